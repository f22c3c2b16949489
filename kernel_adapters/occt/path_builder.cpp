#include "kernel_adapters/occt/path_builder.h"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <numeric>
#include <set>
#include <sstream>
#include <unordered_map>

#include "kernel_adapters/occt/length_text.h"
#include "plugin/core/error.h"

namespace ergpath::occt {

namespace {

std::string point(const Vec3& p) {
  return "(" + mm_text(p.x) + ", " + mm_text(p.y) + ", " + mm_text(p.z) + ") mm";
}

// Union-find over end points.
struct Disjoint {
  std::vector<int> parent;
  explicit Disjoint(int n) : parent(static_cast<std::size_t>(n)) {
    std::iota(parent.begin(), parent.end(), 0);
  }
  int find(int i) {
    while (parent[i] != i) i = parent[i] = parent[parent[i]];
    return i;
  }
  void unite(int a, int b) { parent[find(a)] = find(b); }
};

// Merges end points closer than `tol` (mm) with a uniform grid, so large selections stay linear.
std::vector<int> cluster_points(const std::vector<Vec3>& pts, double tol) {
  const int n = static_cast<int>(pts.size());
  Disjoint sets(n);
  double extent = 0.0;
  for (const Vec3& p : pts) extent = std::max({extent, std::abs(p.x), std::abs(p.y), std::abs(p.z)});
  // A cell no smaller than the tolerance finds every neighbour in the 27 surrounding cells; the floor
  // keeps cell indices well inside 64-bit integers for any coordinate a double can hold.
  const double cell = std::max({tol, extent * 1e-15, std::numeric_limits<double>::min()});
  auto key = [&](long long i, long long j, long long k) {
    return (i * 73856093LL) ^ (j * 19349663LL) ^ (k * 83492791LL);
  };
  std::unordered_map<long long, std::vector<int>> grid;
  std::vector<std::array<long long, 3>> cells(pts.size());
  for (int a = 0; a < n; ++a) {
    cells[a] = {static_cast<long long>(std::floor(pts[a].x / cell)),
                static_cast<long long>(std::floor(pts[a].y / cell)),
                static_cast<long long>(std::floor(pts[a].z / cell))};
    for (long long di = -1; di <= 1; ++di)
      for (long long dj = -1; dj <= 1; ++dj)
        for (long long dk = -1; dk <= 1; ++dk) {
          auto it = grid.find(key(cells[a][0] + di, cells[a][1] + dj, cells[a][2] + dk));
          if (it == grid.end()) continue;
          for (int b : it->second) {
            if (distance(pts[a], pts[b]) <= tol) sets.unite(a, b);
          }
        }
    grid[key(cells[a][0], cells[a][1], cells[a][2])].push_back(a);
  }
  std::vector<int> node(pts.size());
  std::unordered_map<int, int> ids;
  for (int a = 0; a < n; ++a) {
    const int root = sets.find(a);
    auto [it, inserted] = ids.emplace(root, static_cast<int>(ids.size()));
    node[a] = it->second;
  }
  return node;
}

struct Step {
  int k;          // position in the kept-edge list
  bool reversed;  // travelled from its end to its start
};

}  // namespace

Path build_path(const StepModel& model, const std::vector<int>& edges, const PathOptions& options,
                std::vector<std::string>* notes) {
  const std::string& file = model.file();
  if (!std::isfinite(options.gap_tolerance_mm) || options.gap_tolerance_mm < 0.0) {
    throw Error(ErrorKind::BadOption,
                "gap tolerance must be a finite length >= 0 mm, got " + mm_text(options.gap_tolerance_mm));
  }
  if (options.start_mm && !is_finite(*options.start_mm)) {
    throw Error(ErrorKind::BadOption, "start point must have finite coordinates (mm)");
  }
  if (edges.empty()) throw Error(ErrorKind::UnknownEdge, file + ": no edge selected");

  std::vector<int> kept;  // model edge indices, selection order, degenerated ones left out
  std::set<int> seen;
  for (int e : edges) {
    if (e < 1 || e > model.edge_count()) {
      throw Error(ErrorKind::UnknownEdge, file + ": edge " + std::to_string(e) +
                                              " is out of range (valid: 1.." +
                                              std::to_string(model.edge_count()) + ")");
    }
    if (!seen.insert(e).second) {
      throw Error(ErrorKind::BadSelector,
                  file + ": edge " + std::to_string(e) + " is selected twice; a path uses each edge once");
    }
    if (model.edge(e).degenerated) {
      if (notes)
        notes->push_back("edge " + std::to_string(e) + " is degenerated (no 3-D curve) and was skipped");
      continue;
    }
    kept.push_back(e);
  }
  if (kept.empty()) throw Error(ErrorKind::UnknownEdge, file + ": every selected edge is degenerated");

  const int n = static_cast<int>(kept.size());
  std::vector<Vec3> ends(2 * static_cast<std::size_t>(n));
  for (int k = 0; k < n; ++k) {
    ends[2 * k] = model.edge(kept[k]).start_mm;
    ends[2 * k + 1] = model.edge(kept[k]).end_mm;
  }
  const std::vector<int> node = cluster_points(ends, options.gap_tolerance_mm);
  const int nodes = *std::max_element(node.begin(), node.end()) + 1;

  std::vector<std::vector<int>> incident(static_cast<std::size_t>(nodes));  // end-point ids 2k + side
  for (int a = 0; a < 2 * n; ++a) incident[node[a]].push_back(a);
  for (int v = 0; v < nodes; ++v) {
    if (incident[v].size() < 3) continue;
    std::vector<int> ids;
    for (int a : incident[v]) ids.push_back(kept[a / 2]);
    ids.erase(std::unique(ids.begin(), ids.end()), ids.end());
    std::string list;
    for (std::size_t i = 0; i < ids.size(); ++i) list += (i ? ", " : "") + std::to_string(ids[i]);
    throw Error(ErrorKind::BranchInPath, file + ": edges " + list + " meet at " +
                                             point(ends[incident[v][0]]) +
                                             "; a path cannot branch, select one route");
  }

  // Components of the edge graph: exactly one is a path.
  Disjoint comp(nodes);
  for (int k = 0; k < n; ++k) comp.unite(node[2 * k], node[2 * k + 1]);
  const int root = comp.find(node[0]);
  if (std::any_of(node.begin(), node.end(), [&](int v) { return comp.find(v) != root; })) {
    // Name the closest pair of ends in different pieces: that is the gap the user has to look at.
    double best = std::numeric_limits<double>::infinity();
    int ba = 0, bb = 0;
    std::vector<int> free_ends;
    for (int a = 0; a < 2 * n; ++a)
      if (incident[node[a]].size() == 1) free_ends.push_back(a);
    if (free_ends.empty()) {
      free_ends.resize(2 * static_cast<std::size_t>(n));
      std::iota(free_ends.begin(), free_ends.end(), 0);
    }
    for (int a : free_ends)
      for (int b : free_ends)
        if (comp.find(node[a]) != comp.find(node[b]) && distance(ends[a], ends[b]) < best) {
          best = distance(ends[a], ends[b]);
          ba = a;
          bb = b;
        }
    if (kept[ba / 2] > kept[bb / 2]) std::swap(ba, bb);
    throw Error(ErrorKind::GapTooLarge,
                file + ": gap of " + mm_text(best) + " mm between edge " + std::to_string(kept[ba / 2]) +
                    " and edge " + std::to_string(kept[bb / 2]) + " exceeds the chaining tolerance of " +
                    mm_text(options.gap_tolerance_mm) + " mm");
  }

  // Every node has one or two incident ends: an open chain has two ends of degree one, a loop none.
  int start_node = -1;
  for (int v = 0; v < nodes && start_node < 0; ++v)
    if (incident[v].size() == 1) start_node = v;
  const bool closed = start_node < 0;
  if (closed) start_node = node[0];  // the first selected edge's start

  std::vector<Step> walk;
  std::vector<bool> used(static_cast<std::size_t>(n), false);
  int at = start_node;
  int first_end = closed ? 0 : incident[start_node][0];
  for (int step = 0; step < n; ++step) {
    int a = -1;
    if (step == 0) {
      a = first_end;
    } else {
      for (int c : incident[at])
        if (!used[c / 2]) a = c;
    }
    if (a < 0) break;
    const int k = a / 2;
    used[k] = true;
    walk.push_back({k, a % 2 == 1});
    at = node[a ^ 1];
  }

  auto flip = [](std::vector<Step>& w) {
    std::reverse(w.begin(), w.end());
    for (Step& s : w) s.reversed = !s.reversed;
  };
  auto travel_start_of = [&](const Step& s) { return ends[2 * s.k + (s.reversed ? 1 : 0)]; };
  if (!closed) {
    // The first selected edge runs along its own parameter, unless a start point picks the other end.
    const auto first = std::find_if(walk.begin(), walk.end(), [](const Step& s) { return s.k == 0; });
    if (first->reversed) flip(walk);
    if (options.start_mm) {
      const Vec3 head = travel_start_of(walk.front());
      const Vec3 tail = ends[2 * walk.back().k + (walk.back().reversed ? 0 : 1)];
      if (distance(*options.start_mm, tail) < distance(*options.start_mm, head)) flip(walk);
    }
  } else if (options.start_mm) {
    std::size_t best = 0;
    for (std::size_t i = 1; i < walk.size(); ++i)
      if (distance(*options.start_mm, travel_start_of(walk[i])) <
          distance(*options.start_mm, travel_start_of(walk[best])))
        best = i;
    std::rotate(walk.begin(), walk.begin() + static_cast<std::ptrdiff_t>(best), walk.end());
  }
  if (options.reverse) flip(walk);

  if (notes) {
    bool reordered = false;
    for (int i = 0; i < n; ++i) reordered = reordered || walk[i].k != i;
    if (reordered) {
      std::string order;
      for (int i = 0; i < n; ++i) order += (i ? "," : "") + std::to_string(kept[walk[i].k]);
      notes->push_back("edges chained in the order " + order);
    }
  }

  Path path;
  path.length_unit_m = kMetresPerMillimetre;
  path.closed = closed;
  for (const Step& s : walk) {
    Segment seg;
    seg.curve = std::shared_ptr<const Curve>(model.make_curve(kept[s.k]));
    seg.reversed = s.reversed;
    seg.edge = kept[s.k];
    seg.name = model.edge(kept[s.k]).name.value_or("");
    path.segments.push_back(std::move(seg));
  }
  return path;
}

}  // namespace ergpath::occt
