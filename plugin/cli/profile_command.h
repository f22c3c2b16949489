// The work profile behind `ergpath profile`, shared by the CLI and the DRAW plugin.
#pragma once

#include <iosfwd>
#include <string>
#include <vector>

#include "kernel_adapters/occt/step_model.h"
#include "plugin/cli/work_command.h"
#include "plugin/core/work_profile.h"

namespace ergpath::cli {

struct ProfileArgs {
  WorkArgs work;                // path, field, tolerance; format text, json or csv
  std::vector<std::string> at;  // arc lengths, metres or with a unit suffix ("250mm")
  std::string spacing;          // sample every D from 0 to the end (the end included)
  int samples = 0;              // N evenly spaced samples including both ends
};

void add_profile_options(CLI::App& cmd, ProfileArgs& args);

/// Arc lengths (metres) at which to sample a path of length `length_m`, from --at, --spacing or --samples
/// (exactly one). Throws Error(BadOption) for none or several, a negative or non-finite distance, or a value
/// beyond the path length.
std::vector<double> profile_stations(const ProfileArgs& args, double length_m);

std::vector<ProfilePoint> run_profile(const occt::StepModel& model, const ProfileArgs& args,
                                      std::ostream& out);

/// As run_profile, along a path the caller has already built from `model` (a DRAW wire in its own order).
std::vector<ProfilePoint> run_profile_on_path(const occt::StepModel& model, const Path& path,
                                              const ProfileArgs& args, std::ostream& out);

}  // namespace ergpath::cli
