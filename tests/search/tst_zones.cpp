// SPDX-License-Identifier: MIT
// Zones (search/zones.h) and planning by zones (search/detail/zone_plan.h):
// hand-made briefs of the kinds planners bring — suites on a corridor in two
// pieces, flats whose rooms open on their halls, a ring of corridors round a
// block of stores, rooms the planner puts in a zone — formed into the zones a
// planner would draw; every room in exactly one zone; a run laid out as one
// line meets every door of a double-loaded corridor by construction; a zone
// plan is a tiling over every room.
#include "search/detail/cost.h"
#include "search/detail/problem.h"
#include "search/detail/zone_plan.h"
#include "search/plan_search.h"
#include "search/zones.h"

#include "../support/search_fixtures.h"

#include <QtTest>

using namespace abut;
using namespace abut::testing;

namespace {

Room circulation(const std::string& id, double area) {
    Room r = room(id, area);
    r.category = "circulation";
    return r;
}

// A corridor in two pieces, `per` suites on each (an entry on the corridor,
// a bathroom and a guest room behind it, the guest room on the facade).
Brief suites(int per) {
    Brief b;
    const double w = 2 * per * 4.0, d = 2 * 8.0 + 2.0;
    b.footprint = Footprint{w, d, {}};
    b.rooms = {circulation("c1", w), circulation("c2", w)};
    b.adjacencies.push_back(adjacency("c1", "c2"));
    for (int k = 0; k < 4 * per; ++k) {
        const std::string n = std::to_string(k);
        Room e = circulation("entry" + n, 4 * 2.5 * 0.4);
        Room bath = room("bath" + n, 4 * 2.5 * 0.6);
        Room guest = room("guest" + n, 4 * 5.5);
        guest.facade.add(k % 2 ? Side::N : Side::S);
        b.rooms.insert(b.rooms.end(), {e, bath, guest});
        b.adjacencies.push_back(adjacency(k < 2 * per ? "c1" : "c2", "entry" + n));
        b.adjacencies.push_back(adjacency("entry" + n, "bath" + n));
        b.adjacencies.push_back(adjacency("entry" + n, "guest" + n));
    }
    return b;
}

bool partition(const ZoneTree& t, std::size_t rooms) {
    std::vector<int> seen(rooms, 0);
    for (std::size_t z = 0; z < t.zones.size(); ++z)
        for (int r : t.zones[z].rooms) {
            if (++seen[r] != 1 || t.zoneOf[r] != static_cast<int>(z)) return false;
        }
    return std::all_of(seen.begin(), seen.end(), [](int n) { return n == 1; });
}

// A floor of suites with its search problem and zones.
struct SuiteFloor {
    explicit SuiteFloor(int per)
        : b(suites(per)), fp(*b.footprint), p(detail::makeProblem(b, fp, SearchOptions{})), t(formZones(b)) {}
    Brief b;
    Footprint fp;
    detail::SearchProblem p;
    ZoneTree t;
};

// The rectangles `t` gives the blocks of `p`.
std::vector<Rect> layoutOf(const FloorTree& t, const detail::SearchProblem& p) {
    std::vector<Rect> rects;
    FloorTree::Scratch scratch;
    t.layout(p.area, p.outer, rects, scratch);
    return rects;
}

} // namespace

class TestZones : public QObject {
    Q_OBJECT
private slots:
    void suitesOnACorridorInPieces() {
        const Brief b = suites(3);
        const ZoneTree t = formZones(b);
        QVERIFY(partition(t, b.rooms.size()));
        QVERIFY(t.layered());
        // The two pieces are one run (the floor, a single zone), each suite a zone inside it.
        QCOMPARE(t.zones[0].run.size(), std::size_t(2));
        QCOMPARE(t.zones[0].zones.size(), std::size_t(12));
        for (int z : t.zones[0].zones) {
            QCOMPARE(t.zones[z].rooms.size(), std::size_t(3));
            QVERIFY(b.rooms[t.zones[z].hub].id.rfind("entry", 0) == 0);
        }
    }

