# Run by install_check.cmake with the installed launcher: load the plugin, say which file the process
# mapped, and compute one closed-form value with it.
source [file join $env(ERGPATH_TEST_DIR) check.tcl]
pload MODELING
pload -ErgPath ERGPATH

set maps [open /proc/self/maps]
set plugin ""
foreach line [split [read $maps] "\n"] {
  if {[string match "*libergpath_draw.so*" $line]} { set plugin [lindex $line end] }
}
close $maps
puts "plugin file: $plugin"
check_true "the process mapped the plugin library" {$plugin ne ""}

# Green's theorem: circulation of (-y, x, 0) around a counter-clockwise circle is 2 x its area.
circle c 0 0 0 20
mkedge e c
set w [ergpath_work e --field {-y, x, 0}]
set want [expr {2 * acos(-1) * 0.02 * 0.02}]
check_near "installed plugin: circulation around a 20 mm circle is 2 x area" $w $want [expr {1e-9 * $want}]
finish
