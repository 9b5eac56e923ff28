// SPDX-License-Identifier: MIT
// The graph stage: PlaneGraph's face tracing against Euler's formula for
// plane graphs (V − E + F = 1 + C for C components; with one outer face
// traced per component, as PlaneGraph does, the traced faces number
// E − V + 2C), every dart on exactly one face, and rotations that stay
// consistent through edge removals. Graphs from Boyer–Myrvold embeddings of
// seeded random planar graphs (stacked triangulations, thinned).
#include "embed/planar_embedding.h"
#include "graph/plane_graph.h"
#include "../support/random_briefs.h"

#include <QtTest>

#include <map>
#include <numeric>
#include <random>
#include <set>

using namespace abut;

namespace {

int components(const PlaneGraph& g) {
    std::vector<int> parent(g.vertexCount());
    std::iota(parent.begin(), parent.end(), 0);
    auto find = [&](int v) {
        while (parent[v] != v) v = parent[v] = parent[parent[v]];
        return v;
    };
    for (auto [u, v] : g.edgeList()) parent[find(u)] = find(v);
    int c = 0;
    for (int v = 0; v < g.vertexCount(); ++v) c += find(v) == v;
    return c;
}

// Every dart u→v lies on exactly one traced face.
bool dartsOnceEach(const PlaneGraph& g) {
    std::map<std::pair<int, int>, int> seen;
    for (const std::vector<int>& f : g.faces())
        for (std::size_t k = 0; k < f.size(); ++k) ++seen[{f[k], f[(k + 1) % f.size()]}];
    if (seen.size() != 2 * static_cast<std::size_t>(g.edgeCount())) return false;
    for (const auto& [dart, n] : seen)
        if (n != 1) return false;
    return true;
}

// Faces a trace should find: isolated vertices trace none; every other
// component traces E_i − V_i + 2 (Euler, one outer face each).
int expectedFaces(const PlaneGraph& g) {
    int isolated = 0;
    for (int v = 0; v < g.vertexCount(); ++v) isolated += g.degree(v) == 0;
    return g.edgeCount() - (g.vertexCount() - isolated) + 2 * (components(g) - isolated);
}

} // namespace

class TestPlaneGraph : public QObject {
    Q_OBJECT
private slots:
    void eulerOnRandomPlanarGraphs() {
        std::mt19937 rng(17);
        for (int k = 0; k < 300; ++k) {
            const int n = 3 + static_cast<int>(rng() % 60);
            const double keep = 0.3 + 0.7 * static_cast<double>(rng() % 100) / 100.0;
            const auto edges = abut::testing::randomPlanarEdges(n, keep, rng);
            const EmbeddingResult e = embedPlanar(n, edges);
            QCOMPARE(e.status, EmbeddingStatus::Planar);
            const PlaneGraph& g = e.graph;
            QCOMPARE(g.edgeCount(), static_cast<int>(edges.size()));
            QCOMPARE(static_cast<int>(g.faces().size()), expectedFaces(g));
            QVERIFY(dartsOnceEach(g));
        }
    }

    // Removing edges keeps both rotations consistent and faces traced, down
    // to a forest (which has one face per component: its outer walk).
    void removalsKeepRotationsConsistent() {
        std::mt19937 rng(5);
        const auto edges = abut::testing::randomPlanarEdges(25, 1.0, rng);
        EmbeddingResult e = embedPlanar(25, edges);
        PlaneGraph& g = e.graph;
        std::vector<std::pair<int, int>> order = g.edgeList();
        std::shuffle(order.begin(), order.end(), rng);
        for (auto [u, v] : order) {
            if (g.edgeCount() <= 24) break; // a spanning tree's worth may stay
            g.removeEdge(u, v);
            QVERIFY(!g.hasEdge(u, v) && !g.hasEdge(v, u));
            QVERIFY(dartsOnceEach(g));
            QCOMPARE(static_cast<int>(g.faces().size()), expectedFaces(g));
        }
    }
};

QTEST_GUILESS_MAIN(TestPlaneGraph)
#include "tst_plane_graph.moc"
