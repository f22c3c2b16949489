# ergpath_work on our fixtures read into the DRAW session with the kernel's own STEP command, and on a
# wire rebuilt in the session from the exploded edges. Geometry of each fixture: fixtures/make_fixtures.cpp.
source [file join $env(ERGPATH_TEST_DIR) check.tcl]
pload MODELING XSDRAW
pload -ErgPath ERGPATH
proc fixture {name} { return [file join $::env(ERGPATH_FIXTURES_DIR) $name] }

set g_n 9.80665  ;# standard gravity, m/s^2 (CGPM 1901, BIPM SI Brochure)
set PI [expr {acos(-1)}]
# Ten times the default integration target (relative 1e-10 of the integral of |F.dr|).
set rel 1e-9
# STEP writes reals with 12 significant digits, so a file's geometry is only that exact.
set step_rel 1e-10

# Lift track: from (0, 0, 0) to (1250, 650, 1200) mm. Uniform gravity: W = -m g_n dz.
testreadstep [fixture lift_track_mm.stp] track
set want [expr {-25 * $g_n * 1.2}]
set w [ergpath_work track --field {0, 0, -m*g_n} --const m=25]
check_near "lift track (mm file), 25 kg: gravity work is -m g_n dz" $w $want [expr {$rel * abs($want)}]
set w [ergpath_work track --field {0, 0, -m*g_n} --const m=25 --reverse]
check_near "lift track, --reverse: the work changes sign" $w [expr {-$want}] [expr {$rel * abs($want)}]

# The same track written in inches reads back in millimetres: the same joules (units invariance).
testreadstep [fixture lift_track_in.stp] track_in
set w [ergpath_work track_in --field {0, 0, -m*g_n} --const m=25]
check_near "lift track (inch file): the same gravity work" $w $want [expr {($rel + $step_rel) * abs($want)}]

# Rebuild the track as a wire from its exploded edges and measure the wire directly.
explode track e
wire track_w track_1 track_2 track_3 track_4
set w [ergpath_work track_w --field {0, 0, -m*g_n} --const m=25]
check_near "lift track rebuilt as a wire in the session: the same gravity work" $w $want \
    [expr {$rel * abs($want)}]
# The rise alone (edge 2 of the wire): all of the height.
set w [ergpath_work track_w --path edge:2 --field {0, 0, -m*g_n} --const m=25]
check_near "lift track wire, --path edge:2 (the rise): all of the gravity work" $w $want \
    [expr {$rel * abs($want)}]
# The level arc and run-out (edges 3, 4 at z = 1200 mm): no gravity work, path length pi/2 0.25 + 0.4 m.
set json [ergpath_work track_w --path edges:3,4 --field {0, 0, -m*g_n} --const m=25 --format json]
check_near "lift track wire, --path edges:3,4 (level): no gravity work" [json_top_number $json work_J] 0 1e-9
check_near "lift track wire, --path edges:3,4: length pi/2 x 0.25 m + 0.4 m" [json_top_number $json length_m] \
    [expr {$PI / 2 * 0.25 + 0.4}] [expr {$rel * 0.8}]

# Ellipse, semi-axes a = 300, b = 100 mm: perimeter 4 a E(e) (DLMF 19.9.9) with E of
# parameter m = e^2 = 1 - b^2/a^2 = 8/9, as mpmath.ellipe(m) takes it:
# 4 * 300 * ellipe(8/9) = 1336.48932205552582 mm (mpmath at 30 digits).
testreadstep [fixture ellipse_300x100.stp] ell
set json [ergpath_work ell --field {0, 0, 0} --format json]
check_near "ellipse 300 x 100 mm fixture: perimeter is 4 a E(e^2)" [json_top_number $json length_m] \
    1.33648932205552582 [expr {($rel + $step_rel) * 1.34}]

# Transfer loop, a stadium with 800 mm straights and 200 mm end radius, counter-clockwise:
# Green's theorem, circulation of (-y, x, 0) = 2 x area = 2 (0.8 x 0.4 + pi 0.2^2) m^2.
testreadstep [fixture transfer_loop.stp] loop
set want 0.891327412287183459
set w [ergpath_work loop --field {-y, x, 0}]
check_near "transfer loop: circulation of (-y, x, 0) is 2 x area" $w $want [expr {($rel + $step_rel) * $want}]

# A sketch of loose, shuffled edges (slot: 300 mm straights, 80 mm end radius) is chained by end points;
# Green's theorem again, 2 x (0.3 x 0.16 + pi 0.08^2) m^2, sign set by the chaining's direction.
testreadstep [fixture sketch_unordered.stp] slot
set want 0.136212385965949353
set w [ergpath_work slot --field {-y, x, 0}]
check_near "unordered sketch: |circulation| of (-y, x, 0) is 2 x area" [expr {abs($w)}] $want \
    [expr {($rel + $step_rel) * $want}]

# Hatch handle: a 90-degree arc of radius 600 mm about the x axis, from (0, 600, 0) up to (0, 0, 600):
# a 12 kg lid's handle lifted 0.6 m against gravity; arc length pi/2 x 0.6 m.
testreadstep [fixture hatch_hinge_arc.stp] hatch
set json [ergpath_work hatch --field {0, 0, -m*g_n} --const m=12 --format json]
set want [expr {-12 * $g_n * 0.6}]
check_near "hatch arc: gravity work is -m g_n dz" [json_top_number $json work_J] $want \
    [expr {($rel + $step_rel) * abs($want)}]
check_near "hatch arc: length is pi/2 r" [json_top_number $json length_m] [expr {$PI / 2 * 0.6}] \
    [expr {($rel + $step_rel) * 0.95}]

finish
