// SPDX-License-Identifier: MIT
// The embed stage: Boyer–Myrvold planarity with its Kuratowski witness
// (checked by Boost's own is_kuratowski_subgraph, a reference independent of
// the embedding code), Euler's formula on maximal planar graphs, and the
// straight-line drawing of the tidy-up (no two edges cross, checked with
// Qt's QLineF intersection, independent of core).
#include "embed/planar_embedding.h"
#include "brief/brief_edit.h"
#include "embed/straight_line_drawing.h"
#include "io/project_io.h"
#include "../support/random_briefs.h"

#include <boost/graph/adjacency_list.hpp>
#include <boost/graph/boyer_myrvold_planar_test.hpp>
#include <boost/graph/is_kuratowski_subgraph.hpp>

#include <QLineF>
#include <QtTest>

#include <random>
#include <set>

using namespace abut;
using abut::testing::completeGraph;

namespace {

std::vector<std::pair<int, int>> completeBipartite33() {
    std::vector<std::pair<int, int>> e;
    for (int i = 0; i < 3; ++i)
        for (int j = 3; j < 6; ++j) e.emplace_back(i, j);
    return e;
}

// Crossings checked with Qt's segment intersection, independent of core's
// own crossing test: proper crossings, and a room lying on another's line.
int crossingsByQt(const Brief& b, const std::vector<SketchPoint>& p, const std::vector<int>& skip) {
    std::vector<QLineF> lines;
    std::vector<std::pair<int, int>> ends;
    for (std::size_t i = 0; i < b.adjacencies.size(); ++i) {
        if (std::count(skip.begin(), skip.end(), int(i))) continue;
        const int u = b.roomIndex(b.adjacencies[i].a), v = b.roomIndex(b.adjacencies[i].b);
        lines.emplace_back(QPointF(p[u].x, p[u].y), QPointF(p[v].x, p[v].y));
        ends.emplace_back(u, v);
    }
    int crossings = 0;
    for (std::size_t i = 0; i < lines.size(); ++i)
        for (std::size_t j = i + 1; j < lines.size(); ++j) {
            const auto [a, b2] = ends[i];
            const auto [c, d] = ends[j];
            if (a == c || a == d || b2 == c || b2 == d) continue;
            QPointF at;
            if (lines[i].intersects(lines[j], &at) == QLineF::BoundedIntersection) ++crossings;
        }
    return crossings;
}

} // namespace

class TestEmbed : public QObject {
    Q_OBJECT
private slots:
    void kuratowskiWitness_data();
    void kuratowskiWitness();
    void maximalPlanarEdgeCount();
    void droppingTheCheapestLeavesAPlanarGraph();

    // The tidy-up's straight-line drawing.
    void tidyDrawsSamplesWithoutCrossings_data() {
        QTest::addColumn<QString>("sample");
        for (const char* s : {"family-house", "clinic", "office-floor"}) QTest::newRow(s) << s;
    }
    void tidyDrawsSamplesWithoutCrossings() {
        QFETCH(QString, sample);
        const LoadResult l = loadProject((ABUT_SAMPLES "/" + sample + ".abut.json").toStdString());
        QVERIFY(l.ok());
        const TidyResult t = tidySketch(l.brief);
        QCOMPARE(t.status, TidyStatus::Drawn);
        QCOMPARE(t.positions.size(), l.brief.rooms.size());
        QCOMPARE(crossingsByQt(l.brief, t.positions, {}), 0);
    }

    // Random planar briefs (stacked triangulations, thinned, some
    // disconnected): never a crossing, never two rooms on one spot.
    void tidyRandomPlanar() {
        std::mt19937 rng(8);
        for (int k = 0; k < 200; ++k) {
            testing::RandomBriefOptions o;
            o.rooms = 3 + k % 60;
            const Brief b = testing::randomBrief(o, rng);
            const TidyResult t = tidySketch(b);
            QCOMPARE(t.status, TidyStatus::Drawn);
            QCOMPARE(crossingsByQt(b, t.positions, {}), 0);
            std::set<std::pair<double, double>> spots;
            for (const SketchPoint& p : t.positions) spots.emplace(p.x, p.y);
            QCOMPARE(spots.size(), t.positions.size());
        }
    }

    void tidyNonPlanarLeavesOut() {
        // K5: ten adjacencies, one must go (Kuratowski).
        const Brief b = abut::testing::briefFromEdges(5, completeGraph(5));
        const TidyResult t = tidySketch(b);
        QCOMPARE(t.status, TidyStatus::DrawnWithout);
        QCOMPARE(t.leftOut.size(), std::size_t(1));
        QCOMPARE(crossingsByQt(b, t.positions, t.leftOut), 0);
    }
};

void TestEmbed::kuratowskiWitness_data() {
    QTest::addColumn<int>("n");
    QTest::addColumn<QString>("kind");
    QTest::newRow("K5") << 5 << "K5";
    QTest::newRow("K3,3") << 6 << "K33";
    QTest::newRow("K6") << 6 << "K6";
}

