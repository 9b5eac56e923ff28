// SPDX-License-Identifier: MIT
// The lattice of regular edge labelings: counts against OEIS, the pinwheel,
// validity and distinctness of everything listed, the cap, the seed, and
// one-sided (area-universal) layouts.
//
// The extended graphs for n = 1..7 rooms are generated independently of the
// enumerator: every tiling of a W × H grid (W + H = n + 1) into n rectangles
// with no point where four meet is a generic rectangulation; every generic
// rectangulation with n rooms has n − 1 maximal segments and so appears on
// such a grid. Distinct (graph, labeling) pairs read off the geometry are the
// rectangulations up to strong equivalence; distinct graphs are the extended
// graphs.
#include "augment/augment.h"
#include "dual/rectangular_dual.h"
#include "label/labeling_lattice.h"
#include "../support/random_briefs.h"
#include "../support/random_tilings.h"

#include <QtTest>

#include <map>
#include <set>

using namespace abut;

namespace {

// Every tiling of a w × h grid into exactly n rectangles, four never meeting
// at a point. Explicit stack: each state fills the first empty cell.
std::vector<std::vector<Rect>> genericTilings(int w, int h, int n) {
    struct State {
        std::vector<int> owner; // cell → rectangle index or -1
        std::vector<Rect> rects;
    };
    std::vector<std::vector<Rect>> out;
    std::vector<State> stack{{std::vector<int>(w * h, -1), {}}};
    while (!stack.empty()) {
        State s = std::move(stack.back());
        stack.pop_back();
        const auto first = std::find(s.owner.begin(), s.owner.end(), -1);
        if (first == s.owner.end()) {
            if (static_cast<int>(s.rects.size()) != n) continue;
            bool generic = true;
            for (int i = 1; i < w && generic; ++i)
                for (int j = 1; j < h && generic; ++j) {
                    const int a = s.owner[(j - 1) * w + i - 1], b = s.owner[(j - 1) * w + i],
                              c = s.owner[j * w + i - 1], d = s.owner[j * w + i];
                    if (a != b && a != c && a != d && b != c && b != d && c != d) generic = false;
                }
            if (generic) out.push_back(s.rects);
            continue;
        }
        if (static_cast<int>(s.rects.size()) >= n) continue;
        const int cell = static_cast<int>(first - s.owner.begin());
        const int x0 = cell % w, y0 = cell / w;
        for (int x1 = x0 + 1; x1 <= w && s.owner[y0 * w + x1 - 1] == -1; ++x1)
            for (int y1 = y0 + 1; y1 <= h; ++y1) {
                bool free = true;
                for (int x = x0; x < x1 && free; ++x) free = s.owner[(y1 - 1) * w + x] == -1;
                if (!free) break;
                State t = s;
                for (int y = y0; y < y1; ++y)
                    for (int x = x0; x < x1; ++x) t.owner[y * w + x] = static_cast<int>(s.rects.size());
                t.rects.push_back({double(x0), double(y0), double(x1), double(y1)});
                stack.push_back(std::move(t));
            }
    }
    return out;
}

// Canonical code of a plane graph rooted at the dart N → E (and of its
// labeling, when given): vertices numbered in breadth-first order, each
// rotation read from the dart it was reached by.
std::vector<int> canonicalCode(const ExtendedGraph& x, const RegularEdgeLabeling* rel) {
    const PlaneGraph& g = x.graph;
    std::vector<int> number(g.vertexCount(), -1), from(g.vertexCount(), -1), queue;
    const int root = x.pole(Side::N);
    number[root] = 0;
    from[root] = x.pole(Side::E);
    queue.push_back(root);
    std::vector<int> code;
    for (std::size_t q = 0; q < queue.size(); ++q) {
        const int v = queue[q];
        const auto& rot = g.neighbours(v);
        const int d = static_cast<int>(rot.size());
        const int start = g.position(v, from[v]);
        code.push_back(-1 - d);
        for (int k = 0; k < d; ++k) {
            const int u = rot[(start + k) % d];
            if (number[u] < 0) {
                number[u] = static_cast<int>(queue.size());
                from[u] = v;
                queue.push_back(u);
            }
            code.push_back(number[u]);
            if (rel) code.push_back(static_cast<int>(rel->at[v][(start + k) % d]));
        }
    }
    return code;
}

} // namespace

