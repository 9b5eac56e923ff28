// SPDX-License-Identifier: MIT
#include "dual/tiling_dual.h"

#include <algorithm>
#include <cmath>
#include <map>

namespace abut {

namespace {

// Coordinates closer than `tol` become one value (0 and `extent` kept exact).
void snapAxis(std::vector<Rect>& r, bool xAxis, double extent, double tol) {
    std::vector<double> v;
    for (const Rect& q : r) {
        v.push_back(xAxis ? q.x0 : q.y0);
        v.push_back(xAxis ? q.x1 : q.y1);
    }
    v.push_back(0.0);
    v.push_back(extent);
    std::sort(v.begin(), v.end());
    std::vector<double> rep(v.size());
    for (std::size_t i = 0; i < v.size(); ++i)
        rep[i] = (i > 0 && v[i] - v[i - 1] <= tol) ? rep[i - 1] : v[i];
    // The outline's values win over whatever clusters with them.
    for (std::size_t i = 0; i < v.size(); ++i) {
        if (std::abs(v[i]) <= tol) rep[i] = 0.0;
        if (std::abs(v[i] - extent) <= tol) rep[i] = extent;
    }
    auto snap = [&](double& c) {
        const std::size_t i = std::lower_bound(v.begin(), v.end(), c) - v.begin();
        c = rep[std::min(i, v.size() - 1)];
    };
    for (Rect& q : r) {
        snap(xAxis ? q.x0 : q.y0);
        snap(xAxis ? q.x1 : q.y1);
    }
}

// Moves the part of the wall line x = X above the point (X, Y) by `delta`
// where four tiles meet. Returns false if nothing could move.
bool nudgeUpperWall(std::vector<Rect>& r, double X, double Y, double depth, double delta) {
    std::vector<int> left, right;
    double y = Y;
    while (y < depth) {
        int l = -1, rt = -1;
        for (int i = 0; i < static_cast<int>(r.size()); ++i) {
            if (r[i].x1 == X && r[i].y0 <= y && y < r[i].y1) l = i;
            if (r[i].x0 == X && r[i].y0 <= y && y < r[i].y1) rt = i;
        }
        if (l < 0 || rt < 0) break;
        left.push_back(l);
        right.push_back(rt);
        y = std::min(r[l].y1, r[rt].y1);
    }
    if (left.empty()) return false;
    double room = std::abs(delta);
    for (int i : left) room = std::min(room, 0.45 * r[i].width());
    for (int i : right) room = std::min(room, 0.45 * r[i].width());
    const double x = X + (delta < 0 ? -room : room);
    for (int i : left) r[i].x1 = x;
    for (int i : right) r[i].x0 = x;
    return true;
}

// Points where four tiles meet, nudged apart one at a time (towards the
// contact `preferContact` wants). Empty on success, else what failed.
std::string resolveFourCorners(std::vector<Rect>& r, double depth, const TilingDualOptions& options) {
    const int t = static_cast<int>(r.size());
    for (int round = 0; round <= t; ++round) {
        std::map<std::pair<double, double>, std::vector<int>> corners;
        for (int i = 0; i < t; ++i)
            for (const auto& c : {std::make_pair(r[i].x0, r[i].y0), std::make_pair(r[i].x1, r[i].y0),
                                  std::make_pair(r[i].x0, r[i].y1), std::make_pair(r[i].x1, r[i].y1)})
                corners[c].push_back(i);
        bool nudged = false;
        for (const auto& [p, at] : corners) {
            if (at.size() < 4) continue;
            const auto [X, Y] = p;
            int nw = -1, ne = -1, sw = -1, se = -1;
            for (int i : at) {
                if (r[i].x1 == X && r[i].y0 == Y) nw = i;
                if (r[i].x0 == X && r[i].y0 == Y) ne = i;
                if (r[i].x1 == X && r[i].y1 == Y) sw = i;
                if (r[i].x0 == X && r[i].y1 == Y) se = i;
            }
            if (nw < 0 || ne < 0 || sw < 0 || se < 0) continue;
            // Moving the upper wall east lets the north-west tile meet the south-east one.
            bool east = true;
            if (options.preferContact && !options.preferContact(nw, se) && options.preferContact(ne, sw))
                east = false;
            if (nudgeUpperWall(r, X, Y, depth, east ? options.nudge : -options.nudge)) {
                nudged = true;
                break;
            }
        }
        if (!nudged) return {};
    }
    return "four tiles meet at a point that could not be resolved";
}

// The plane graph of the tiling: tiles (rooms as vertices 0..n−1, the
// others after the four poles N, E, S, W), rotations read off the sides.
void tilingGraph(const std::vector<Rect>& r, int n, double width, double depth, ExtendedGraph& x) {
    const int t = static_cast<int>(r.size());
    auto vertexOf = [&](int tile) { return tile < n ? tile : tile + 4; };
    const int V = t + 4;
    x.roomCount = n;
    x.graph = PlaneGraph(V);
    const int N = n, E = n + 1, S = n + 2, W = n + 3;
    // Per tile: (position along its perimeter counter-clockwise from the SE corner, neighbour vertex).
    std::vector<std::vector<std::pair<double, int>>> around(t);
    auto param = [&](int i, int side, double c) {
        const Rect& q = r[i];
        const double w = q.width(), d = q.depth();
        switch (side) {
        case 0: return c - q.y0;             // east side going north
        case 1: return d + (q.x1 - c);       // north side going west
        case 2: return d + w + (q.y1 - c);   // west side going south
        default: return 2 * d + w + (c - q.x0); // south side going east
        }
    };
    std::map<double, std::vector<int>> byX0, byY0;
    for (int i = 0; i < t; ++i) {
        byX0[r[i].x0].push_back(i);
        byY0[r[i].y0].push_back(i);
    }
    for (int u = 0; u < t; ++u) {
        const Rect& a = r[u];
        if (auto it = byX0.find(a.x1); it != byX0.end())
            for (int v : it->second) {
                const double lo = std::max(a.y0, r[v].y0), hi = std::min(a.y1, r[v].y1);
                if (hi <= lo) continue;
                around[u].emplace_back(param(u, 0, 0.5 * (lo + hi)), vertexOf(v));
                around[v].emplace_back(param(v, 2, 0.5 * (lo + hi)), vertexOf(u));
            }
        if (auto it = byY0.find(a.y1); it != byY0.end())
            for (int v : it->second) {
                const double lo = std::max(a.x0, r[v].x0), hi = std::min(a.x1, r[v].x1);
                if (hi <= lo) continue;
                around[u].emplace_back(param(u, 1, 0.5 * (lo + hi)), vertexOf(v));
                around[v].emplace_back(param(v, 3, 0.5 * (lo + hi)), vertexOf(u));
            }
    }
    std::vector<std::pair<double, int>> north, east, south, west;
    for (int i = 0; i < t; ++i) {
        const Rect& q = r[i];
        const int v = vertexOf(i);
        if (q.x1 == width) { around[i].emplace_back(param(i, 0, 0.5 * (q.y0 + q.y1)), E); east.emplace_back(-q.y0, v); }
        if (q.y1 == depth) { around[i].emplace_back(param(i, 1, 0.5 * (q.x0 + q.x1)), N); north.emplace_back(q.x0, v); }
        if (q.x0 == 0) { around[i].emplace_back(param(i, 2, 0.5 * (q.y0 + q.y1)), W); west.emplace_back(q.y0, v); }
        if (q.y0 == 0) { around[i].emplace_back(param(i, 3, 0.5 * (q.x0 + q.x1)), S); south.emplace_back(-q.x0, v); }
    }
    for (int i = 0; i < t; ++i) {
        std::sort(around[i].begin(), around[i].end());
        std::vector<int> rot;
        for (const auto& [p, u] : around[i]) rot.push_back(u);
        x.graph.setRotation(vertexOf(i), rot);
    }
    // Poles: [previous pole, side tiles in the outline's clockwise order, next pole].
    auto poleRotation = [](std::vector<std::pair<double, int>> side, int prev, int next) {
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

}

// The regular edge labeling read off the rectangles (per vertex).
RegularEdgeLabeling tilingLabeling(const ExtendedGraph& x, const std::vector<Rect>& rects) {
    const int n = x.roomCount, V = x.graph.vertexCount();
    const int N = n, E = n + 1, S = n + 2, W = n + 3;
    RegularEdgeLabeling rel;
    const PlaneGraph& g = x.graph;
    rel.at.resize(V);
    for (int v = 0; v < V; ++v) {
        for (int u : g.neighbours(v)) {
            EdgeLabel l = EdgeLabel::Outer;
            if (x.isPole(v) && x.isPole(u)) l = EdgeLabel::Outer;
            else if (v == N) l = EdgeLabel::InRed;
            else if (v == S) l = EdgeLabel::OutRed;
            else if (v == W) l = EdgeLabel::OutBlue;
            else if (v == E) l = EdgeLabel::InBlue;
            else if (u == N) l = EdgeLabel::OutRed;
            else if (u == S) l = EdgeLabel::InRed;
            else if (u == W) l = EdgeLabel::InBlue;
            else if (u == E) l = EdgeLabel::OutBlue;
            else if (rects[v].x1 == rects[u].x0) l = EdgeLabel::OutBlue;
            else if (rects[v].x0 == rects[u].x1) l = EdgeLabel::InBlue;
            else if (rects[v].y1 == rects[u].y0) l = EdgeLabel::OutRed;
            else l = EdgeLabel::InRed;
            rel.at[v].push_back(l);
        }
    }
    return rel;
}

} // namespace

TilingDual dualOfTiling(const std::vector<Rect>& tiles, int roomCount, double width, double depth,
                        const std::vector<std::string>& roomIds, const TilingDualOptions& options) {
    TilingDual out;
    const int t = static_cast<int>(tiles.size());
    if (roomCount < 1 || roomCount > t) {
        out.problem = "no rooms";
        return out;
    }
    std::vector<Rect> r = tiles;
    const double tol = options.tolerance * std::max(width, depth);
    snapAxis(r, true, width, tol);
    snapAxis(r, false, depth, tol);
    for (const Rect& q : r)
        if (!(q.x1 > q.x0 && q.y1 > q.y0)) {
            out.problem = "a tile has no area";
            return out;
        }
    if (std::string problem = resolveFourCorners(r, depth, options); !problem.empty()) {
        out.problem = std::move(problem);
        return out;
    }
    ExtendedGraph& x = out.extended;
    tilingGraph(r, roomCount, width, depth, x);
    nameVertices(x, roomIds);
    out.rects.assign(t + 4, Rect{});
    for (int i = 0; i < t; ++i) out.rects[i < roomCount ? i : i + 4] = r[i];
    out.labeling = tilingLabeling(x, out.rects);
    const StageCheck gc = checkExtendedGraph(x);
    if (!gc.ok) {
        out.problem = "the tiling's graph is not an extended graph: " + gc.problem;
        return out;
    }
    const StageCheck lc = checkRegularEdgeLabeling(x, out.labeling);
    if (!lc.ok) {
        out.problem = "the tiling's labeling is not regular: " + lc.problem;
        return out;
    }
    out.ok = true;
    return out;
}

} // namespace abut
