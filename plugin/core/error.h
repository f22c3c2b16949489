// Error kinds and the one exception type the library throws for user-facing failures.
//
// Every user-facing failure carries a kind (tests assert the exact kind) and a one-line message that
// names the file, edge, selector or formula position involved. Programmer bugs are asserts, not Errors.
#pragma once

#include <stdexcept>
#include <string>

namespace ergpath {

enum class ErrorKind {
  // Bad input: exit code 2.
  UnreadableFile,       // missing, unreadable, empty, truncated or not STEP
  EmptyModel,           // the file holds no edges
  BadSelector,          // selector text does not parse
  UnknownEdge,          // index out of range, name not found, nothing matched
  GapTooLarge,          // consecutive edges further apart than the chaining tolerance
  BranchInPath,         // three or more selected edges meet at one point
  BadFormula,           // formula syntax, unknown variable/function (message carries the position)
  WrongComponentCount,  // a force field needs exactly three comma-separated components
  BadConstant,          // NAME=VALUE malformed, non-finite, or shadows a variable
  BadOption,            // an option value out of its domain (tolerance, unit, window, ...)
  BadManifest,          // a batch manifest or field file is unreadable or wrong (message names the line)
  BadGeometry,          // an edge's geometry is unusable: non-finite or absurd coordinates (names file, edge)
  NoField,              // a command that integrates a force field was given none
  DuplicateField,       // two force fields with the same name
  NoSuchShape,          // (DRAW) no shape of that name in the session
  // Numerical failure: exit code 3.
  NonFiniteField,   // the field or the curve derivative is NaN/Inf somewhere on the path
  ToleranceNotMet,  // the error budget could not be met; the best value is still reported
  // Environment: exit code 4.
  OutputFailed,  // an output file could not be written
  // Not the user's fault: exit code 5.
  Internal,  // a bug, or the machine ran out of memory; the message says which
};

/// Stable lower-case identifier of a kind, e.g. "gap_too_large" (used in JSON and batch results).
const char* to_string(ErrorKind kind);

/// Process exit code documented in docs/exit-codes.md: 2 bad input, 3 numerical failure, 4 output failure,
/// 5 internal error.
int exit_code(ErrorKind kind);

class Error : public std::runtime_error {
 public:
  Error(ErrorKind kind, const std::string& message) : std::runtime_error(message), kind_(kind) {}
  ErrorKind kind() const noexcept { return kind_; }

 private:
  ErrorKind kind_;
};

}  // namespace ergpath
