// SPDX-License-Identifier: MIT
// Sizing: exact on layouts whose targets are achievable, exact on one-sided
// layouts for any targets, honest about what cannot be met, and usable for
// dragging (ranges, locked segments, warm starts, the planning grid).
#include "augment/augment.h"
#include "dual/rectangular_dual.h"
#include "label/labeling_lattice.h"
#include "size/segment_sizing.h"
#include "../support/random_briefs.h"
#include "../support/random_tilings.h"

#include <QtTest>

using namespace abut;

namespace {

// A brief whose target areas and minimum widths are read off a tiling.
Brief briefOfTiling(const std::vector<Rect>& rects, double minWidthShare) {
    Brief b;
    for (std::size_t i = 0; i < rects.size(); ++i) {
        Room r;
        r.id = "t" + std::to_string(i);
        r.area = rects[i].area();
        if (minWidthShare > 0) r.minWidth = minWidthShare * std::min(rects[i].width(), rects[i].depth());
        b.rooms.push_back(r);
    }
    return b;
}

SizingOptions looseWalls() {
    SizingOptions o;
    o.anyWall = 1e-4; // random tilings have arbitrarily short contacts
    o.doorWidth = 1e-4;
    return o;
}

double worstDeviation(const SizingResult& r) {
    double worst = 0;
    for (const RoomSize& s : r.rooms) worst = std::max(worst, std::abs(s.deviation));
    return worst;
}

} // namespace

class TestSizing : public QObject {
    Q_OBJECT
private slots:
    void tilingLayoutsAreExact_data();
    void tilingLayoutsAreExact();
    void oneSidedLayoutsMeetAnyTargets();
    void publishedMinimumsFitTheirDwelling();
    void impossibleMinimumsAreReported();
    void areasFarOverTheFootprintAreReported();
    void dragRangeKeepsHardRequirements();
    void lockedSegmentStaysPut();
    void warmStartIsCheaper();
    void gridSnapsWalls();
};

void TestSizing::tilingLayoutsAreExact_data() {
    QTest::addColumn<int>("rooms");
    for (int n : {5, 10, 30, 100}) QTest::addRow("%d rooms", n) << n;
}

void TestSizing::tilingLayoutsAreExact() {
    // With the tiling's own labeling the targets are achievable, so the
    // sizer must find them: worst area error ≤ 0.1 % (with 90 % minimum widths).
    QFETCH(int, rooms);
    std::mt19937 rng(600 + rooms);
    for (int rep = 0; rep < 5; ++rep) {
        const auto rects = abut::testing::randomSlicing(rooms, 24.0, 16.0, rng);
        const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 24.0, 16.0);
        const Brief b = briefOfTiling(rects, 0.9);
        const SizingProblem p(b, x, abut::testing::labelingOfTiling(x, rects), Footprint{24.0, 16.0}, looseWalls());
        const SizingResult r = p.solve();
        QCOMPARE(r.status, SizingStatus::Solved);
        QVERIFY2(worstDeviation(r) <= 1e-3, qPrintable(QString::number(worstDeviation(r))));
        for (std::size_t i = 0; i < b.rooms.size(); ++i)
            QVERIFY(std::min(r.rects[i].width(), r.rects[i].depth()) >= *b.rooms[i].minWidth - 1e-9);
        QVERIFY(checkRectangularDual(x, r.rects, 24.0, 16.0, 1e-6).ok);
    }
}

void TestSizing::oneSidedLayoutsMeetAnyTargets() {
    // One-sided layouts are area-universal (Eppstein, Mumford, Speckmann &
    // Verbeek, SIAM J. Comput. 41(3), 2012): any targets summing to the
    // footprint are met exactly; here within 0.1 %.
    std::mt19937 rng(61);
    int tried = 0;
    for (int rep = 0; rep < 200 && tried < 40; ++rep) {
        const int n = 3 + static_cast<int>(rng() % 10);
        const auto rects = abut::testing::randomSlicing(n, 10.0, 10.0, rng);
        const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 10.0, 10.0);
        LabelingEnumerator e(x, computeRegularEdgeLabeling(x).labeling);
        while (const RegularEdgeLabeling* rel = e.next()) {
            if (!isOneSided(x, *rel)) continue;
            Brief b = briefOfTiling(rects, 0.0);
            std::uniform_real_distribution<double> share(0.5, 2.0);
            double sum = 0;
            for (Room& room : b.rooms) sum += (room.area = share(rng));
            for (Room& room : b.rooms) room.area *= 100.0 / sum;
            const SizingProblem p(b, x, *rel, Footprint{10.0, 10.0}, looseWalls());
            const SizingResult r = p.solve();
            QVERIFY2(worstDeviation(r) <= 1e-3, qPrintable(QString::number(worstDeviation(r))));
            ++tried;
            break;
        }
    }
    QVERIFY(tried >= 20);
}

