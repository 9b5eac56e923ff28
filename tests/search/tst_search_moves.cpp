// SPDX-License-Identifier: MIT
// The plan search's moves (search/detail/moves.h) and seeds
// (search/detail/seeds.h): every move keeps the floor tree whole and its
// layout a tiling; moves aimed at a miss meet it far more often than moves at
// random; gathering puts a hub's rooms along it; seeds follow the sketch,
// tile the footprint, keep held blocks in place and lay zones out as strips.
#include "search/detail/chain.h"
#include "search/detail/cost.h"
#include "search/detail/moves.h"
#include "search/detail/problem.h"
#include "search/detail/seeds.h"
#include "search/plan_search.h"

#include "../support/random_briefs.h"
#include "../support/search_fixtures.h"

#include <QtTest>

#include <numeric>

using namespace abut;
using namespace abut::detail;
using namespace abut::testing;

namespace {

// A corridor with `n` offices that must open on it, one wishing the north facade.
Brief corridorBrief(int n) {
    Brief b;
    b.footprint = Footprint{3.0 * n, 12, {}};
    Room c = room("corridor", 3.0 * n * 2);
    c.category = "circulation";
    b.rooms.push_back(c);
    for (int k = 0; k < n; ++k) {
        b.rooms.push_back(room("office" + std::to_string(k), (3.0 * n * 12 - c.area) / n));
        b.adjacencies.push_back(adjacency("corridor", "office" + std::to_string(k)));
    }
    b.rooms[1].facade.add(Side::N);
    return b;
}

std::vector<Rect> layoutOf(const SearchProblem& p, const FloorTree& t) {
    std::vector<Rect> rects;
    FloorTree::Scratch scratch;
    t.layout(p.area, p.outer, rects, scratch, &p.pins);
    return rects;
}

} // namespace

class TestSearchMoves : public QObject {
    Q_OBJECT
private slots:
    void everyMoveKeepsTheTreeWhole() {
        std::mt19937 rng(7);
        for (int trial = 0; trial < 20; ++trial) {
            RandomBriefOptions o;
            o.rooms = 4 + trial;
            Brief b = randomBrief(o, rng);
            b.footprint = Footprint{15, 10, {}};
            const SearchProblem p = makeProblem(b, *b.footprint, SearchOptions{});
            FloorTree t = randomTree(p.blockCount(), rng);
            Moves moves(p, rng);
            for (int k = 0; k < 500; ++k) {
                std::vector<Violation> v;
                const std::vector<Rect> rects = layoutOf(p, t);
                evaluate(p, rects, &v);
                moves.propose(t, rects, v);
                QVERIFY2(t.valid(), qPrintable(QString("trial %1, move %2").arg(trial).arg(k)));
                const QString bad = tilingProblem(layoutOf(p, t), 15, 10);
                QVERIFY2(bad.isEmpty(), qPrintable(bad));
            }
        }
    }

    // From a layout where office 0 misses the north facade, moves drawn
    // with that miss as the only one put it on the north side far more often
    // than moves drawn with no miss to aim at (40 % of the draws are aimed).
    void aimedMovesMeetTheFacade() {
        const Brief b = corridorBrief(6);
        const SearchProblem p = makeProblem(b, *b.footprint, SearchOptions{});
        std::mt19937 rng(11);
        // Office 0 under the corridor, away from the north.
        FloorTree t(p.blockCount());
        std::vector<int> south{t.leafOf(1), t.leafOf(2), t.leafOf(3)}, north{t.leafOf(4), t.leafOf(5), t.leafOf(6)};
        const int low = t.chainNodes(south, true), high = t.chainNodes(north, true);
        t.setRoot(t.makeCut(false, t.makeCut(false, low, t.leafOf(0)), high));
        const std::vector<Rect> rects = layoutOf(p, t);
        std::vector<Violation> v;
        evaluate(p, rects, &v);
        QVERIFY(std::any_of(v.begin(), v.end(), [](const Violation& x) { return x.kind == RequirementKind::Facade; }));
        const std::vector<Violation> facade{{RequirementKind::Facade, 1, int(Side::N)}};
        auto rate = [&](const std::vector<Violation>& aim) {
            Moves moves(p, rng);
            int met = 0;
            for (int k = 0; k < 2000; ++k) {
                FloorTree trial = t;
                if (!moves.propose(trial, rects, aim)) continue;
                const std::vector<Rect> after = layoutOf(p, trial);
                met += exteriorDistance(p, after, after[1], Side::N) <= p.lineTolerance();
            }
            return met / 2000.0;
        };
        const double aimed = rate(facade), blind = rate({});
        QVERIFY2(aimed > blind + 0.1, qPrintable(QString("aimed %1, at random %2").arg(aimed).arg(blind)));
    }

