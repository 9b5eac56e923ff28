// SPDX-License-Identifier: MIT
// A name for a variant's arrangement that survives re-computation and
// re-sizing, so that the planner's pinned and hidden variants are found again:
// FNV-1a (64 bit, hex) over the sorted list of room pairs that share a wall
// and how (which room is west, or south, of the other). Same arrangement of
// rooms ⇒ same key, whatever the sizes; spare spaces do not count.
// O(rooms²).
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <string>

namespace abut {

std::string variantKey(const Brief& brief, const PlanVariant& v);

} // namespace abut
