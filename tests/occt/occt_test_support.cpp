#include "occt_test_support.h"

#include <BRepAdaptor_Curve.hxx>
#include <GCPnts_AbscissaPoint.hxx>
#include <TopoDS.hxx>

#include "kernel_adapters/occt/step_model_impl.h"

namespace ergpath::occt::testing {

std::string fixture(const std::string& name) { return std::string(ERGPATH_FIXTURES_DIR) + "/" + name; }

TopoDS_Edge kernel_edge(const StepModel& model, int index) { return TopoDS::Edge(model.impl().edges(index)); }

double gcpnts_length_mm(const TopoDS_Edge& edge) {
  BRepAdaptor_Curve c(edge);
  return GCPnts_AbscissaPoint::Length(c, 1e-12);
}

}  // namespace ergpath::occt::testing
