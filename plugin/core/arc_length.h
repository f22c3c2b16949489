// Arc length along a path and its inverse: s(t) per segment and t(s) along the whole path.
//
// Each break-free span is cut into pieces on which Gauss-Kronrod 7/15 resolves |r'(t)| to the requested
// relative tolerance (Kronrod 1965; Piessens et al. 1983); the cumulative length at piece ends is stored.
// Inside a piece, s(t) adds a 10-point Gauss-Legendre integral from the piece start to t, so s is accurate
// at any t, not only at stored points. t(s) solves s(t) = s by Newton's method with the speed as
// derivative, safeguarded by bisection on the piece bracket where the speed is near zero or a step
// leaves the bracket. See docs/method.md.
#pragma once

#include <cstddef>
#include <vector>

#include "path.h"

namespace ergpath {

/// A point on a path: which segment, which curve parameter, where, and how far from the start.
struct PathLocation {
  std::size_t segment = 0;  // index into Path::segments
  double t = 0.0;           // curve parameter of that segment
  int edge = 0;             // Segment::edge
  Vec3 position;            // model length unit
  double s_m = 0.0;         // arc length from the path start in travel direction, metres
};

class ArcLength {
 public:
  /// Default relative accuracy of every stored length (w.r.t. the segment length).
  static constexpr double kDefaultRelTol = 1e-13;

  /// Throws Error(NonFiniteField) naming the edge when r'(t) is not finite, Error(BadOption) when
  /// rel_tol is not positive. Keeps the path's curves (shared); use one ArcLength per thread.
  explicit ArcLength(const Path& path, double rel_tol = kDefaultRelTol);

  double total_m() const { return total_m_; }
  /// Estimated absolute error of total_m(), metres.
  double error_m() const { return error_m_; }
  std::size_t segment_count() const { return segments_.size(); }
  /// Arc length from the path start to the travel start of segment k, and its length, metres.
  double segment_start_m(std::size_t k) const;
  double segment_length_m(std::size_t k) const;

  /// Arc length in metres from the path start to parameter t of segment k, in travel direction
  /// (a reversed segment is travelled from last() to first()). t is clamped to the curve range.
  double s_at(std::size_t segment, double t) const;

  /// The point at arc length s_m (metres) from the path start; |s_at(locate(s).t) - s| <= 1e-12 total.
  /// Throws Error(BadOption) when s_m lies outside [0, total_m()] (beyond a 1e-12 relative slack).
  PathLocation locate(double s_m) const;

  /// Parameter of segment k at arc length s_m from the path start (s_m clamped to the segment).
  double t_at(std::size_t segment, double s_m) const;

  long curve_evaluations() const { return evaluations_; }

 private:
  struct SegmentTable {
    std::vector<double> t;    // piece ends, ascending curve parameter, first() .. last()
    std::vector<double> cum;  // length from first() to t[i] along the parameter, model length unit
    double start_m = 0.0;     // travel distance to the segment start, metres
    bool reversed = false;
  };
  double along_parameter(const SegmentTable& table, std::size_t k, double t) const;  // model unit

  Path path_;
  std::vector<SegmentTable> segments_;
  double total_m_ = 0.0;
  double error_m_ = 0.0;
  mutable long evaluations_ = 0;
};

}  // namespace ergpath
