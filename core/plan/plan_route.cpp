// SPDX-License-Identifier: MIT
#include "plan/plan_route.h"

#include "dual/rectangular_dual.h"
#include "label/regular_edge_labeling.h"
#include "plan/graph_first.h"
#include "search/plan_search.h"

#include <chrono>

namespace abut {

bool PlanRouteResult::usable() const {
    for (const PlanVariant& v : variants)
        if (v.sized && v.misses.usable()) return true;
    return false;
}

PlanRouteResult PlanRoute::run(const PlanRouteContext& c) const {
    PlanRouteResult r = doRun(c);
    if (r.status == PlanRouteResult::Status::Internal) return r;
    for (const PlanVariant& v : r.variants) {
        StageCheck check = checkRegularEdgeLabeling(v.extended, v.labeling);
        if (check.ok) check = checkVariant(c.brief, c.footprint, v);
        if (!check.ok) {
            r.status = PlanRouteResult::Status::Internal;
            r.problem = std::string("Internal error: a plan of the ") + name() + " failed its check (" + check.problem +
                        "). Please report this brief.";
            r.variants.clear();
            return r;
        }
    }
    return r;
}

namespace {

// A sized plan found by the search, as a variant.
PlanVariant variantOf(const Brief& brief, const Footprint& fp, const SearchPlan& found) {
    PlanVariant v;
    v.extended = found.extended;
    v.labeling = found.labeling;
    v = applySizing(brief, fp, v, found.sized);
    v.oneSided = isOneSided(v.extended, v.labeling);
    return v;
}

// Streams the search's progress and improvements to the route's context.
class ContextVisitor : public SearchVisitor {
public:
    explicit ContextVisitor(const PlanRouteContext& c) : c_(c) {}
    bool onRound(const SearchProgress& p) override {
        if (!c_.keepGoing) return true;
        stopped_ = !c_.keepGoing(p.done, p.usable ? "improving" : "searching");
        return !stopped_;
    }
    void onImproved(const SearchPlan& plan) override {
        if (c_.monitor && c_.monitor->found) c_.monitor->found(variantOf(c_.brief, c_.footprint, plan));
    }
    bool stopped() const { return stopped_; }

private:
    const PlanRouteContext& c_;
    bool stopped_ = false;
};

class SearchRoute : public PlanRoute {
public:
    const char* name() const override { return "plan search"; }

protected:
    PlanRouteResult doRun(const PlanRouteContext& c) const override {
        SearchOptions search;
        search.seed = c.options.seed;
        search.threads = c.options.threads;
        search.timeLimit = c.timeLimit;
        search.moves = c.options.searchMoves;
        search.variantFlips = c.options.variantFlips;
        search.keep = std::max(1, c.options.variants);
        search.anyWall = c.options.anyWall;
        search.spareMinimum = c.options.spareMinimum;
        search.grid = c.options.grid;
        ContextVisitor visitor(c);
        const SearchResult found = searchPlans(c.brief, search, &visitor);
        PlanRouteResult r;
        r.status = visitor.stopped() ? PlanRouteResult::Status::Stopped : PlanRouteResult::Status::Done;
        r.firstUsableSeconds = found.firstUsableSeconds;
        r.moves = found.moves;
        for (const SearchPlan& sp : found.plans) r.variants.push_back(variantOf(c.brief, c.footprint, sp));
        return r;
    }
};

class GraphFirstRoute : public PlanRoute {
public:
    explicit GraphFirstRoute(bool anneal) : anneal_(anneal) {}
    const char* name() const override { return "graph-first route"; }

protected:
    PlanRouteResult doRun(const PlanRouteContext& c) const override {
        const auto started = std::chrono::steady_clock::now();
        PlanRouteResult r;
        Plan plan;
        plan.footprint = c.footprint;
        bool stopped = false;
        auto going = [&](double done, const char* step) {
            if (c.keepGoing && !c.keepGoing(done, step)) stopped = true;
            if (c.timeLimit > 0 &&
                std::chrono::duration<double>(std::chrono::steady_clock::now() - started).count() > c.timeLimit)
                stopped = true;
            return !stopped;
        };
        if (!graphFirstVariants(c.brief, c.aug, c.options, plan, going, anneal_ && c.options.improvedCandidates > 0,
                                c.monitor)) {
            r.status = PlanRouteResult::Status::Internal;
            r.problem = plan.summary;
            return r;
        }
        r.variants = std::move(plan.variants);
        r.status = stopped ? PlanRouteResult::Status::Stopped : PlanRouteResult::Status::Done;
        if (r.usable())
            r.firstUsableSeconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - started).count();
        return r;
    }

private:
    bool anneal_;
};

} // namespace

std::unique_ptr<PlanRoute> makeSearchRoute() { return std::make_unique<SearchRoute>(); }
std::unique_ptr<PlanRoute> makeGraphFirstRoute(bool anneal) { return std::make_unique<GraphFirstRoute>(anneal); }

} // namespace abut
