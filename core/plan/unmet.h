// SPDX-License-Identifier: MIT
// What a plan variant does not meet, one item per requirement, in the
// planner's words with amounts: a room off its area band, narrower than its
// minimum width, beyond its aspect limit, away from a facade it wishes for or
// from where it is fixed; a 'must' adjacency without its wall (a door:
// without a door-wide wall). The items are the misses of the one measure
// (search/requirements.h), so the plan file (`unmet`), `abut-cli plan`, the
// PDF sheet and the editor cannot say less than the plan shows.
// O(rooms · cut-outs + adjacencies).
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <string>
#include <vector>

namespace abut {

struct UnmetItem {
    RequirementKind kind = RequirementKind::Area;
    std::string field;      // the brief field it concerns, as a JSON Pointer (e.g. /rooms/3/area)
    std::vector<int> rooms; // brief room indices
    int adjacency = -1;     // brief adjacency index (Door, Adjacency)
    double target = 0, achieved = 0; // area, width, aspect or wall length; 0 for facades
    std::string text;       // one line, e.g. "Office 3: 2.4 m wide, minimum 2.7 m"
    std::vector<std::string> heldBy; // what the plan shows holds it there (facades: who takes the side)
    // Names this requirement whatever its amounts: the field and the kind.
    std::string key() const { return field + "#" + toString(kind); }
};

std::vector<UnmetItem> unmetRequirements(const Brief& brief, const Footprint& footprint, const PlanVariant& v,
                                         const Thresholds& thresholds = {});

} // namespace abut
