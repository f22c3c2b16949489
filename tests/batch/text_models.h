// Test models described by one line of text, so runner tests need no CAD kernel and know exact answers.
//
//   line X0 Y0 Z0 X1 Y1 Z1      a straight edge, millimetres
//   circle CX CY R              a full circle in the plane z = 0, counter-clockwise, millimetres (closed
//   path)
//
// Only the selector "all" is understood; any other raises Error(BadSelector), which tests use as a
// broken case. A missing file raises Error(UnreadableFile).
#pragma once

#include <atomic>
#include <string>

#include "plugin/batch/model_source.h"

namespace ergpath::batch::testing {

/// Loader of text models; counts its calls in `loads` when given.
ModelLoader text_model_loader(std::atomic<int>* loads = nullptr);

/// A fresh empty folder under the temp directory, removed with its contents when the test program ends.
std::string fresh_dir(const std::string& prefix);
void write_file(const std::string& path, const std::string& text);
std::string read_file(const std::string& path);

}  // namespace ergpath::batch::testing
