// SPDX-License-Identifier: MIT
// The extended graph: the rooms' adjacency graph grown into an irreducible
// triangulation of the 4-cycle N–E–S–W (all inner faces triangles, no
// separating triangle, no chord N–S or E–W). Exactly these graphs have a
// rectangular dual with the four poles as the outline's sides (Koźmiński &
// Kinnen, Networks 15, 1985; Bhasker & Sahni, Networks 17, 1987).
//
// Vertex numbering: rooms 0..roomCount-1 in brief order, then the poles N, E,
// S, W, then spare spaces.
#pragma once

#include "check.h"
#include "brief/brief.h"
#include "graph/plane_graph.h"

#include <array>
#include <string>
#include <utility>
#include <vector>

namespace abut {

struct ExtendedGraph {
    PlaneGraph graph;
    int roomCount = 0;
    std::vector<std::string> names; // one per vertex: room ids, "N".."W", "spare1"...

    int pole(Side s) const { return roomCount + static_cast<int>(s); }
    bool isRoom(int v) const { return v < roomCount; }
    bool isPole(int v) const { return v >= roomCount && v < roomCount + 4; }
    bool isSpare(int v) const { return v >= roomCount + 4; }
    int spareCount() const { return graph.vertexCount() - roomCount - 4; }
};

// Fills x.names: the room ids, then "N", "E", "S", "W", then "spare1"...;
// a pole or spare name that a room id already uses gets a "~" suffix.
void nameVertices(ExtendedGraph& x, const std::vector<std::string>& roomIds);

// Checker: the outer face is N, E, S, W (clockwise, traced from dart N→E),
// the poles carry no chord, every other face is a triangle, no 3-cycle is
// anything but a face, the graph is simple and its rotation system planar
// (Euler: V − E + F = 2, and E = 3V − 7). O(V + E·d).
StageCheck checkExtendedGraph(const ExtendedGraph& x);

// Also checks against the brief: every adjacency of `brief` is an edge of `x`
// unless its index is in `dropped`.
StageCheck checkExtendedGraph(const ExtendedGraph& x, const Brief& brief,
                              const std::vector<int>& dropped);

} // namespace abut
