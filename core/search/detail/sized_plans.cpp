// SPDX-License-Identifier: MIT
#include "search/detail/sized_plans.h"

#include "search/arrangement_key.h"
#include "search/detail/cost.h"
#include "search/score.h"

#include <algorithm>
#include <cmath>

namespace abut::detail {

std::vector<SearchPlan> sizeArrangement(const Brief& brief, const Footprint& fp, const SearchOptions& o,
                                        const std::vector<Rect>& rects, const SearchPlan& arrangement,
                                        const std::function<bool()>& inTime) {
    std::vector<SearchPlan> out;
    const SizingOptions so = sizingOptionsFor(brief, o.anyWall, o.spareMinimum, o.grid);
    SizingProblem problem(brief, arrangement.extended, arrangement.labeling, fp, so);
    problem.setPreferredAreas(preferredAreas(brief, fp, arrangement.extended));
    const SizingResult start = problem.stateOf(rects);
    auto add = [&](SizingResult sized) {
        out.push_back(arrangement);
        out.back().sized = std::move(sized);
    };
    const bool anyFixed = std::any_of(brief.rooms.begin(), brief.rooms.end(), [](const Room& r) { return r.fixed.has_value(); });
    if (problem.meetsMinimums(start) && !anyFixed) { // nothing has to move
        add(start);
        return out;
    }
    add(problem.solve(&start));
    if (inTime && !inTime()) return out;
    bool offBand = false;
    for (std::size_t i = 0; i < brief.rooms.size(); ++i)
        offBand = offBand || std::abs(out.back().sized.rooms[i].deviation) > brief.rooms[i].tolerance();
    if (offBand) {
        SizingOptions banded = so;
        banded.areaBands = true;
        problem.setOptions(banded);
        add(problem.solve(&start));
        problem.setOptions(so);
    }
    if (inTime && !inTime()) return out;
    bool shortfall = false;
    for (const UnmetRequirement& u : start.unmet) shortfall = shortfall || u.kind == RequirementKind::MinWidth || u.kind == RequirementKind::Door;
    if (shortfall) {
        problem.holdMinimumsAt(start);
        add(problem.solve(&start));
    }
    return out;
}

void judge(const Brief& brief, const SearchProblem& p, SearchPlan& plan) {
    std::vector<Rect> blocks;
    for (int v = 0; v < plan.extended.graph.vertexCount(); ++v)
        if (!plan.extended.isPole(v)) blocks.push_back(plan.sized.rects[v]);
    std::vector<Rect> rooms(blocks.begin(), blocks.begin() + p.rooms);
    const RequirementReport report = measureRequirements(brief, p.fp, rooms, p.thresholds);
    plan.misses = report.counts;
    if (static_cast<int>(blocks.size()) == static_cast<int>(p.blocks.size())) {
        plan.cost = evaluate(p, blocks, nullptr).cost;
    } else { // more spare spaces than the search made (a plan from elsewhere): rooms only
        SearchProblem roomsOnly = p;
        roomsOnly.blocks.resize(p.rooms);
        plan.cost = evaluate(roomsOnly, blocks, nullptr).cost;
    }
    double err = 0;
    for (int i = 0; i < p.rooms; ++i)
        err += std::abs(rooms[i].area() - brief.rooms[i].area) / brief.rooms[i].area;
    plan.cost += 0.1 * plan.misses.worstAreaError + 0.02 * err / std::max(1, p.rooms);
    std::vector<Rect> spaces(blocks.begin() + p.rooms, blocks.end());
    plan.score = planScore(brief, p.fp, rooms, spaces, report);
    plan.key = arrangementKey(brief, rooms);
}

SearchPlan pickSizing(const Brief& brief, const SearchProblem& p, std::vector<SearchPlan> sizings) {
    std::size_t best = 0;
    for (std::size_t k = 0; k < sizings.size(); ++k) {
        judge(brief, p, sizings[k]);
        if (ranksBefore(sizings[k], sizings[best])) best = k;
    }
    return std::move(sizings[best]);
}

bool PlanPool::offer(SearchPlan plan) {
    for (SearchPlan& q : plans_)
        if (q.key == plan.key) {
            if (!ranksBefore(plan, q)) return false;
            q = std::move(plan);
            sort();
            return true;
        }
    if (plans_.size() >= capacity_ && !ranksBefore(plan, plans_.back())) return false;
    plans_.push_back(std::move(plan));
    sort();
    if (plans_.size() > capacity_) plans_.pop_back();
    return true;
}

void PlanPool::sort() { std::stable_sort(plans_.begin(), plans_.end(), ranksBefore); }

} // namespace abut::detail