    void flatsNestInTheirCorridor() {
        Brief b;
        b.footprint = Footprint{40, 20, {}};
        b.rooms = {circulation("corridor", 60)};
        for (int f = 0; f < 4; ++f) {
            const std::string h = "hall" + std::to_string(f);
            b.rooms.push_back(circulation(h, 8));
            b.adjacencies.push_back(adjacency("corridor", h));
            for (const char* kind : {"living", "kitchen", "bath", "bed"}) {
                const std::string id = h + kind;
                b.rooms.push_back(room(id, 15));
                b.adjacencies.push_back(adjacency(h, id));
            }
        }
        const ZoneTree t = formZones(b);
        QVERIFY(partition(t, b.rooms.size()));
        // The floor is the corridor's zone; a flat (its hall and four rooms) a zone inside it.
        QCOMPARE(b.rooms[t.zones[0].hub].id, std::string("corridor"));
        QCOMPARE(t.zones[0].zones.size(), std::size_t(4));
        for (int z : t.zones[0].zones) QCOMPARE(t.zones[z].rooms.size(), std::size_t(5));
    }

    void theBlockARingRunsRound() {
        // Four corridors in a ring; patient rooms (a third wish a facade) on
        // the outer sides, stores (none do) inside.
        Brief b;
        b.footprint = Footprint{40, 30, {}};
        const char* ring[] = {"n", "e", "s", "w"};
        for (const char* c : ring) b.rooms.push_back(circulation(c, 30));
        for (int k = 0; k < 4; ++k) b.adjacencies.push_back(adjacency(ring[k], ring[(k + 1) % 4]));
        for (int k = 0; k < 12; ++k) {
            Room pat = room("pat" + std::to_string(k), 18);
            pat.category = "sleeping";
            if (k % 3 == 0) pat.facade.anySide = true;
            Room store = room("store" + std::to_string(k), 12);
            store.category = "service";
            b.rooms.insert(b.rooms.end(), {pat, store});
            b.adjacencies.push_back(adjacency(ring[k % 4], pat.id));
            b.adjacencies.push_back(adjacency(ring[k % 4], store.id));
        }
        const ZoneTree t = formZones(b);
        QVERIFY(partition(t, b.rooms.size()));
        int inner = -1;
        for (int z = 1; z < static_cast<int>(t.zones.size()); ++z)
            if (t.zones[z].hub < 0 && !t.zones[z].rooms.empty() && b.rooms[t.zones[z].rooms[0]].id.rfind("store", 0) == 0)
                inner = z;
        QVERIFY(inner > 0);
        QCOMPARE(t.zones[inner].rooms.size(), std::size_t(12)); // every store, no patient room
    }

    void thePlannersZonesWin() {
        Brief b = suites(2);
        for (Room& r : b.rooms)
            if (r.id == "guest0" || r.id == "guest5" || r.id == "bath3") r.zone = "east wing";
        const ZoneTree t = formZones(b);
        QVERIFY(partition(t, b.rooms.size()));
        const auto named = std::find_if(t.zones.begin(), t.zones.end(), [](const ZoneTree::Zone& z) { return z.name == "east wing"; });
        QVERIFY(named != t.zones.end());
        QCOMPARE(named->rooms.size(), std::size_t(3));
    }

    void aRunLaidOutAsOneLineMeetsItsDoors() {
        const SuiteFloor f(4);
        detail::ZonePlanner planner(f.p, f.t, 1);
        const detail::ZonePlanner::Level l = planner.level(0, f.p.outer);
        QCOMPARE(l.run.size(), std::size_t(2));
        const FloorTree line = detail::ZonePlanner::runStrip(l);
        QVERIFY(line.valid());
        const std::vector<Rect> rects = layoutOf(line, l.problem);
        QVERIFY(tilingProblem(rects, f.fp.width, f.fp.depth).isEmpty());
        // Every suite on its piece with a door-wide wall, the pieces meeting, every facade met.
        QCOMPARE(detail::evaluate(l.problem, rects, nullptr).hard, 0);
    }

    void aZonePlanTilesTheFloor() {
        const SuiteFloor f(5);
        detail::ZonePlanner planner(f.p, f.t, 3);
        planner.plan();
        const FloorTree tree = planner.tree();
        QVERIFY(tree.valid());
        const std::vector<Rect> rects = layoutOf(tree, f.p);
        QVERIFY(tilingProblem(rects, f.fp.width, f.fp.depth).isEmpty());
        QCOMPARE(detail::evaluate(f.p, rects, nullptr).hard, 0); // an easy floor: met as planned
    }
};

QTEST_GUILESS_MAIN(TestZones)
#include "tst_zones.moc"
