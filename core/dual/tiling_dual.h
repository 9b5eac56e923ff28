// SPDX-License-Identifier: MIT
// The extended graph and regular edge labeling of a rectangle tiling: the
// inverse of the rectangular dual. Two tiles that share a wall of positive
// length are joined; a tile on the footprint's side X is joined to pole X;
// rotations follow the geometry; a west tile points blue to its east
// neighbour, a lower tile red to the one above (Kant & He, Theor. Comput.
// Sci. 172, 1997: the labeling read off a rectangular dual is regular).
//
// A generic tiling (no point where four tiles meet) gives an irreducible
// triangulation of the 4-cycle. Where four tiles meet, the half of one wall
// line above the point is moved sideways by `nudge`, so that two diagonal
// tiles meet along a short wall; `preferContact` chooses which two.
//
// Precondition: `rects` tile [0,width]×[0,depth] (tiles: rooms first, then
// spare spaces), up to round-off below `tolerance`. Running time O(n log n)
// plus O(n) per point where four tiles meet.
#pragma once

#include "augment/extended_graph.h"
#include "dual/rectangular_dual.h"
#include "label/regular_edge_labeling.h"

#include <functional>
#include <string>
#include <vector>

namespace abut {

struct TilingDual {
    bool ok = false;
    std::string problem;          // why not, when !ok
    ExtendedGraph extended;       // rooms 0..roomCount-1, poles, then spare spaces
    RegularEdgeLabeling labeling;
    std::vector<Rect> rects;      // per vertex of `extended` (poles empty), snapped and nudged
};

struct TilingDualOptions {
    double tolerance = 1e-9; // relative to the footprint's longer side: coordinates closer are one
    double nudge = 0.06;     // units: how far a wall moves where four tiles meet
    // Whether tiles a and b (indices into the input) should meet where four
    // tiles meet; the other diagonal pair meets otherwise.
    std::function<bool(int a, int b)> preferContact;
};

TilingDual dualOfTiling(const std::vector<Rect>& tiles, int roomCount, double width, double depth,
                        const std::vector<std::string>& roomIds, const TilingDualOptions& options = {});

} // namespace abut