    // Gathering takes the rooms that open on a hub (all of them, or those
    // without their wall) and lays them in rows along it: from random trees,
    // every room touches the corridor afterwards in most trials, and far more
    // rooms touch it than before.
    void gatherPutsTheRoomsAlongTheHub() {
        const Brief b = corridorBrief(6);
        const SearchProblem p = makeProblem(b, *b.footprint, SearchOptions{});
        QVERIFY(p.isHub(0));
        std::mt19937 rng(3);
        auto touching = [&](const std::vector<Rect>& rects) {
            int n = 0;
            for (int k = 1; k < p.blockCount(); ++k) n += sharedWallLength(rects[0], rects[k], 1e-9) > 0;
            return n;
        };
        int before = 0, after = 0, all = 0, gathered = 0;
        for (int trial = 0; trial < 40; ++trial) {
            FloorTree t = randomTree(p.blockCount(), rng);
            Moves moves(p, rng);
            const std::vector<Rect> rects = layoutOf(p, t);
            if (!moves.gather(t, rects, 0)) continue;
            QVERIFY(t.valid());
            ++gathered;
            before += touching(rects);
            const int now = touching(layoutOf(p, t));
            after += now;
            all += now == 6;
        }
        QVERIFY(gathered >= 30);
        QVERIFY2(all >= gathered / 2 && after > before + gathered,
                 qPrintable(QString("%1 gathers: all six on the corridor %2 times; touching %3 before, %4 after")
                                .arg(gathered).arg(all).arg(before).arg(after)));
    }

    void seedsFollowTheSketch() {
        Brief b;
        b.footprint = Footprint{20, 10, {}};
        b.rooms = {room("w", 50), room("e", 50), room("n", 50), room("s", 50)};
        b.sketch = {{"w", {0, 50}}, {"e", {100, 50}}, {"n", {50, 100}}, {"s", {50, 0}}};
        const SearchProblem p = makeProblem(b, *b.footprint, SearchOptions{});
        std::mt19937 rng(1);
        const std::vector<Point> pos = roughPositions(p, true, 0.0, rng);
        QVERIFY(pos[0].x < pos[2].x && pos[2].x < pos[1].x); // west, middle, east (north up)
        QVERIFY(pos[3].y < pos[0].y && pos[0].y < pos[2].y);
        const std::vector<Rect> rects = layoutOf(p, cutTree(p, pos, rng, 0.0));
        QVERIFY(tilingProblem(rects, 20, 10).isEmpty());
        QVERIFY(rects[0].x0 == 0 && rects[1].x1 == 20);
    }

    void seedsKeepHeldBlocksInPlace() {
        Brief b;
        b.footprint = Footprint{12, 8, {}};
        b.rooms = {room("core", 16), room("a", 40), room("b", 40)};
        b.rooms[0].fixed = Placement{4, 0, 2, 8};
        const SearchProblem p = makeProblem(b, *b.footprint, SearchOptions{});
        std::mt19937 rng(5);
        int held = 0;
        for (int k = 0; k < 20; ++k) {
            const std::vector<Rect> rects = layoutOf(p, cutTree(p, roughPositions(p, false, 0.3, rng), rng, 1.0));
            QVERIFY(tilingProblem(rects, 12, 8).isEmpty());
            held += std::abs(rects[0].x0 - 4) < 1e-9 && std::abs(rects[0].x1 - 6) < 1e-9; // the layout lays cuts on its sides
        }
        QVERIFY2(held >= 10, qPrintable(QString("%1 of 20 seeds hold the core").arg(held)));
    }

