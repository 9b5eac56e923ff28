// SPDX-License-Identifier: MIT
// A route of planning: from a brief (as planned) to sized variants. Two
// routes share this interface (as the augmentation's two do, augment/route.h):
// the plan search (search/plan_search.h: whole plans arranged and sized
// together) and the graph-first route (plan/graph_first.h: extended graphs,
// labelings, fitted and sized). buildPlan runs them, the relaxations re-plan
// with them, and one contract test (tests/plan/tst_plan_routes.cpp) runs over
// both.
//
// The contract every route keeps, checked by PlanRoute::run after the route
// has run (a variant that breaks it is an internal error, never returned):
//   - every variant is a rectangular dual of a checked extended graph and
//     regular edge labeling whose rooms and spare spaces tile the footprint
//     (checkVariant, checkRegularEdgeLabeling);
//   - its misses, dropped adjacencies, facades missed and score are those of
//     the one measure of its rectangles (search/requirements.h, applySizing);
//   - the same brief, seed, thread count and budget (no time limit) give the
//     same variants.
// Running time: bounded by the context's time limit and the route's budgets.
#pragma once

#include "augment/augment.h"
#include "plan/plan.h"
#include "plan/plan_builder.h"

#include <functional>
#include <memory>
#include <string>
#include <vector>

namespace abut {

struct PlanRouteContext {
    const Brief& brief;       // as planned (plannedBrief: cut-outs as rooms held in place)
    const AugmentResult& aug; // the augmentation of `brief` (graphs for the graph-first route)
    const PlanOptions& options;
    const PlanMonitor* monitor = nullptr; // `found` gets each improvement
    Footprint footprint;
    double timeLimit = 0; // seconds for this route (0: none)
    // The share done of this route (0..1) and the step; false: the caller asks to stop.
    std::function<bool(double done, const char* step)> keepGoing;
};

struct PlanRouteResult {
    enum class Status { Done, Stopped, Internal } status = Status::Done;
    std::string problem;              // Internal: what failed, for the planner to report
    std::vector<PlanVariant> variants; // in the route's order
    double firstUsableSeconds = -1;   // from the route's start (−1: none usable)
    long long moves = 0;              // plan search moves over all chains
    bool usable() const;              // some sized variant meets the whole brief
};

class PlanRoute {
public:
    virtual ~PlanRoute() = default;
    virtual const char* name() const = 0;
    // Runs the route and checks the contract above on what it returns.
    PlanRouteResult run(const PlanRouteContext& c) const;

protected:
    virtual PlanRouteResult doRun(const PlanRouteContext& c) const = 0;
};

std::unique_ptr<PlanRoute> makeSearchRoute();
// `anneal`: improve the best sized variant by labeling flips.
std::unique_ptr<PlanRoute> makeGraphFirstRoute(bool anneal = true);

} // namespace abut
