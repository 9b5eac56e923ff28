// SPDX-License-Identifier: MIT
// Footprints that are not one rectangle and rooms fixed in place: the
// outline (the shoelace formula for a polygon's area, Gauss; an outer loop
// counter-clockwise and a courtyard clockwise have areas of opposite sign),
// one-piece checks, facades on cut-outs, the edits that set them, and plans
// of the L-shaped sample that keep the core exactly where it is fixed and
// nothing on the cut-out. The plans pass the stage checkers (buildPlan
// reports an internal error otherwise).
#include "brief/brief_edit.h"
#include "brief/footprint_check.h"
#include "io/project_io.h"
#include "plan/plan_builder.h"
#include "plan/unmet.h"
#include "search/requirements.h"

#include <QtTest>

using namespace abut;

namespace {

double shoelace(const OutlineLoop& l) {
    double a = 0;
    for (std::size_t i = 0; i < l.size(); ++i) {
        const auto& [x0, y0] = l[i];
        const auto& [x1, y1] = l[(i + 1) % l.size()];
        a += x0 * y1 - x1 * y0;
    }
    return a / 2;
}

Brief twoRooms(double w, double d) {
    Brief b;
    b.footprint = Footprint{w, d, {}};
    b.rooms.push_back(Room{"a", "A", w * d / 2});
    b.rooms.push_back(Room{"b", "B", w * d / 2});
    return b;
}

} // namespace

class TestShaped : public QObject {
    Q_OBJECT
private slots:
    void outlineOfAnEll() {
        const Footprint fp{24, 18, {{12, 9, 12, 9}}};
        const std::vector<OutlineLoop> loops = footprintOutline(fp);
        QCOMPARE(loops.size(), std::size_t(1));
        QCOMPARE(loops[0].size(), std::size_t(6)); // an L has six corners
        QCOMPARE(shoelace(loops[0]), fp.netArea()); // 24·18 − 12·9 = 324
        QCOMPARE(fp.netArea(), 324.0);
        QVERIFY(isConnected(fp));
    }

    void outlineOfACourtyard() {
        const Footprint fp{20, 16, {{6, 5, 8, 6}}};
        const std::vector<OutlineLoop> loops = footprintOutline(fp);
        QCOMPARE(loops.size(), std::size_t(2));
        QCOMPARE(shoelace(loops[0]), 320.0); // the outside, counter-clockwise
        QCOMPARE(shoelace(loops[1]), -48.0); // the courtyard, clockwise
        QVERIFY(isConnected(fp));
    }

    void cutOutThatSplitsIsNotOnePiece() {
        QVERIFY(!isConnected(Footprint{10, 8, {{4, 0, 2, 8}}}));
        // Two cut-outs meeting at a corner leave two parts touching at a point only.
        QVERIFY(!isConnected(Footprint{10, 10, {{0, 5, 5, 5}, {5, 0, 5, 5}}}));
        QVERIFY(isConnected(Footprint{10, 10, {{0, 6, 4, 4}, {6, 0, 4, 4}}}));
    }

    void largestRectangleBesideCutOutsAndFixedRooms() {
        // Worked by hand: a 10 × 8 footprint less a 3 × 3 corner holds at most
        // 7 × 8 = 56 (beside it) or 10 × 5 = 50 (above it).
        const Footprint fp{10, 8, {}};
        const Placement l = largestFreeRectangle(fp, {{0, 0, 3, 3}});
        QCOMPARE(l.area(), 56.0);
        QCOMPARE(l.x, 3.0);
        QCOMPARE(l.width, 7.0);
        // A courtyard 6..14 × 5..11 in 20 × 16: the widest band is 20 × 5 south of it.
        QCOMPARE(largestFreeRectangle(Footprint{20, 16, {{6, 5, 8, 6}}}).area(), 100.0);
        // Nothing taken: the footprint itself.
        QCOMPARE(largestFreeRectangle(fp).area(), 80.0);
    }

