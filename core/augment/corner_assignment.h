// SPDX-License-Identifier: MIT
// Splitting the outer cycle of the rooms' graph into the four facade sides.
//
// The rooms on the outer cycle touch the building's outline; the four corners
// cut the cycle into the north, east, south and west sides (in that order, the
// cycle being traced clockwise). Two rooms joined by a chord of the cycle must
// not lie on one side: the side's pole would close a separating triangle with
// them (the corner-implying paths of Koźmiński & Kinnen, Networks 15, 1985).
// Facade wishes add: a room wishing side X lies on side X.
//
// Precondition: `cycle` is a simple face cycle of `g` traced with the outer
// region on its left, length >= 3. Running time: O(k² + chords·k) set-up, then
// O(1) per listed assignment.
#pragma once

#include "brief/brief.h"
#include "graph/plane_graph.h"

#include <array>
#include <vector>

namespace abut {

// Positions in the outer cycle (unrolled): nw <= ne <= se <= sw <= nw + k.
// North is [nw, ne], east [ne, se], south [se, sw], west [sw, nw + k].
struct CornerAssignment {
    std::array<int, 4> corner{}; // NW, NE, SE, SW
    bool operator==(const CornerAssignment&) const = default;
};

// The rooms of each side, in cycle order, for `cycle` and `a`.
std::array<std::vector<int>, 4> sidesOf(const std::vector<int>& cycle, const CornerAssignment& a);

struct CornerSearch {
    std::vector<CornerAssignment> assignments; // valid ones, up to the limit
    bool truncated = false;
};

// Every assignment that meets the chord rule and the wishes (wish[v] for the
// vertices of g; vertices without a brief room get an empty wish).
CornerSearch cornerAssignments(const PlaneGraph& g, const std::vector<int>& cycle,
                               const std::vector<FacadeWish>& wish, int limit);

} // namespace abut
