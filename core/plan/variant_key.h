// SPDX-License-Identifier: MIT
// A name for a variant's arrangement that survives re-computation and
// re-sizing, so that the planner's pinned and hidden variants are found
// again: the arrangement key of its rooms (search/arrangement_key.h). O(rooms²).
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <string>

namespace abut {

std::string variantKey(const Brief& brief, const PlanVariant& v);

} // namespace abut
