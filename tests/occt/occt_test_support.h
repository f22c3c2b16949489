// Helpers shared by the adapter tests: fixture paths and the kernel's own reference length.
#pragma once

#include <gtest/gtest.h>
#include <TopoDS_Edge.hxx>

#include <string>

#include "kernel_adapters/occt/step_model.h"
#include "plugin/core/error.h"

namespace ergpath::occt::testing {

/// Path of a committed fixture, e.g. fixture("lift_track_mm.stp").
std::string fixture(const std::string& name);

/// The kernel's edge `index` of a model (adapter-internal access).
TopoDS_Edge kernel_edge(const StepModel& model, int index);

/// Reference arc length in mm: GCPnts_AbscissaPoint::Length on BRepAdaptor_Curve at tolerance 1e-12
/// (KERNEL-NOTES: right to ~1e-14 on smooth curves).
double gcpnts_length_mm(const TopoDS_Edge& edge);

/// The kind of the ergpath::Error that `f` throws (its message into `message` when given); a test failure
/// when it throws none.
template <class F>
ErrorKind kind_of(F f, std::string* message = nullptr) {
  try {
    f();
  } catch (const Error& e) {
    if (message) *message = e.what();
    return e.kind();
  }
  ADD_FAILURE() << "no ergpath::Error thrown";
  return ErrorKind::OutputFailed;
}

}  // namespace ergpath::occt::testing
