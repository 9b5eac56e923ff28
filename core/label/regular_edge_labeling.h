// SPDX-License-Identifier: MIT
// Regular edge labeling (transversal structure) of an extended graph.
//
// Every inner edge gets a colour and a direction: red edges point from the
// room below to the room above (south to north), blue edges from the room on
// the west to the room on the east. Around each inner vertex the edges come,
// counter-clockwise, in four non-empty blocks: outgoing red (north), incoming
// blue (west), incoming red (south), outgoing blue (east). All inner edges at
// N are incoming red, at S outgoing red, at W outgoing blue, at E incoming blue.
// (Kant & He, Theor. Comput. Sci. 172, 1997; Fusy, Discrete Math. 309, 2009.)
//
// Method: a canonical ordering swept from the south-west corner (Kant & He
// 1997): rooms are added one by one onto a contour that runs from W to S;
// each new vertex lies against a run of contour vertices, the upper part of
// the run to its west (blue in), the lower part below it (red in). A vertex is
// eligible when its contour neighbours are consecutive, the ones it covers
// have no other neighbour left, and the contour edges of the run read "red
// upward" then "blue eastward" (the staircase shape of what has been placed).
//
// Precondition: checkExtendedGraph(x).ok. Running time: O(Σ deg(v)²), linear
// for bounded degree.
#pragma once

#include "check.h"
#include "augment/extended_graph.h"

#include <cstdint>
#include <string>
#include <vector>

namespace abut {

// The label of an edge as seen from one end.
enum class EdgeLabel : std::uint8_t { OutRed, InRed, OutBlue, InBlue, Outer };

struct RegularEdgeLabeling {
    // at[v][i]: label of the edge from v to its i-th neighbour in rotation order.
    std::vector<std::vector<EdgeLabel>> at;
    EdgeLabel label(const PlaneGraph& g, int from, int to) const { return at[from][g.position(from, to)]; }
};

enum class LabelingStatus { Ok, Stuck };

struct LabelingResult {
    LabelingStatus status = LabelingStatus::Ok;
    std::string message;
    RegularEdgeLabeling labeling;
};

LabelingResult computeRegularEdgeLabeling(const ExtendedGraph& x);

// O(m) checker of the local rules at every inner vertex and at the poles, and
// of the agreement of both ends of every edge.
StageCheck checkRegularEdgeLabeling(const ExtendedGraph& x, const RegularEdgeLabeling& rel);

} // namespace abut
