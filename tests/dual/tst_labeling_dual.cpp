// SPDX-License-Identifier: MIT
// Regular edge labelings and rectangular duals: on random tilings (valid by
// construction) and on random briefs, every labeling passes the local-rule
// checker and every dual passes the tiling/contact checker; the checkers
// themselves reject broken input; minimum contact lengths hold.
#include "augment/augment.h"
#include "dual/rectangular_dual.h"
#include "io/project_io.h"
#include "label/regular_edge_labeling.h"
#include "plan/plan_builder.h"
#include "../support/random_briefs.h"
#include "../support/random_tilings.h"

#include <QtTest>

using namespace abut;

namespace {

// Labeling + dual + both checkers; "" when all is well.
std::string fullCheck(const ExtendedGraph& x, const DualWeights& w = {}) {
    const LabelingResult r = computeRegularEdgeLabeling(x);
    if (r.status != LabelingStatus::Ok) return "labeling: " + r.message;
    const StageCheck c = checkRegularEdgeLabeling(x, r.labeling);
    if (!c.ok) return "labeling check: " + c.problem;
    const SegmentStructure s = maximalSegments(x, r.labeling);
    const DualLayout l = longestPathLayout(x, s, w);
    const StageCheck d = checkRectangularDual(x, l.rects, l.width, l.depth);
    if (!d.ok) return "dual check: " + d.problem;
    return {};
}

} // namespace

class TestLabelingDual : public QObject {
    Q_OBJECT
private slots:
    void randomTilings();
    void randomBriefs();
    void pinwheelPlan();
    void labelingCheckerRejectsBrokenLabels();
    void dualCheckerRejectsBrokenLayouts();
    void minimumContactLengthsHold();
    void samplesGiveValidPlans_data();
    void samplesGiveValidPlans();
};

void TestLabelingDual::randomTilings() {
    std::mt19937 rng(1201);
    for (int i = 0; i < 1000; ++i) {
        const int n = 1 + static_cast<int>(rng() % 120);
        const auto rects = abut::testing::randomSlicing(n, 12.0, 9.0, rng);
        const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 12.0, 9.0);
        const StageCheck g = checkExtendedGraph(x);
        QVERIFY2(g.ok, g.problem.c_str());
        const std::string problem = fullCheck(x);
        QVERIFY2(problem.empty(), (std::to_string(i) + ": " + problem).c_str());
    }
}

void TestLabelingDual::randomBriefs() {
    std::mt19937 rng(1202);
    for (int i = 0; i < 1000; ++i) {
        abut::testing::RandomBriefOptions o;
        o.rooms = 1 + static_cast<int>(rng() % 60);
        o.keepEdge = 0.3 + 0.7 * (rng() % 100) / 100.0;
        o.facadeWish = 0.2;
        const Brief b = abut::testing::randomBrief(o, rng);
        const AugmentResult a = buildExtendedGraph(b);
        const std::string problem = fullCheck(a.extended);
        QVERIFY2(problem.empty(), (std::to_string(i) + ": " + problem).c_str());
    }
}

void TestLabelingDual::pinwheelPlan() {
    // The five-room pinwheel: four rooms around a centre, each touching the next.
    Brief b = abut::testing::briefFromEdges(5, {{0, 1}, {0, 2}, {0, 3}, {0, 4}, {1, 2}, {2, 3}, {3, 4}, {4, 1}});
    // Targets that fill the footprint: footprint area the targets leave over
    // would stand as a spare space (the default `surplus: "spare"`).
    for (Room& r : b.rooms) r.area = 20.0;
    b.footprint = Footprint{10.0, 10.0};
    const Plan plan = buildPlan(b);
    QCOMPARE(plan.status, PlanStatus::Ok);
    QVERIFY(!plan.variants.empty());
    const PlanVariant& v = plan.variants.front();
    QCOMPARE(checkVariant(b, *b.footprint, v).problem, std::string());
    QVERIFY(v.dropped.empty());
    QVERIFY(v.spaces.empty());
    // The centre room touches no outline side.
    const Rect& c = v.rooms[0];
    QVERIFY(c.x0 > 0 && c.y0 > 0 && c.x1 < 10.0 && c.y1 < 10.0);
}