    void zonesAreStripsAlongTheirHub() {
        const Brief b = corridorBrief(8);
        const SearchProblem p = makeProblem(b, *b.footprint, SearchOptions{});
        std::mt19937 rng(9);
        const std::vector<Zone> zones = circulationZones(p, rng);
        QCOMPARE(zones.size(), std::size_t(1));
        QCOMPARE(zones[0].hub, 0);
        QCOMPARE(zones[0].clients.size(), std::size_t(8));
        const std::vector<Rect> rects = layoutOf(p, zoneTree(p, zones, roughPositions(p, false, 0, rng), rng, 0));
        QVERIFY(tilingProblem(rects, 24, 12).isEmpty());
        for (int k = 1; k <= 8; ++k) QVERIFY(sharedWallLength(rects[0], rects[k], 1e-9) >= 0.9);
    }

    void aSplitSweepAddsUpAsTheLoopDoes() {
        // SplitSweep against the plain sum over every block, per cut position,
        // on random blocks (some held in place): the same to rounding.
        std::mt19937 rng(5);
        std::uniform_real_distribution<double> u(0.0, 1.0);
        for (int trial = 0; trial < 20; ++trial) {
            const int m = 5 + trial * 20;
            std::vector<Point> pos(m), half(m);
            std::vector<std::optional<Rect>> pin(m);
            for (int j = 0; j < m; ++j) {
                pos[j] = {50 * u(rng), 30 * u(rng)};
                half[j] = {3 * u(rng), trial % 3 == 0 ? 0.0 : 2 * u(rng)};
                if (j % 7 == 3) pin[j] = Rect{pos[j].x - 1, pos[j].y - 1, pos[j].x + 1, pos[j].y + 1};
            }
            for (const bool dir : {true, false}) {
                std::vector<int> items(m);
                std::iota(items.begin(), items.end(), 0);
                std::sort(items.begin(), items.end(), [&](int a, int b) { return dir ? pos[a].x < pos[b].x : pos[a].y < pos[b].y; });
                SplitSweep sweep;
                sweep.start(items, pos, half, pin, dir);
                for (int k = 1; k < m; ++k) {
                    const double c = (dir ? 50.0 : 30.0) * k / m;
                    double wrong = 0, through = 0, w = 0, t = 0;
                    sweep.at(static_cast<std::size_t>(k), c, w, t);
                    for (int j = 0; j < m; ++j) {
                        const double at = dir ? pos[items[j]].x : pos[items[j]].y;
                        const double reach = dir ? half[items[j]].x : half[items[j]].y;
                        wrong += j < k ? std::max(0.0, at - c) : std::max(0.0, c - at);
                        through += std::max(0.0, reach - std::abs(at - c));
                        if (const std::optional<Rect>& f = pin[items[j]])
                            wrong += 4.0 * (j < k ? std::max(0.0, (dir ? f->x1 : f->y1) - c) : std::max(0.0, c - (dir ? f->x0 : f->y0)));
                    }
                    QVERIFY2(std::abs(w - wrong) <= 1e-9 * (1 + wrong) && std::abs(t - through) <= 1e-9 * (1 + through),
                             qPrintable(QString("trial %1 k %2: %3/%4 %5/%6").arg(trial).arg(k).arg(w).arg(wrong).arg(t).arg(through)));
                }
            }
        }
    }

    void aChainIsTheSameForTheSameSeed() {
        const Brief b = corridorBrief(6);
        const SearchProblem p = makeProblem(b, *b.footprint, SearchOptions{});
        Chain one(p, 42, 1, 5000), two(p, 42, 1, 5000);
        one.run(20000);
        two.run(20000);
        QCOMPARE(one.bestEvaluation().cost, two.bestEvaluation().cost);
        QCOMPARE(one.bestRects().size(), two.bestRects().size());
        for (std::size_t k = 0; k < one.bestRects().size(); ++k) QCOMPARE(one.bestRects()[k].x0, two.bestRects()[k].x0);
        QCOMPARE(one.bestEvaluation().hard, 0); // six offices on a corridor, one to the north: easy
    }
};

QTEST_GUILESS_MAIN(TestSearchMoves)
#include "tst_search_moves.moc"
