// SPDX-License-Identifier: MIT
// The graph-first route, the pipeline before the plan search: the
// augmentation's extended graphs (corner assignments, triangulations, the
// pole route), a few regular edge labelings of each, laid out and fitted;
// the best sized; the best of those improved by simulated annealing over
// labeling flips (`anneal`). buildPlan runs it first for briefs that name
// most contacts, and as the fallback when the plan search finds nothing
// usable. Budget: PlanOptions (cornerTrials, labelingsPerGraph, layoutBudget,
// sizedCandidates, flipBudget).
#pragma once

#include "augment/augment.h"
#include "brief/brief.h"
#include "plan/plan.h"
#include "plan/plan_builder.h"

#include <functional>

namespace abut {

// Adds its variants to plan.variants. `keepGoing(done, step)` reports
// progress and returns false to stop. Returns false on an internal error
// (plan.status and plan.summary set).
bool graphFirstVariants(const Brief& brief, const AugmentResult& aug, const PlanOptions& options, Plan& plan,
                        const std::function<bool(double, const char*)>& keepGoing, bool anneal,
                        const PlanMonitor* monitor);

} // namespace abut