void TestEmbed::kuratowskiWitness() {
    QFETCH(int, n);
    QFETCH(QString, kind);
    const auto edges = kind == "K33" ? completeBipartite33() : completeGraph(n);
    const EmbeddingResult e = embedPlanar(n, edges);
    QCOMPARE(e.status, EmbeddingStatus::NonPlanar);
    QVERIFY(!e.witnessEdges.empty());
    // Boost's own checker must accept the witness as a Kuratowski subgraph.
    using G = boost::adjacency_list<boost::vecS, boost::vecS, boost::undirectedS,
                                    boost::property<boost::vertex_index_t, int>,
                                    boost::property<boost::edge_index_t, int>>;
    G g(n);
    std::vector<boost::graph_traits<G>::edge_descriptor> witness;
    for (int i : e.witnessEdges) witness.push_back(boost::add_edge(edges[i].first, edges[i].second, g).first);
    QVERIFY(boost::is_kuratowski_subgraph(g, witness.begin(), witness.end()));
}

void TestEmbed::maximalPlanarEdgeCount() {
    // A maximal planar graph has 3n − 6 edges and 2n − 4 faces (Euler's
    // formula for plane graphs, V − E + F = 2 with every face a triangle).
    // Checked on a stacked triangulation and its embedding.
    std::mt19937 rng(3);
    const auto edges = abut::testing::randomPlanarEdges(30, 1.0, rng);
    QCOMPARE(static_cast<int>(edges.size()), 3 * 30 - 6);
    const EmbeddingResult e = embedPlanar(30, edges);
    QCOMPARE(e.status, EmbeddingStatus::Planar);
    QCOMPARE(static_cast<int>(e.graph.faces().size()), 2 * 30 - 4);
}

// K5 gives up one edge and K6 at least three (a simple planar graph on n
// vertices has at most 3n − 6 edges: 9 for K5's 10, 12 for K6's 15; Euler's
// formula). Each edge given up is the cheapest of its witness, and each
// witness is a Kuratowski subgraph by Boost's own checker. K40 (780 edges,
// 666 more than 114) is far from planar: after the first witness the edges
// are kept dearest first; every edge dropped without a witness, added back
// to the edges kept, breaks planarity (Boost's test), so the graph kept is
// a maximal planar subgraph.
void TestEmbed::droppingTheCheapestLeavesAPlanarGraph() {
    using G = boost::adjacency_list<boost::vecS, boost::vecS, boost::undirectedS,
                                    boost::property<boost::vertex_index_t, int>,
                                    boost::property<boost::edge_index_t, int>>;
    for (int n : {5, 6, 40}) {
        const auto edges = completeGraph(n);
        std::vector<double> cost(edges.size());
        for (std::size_t i = 0; i < cost.size(); ++i) cost[i] = 1.0 + static_cast<double>((i * 7) % 5);
        const PlanarizedEmbedding p = embedDroppingCheapest(n, edges, cost);
        QCOMPARE(p.embedding.status, EmbeddingStatus::Planar);
        QVERIFY(static_cast<int>(edges.size() - p.dropped.size()) <= 3 * n - 6);
        QVERIFY(p.dropped.size() >= edges.size() - static_cast<std::size_t>(3 * n - 6));
        QCOMPARE(p.witnesses.size(), p.dropped.size());
        QCOMPARE(p.embedding.graph.edgeCount(), static_cast<int>(edges.size() - p.dropped.size()));
        QVERIFY(!p.witnesses.front().empty()); // the first drop always has its witness (the diagnostics name it)
        std::vector<char> dropped(edges.size(), 0);
        for (int d : p.dropped) dropped[d] = 1;
        int unwitnessed = 0;
        for (std::size_t k = 0; k < p.dropped.size(); ++k) {
            G g(n);
            if (p.witnesses[k].empty()) {
                ++unwitnessed;
                for (std::size_t e = 0; e < edges.size(); ++e)
                    if (!dropped[e] || static_cast<int>(e) == p.dropped[k]) boost::add_edge(edges[e].first, edges[e].second, g);
                int i = 0;
                for (auto [it, end] = boost::edges(g); it != end; ++it) boost::put(boost::edge_index, g, *it, i++);
                QVERIFY(!boost::boyer_myrvold_planarity_test(g));
                continue;
            }
            for (int e : p.witnesses[k]) QVERIFY(cost[p.dropped[k]] <= cost[e]);
            std::vector<boost::graph_traits<G>::edge_descriptor> witness;
            for (int e : p.witnesses[k]) witness.push_back(boost::add_edge(edges[e].first, edges[e].second, g).first);
            QVERIFY(boost::is_kuratowski_subgraph(g, witness.begin(), witness.end()));
        }
        QCOMPARE(unwitnessed > 0, n == 40);
    }
}

QTEST_GUILESS_MAIN(TestEmbed)
#include "tst_embed.moc"
