// Edge names and assembly instances from an XDE document read from STEP.
//
// Names sit on sub-shape labels of a part's shape label (TDataStd_Name) when the file was written with
// sub-shape names; they belong to the part's edge whatever instance places it. Instance paths are the
// component names from the root down ("cell/carrier_2"), matched to world edges by shared geometry
// and equal placement.
#pragma once

#include <TDocStd_Document.hxx>
#include <TopTools_IndexedMapOfShape.hxx>

#include <optional>
#include <string>
#include <vector>

namespace ergpath::occt {

struct XdeEdgeLabels {
  std::vector<std::optional<std::string>> name;      // per edge of the map, index i - 1
  std::vector<std::optional<std::string>> instance;  // per edge; empty when the edge is in no assembly
};

/// Names and instances of the edges in `edges` (world coordinates) found in `doc`.
XdeEdgeLabels read_xde_labels(const Handle(TDocStd_Document) & doc, const TopTools_IndexedMapOfShape& edges);

}  // namespace ergpath::occt