    void roomThatWouldBeLShapedHasNoPlan() {
        // Room A fixed in a corner, B must take the rest: B would be an L,
        // so no rectangular plan exists (a proof, not a search that gave up).
        Brief b;
        b.footprint = Footprint{10, 8, {}};
        Room a{"A", "A", 9};
        a.fixed = Placement{0, 0, 3, 3};
        b.rooms = {a, Room{"B", "B", 71}};
        b.adjacencies.push_back(Adjacency{"A", "B"});
        const std::vector<Diagnostic> problems = footprintProblems(b);
        QVERIFY(std::any_of(problems.begin(), problems.end(), [](const Diagnostic& d) {
            return d.code == DiagnosticCode::NoRectangleFits && d.rooms == std::vector<int>{1} &&
                   d.message.find("L-shaped") != std::string::npos;
        }));
        PlanOptions o;
        o.threads = 1;
        o.timeLimit = 2;
        const Plan p = buildPlan(b, o);
        QCOMPARE(p.status, PlanStatus::NoPlan);
        QVERIFY(p.variants.empty());
        QVERIFY(p.summary.find("L-shaped") != std::string::npos);
    }

    void fixedRoomOnTheOutlineIsHeldOrNoPlan() {
        // Three rooms with one fixed across the footprint: every variant
        // kept holds it exactly; the sizer never moves the outline for it.
        Brief b;
        b.footprint = Footprint{12, 8, {}};
        Room f{"F", "Fixed", 8};
        f.fixed = Placement{4.5, 0, 1, 8};
        b.rooms = {f, Room{"W", "West", 36}, Room{"E", "East", 52}};
        b.adjacencies = {Adjacency{"F", "W"}, Adjacency{"F", "E"}};
        PlanOptions o;
        o.threads = 1;
        o.timeLimit = 3;
        const Plan p = buildPlan(b, o);
        QVERIFY(p.status != PlanStatus::Internal);
        QVERIFY(!p.variants.empty()); // 4.5 × 8, 1 × 8 and 6.5 × 8 side by side meet it exactly
        for (const PlanVariant& v : p.variants) {
            QVERIFY(inPlace(b.rooms[0], v.rooms[0], 1e-6));
            QVERIFY(checkVariant(plannedBrief(b), p.footprint, v).ok);
        }
    }

    void wallOnACutOutIsAFacade() {
        // A room just south of a cut-out faces north there; one beside it faces east.
        Brief b = twoRooms(10, 8);
        b.footprint->cutouts.push_back({6, 4, 4, 4});
        const Brief planned = plannedBrief(b);
        QCOMPARE(planned.rooms.size(), std::size_t(3));
        QVERIFY(planned.rooms[2].cutout && planned.rooms[2].fixed);
        const std::vector<Rect> rects{{0, 0, 6, 8}, {6, 0, 10, 4}, {6, 4, 10, 8}};
        const double tol = 1e-9;
        QVERIFY(facesOutside(planned, *b.footprint, rects, 1, Side::N, tol));
        QVERIFY(facesOutside(planned, *b.footprint, rects, 0, Side::E, tol));
        QVERIFY(facesOutside(planned, *b.footprint, rects, 0, Side::N, tol)); // the footprint's own north side
        QVERIFY(!facesOutside(planned, *b.footprint, rects, 1, Side::W, tol));
        // plannedBrief twice adds nothing more.
        QCOMPARE(plannedBrief(planned).rooms.size(), std::size_t(3));
    }

