// SPDX-License-Identifier: MIT
// One contract, both planning routes (plan/plan_route.h): the plan search and
// the graph-first route run on the same briefs — the samples, hand-made ones
// and seeded random ones — and are held to the same promises, checked
// independently of how each built its variants: every variant's extended
// graph and labeling pass their checkers (checkExtendedGraph,
// checkRegularEdgeLabeling), its rectangles are the rectangular dual of them
// (checkRectangularDual) and tile the footprint (checkVariant); everything
// it misses is reported (its counts, dropped adjacencies and unmet facades
// equal the one measure's of its rectangles, recomputed here); and a second
// run with the same seed and budget gives the same rectangles.
#include "augment/augment.h"
#include "dual/rectangular_dual.h"
#include "io/project_io.h"
#include "label/regular_edge_labeling.h"
#include "plan/plan_route.h"
#include "plan/unmet.h"
#include "search/requirements.h"

#include "../support/random_briefs.h"

#include <QtTest>

using namespace abut;

namespace {

struct Case {
    std::string name;
    Brief brief; // as planned
};

std::vector<Case> cases() {
    std::vector<Case> out;
    for (const char* sample : {"family-house", "clinic", "office-floor", "l-shaped-studio", "four-way-studio"}) {
        const LoadResult l = loadProject(std::string(ABUT_SAMPLES) + "/" + sample + ".abut.json");
        if (l.ok()) out.push_back({sample, plannedBrief(l.brief)});
    }
    // A pinwheel: five rooms no straight cut separates (from memory: the
    // smallest non-slicing floorplan).
    Brief wheel = testing::briefFromEdges(5, {{0, 4}, {1, 4}, {2, 4}, {3, 4}, {0, 1}, {1, 2}, {2, 3}, {3, 0}});
    wheel.footprint = Footprint{10, 10, {}};
    for (Room& r : wheel.rooms) r.area = 20;
    out.push_back({"pinwheel", wheel});
    std::mt19937 rng(25);
    for (int k = 0; k < 40; ++k) {
        testing::RandomBriefOptions o;
        o.rooms = 3 + k % 14;
        Brief b = testing::randomBrief(o, rng);
        double area = 0;
        for (const Room& r : b.rooms) area += r.area;
        b.footprint = Footprint{std::sqrt(area * 1.3), std::sqrt(area / 1.3), {}};
        out.push_back({"random " + std::to_string(k), b});
    }
    return out;
}

PlanOptions budget() {
    PlanOptions o;
    o.threads = 1;
    o.seed = 3;
    o.searchMoves = 20000;
    o.flipBudget = 60;
    o.variants = 4;
    return o;
}

PlanRouteResult runRoute(const PlanRoute& route, const Brief& b, const AugmentResult& aug) {
    const PlanOptions o = budget();
    PlanRouteContext c{b, aug, o, nullptr, b.effectiveFootprint(), 0, {}};
    return route.run(c);
}

// Empty when the variant keeps the contract, else what it breaks.
std::string breach(const Brief& b, const Footprint& fp, const PlanVariant& v) {
    if (const StageCheck c = checkExtendedGraph(v.extended); !c.ok) return "extended graph: " + c.problem;
    if (const StageCheck c = checkRegularEdgeLabeling(v.extended, v.labeling); !c.ok) return "labeling: " + c.problem;
    std::vector<Rect> perVertex = vertexRects(v);
    if (const StageCheck c = checkRectangularDual(v.extended, perVertex, fp.width, fp.depth); !c.ok)
        return "dual: " + c.problem;
    if (const StageCheck c = checkVariant(b, fp, v); !c.ok) return "tiling: " + c.problem;
    const RequirementReport measured = measureRequirements(b, fp, v.rooms);
    const RequirementMisses& m = measured.counts;
    if (m.area != v.misses.area || m.minWidth != v.misses.minWidth || m.maxAspect != v.misses.maxAspect ||
        m.must != v.misses.must || m.should != v.misses.should || m.facade != v.misses.facade || m.fixed != v.misses.fixed)
        return "misses differ from the measure's";
    std::vector<int> dropped, facades;
    for (const Miss& miss : measured.misses) {
        if (miss.adjacency >= 0) dropped.push_back(miss.adjacency);
        if (miss.kind == RequirementKind::Facade) facades.push_back(miss.room);
    }
    std::sort(dropped.begin(), dropped.end());
    if (dropped != v.dropped) return "dropped adjacencies differ from the measure's";
    if (facades != v.unmetFacade) return "unmet facades differ from the measure's";
    if (v.sized && v.misses.usable() != unmetRequirements(b, fp, v).empty())
        return "usable, yet unmet lists something (or the reverse)";
    return {};
}

} // namespace

