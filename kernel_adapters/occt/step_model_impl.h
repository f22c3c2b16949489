// Adapter-internal view of a StepModel: the kernel shape and its numbered sub-shapes.
//
// Only sources under kernel_adapters/occt (and the DRAW plugin) include this header: it pulls in OCCT.
#pragma once

#include <TDocStd_Document.hxx>
#include <TopTools_IndexedMapOfShape.hxx>
#include <TopoDS_Shape.hxx>

#include <optional>
#include <string>
#include <vector>

#include "kernel_adapters/occt/step_model.h"

namespace ergpath::occt {

struct StepModel::Impl {
  std::string file;
  std::string file_unit;
  std::string schema;
  std::string protocol;
  TopoDS_Shape shape;                                // the whole model in world coordinates, millimetres
  TopTools_IndexedMapOfShape edges;                  // index i (1-based) is edge i of the model
  std::vector<EdgeInfo> info;                        // info[i - 1] describes edge i
  std::vector<std::optional<std::string>> instance;  // assembly instance path of edge i, when known
  Handle(TDocStd_Document) document;  // XDE document when names were read through it; null otherwise
};

}  // namespace ergpath::occt
