// SPDX-License-Identifier: MIT
#include "plan/variant_key.h"

#include "search/arrangement_key.h"

namespace abut {

std::string variantKey(const Brief& brief, const PlanVariant& v) { return arrangementKey(brief, v.rooms); }

} // namespace abut