class TestPlanRoutes : public QObject {
    Q_OBJECT
private slots:
    void everyRouteKeepsTheContract_data() {
        QTest::addColumn<int>("route");
        QTest::newRow("plan search") << 0;
        QTest::newRow("graph-first route") << 1;
    }
    void everyRouteKeepsTheContract() {
        QFETCH(int, route);
        const std::unique_ptr<PlanRoute> r = route == 0 ? makeSearchRoute() : makeGraphFirstRoute(true);
        int variants = 0, briefs = 0;
        for (const Case& c : cases()) {
            const AugmentResult aug = buildExtendedGraph(c.brief);
            if (aug.status == AugmentStatus::Empty || aug.status == AugmentStatus::Internal) continue;
            const PlanRouteResult one = runRoute(*r, c.brief, aug);
            QVERIFY2(one.status != PlanRouteResult::Status::Internal, qPrintable(QString::fromStdString(c.name + ": " + one.problem)));
            ++briefs;
            const Footprint fp = c.brief.effectiveFootprint();
            for (const PlanVariant& v : one.variants) {
                const std::string bad = breach(c.brief, fp, v);
                QVERIFY2(bad.empty(), qPrintable(QString::fromStdString(c.name + ": " + bad)));
                ++variants;
            }
            // The same seed and budget, the same variants.
            const PlanRouteResult two = runRoute(*r, c.brief, aug);
            QCOMPARE(two.variants.size(), one.variants.size());
            for (std::size_t k = 0; k < one.variants.size(); ++k)
                for (std::size_t i = 0; i < one.variants[k].rooms.size(); ++i) {
                    const Rect &a = one.variants[k].rooms[i], &b = two.variants[k].rooms[i];
                    QVERIFY2(a.x0 == b.x0 && a.y0 == b.y0 && a.x1 == b.x1 && a.y1 == b.y1, c.name.c_str());
                }
        }
        QVERIFY(briefs >= 40);
        QVERIFY(variants >= 40);
        qInfo("%s: %d briefs, %d variants checked", r->name(), briefs, variants);
    }

    // The contract is checked by PlanRoute::run itself: a route that returns
    // a broken variant reports an internal error instead.
    void aBrokenVariantIsAnInternalError() {
        struct Broken : PlanRoute {
            const char* name() const override { return "broken route"; }
            PlanRouteResult doRun(const PlanRouteContext& c) const override {
                PlanRouteResult r = makeSearchRoute()->run(c);
                if (!r.variants.empty()) r.variants.front().rooms.front().x1 += 0.5; // overlaps its neighbour
                return r;
            }
        } broken;
        Brief b = testing::briefFromEdges(4, {{0, 1}, {1, 2}, {2, 3}});
        b.footprint = Footprint{8, 5, {}};
        for (Room& r : b.rooms) r.area = 10;
        const AugmentResult aug = buildExtendedGraph(b);
        const PlanRouteResult r = runRoute(broken, b, aug);
        QCOMPARE(r.status, PlanRouteResult::Status::Internal);
        QVERIFY(r.variants.empty());
        QVERIFY(r.problem.find("broken route") != std::string::npos);
    }
};

QTEST_GUILESS_MAIN(TestPlanRoutes)
#include "tst_plan_routes.moc"
