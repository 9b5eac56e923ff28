// SPDX-License-Identifier: MIT
// Abut's benchmarks. Prints one "name: value unit" line per figure.
//   abut_bench            all sections
//   abut_bench pipeline   extended graph → labeling → dual, against Boost's
//                         Boyer–Myrvold planarity test on the same graph
//   abut_bench augment    brief → extended graph
//   abut_bench labelings  enumeration speed against one checker pass
//   abut_bench sizing     re-sizing time, cold and warm
//   abut_bench input      big input: a CSV adjacency matrix of 300 and 1,000
//                         rooms imported; the brief check (no search) of
//                         chains of 2,000 and 10,000 rooms
//   abut_bench gui        the editor's worst event-loop delay while it
//                         computes the plans of the largest sample
//                         (offscreen; only when built with the editor)
// Targets (not enforced here): linear scaling, and the pipeline at most 3× the
// planarity test.
#include "augment/augment.h"
#include "io/csv_import.h"
#include "plan/brief_check.h"
#include "dual/rectangular_dual.h"
#include "label/labeling_lattice.h"
#include "size/segment_sizing.h"
#include "label/regular_edge_labeling.h"
#include "../support/random_briefs.h"
#include "../support/random_tilings.h"

#include <boost/graph/adjacency_list.hpp>
#include <boost/graph/boyer_myrvold_planar_test.hpp>

#include <string>

#ifdef ABUT_BENCH_GUI
#include "main_window.h"

#include <QApplication>
#include <QElapsedTimer>
#include <QTemporaryDir>
#include <QTimer>
#endif

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <string>

using namespace abut;
using Clock = std::chrono::steady_clock;

namespace {

double seconds(Clock::time_point a, Clock::time_point b) {
    return std::chrono::duration<double>(b - a).count();
}

// Best of `repeats` runs, in seconds.
template <typename F>
double bestOf(int repeats, F&& f) {
    double best = 1e300;
    for (int i = 0; i < repeats; ++i) {
        const auto t0 = Clock::now();
        f();
        best = std::min(best, seconds(t0, Clock::now()));
    }
    return best;
}

void pipeline() {
    for (int n : {1000, 10000, 100000}) {
        std::mt19937 rng(n);
        const auto rects = abut::testing::randomSlicing(n, 100.0, 100.0, rng);
        const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 100.0, 100.0);
        const int repeats = n >= 100000 ? 3 : 10;
        double checksum = 0;
        const double ours = bestOf(repeats, [&] {
            const LabelingResult r = computeRegularEdgeLabeling(x);
            const SegmentStructure s = maximalSegments(x, r.labeling);
            const DualLayout l = longestPathLayout(x, s, {});
            checksum += l.width;
        });
        using G = boost::adjacency_list<boost::vecS, boost::vecS, boost::undirectedS,
                                        boost::property<boost::vertex_index_t, int>,
                                        boost::property<boost::edge_index_t, int>>;
        G g(x.graph.vertexCount());
        for (const auto& [u, v] : x.graph.edgeList()) boost::add_edge(u, v, g);
        int k = 0;
        for (auto [it, end] = boost::edges(g); it != end; ++it) boost::put(boost::edge_index, g, *it, k++);
        const double planarity = bestOf(repeats, [&] {
            checksum += boost::boyer_myrvold_planarity_test(g) ? 1 : 0;
        });
        std::printf("pipeline_time_per_room_n%d: %.3f us\n", n, 1e6 * ours / n);
        std::printf("planarity_time_per_room_n%d: %.3f us\n", n, 1e6 * planarity / n);
        std::printf("pipeline_over_planarity_n%d: %.2f x\n", n, ours / planarity);
        if (checksum < 0) std::printf("%f\n", checksum);
    }
}

// Brief → extended graph on random briefs (stacked triangulations, 70 % of
// edges kept, 20 % facade wishes).
void augment() {
    for (int n : {50, 100, 200, 400, 800}) {
        std::mt19937 rng(n);
        abut::testing::RandomBriefOptions o;
        o.rooms = n;
        const Brief b = abut::testing::randomBrief(o, rng);
        const double t = bestOf(3, [&] { buildExtendedGraph(b); });
        std::printf("augment_time_per_room_n%d: %.1f us\n", n, 1e6 * t / n);
    }
}

// Labelings per second on extended graphs of random tilings, and the time
// per labeling against one O(m) checker pass on the same graph (target: well
// below 1, i.e. amortised cost below linear).
void labelings() {
    for (int n : {20, 50, 200}) {
        std::mt19937 rng(100 + n);
        const auto rects = abut::testing::randomSlicing(n, 100.0, 100.0, rng);
        const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 100.0, 100.0);
        const RegularEdgeLabeling first = computeRegularEdgeLabeling(x).labeling;
        const std::uint64_t cap = 20000;
        std::uint64_t listed = 0;
        const double t = bestOf(3, [&] {
            LabelingEnumerator e(x, first);
            listed = 0;
            while (listed < cap && e.next()) ++listed;
        });
        const double check = bestOf(20, [&] { checkRegularEdgeLabeling(x, first); });
        std::printf("labelings_listed_n%d: %llu count\n", n, static_cast<unsigned long long>(listed));
        std::printf("labelings_per_second_n%d: %.0f 1/s\n", n, listed / t);
        std::printf("labeling_time_over_check_n%d: %.2f x\n", n, (t / listed) / check);
    }
}

