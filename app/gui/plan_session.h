// SPDX-License-Identifier: MIT
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <QObject>
#include <QString>

#include <set>
#include <vector>

namespace abut::gui {

// The plan session: the variants of the computation under way or last
// finished, the one on show and the brief and footprint it was planned
// (or last re-sized) for, the rooms locked by the planner, and whether the
// variant on show was chosen by the planner or is just the best so far.
// Widget-free: the window, the plan view and the strip observe it through
// its signals, and tests drive it without a window.
//
// How an edit reaches the plan: the window passes every new brief to
// briefChanged(). With the same rooms, adjacencies and facade wishes the
// variant on show is re-sized at once (or kept as a drag left it); otherwise
// it goes stale and the window starts a new computation, whose variants
// come back through variantFound() and planFinished().
class PlanSession : public QObject {
    Q_OBJECT
public:
    explicit PlanSession(QObject* parent = nullptr);

    // What briefChanged() asks of the caller.
    enum class Next { Nothing, Plan, Clear };
    // A new brief (after any edit). Re-sizes or re-labels the variant on
    // show where that is enough; says whether a new computation is needed.
    Next briefChanged(const Brief& brief);

    // A computation's streamed variants (provisional) and its end. After
    // planFinished() returns true the caller chooses the variant to show
    // (the best one the planner has not set aside: the strip knows).
    void startComputation() { variants_.clear(); }
    void variantFound(const Brief& brief, const PlanVariant& v);
    bool planFinished(const Plan& plan);
    // Shows the variant with this key (variantKey); `byPlanner`: picked in
    // the strip, so it stays on show when new variants arrive.
    void choose(const Brief& brief, const QString& key, bool byPlanner);

    // A hand-sized layout (a wall or target drag) for the edit that follows:
    // the brief it returns takes the dragged rooms' new areas as targets,
    // and the next briefChanged() keeps the layout as it is.
    Brief handSized(const Brief& brief, const PlanVariant& resized, int room = -1, double area = 0);
    // Whether the hand-sized layout is still waiting (nothing in the brief
    // changed, so no briefChanged() came): then it is shown as it is.
    bool takeWaitingLayout();

    void toggleLock(int room);
    const std::set<int>& lockedRooms() const { return locked_; }

    bool hasCurrent() const { return haveCurrent_; }
    const PlanVariant& current() const { return current_; }
    const Brief& plannedFor() const { return planBrief_; }
    const Footprint& footprint() const { return planFootprint_; }
    const std::vector<PlanVariant>& variants() const { return variants_; }
    QString currentKey() const;
    // The variant on show as a plan of its own (for export and printing).
    Plan currentAsPlan() const;

signals:
    void currentChanged();  // the variant on show, its brief or its sizes changed
    void variantsChanged(); // the list of variants changed (streamed, finished, cleared)
    void lockedChanged();

private:
    void resizeCurrent(const Brief& brief, bool keepLayout);

    std::vector<PlanVariant> variants_; // best first (streamed until the plan is done)
    PlanVariant current_;               // on show, sized for planBrief_
    bool haveCurrent_ = false, currentStale_ = false;
    bool chosenByPlanner_ = false; // picked in the strip, not just the best so far
    bool handLayoutWaiting_ = false; // current_ is a drag's layout, waiting for its edit
    Brief planBrief_;
    Footprint planFootprint_;
    std::set<int> locked_;
};

// The numbers and structure of two briefs, as the session compares them.
namespace brief_diff {
// The same rooms, adjacencies, facade wishes and units: a variant of one
// still fits the other and only needs re-sizing.
bool sameStructure(const Brief& a, const Brief& b);
// Only the planner's choices among variants (pinned, hidden) differ.
bool onlyChoicesDiffer(const Brief& a, const Brief& b);
// The numbers sizing reads are the same (targets, widths, aspects, footprint, door wall).
bool sameSizes(const Brief& a, const Brief& b);
} // namespace brief_diff

} // namespace abut::gui
