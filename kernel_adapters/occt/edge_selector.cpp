// select_edges: the selector grammar of docs/selectors.md.
//
// Unknown names are answered with the closest existing names by Levenshtein distance
// (V. I. Levenshtein, Soviet Physics Doklady 10(8), 1966; Wagner & Fischer, J. ACM 21(1), 1974).
#include <BRepTools.hxx>
#include <BRepTools_WireExplorer.hxx>
#include <Standard_Failure.hxx>
#include <TopExp.hxx>
#include <TopExp_Explorer.hxx>
#include <TopoDS.hxx>
#include <TopoDS_Wire.hxx>

#include <algorithm>
#include <cctype>
#include <cerrno>
#include <cmath>
#include <cstdlib>
#include <limits>
#include <set>

#include "kernel_adapters/occt/edge_distance.h"
#include "kernel_adapters/occt/path_builder.h"
#include "kernel_adapters/occt/step_model_impl.h"
#include "plugin/core/error.h"

namespace ergpath::occt {

namespace {

[[noreturn]] void bad(const std::string& selector, const std::string& why) {
  throw Error(ErrorKind::BadSelector, "selector '" + selector + "': " + why);
}

std::string trim(const std::string& s) {
  const auto b = s.find_first_not_of(" \t");
  if (b == std::string::npos) return "";
  return s.substr(b, s.find_last_not_of(" \t") - b + 1);
}

// Splits at commas outside double quotes; a backslash escapes the next character inside quotes.
std::vector<std::string> split(const std::string& selector) {
  std::vector<std::string> out(1);
  bool quoted = false;
  for (std::size_t i = 0; i < selector.size(); ++i) {
    const char c = selector[i];
    if (quoted && c == '\\' && i + 1 < selector.size()) {
      out.back() += c;
      out.back() += selector[++i];
    } else if (c == '"') {
      quoted = !quoted;
      out.back() += c;
    } else if (c == ',' && !quoted) {
      out.emplace_back();
    } else {
      out.back() += c;
    }
  }
  if (quoted) bad(selector, "unbalanced double quote");
  for (std::string& t : out) t = trim(t);
  return out;
}

std::string unquote(const std::string& selector, const std::string& text) {
  if (text.empty() || text.front() != '"') return text;
  if (text.size() < 2 || text.back() != '"') bad(selector, "text after a closing quote in " + text);
  std::string out;
  for (std::size_t i = 1; i + 1 < text.size(); ++i) {
    if (text[i] == '\\' && i + 2 < text.size()) ++i;
    out += text[i];
  }
  return out;
}

// A positive decimal index; values beyond int are reported as out of range by the caller (-1).
long long parse_index(const std::string& selector, const std::string& text) {
  if (text.empty() || !std::all_of(text.begin(), text.end(),
                                   [](char c) { return std::isdigit(static_cast<unsigned char>(c)); })) {
    bad(selector, "'" + text + "' is not an index (a whole number from 1)");
  }
  const std::string digits = text.substr(std::min(text.find_first_not_of('0'), text.size() - 1));
  if (digits.size() > 10) return -1;
  const long long v = std::stoll(digits);
  return v > std::numeric_limits<int>::max() ? -1 : v;
}

double parse_number(const std::string& selector, const std::string& text) {
  errno = 0;
  char* end = nullptr;
  const double v = std::strtod(text.c_str(), &end);
  if (text.empty() || end != text.c_str() + text.size() || errno == ERANGE || !std::isfinite(v)) {
    bad(selector, "'" + text + "' is not a finite number");
  }
  return v;
}

std::size_t levenshtein(const std::string& a, const std::string& b) {
  std::vector<std::size_t> row(b.size() + 1);
  for (std::size_t j = 0; j <= b.size(); ++j) row[j] = j;
  for (std::size_t i = 1; i <= a.size(); ++i) {
    std::size_t diag = row[0];
    row[0] = i;
    for (std::size_t j = 1; j <= b.size(); ++j) {
      const std::size_t up = row[j];
      row[j] = std::min({row[j] + 1, row[j - 1] + 1, diag + (a[i - 1] == b[j - 1] ? 0 : 1)});
      diag = up;
    }
  }
  return row[b.size()];
}

class Resolver {
 public:
  Resolver(const StepModel& model, const std::string& selector) : model_(model), selector_(selector) {}

  void add(int e) {
    if (seen_.insert(e).second) out_.push_back(e);
  }
  std::vector<int> result() { return out_; }

  int checked_index(const char* what, long long i, int count) const {
    if (i < 1 || i > count) {
      const std::string valid =
          count == 0 ? std::string("it has none") : "valid: 1.." + std::to_string(count);
      throw Error(ErrorKind::UnknownEdge, model_.file() + ": " + what + " " +
                                              (i < 0 ? std::string("index") : std::to_string(i)) +
                                              " is out of range (" + valid + ")");
    }
    return static_cast<int>(i);
  }

  // "I" or "I-J" (ascending or descending), appended through `use`.
  template <class Use>
  void index_list(const char* what, const std::string& item, int count, Use use) {
    const auto dash = item.find('-');
    if (dash == std::string::npos) {
      use(checked_index(what, parse_index(selector_, item), count));
      return;
    }
    const int a = checked_index(what, parse_index(selector_, trim(item.substr(0, dash))), count);
    const int b = checked_index(what, parse_index(selector_, trim(item.substr(dash + 1))), count);
    for (int i = a;; i += (b >= a ? 1 : -1)) {
      use(i);
      if (i == b) break;
    }
  }

