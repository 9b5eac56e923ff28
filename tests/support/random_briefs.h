// SPDX-License-Identifier: MIT
// Seeded generators of test briefs. Header-only; used by tests and benchmarks.
#pragma once

#include "brief/brief.h"

#include <algorithm>
#include <array>
#include <random>
#include <set>
#include <string>
#include <utility>
#include <vector>

namespace abut::testing {

struct RandomBriefOptions {
    int rooms = 10;
    double keepEdge = 0.7;     // share of a stacked triangulation's edges kept
    double facadeWish = 0.2;   // chance a room wishes a facade
    double shouldShare = 0.3;  // chance an adjacency is 'should'
    double wallShare = 0.3;    // chance an adjacency is a wall
    bool withSketch = false;   // random sketch positions (usually crossing)
};

// A stacked triangulation (each room inserted into a random triangle, so many
// separating triangles), thinned at random: planar, maybe disconnected.
inline std::vector<std::pair<int, int>> randomPlanarEdges(int n, double keep, std::mt19937& rng) {
    std::vector<std::pair<int, int>> edges;
    if (n < 2) return edges;
    std::uniform_real_distribution<double> coin(0.0, 1.0);
    std::vector<std::array<int, 3>> faces;
    if (n == 2) {
        edges.emplace_back(0, 1);
    } else {
        edges = {{0, 1}, {1, 2}, {0, 2}};
        faces = {{0, 1, 2}, {0, 1, 2}};
        for (int v = 3; v < n; ++v) {
            const std::size_t f = std::uniform_int_distribution<std::size_t>(0, faces.size() - 1)(rng);
            const auto t = faces[f];
            for (int u : t) edges.emplace_back(u, v);
            faces[f] = {t[0], t[1], v};
            faces.push_back({t[1], t[2], v});
            faces.push_back({t[0], t[2], v});
        }
    }
    std::vector<std::pair<int, int>> kept;
    for (const auto& e : edges)
        if (coin(rng) < keep) kept.push_back(e);
    return kept;
}

inline Brief randomBrief(const RandomBriefOptions& o, std::mt19937& rng) {
    std::uniform_real_distribution<double> coin(0.0, 1.0);
    Brief b;
    for (int i = 0; i < o.rooms; ++i) {
        Room r;
        r.id = "r" + std::to_string(i);
        r.area = 6.0 + 20.0 * coin(rng);
        if (coin(rng) < o.facadeWish) {
            if (coin(rng) < 0.4) r.facade.anySide = true;
            else r.facade.add(allSides[std::uniform_int_distribution<int>(0, 3)(rng)]);
        }
        b.rooms.push_back(r);
    }
    // Shuffle room numbers so the stacking order is not the brief order.
    std::vector<int> perm(o.rooms);
    for (int i = 0; i < o.rooms; ++i) perm[i] = i;
    std::shuffle(perm.begin(), perm.end(), rng);
    for (const auto& [u, v] : randomPlanarEdges(o.rooms, o.keepEdge, rng)) {
        Adjacency a;
        a.a = b.rooms[perm[u]].id;
        a.b = b.rooms[perm[v]].id;
        a.priority = coin(rng) < o.shouldShare ? Priority::Should : Priority::Must;
        a.kind = coin(rng) < o.wallShare ? AdjacencyKind::Wall : AdjacencyKind::Door;
        b.adjacencies.push_back(a);
    }
    if (o.withSketch)
        for (const Room& r : b.rooms)
            b.sketch.emplace_back(r.id, SketchPoint{1000.0 * coin(rng), 1000.0 * coin(rng)});
    return b;
}

// Brief over the given edges with every adjacency a 'must' door.
// K_n: every pair of 0..n−1.
inline std::vector<std::pair<int, int>> completeGraph(int n) {
    std::vector<std::pair<int, int>> e;
    for (int i = 0; i < n; ++i)
        for (int j = i + 1; j < n; ++j) e.emplace_back(i, j);
    return e;
}

inline Brief briefFromEdges(int n, const std::vector<std::pair<int, int>>& edges) {
    Brief b;
    for (int i = 0; i < n; ++i) b.rooms.push_back(Room{"r" + std::to_string(i), "", 10.0});
    for (const auto& [u, v] : edges) {
        Adjacency a;
        a.a = "r" + std::to_string(u);
        a.b = "r" + std::to_string(v);
        b.adjacencies.push_back(a);
    }
    return b;
}

} // namespace abut::testing
