// Signals raised inside the kernel (e.g. SIGSEGV on a malformed entity) become Standard_Failure at
// the OCC_CATCH_SIGNALS point below instead of killing the process.
#define OCC_CONVERT_SIGNALS 1

#include "kernel_adapters/occt/step_model.h"

#include <BRep_Builder.hxx>
#include <BRep_Tool.hxx>
#include <HeaderSection_FileSchema.hxx>
#include <Interface_HArray1OfHAsciiString.hxx>
#include <Interface_Static.hxx>
#include <OSD.hxx>
#include <Precision.hxx>
#include <STEPCAFControl_Reader.hxx>
#include <STEPControl_Controller.hxx>
#include <STEPControl_Reader.hxx>
#include <Standard_ErrorHandler.hxx>
#include <Standard_Failure.hxx>
#include <StepData_StepModel.hxx>
#include <TColStd_SequenceOfAsciiString.hxx>
#include <TDF_LabelSequence.hxx>
#include <TopExp.hxx>
#include <TopoDS.hxx>
#include <TopoDS_Compound.hxx>
#include <TopoDS_Vertex.hxx>
#include <XCAFApp_Application.hxx>
#include <XCAFDoc_DocumentTool.hxx>
#include <XCAFDoc_ShapeTool.hxx>

#include <algorithm>
#include <cctype>
#include <fstream>
#include <mutex>
#include <sstream>

#include "kernel_adapters/occt/edge_curve.h"
#include "kernel_adapters/occt/length_text.h"
#include "kernel_adapters/occt/step_model_impl.h"
#include "kernel_adapters/occt/xde_names.h"
#include "plugin/core/curve_length.h"
#include "plugin/core/error.h"

