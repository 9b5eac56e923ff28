// SPDX-License-Identifier: MIT
#include "embed/planar_embedding.h"

#include <boost/graph/adjacency_list.hpp>
#include <boost/graph/boyer_myrvold_planar_test.hpp>
#include <boost/graph/graph_traits.hpp>

#include <algorithm>
#include <cmath>
#include <map>

namespace abut {

namespace {

using BoostGraph =
    boost::adjacency_list<boost::vecS, boost::vecS, boost::undirectedS,
                          boost::property<boost::vertex_index_t, int>,
                          boost::property<boost::edge_index_t, int>>;
using BoostEdge = boost::graph_traits<BoostGraph>::edge_descriptor;

double orientation(const SketchPoint& a, const SketchPoint& b, const SketchPoint& c) {
    return (b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x);
}

bool onSegment(const SketchPoint& a, const SketchPoint& b, const SketchPoint& p) {
    return std::min(a.x, b.x) <= p.x && p.x <= std::max(a.x, b.x) && std::min(a.y, b.y) <= p.y &&
           p.y <= std::max(a.y, b.y);
}

bool segmentsCross(const SketchPoint& a, const SketchPoint& b, const SketchPoint& c,
                   const SketchPoint& d) {
    const double o1 = orientation(a, b, c), o2 = orientation(a, b, d);
    const double o3 = orientation(c, d, a), o4 = orientation(c, d, b);
    if (((o1 > 0 && o2 < 0) || (o1 < 0 && o2 > 0)) && ((o3 > 0 && o4 < 0) || (o3 < 0 && o4 > 0)))
        return true;
    // Touching or overlapping collinear pieces also make the sketch ambiguous.
    return (o1 == 0 && onSegment(a, b, c)) || (o2 == 0 && onSegment(a, b, d)) ||
           (o3 == 0 && onSegment(c, d, a)) || (o4 == 0 && onSegment(c, d, b));
}

bool sketchUsable(int n, const std::vector<std::pair<int, int>>& edges,
                  const std::vector<std::optional<SketchPoint>>& sketch) {
    if (static_cast<int>(sketch.size()) != n || edges.size() > sketchCrossingLimit) return false;
    for (const auto& p : sketch)
        if (!p) return false;
    // Two rooms at the same spot give no angle to order by.
    std::vector<std::pair<double, double>> pts;
    for (const auto& p : sketch) pts.emplace_back(p->x, p->y);
    std::sort(pts.begin(), pts.end());
    if (std::adjacent_find(pts.begin(), pts.end()) != pts.end()) return false;
    return sketchCrossings(edges, sketch).empty();
}

PlaneGraph fromSketch(int n, const std::vector<std::pair<int, int>>& edges,
                      const std::vector<std::optional<SketchPoint>>& sketch) {
    std::vector<std::vector<int>> nbrs(n);
    for (const auto& [u, v] : edges) {
        nbrs[u].push_back(v);
        nbrs[v].push_back(u);
    }
    PlaneGraph g(n);
    for (int v = 0; v < n; ++v) {
        const SketchPoint c = *sketch[v];
        std::sort(nbrs[v].begin(), nbrs[v].end(), [&](int a, int b) {
            return std::atan2(sketch[a]->y - c.y, sketch[a]->x - c.x) <
                   std::atan2(sketch[b]->y - c.y, sketch[b]->x - c.x);
        });
        g.setRotation(v, nbrs[v]);
    }
    g.rebuildEdgeSet();
    return g;
}

} // namespace

std::vector<std::pair<int, int>> sketchCrossings(const std::vector<std::pair<int, int>>& edges,
                                                 const std::vector<std::optional<SketchPoint>>& sketch) {
    std::vector<std::pair<int, int>> out;
    for (std::size_t i = 0; i < edges.size(); ++i) {
        const auto [a, b] = edges[i];
        if (!sketch[a] || !sketch[b]) continue;
        for (std::size_t j = i + 1; j < edges.size(); ++j) {
            const auto [c, d] = edges[j];
            if (c == a || c == b || d == a || d == b || !sketch[c] || !sketch[d]) continue;
            if (segmentsCross(*sketch[a], *sketch[b], *sketch[c], *sketch[d]))
                out.emplace_back(static_cast<int>(i), static_cast<int>(j));
        }
    }
    return out;
}

EmbeddingResult embedPlanar(int n, const std::vector<std::pair<int, int>>& edges,
                            const std::vector<std::optional<SketchPoint>>& sketch) {
    EmbeddingResult result;
    BoostGraph g(n);
    std::map<std::pair<int, int>, int> inputIndex;
    for (std::size_t i = 0; i < edges.size(); ++i) {
        boost::add_edge(edges[i].first, edges[i].second, g);
        inputIndex[std::minmax(edges[i].first, edges[i].second)] = static_cast<int>(i);
    }
    // Boost's planarity functions need edge indices 0..m-1 (numbered here).
    int k = 0;
    for (auto [it, end] = boost::edges(g); it != end; ++it) boost::put(boost::edge_index, g, *it, k++);

    using Embedding = std::vector<std::vector<BoostEdge>>;
    Embedding embedding(n);
    std::vector<BoostEdge> kuratowski;
    const bool planar = boost::boyer_myrvold_planarity_test(
        boost::boyer_myrvold_params::graph = g,
        boost::boyer_myrvold_params::embedding =
            boost::make_iterator_property_map(embedding.begin(), boost::get(boost::vertex_index, g)),
        boost::boyer_myrvold_params::kuratowski_subgraph = std::back_inserter(kuratowski));
    if (!planar) {
        result.status = EmbeddingStatus::NonPlanar;
        for (const BoostEdge& e : kuratowski) {
            const int u = static_cast<int>(boost::source(e, g));
            const int v = static_cast<int>(boost::target(e, g));
            result.witnessEdges.push_back(inputIndex.at(std::minmax(u, v)));
        }
        std::sort(result.witnessEdges.begin(), result.witnessEdges.end());
        return result;
    }
    if (sketchUsable(n, edges, sketch)) {
        result.graph = fromSketch(n, edges, sketch);
        result.fromSketch = true;
        return result;
    }
    PlaneGraph pg(n);
    for (int v = 0; v < n; ++v) {
        std::vector<int> rot;
        for (const BoostEdge& e : embedding[v]) {
            const int s = static_cast<int>(boost::source(e, g));
            const int t = static_cast<int>(boost::target(e, g));
            rot.push_back(s == v ? t : s);
        }
        pg.setRotation(v, std::move(rot));
    }
    pg.rebuildEdgeSet();
    result.graph = std::move(pg);
    return result;
}

namespace {

// Boyer–Myrvold's test alone: no embedding, no witness.
bool isPlanar(int n, const std::vector<std::pair<int, int>>& edges) {
    BoostGraph g(n);
    for (const auto& [u, v] : edges) boost::add_edge(u, v, g);
    int k = 0;
    for (auto [it, end] = boost::edges(g); it != end; ++it) boost::put(boost::edge_index, g, *it, k++);
    return boost::boyer_myrvold_planarity_test(g);
}

} // namespace

PlanarizedEmbedding embedDroppingCheapest(int n, const std::vector<std::pair<int, int>>& edges,
                                          const std::vector<double>& cost,
                                          const std::vector<std::optional<SketchPoint>>& sketch,
                                          const std::function<bool()>& keepGoing) {
    PlanarizedEmbedding out;
    bool going = true;
    auto goOn = [&] { return going = going && (!keepGoing || keepGoing()); };
    std::vector<std::pair<int, int>> left = edges;
    std::vector<int> index(edges.size()); // position in `left` → index into `edges`
    for (std::size_t i = 0; i < index.size(); ++i) index[i] = static_cast<int>(i);
    const std::size_t most = n >= 3 ? static_cast<std::size_t>(3 * n - 6) : static_cast<std::size_t>(n > 1);
    for (;;) {
        EmbeddingResult e = embedPlanar(n, left, sketch);
        if (e.status == EmbeddingStatus::Planar) {
            out.embedding = std::move(e);
            return out;
        }
        std::vector<int> witness;
        int cheapest = e.witnessEdges.front();
        for (int we : e.witnessEdges) {
            witness.push_back(index[we]);
            if (cost[index[we]] < cost[index[cheapest]]) cheapest = we;
        }
        out.witnesses.push_back(std::move(witness));
        out.dropped.push_back(index[cheapest]);
        left.erase(left.begin() + cheapest);
        index.erase(index.begin() + cheapest);
        // Drops still needed by Euler's formula alone.
        const std::size_t excess = left.size() > most ? left.size() - most : 0;
        if (out.dropped.size() + excess > witnessedDrops || !goOn()) break;
    }
    // Far from planar (a complete graph of 200 rooms has 19,306 edges too
    // many): a witness per drop would cost a test of all the edges left for
    // each. The rest, dearest first (equal costs in input order), are kept
    // while the graph stays planar, and once 3n − 6 are kept no more fit
    // (Euler's formula): what is left is a maximal planar subgraph.
    std::vector<int> order(left.size());
    for (std::size_t i = 0; i < order.size(); ++i) order[i] = static_cast<int>(i);
    std::stable_sort(order.begin(), order.end(), [&](int a, int b) { return cost[index[a]] > cost[index[b]]; });
    std::vector<std::pair<int, int>> trial;
    std::vector<char> keep(left.size(), 0);
    for (int i : order) {
        if (trial.size() < most && goOn()) {
            trial.push_back(left[i]);
            if (isPlanar(n, trial)) {
                keep[i] = 1;
                continue;
            }
            trial.pop_back();
        }
        out.dropped.push_back(index[i]);
        out.witnesses.emplace_back(); // no witness: see the header
    }
    std::vector<std::pair<int, int>> kept; // in input order, as the witness loop leaves them
    for (std::size_t i = 0; i < left.size(); ++i)
        if (keep[i]) kept.push_back(left[i]);
    out.embedding = embedPlanar(n, kept, sketch);
    return out;
}

} // namespace abut
