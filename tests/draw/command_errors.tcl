# Bad input to the ergpath DRAW commands: a Tcl error with a one-line message naming the error kind
# (docs/exit-codes.md), or the usage text for bad arguments, never a crash.
source [file join $env(ERGPATH_TEST_DIR) check.tcl]
pload MODELING
pload -ErgPath ERGPATH

foreach command {ergpath_list ergpath_work ergpath_profile} {
  check_true "$command is registered" {[llength [info commands $command]] == 1}
}

circle c 0 0 0 50
mkedge e c
line l 0 0 0 1 0 0
mkedge a l 0 100
mkedge b l 200 300
compound a b apart
vertex v 1 2 3

check_usage "ergpath_work without arguments prints the usage" {ergpath_work} "Usage: ergpath_work"
check_usage "ergpath_work with an unknown option prints the usage" {ergpath_work e --no-such-option 1} \
    "Usage: ergpath_work"
check_usage "ergpath_work --format xml prints the usage" {ergpath_work e --field {0,0,0} --format xml} \
    "Usage: ergpath_work"
check_usage "ergpath_list without arguments prints the usage" {ergpath_list} "Usage: ergpath_list"
check_usage "ergpath_profile without stations is a bad option, with arguments it needs SHAPE" {ergpath_profile} \
    "Usage: ergpath_profile"
check_error_kind "ergpath_profile without --at, --spacing or --samples" {ergpath_profile e --field {0, 0, 1}} \
    bad_option
check_error_kind "ergpath_list of no such shape" {ergpath_list nosuch} unreadable_file
check_error_kind "no such shape" {ergpath_work nosuch --field {0, 0, 1}} unreadable_file
check_error_kind "a vertex holds no edge" {ergpath_work v --field {0, 0, 1}} empty_model
check_error_kind "formula syntax error" {ergpath_work e --field {0, 0, -m*}} bad_formula
check_error_kind "unknown variable in a formula" {ergpath_work e --field {0, 0, -mass*g_n}} bad_formula
check_error_kind "two components instead of three" {ergpath_work e --field {0, 1}} wrong_component_count
check_error_kind "malformed constant" {ergpath_work e --field {0, 0, m} --const m} bad_constant
check_error_kind "selector that does not parse" {ergpath_work e --path {edges:} --field {0, 0, 1}} bad_selector
check_error_kind "edge index out of range" {ergpath_work e --path edge:7 --field {0, 0, 1}} unknown_edge
check_error_kind "edges 100 mm apart do not chain" {ergpath_work apart --field {1, 0, 0}} gap_too_large
check_error_kind "tolerance out of (0, 1)" {ergpath_work e --field {0, 0, 1} --tolerance 2} bad_option
check_error_kind "field not finite on the path" {ergpath_work e --field {sqrt(x-1), 0, 0}} non_finite_field

# After all of that the session still works.
set w [ergpath_work e --field {-y, x, 0}]
check_near "the session still computes after the errors" $w [expr {2 * acos(-1) * 0.0025}] 1e-12

finish