  void by_name(const std::string& raw) {
    const std::string name = unquote(selector_, raw);
    if (name.empty()) bad(selector_, "name: needs a name");
    bool found = false;
    std::set<std::string> names;
    for (const EdgeInfo& e : model_.edges()) {
      if (!e.name) continue;
      names.insert(*e.name);
      if (*e.name == name) {
        add(e.index);
        found = true;
      }
    }
    if (found) return;
    std::string hint = " (the file carries no edge names)";
    if (!names.empty()) {
      std::vector<std::pair<std::size_t, std::string>> ranked;
      for (const std::string& n : names) ranked.emplace_back(levenshtein(name, n), n);
      std::sort(ranked.begin(), ranked.end());
      hint = "; closest names:";
      for (std::size_t i = 0; i < std::min<std::size_t>(3, ranked.size()); ++i)
        hint += (i ? ", '" : " '") + ranked[i].second + "'";
    }
    throw Error(ErrorKind::UnknownEdge, model_.file() + ": no edge named '" + name + "'" + hint);
  }

  void wire_edges(const TopoDS_Wire& wire, const char* what, int i) {
    const Impl& impl = model_.impl();
    std::vector<int> ids;
    try {
      for (BRepTools_WireExplorer ex(wire); ex.More(); ex.Next())
        ids.push_back(impl.edges.FindIndex(ex.Current()));
    } catch (const Standard_Failure&) {
      ids.clear();
    }
    std::size_t total = 0;
    for (TopExp_Explorer ex(wire, TopAbs_EDGE); ex.More(); ex.Next()) ++total;
    if (ids.size() != total) {
      // The wire explorer follows shared vertices only; keep the stored order for the rest.
      ids.clear();
      for (TopExp_Explorer ex(wire, TopAbs_EDGE); ex.More(); ex.Next())
        ids.push_back(impl.edges.FindIndex(ex.Current()));
    }
    std::set<int> once;
    for (int id : ids) {
      if (!once.insert(id).second) {
        bad(selector_, std::string(what) + " " + std::to_string(i) + " runs along seam edge " +
                           std::to_string(id) +
                           " in both directions, so it is not one simple path; select its edges instead");
      }
    }
    for (int id : ids) add(id);
  }

  void wire(long long i) {
    TopTools_IndexedMapOfShape wires;
    TopExp::MapShapes(model_.impl().shape, TopAbs_WIRE, wires);
    const int w = checked_index("wire", i, wires.Extent());
    wire_edges(TopoDS::Wire(wires(w)), "wire", w);
  }

  void face(long long i) {
    TopTools_IndexedMapOfShape faces;
    TopExp::MapShapes(model_.impl().shape, TopAbs_FACE, faces);
    const int f = checked_index("face", i, faces.Extent());
    const TopoDS_Wire outer = BRepTools::OuterWire(TopoDS::Face(faces(f)));
    if (outer.IsNull()) bad(selector_, "face " + std::to_string(f) + " has no boundary");
    wire_edges(outer, "face", f);
  }

  void near(const Vec3& p) {
    const int e = nearest_edge(model_, p);
    if (e < 1)
      throw Error(ErrorKind::UnknownEdge, model_.file() + ": no edge with a 3-D curve to be near to");
    add(e);
  }

 private:
  using Impl = StepModel::Impl;
  const StepModel& model_;
  const std::string& selector_;
  std::vector<int> out_;
  std::set<int> seen_;
};

}  // namespace

std::vector<int> select_edges(const StepModel& model, const std::string& selector) {
  const std::vector<std::string> items = split(selector);
  if (items.size() == 1 && items[0].empty()) bad(selector, "empty selector");
  Resolver r(model, selector);
  std::string kind;  // the list a bare item continues: "edges", "wire" or "face"
  for (std::size_t i = 0; i < items.size(); ++i) {
    const std::string& item = items[i];
    if (item.empty()) bad(selector, "empty item between commas");
    const auto colon = item.find(':');
    const bool quoted_start = !item.empty() && item.front() == '"';
    std::string head = colon == std::string::npos || quoted_start ? "" : item.substr(0, colon);
    if (!std::all_of(head.begin(), head.end(),
                     [](char c) { return std::isalpha(static_cast<unsigned char>(c)); }))
      head.clear();
    const std::string arg = head.empty() ? item : trim(item.substr(colon + 1));
    if (head.empty()) {
      if (item == "all") {
        for (const EdgeInfo& e : model.edges()) r.add(e.index);
        kind.clear();
        continue;
      }
      if (kind.empty()) bad(selector, "'" + item + "' does not follow edges:, wire: or face:");
      head = kind;
    }
    if (head == "edge" || head == "edges") {
      kind = "edges";
      r.index_list("edge", arg, model.edge_count(), [&](int e) { r.add(e); });
    } else if (head == "wire") {
      kind = "wire";
      r.wire(parse_index(selector, arg));
    } else if (head == "face") {
      kind = "face";
      r.face(parse_index(selector, arg));
    } else if (head == "name") {
      kind.clear();
      r.by_name(arg);
    } else if (head == "near") {
      kind.clear();
      if (i + 2 >= items.size()) bad(selector, "near: needs three coordinates X,Y,Z in mm");
      r.near({parse_number(selector, arg), parse_number(selector, items[i + 1]),
              parse_number(selector, items[i + 2])});
      i += 2;
    } else {
      bad(selector,
          "unknown selector kind '" + head + ":' (use all, edge:, edges:, name:, wire:, face:, near:)");
    }
  }
  return r.result();
}

}  // namespace ergpath::occt
