// The real model loader of batch checks: STEP files through the OCCT adapter.
#pragma once

#include "plugin/batch/model_source.h"

namespace ergpath::batch {

/// Loader that reads a STEP file with occt::StepModel::read and builds paths with occt::select_edges and
/// occt::build_path. Coordinates in millimetres. Errors as those functions throw them.
ModelLoader step_model_loader();

}  // namespace ergpath::batch
