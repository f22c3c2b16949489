#include "kernel_adapters/occt/edge_inventory.h"

#include <BRepAdaptor_Curve.hxx>
#include <BRep_Tool.hxx>
#include <GeomAdaptor_Curve.hxx>
#include <Geom_BSplineCurve.hxx>
#include <Geom_BezierCurve.hxx>
#include <Geom_OffsetCurve.hxx>
#include <Geom_TrimmedCurve.hxx>
#include <Standard_Failure.hxx>
#include <TopExp.hxx>
#include <TopTools_IndexedDataMapOfShapeListOfShape.hxx>
#include <TopTools_ListOfShape.hxx>
#include <TopoDS.hxx>

#include <algorithm>
#include <cmath>

#include "kernel_adapters/occt/edge_curve.h"
#include "kernel_adapters/occt/edge_distance.h"
#include "kernel_adapters/occt/step_model_impl.h"
#include "plugin/core/error.h"

namespace ergpath::occt {

namespace {

std::vector<int> ancestors(const TopTools_IndexedDataMapOfShapeListOfShape& map,
                           const TopTools_IndexedMapOfShape& index, const TopoDS_Shape& edge) {
  std::vector<int> out;
  const int k = map.FindIndex(edge);
  if (k == 0) return out;
  for (TopTools_ListOfShape::Iterator it(map(k)); it.More(); it.Next())
    out.push_back(index.FindIndex(it.Value()));
  std::sort(out.begin(), out.end());
  out.erase(std::unique(out.begin(), out.end()), out.end());
  return out;
}

void curve_details(const TopoDS_Edge& edge, EdgeDetails& d) {
  double f = 0.0, l = 0.0;
  Handle(Geom_Curve) c = BRep_Tool::Curve(edge, f, l);
  while (!c.IsNull() && c->IsKind(STANDARD_TYPE(Geom_TrimmedCurve)))
    c = Handle(Geom_TrimmedCurve)::DownCast(c)->BasisCurve();
  if (c.IsNull()) return;
  if (auto bs = Handle(Geom_BSplineCurve)::DownCast(c)) {
    d.degree = bs->Degree();
    d.poles = bs->NbPoles();
    d.rational = bs->IsRational();
  } else if (auto bz = Handle(Geom_BezierCurve)::DownCast(c)) {
    d.degree = bz->Degree();
    d.poles = bz->NbPoles();
    d.rational = bz->IsRational();
  } else if (auto off = Handle(Geom_OffsetCurve)::DownCast(c)) {
    GeomAdaptor_Curve basis(off->BasisCurve());
    switch (basis.GetType()) {
      case GeomAbs_Line:
        d.basis = CurveType::Line;
        break;
      case GeomAbs_Circle:
        d.basis = CurveType::Circle;
        break;
      case GeomAbs_Ellipse:
        d.basis = CurveType::Ellipse;
        break;
      case GeomAbs_BezierCurve:
        d.basis = CurveType::Bezier;
        break;
      case GeomAbs_BSplineCurve:
        d.basis = CurveType::BSpline;
        break;
      default:
        d.basis = CurveType::Other;
        break;
    }
  }
}

void check_length(const char* what, const std::optional<double>& v) {
  if (v && !(std::isfinite(*v) && *v >= 0.0)) {
    throw Error(ErrorKind::BadOption, std::string(what) + " must be a finite value >= 0");
  }
}

}  // namespace

Inventory edge_inventory(const StepModel& model) {
  const StepModel::Impl& impl = model.impl();
  Inventory inv;
  TopTools_IndexedMapOfShape faces, wires;
  TopExp::MapShapes(impl.shape, TopAbs_FACE, faces);
  TopExp::MapShapes(impl.shape, TopAbs_WIRE, wires);
  inv.face_count = faces.Extent();
  inv.wire_count = wires.Extent();
  TopTools_IndexedDataMapOfShapeListOfShape edge_faces, edge_wires;
  TopExp::MapShapesAndUniqueAncestors(impl.shape, TopAbs_EDGE, TopAbs_FACE, edge_faces);
  TopExp::MapShapesAndUniqueAncestors(impl.shape, TopAbs_EDGE, TopAbs_WIRE, edge_wires);
  for (int i = 1; i <= impl.edges.Extent(); ++i) {
    const TopoDS_Edge& edge = TopoDS::Edge(impl.edges(i));
    EdgeDetails d;
    d.index = i;
    d.faces = ancestors(edge_faces, faces, edge);
    d.wires = ancestors(edge_wires, wires, edge);
    for (int f : d.faces) d.seam = d.seam || BRep_Tool::IsClosed(edge, TopoDS::Face(faces(f)));
    try {
      curve_details(edge, d);
    } catch (const Standard_Failure&) {
      // Details are informative only; the listing still shows type, ends and length.
    }
    d.instance = impl.instance[static_cast<std::size_t>(i - 1)];
    inv.edges.push_back(std::move(d));
  }
  return inv;
}

CurveType parse_curve_type(const std::string& name) {
  for (CurveType t :
       {CurveType::Line, CurveType::Circle, CurveType::Ellipse, CurveType::Hyperbola, CurveType::Parabola,
        CurveType::Bezier, CurveType::BSpline, CurveType::Offset, CurveType::Other}) {
    if (name == to_string(t)) return t;
  }
  throw Error(ErrorKind::BadOption,
              "unknown edge type '" + name +
                  "' (use line, circle, ellipse, hyperbola, parabola, bezier, bspline, offset, other)");
}

bool glob_match(const std::string& pattern, const std::string& text) {
  // Iterative wildcard matching with one backtrack point for the last '*' (linear in practice).
  std::size_t p = 0, t = 0, star = std::string::npos, mark = 0;
  while (t < text.size()) {
    if (p < pattern.size() && (pattern[p] == '?' || pattern[p] == text[t])) {
      ++p;
      ++t;
    } else if (p < pattern.size() && pattern[p] == '*') {
      star = p++;
      mark = t;
    } else if (star != std::string::npos) {
      p = star + 1;
      t = ++mark;
    } else {
      return false;
    }
  }
  while (p < pattern.size() && pattern[p] == '*') ++p;
  return p == pattern.size();
}

std::vector<int> filter_edges(const StepModel& model, const EdgeFilter& filter) {
  check_length("--min-length", filter.min_length_m);
  check_length("--max-length", filter.max_length_m);
  check_length("--within", filter.within_mm);
  if (filter.within_mm && !filter.near_mm) throw Error(ErrorKind::BadOption, "--within needs --near X,Y,Z");
  if (filter.near_mm && !is_finite(*filter.near_mm))
    throw Error(ErrorKind::BadOption, "--near needs finite coordinates");
  int nearest = 0;
  if (filter.near_mm && !filter.within_mm) nearest = nearest_edge(model, *filter.near_mm);
  std::vector<int> out;
  for (const EdgeInfo& e : model.edges()) {
    if (!filter.types.empty() &&
        std::find(filter.types.begin(), filter.types.end(), e.type) == filter.types.end())
      continue;
    if (!filter.name_pattern.empty() && !(e.name && glob_match(filter.name_pattern, *e.name))) continue;
    if (filter.min_length_m && e.length_m < *filter.min_length_m) continue;
    if (filter.max_length_m && e.length_m > *filter.max_length_m) continue;
    if (filter.near_mm) {
      if (filter.within_mm) {
        if (e.degenerated || distance_to_edge(model, e.index, *filter.near_mm) > *filter.within_mm) continue;
      } else if (e.index != nearest) {
        continue;
      }
    }
    out.push_back(e.index);
  }
  return out;
}

}  // namespace ergpath::occt
