// Shapes of the DRAW session, fetched by their variable name, as ergpath models.
#pragma once

#include <string>

#include "kernel_adapters/occt/step_model.h"

namespace ergpath::draw {

/// The model of the shape held by DRAW variable `name`, its edges numbered as StepModel::read numbers
/// the same shape; coordinates are taken as millimetres. Reports and messages call it "shape NAME".
/// Throws Error(UnreadableFile) when no shape has that name (the name plays the file's part),
/// Error(EmptyModel) when the shape holds no edge.
occt::StepModel session_model(const std::string& name);

}  // namespace ergpath::draw
