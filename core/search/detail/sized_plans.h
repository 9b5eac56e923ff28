// SPDX-License-Identifier: MIT
// Between rounds the plan search turns its best layouts into sized plans:
// each arrangement is sized in one or more ways (size/segment_sizing.h),
// every sizing judged by the one measure and the one ranking (planScore),
// the best kept in a pool of distinct arrangements (arrangementKey).
// Running time: a sizing is a few Newton steps with a sparse factorisation
// each; judging O(rooms² ) for the key plus the measure.
#pragma once

#include "search/detail/problem.h"
#include "search/plan_search.h"

#include <functional>
#include <vector>

namespace abut::detail {

// The ways `arrangement` (extended graph and labeling set) is sized, warm
// from `rects` (per vertex): towards the areas the search lays out (the
// targets; within their bands when the footprint has room to spare); when
// that leaves a room off its band, with the bands free; when `rects` falls
// short of a hard minimum, also with its shortfalls held
// (SizingProblem::holdMinimumsAt). The caller judges which is best. The
// second and third sizings only while `inTime` (empty: always) says so.
std::vector<SearchPlan> sizeArrangement(const Brief& brief, const Footprint& fp, const SearchOptions& o,
                                        const std::vector<Rect>& rects, const SearchPlan& arrangement,
                                        const std::function<bool()>& inTime = {});

// Misses, score, key and the search's own cost of a sized plan.
void judge(const Brief& brief, const SearchProblem& p, SearchPlan& plan);

// The one ranking: the lower score first.
inline bool ranksBefore(const SearchPlan& a, const SearchPlan& b) { return a.score < b.score; }

// The best of several sizings of one arrangement, judged.
SearchPlan pickSizing(const Brief& brief, const SearchProblem& p, std::vector<SearchPlan> sizings);

// The best plans found, one per arrangement, best first, at most `capacity`.
class PlanPool {
public:
    explicit PlanPool(std::size_t capacity) : capacity_(capacity) {}
    // Whether `plan` is kept (new, or better than the plan of its arrangement).
    bool offer(SearchPlan plan);
    const std::vector<SearchPlan>& plans() const { return plans_; }
    std::vector<SearchPlan> take() { return std::move(plans_); }
    bool usable() const { return !plans_.empty() && plans_.front().misses.usable(); }

private:
    void sort();
    std::size_t capacity_;
    std::vector<SearchPlan> plans_;
};

} // namespace abut::detail
