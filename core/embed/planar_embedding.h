// SPDX-License-Identifier: MIT
// Planarity test and combinatorial embedding of the rooms' adjacency graph.
//
// Method: Boyer & Myrvold, "On the cutting edge: simplified O(n) planarity by
// edge addition", J. Graph Algorithms Appl. 8(3), 2004, as implemented by
// Boost.Graph's boyer_myrvold_planarity_test. When every room has a sketch
// position and the straight-line sketch has no crossing, the sketch itself is
// kept as the embedding: it is the planner's intent.
//
// Precondition: edges are simple (no loops, no duplicates), endpoints < n.
// Running time: O(n + m) for the test; the crossing check of the sketch is
// O(m²) and only done for m <= sketchCrossingLimit.
#pragma once

#include "brief/brief.h"
#include "graph/plane_graph.h"

#include <functional>
#include <optional>
#include <string>
#include <utility>
#include <vector>

namespace abut {

enum class EmbeddingStatus { Planar, NonPlanar };

struct EmbeddingResult {
    EmbeddingStatus status = EmbeddingStatus::Planar;
    PlaneGraph graph;     // the embedding, when Planar
    bool fromSketch = false;
    std::vector<int> witnessEdges; // NonPlanar: indices into the input edges of a Kuratowski subgraph
};

constexpr int sketchCrossingLimit = 4000;

EmbeddingResult embedPlanar(int n, const std::vector<std::pair<int, int>>& edges,
                            const std::vector<std::optional<SketchPoint>>& sketch = {});

// Embeds a graph that may not be planar by dropping edges: each time the
// test finds a Kuratowski subgraph, the cheapest of its edges (by `cost`,
// the first of equal ones in witness order) is dropped and the test runs
// again. `witnesses` lists each Kuratowski subgraph found and `dropped` the
// edge given up for it (indices into `edges`), in order; `embedding` is that
// of the edges left. O(k·(n + m)) for k drops.
// Once more than `witnessedDrops` drops in all are certain (Euler's formula:
// more than 3n − 6 edges left), the graph is far from planar: the edges left
// are then kept dearest first while the graph stays planar (at most 3n − 6,
// by Euler's formula), and those that do not fit are dropped with an empty
// witness — each breaks the planarity of the edges kept (a maximal planar
// subgraph). O(m·n) for that part.
inline constexpr std::size_t witnessedDrops = 64;
struct PlanarizedEmbedding {
    EmbeddingResult embedding;             // Planar
    std::vector<std::vector<int>> witnesses; // per drop: the witness's edges
    std::vector<int> dropped;                // per drop: the edge given up
};
// `keepGoing` (empty: always) is asked between tests; once it says no, the
// edges not yet looked at are dropped with an empty witness.
PlanarizedEmbedding embedDroppingCheapest(int n, const std::vector<std::pair<int, int>>& edges,
                                          const std::vector<double>& cost,
                                          const std::vector<std::optional<SketchPoint>>& sketch = {},
                                          const std::function<bool()>& keepGoing = {});

// Pairs of input edges whose straight segments cross in the sketch (edges
// sharing an endpoint never count). O(m²).
std::vector<std::pair<int, int>> sketchCrossings(const std::vector<std::pair<int, int>>& edges,
                                                 const std::vector<std::optional<SketchPoint>>& sketch);

} // namespace abut
