// SPDX-License-Identifier: MIT
// Sizing a layout: positions of the maximal segments that bring every room to
// its target area inside a fixed footprint.
//
// Method: interior-point (log-barrier) Gauss–Newton on the segment positions,
// in the spirit of convex floor planning (Boyd & Vandenberghe, Convex
// Optimization, §8.8) but with the footprint fixed. For a fixed layout every
// hard requirement is a difference of two segment coordinates: a room at
// least its minimum width in both directions, a door wall at least doorWidth,
// every other contact at least `anyWall`, a spare space at least
// `spareMinimum`. These stay strictly satisfied through a log barrier, so the
// segment order can never break. The error measure minimised is
//     Σ_rooms log²(w·h / A)  +  β Σ_spares (w·h / Ā)²  +  γ Σ_rooms aspect excess²
// (relative area error, symmetric in too big and too small, and well scaled
// for rooms of very different sizes; spare spaces as small as the constraints let them be;
// `maxAspect` as a soft wish). Each Newton system is sparse (every residual
// touches four segments) and solved with Eigen's SimplicialLDLT; the sparsity
// pattern is analysed once per solve() and refactorised at each step. Why this and not a closed form: only
// one-sided layouts are area-universal (Eppstein, Mumford, Speckmann &
// Verbeek, SIAM J. Comput. 41(3), 2012); for them the least-squares optimum
// is exact, for the others it is the best compromise, and the same solver
// serves both, warm-started during a drag.
//
// Precondition: a valid labeling of the extended graph. Running time per
// Newton step O(V) plus one sparse factorisation; 20–80 steps cold, a few warm.
#pragma once

#include "brief/brief.h"
#include "brief/requirement_kind.h"
#include "dual/rectangular_dual.h"

#include <chrono>
#include <optional>
#include <string>
#include <vector>

namespace abut {

struct SizingOptions {
    double doorWidth = 0.9;     // m, shortest wall for a door adjacency
    double anyWall = minContactLength; // m, shortest wall for any other contact
    double spareMinimum = minSpareSide; // m, smallest side of a spare space
    double spareWeight = 0.05;  // β
    double aspectWeight = 0.3;  // γ
    // Area bands (Room::tolerance): within its band a room's area costs only
    // inBandWeight × log²(area / target); outside, the distance to the band.
    bool areaBands = false;
    double inBandWeight = 0.01;
    double grid = 0.0;          // m, planning module to snap segments to (0 = none)
    int maxNewtonSteps = 400;
    std::vector<int> lockedVertical, lockedHorizontal; // segment ids held where they are
    std::vector<int> lockedRooms;                      // vertex ids whose four sides are held
};

enum class SizingStatus {
    Solved,       // every hard requirement met
    Relaxed,      // the hard requirements could not all fit; they were scaled down (see unmet)
};

// What the sizer could not meet of its own aims: a room more than 1 % off
// the area it was sized towards, under its minimum width, over its aspect
// limit, a door wall shorter than a door, a wall off the planning grid. (What
// a plan misses of the brief is measured by search/requirements.h.)
struct UnmetRequirement {
    RequirementKind kind = RequirementKind::Area; // Area, MinWidth, MaxAspect, Door, Grid
    int room = -1;       // vertex id (rooms: brief index)
    int other = -1;      // second room for walls
    double wanted = 0, got = 0;
    std::string message;
};

// The options every layout of `brief` is sized with: its door width, the
// contact and spare minimums and the planning grid (all stages use this).
SizingOptions sizingOptionsFor(const Brief& brief, double anyWall = minContactLength,
                               double spareMinimum = minSpareSide, double grid = 0);

// Shortest length each wall of `segs` must keep: doorWidth between two rooms
// with a door adjacency, anyWall otherwise.
std::vector<double> wallMinimums(const Brief& brief, const ExtendedGraph& x, const SegmentStructure& segs,
                                 double doorWidth, double anyWall);

struct RoomSize {
    double area = 0, deviation = 0, aspect = 0; // deviation relative: (area − target)/target
};

struct SizingResult {
    SizingStatus status = SizingStatus::Solved;
    std::vector<double> x, y;       // per vertical / horizontal segment
    std::vector<Rect> rects;        // per vertex of the extended graph (poles empty)
    std::vector<RoomSize> rooms;    // per brief room
    std::vector<UnmetRequirement> unmet;
    double objective = 0;
    double relaxation = 1.0;   // factor the hard minimums were scaled by to fit (1 = none)
    int newtonSteps = 0;
};

// Everything about a layout that does not change while the planner works on
// it: built once, sized many times.
class SizingProblem {
public:
    SizingProblem(const Brief& brief, const ExtendedGraph& x, const RegularEdgeLabeling& rel,
                  const Footprint& footprint, const SizingOptions& options);

