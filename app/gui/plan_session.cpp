// SPDX-License-Identifier: MIT
#include "plan_session.h"

#include "io/project_io.h"
#include "plan/plan_builder.h"
#include "plan/variant_key.h"

#include <algorithm>
#include <cmath>

namespace abut::gui {

namespace brief_diff {

bool sameStructure(const Brief& a, const Brief& b) {
    if (a.units != b.units || a.rooms.size() != b.rooms.size() || a.adjacencies.size() != b.adjacencies.size())
        return false;
    for (std::size_t i = 0; i < a.rooms.size(); ++i)
        if (a.rooms[i].id != b.rooms[i].id || !(a.rooms[i].facade == b.rooms[i].facade)) return false;
    for (std::size_t i = 0; i < a.adjacencies.size(); ++i) {
        const Adjacency &x = a.adjacencies[i], &y = b.adjacencies[i];
        if (x.a != y.a || x.b != y.b || x.kind != y.kind || x.priority != y.priority) return false;
    }
    return true;
}

bool onlyChoicesDiffer(const Brief& a, const Brief& b) {
    Brief x = a, y = b;
    x.pinnedVariants.clear();
    x.hiddenVariants.clear();
    y.pinnedVariants.clear();
    y.hiddenVariants.clear();
    return serializeProject(x) == serializeProject(y);
}

bool sameSizes(const Brief& a, const Brief& b) {
    if (a.doorWidth != b.doorWidth || !(a.effectiveFootprint() == b.effectiveFootprint())) return false;
    for (std::size_t i = 0; i < a.rooms.size() && i < b.rooms.size(); ++i)
        if (a.rooms[i].area != b.rooms[i].area || a.rooms[i].minWidth != b.rooms[i].minWidth ||
            a.rooms[i].maxAspect != b.rooms[i].maxAspect)
            return false;
    return a.rooms.size() == b.rooms.size();
}

} // namespace brief_diff

namespace {
double twoDecimals(double v) { return std::round(v * 100.0) / 100.0; }
} // namespace

PlanSession::PlanSession(QObject* parent) : QObject(parent) {}

QString PlanSession::currentKey() const {
    return haveCurrent_ ? QString::fromStdString(variantKey(planBrief_, current_)) : QString();
}

PlanSession::Next PlanSession::briefChanged(const Brief& b) {
    using namespace brief_diff;
    const bool choicesOnly = haveCurrent_ && onlyChoicesDiffer(planBrief_, b);
    const bool keep = handLayoutWaiting_;
    handLayoutWaiting_ = false;
    if (haveCurrent_ && !currentStale_ && sameStructure(planBrief_, b)) {
        // A moved bubble or a renamed room leaves the sizes alone.
        if (keep || !sameSizes(planBrief_, b)) {
            resizeCurrent(b, keep);
        } else {
            planBrief_ = b;
            emit currentChanged(); // names and categories as typed
        }
    } else if (haveCurrent_) {
        currentStale_ = true;
    }
    if (choicesOnly) {
        planBrief_ = b;
        emit variantsChanged();
        return Next::Nothing;
    }
    if (b.rooms.empty()) {
        haveCurrent_ = false;
        variants_.clear();
        emit variantsChanged();
        return Next::Clear;
    }
    return Next::Plan;
}

void PlanSession::resizeCurrent(const Brief& given, bool keepLayout) {
    const Brief b = plannedBrief(given);
    const Footprint fp = b.effectiveFootprint();
    SizingOptions o = planSizingOptions(b);
    o.lockedRooms.assign(locked_.begin(), locked_.end());
    const SizingProblem problem(b, current_.extended, current_.labeling, fp, o);
    const SizingResult start = problem.stateOf(vertexRects(current_));
    SizingResult r;
    if (keepLayout) r = start; // a drag already placed every wall
    else if (fp == planFootprint_) r = problem.solve(&start);
    else r = problem.solve();
    current_ = applySizing(b, fp, current_, r);
    planBrief_ = b;
    planFootprint_ = fp;
    emit currentChanged();
}

void PlanSession::variantFound(const Brief& brief, const PlanVariant& v) {
    // The same arrangement found again (improved, or from another graph): keep the better one.
    const std::string key = variantKey(brief, v);
    auto same = std::find_if(variants_.begin(), variants_.end(),
                             [&](const PlanVariant& o) { return variantKey(brief, o) == key; });
    if (same == variants_.end()) variants_.push_back(v);
    else if (v.score < same->score) *same = v;
    else return;
    rankVariants(brief, brief.effectiveFootprint(), variants_);
    for (std::size_t i = 0; i < variants_.size(); ++i) variants_[i].rank = int(i) + 1;
    emit variantsChanged();
    if (!haveCurrent_ || currentStale_) choose(brief, QString::fromStdString(variantKey(brief, variants_.front())), false);
}

bool PlanSession::planFinished(const Plan& plan) {
    variants_ = plan.variants;
    if (variants_.empty()) haveCurrent_ = false;
    emit variantsChanged();
    return !variants_.empty() && (!haveCurrent_ || currentStale_ || !chosenByPlanner_);
}

void PlanSession::choose(const Brief& b, const QString& key, bool byPlanner) {
    for (const PlanVariant& v : variants_) {
        if (QString::fromStdString(variantKey(b, v)) != key) continue;
        current_ = v;
        haveCurrent_ = true;
        currentStale_ = false;
        chosenByPlanner_ = byPlanner;
        planBrief_ = b;
        planFootprint_ = b.effectiveFootprint();
        locked_.clear();
        emit lockedChanged();
        emit currentChanged();
        return;
    }
}

Brief PlanSession::handSized(const Brief& brief, const PlanVariant& resized, int room, double area) {
    Brief b = brief;
    if (room >= 0) {
        if (room < int(b.rooms.size())) b.rooms[room].area = twoDecimals(area);
    } else {
        // The rooms beside a moved wall take their new areas as targets.
        for (std::size_t i = 0; i < b.rooms.size() && i < resized.rooms.size() && i < current_.rooms.size(); ++i)
            if (std::abs(resized.rooms[i].area() - current_.rooms[i].area()) > 1e-9)
                b.rooms[i].area = twoDecimals(resized.rooms[i].area());
    }
    current_ = resized;
    chosenByPlanner_ = true; // a hand-sized plan stays on show when new variants arrive
    handLayoutWaiting_ = true;
    return b;
}

Plan PlanSession::currentAsPlan() const {
    Plan plan;
    plan.units = planBrief_.units;
    plan.footprint = planFootprint_;
    if (haveCurrent_) plan.variants = {current_};
    return plan;
}

bool PlanSession::takeWaitingLayout() {
    const bool waiting = handLayoutWaiting_;
    handLayoutWaiting_ = false;
    return waiting;
}

void PlanSession::toggleLock(int room) {
    if (!locked_.erase(room)) locked_.insert(room);
    emit lockedChanged();
}

} // namespace abut::gui
