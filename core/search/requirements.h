// SPDX-License-Identifier: MIT
// The one measure of what a plan misses, on its room rectangles: every room
// within its area band, at least its minimum width, at most its aspect
// limit, exactly where it is fixed; every adjacency a shared wall (a door
// one at least doorWidth long, a wall one at least Thresholds::anyWall);
// every facade wish met (a wall on a cut-out counts, facing the side it
// faces). The plan search's cost, the search's and the plan's counts, the
// plan file's `unmet`, the metrics and checkVariant all derive from it, so
// none of them can say less than another.
//
// Running time: O(rooms · cut-outs + adjacencies).
#pragma once

#include "brief/brief.h"
#include "brief/requirement_kind.h"
#include "dual/rectangular_dual.h"

#include <vector>

namespace abut {

// Where a measured value meets its limit. Lengths in the brief's units.
struct Thresholds {
    double anyWall = minContactLength; // units: the shortest shared wall that realises a 'wall' adjacency
    double line = 1e-7;  // × the footprint's longer side: sides this close are one line
    double place = 1e-6; // × the footprint's longer side: a fixed room this close to its place is in place
    double slack = 1e-9; // relative: a value this close to its limit meets it (round-off)
};

// Per requirement, one rule. `scale`: the footprint's longer side.
bool areaMeets(const Room& room, double area);
bool widthMeets(const Room& room, const Rect& r, const Thresholds& t = {});
bool aspectMeets(const Room& room, const Rect& r, const Thresholds& t = {});
// The shared wall an adjacency needs: doorWidth for a door, anyWall for a wall.
double wallNeeded(const Brief& brief, const Adjacency& a, const Thresholds& t = {});
bool wallMeets(double length, double need, const Thresholds& t = {});
double lineTolerance(const Footprint& fp, const Thresholds& t = {});

// One requirement a plan does not meet.
struct Miss {
    RequirementKind kind = RequirementKind::Area;
    int room = -1;      // brief room index (adjacencies: the first room)
    int other = -1;     // adjacencies: the second room
    int adjacency = -1; // adjacencies: brief adjacency index
    bool must = true;   // adjacencies: a 'must' one (a 'should' miss keeps a plan usable)
    double target = 0, achieved = 0; // area, width, aspect, wall length; facades: 0; fixed: 0 and the distance
    FacadeWish sides;   // facades: the sides wished for and not reached (anySide: no outside wall at all)
};

// Counts of what keeps a plan from being usable, from a measure.
struct RequirementMisses {
    int area = 0;      // rooms outside their band
    int minWidth = 0;  // rooms narrower than their minimum width
    int maxAspect = 0; // rooms more elongated than allowed
    int must = 0;      // 'must' adjacencies without their wall (doors: door-wide)
    int should = 0;    // 'should' adjacencies without their wall
    int facade = 0;    // rooms missing a facade side they wish for
    int fixed = 0;     // rooms (and cut-outs) not exactly where they are fixed
    double worstAreaError = 0; // max |achieved − target| / target over the rooms (not cut-outs)
    bool usable() const { return area == 0 && minWidth == 0 && maxAspect == 0 && must == 0 && facade == 0 && fixed == 0; }
    int count() const { return area + minWidth + maxAspect + must + facade + fixed; }
};

struct RequirementReport {
    std::vector<Miss> misses;  // rooms in brief order (area, width, aspect, fixed, facade), then adjacencies
    RequirementMisses counts;
    double meanAreaError = 0;  // over the rooms (not cut-outs)
};

// `rooms`: one rectangle per room of `brief` (cut-outs of plannedBrief
// included, as rooms held in place), brief order.
RequirementReport measureRequirements(const Brief& brief, const Footprint& footprint, const std::vector<Rect>& rooms,
                                      const Thresholds& thresholds = {});
// The counts alone.
RequirementMisses requirementMisses(const Brief& brief, const Footprint& footprint, const std::vector<Rect>& rooms,
                                    const Thresholds& thresholds = {});

// Whether `r` reaches side `s` of [0,width]×[0,depth].
bool reachesSide(const Rect& r, Side s, double width, double depth, double tolerance);

// Whether room `i` has an exterior wall facing side `s`: on that side of the
// bounding rectangle, or on a cut-out (a room of plannedBrief with `cutout`)
// that lies on that side of it. `rooms`: one rectangle per brief room. O(rooms).
bool facesOutside(const Brief& brief, const Footprint& footprint, const std::vector<Rect>& rooms, int i, Side s,
                  double tolerance);
// Whether the room's rectangle is where it is fixed (true when not fixed).
bool inPlace(const Room& room, const Rect& r, double tolerance);
Rect toRect(const Placement& p);

} // namespace abut
