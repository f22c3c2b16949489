# ergpath_check on our demo manifest (fixtures/batch/mechanisms.toml, invented loads and limits): the
# verdicts of `ergpath check`, as the Tcl result. The manifest's own comments give each case's limits;
# magnet-latch-close is built to exceed its 15 N peak-force limit, the five others to pass.
source [file join $env(ERGPATH_TEST_DIR) check.tcl]
pload -ErgPath ERGPATH
set manifest [file join $env(ERGPATH_FIXTURES_DIR) batch mechanisms.toml]

# A top-level integer of the summary JSON (indent 2).
proc json_top_int {json key} {
  if {![regexp "\n  \"$key\": (\[0-9\]+)" $json -> value]} { error "no top-level \"$key\" in the summary" }
  return $value
}

check_true "ergpath_check is registered" {[llength [info commands ergpath_check]] == 1}

# Text mode prints the summary table (with its PASS / FAIL column) and returns the verdict.
check_equal "demo manifest: a limit failed, result 1" [ergpath_check $manifest --jobs 2] 1

set json [ergpath_check $manifest --jobs 2 --format json]
check_equal "demo manifest JSON: 5 cases passed" [json_top_int $json passed] 5
check_equal "demo manifest JSON: 1 case failed" [json_top_int $json failed] 1
check_equal "demo manifest JSON: no errors" [json_top_int $json errors] 0
check_equal "demo manifest JSON: exit_code 1" [json_top_int $json exit_code] 1
check_equal "demo manifest JSON: one FAIL verdict" [regexp -all {"verdict": "FAIL"} $json] 1
# The verdict in the result object of magnet-latch-close (before the next case's "name").
check_true "demo manifest JSON: the failing case is magnet-latch-close" \
    {[regexp {"name": "magnet-latch-close",(?:(?!"name": ).)*"verdict": "FAIL"} $json]}

# A results log, then a resumed run: nothing is computed again and the verdict stands.
set dir [file join [pwd] ergpath_check_test_[pid]]
file mkdir $dir
set log [file join $dir results.jsonl]
ergpath_check $manifest --jobs 2 --results $log --format json
check_true "--results writes results.summary.json beside results.jsonl" {[file exists [file join $dir results.summary.json]]}
set json [ergpath_check $manifest --jobs 2 --results $log --resume --format json]
check_equal "--resume: all 6 cases taken from the log" [json_top_int $json resumed] 6
check_equal "--resume: the verdict is still 1" [json_top_int $json exit_code] 1
file delete -force $dir

# Shards K/N take cases K, K+N, ...: shard 0/2 holds lift-raise, cam-follower-cycle and
# transfer-loop-lap (all pass); shard 1/2 holds magnet-latch-close.
check_equal "--shard 0/2: every case of the shard passes, result 0" \
    [json_top_int [ergpath_check $manifest --jobs 2 --shard 0/2 --format json] exit_code] 0
check_equal "--shard 1/2: holds the failing case, result 1" \
    [json_top_int [ergpath_check $manifest --jobs 2 --shard 1/2 --format json] exit_code] 1

check_usage "ergpath_check without a manifest prints the usage" {ergpath_check} "Usage: ergpath_check"
check_error_kind "--resume without --results" {ergpath_check $manifest --resume} bad_option
check_error_kind "a malformed shard" {ergpath_check $manifest --shard 3/2} bad_option
check_error_kind "no such manifest" {ergpath_check [file join $dir none.toml]} bad_manifest

finish