    void editsRefuseWhatCannotBeBuilt() {
        Brief b = twoRooms(10, 8);
        QVERIFY(setBriefField(b, BriefField::Cutouts, "6 4 4 4").ok());
        QCOMPARE(b.footprint->cutouts.size(), std::size_t(1));
        QCOMPARE(cutoutsText(b.footprint->cutouts), std::string("6 4 4 4"));
        Brief before = b;
        EditResult r = setBriefField(b, BriefField::Cutouts, "4 0 2 8");
        QVERIFY(!r.ok());
        QVERIFY2(r.message.find("split") != std::string::npos, r.message.c_str());
        r = setBriefField(b, BriefField::Cutouts, "6 4 4");
        QVERIFY(!r.ok() && r.message.find("four numbers") != std::string::npos);
        b = before;
        // Decimal commas as a planner types them.
        QVERIFY(setBriefField(b, BriefField::Cutouts, "6,5 4 3,5 4").ok());
        QCOMPARE(b.footprint->cutouts[0].x, 6.5);
        // A footprint narrowed past a cut-out is refused.
        r = setBriefField(b, BriefField::FootprintWidth, "9");
        QVERIFY(!r.ok() && r.message.find("reaches past") != std::string::npos);
        // Fixing a room over the cut-out or over another fixed room is refused.
        QVERIFY(!setRoomFixed(b, 0, Placement{5, 3, 3, 3}).ok());
        QVERIFY(setRoomFixed(b, 0, Placement{0, 0, 3, 3}).ok());
        r = setRoomFixed(b, 1, Placement{2, 2, 2, 2});
        QVERIFY(!r.ok() && r.message.find("two rooms cannot share floor") != std::string::npos);
        QVERIFY(!b.rooms[1].fixed);
        QVERIFY(setRoomFixed(b, 0, std::nullopt).ok());
        QVERIFY(!b.rooms[0].fixed);
    }

    void fixedRoomOffItsTargetIsNamed() {
        Brief b = twoRooms(10, 8);
        b.rooms[0].fixed = Placement{0, 0, 4, 4}; // 16 m² for a target of 40
        const std::vector<Diagnostic> d = footprintProblems(b);
        QVERIFY(std::any_of(d.begin(), d.end(), [](const Diagnostic& x) { return x.code == DiagnosticCode::FixedOffTarget; }));
    }

    void sampleKeepsItsCoreAndItsCutOut() {
        const LoadResult l = loadProject(ABUT_SAMPLES "/l-shaped-studio.abut.json");
        QVERIFY(l.ok());
        const Brief& b = l.brief;
        PlanOptions o;
        o.threads = 1;
        o.timeLimit = 30;
        o.variants = 4;
        const Plan plan = buildPlan(b, o);
        QVERIFY2(plan.status == PlanStatus::Ok, plan.summary.c_str());
        QVERIFY(!plan.variants.empty());
        const Brief planned = plannedBrief(b);
        const int core = b.roomIndex("core");
        const Placement f = *b.rooms[core].fixed;
        for (const PlanVariant& v : plan.variants) {
            QCOMPARE(v.rooms.size(), planned.rooms.size());
            const Rect& r = v.rooms[core];
            QVERIFY(std::abs(r.x0 - f.x) < 1e-6 && std::abs(r.y0 - f.y) < 1e-6 &&
                    std::abs(r.x1 - f.x - f.width) < 1e-6 && std::abs(r.y1 - f.y - f.depth) < 1e-6);
            // Nothing stands on the cut-out: no room or spare space overlaps it.
            const Placement& c = b.footprint->cutouts[0];
            for (std::size_t i = 0; i < b.rooms.size(); ++i)
                QVERIFY(!overlaps(Placement{v.rooms[i].x0, v.rooms[i].y0, v.rooms[i].width(), v.rooms[i].depth()}, c, 1e-6));
            for (const Rect& s : v.spaces)
                QVERIFY(!overlaps(Placement{s.x0, s.y0, s.width(), s.depth()}, c, 1e-6));
            QVERIFY(checkVariant(planned, plan.footprint, v).ok);
        }
        const PlanVariant& best = plan.variants.front();
        QVERIFY(best.misses.usable());
        QVERIFY(unmetRequirements(b, plan.footprint, best).empty());
    }
};

QTEST_GUILESS_MAIN(TestShaped)
#include "tst_shaped.moc"
