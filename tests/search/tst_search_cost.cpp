// SPDX-License-Identifier: MIT
// The plan search's cost (search/detail/cost.h): each kind of miss counted
// where the one measure (search/requirements.h) counts it, and costing more
// the further it is from being met. Worked cases by hand, then a property:
// on random tilings with random briefs, the cost's count of misses equals
// the measure's (no threshold between them).
#include "search/detail/cost.h"
#include "search/detail/problem.h"
#include "search/plan_search.h"
#include "search/requirements.h"

#include "../support/random_briefs.h"
#include "../support/random_tilings.h"
#include "../support/search_fixtures.h"

#include <QtTest>

using namespace abut;
using namespace abut::detail;
using namespace abut::testing;

namespace {

// Two rooms side by side in a 10 × 4 footprint, the east one `eastWidth` wide
// and moved up by `shift`, so that their wall is 4 − shift long.
struct Pair {
    Brief brief;
    std::vector<Rect> rects;
};

Pair pair(double shift, AdjacencyKind kind, Priority priority) {
    Pair p;
    p.brief.footprint = Footprint{10, 8, {}};
    p.brief.rooms = {room("west", 20), room("east", 20), room("rest", 40)};
    p.brief.adjacencies = {adjacency("west", "east", priority, kind)};
    p.rects = {Rect{0, 0, 5, 4}, Rect{5, shift, 10, shift + 4}, Rect{0, 4, 5, 8}};
    return p;
}

Evaluation costOf(const Brief& b, const std::vector<Rect>& rects, std::vector<Violation>* out = nullptr) {
    const SearchProblem p = makeProblem(b, *b.footprint, SearchOptions{});
    return evaluate(p, rects, out);
}

} // namespace

class TestSearchCost : public QObject {
    Q_OBJECT
private slots:
    void mustWalls_data() {
        QTest::addColumn<double>("wall");
        QTest::addColumn<int>("kind");
        QTest::addColumn<int>("hard");
        // A door needs 0.9 m (the brief's doorWidth); a wall 0.05 m
        // (minContactLength): the measure's thresholds.
        QTest::newRow("door, 4 m") << 4.0 << int(AdjacencyKind::Door) << 0;
        QTest::newRow("door, 0.95 m") << 0.95 << int(AdjacencyKind::Door) << 0;
        QTest::newRow("door, 0.5 m") << 0.5 << int(AdjacencyKind::Door) << 1;
        QTest::newRow("door, apart") << 0.0 << int(AdjacencyKind::Door) << 1;
        QTest::newRow("wall, 0.1 m") << 0.1 << int(AdjacencyKind::Wall) << 0;
        QTest::newRow("wall, 0.03 m") << 0.03 << int(AdjacencyKind::Wall) << 1;
    }
    void mustWalls() {
        QFETCH(double, wall);
        QFETCH(int, kind);
        QFETCH(int, hard);
        // Rooms moved apart by a gap when there is no wall.
        Pair p = pair(4 - wall, static_cast<AdjacencyKind>(kind), Priority::Must);
        if (wall == 0) p.rects[1] = {5.5, 4, 10, 8};
        p.rects[2] = {0, 4, 5, 8};
        std::vector<Violation> v;
        const Evaluation e = costOf(p.brief, {p.rects[0], p.rects[1], p.rects[2]}, &v);
        QCOMPARE(e.hard, hard);
        const RequirementMisses m = requirementMisses(p.brief, *p.brief.footprint, p.rects);
        QCOMPARE(m.must, hard); // the one measure agrees
        if (hard) {
            QVERIFY(e.cost >= 0.3);
            QVERIFY(std::any_of(v.begin(), v.end(), [](const Violation& x) { return x.block == 0 && x.other == 1; }));
        }
    }

    void shouldWallCostsLessAndIsNoMiss() {
        const Pair must = pair(4.0, AdjacencyKind::Door, Priority::Must);
        const Pair should = pair(4.0, AdjacencyKind::Door, Priority::Should);
        const Evaluation a = costOf(must.brief, must.rects), b = costOf(should.brief, should.rects);
        QCOMPARE(b.hard, 0);
        QCOMPARE(a.hard, 1);
        QVERIFY(b.cost < a.cost);
    }

    void farFromTheWallCostsMore() {
        Pair p = pair(0, AdjacencyKind::Door, Priority::Must);
        const std::vector<Rect> near{{0, 0, 5, 4}, {5.5, 4, 10, 8}, {0, 4, 5, 8}};
        const std::vector<Rect> far{{0, 0, 3, 4}, {7, 4, 10, 8}, {0, 4, 5, 8}};
        QVERIFY(costOf(p.brief, far).cost > costOf(p.brief, near).cost);
    }

