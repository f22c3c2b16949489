#include "plugin/draw/session_shape.h"

#include <DBRep.hxx>
#include <TCollection_AsciiString.hxx>
#include <TopoDS_Shape.hxx>

#include "kernel_adapters/occt/shape_model.h"
#include "kernel_adapters/occt/step_model_impl.h"
#include "plugin/core/error.h"

namespace ergpath::draw {

occt::StepModel session_model(const std::string& name) {
  const std::string label = "shape " + name;
  if (name.empty()) throw Error(ErrorKind::UnreadableFile, "an empty shape name (give a DRAW variable name)");
  // GetExisting, not Get: Get takes "." as "pick a shape in the viewer", which waits forever in batch.
  const TopoDS_Shape shape = DBRep::GetExisting(TCollection_AsciiString(name.c_str()));
  if (shape.IsNull()) throw Error(ErrorKind::UnreadableFile, label + ": no such shape in this session");
  return occt::model_from_shape(shape, label);
}

std::optional<Path> own_path(const occt::StepModel& model, cli::PathCliOptions& options) {
  std::optional<Path> path = occt::path_of_shape(model, cli::make_path_options(options));
  if (path) options.selector = model.impl().shape.ShapeType() == TopAbs_WIRE ? "the wire" : "the edge";
  return path;
}

}  // namespace ergpath::draw
