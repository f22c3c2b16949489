#include "error.h"

namespace ergpath {

const char* to_string(ErrorKind kind) {
  switch (kind) {
    case ErrorKind::UnreadableFile:
      return "unreadable_file";
    case ErrorKind::EmptyModel:
      return "empty_model";
    case ErrorKind::BadSelector:
      return "bad_selector";
    case ErrorKind::UnknownEdge:
      return "unknown_edge";
    case ErrorKind::GapTooLarge:
      return "gap_too_large";
    case ErrorKind::BranchInPath:
      return "branch_in_path";
    case ErrorKind::BadFormula:
      return "bad_formula";
    case ErrorKind::WrongComponentCount:
      return "wrong_component_count";
    case ErrorKind::BadConstant:
      return "bad_constant";
    case ErrorKind::BadOption:
      return "bad_option";
    case ErrorKind::BadManifest:
      return "bad_manifest";
    case ErrorKind::BadGeometry:
      return "bad_geometry";
    case ErrorKind::NoField:
      return "no_field";
    case ErrorKind::DuplicateField:
      return "duplicate_field";
    case ErrorKind::NoSuchShape:
      return "no_such_shape";
    case ErrorKind::NonFiniteField:
      return "non_finite_field";
    case ErrorKind::ToleranceNotMet:
      return "tolerance_not_met";
    case ErrorKind::OutputFailed:
      return "output_failed";
    case ErrorKind::Internal:
      return "internal";
  }
  return "unknown";
}

int exit_code(ErrorKind kind) {
  switch (kind) {
    case ErrorKind::NonFiniteField:
    case ErrorKind::ToleranceNotMet:
      return 3;
    case ErrorKind::OutputFailed:
      return 4;
    case ErrorKind::Internal:
      return 5;
    default:
      return 2;
  }
}

}  // namespace ergpath
