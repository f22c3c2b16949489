# ergpath_list and ergpath_scalar on shapes built in the DRAW session and on fixtures read with the
# kernel's STEP command: the rows and integrals of the CLI's own code.
source [file join $env(ERGPATH_TEST_DIR) check.tcl]
pload MODELING XSDRAW
pload -ErgPath ERGPATH
proc fixture {name} { return [file join $::env(ERGPATH_FIXTURES_DIR) $name] }

set PI [expr {acos(-1)}]
# Ten times the default integration target (relative 1e-10 of the integral of |f| ds).
set rel 1e-9

# The "edges" array of a JSON listing (keys are sorted, so "edges" comes before "summary").
proc json_edges {json} {
  if {![regexp {"edges": (\[.*\]),\n  "summary"} $json -> edges]} { error "no edges array in the listing" }
  return $edges
}

# A box: 12 edges, 6 faces, each edge bounding exactly 2 faces (a cuboid's topology).
box bx 10 20 30
set n [ergpath_list bx]
check_equal "box: ergpath_list lists its 12 edges" $n 12
set json [ergpath_list bx --format json]
check_true "box listing: 6 faces in the summary" {[regexp {"face_count": 6\M} $json]}
check_true "box listing: 6 wires in the summary" {[regexp {"wire_count": 6\M} $json]}
check_true "box listing: edge 1 bounds two faces" \
    {[regexp {"faces": \[\s*\d+,\s*\d+\s*\]} [json_edges $json]]}
# The CLI's filters: edges at least 15 mm long are the four of 20 mm and the four of 30 mm.
check_equal "box: --min-length 0.015 lists 8 edges" [ergpath_list bx --type line --min-length 0.015] 8
check_equal "box: --type circle lists none" [ergpath_list bx --type circle] 0
check_error_kind "ergpath_list with an unknown type" {ergpath_list bx --type spiral} bad_option
check_error_kind "ergpath_list --within without --near" {ergpath_list bx --within 3} bad_option

# A fixture read in the session lists the same rows as `ergpath list` of the file (faces, wires, seam,
# degenerated apex), only the summary's file name and schema differ.
foreach name {cone_seam_apex.stp lift_track_mm.stp} {
  testreadstep [fixture $name] m
  set from_draw [json_edges [ergpath_list m --format json]]
  set from_cli [json_edges [exec $env(ERGPATH_CLI) list [fixture $name] --format json]]
  check_equal "$name: ergpath_list rows are the CLI's rows" $from_draw $from_cli
}

# Integral of 1 ds over a circle of radius 50 mm: its circumference 2 pi r = 2 pi 0.05 m (Euclid).
circle c 0 0 0 50
mkedge e c
set want [expr {2 * $PI * 0.05}]
check_near "circle r 50 mm: integral of 1 ds is 2 pi r" [ergpath_scalar e --integrand 1] $want [expr {$rel * $want}]

# A cable of linear density lambda(x) = l0 + l1 x (kg/m, x in m) laid along x from 0 to 400 mm:
# mass = l0 L + l1 L^2 / 2 (integral of a polynomial) = 2 x 0.4 + 3 x 0.16 / 2 = 1.04 kg.
line l 0 0 0 1 0 0
mkedge cable l 0 400
set want 1.04
set m [ergpath_scalar cable --integrand {l0 + l1*x} --const l0=2 --const l1=3]
check_near "cable along x, lambda = 2 + 3 x kg/m: mass 1.04 kg" $m $want [expr {$rel * $want}]
# ds > 0 either way: reversing the travel leaves a scalar integral unchanged.
set m [ergpath_scalar cable --integrand {l0 + l1*x} --const l0=2 --const l1=3 --reverse]
check_near "cable, --reverse: the same mass" $m $want [expr {$rel * $want}]
# The same formula with x in millimetres and l1 per mm: 2 x 0.4 + 0.003 x 400 x 0.4 / 2 = 1.04 kg.
set m [ergpath_scalar cable --integrand {l0 + l1*x} --const l0=2 --const l1=0.003 --field-length-unit mm]
check_near "cable, x in mm: the same mass" $m $want [expr {$rel * $want}]
set json [ergpath_scalar cable --integrand {l0 + l1*x} --const l0=2 --const l1=3 --format json]
check_near "cable JSON: mean density is mass / length" [json_top_number $json mean] [expr {$want / 0.4}] \
    [expr {$rel * $want / 0.4}]

# --path picks edges by the numbers ergpath_list shows: the 100 mm side of a 100 x 50 mm rectangle.
polyline rect 0 0 0 100 0 0 100 50 0 0 50 0 0 0 0
check_near "rectangle wire: integral of 1 ds is its perimeter 0.3 m" [ergpath_scalar rect --integrand 1] 0.3 \
    [expr {$rel * 0.3}]
check_near "rectangle, --path edge:1: the 100 mm side" [ergpath_scalar rect --path edge:1 --integrand 1] 0.1 \
    [expr {$rel * 0.1}]

check_usage "ergpath_scalar without --integrand prints the usage" {ergpath_scalar e} "Usage: ergpath_scalar"
check_error_kind "ergpath_scalar with a formula syntax error" {ergpath_scalar e --integrand {2*}} bad_formula
check_error_kind "ergpath_scalar of no such shape" {ergpath_scalar nosuch --integrand 1} unreadable_file
check_error_kind "ergpath_scalar edge out of range" {ergpath_scalar e --path edge:2 --integrand 1} unknown_edge

finish