    void facadesOnTheOutlineAndOnCutOuts() {
        // A 10 × 8 footprint less its north-east quarter: a = west half, b
        // south-east. a's east wall on the cut-out faces east, b's north wall
        // on it faces north (both met); b's west wall is on a (missed).
        Brief b;
        b.footprint = Footprint{10, 8, {{6, 4, 4, 4}}};
        b.rooms = {room("a", 48), room("b", 16)};
        b.rooms[0].facade.add(Side::E);
        b.rooms[1].facade.add(Side::N);
        b.rooms[1].facade.add(Side::W);
        const Brief planned = plannedBrief(b);
        const std::vector<Rect> rects{{0, 0, 6, 8}, {6, 0, 10, 4}, {6, 4, 10, 8}};
        std::vector<Violation> v;
        const Evaluation e = costOf(planned, rects, &v);
        QCOMPARE(e.hard, 1);
        QCOMPARE(requirementMisses(planned, *b.footprint, rects).facade, 1);
        QCOMPARE(v.size(), std::size_t(1));
        QCOMPARE(v[0].block, 1);
        QCOMPARE(v[0].other, int(Side::W));
    }

    void narrowAndElongatedRooms() {
        Brief b;
        b.footprint = Footprint{10, 4, {}};
        b.rooms = {room("slim", 4), room("rest", 36)};
        b.rooms[0].minWidth = 1.2;
        b.rooms[0].maxAspect = 2.0;
        const std::vector<Rect> rects{{0, 0, 1, 4}, {1, 0, 10, 4}};
        std::vector<Violation> v;
        const Evaluation e = costOf(b, rects, &v);
        QCOMPARE(e.hard, 2); // 1 m wide under 1.2 m, 1:4 over 1:2
        QVERIFY(std::any_of(v.begin(), v.end(), [](const Violation& x) { return x.kind == RequirementKind::MinWidth; }));
        QVERIFY(std::any_of(v.begin(), v.end(), [](const Violation& x) { return x.kind == RequirementKind::MaxAspect; }));
        const std::vector<Rect> wide{{0, 0, 1.5, 4}, {1.5, 0, 10, 4}};
        QVERIFY(costOf(b, wide).cost < e.cost);
    }

    void fixedBlockAwayFromItsPlace() {
        Brief b;
        b.footprint = Footprint{10, 4, {}};
        b.rooms = {room("core", 8), room("rest", 32)};
        b.rooms[0].fixed = Placement{0, 0, 2, 4};
        QCOMPARE(costOf(b, {{0, 0, 2, 4}, {2, 0, 10, 4}}).hard, 0);
        QCOMPARE(costOf(b, {{8, 0, 10, 4}, {0, 0, 8, 4}}).hard, 1);
    }

    // The cost's count and the measure's count of the same misses agree on
    // random tilings of random briefs (seeded): there is one threshold.
    void costCountsWhatTheMeasureCounts() {
        std::mt19937 rng(20261203);
        int compared = 0, withMisses = 0;
        for (int trial = 0; trial < 300; ++trial) {
            const int n = 3 + trial % 15;
            RandomBriefOptions o;
            o.rooms = n;
            Brief b = randomBrief(o, rng);
            b.footprint = Footprint{12, 9, {}};
            const std::vector<Rect> rects = randomSlicing(n, 12, 9, rng);
            std::uniform_real_distribution<double> unit(0.0, 1.0);
            for (int i = 0; i < n; ++i) {
                b.rooms[i].area = rects[i].area(); // exact: the layout's areas are the targets
                const double shortSide = std::min(rects[i].width(), rects[i].depth());
                const double aspect = std::max(rects[i].width(), rects[i].depth()) / shortSide;
                if (unit(rng) < 0.5) b.rooms[i].minWidth = shortSide * (0.7 + 0.6 * unit(rng));
                if (unit(rng) < 0.5) b.rooms[i].maxAspect = std::max(1.0, aspect * (0.7 + 0.6 * unit(rng)));
            }
            const SearchProblem p = makeProblem(b, *b.footprint, SearchOptions{});
            if (p.blockCount() != n) continue; // a spare block: not this layout
            const Evaluation e = evaluate(p, rects, nullptr);
            const RequirementMisses m = requirementMisses(b, *b.footprint, rects);
            QCOMPARE(e.hard, m.must + m.facade + m.minWidth + m.maxAspect);
            ++compared;
            withMisses += e.hard > 0;
        }
        QVERIFY(compared > 200);
        QVERIFY(withMisses > 50); // the property is not vacuous
    }
};

QTEST_GUILESS_MAIN(TestSearchCost)
#include "tst_search_cost.moc"