void TestSizing::publishedMinimumsFitTheirDwelling() {
    // Worked example: a two-bedroom, four-person single-storey dwelling at the
    // minimum gross internal area of 70 m² (UK DCLG nationally described space
    // standard 2015, Table 1) on a 10 × 7 m footprint, its double bedroom at
    // the standard's 11.5 m² and 2.75 m width and the twin at 11.5 m² and
    // 2.55 m (same standard). Living 24, kitchen 9, bath 5 and hall 9 m² are
    // invented to fill the area. Worked by hand: living takes the west strip
    // (24/7 = 3.43 m wide); east of it the bedrooms share a row 23/6.57 =
    // 3.50 m deep, the hall a strip 9/6.57 = 1.37 m deep, and kitchen and bath
    // a row 14/6.57 = 2.13 m deep. The sizer, started from scratch on that
    // arrangement, must find the same sizes: every area within 0.1 %, every
    // width and every door wall (0.9 m, common practice) met.
    const double a = 24.0 / 7.0, e = 10.0 - a;
    const double bed = 23.0 / e, hall = 9.0 / e, low = 14.0 / e;
    const std::vector<Rect> rects{
        {a, low + hall, a + 11.5 / bed, 7.0},        // 0 double
        {a + 11.5 / bed, low + hall, 10.0, 7.0},     // 1 twin
        {0.0, 0.0, a, 7.0},                          // 2 living
        {a, 0.0, a + 9.0 / low, low},                // 3 kitchen
        {a + 9.0 / low, 0.0, 10.0, low},             // 4 bath
        {a, low, 10.0, low + hall},                  // 5 hall
    };
    const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 10.0, 7.0);
    QVERIFY(checkExtendedGraph(x).ok);
    Brief b;
    b.footprint = Footprint{10.0, 7.0};
    const char* ids[6] = {"double", "twin", "living", "kitchen", "bath", "hall"};
    const double areas[6] = {11.5, 11.5, 24.0, 9.0, 5.0, 9.0};
    const double widths[6] = {2.75, 2.55, 3.0, 2.0, 1.7, 1.2};
    for (int i = 0; i < 6; ++i) {
        Room r;
        r.id = ids[i];
        r.area = areas[i];
        r.minWidth = widths[i];
        b.rooms.push_back(r);
    }
    b.adjacencies = {{"hall", "double"}, {"hall", "twin"}, {"hall", "living"}, {"hall", "bath"},
                     {"living", "kitchen"}};
    SizingOptions o;
    o.doorWidth = 0.9;
    const SizingResult r = SizingProblem(b, x, abut::testing::labelingOfTiling(x, rects), *b.footprint, o).solve();
    QCOMPARE(r.status, SizingStatus::Solved);
    QVERIFY2(worstDeviation(r) <= 1e-3, qPrintable(QString::number(worstDeviation(r))));
    for (int i = 0; i < 6; ++i) {
        QVERIFY(std::min(r.rects[i].width(), r.rects[i].depth()) >= widths[i] - 1e-9);
        QVERIFY(std::abs(r.rects[i].area() - rects[i].area()) < 0.01 * areas[i]);
    }
    for (const UnmetRequirement& u : r.unmet) QVERIFY2(u.kind != RequirementKind::Door, u.message.c_str());
}

void TestSizing::impossibleMinimumsAreReported() {
    std::mt19937 rng(62);
    const auto rects = abut::testing::randomSlicing(8, 10.0, 10.0, rng);
    const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 10.0, 10.0);
    Brief b = briefOfTiling(rects, 0.0);
    for (Room& r : b.rooms) r.minWidth = 6.0; // eight rooms 6 m wide in 10 m: impossible
    const SizingResult r = SizingProblem(b, x, abut::testing::labelingOfTiling(x, rects), Footprint{10, 10}, looseWalls()).solve();
    QCOMPARE(r.status, SizingStatus::Relaxed);
    QVERIFY(std::any_of(r.unmet.begin(), r.unmet.end(), [](const UnmetRequirement& u) { return u.kind == RequirementKind::MinWidth; }));
    QVERIFY(checkRectangularDual(x, r.rects, 10, 10, 1e-6).ok); // still a valid plan
}

