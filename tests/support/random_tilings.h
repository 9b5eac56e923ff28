// SPDX-License-Identifier: MIT
// Random rectangle tilings (slicing floorplans with split points drawn at
// random, so no four rectangles meet at a point) and the extended graph read
// off their geometry. Header-only; used by tests and benchmarks as a source
// of extended graphs that are valid by construction.
#pragma once

#include "augment/extended_graph.h"
#include "dual/rectangular_dual.h"
#include "label/regular_edge_labeling.h"

#include <algorithm>
#include <map>
#include <random>
#include <string>
#include <vector>

namespace abut::testing {

// n rectangles tiling [0,width]×[0,depth]; each split cuts a random rectangle
// across its longer side (mostly) at 30–70 %. O(n).
inline std::vector<Rect> randomSlicing(int n, double width, double depth, std::mt19937& rng) {
    std::vector<Rect> rects{{0, 0, width, depth}};
    std::uniform_real_distribution<double> at(0.3, 0.7), coin(0.0, 1.0);
    while (static_cast<int>(rects.size()) < n) {
        const std::size_t i = std::uniform_int_distribution<std::size_t>(0, rects.size() - 1)(rng);
        const Rect r = rects[i];
        const bool vertical = (r.width() > r.depth()) == (coin(rng) < 0.8);
        const double t = at(rng);
        if (vertical) {
            const double x = r.x0 + t * r.width();
            rects[i] = {r.x0, r.y0, x, r.y1};
            rects.push_back({x, r.y0, r.x1, r.y1});
        } else {
            const double y = r.y0 + t * r.depth();
            rects[i] = {r.x0, r.y0, r.x1, y};
            rects.push_back({r.x0, y, r.x1, r.y1});
        }
    }
    return rects;
}

// The extended graph of a tiling: rooms 0..n-1 are the rectangles, then the
// poles; rotations follow the geometry. Contacts are found by grouping sides
// on equal coordinates (splits produce exactly equal values). O(n log n).
inline ExtendedGraph extendedGraphOfTiling(const std::vector<Rect>& rects, double width, double depth) {
    const int n = static_cast<int>(rects.size());
    ExtendedGraph x;
    x.roomCount = n;
    x.graph = PlaneGraph(n + 4);
    const int N = n, E = n + 1, S = n + 2, W = n + 3;
    // Per room: (position along its perimeter counter-clockwise from the SE corner, neighbour).
    std::vector<std::vector<std::pair<double, int>>> around(n);
    auto addContact = [&](int a, int b, double paramA, double paramB) {
        around[a].emplace_back(paramA, b);
        if (b < n) around[b].emplace_back(paramB, a);
    };
    // Perimeter parameter of a point on a rectangle's boundary: east side
    // going north, north side going west, west side going south, south side going east.
    auto param = [&](int v, int side, double t) {
        const Rect& r = rects[v];
        const double w = r.width(), d = r.depth();
        switch (side) {
        case 0: return (t - r.y0);                       // east, t = y
        case 1: return d + (r.x1 - t);                   // north, t = x
        case 2: return d + w + (r.y1 - t);               // west, t = y
        default: return 2 * d + w + (t - r.x0);          // south, t = x
        }
    };
    std::map<double, std::vector<int>> byX0, byY0;
    for (int v = 0; v < n; ++v) {
        byX0[rects[v].x0].push_back(v);
        byY0[rects[v].y0].push_back(v);
    }
    for (int u = 0; u < n; ++u) {
        const Rect& a = rects[u];
        if (auto it = byX0.find(a.x1); it != byX0.end())
            for (int v : it->second) {
                const Rect& b = rects[v];
                const double lo = std::max(a.y0, b.y0), hi = std::min(a.y1, b.y1);
                if (hi > lo) addContact(u, v, param(u, 0, 0.5 * (lo + hi)), param(v, 2, 0.5 * (lo + hi)));
            }
        if (auto it = byY0.find(a.y1); it != byY0.end())
            for (int v : it->second) {
                const Rect& b = rects[v];
                const double lo = std::max(a.x0, b.x0), hi = std::min(a.x1, b.x1);
                if (hi > lo) addContact(u, v, param(u, 1, 0.5 * (lo + hi)), param(v, 3, 0.5 * (lo + hi)));
            }
    }
    std::vector<std::pair<double, int>> north, east, south, west;
    for (int v = 0; v < n; ++v) {
        const Rect& r = rects[v];
        if (r.x1 == width) { around[v].emplace_back(param(v, 0, 0.5 * (r.y0 + r.y1)), E); east.emplace_back(-r.y0, v); }
        if (r.y1 == depth) { around[v].emplace_back(param(v, 1, 0.5 * (r.x0 + r.x1)), N); north.emplace_back(r.x0, v); }
        if (r.x0 == 0) { around[v].emplace_back(param(v, 2, 0.5 * (r.y0 + r.y1)), W); west.emplace_back(r.y0, v); }
        if (r.y0 == 0) { around[v].emplace_back(param(v, 3, 0.5 * (r.x0 + r.x1)), S); south.emplace_back(-r.x0, v); }
    }
    for (int v = 0; v < n; ++v) {
        std::sort(around[v].begin(), around[v].end());
        std::vector<int> rot;
        for (const auto& [p, u] : around[v]) rot.push_back(u);
        x.graph.setRotation(v, rot);
    }
    // Poles: [previous pole, side rooms in the outline's clockwise order, next pole].
    auto poleRotation = [&](std::vector<std::pair<double, int>> side, int prev, int next) {
        std::sort(side.begin(), side.end());
        std::vector<int> rot{prev};
        for (const auto& [k, v] : side) rot.push_back(v);
        rot.push_back(next);
        return rot;
    };
    x.graph.setRotation(N, poleRotation(north, W, E));
    x.graph.setRotation(E, poleRotation(east, N, S));
    x.graph.setRotation(S, poleRotation(south, E, W));
    x.graph.setRotation(W, poleRotation(west, S, N));
    x.graph.rebuildEdgeSet();
    std::vector<std::string> ids;
    for (int v = 0; v < n; ++v) ids.push_back("t" + std::to_string(v));
    nameVertices(x, ids);
    return x;
}

// The labeling read off the rectangles: a west room points blue to its east
// neighbour, a lower room red to the one above.
inline RegularEdgeLabeling labelingOfTiling(const ExtendedGraph& x, const std::vector<Rect>& r) {
    RegularEdgeLabeling rel;
    const PlaneGraph& g = x.graph;
    rel.at.resize(g.vertexCount());
    for (int v = 0; v < g.vertexCount(); ++v) {
        for (int u : g.neighbours(v)) {
            EdgeLabel l = EdgeLabel::Outer;
            if (x.isPole(v) && x.isPole(u)) l = EdgeLabel::Outer;
            else if (v == x.pole(Side::N)) l = EdgeLabel::InRed;
            else if (v == x.pole(Side::S)) l = EdgeLabel::OutRed;
            else if (v == x.pole(Side::W)) l = EdgeLabel::OutBlue;
            else if (v == x.pole(Side::E)) l = EdgeLabel::InBlue;
            else if (u == x.pole(Side::N)) l = EdgeLabel::OutRed;
            else if (u == x.pole(Side::S)) l = EdgeLabel::InRed;
            else if (u == x.pole(Side::W)) l = EdgeLabel::InBlue;
            else if (u == x.pole(Side::E)) l = EdgeLabel::OutBlue;
            else if (r[v].x1 == r[u].x0) l = EdgeLabel::OutBlue;
            else if (r[v].x0 == r[u].x1) l = EdgeLabel::InBlue;
            else if (r[v].y1 == r[u].y0) l = EdgeLabel::OutRed;
            else l = EdgeLabel::InRed;
            rel.at[v].push_back(l);
        }
    }
    return rel;
}

} // namespace abut::testing
