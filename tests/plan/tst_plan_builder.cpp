// SPDX-License-Identifier: MIT
// Steering the plan computation (progress, streaming, cancel) and the sizing
// calls a wall drag uses (state of a layout, segment range, evaluate).
#include "io/project_io.h"
#include "plan/plan_builder.h"

#include <QtTest>

using namespace abut;

namespace {
Brief sample(const char* name) {
    const LoadResult r = loadProject(std::string(ABUT_SAMPLES "/") + name + ".abut.json");
    return r.brief;
}
} // namespace

class TestPlanBuilder : public QObject {
    Q_OBJECT
private slots:
    void roomAcrossTheFloorSizedExactly() {
        // A hall from north to south with two rooms on each side (the brief of
        // tst_augment's roomAcrossTheFloor, with areas). Both long walls have
        // the hall alone on one side, so the layout is one-sided and any
        // areas summing to the footprint are met exactly (Eppstein, Mumford,
        // Speckmann & Verbeek, SIAM J. Comput. 41(3), 2012): within 0.1 %.
        Brief b;
        const double areas[5] = {10, 12, 8, 9, 11}; // m², sum 50 = 10 m × 5 m
        for (int v = 0; v < 5; ++v) b.rooms.push_back(Room{"r" + std::to_string(v), "", areas[v]});
        for (auto [u, w] : std::vector<std::pair<int, int>>{{0, 1}, {0, 2}, {0, 3}, {0, 4}, {1, 2}, {3, 4}}) {
            Adjacency a;
            a.a = "r" + std::to_string(u);
            a.b = "r" + std::to_string(w);
            b.adjacencies.push_back(a);
        }
        const std::vector<std::vector<Side>> wishes{
            {Side::N, Side::S}, {Side::N, Side::W}, {Side::S, Side::W}, {Side::N, Side::E}, {Side::S, Side::E}};
        for (int v = 0; v < 5; ++v)
            for (Side s : wishes[v]) b.rooms[v].facade.add(s);
        b.footprint = Footprint{10.0, 5.0};
        const Plan plan = buildPlan(b, {});
        QCOMPARE(plan.status, PlanStatus::Ok);
        const PlanVariant& v = plan.variants.front();
        QVERIFY(v.unmetFacade.empty());
        QVERIFY(v.dropped.empty());
        QVERIFY2(v.metrics.worstAreaError <= 1e-3, std::to_string(v.metrics.worstAreaError).c_str());
        // The hall runs the full depth.
        QCOMPARE(v.rooms[0].y0, 0.0);
        QVERIFY(std::abs(v.rooms[0].y1 - 5.0) < 1e-9);
    }

    void progressRisesAndVariantsStream() {
        const Brief b = sample("clinic");
        std::vector<double> seen;
        int found = 0;
        PlanMonitor m;
        m.progress = [&](double done, const std::string&) {
            seen.push_back(done);
            return true;
        };
        m.found = [&](const PlanVariant& v) {
            ++found;
            QVERIFY(v.sized);
        };
        const Plan plan = buildPlan(b, {}, &m);
        QVERIFY(plan.status == PlanStatus::Ok || plan.status == PlanStatus::Compromised);
        QVERIFY(found >= 1);
        QVERIFY(seen.size() > 3);
        for (std::size_t i = 1; i < seen.size(); ++i) QVERIFY(seen[i] >= seen[i - 1] - 1e-12);
        QCOMPARE(seen.back(), 1.0);
    }

    void cancelStopsAndKeepsWhatWasFound_data() {
        QTest::addColumn<int>("stopAfter"); // progress calls allowed before stopping
        QTest::newRow("at once") << 0;
        QTest::newRow("after a few") << 3;
        QTest::newRow("while sizing") << 12;
    }
    void cancelStopsAndKeepsWhatWasFound() {
        QFETCH(int, stopAfter);
        const Brief b = sample("office-floor");
        int calls = 0;
        PlanMonitor m;
        m.progress = [&](double, const std::string&) { return calls++ < stopAfter; };
        const Plan plan = buildPlan(b, {}, &m);
        QCOMPARE(plan.status, PlanStatus::Cancelled);
        QCOMPARE(calls, stopAfter + 1); // nothing more is asked once stopped
        for (const PlanVariant& v : plan.variants) QVERIFY(checkVariant(b, plan.footprint, v).ok);
        if (stopAfter == 0) QVERIFY(plan.variants.empty());
    }

    // Moving one wall within its range changes only the rooms beside it and
    // keeps every hard requirement.
    void wallDragWithinRange() {
        const Brief b = sample("family-house");
        const Plan plan = buildPlan(b);
        QVERIFY(!plan.variants.empty());
        const PlanVariant& v = plan.variants[0];
        // The options the plan was sized with (its minimum widths, door walls and contacts).
        const SizingProblem problem(b, v.extended, v.labeling, plan.footprint, planSizingOptions(b));
        const SizingResult state = problem.stateOf(vertexRects(v));
        for (std::size_t i = 0; i < b.rooms.size(); ++i) QCOMPARE(state.rooms[i].area, v.rooms[i].area());
        const SegmentStructure& s = problem.segments();
        int moved = 0;
        for (int k = 0; k < s.verticalCount; ++k) {
            if (k == s.westSegment || k == s.eastSegment) continue;
            const auto [lo, hi] = problem.segmentRange(state, true, k);
            QVERIFY2(lo <= state.x[k] + 1e-9 && state.x[k] <= hi + 1e-9, "the current position is in range");
            for (double to : {lo, hi, 0.5 * (lo + hi)}) {
                std::vector<double> x = state.x;
                x[k] = to;
                const SizingResult r = problem.evaluate(x, state.y);
                for (const UnmetRequirement& u : r.unmet)
                    QVERIFY2(u.kind == RequirementKind::Area || u.kind == RequirementKind::MaxAspect,
                             qPrintable(QString::fromStdString(std::string(toString(u.kind)) + ": " + u.message)));
                for (std::size_t i = 0; i < b.rooms.size(); ++i) {
                    const bool beside = s.west[i] == k || s.east[i] == k;
                    if (!beside) QCOMPARE(r.rooms[i].area, state.rooms[i].area);
                }
                const PlanVariant dragged = applySizing(b, plan.footprint, v, r);
                QVERIFY2(checkVariant(b, plan.footprint, dragged).ok, checkVariant(b, plan.footprint, dragged).problem.c_str());
            }
            ++moved;
        }
        QVERIFY(moved > 0);
    }
};

QTEST_GUILESS_MAIN(TestPlanBuilder)
#include "tst_plan_builder.moc"
