// SPDX-License-Identifier: MIT
// What a plan must meet to be usable, measured on its room rectangles: every
// room within its area band, at least its minimum width, at most its aspect
// limit; every 'must' adjacency a shared wall (a door one at least doorWidth
// long, any other at least `anyWall`); every facade wish met. O(rooms +
// adjacencies).
#pragma once

#include "brief/brief.h"
#include "dual/rectangular_dual.h"

#include <vector>

namespace abut {

struct RequirementMisses {
    int area = 0;      // rooms outside their band
    int minWidth = 0;  // rooms narrower than their minimum width
    int maxAspect = 0; // rooms more elongated than allowed
    int must = 0;      // 'must' adjacencies without their wall (doors: door-wide)
    int should = 0;    // 'should' adjacencies without their wall
    int facade = 0;    // rooms missing a facade side they wish for
    int fixed = 0;     // rooms (and cut-outs) not exactly where they are fixed
    double worstAreaError = 0; // max |achieved − target| / target
    bool usable() const { return area == 0 && minWidth == 0 && maxAspect == 0 && must == 0 && facade == 0 && fixed == 0; }
    int count() const { return area + minWidth + maxAspect + must + facade + fixed; }
};

// Length of the wall two rectangles share (0 when they only meet at a corner
// or not at all); sides closer than `tolerance` count as one line.
double sharedWallLength(const Rect& a, const Rect& b, double tolerance = 1e-9);

// Whether `r` reaches side `s` of [0,width]×[0,depth].
bool reachesSide(const Rect& r, Side s, double width, double depth, double tolerance = 1e-9);

// Whether room `i` has an exterior wall facing side `s`: on that side of the
// bounding rectangle, or on a cut-out (a room of plannedBrief with `cutout`)
// that lies on that side of it. `rooms`: one rectangle per brief room.
bool facesOutside(const Brief& brief, const Footprint& footprint, const std::vector<Rect>& rooms, int i, Side s,
                  double tolerance);
// Whether the room's rectangle is where it is fixed (true when not fixed).
bool inPlace(const Room& room, const Rect& r, double tolerance);
Rect toRect(const Placement& p);

// `rooms`: one rectangle per brief room, brief order.
RequirementMisses requirementMisses(const Brief& brief, const Footprint& footprint, const std::vector<Rect>& rooms,
                                    double anyWall);

} // namespace abut
