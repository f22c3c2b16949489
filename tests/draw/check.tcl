# Helpers sourced by the DRAW test scripts. DRAW's exit status is always 0, so every check prints one
# line, "PASS <what>" or "FAIL <what>: ...", and `finish` prints the sentinel CTest waits for. A Tcl
# error stops the script before the sentinel, which fails the test as well.

set ::failures 0

proc pass {what} { puts "PASS $what" }
proc fail {what why} {
  puts "FAIL $what: $why"
  incr ::failures
}

# |got - want| <= tol, and got must be a number.
proc check_near {what got want tol} {
  if {![string is double -strict $got]} {
    fail $what "not a number: '$got'"
  } elseif {abs($got - $want) > $tol} {
    fail $what "got $got, want $want (tolerance $tol, off by [expr {abs($got - $want)}])"
  } else {
    pass $what
  }
}

proc check_true {what condition} {
  if {[uplevel 1 [list expr $condition]]} { pass $what } else { fail $what "false: $condition" }
}

proc check_equal {what got want} {
  if {$got eq $want} { pass $what } else { fail $what "got '$got', want '$want'" }
}

# Runs `script` in the caller's scope; it must fail with a one-line message carrying "[kind]".
proc check_error_kind {what script kind} {
  if {![catch {uplevel 1 $script} message]} {
    fail $what "no error (result '$message'), want \[$kind\]"
  } elseif {[string first "\[$kind\]" $message] < 0} {
    fail $what "want \[$kind\], got: $message"
  } elseif {[string first "\n" $message] >= 0} {
    fail $what "message is not one line: $message"
  } else {
    pass $what
  }
}

# Runs `script`; it must fail (bad arguments) with a message that shows the usage, i.e. contains
# `usage_head` (the start of the command's usage string).
proc check_usage {what script usage_head} {
  if {![catch {uplevel 1 $script} message]} {
    fail $what "no error (result '$message'), want the usage"
  } elseif {[string first $usage_head $message] < 0} {
    fail $what "no usage in: $message"
  } else {
    pass $what
  }
}

# A top-level number of a JSON report (nlohmann::json dump with indent 2: top-level keys have exactly
# two spaces before them, nested keys more).
proc json_top_number {json key} {
  if {![regexp "\n  \"$key\": (\[-+0-9.eE\]+)" $json -> value]} {
    error "no top-level number \"$key\" in the JSON report"
  }
  return $value
}

proc finish {} {
  if {$::failures == 0} {
    puts "ALL CHECKS PASSED"
  } else {
    puts "$::failures CHECK(S) FAILED"
  }
}