void TestSizing::areasFarOverTheFootprintAreReported() {
    std::mt19937 rng(63);
    const auto rects = abut::testing::randomSlicing(6, 10.0, 10.0, rng);
    const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 10.0, 10.0);
    Brief b = briefOfTiling(rects, 0.0);
    for (Room& r : b.rooms) r.area *= 3.0; // three times the footprint
    const SizingResult r = SizingProblem(b, x, abut::testing::labelingOfTiling(x, rects), Footprint{10, 10}, looseWalls()).solve();
    int areaMisses = 0;
    for (const UnmetRequirement& u : r.unmet) areaMisses += u.kind == RequirementKind::Area;
    QCOMPARE(areaMisses, 6);
}

void TestSizing::dragRangeKeepsHardRequirements() {
    std::mt19937 rng(64);
    const auto rects = abut::testing::randomSlicing(12, 12.0, 9.0, rng);
    const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 12.0, 9.0);
    const Brief b = briefOfTiling(rects, 0.5);
    SizingOptions o = looseWalls();
    const RegularEdgeLabeling rel = abut::testing::labelingOfTiling(x, rects);
    const SizingProblem p(b, x, rel, Footprint{12, 9}, o);
    const SizingResult r = p.solve();
    const SegmentStructure& s = p.segments();
    for (int k = 0; k < s.verticalCount; ++k) {
        if (k == s.westSegment || k == s.eastSegment) continue;
        const auto [lo, hi] = p.segmentRange(r, true, k);
        QVERIFY(lo <= r.x[k] + 1e-9 && r.x[k] <= hi + 1e-9);
        for (double at : {lo, hi, 0.5 * (lo + hi)}) {
            SizingResult moved = r;
            moved.x[k] = at;
            for (int v = 0; v < x.graph.vertexCount(); ++v)
                if (!x.isPole(v)) moved.rects[v] = {moved.x[s.west[v]], moved.y[s.south[v]], moved.x[s.east[v]], moved.y[s.north[v]]};
            for (int v = 0; v < x.roomCount; ++v)
                QVERIFY(moved.rects[v].width() >= *b.rooms[v].minWidth - 1e-9);
        }
    }
}

void TestSizing::lockedSegmentStaysPut() {
    std::mt19937 rng(65);
    const auto rects = abut::testing::randomSlicing(10, 12.0, 9.0, rng);
    const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 12.0, 9.0);
    const Brief b = briefOfTiling(rects, 0.0);
    SizingOptions o = looseWalls();
    const RegularEdgeLabeling rel = abut::testing::labelingOfTiling(x, rects);
    SizingProblem p(b, x, rel, Footprint{12, 9}, o);
    SizingResult r = p.solve();
    const SegmentStructure& s = p.segments();
    int k = 0;
    while (k == s.westSegment || k == s.eastSegment) ++k;
    const auto [lo, hi] = p.segmentRange(r, true, k);
    r.x[k] = lo + 0.3 * (hi - lo); // the planner drags a wall
    o.lockedVertical = {k};
    p.setOptions(o);
    const SizingResult after = p.solve(&r);
    QCOMPARE(after.x[k], r.x[k]);
    QVERIFY(checkRectangularDual(x, after.rects, 12, 9, 1e-6).ok);
}

void TestSizing::warmStartIsCheaper() {
    std::mt19937 rng(66);
    const auto rects = abut::testing::randomSlicing(40, 20.0, 15.0, rng);
    const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 20.0, 15.0);
    Brief b = briefOfTiling(rects, 0.0);
    SizingProblem p(b, x, abut::testing::labelingOfTiling(x, rects), Footprint{20, 15}, looseWalls());
    const SizingResult cold = p.solve();
    p.setTargetArea(3, b.rooms[3].area * 1.05); // the planner nudges one target
    const SizingResult warm = p.solve(&cold);
    QVERIFY(warm.newtonSteps < cold.newtonSteps);
}

void TestSizing::gridSnapsWalls() {
    std::mt19937 rng(67);
    const auto rects = abut::testing::randomSlicing(6, 12.0, 9.0, rng);
    const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 12.0, 9.0);
    const Brief b = briefOfTiling(rects, 0.0);
    SizingOptions o = looseWalls();
    o.grid = 0.3; // planning module 3M = 0.3 m (ISO 2848)
    const SizingResult r = SizingProblem(b, x, abut::testing::labelingOfTiling(x, rects), Footprint{12, 9}, o).solve();
    for (double v : r.x) {
        const bool onGrid = std::abs(v / 0.3 - std::round(v / 0.3)) < 1e-9;
        const bool reported = std::any_of(r.unmet.begin(), r.unmet.end(), [](const UnmetRequirement& u) { return u.kind == RequirementKind::Grid; });
        QVERIFY(onGrid || reported);
    }
    QVERIFY(checkRectangularDual(x, r.rects, 12, 9, 1e-6).ok);
}

QTEST_GUILESS_MAIN(TestSizing)
#include "tst_sizing.moc"
