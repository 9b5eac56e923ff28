// SPDX-License-Identifier: MIT
// The plan session without a window: what an edit does to the variant on
// show (re-sized at once, kept as a drag left it, or gone stale until the
// next computation), variants streamed and finished, locks. The variants
// come from buildPlan on the family-house sample; every variant the session
// shows is checked with checkVariant (the plan's own independent checker).
#include "io/project_io.h"
#include "plan/plan_builder.h"
#include "plan/variant_key.h"
#include "plan_session.h"
#include "../support/sample_plan.h"

#include <QSignalSpy>
#include <QtTest>

using namespace abut;
using namespace abut::gui;

namespace {
bool same(const Rect& a, const Rect& b) { return a.x0 == b.x0 && a.y0 == b.y0 && a.x1 == b.x1 && a.y1 == b.y1; }
} // namespace

class TestPlanSession : public QObject {
    Q_OBJECT

    Brief house_;
    Plan plan_;

    // A session showing the best variant of the house, as a finished computation leaves it.
    void startWithPlan(PlanSession& s) {
        QCOMPARE(s.briefChanged(house_), PlanSession::Next::Plan);
        s.startComputation();
        for (const PlanVariant& v : plan_.variants) s.variantFound(house_, v);
        QVERIFY(s.hasCurrent());
        if (s.planFinished(plan_)) s.choose(house_, QString::fromStdString(variantKey(house_, plan_.variants.front())), false);
        QVERIFY(s.hasCurrent());
    }

private slots:
    void initTestCase() {
        const abut::testing::SamplePlan s = abut::testing::planSample(ABUT_SAMPLES "/family-house.abut.json");
        QVERIFY(s.ok);
        house_ = s.brief;
        plan_ = s.plan;
        QVERIFY(plan_.variants.size() >= 2);
    }

    // Streamed variants: the first one goes on show at once, the list grows
    // and is ranked; the end of the computation keeps the list it reports.
    void streamedVariantsShowTheBest() {
        PlanSession s;
        QSignalSpy listed(&s, &PlanSession::variantsChanged), shown(&s, &PlanSession::currentChanged);
        QCOMPARE(s.briefChanged(house_), PlanSession::Next::Plan);
        s.startComputation();
        s.variantFound(house_, plan_.variants.back());
        QVERIFY(s.hasCurrent());
        QCOMPARE(shown.count(), 1);
        s.variantFound(house_, plan_.variants.front());
        QCOMPARE(int(s.variants().size()), 2);
        QVERIFY(s.variants().front().score <= s.variants().back().score);
        QVERIFY(s.planFinished(plan_)); // not chosen by the planner: the caller picks the best
        QCOMPARE(s.variants().size(), plan_.variants.size());
        QVERIFY(listed.count() >= 3);
    }

    // A new target re-sizes the variant on show at once (same arrangement,
    // the room nearer its new target), and planning starts again.
    void newTargetResizesAtOnce() {
        PlanSession s;
        startWithPlan(s);
        const std::string key = variantKey(house_, s.current());
        Brief b = house_;
        const double before = s.current().rooms[0].area();
        b.rooms[0].area = before * 1.2;
        QSignalSpy shown(&s, &PlanSession::currentChanged);
        QCOMPARE(s.briefChanged(b), PlanSession::Next::Plan);
        QCOMPARE(shown.count(), 1);
        QCOMPARE(variantKey(b, s.current()), key);
        QVERIFY(s.current().rooms[0].area() > before);
        QVERIFY2(checkVariant(s.plannedFor(), s.footprint(), s.current()).ok,
                 checkVariant(s.plannedFor(), s.footprint(), s.current()).problem.c_str());
    }

    // A renamed room changes no size: the variant is shown again as it is.
    void renameKeepsSizes() {
        PlanSession s;
        startWithPlan(s);
        const PlanVariant before = s.current();
        Brief b = house_;
        b.rooms[0].name = "Renamed";
        QSignalSpy shown(&s, &PlanSession::currentChanged);
        s.briefChanged(b);
        QCOMPARE(shown.count(), 1);
        QCOMPARE(s.plannedFor().rooms[0].name, std::string("Renamed"));
        for (std::size_t i = 0; i < before.rooms.size(); ++i) QVERIFY(same(s.current().rooms[i], before.rooms[i]));
    }

    // A new room makes the variant on show stale: the next computation's
    // first variant replaces it.
    void newRoomMakesTheVariantStale() {
        PlanSession s;
        startWithPlan(s);
        Brief b = house_;
        Room extra;
        extra.id = "extra";
        extra.area = 5.0;
        b.rooms.push_back(extra);
        Adjacency a;
        a.a = b.rooms[0].id;
        a.b = "extra";
        b.adjacencies.push_back(a);
        QCOMPARE(s.briefChanged(b), PlanSession::Next::Plan);
        PlanOptions o;
        o.threads = 1;
        o.timeLimit = 20;
        o.relaxations = false;
        const Plan next = buildPlan(b, o);
        QVERIFY(!next.variants.empty());
        s.startComputation();
        s.variantFound(b, next.variants.front());
        QCOMPARE(s.current().rooms.size(), b.rooms.size());
    }

    // A drag's layout is kept exactly by the edit that follows it, and its
    // rooms' targets are what the layout shows.
    void handSizedLayoutIsKept() {
        PlanSession s;
        startWithPlan(s);
        PlanVariant dragged = s.current();
        // Shrink room 0 by moving nothing but its number: a target drag.
        const Brief b = s.handSized(house_, dragged, 0, 12.345);
        QCOMPARE(b.rooms[0].area, 12.35);
        QVERIFY(!s.current().rooms.empty());
        s.briefChanged(b);
        QVERIFY(!s.takeWaitingLayout()); // used by briefChanged
        for (std::size_t i = 0; i < dragged.rooms.size(); ++i) QVERIFY(same(s.current().rooms[i], dragged.rooms[i]));
        // A strip choice later replaces it; locks go with the variant.
        s.toggleLock(1);
        QCOMPARE(int(s.lockedRooms().size()), 1);
        QSignalSpy locks(&s, &PlanSession::lockedChanged);
        s.choose(b, QString::fromStdString(variantKey(b, s.variants().back())), true);
        QCOMPARE(locks.count(), 1);
        QVERIFY(s.lockedRooms().empty());
    }

    // No rooms: nothing to plan, nothing on show.
    void emptyBriefClears() {
        PlanSession s;
        startWithPlan(s);
        Brief b = house_;
        b.rooms.clear();
        b.adjacencies.clear();
        QCOMPARE(s.briefChanged(b), PlanSession::Next::Clear);
        QVERIFY(!s.hasCurrent());
        QVERIFY(s.variants().empty());
    }
};

QTEST_GUILESS_MAIN(TestPlanSession)
#include "tst_plan_session.moc"
