// SPDX-License-Identifier: MIT
// From a brief to an extended graph: the whole augmentation stage.
//
//   embed (planarity; drop the cheapest adjacency of a Kuratowski witness
//   until planar) → join groups → remove cut vertices → choose the outer
//   cycle → break separating triangles (cheapest cover) → assign the four
//   corners (facade wishes) → add the poles → triangulate inner faces.
//
// Every change to the brief's graph is reported as a diagnostic naming the
// rooms and adjacencies involved. Dropping prefers `should` over `must` and
// walls over doors; added contacts are extra walls and cost nothing to the
// brief. The result is verified by checkExtendedGraph before it is returned.
//
// Running time: O(n + m) for the planarity test, O(n·(n + m)) worst case for
// the rest (briefs have a few hundred rooms at most).
#pragma once

#include "augment/corner_assignment.h"
#include "augment/extended_graph.h"
#include "brief/brief.h"
#include "diagnostics.h"

#include <functional>
#include <string>
#include <vector>

namespace abut {

struct AugmentOptions {
    int cornerLimit = 500; // corner assignments listed per outer cycle
    int cornerChoice = 0;  // which of the ranked assignments to build (0 = best)
    int poleRouteGraphs = 1; // graphs kept from the pole route (alternative triangulations)
    // Asked while a graph far from planar is cut down to a planar one (the
    // one step that grows with the square of a pathological brief, such as
    // 200 rooms that must all touch); false: the adjacencies not yet looked
    // at are dropped (they are the cheapest). Empty: always go on.
    std::function<bool()> keepGoing;
};

enum class AugmentStatus {
    Feasible,    // every must adjacency and facade wish is kept
    Compromised, // a plan exists only by dropping a must adjacency or a facade wish
    Empty,       // no rooms
    Internal     // the result failed its own checker (a bug; never returned silently)
};
const char* toString(AugmentStatus s);

// The rooms' graph just before the poles go in: planar, 2-connected, free of
// separating triangles, with its outer cycle and the valid corner assignments.
struct OuterFrame {
    PlaneGraph graph; // vertices = rooms
    std::vector<int> cycle;
    std::vector<CornerAssignment> corners; // ranked, best first
    bool cornersTruncated = false;
};

struct AugmentResult {
    AugmentStatus status = AugmentStatus::Feasible;
    std::string summary; // one line for the planner
    ExtendedGraph extended;
    OuterFrame frame;
    std::vector<int> dropped; // brief adjacency indices the plan does not realise
    std::vector<int> unmetFacade; // rooms whose facade wish is not met
    std::vector<Diagnostic> diagnostics;
    bool embeddingFromSketch = false;
    // Extended graphs of the other route (see buildExtendedGraph), each a
    // valid alternative: planned beside the frame's corner assignments.
    std::vector<ExtendedGraph> alternatives;
};

// Two routes (augment/route.h): the frame route chooses the outline as a
// cycle of rooms; the pole route puts the four sides in first and finds plans
// where a room must appear twice on the outline. The route that keeps more of
// the brief gives `extended` and the diagnostics; the other one's graphs, when
// valid, are listed in `alternatives`.
AugmentResult buildExtendedGraph(const Brief& brief, const AugmentOptions& options = {});

// Poles and triangulation for one corner assignment of a prepared frame.
// `report` (optional) receives the added contacts and spare spaces; a
// non-zero `seed` draws the added contacts at random among the safe ones
// (an alternative augmentation).
struct TriangulationReport;
ExtendedGraph extendFrame(const OuterFrame& frame, const std::vector<std::string>& roomIds,
                          const CornerAssignment& corners, TriangulationReport* report = nullptr,
                          unsigned seed = 0);

} // namespace abut
