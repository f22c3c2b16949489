#include "plugin/batch/step_model_source.h"

#include "kernel_adapters/occt/path_builder.h"
#include "kernel_adapters/occt/step_model.h"

namespace ergpath::batch {

namespace {

class StepLoadedModel : public LoadedModel {
 public:
  explicit StepLoadedModel(occt::StepModel model) : model_(std::move(model)) {}

  Path build_path(const PathRequest& request) const override {
    occt::PathOptions o;
    o.reverse = request.reverse;
    o.start_mm = request.start_mm;
    o.gap_tolerance_mm = request.gap_tolerance_mm;
    // StepModel::make_curve returns independent curve objects: the Path belongs to this caller alone.
    return occt::build_path(model_, occt::select_edges(model_, request.selector), o);
  }

 private:
  occt::StepModel model_;
};

}  // namespace

ModelLoader step_model_loader() {
  return [](const std::string& file) -> std::shared_ptr<const LoadedModel> {
    return std::make_shared<StepLoadedModel>(occt::StepModel::read(file));
  };
}

}  // namespace ergpath::batch