// Sizing a layout read off a random tiling: from scratch, and warm (the
// previous solution, one target nudged by 5 %, as during a drag). Target:
// 100 rooms warm within a quarter of a 60 Hz frame (about 4 ms).
void sizing() {
    for (int n : {10, 30, 100, 300}) {
        std::mt19937 rng(900 + n);
        const auto rects = abut::testing::randomSlicing(n, 40.0, 30.0, rng);
        const ExtendedGraph x = abut::testing::extendedGraphOfTiling(rects, 40.0, 30.0);
        Brief b;
        for (int i = 0; i < n; ++i) {
            Room r;
            r.id = "t" + std::to_string(i);
            r.area = rects[i].area();
            b.rooms.push_back(r);
        }
        SizingOptions o;
        o.anyWall = o.doorWidth = 1e-4;
        SizingProblem p(b, x, abut::testing::labelingOfTiling(x, rects), Footprint{40.0, 30.0}, o);
        SizingResult cold;
        const double tCold = bestOf(5, [&] { cold = p.solve(); });
        int k = 0;
        const double tWarm = bestOf(5, [&] {
            p.setTargetArea(k % n, b.rooms[k % n].area * 1.05);
            p.solve(&cold);
            p.setTargetArea(k % n, b.rooms[k % n].area);
            ++k;
        });
        std::printf("sizing_cold_n%d: %.3f ms\n", n, 1e3 * tCold);
        std::printf("sizing_warm_n%d: %.3f ms\n", n, 1e3 * tWarm);
    }
}

} // namespace

#ifdef ABUT_BENCH_GUI
// A 2 ms timer on the UI thread records how late it fires while the editor
// opens the largest sample and computes its plans in the background. The
// worst delay is what a planner would feel as a freeze.
void guiLatency(int argc, char** argv) {
    qputenv("QT_QPA_PLATFORM", "offscreen");
    QApplication app(argc, argv);
    QTemporaryDir recovery;
    abut::gui::MainWindowOptions o;
    o.recoveryFolder = recovery.path();
    o.autosaveSeconds = 0;
    abut::gui::MainWindow w(o);
    w.resize(1400, 900);
    w.show();
    QElapsedTimer clock;
    clock.start();
    qint64 last = clock.elapsed(), worst = 0;
    std::vector<qint64> gaps;
    QTimer tick;
    tick.setInterval(2);
    QObject::connect(&tick, &QTimer::timeout, [&] {
        const qint64 now = clock.elapsed();
        gaps.push_back(now - last);
        worst = std::max(worst, now - last);
        last = now;
    });
    tick.start();
    const auto t0 = Clock::now();
    w.openProject(QStringLiteral(ABUT_SAMPLES "/office-floor.abut.json"));
    last = clock.elapsed();
    const qint64 openMs = clock.elapsed();
    double firstPlan = -1; // until the first variant is on show (aim: 0.5 s)
    while (w.planning() || w.checking()) {
        QCoreApplication::processEvents(QEventLoop::AllEvents, 5);
        if (firstPlan < 0 && w.hasCurrentVariant()) firstPlan = seconds(t0, Clock::now());
    }
    const double total = seconds(t0, Clock::now());
    std::printf("gui/first_plan_office_floor: %.2f s\n", firstPlan);
    std::sort(gaps.begin(), gaps.end());
    const qint64 p99 = gaps.empty() ? 0 : gaps[gaps.size() * 99 / 100];
    std::printf("gui/open_office_floor: %lld ms\n", static_cast<long long>(openMs));
    std::printf("gui/plans_office_floor: %.2f s\n", total);
    std::printf("gui/event_loop_worst_delay: %lld ms\n", static_cast<long long>(worst));
    std::printf("gui/event_loop_p99_delay: %lld ms\n", static_cast<long long>(p99));
}
#endif

// Big input stays near-linear: an n × n matrix (every room beside the next
// two, as a corridor's rooms are), and a chain of rooms checked without a search.
void input() {
    for (int n : {300, 1000}) {
        std::string csv = "room";
        for (int c = 0; c < n; ++c) csv += ",R" + std::to_string(c);
        csv += "\n";
        for (int r = 0; r < n; ++r) {
            csv += "R" + std::to_string(r);
            for (int c = 0; c < n; ++c) csv += std::abs(r - c) == 1 || std::abs(r - c) == 2 ? ",D" : ",";
            csv += "\n";
        }
        Brief into;
        std::size_t adjacencies = 0;
        const double t = bestOf(1, [&] { adjacencies = importCsv(csv, "bench.csv", into).brief.adjacencies.size(); });
        std::printf("input/csv_matrix_%d: %.3f s (%zu adjacencies, %zu kB)\n", n, t, adjacencies, csv.size() / 1024);
    }
    for (int n : {2000, 10000}) {
        Brief b;
        for (int k = 0; k < n; ++k) {
            Room r;
            r.id = "r" + std::to_string(k);
            r.area = 12;
            b.rooms.push_back(r);
            if (k > 0) b.adjacencies.push_back(Adjacency{"r" + std::to_string(k - 1), r.id, AdjacencyKind::Door, Priority::Must});
        }
        b.footprint = Footprint{std::sqrt(12.0 * n), std::sqrt(12.0 * n), {}};
        BriefCheckOptions o;
        o.searchMoves = -1; // the check itself, no search
        const double t = bestOf(1, [&] { checkBrief(b, o); });
        std::printf("input/check_chain_%d: %.3f s\n", n, t);
    }
}

int main(int argc, char** argv) {
    const std::string only = argc > 1 ? argv[1] : "";
    if (only.empty() || only == "pipeline") pipeline();
    if (only.empty() || only == "augment") augment();
    if (only.empty() || only == "labelings") labelings();
    if (only.empty() || only == "sizing") sizing();
    if (only.empty() || only == "input") input();
#ifdef ABUT_BENCH_GUI
    if (only.empty() || only == "gui") guiLatency(argc, argv);
#endif
    return 0;
}
