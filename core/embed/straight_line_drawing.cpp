// SPDX-License-Identifier: MIT
#include "embed/straight_line_drawing.h"

#include "embed/planar_embedding.h"

#include <Eigen/SparseCholesky>
#include <Eigen/SparseCore>

#include <boost/graph/adjacency_list.hpp>
#include <boost/graph/boyer_myrvold_planar_test.hpp>
#include <boost/graph/chrobak_payne_drawing.hpp>
#include <boost/graph/make_biconnected_planar.hpp>
#include <boost/graph/make_connected.hpp>
#include <boost/graph/make_maximal_planar.hpp>
#include <boost/graph/planar_canonical_ordering.hpp>

#include <algorithm>
#include <cmath>
#include <set>

namespace abut {

namespace {

using Graph = boost::adjacency_list<boost::vecS, boost::vecS, boost::undirectedS,
                                    boost::property<boost::vertex_index_t, int>,
                                    boost::property<boost::edge_index_t, int>>;
using Edge = boost::graph_traits<Graph>::edge_descriptor;
using Vertex = boost::graph_traits<Graph>::vertex_descriptor;
using Embedding = std::vector<std::vector<Edge>>;

// Boost's planarity functions index edges 0..m−1; every make_* call adds
// edges, so the numbering is redone after each.
void renumberEdges(Graph& g) {
    int k = 0;
    for (auto [it, end] = boost::edges(g); it != end; ++it) boost::put(boost::edge_index, g, *it, k++);
}

bool embed(Graph& g, Embedding& embedding) {
    renumberEdges(g);
    embedding.assign(boost::num_vertices(g), {});
    return boost::boyer_myrvold_planarity_test(boost::boyer_myrvold_params::graph = g,
                                               boost::boyer_myrvold_params::embedding = &embedding[0]);
}

bool isPlanar(Graph& g) {
    Embedding e;
    return embed(g, e);
}

std::vector<std::pair<int, int>> edgeList(const Graph& g) {
    std::vector<std::pair<int, int>> out;
    for (auto [it, end] = boost::edges(g); it != end; ++it)
        out.emplace_back(int(boost::source(*it, g)), int(boost::target(*it, g)));
    return out;
}

bool crossingFree(const Graph& g, const std::vector<SketchPoint>& p) {
    std::vector<std::optional<SketchPoint>> sketch(p.begin(), p.end());
    std::set<std::pair<double, double>> distinct;
    for (const SketchPoint& q : p) distinct.emplace(q.x, q.y);
    return distinct.size() == p.size() && sketchCrossings(edgeList(g), sketch).empty();
}

// Tutte's barycentric relaxation with the vertices of `outer` held in place.
std::vector<SketchPoint> barycentric(const Graph& g, const std::vector<SketchPoint>& start,
                                     const std::vector<int>& outer) {
    const int n = static_cast<int>(boost::num_vertices(g));
    std::vector<int> slot(n, -1);
    int free = 0;
    for (int v = 0; v < n; ++v)
        if (std::find(outer.begin(), outer.end(), v) == outer.end()) slot[v] = free++;
    if (free == 0) return start;
    std::vector<Eigen::Triplet<double>> t;
    Eigen::VectorXd bx = Eigen::VectorXd::Zero(free), by = Eigen::VectorXd::Zero(free);
    for (int v = 0; v < n; ++v) {
        if (slot[v] < 0) continue;
        t.emplace_back(slot[v], slot[v], double(boost::degree(v, g)));
        for (auto [it, end] = boost::adjacent_vertices(v, g); it != end; ++it) {
            const int u = static_cast<int>(*it);
            if (slot[u] >= 0) {
                t.emplace_back(slot[v], slot[u], -1.0);
            } else {
                bx[slot[v]] += start[u].x;
                by[slot[v]] += start[u].y;
            }
        }
    }
    Eigen::SparseMatrix<double> L(free, free);
    L.setFromTriplets(t.begin(), t.end());
    Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>> solver(L);
    if (solver.info() != Eigen::Success) return start;
    const Eigen::VectorXd x = solver.solve(bx), y = solver.solve(by);
    std::vector<SketchPoint> out = start;
    for (int v = 0; v < n; ++v)
        if (slot[v] >= 0) out[v] = {x[slot[v]], y[slot[v]]};
    return out;
}

} // namespace

TidyResult tidySketch(const Brief& brief, double spacing) {
    TidyResult result;
    const int n = static_cast<int>(brief.rooms.size());
    if (n == 0) {
        result.status = TidyStatus::Empty;
        return result;
    }
    if (n <= 2) {
        for (int i = 0; i < n; ++i) result.positions.push_back({i * spacing, 0.0});
        return result;
    }
    Graph g(n);
    // Must adjacencies first, so that a non-planar brief loses shoulds first.
    std::vector<int> order(brief.adjacencies.size());
    for (std::size_t i = 0; i < order.size(); ++i) order[i] = static_cast<int>(i);
    std::stable_sort(order.begin(), order.end(), [&](int a, int b) {
        return brief.adjacencies[a].priority == Priority::Must && brief.adjacencies[b].priority != Priority::Must;
    });
    std::set<std::pair<int, int>> seen;
    std::vector<std::pair<int, int>> pending; // (adjacency, endpoints packed below)
    for (int i : order) {
        const Adjacency& a = brief.adjacencies[i];
        const int u = brief.roomIndex(a.a), v = brief.roomIndex(a.b);
        if (u < 0 || v < 0 || u == v || !seen.insert(std::minmax(u, v)).second) continue;
        boost::add_edge(u, v, g);
        pending.emplace_back(i, 0);
    }
    if (!isPlanar(g)) {
        // Add one by one, keeping the graph planar.
        g = Graph(n);
        for (const auto& [i, unused] : pending) {
            const Adjacency& a = brief.adjacencies[i];
            const int u = brief.roomIndex(a.a), v = brief.roomIndex(a.b);
            const auto [e, added] = boost::add_edge(u, v, g);
            if (!isPlanar(g)) {
                boost::remove_edge(e, g);
                result.leftOut.push_back(i);
            }
        }
        std::sort(result.leftOut.begin(), result.leftOut.end());
        result.status = TidyStatus::DrawnWithout;
    }
    Embedding embedding;
    embed(g, embedding);
    renumberEdges(g);
    boost::make_connected(g);
    embed(g, embedding);
    boost::make_biconnected_planar(g, &embedding[0]);
    embed(g, embedding);
    boost::make_maximal_planar(g, &embedding[0]);
    embed(g, embedding);

    std::vector<Vertex> ordering;
    boost::planar_canonical_ordering(g, &embedding[0], std::back_inserter(ordering));
    struct Coord {
        std::size_t x, y;
    };
    std::vector<Coord> grid(n);
    boost::chrobak_payne_straight_line_drawing(
        g, boost::make_iterator_property_map(embedding.begin(), boost::get(boost::vertex_index, g)),
        ordering.begin(), ordering.end(),
        boost::make_iterator_property_map(grid.begin(), boost::get(boost::vertex_index, g)));

    std::vector<SketchPoint> drawn(n);
    for (int v = 0; v < n; ++v) drawn[v] = {double(grid[v].x), double(grid[v].y)};
    // The canonical order starts with the base edge and ends with the apex:
    // these three form the outer face.
    const std::vector<int> outer{int(ordering[0]), int(ordering[1]), int(ordering.back())};
    // Make the outer face an equilateral triangle before relaxing, so that
    // the drawing is as tall as it is wide.
    const double side = double(n);
    drawn[outer[0]] = {0.0, 0.0};
    drawn[outer[1]] = {side, 0.0};
    drawn[outer[2]] = {side / 2, side * std::sqrt(3.0) / 2};
    std::vector<SketchPoint> relaxed = barycentric(g, drawn, outer);
    if (!crossingFree(g, relaxed)) {
        for (int v = 0; v < n; ++v) relaxed[v] = {double(grid[v].x), double(grid[v].y)};
    }
    // Scale so that the brief's adjacencies are `spacing` long on average.
    double total = 0;
    int count = 0;
    for (const Adjacency& a : brief.adjacencies) {
        const int u = brief.roomIndex(a.a), v = brief.roomIndex(a.b);
        if (u < 0 || v < 0 || u == v) continue;
        total += std::hypot(relaxed[u].x - relaxed[v].x, relaxed[u].y - relaxed[v].y);
        ++count;
    }
    const double mean = count ? total / count : 1.0;
    const double scale = mean > 0 ? spacing / mean : spacing;
    for (SketchPoint& p : relaxed) p = {p.x * scale, p.y * scale};
    result.positions = std::move(relaxed);
    return result;
}

} // namespace abut