namespace ergpath::occt {

namespace {

// Relative accuracy of the listed edge lengths: the integrator reaches ~1e-14 on smooth spans, and
// 1e-12 keeps every listed digit meaningful while the corpus (~10k edges) still lists in seconds.
constexpr double kLengthRelTol = 1e-12;
// Bytes inspected at the end of a file for the exchange-structure terminator (ISO 10303-21, clause 5):
// enough for trailing comments and blank lines after "END-ISO-10303-21;".
constexpr std::streamoff kTailBytes = 4096;

std::mutex& reader_mutex() {
  static std::mutex m;
  return m;
}

void install_signal_handlers() {
  static std::once_flag once;
  // Only where nobody else handles the signal, and without floating-point traps: the engine relies on
  // quiet NaN/Inf to report a non-finite field.
  std::call_once(once, [] { OSD::SetSignal(OSD_SignalMode_SetUnhandled, Standard_False); });
}

[[noreturn]] void unreadable(const std::string& file, const std::string& why) {
  throw Error(ErrorKind::UnreadableFile, file + ": " + why);
}

std::string upper(std::string s) {
  for (char& c : s) c = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  return s;
}

// Checks what the kernel's reader does not: that the file exists, starts as an ISO 10303-21 exchange
// structure and is not cut short.
void check_exchange_structure(const std::string& file) {
  std::ifstream in(file, std::ios::binary);
  if (!in) unreadable(file, "cannot open the file (missing or not readable)");
  in.seekg(0, std::ios::end);
  const std::streamoff size = in.tellg();
  if (size <= 0) unreadable(file, "the file is empty");
  in.seekg(0);
  std::string head(static_cast<std::size_t>(std::min<std::streamoff>(size, 256)), '\0');
  in.read(head.data(), static_cast<std::streamsize>(head.size()));
  std::size_t i = 0;
  if (head.compare(0, 3, "\xEF\xBB\xBF") == 0) i = 3;  // UTF-8 byte order mark
  while (i < head.size() && std::isspace(static_cast<unsigned char>(head[i]))) ++i;
  if (upper(head.substr(i, 12)) != "ISO-10303-21") {
    unreadable(file, "not a STEP file (it does not begin with ISO-10303-21;)");
  }
  const std::streamoff from = std::max<std::streamoff>(0, size - kTailBytes);
  in.seekg(from);
  std::string tail(static_cast<std::size_t>(size - from), '\0');
  in.read(tail.data(), static_cast<std::streamsize>(tail.size()));
  if (upper(tail).find("END-ISO-10303-21") == std::string::npos) {
    unreadable(file, "truncated STEP file (no END-ISO-10303-21; terminator)");
  }
}

std::string unit_symbol(const std::string& step_name) {
  const std::string u = upper(step_name);
  if (u == "MILLIMETRE" || u == "MILLIMETER" || u == "MM") return "mm";
  if (u == "CENTIMETRE" || u == "CENTIMETER" || u == "CM") return "cm";
  if (u == "METRE" || u == "METER" || u == "M") return "m";
  if (u == "INCH" || u == "IN") return "inch";
  if (u == "FOOT" || u == "FT") return "ft";
  if (u == "MICROMETRE" || u == "MICROMETER") return "um";
  if (u == "KILOMETRE" || u == "KILOMETER" || u == "KM") return "km";
  if (u == "MILE" || u == "MI") return "mile";
  if (u.empty()) return "unknown";
  std::string lower = step_name;
  for (char& c : lower) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return lower;
}

void read_header(STEPControl_Reader& reader, StepModel::Impl& impl) {
  TColStd_SequenceOfAsciiString lengths, angles, solid_angles;
  reader.FileUnits(lengths, angles, solid_angles);
  impl.file_unit = lengths.IsEmpty() ? "unknown" : unit_symbol(lengths.First().ToCString());
  impl.schema = "unknown";
  impl.protocol = "unknown";
  const Handle(StepData_StepModel) model = reader.StepModel();
  if (model.IsNull()) return;
  const Handle(HeaderSection_FileSchema) fs = Handle(HeaderSection_FileSchema)::DownCast(
      model->HeaderEntity(STANDARD_TYPE(HeaderSection_FileSchema)));
  if (fs.IsNull() || fs->NbSchemaIdentifiers() < 1 || fs->SchemaIdentifiersValue(1).IsNull()) return;
  std::string id = fs->SchemaIdentifiersValue(1)->ToCString();
  id = id.substr(0, id.find_first_of(" {"));
  while (!id.empty() && id.back() == '.') id.pop_back();  // some writers end the identifier with '.'

  if (id.empty()) return;
  impl.schema = id;
  const std::string u = upper(id);
  if (u.rfind("CONFIG_CONTROL_DESIGN", 0) == 0 || u.rfind("AP203", 0) == 0)
    impl.protocol = "AP203";
  else if (u.rfind("AUTOMOTIVE_DESIGN", 0) == 0)
    impl.protocol = "AP214";
  else if (u.rfind("AP242", 0) == 0)
    impl.protocol = "AP242";
}

// XDE route: names and assembly structure. Returns false when the transfer produced no shape.
bool read_with_xde(StepModel::Impl& impl, XdeEdgeLabels& labels) {
  Handle(XCAFApp_Application) app = XCAFApp_Application::GetApplication();
  Handle(TDocStd_Document) doc;
  app->NewDocument("MDTV-XCAF", doc);
  struct Closer {
    Handle(XCAFApp_Application) app;
    Handle(TDocStd_Document) doc;
    ~Closer() {
      if (!doc.IsNull() && app->CanClose(doc) == CDM_CCS_OK) app->Close(doc);
    }
  } closer{app, doc};

  STEPCAFControl_Reader reader;
  // The XDE settings exist only once an XDE reader has initialised its controller.
  Interface_Static::SetIVal("read.stepcaf.subshapes.name", 1);
  reader.SetNameMode(Standard_True);
  if (reader.ReadFile(impl.file.c_str()) != IFSelect_RetDone) {
    unreadable(impl.file, "the STEP reader rejected the file (syntax or schema error)");
  }
  read_header(reader.ChangeReader(), impl);
  if (!reader.Transfer(doc)) return false;
  const Handle(XCAFDoc_ShapeTool) tool = XCAFDoc_DocumentTool::ShapeTool(doc->Main());
  TDF_LabelSequence roots;
  tool->GetFreeShapes(roots);
  if (roots.IsEmpty()) return false;
  if (roots.Length() == 1) {
    impl.shape = XCAFDoc_ShapeTool::GetShape(roots.First());
  } else {
    TopoDS_Compound all;
    BRep_Builder builder;
    builder.MakeCompound(all);
    for (int i = 1; i <= roots.Length(); ++i) builder.Add(all, XCAFDoc_ShapeTool::GetShape(roots.Value(i)));
    impl.shape = all;
  }
  if (impl.shape.IsNull()) return false;
  TopExp::MapShapes(impl.shape, TopAbs_EDGE, impl.edges);
  labels = read_xde_labels(doc, impl.edges);
  return true;
}

void read_plain(StepModel::Impl& impl) {
  STEPControl_Reader reader;
  if (reader.ReadFile(impl.file.c_str()) != IFSelect_RetDone) {
    unreadable(impl.file, "the STEP reader rejected the file (syntax or schema error)");
  }
  read_header(reader, impl);
  reader.TransferRoots();
  impl.shape = reader.OneShape();
  impl.edges.Clear();
  if (!impl.shape.IsNull()) TopExp::MapShapes(impl.shape, TopAbs_EDGE, impl.edges);
}

Vec3 to_vec(const gp_Pnt& p) { return {p.X(), p.Y(), p.Z()}; }

EdgeInfo describe(const TopoDS_Edge& edge, int index) {
  EdgeInfo info;
  info.index = index;
  TopoDS_Vertex v1, v2;
  TopExp::Vertices(edge, v1, v2);
  info.degenerated = BRep_Tool::Degenerated(edge) || !BRep_Tool::IsGeometric(edge);
  if (info.degenerated) {
    if (!v1.IsNull()) info.start_mm = to_vec(BRep_Tool::Pnt(v1));
    info.end_mm = v2.IsNull() ? info.start_mm : to_vec(BRep_Tool::Pnt(v2));
    info.closed = true;
    return info;
  }
  const EdgeCurve curve(edge);
  info.type = curve_type_of(curve.adaptor());
  Vec3 d;
  curve.d1(curve.first(), info.start_mm, d);
  curve.d1(curve.last(), info.end_mm, d);
  info.length_m = curve_length(curve, kLengthRelTol).length * kMetresPerMillimetre;
  // Precision::Confusion() (1e-7 mm) is the kernel's own distance below which points coincide.
  info.closed =
      (!v1.IsNull() && v1.IsSame(v2)) || distance(info.start_mm, info.end_mm) <= Precision::Confusion();
  return info;
}

// Fills impl.info (and the instance paths) for the edges already numbered in impl.edges.
void describe_edges(StepModel::Impl& impl, const XdeEdgeLabels& labels) {
  impl.info.reserve(impl.edges.Extent());
  for (int i = 1; i <= impl.edges.Extent(); ++i) {
    EdgeInfo info = describe(TopoDS::Edge(impl.edges(i)), i);
    if (static_cast<std::size_t>(i) <= labels.name.size()) info.name = labels.name[i - 1];
    impl.info.push_back(std::move(info));
  }
  impl.instance = labels.instance;
  impl.instance.resize(impl.info.size());
}

}  // namespace

StepModel::StepModel() : impl_(std::make_unique<Impl>()) {}
StepModel::~StepModel() = default;
StepModel::StepModel(StepModel&&) noexcept = default;
StepModel& StepModel::operator=(StepModel&&) noexcept = default;

StepModel StepModel::read(const std::string& file) {
  check_exchange_structure(file);
  std::lock_guard<std::mutex> lock(reader_mutex());
  install_signal_handlers();
  StepModel model;
  Impl& impl = *model.impl_;
  impl.file = file;
  XdeEdgeLabels labels;
  try {
    OCC_CATCH_SIGNALS
    STEPControl_Controller::Init();
    bool ok = false;
    try {
      OCC_CATCH_SIGNALS
      ok = read_with_xde(impl, labels);
    } catch (const Standard_Failure&) {
      ok = false;
    }
    if (!ok) {
      labels = XdeEdgeLabels{};
      read_plain(impl);
    }
    if (impl.edges.Extent() == 0) throw Error(ErrorKind::EmptyModel, file + ": the model holds no edges");
    describe_edges(impl, labels);
  } catch (const Standard_Failure& e) {
    std::string what = e.GetMessageString() ? e.GetMessageString() : "";
    unreadable(file, std::string("the kernel failed while reading (") + e.DynamicType()->Name() +
                         (what.empty() ? "" : ": " + what) + ")");
  }
  return model;
}

StepModel StepModel::from_impl(std::unique_ptr<Impl> impl) {
  StepModel model;
  model.impl_ = std::move(impl);
  Impl& i = *model.impl_;
  try {
    OCC_CATCH_SIGNALS
    i.edges.Clear();
    i.info.clear();
    if (!i.shape.IsNull()) TopExp::MapShapes(i.shape, TopAbs_EDGE, i.edges);
    if (i.edges.Extent() == 0) throw Error(ErrorKind::EmptyModel, i.file + ": the shape holds no edges");
    describe_edges(i, XdeEdgeLabels{});
  } catch (const Standard_Failure& e) {
    unreadable(i.file, std::string("the kernel failed on the shape (") + e.DynamicType()->Name() + ")");
  }
  return model;
}

const std::string& StepModel::file() const { return impl_->file; }
const std::string& StepModel::file_unit() const { return impl_->file_unit; }
const std::string& StepModel::schema() const { return impl_->schema; }
const std::string& StepModel::application_protocol() const { return impl_->protocol; }
int StepModel::edge_count() const { return static_cast<int>(impl_->info.size()); }
const EdgeInfo& StepModel::edge(int index) const {
  return impl_->info.at(static_cast<std::size_t>(index - 1));
}
const std::vector<EdgeInfo>& StepModel::edges() const { return impl_->info; }

std::unique_ptr<Curve> StepModel::make_curve(int index) const {
  if (index < 1 || index > edge_count()) {
    throw Error(ErrorKind::UnknownEdge, impl_->file + ": edge " + std::to_string(index) +
                                            " is out of range (valid: 1.." + std::to_string(edge_count()) +
                                            ")");
  }
  if (edge(index).degenerated) {
    throw Error(ErrorKind::UnknownEdge,
                impl_->file + ": edge " + std::to_string(index) + " is degenerated (it has no 3-D curve)");
  }
  try {
    OCC_CATCH_SIGNALS
    return std::make_unique<EdgeCurve>(TopoDS::Edge(impl_->edges(index)));
  } catch (const Standard_Failure& e) {
    throw Error(ErrorKind::UnreadableFile, impl_->file + ": edge " + std::to_string(index) +
                                               " has no usable 3-D geometry (" + e.DynamicType()->Name() +
                                               ")");
  }
}

}  // namespace ergpath::occt
