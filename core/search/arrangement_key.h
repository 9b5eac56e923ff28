// SPDX-License-Identifier: MIT
// A name for a plan's arrangement that survives re-computation and
// re-sizing: FNV-1a (64 bit, hex) over the sorted list of room pairs that
// share a wall and how (which room is west, or south, of the other). Same
// arrangement of rooms ⇒ same key, whatever the sizes; spare spaces do not
// count. The plan search's pool, the plan's variants and the planner's
// pinned and hidden variants (plan/variant_key.h) all use it. O(rooms²).
#pragma once

#include "brief/brief.h"
#include "dual/rectangular_dual.h"

#include <string>
#include <vector>

namespace abut {

// `rooms`: one rectangle per room of `brief`, brief order.
std::string arrangementKey(const Brief& brief, const std::vector<Rect>& rooms);

} // namespace abut