void TestLabelingDual::labelingCheckerRejectsBrokenLabels() {
    std::mt19937 rng(3);
    const auto rects = abut::testing::randomSlicing(12, 10, 10, rng);
    const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 10, 10);
    const LabelingResult r = computeRegularEdgeLabeling(x);
    QVERIFY(checkRegularEdgeLabeling(x, r.labeling).ok);
    int rejected = 0, tried = 0;
    for (int v = 0; v < x.roomCount; ++v)
        for (int i = 0; i < x.graph.degree(v); ++i) {
            const int u = x.graph.neighbours(v)[i];
            if (!x.isRoom(u)) continue;
            RegularEdgeLabeling broken = r.labeling;
            // Recolour one edge at both ends (red ↔ blue, same direction).
            auto swap = [](EdgeLabel l) {
                switch (l) {
                case EdgeLabel::OutRed: return EdgeLabel::OutBlue;
                case EdgeLabel::OutBlue: return EdgeLabel::OutRed;
                case EdgeLabel::InRed: return EdgeLabel::InBlue;
                case EdgeLabel::InBlue: return EdgeLabel::InRed;
                default: return l;
                }
            };
            broken.at[v][i] = swap(broken.at[v][i]);
            const int j = x.graph.position(u, v);
            broken.at[u][j] = swap(broken.at[u][j]);
            ++tried;
            rejected += !checkRegularEdgeLabeling(x, broken).ok;
        }
    // Recolouring a single edge always breaks a block at one of its ends.
    QCOMPARE(rejected, tried);
    // One end disagreeing with the other is caught too.
    RegularEdgeLabeling oneEnd = r.labeling;
    oneEnd.at[0][0] = oneEnd.at[0][0] == EdgeLabel::OutRed ? EdgeLabel::InRed : EdgeLabel::OutRed;
    QVERIFY(!checkRegularEdgeLabeling(x, oneEnd).ok);
}

void TestLabelingDual::dualCheckerRejectsBrokenLayouts() {
    std::mt19937 rng(4);
    const auto rects = abut::testing::randomSlicing(15, 10, 10, rng);
    const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 10, 10);
    std::vector<Rect> all(x.graph.vertexCount());
    for (int v = 0; v < x.roomCount; ++v) all[v] = rects[v];
    QVERIFY(checkRectangularDual(x, all, 10, 10).ok);
    std::vector<Rect> shrunk = all;
    shrunk[3].x1 -= 0.01; // leaves a gap
    QVERIFY(!checkRectangularDual(x, shrunk, 10, 10).ok);
    std::vector<Rect> swapped = all;
    std::swap(swapped[2], swapped[7]); // same tiling, wrong rooms
    QVERIFY(!checkRectangularDual(x, swapped, 10, 10).ok);
}

void TestLabelingDual::minimumContactLengthsHold() {
    std::mt19937 rng(5);
    for (int i = 0; i < 200; ++i) {
        const int n = 2 + static_cast<int>(rng() % 60);
        const auto rects = abut::testing::randomSlicing(n, 10, 10, rng);
        const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 10, 10);
        const LabelingResult r = computeRegularEdgeLabeling(x);
        const SegmentStructure s = maximalSegments(x, r.labeling);
        DualWeights w;
        w.minWidth.assign(x.graph.vertexCount(), 0.5);
        w.minDepth.assign(x.graph.vertexCount(), 0.5);
        w.minWall.resize(s.walls.size());
        for (double& m : w.minWall) m = (rng() % 2) ? 0.9 : 0.0; // a door's width, common practice
        const DualLayout l = longestPathLayout(x, s, w);
        QVERIFY(checkRectangularDual(x, l.rects, l.width, l.depth).ok);
        for (std::size_t k = 0; k < s.walls.size(); ++k) {
            const auto& wall = s.walls[k];
            const Rect &a = l.rects[wall.u], &b = l.rects[wall.v];
            const double shared = wall.vertical ? std::min(a.y1, b.y1) - std::max(a.y0, b.y0)
                                                : std::min(a.x1, b.x1) - std::max(a.x0, b.x0);
            QVERIFY(shared >= std::max(w.minWall[k], w.anyWall) - 1e-9);
        }
    }
}

void TestLabelingDual::samplesGiveValidPlans_data() {
    QTest::addColumn<QString>("file");
    for (const char* f : {"family-house", "clinic", "office-floor", "four-way-studio"}) QTest::newRow(f) << f;
}

void TestLabelingDual::samplesGiveValidPlans() {
    QFETCH(QString, file);
    const LoadResult l = loadProject((QString(ABUT_SAMPLES "/") + file + ".abut.json").toStdString());
    QVERIFY(l.ok());
    // Validity, not quality, is checked here (the plan search's own tests
    // and the acceptance run measure quality): a short search, one thread,
    // no annealing of labelings, so that sanitizer builds finish in time.
    PlanOptions o;
    o.threads = 1;
    o.searchMoves = 20000;
    o.variantFlips = 3;
    o.improvedCandidates = 0;
    o.relaxations = false;
    const Plan plan = buildPlan(l.brief, o);
    QVERIFY2(plan.status != PlanStatus::Internal, plan.summary.c_str());
    QVERIFY(!plan.variants.empty());
    for (const PlanVariant& v : plan.variants)
        QCOMPARE(checkVariant(l.brief, plan.footprint, v).problem, std::string());
}

QTEST_GUILESS_MAIN(TestLabelingDual)
#include "tst_labeling_dual.moc"
