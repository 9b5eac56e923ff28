// SPDX-License-Identifier: MIT
// What must give: for each requirement a plan variant does not meet, the
// smallest single changes to the brief that would meet it, each verified by
// sizing the same arrangement again with the change made: a room's target
// set to what it can get, a minimum width or aspect limit eased to what the
// room is, the footprint made longer or deeper (the smallest of a few steps
// that works), a facade wish or a 'must' given up. A change counts only if
// the re-sized plan meets the requirement and misses nothing it met before.
// A change one arrangement cannot absorb (targets over the footprint) is
// verified by a short re-plan instead. The requirements of the rooms beside
// a room off its numbers are eased in turn too: those that free it are what
// hold it there (Relaxation::holds, heldBy below).
// Cost: a few sizings of the variant per unmet requirement, a few short
// re-plans for an over-full brief; bounded by `seconds`.
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"
#include "plan/unmet.h"

#include <string>
#include <vector>

namespace abut {

// At most `limit` relaxations, the smallest change first for each unmet
// requirement, requirements in the order unmetRequirements lists them.
// `seconds` (> 0) bounds the work: requirements not reached by then get none.
std::vector<Relaxation> relaxationsFor(const Brief& brief, const Footprint& footprint, const PlanVariant& v,
                                       int limit = 12, double seconds = 0);

// What holds `item` there, in the planner's words: the item's own geometric
// reasons (a facade taken by other rooms) and the requirements whose
// relaxation would meet it, e.g. "Store's minimum width of 1.8 m".
std::vector<std::string> heldBy(const UnmetItem& item, const std::vector<Relaxation>& relaxations);

} // namespace abut
