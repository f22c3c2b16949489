// Shapes of the DRAW session, fetched by their variable name, as ergpath models.
#pragma once

#include <optional>
#include <string>

#include "kernel_adapters/occt/step_model.h"
#include "plugin/cli/field_options.h"
#include "plugin/core/path.h"

namespace ergpath::draw {

/// The model of the shape held by DRAW variable `name`, its edges numbered as StepModel::read numbers
/// the same shape; coordinates are taken as millimetres. Reports and messages call it "shape NAME".
/// Throws Error(UnreadableFile) when no shape has that name (the name plays the file's part),
/// Error(EmptyModel) when the shape holds no edge.
occt::StepModel session_model(const std::string& name);

/// The path a shape given without --path travels: an edge or a wire in its own order and orientation
/// (occt::path_of_shape with the --reverse/--start/--gap-tolerance options); nullopt for other shapes,
/// which are chained by selector as the CLI chains a file. Sets options.selector to the label reports
/// show ("the wire", "the edge") when it returns a path.
std::optional<Path> own_path(const occt::StepModel& model, cli::PathCliOptions& options);

}  // namespace ergpath::draw