class TestLabelingLattice : public QObject {
    Q_OBJECT
private slots:
    void countsMatchOeis_data();
    void countsMatchOeis();
    void pinwheelHasTwoLabelings();
    void listedLabelingsValidAndDistinct();
    void capStopsTheListing();
    void seedChangesOrderNotSet();
    void oneSidedLayouts();
};

void TestLabelingLattice::countsMatchOeis_data() {
    QTest::addColumn<int>("n");
    QTest::addColumn<int>("graphs");
    QTest::addColumn<int>("pairs");
    // OEIS A000139: irreducible triangulations of a 4-gon with n inner
    // vertices, 2(3n)!/((2n+1)!(n+1)!). OEIS A342141: generic rectangulations
    // up to strong equivalence = (extended graph, labeling) pairs.
    const int a000139[] = {1, 2, 6, 22, 91, 408, 1938};
    const int a342141[] = {1, 2, 6, 24, 116, 642, 3938};
    for (int n = 1; n <= 7; ++n) QTest::addRow("n=%d", n) << n << a000139[n - 1] << a342141[n - 1];
}

void TestLabelingLattice::countsMatchOeis() {
    QFETCH(int, n);
    QFETCH(int, graphs);
    QFETCH(int, pairs);
    std::map<std::vector<int>, std::set<std::vector<int>>> rectangulations; // graph → labelings
    std::map<std::vector<int>, ExtendedGraph> representative;
    for (int w = 1; w <= n; ++w) {
        const int h = n + 1 - w;
        for (const auto& rects : genericTilings(w, h, n)) {
            const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, w, h);
            QVERIFY(checkExtendedGraph(x).ok);
            const RegularEdgeLabeling rel = abut::testing::labelingOfTiling(x, rects);
            QVERIFY(checkRegularEdgeLabeling(x, rel).ok);
            const auto key = canonicalCode(x, nullptr);
            rectangulations[key].insert(canonicalCode(x, &rel));
            representative.emplace(key, x);
        }
    }
    QCOMPARE(static_cast<int>(rectangulations.size()), graphs);
    int total = 0, enumerated = 0;
    for (const auto& [key, labelings] : rectangulations) {
        total += static_cast<int>(labelings.size());
        const ExtendedGraph& x = representative.at(key);
        const LabelingResult start = computeRegularEdgeLabeling(x);
        QVERIFY(start.status == LabelingStatus::Ok);
        LabelingEnumerator e(x, start.labeling);
        std::set<std::vector<int>> listed;
        while (const RegularEdgeLabeling* l = e.next()) listed.insert(canonicalCode(x, l));
        // The enumerator lists exactly the labelings the tilings show.
        QCOMPARE(listed, labelings);
        enumerated += static_cast<int>(listed.size());
    }
    QCOMPARE(total, pairs);
    QCOMPARE(enumerated, pairs);
}

void TestLabelingLattice::pinwheelHasTwoLabelings() {
    // The five-room pinwheel's extended graph has exactly 2 labelings (references.md).
    const Brief b = abut::testing::briefFromEdges(5, {{0, 1}, {0, 2}, {0, 3}, {0, 4}, {1, 2}, {2, 3}, {3, 4}, {4, 1}});
    const AugmentResult a = buildExtendedGraph(b);
    const LabelingResult r = computeRegularEdgeLabeling(a.extended);
    QCOMPARE(countLabelings(a.extended, r.labeling, 100), std::uint64_t(2));
}

void TestLabelingLattice::listedLabelingsValidAndDistinct() {
    std::mt19937 rng(55);
    for (int i = 0; i < 150; ++i) {
        const int n = 3 + static_cast<int>(rng() % 16);
        const auto rects = abut::testing::randomSlicing(n, 10, 10, rng);
        const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 10, 10);
        const LabelingResult r = computeRegularEdgeLabeling(x);
        LabelingEnumerator e(x, r.labeling);
        std::set<std::vector<std::vector<EdgeLabel>>> seen;
        while (const RegularEdgeLabeling* l = e.next()) {
            const StageCheck c = checkRegularEdgeLabeling(x, *l);
            QVERIFY2(c.ok, c.problem.c_str());
            QVERIFY(seen.insert(l->at).second);
            if (seen.size() > 5000) break;
        }
    }
}

