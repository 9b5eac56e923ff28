// SPDX-License-Identifier: MIT
// Separating triangles of a plane graph, and the cheapest set of edges whose
// removal breaks them all.
//
// A 3-cycle that is not an inner face encloses something on both sides; in a
// rectangular plan one of its rooms would have to wrap around the others, so
// no rectangular dual exists while it is there (Koźmiński & Kinnen, Networks
// 15, 1985; Bhasker & Sahni, Networks 17, 1987). Breaking them by removing the
// fewest / cheapest edges is a weighted covering problem (Accornero, Ancona &
// Varini, IJFCS 2000): each triangle must lose one of its three edges.
//
// separatingTriangles: O(sum over edges of the smaller end degree).
// cheapestCover: exact branch and bound for groups of up to exactCoverLimit
// triangles that share edges, greedy (cost per newly covered triangle) above.
#pragma once

#include "graph/plane_graph.h"

#include <array>
#include <functional>
#include <utility>
#include <vector>

namespace abut {

using Triangle = std::array<int, 3>; // sorted vertex ids

// Triangles of `g` that are not faces; `outerFace` (a face cycle) is not an
// inner face, so it counts as separating when it is a triangle with anything
// inside it.
std::vector<Triangle> separatingTriangles(const PlaneGraph& g, const std::vector<int>& outerFace);

constexpr int exactCoverLimit = 14;

struct Cover {
    std::vector<std::pair<int, int>> edges; // edges to remove
    double cost = 0.0;
    bool exact = true; // false when a group was too large for branch and bound
};

Cover cheapestCover(const std::vector<Triangle>& triangles,
                    const std::function<double(int, int)>& edgeCost);

} // namespace abut
