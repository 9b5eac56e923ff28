// SPDX-License-Identifier: MIT
// Tidy sketch: a planar straight-line drawing of the rooms' adjacency graph,
// for the editor's "Tidy up" action.
//
// Method: the graph is made connected, biconnected and maximal planar
// (Boost.Graph's make_connected, make_biconnected_planar,
// make_maximal_planar), ordered canonically (de Fraysseix, Pach & Pollack,
// "How to draw a planar graph on a grid", Combinatorica 10, 1990) and drawn
// on the (2n−4)×(n−2) grid by Chrobak & Payne, "A linear-time algorithm for
// drawing a planar graph on a grid", Inf. Process. Lett. 54, 1995 (Boost's
// chrobak_payne_straight_line_drawing). Grid drawings squeeze rooms against
// the base line, so the interior is then relaxed with Tutte's barycentric
// method (W. T. Tutte, "How to draw a graph", Proc. LMS 13, 1963): with the
// outer triangle fixed, every other room sits at the mean of its neighbours
// in the maximal planar graph, which is 3-connected, so the drawing stays
// planar with convex faces. The result is checked for crossings; if rounding
// ever made one, the grid drawing is returned instead.
//
// A brief that is not planar is drawn without the adjacencies that would
// cross (musts are kept first, in brief order); they are listed.
//
// Running time: O(n + m) for the drawing, one sparse solve for the
// relaxation, O(m²) for the final crossing check; O(m·(n + m)) when the
// brief is not planar (adjacencies are added one by one).
#pragma once

#include "brief/brief.h"

#include <vector>

namespace abut {

enum class TidyStatus { Drawn, DrawnWithout, Empty };

struct TidyResult {
    TidyStatus status = TidyStatus::Drawn;
    std::vector<SketchPoint> positions; // one per room, brief order
    std::vector<int> leftOut;           // adjacencies not drawable without crossings
};

// `spacing`: sketch units between neighbouring rooms on average.
TidyResult tidySketch(const Brief& brief, double spacing = 90.0);

} // namespace abut
