// SPDX-License-Identifier: MIT
#include "dual/rectangular_dual.h"

#include <algorithm>
#include <cmath>
#include <map>
#include <set>
#include <utility>

namespace abut {

namespace {

struct UnionFind {
    std::vector<int> parent;
    explicit UnionFind(int n) : parent(n) {
        for (int i = 0; i < n; ++i) parent[i] = i;
    }
    int find(int a) {
        while (parent[a] != a) a = parent[a] = parent[parent[a]];
        return a;
    }
    void join(int a, int b) { parent[find(a)] = find(b); }
};

// Compact the union-find roots of the used side variables into 0..count-1;
// unused ones (a pole's far sides) get -1.
std::vector<int> compact(UnionFind& uf, const std::vector<char>& used, int& count) {
    std::vector<int> id(uf.parent.size(), -1), out(uf.parent.size(), -1);
    count = 0;
    for (std::size_t i = 0; i < uf.parent.size(); ++i) {
        if (!used[i]) continue;
        const int r = uf.find(static_cast<int>(i));
        if (id[r] < 0) id[r] = count++;
        out[i] = id[r];
    }
    return out;
}

} // namespace

std::vector<double> longestPaths(int count, const std::vector<std::pair<std::pair<int, int>, double>>& arcs) {
    std::vector<std::vector<std::pair<int, double>>> out(count);
    std::vector<int> indegree(count, 0);
    for (const auto& [e, w] : arcs) {
        out[e.first].emplace_back(e.second, w);
        ++indegree[e.second];
    }
    std::vector<double> dist(count, 0.0);
    std::vector<int> ready;
    for (int i = 0; i < count; ++i)
        if (indegree[i] == 0) ready.push_back(i);
    while (!ready.empty()) {
        const int s = ready.back();
        ready.pop_back();
        for (const auto& [t, w] : out[s]) {
            dist[t] = std::max(dist[t], dist[s] + w);
            if (--indegree[t] == 0) ready.push_back(t);
        }
    }
    return dist;
}

double sharedWallLength(const Rect& a, const Rect& b, double tol) {
    const double ox = std::min(a.x1, b.x1) - std::max(a.x0, b.x0);
    const double oy = std::min(a.y1, b.y1) - std::max(a.y0, b.y0);
    if ((std::abs(a.x1 - b.x0) <= tol || std::abs(b.x1 - a.x0) <= tol) && oy > tol) return oy;
    if ((std::abs(a.y1 - b.y0) <= tol || std::abs(b.y1 - a.y0) <= tol) && ox > tol) return ox;
    return 0.0;
}

bool interiorsOverlap(const Rect& a, const Rect& b, double tol) {
    return std::min(a.x1, b.x1) - std::max(a.x0, b.x0) > tol && std::min(a.y1, b.y1) - std::max(a.y0, b.y0) > tol;
}

SegmentStructure maximalSegments(const ExtendedGraph& x, const RegularEdgeLabeling& rel) {
    const PlaneGraph& g = x.graph;
    const int n = g.vertexCount();
    // Side variables: 2v = west/south side, 2v + 1 = east/north side.
    UnionFind vertical(2 * n), horizontal(2 * n);
    for (int u = 0; u < n; ++u)
        for (std::size_t i = 0; i < g.neighbours(u).size(); ++i) {
            const int v = g.neighbours(u)[i];
            if (rel.at[u][i] == EdgeLabel::OutBlue) vertical.join(2 * u + 1, 2 * v);
            if (rel.at[u][i] == EdgeLabel::OutRed) horizontal.join(2 * u + 1, 2 * v);
        }
    SegmentStructure s;
    // Used sides: both of every room or spare; of the poles only the one facing in.
    std::vector<char> usedV(2 * n, 0), usedH(2 * n, 0);
    for (int v = 0; v < n; ++v)
        if (!x.isPole(v)) usedV[2 * v] = usedV[2 * v + 1] = usedH[2 * v] = usedH[2 * v + 1] = 1;
    usedV[2 * x.pole(Side::W) + 1] = usedV[2 * x.pole(Side::E)] = 1;
    usedH[2 * x.pole(Side::S) + 1] = usedH[2 * x.pole(Side::N)] = 1;
    const std::vector<int> vid = compact(vertical, usedV, s.verticalCount);
    const std::vector<int> hid = compact(horizontal, usedH, s.horizontalCount);
    s.west.resize(n);
    s.east.resize(n);
    s.south.resize(n);
    s.north.resize(n);
    for (int v = 0; v < n; ++v) {
        s.west[v] = vid[2 * v];
        s.east[v] = vid[2 * v + 1];
        s.south[v] = hid[2 * v];
        s.north[v] = hid[2 * v + 1];
    }
    s.westSegment = s.east[x.pole(Side::W)];
    s.eastSegment = s.west[x.pole(Side::E)];
    s.southSegment = s.north[x.pole(Side::S)];
    s.northSegment = s.south[x.pole(Side::N)];
    for (int u = 0; u < n; ++u) {
        if (x.isPole(u)) continue;
        for (std::size_t i = 0; i < g.neighbours(u).size(); ++i) {
            const int v = g.neighbours(u)[i];
            if (x.isPole(v)) continue;
            const EdgeLabel l = rel.at[u][i];
            if (l == EdgeLabel::OutBlue) {
                // u west of v. North third vertex z (left of u→v), south w (left of v→u).
                const int z = g.nextOnFace(u, v);
                const int w = g.nextOnFace(v, u);
                SegmentStructure::Wall wall{u, v, true, s.east[u], 0, 0};
                wall.from = rel.label(g, w, v) == EdgeLabel::OutRed ? s.south[v] : s.south[u];
                wall.to = rel.label(g, v, z) == EdgeLabel::OutRed ? s.north[v] : s.north[u];
                s.walls.push_back(wall);
            } else if (l == EdgeLabel::OutRed) {
                // u below v. West third vertex a (left of u→v), east b (left of v→u).
                const int a = g.nextOnFace(u, v);
                const int b = g.nextOnFace(v, u);
                SegmentStructure::Wall wall{u, v, false, s.north[u], 0, 0};
                wall.from = rel.label(g, a, v) == EdgeLabel::OutBlue ? s.west[v] : s.west[u];
                wall.to = rel.label(g, v, b) == EdgeLabel::OutBlue ? s.east[v] : s.east[u];
                s.walls.push_back(wall);
            }
        }
    }
    return s;
}

DualLayout longestPathLayout(const ExtendedGraph& x, const SegmentStructure& s, const DualWeights& w) {
    const int n = x.graph.vertexCount();
    std::vector<std::pair<std::pair<int, int>, double>> xArcs, yArcs;
    for (int v = 0; v < n; ++v) {
        if (x.isPole(v)) continue;
        xArcs.push_back({{s.west[v], s.east[v]}, w.minWidth.empty() ? 1.0 : w.minWidth[v]});
        yArcs.push_back({{s.south[v], s.north[v]}, w.minDepth.empty() ? 1.0 : w.minDepth[v]});
    }
    for (std::size_t i = 0; i < s.walls.size(); ++i) {
        const auto& wall = s.walls[i];
        const double length = std::max(w.anyWall, i < w.minWall.size() ? w.minWall[i] : 0.0);
        (wall.vertical ? yArcs : xArcs).push_back({{wall.from, wall.to}, length});
    }
    DualLayout layout;
    layout.xOfVertical = longestPaths(s.verticalCount, xArcs);
    layout.yOfHorizontal = longestPaths(s.horizontalCount, yArcs);
    layout.width = layout.xOfVertical[s.eastSegment];
    layout.depth = layout.yOfHorizontal[s.northSegment];
    layout.rects.resize(n);
    for (int v = 0; v < n; ++v) {
        if (x.isPole(v)) continue;
        layout.rects[v] = {layout.xOfVertical[s.west[v]], layout.yOfHorizontal[s.south[v]],
                           layout.xOfVertical[s.east[v]], layout.yOfHorizontal[s.north[v]]};
    }
    return layout;
}

StageCheck checkRectangularDual(const ExtendedGraph& x, const std::vector<Rect>& rects, double width,
                               double depth, double tol) {
    const int n = x.graph.vertexCount();
    auto name = [&](int v) { return x.names[v]; };
    std::vector<int> inner;
    double areaSum = 0;
    for (int v = 0; v < n; ++v) {
        if (x.isPole(v)) continue;
        const Rect& r = rects[v];
        if (!(r.width() > tol && r.depth() > tol)) return {false, name(v) + " has no area"};
        if (r.x0 < -tol || r.y0 < -tol || r.x1 > width + tol || r.y1 > depth + tol)
            return {false, name(v) + " lies outside the outline"};
        areaSum += r.area();
        inner.push_back(v);
    }
    if (std::abs(areaSum - width * depth) > tol * std::max(1.0, width * depth) * 10)
        return {false, "the rectangles do not fill the outline (area " + std::to_string(areaSum) +
                           " of " + std::to_string(width * depth) + ")"};
    std::vector<int> byX = inner;
    std::sort(byX.begin(), byX.end(), [&](int a, int b) { return rects[a].x0 < rects[b].x0; });
    for (std::size_t i = 0; i < byX.size(); ++i) {
        const Rect& a = rects[byX[i]];
        for (std::size_t j = i + 1; j < byX.size() && rects[byX[j]].x0 < a.x1 - tol; ++j) {
            const Rect& b = rects[byX[j]];
            if (std::min(a.y1, b.y1) - std::max(a.y0, b.y0) > tol &&
                std::min(a.x1, b.x1) - std::max(a.x0, b.x0) > tol)
                return {false, name(byX[i]) + " overlaps " + name(byX[j])};
        }
    }
    // Contacts of positive length, found through sorted side coordinates.
    std::set<std::pair<int, int>> contacts;
    auto collect = [&](bool verticalWalls) {
        std::vector<std::pair<double, int>> starts;
        for (int v : inner) starts.emplace_back(verticalWalls ? rects[v].x0 : rects[v].y0, v);
        std::sort(starts.begin(), starts.end());
        for (int u : inner) {
            const double end = verticalWalls ? rects[u].x1 : rects[u].y1;
            auto it = std::lower_bound(starts.begin(), starts.end(), std::make_pair(end - tol, -1));
            for (; it != starts.end() && it->first <= end + tol; ++it) {
                const int v = it->second;
                const Rect &a = rects[u], &b = rects[v];
                const double overlap = verticalWalls ? std::min(a.y1, b.y1) - std::max(a.y0, b.y0)
                                                     : std::min(a.x1, b.x1) - std::max(a.x0, b.x0);
                if (overlap > tol) contacts.insert(std::minmax(u, v));
            }
        }
    };
    collect(true);
    collect(false);
    for (int v : inner) {
        const Rect& r = rects[v];
        const bool touches[4] = {r.y1 > depth - tol, r.x1 > width - tol, r.y0 < tol, r.x0 < tol};
        for (Side side : allSides) {
            const bool adjacent = x.graph.hasEdge(v, x.pole(side));
            if (adjacent != touches[static_cast<int>(side)])
                return {false, name(v) + (adjacent ? " should" : " should not") + " touch the " +
                                   std::string(1, sideLetter(side)) + " side"};
        }
    }
    for (const auto& [u, v] : contacts)
        if (!x.graph.hasEdge(u, v)) return {false, name(u) + " and " + name(v) + " touch but are not adjacent"};
    for (const auto& [u, v] : x.graph.edgeList())
        if (!x.isPole(u) && !x.isPole(v) && !contacts.count(std::minmax(u, v)))
            return {false, name(u) + " and " + name(v) + " are adjacent but share no wall"};
    return {};
}

bool isOneSided(const ExtendedGraph& x, const RegularEdgeLabeling& rel) {
    const SegmentStructure s = maximalSegments(x, rel);
    std::vector<int> westOf(s.verticalCount, 0), eastOf(s.verticalCount, 0);
    std::vector<int> southOf(s.horizontalCount, 0), northOf(s.horizontalCount, 0);
    for (int v = 0; v < x.graph.vertexCount(); ++v) {
        if (x.isPole(v)) continue;
        ++westOf[s.east[v]]; // v lies west of its east segment
        ++eastOf[s.west[v]];
        ++southOf[s.north[v]];
        ++northOf[s.south[v]];
    }
    for (int k = 0; k < s.verticalCount; ++k) {
        if (k == s.westSegment || k == s.eastSegment) continue;
        if (westOf[k] != 1 && eastOf[k] != 1) return false;
    }
    for (int k = 0; k < s.horizontalCount; ++k) {
        if (k == s.southSegment || k == s.northSegment) continue;
        if (southOf[k] != 1 && northOf[k] != 1) return false;
    }
    return true;
}

} // namespace abut
