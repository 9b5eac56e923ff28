// SPDX-License-Identifier: MIT
// Triangulating the inner faces of a plane graph without creating a separating
// triangle, in the spirit of Biedl, Kant & Kaufmann (Algorithmica 19, 1997).
//
// A chord u–w of a face is safe when u and w are not yet adjacent and every
// common neighbour of theirs closes a triangle that becomes a face (the apex
// of an ear). Ears are tried first, then any safe chord. A face with no safe
// chord gets spare spaces (dummy vertices): its cycle is cut into arcs that
// hold no chord, one spare space per arc, joined in a ring around a centre
// spare when there are four or more; every triangle this creates is a face.
//
// Precondition: every face to triangulate is a simple cycle traced with the
// face on its left. Running time: O(k² · d) per face of length k (d the
// largest degree on it); linear in the number of faces otherwise.
#pragma once

#include "graph/plane_graph.h"

#include <functional>
#include <random>
#include <utility>
#include <vector>

namespace abut {

struct TriangulationReport {
    std::vector<std::pair<int, int>> addedEdges; // between existing vertices
    std::vector<int> spares;                      // new dummy vertices
};

// Triangulates the face `face`, appending to `report`. With `rng`, the safe
// chord is drawn at random among the safe ones (ears still first), which
// gives alternative augmentations; without, the first one is taken.
// With `allowed`, a chord is drawn only between pairs it accepts (the poles
// of a plan must not be joined across it).
void triangulateFace(PlaneGraph& g, const std::vector<int>& face, TriangulationReport& report,
                     std::mt19937* rng = nullptr, const std::function<bool(int, int)>& allowed = {});

// Triangulates every face except the one traced from dart outerFrom → outerTo.
TriangulationReport triangulateInnerFaces(PlaneGraph& g, int outerFrom, int outerTo,
                                          std::mt19937* rng = nullptr,
                                          const std::function<bool(int, int)>& allowed = {});

} // namespace abut
