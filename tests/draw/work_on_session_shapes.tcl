# ergpath_work on shapes built in the DRAW session itself (no file): edges, wires, compounds.
source [file join $env(ERGPATH_TEST_DIR) check.tcl]
pload MODELING
pload -ErgPath ERGPATH

set g_n 9.80665  ;# standard gravity, m/s^2 (CGPM 1901, BIPM SI Brochure)
set PI [expr {acos(-1)}]
# Relative tolerance of the checks: ten times the default integration target (1e-10 of the integral of
# |F.dr|), which the engine's error estimate promises to meet.
set rel 1e-9

# Green's theorem: the circulation of F = (-y, x, 0) around a counter-clockwise loop in the x-y plane
# is 2 x the enclosed area (positions in metres, so the result is in m^2 = J for this field).
circle c 0 0 0 50
mkedge e c
set w [ergpath_work e --field {-y, x, 0}]
set want [expr {2 * $PI * 0.05 * 0.05}]
check_near "circle r 50 mm: circulation of (-y, x, 0) is 2 x area" $w $want [expr {$rel * $want}]

# Arc length of the same circle: 2 pi r (Euclid), read from the JSON report.
set json [ergpath_work e --field {0, 0, 0} --format json]
check_near "circle r 50 mm: path length is 2 pi r" [json_top_number $json length_m] [expr {2 * $PI * 0.05}] \
    [expr {$rel * 2 * $PI * 0.05}]

# An edge given directly is travelled in its orientation: the reversed edge gives the opposite sign.
copy e er
orientation er R
set wr [ergpath_work er --field {-y, x, 0}]
check_near "reversed circle edge: circulation changes sign" $wr [expr {-$want}] [expr {$rel * $want}]

# Polyline square 100 mm, counter-clockwise: Green's theorem again, 2 x 0.01 m^2.
polyline sq 0 0 0 100 0 0 100 100 0 0 100 0 0 0 0
set w [ergpath_work sq --field {-y, x, 0}]
check_near "square wire 100 mm: circulation is 2 x area" $w 0.02 [expr {$rel * 0.02}]
set w [ergpath_work sq --field {-y, x, 0} --reverse]
check_near "square wire, --reverse: circulation changes sign" $w -0.02 [expr {$rel * 0.02}]

# A wire whose edges run against their own parameter: the wire order and orientations are followed.
explode sq e
copy sq_2 b2
copy sq_3 b3
orientation b2 R
orientation b3 R
# b2, b3 reversed edges: the wire b3 b2 runs (0,100) -> (100,100) -> (100,0), clockwise along the corner.
wire corner b3 b2
set w [ergpath_work corner --field {1, 0, 0}]
check_near "wire of reversed edges: work of (1, 0, 0) N is +0.1 J along +x first" $w 0.1 [expr {$rel * 0.1}]
set w [ergpath_work corner --field {0, 1, 0}]
check_near "wire of reversed edges: work of (0, 1, 0) N is -0.1 J going down" $w -0.1 [expr {$rel * 0.1}]

# A compound of loose edges in no order is chained by end points, as the CLI chains a STEP sketch.
compound sq_3 sq_1 sq_4 sq_2 loose
set w [ergpath_work loose --field {-y, x, 0}]
check_near "compound of the square's edges: chained loop, |circulation| is 2 x area" [expr {abs($w)}] 0.02 \
    [expr {$rel * 0.02}]

# Uniform gravity is conservative: W = -m g_n (z_end - z_start) whatever the route.
polyline ramp 0 0 0 300 0 100 600 0 100 900 0 400
set w [ergpath_work ramp --field {0, 0, -m*g_n} --const m=25]
set want [expr {-25 * $g_n * 0.4}]
check_near "ramp polyline, 25 kg: gravity work is -m g_n dz" $w $want [expr {$rel * abs($want)}]

# Gravity plus a spring anchored at a (Hooke): W = -m g_n dz - k/2 (|r2 - a|^2 - |r1 - a|^2), along a
# Bezier curve built in the session from (0,0,0) to (300,0,60) mm.
beziercurve bz 4 0 0 0 100 50 0 200 -50 30 300 0 60
mkedge eb bz
set w [ergpath_work eb --field {-k*(x-ax), -k*(y-ay), -k*(z-az) - m*g_n} \
           --const k=200 --const ax=0.1 --const ay=0.2 --const az=-0.05 --const m=4]
set r1 [expr {0.1 * 0.1 + 0.2 * 0.2 + 0.05 * 0.05}]
set r2 [expr {0.2 * 0.2 + 0.2 * 0.2 + 0.11 * 0.11}]
set want [expr {-4 * $g_n * 0.06 - 0.5 * 200 * ($r2 - $r1)}]
check_near "Bezier edge: gravity + anchored spring give the potential difference" $w $want \
    [expr {$rel * abs($want)}]

# Ellipse with semi-axes a = 150, b = 50 mm: perimeter 4 a E(e) (DLMF 19.9.9) with E of
# parameter m = e^2 = 1 - b^2/a^2 = 8/9, as mpmath.ellipe(m) takes it:
# 4 * 150 * ellipe(8/9) = 668.244661027762911 mm (mpmath at 30 digits).
ellipse el 0 0 0 150 50
mkedge ee el
set json [ergpath_work ee --field {0, 0, 0} --format json]
check_near "ellipse 150 x 50 mm: perimeter is 4 a E(e^2)" [json_top_number $json length_m] \
    0.668244661027762911 [expr {$rel * 0.668}]

# --path selects edges of any shape by the numbers ergpath_list shows (here: the ramp's second run).
set n [ergpath_list ramp]
check_equal "ergpath_list of the ramp: three edges" $n 3
set w [ergpath_work ramp --path edge:3 --field {0, 0, -m*g_n} --const m=25]
set want [expr {-25 * $g_n * 0.3}]
check_near "ramp, --path edge:3: gravity work over its 300 mm rise" $w $want [expr {$rel * abs($want)}]

# ergpath_profile: W(s) along the ramp is -m g_n z(s) at every station (uniform gravity). Stations: the
# ends of the first two runs (lengths sqrt(0.3^2 + 0.1^2) and 0.3 m) and half-way up the last run, where
# z = 250 mm.
set l1 [expr {sqrt(0.09 + 0.01)}]
set half3 [expr {$l1 + 0.3 + 0.5 * sqrt(0.09 + 0.09)}]
set profile [ergpath_profile ramp --field {0, 0, -m*g_n} --const m=25 --at "$l1,[expr {$l1 + 0.3}],$half3"]
check_equal "ergpath_profile: one triple per station" [llength $profile] 3
set i 0
foreach z {0.1 0.1 0.25} {
  lassign [lindex $profile $i] s w f
  set want [expr {-25 * $g_n * $z}]
  check_near "ramp profile station [incr i]: W(s) is -m g_n z(s)" $w $want [expr {$rel * abs($want)}]
}
# The tangential force on the last run: -m g_n sin(45 deg).
check_near "ramp profile: F.T on the 45-degree run is -m g_n sin 45" $f [expr {-25 * $g_n * sqrt(0.5)}] \
    [expr {$rel * 25 * $g_n}]

finish
