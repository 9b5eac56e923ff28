// SPDX-License-Identifier: MIT
// The kinds of requirement a plan can miss, one spelling for every stage:
// the sizer's shortfalls, the search's cost, the measure of a plan
// (search/requirements.h), the plan file's `unmet` and the editor's notes.
#pragma once

#include <cstdint>

namespace abut {

enum class RequirementKind : std::uint8_t {
    Area,      // a room outside its area band
    MinWidth,  // a room narrower than its minimum width
    MaxAspect, // a room more elongated than its aspect limit
    Door,      // a door adjacency without a door-wide wall
    Adjacency, // a wall adjacency without a wall
    Facade,    // a room away from a facade side it wishes for
    Fixed,     // a room (or cut-out) not exactly where it is fixed
    Grid,      // a wall off the planning grid (the sizer's own, not the brief's)
};

// As the plan file writes it: "area", "minWidth", "maxAspect", "door",
// "adjacency", "facade", "fixed", "grid".
const char* toString(RequirementKind k);

} // namespace abut