    // Cold start from a stretched longest-path layout, or warm from `start`:
    // kept as it is when it is strictly feasible, else its proportions are
    // kept in a longest-path layout that meets the hard minimums.
    SizingResult solve(const SizingResult* start = nullptr) const;

    // The layout, room sizes and unmet requirements of given segment
    // positions (no optimisation): for a drag that moves one segment.
    SizingResult evaluate(std::vector<double> x, std::vector<double> y) const;
    // The segment positions of a layout given as rectangles per vertex of the
    // extended graph (as a plan variant stores them), evaluated.
    SizingResult stateOf(const std::vector<Rect>& rects) const;

    // How far segment `segment` (vertical or horizontal) can move with every
    // other segment where `current` has it, keeping all hard requirements.
    std::pair<double, double> segmentRange(const SizingResult& current, bool vertical, int segment) const;

    const SegmentStructure& segments() const { return segs_; }
    const SizingOptions& options() const { return options_; }
    void setOptions(const SizingOptions& o) { options_ = o; }
    void setTargetArea(int room, double area) { target_[room] = area; }
    // Areas the layout should aim at, per vertex (0: none), instead of the
    // targets (which still measure what is unmet): a room is sized towards
    // it (with area bands: lightly, within its band); a spare space is sized
    // towards it instead of as small as it can be.
    void setPreferredAreas(std::vector<double> perVertex) { preferred_ = std::move(perVertex); }
    // Whether `layout` meets every hard minimum (widths, walls) strictly.
    bool meetsMinimums(const SizingResult& layout) const;
    // Hard minimums (widths, walls) that `layout` does not meet are held at
    // what it has instead: sizing then improves the areas without forcing
    // them, and the layout's shortfalls stay (and are reported as unmet).
    void holdMinimumsAt(const SizingResult& layout);
    // Newton steps stop at this moment (the layout so far is kept: every
    // hard requirement it met stays met); for work under a time limit, such
    // as checking what must give on thousands of rooms. Default: none.
    void setDeadline(std::chrono::steady_clock::time_point at) { deadline_ = at; }

private:
    // coordinate[to] − coordinate[from] ≥ min on one axis; `vertex` is the
    // room or spare whose extent it is (−1 for a wall).
    struct Gap { bool vertical; int from, to; double min; int vertex = -1; };
    struct Solve; // the steps of one sizing (segment_sizing.cpp)
    std::vector<Gap> gaps() const;
    void describe(SizingResult& result) const; // rects, room sizes, unmet from result.x, result.y

    const Brief& brief_;
    const ExtendedGraph& x_;
    SegmentStructure segs_;
    Footprint footprint_;
    SizingOptions options_;
    std::vector<double> target_;
    std::vector<double> preferred_; // per vertex, 0 = none
    std::vector<double> cap_;       // per gap: a lower minimum held (holdMinimumsAt)
    std::vector<double> wallMin_; // per wall of segs_
    std::optional<std::chrono::steady_clock::time_point> deadline_;
};

} // namespace abut
