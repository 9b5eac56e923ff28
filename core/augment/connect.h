// SPDX-License-Identifier: MIT
// Joining a brief's separate groups of rooms, and removing cut vertices, by
// added contacts (extra walls, harmless to the brief). Both keep the graph
// plane and create no separating triangle: a join edge links two groups, so
// it lies on no triangle; an edge a–b added in the angle a–c–b at a cut vertex
// c has c as the only common neighbour, and a–c–b becomes a face.
//
// Precondition: `g` is a plane graph. Running time: joinComponents O(n + m)
// (O(n·k) with sketch positions for k groups); makeBiconnected one face trace,
// O(n + m), then per added edge O(length of its face + degree of its ends).
#pragma once

#include "brief/brief.h"
#include "graph/plane_graph.h"

#include <functional>
#include <optional>
#include <utility>
#include <vector>

namespace abut {

// Connects the components; returns the edges added. With sketch positions the
// nearest pair of rooms is joined, otherwise a room on the largest face of the
// first component.
std::vector<std::pair<int, int>> joinComponents(PlaneGraph& g,
                                                const std::vector<std::optional<SketchPoint>>& sketch);

// Adds edges until every face is a simple cycle (the graph is 2-connected).
// Precondition: connected, at least 3 vertices. With `allowed`, only pairs
// it accepts are joined; a cut vertex no allowed edge can close stays.
using EdgeFilter = std::function<bool(int, int)>;
std::vector<std::pair<int, int>> makeBiconnected(PlaneGraph& g, const EdgeFilter& allowed = {});

// Component number of every vertex, and their count.
std::pair<std::vector<int>, int> components(const PlaneGraph& g);

} // namespace abut
