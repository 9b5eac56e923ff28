// SPDX-License-Identifier: MIT
// What a plan variant does not meet, one item per requirement, in the
// planner's words with amounts: a room off its area band, narrower than its
// minimum width, beyond its aspect limit, away from a facade it wishes for;
// a 'must' adjacency without its wall (a door: without a door-wide wall). The
// plan file (`unmet`), `abut-cli plan` and the PDF sheet all print this list,
// so none of them can say less than the plan shows. O(rooms + adjacencies).
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <string>
#include <vector>

namespace abut {

struct UnmetItem {
    std::string requirement; // "area", "minWidth", "maxAspect", "facade", "door" (a 'must' door), "adjacency" (a 'must' wall), "fixed" (not where it is fixed)
    std::string field;       // the brief field it concerns, as a JSON Pointer (e.g. /rooms/3/area)
    std::vector<int> rooms;  // brief room indices
    int adjacency = -1;      // brief adjacency index ("adjacency")
    double wanted = 0, got = 0; // area, width, aspect or wall length; 0 for facades
    std::string text;        // one line, e.g. "Office 3: 2.4 m wide, minimum 2.7 m"
    std::vector<std::string> heldBy; // what the plan shows holds it there (facades: who takes the side)
};

std::vector<UnmetItem> unmetRequirements(const Brief& brief, const Footprint& footprint, const PlanVariant& v);

} // namespace abut
