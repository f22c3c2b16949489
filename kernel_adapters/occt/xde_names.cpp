#include "kernel_adapters/occt/xde_names.h"

#include <TDF_Label.hxx>
#include <TDF_LabelSequence.hxx>
#include <TDataStd_Name.hxx>
#include <TopExp.hxx>
#include <TopoDS.hxx>
#include <TopoDS_Shape.hxx>
#include <XCAFDoc_DocumentTool.hxx>
#include <XCAFDoc_ShapeTool.hxx>
#include <gp_Trsf.hxx>

#include <cmath>
#include <map>

namespace ergpath::occt {

namespace {

// Two placements are the same when their matrices agree to 1e-9 (rotation entries, dimensionless) and
// 1e-9 mm (translation): far below any meaningful offset between two instances, far above rounding.
constexpr double kSamePlacementTol = 1e-9;

std::optional<std::string> label_name(const TDF_Label& label) {
  Handle(TDataStd_Name) attr;
  if (!label.FindAttribute(TDataStd_Name::GetID(), attr)) return std::nullopt;
  TCollection_AsciiString text(attr->Get());
  std::string name = text.ToCString();
  if (name.empty()) return std::nullopt;
  return name;
}

bool same_placement(const gp_Trsf& a, const gp_Trsf& b) {
  for (int r = 1; r <= 3; ++r) {
    for (int c = 1; c <= 4; ++c) {
      if (std::abs(a.Value(r, c) - b.Value(r, c)) > kSamePlacementTol) return false;
    }
  }
  return true;
}

struct Placed {
  gp_Trsf trsf;
  std::string path;
};

using ByTShape = std::map<const TopoDS_TShape*, std::vector<Placed>>;

void walk(const Handle(XCAFDoc_ShapeTool) & tool, const TDF_Label& label, const TopLoc_Location& loc,
          const std::string& path, ByTShape& out) {
  if (XCAFDoc_ShapeTool::IsAssembly(label)) {
    TDF_LabelSequence components;
    XCAFDoc_ShapeTool::GetComponents(label, components);
    for (int i = 1; i <= components.Length(); ++i) {
      const TDF_Label& comp = components.Value(i);
      TDF_Label ref;
      if (!XCAFDoc_ShapeTool::GetReferredShape(comp, ref)) continue;
      std::optional<std::string> name = label_name(comp);
      if (!name) name = label_name(ref);
      const std::string step = name ? *name : "component_" + std::to_string(i);
      walk(tool, ref, loc * XCAFDoc_ShapeTool::GetLocation(comp), path.empty() ? step : path + "/" + step,
           out);
    }
    return;
  }
  if (path.empty()) return;  // a part that is not placed by any assembly
  const TopoDS_Shape shape = XCAFDoc_ShapeTool::GetShape(label).Moved(loc);
  TopTools_IndexedMapOfShape edges;
  TopExp::MapShapes(shape, TopAbs_EDGE, edges);
  for (int i = 1; i <= edges.Extent(); ++i) {
    const TopoDS_Shape& e = edges(i);
    out[e.TShape().get()].push_back({e.Location().Transformation(), path});
  }
}

void collect_names(const TDF_Label& label, std::map<const TopoDS_TShape*, std::string>& names) {
  const TopoDS_Shape shape = XCAFDoc_ShapeTool::GetShape(label);
  if (!shape.IsNull() && shape.ShapeType() == TopAbs_EDGE) {
    if (auto name = label_name(label)) names.emplace(shape.TShape().get(), *name);
  }
  TDF_LabelSequence subs;
  XCAFDoc_ShapeTool::GetSubShapes(label, subs);
  for (int i = 1; i <= subs.Length(); ++i) collect_names(subs.Value(i), names);
}

}  // namespace

XdeEdgeLabels read_xde_labels(const Handle(TDocStd_Document) & doc, const TopTools_IndexedMapOfShape& edges) {
  XdeEdgeLabels out;
  out.name.resize(edges.Extent());
  out.instance.resize(edges.Extent());
  const Handle(XCAFDoc_ShapeTool) tool = XCAFDoc_DocumentTool::ShapeTool(doc->Main());

  std::map<const TopoDS_TShape*, std::string> names;
  TDF_LabelSequence all;
  tool->GetShapes(all);
  for (int i = 1; i <= all.Length(); ++i) collect_names(all.Value(i), names);

  ByTShape placed;
  TDF_LabelSequence roots;
  tool->GetFreeShapes(roots);
  for (int i = 1; i <= roots.Length(); ++i) {
    const TDF_Label& root = roots.Value(i);
    if (!XCAFDoc_ShapeTool::IsAssembly(root)) continue;
    walk(tool, root, TopLoc_Location(), label_name(root).value_or("assembly_" + std::to_string(i)), placed);
  }

  for (int i = 1; i <= edges.Extent(); ++i) {
    const TopoDS_Shape& e = edges(i);
    const TopoDS_TShape* key = e.TShape().get();
    if (auto it = names.find(key); it != names.end()) out.name[i - 1] = it->second;
    if (auto it = placed.find(key); it != placed.end()) {
      const gp_Trsf trsf = e.Location().Transformation();
      for (const Placed& p : it->second) {
        if (same_placement(p.trsf, trsf)) {
          out.instance[i - 1] = p.path;
          break;
        }
      }
    }
  }
  return out;
}

}  // namespace ergpath::occt