void TestLabelingLattice::capStopsTheListing() {
    std::mt19937 rng(8);
    const auto rects = abut::testing::randomSlicing(30, 10, 10, rng);
    const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 10, 10);
    const LabelingResult r = computeRegularEdgeLabeling(x);
    const std::uint64_t all = countLabelings(x, r.labeling, 1000000);
    QVERIFY(all > 10);
    QCOMPARE(countLabelings(x, r.labeling, 7), std::uint64_t(7));
}

void TestLabelingLattice::seedChangesOrderNotSet() {
    std::mt19937 rng(9);
    const auto rects = abut::testing::randomSlicing(14, 10, 10, rng);
    const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 10, 10);
    const LabelingResult r = computeRegularEdgeLabeling(x);
    auto listAll = [&](std::uint32_t seed) {
        std::vector<std::vector<std::vector<EdgeLabel>>> out;
        LabelingEnumerator e(x, r.labeling, seed);
        while (const RegularEdgeLabeling* l = e.next()) out.push_back(l->at);
        return out;
    };
    const auto a = listAll(1), b = listAll(1), c = listAll(2);
    QCOMPARE(a, b); // deterministic for a seed
    QCOMPARE(std::set(a.begin(), a.end()), std::set(c.begin(), c.end()));
}

void TestLabelingLattice::oneSidedLayouts() {
    // The pinwheel is one-sided: each segment is a whole side of a room.
    const Brief b = abut::testing::briefFromEdges(5, {{0, 1}, {0, 2}, {0, 3}, {0, 4}, {1, 2}, {2, 3}, {3, 4}, {4, 1}});
    const AugmentResult a = buildExtendedGraph(b);
    const LabelingResult r = computeRegularEdgeLabeling(a.extended);
    QVERIFY(isOneSided(a.extended, r.labeling));
    // Geometric oracle: on a grid realisation where every inner grid line
    // holds exactly one segment (its sides on each side form one unbroken
    // run), the layout is one-sided when one of a line's sides is one room.
    auto singleRun = [](std::vector<std::pair<double, double>> spans) {
        if (spans.empty()) return false;
        std::sort(spans.begin(), spans.end());
        for (std::size_t i = 1; i < spans.size(); ++i)
            if (spans[i].first != spans[i - 1].second) return false;
        return true;
    };
    int compared = 0;
    for (int n = 2; n <= 6; ++n)
        for (int w = 1; w <= n; ++w) {
            const int h = n + 1 - w;
            for (const auto& rects : genericTilings(w, h, n)) {
                bool oneSided = true, clean = true;
                for (int line = 1; line < w; ++line) {
                    std::vector<std::pair<double, double>> west, east;
                    for (const Rect& q : rects) {
                        if (q.x1 == line) west.emplace_back(q.y0, q.y1);
                        if (q.x0 == line) east.emplace_back(q.y0, q.y1);
                    }
                    clean = clean && singleRun(west) && singleRun(east);
                    if (west.size() != 1 && east.size() != 1) oneSided = false;
                }
                for (int line = 1; line < h; ++line) {
                    std::vector<std::pair<double, double>> south, north;
                    for (const Rect& q : rects) {
                        if (q.y1 == line) south.emplace_back(q.x0, q.x1);
                        if (q.y0 == line) north.emplace_back(q.x0, q.x1);
                    }
                    clean = clean && singleRun(south) && singleRun(north);
                    if (south.size() != 1 && north.size() != 1) oneSided = false;
                }
                if (!clean) continue;
                const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, w, h);
                QCOMPARE(isOneSided(x, abut::testing::labelingOfTiling(x, rects)), oneSided);
                ++compared;
            }
        }
    QVERIFY(compared > 100);
}

QTEST_GUILESS_MAIN(TestLabelingLattice)
#include "tst_labeling_lattice.moc"
