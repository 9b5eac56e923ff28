// SPDX-License-Identifier: MIT
#include "plan/brief_check.h"

#include "search/plan_search.h"
#include "search/requirements.h"

#include <algorithm>

namespace abut {

namespace {

// Stops the search at the first plan that keeps every 'must' and facade wish.
class KeepsEverything : public SearchVisitor {
public:
    bool onRound(const SearchProgress&) override { return !found_; }
    void onImproved(const SearchPlan& plan) override {
        if (!found_ && plan.misses.must == 0 && plan.misses.facade == 0 && plan.misses.fixed == 0) {
            found_ = true;
            plan_ = plan;
        }
    }
    bool found() const { return found_; }
    const SearchPlan& plan() const { return plan_; }

private:
    bool found_ = false;
    SearchPlan plan_;
};

} // namespace

namespace {
BriefCheck arrangementCheck(const Brief& brief, const BriefCheckOptions& options) {
    BriefCheck out;
    out.arrangement = buildExtendedGraph(brief);
    AugmentResult& aug = out.arrangement;
    if (aug.status != AugmentStatus::Compromised || options.searchMoves < 0 || options.searchSeconds <= 0) return out;
    // A 'must' graph that is not planar cannot be drawn by any plan.
    for (const Diagnostic& d : aug.diagnostics)
        if (d.code == DiagnosticCode::NonPlanar) return out;
    SearchOptions search;
    search.threads = 1;
    search.moves = options.searchMoves > 0 ? options.searchMoves
                                           : 100000LL + 5000LL * static_cast<long long>(brief.rooms.size());
    search.timeLimit = options.searchSeconds;
    search.keep = 1;
    search.variantFlips = 0;
    KeepsEverything visitor;
    SearchResult found = searchPlans(brief, search, &visitor);
    out.searched = true;
    const SearchPlan* plan = visitor.found() ? &visitor.plan() : nullptr;
    for (const SearchPlan& p : found.plans)
        if (!plan && p.misses.must == 0 && p.misses.facade == 0 && p.misses.fixed == 0) plan = &p;
    if (!plan) return out;
    out.foundBySearch = true;
    aug.status = AugmentStatus::Feasible;
    aug.extended = plan->extended;
    aug.dropped.clear();
    aug.unmetFacade.clear();
    for (int k = 0; k < static_cast<int>(brief.adjacencies.size()); ++k) {
        const Adjacency& a = brief.adjacencies[k];
        const double need = a.kind == AdjacencyKind::Door ? brief.doorWidth : search.anyWall;
        const Rect& ra = plan->sized.rects[brief.roomIndex(a.a)];
        const Rect& rb = plan->sized.rects[brief.roomIndex(a.b)];
        if (sharedWallLength(ra, rb, 1e-9 * std::max(1.0, ra.width() + ra.depth())) < need - 1e-9)
            aug.dropped.push_back(k);
    }
    // What the augmentation gave up is not given up after all.
    std::erase_if(aug.diagnostics, [](const Diagnostic& d) {
        // (added contacts belonged to the augmentation's graph, not to the plan found)
        return d.code == DiagnosticCode::DroppedAdjacency || d.code == DiagnosticCode::FacadeConflict || d.code == DiagnosticCode::FacadeUnmet ||
               d.code == DiagnosticCode::AddedContact;
    });
    aug.summary = aug.dropped.empty()
                      ? "A rectangular plan exists with every adjacency and facade wish."
                      : "A rectangular plan exists with every 'must' adjacency and facade wish; " +
                            std::to_string(aug.dropped.size()) + " 'should' adjacency(ies) dropped.";
    return out;
}

// The planned brief's notes as notes on the brief as written: cut-outs are
// rooms of the planned brief (indices past the brief's own), never named to
// the planner. A contact with a cut-out is an exterior wall, not an added one.
void speakOfTheBrief(std::size_t rooms, AugmentResult& aug) {
    const auto isCutout = [&](int r) { return r < 0 || static_cast<std::size_t>(r) >= rooms; };
    std::erase_if(aug.diagnostics, [&](const Diagnostic& d) {
        const bool touchesCutout = std::any_of(d.rooms.begin(), d.rooms.end(), isCutout);
        const bool onlyCutouts = !d.rooms.empty() && std::all_of(d.rooms.begin(), d.rooms.end(), isCutout);
        return onlyCutouts || (touchesCutout && d.code == DiagnosticCode::AddedContact);
    });
    for (Diagnostic& d : aug.diagnostics) std::erase_if(d.rooms, isCutout);
    std::erase_if(aug.unmetFacade, isCutout);
}

} // namespace

BriefCheck checkBrief(const Brief& brief, const BriefCheckOptions& options) {
    // Planned as buildPlan plans it: cut-outs as blocks held in place.
    BriefCheck out = arrangementCheck(plannedBrief(brief), options);
    speakOfTheBrief(brief.rooms.size(), out.arrangement);
    out.diagnostics = footprintProblems(brief);
    out.fits = std::none_of(out.diagnostics.begin(), out.diagnostics.end(),
                            [](const Diagnostic& d) { return d.severity == Severity::Error; });
    out.diagnostics.insert(out.diagnostics.end(), out.arrangement.diagnostics.begin(),
                           out.arrangement.diagnostics.end());
    return out;
}

} // namespace abut
