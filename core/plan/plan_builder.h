// SPDX-License-Identifier: MIT
// Brief → plan. Two routes, then one ranking:
// - the plan search (search/plan_search.h): whole plans arranged and sized
//   together, each turned back into an extended graph, labeling and dual;
// - the graph-first route (plan/graph_first.h): extended graph (augment/),
//   regular edge labelings (label/), rectangular dual (dual/), fitted into
//   the footprint and sized (size/). It comes first when the brief names
//   most contacts, else it is the fallback when the search finds no plan
//   that meets the whole brief.
// Then variants are ranked (variantScore), one kept per arrangement, and the
// best gets its relaxations (plan/relaxations.h).
//
// Fitting (graph-first): every room asks for a natural side of t·√(target area) in both
// directions (never below its minWidth), door adjacencies for doorWidth of
// shared wall, other contacts for `anyWall`. The longest-path layout of
// these minimum extents is monotone in t, so t is found by bisection as the
// largest that fits the footprint, and the layout is then stretched to the
// footprint (stretching keeps every minimum). Rooms only roughly approach
// their target areas here; core/size does the sizing.
//
// Running time: bounded by PlanOptions::timeLimit when one is set (the whole
// run: the preparation, the routes, and what must give, which gets a tenth of
// the limit kept back; past it, only a sizing already started is finished);
// otherwise by the search's move budget (200,000 + 60,000 moves per room
// and chain, O(V + E) each), the graph-first budgets (layoutBudget,
// flipBudget sizings) and the relaxation budget (1 s).
#pragma once

#include "plan/plan.h"

#include <functional>
#include <string>

namespace abut {

// Watching and steering a long computation (the editor runs it on a worker
// thread). Both are called on the computing thread.
struct PlanMonitor {
    // Share done (0..1) and the step under way; return false to stop: the
    // plan then has status Cancelled and keeps the variants found so far.
    std::function<bool(double done, const std::string& step)> progress;
    // Each variant once it is sized (provisional; the final plan re-ranks).
    std::function<void(const PlanVariant& variant)> found;
};

Plan buildPlan(const Brief& brief, const PlanOptions& options = {}, const PlanMonitor* monitor = nullptr);

// The same without what must give (plan/relaxations.h, which re-plans with
// it): the routes (plan/plan_route.h), ranking and one variant per arrangement.
Plan planVariants(const Brief& brief, const PlanOptions& options = {}, const PlanMonitor* monitor = nullptr);

// The sizing options every plan of the brief is sized with (area bands free).
SizingOptions planSizingOptions(const Brief& brief, const PlanOptions& options = {});

// Best first: sized before fitted, then by score (variantScore).
void rankVariants(const Brief& brief, const Footprint& footprint, std::vector<PlanVariant>& variants);

// The augmentation's diagnostics speak of its own graph; a variant may come
// from the search and give up something else, or nothing. Reworded so that
// they say what `v` gives up: the reason stays (four rooms that must all
// touch, crossing lines), the adjacency named is the one `v` drops, and
// facade notes are the variant's own. (The plan's notes and the editor's
// live check beside the plan on show both pass through here.)
void reconcileDiagnostics(const Brief& brief, const PlanVariant& v, std::vector<Diagnostic>& diagnostics);

// One variant from a given extended graph and labeling. Its dropped
// adjacencies are those `x` does not join, plus doors left too short.
PlanVariant layoutVariant(const Brief& brief, const ExtendedGraph& x, const RegularEdgeLabeling& rel,
                          const PlanOptions& options);

// `v` with the rectangles of a sizing result of its layout, its metrics,
// dropped adjacencies, unmet requirements and score recomputed.
PlanVariant applySizing(const Brief& brief, const Footprint& footprint, const PlanVariant& v,
                        const SizingResult& sized, const Thresholds& thresholds = {});

// The rectangles of a variant per vertex of its extended graph (rooms and
// spare spaces in vertex order; poles empty), as the sizer indexes them.
std::vector<Rect> vertexRects(const PlanVariant& v);

// Independent-of-construction check of a variant against its brief: the
// rectangles tile the footprint, every adjacency not listed as dropped is a
// shared wall by the measure's rule (doors at least doorWidth). O(V² + E).
StageCheck checkVariant(const Brief& brief, const Footprint& footprint, const PlanVariant& v,
                        const Thresholds& thresholds = {});

} // namespace abut
