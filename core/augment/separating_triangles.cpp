// SPDX-License-Identifier: MIT
#include "augment/separating_triangles.h"

#include <algorithm>
#include <limits>
#include <map>
#include <set>

namespace abut {

namespace {

Triangle sorted(int a, int b, int c) {
    Triangle t{a, b, c};
    std::sort(t.begin(), t.end());
    return t;
}

using Edge = std::pair<int, int>;

std::array<Edge, 3> edgesOf(const Triangle& t) {
    return {Edge{t[0], t[1]}, Edge{t[0], t[2]}, Edge{t[1], t[2]}};
}

// Exact minimum-cost cover of a small group by depth-first branch and bound on
// the first uncovered triangle's three edges; explicit stack.
std::vector<Edge> exactCover(const std::vector<Triangle>& group,
                             const std::function<double(int, int)>& cost) {
    struct State {
        std::vector<Edge> chosen;
        double cost;
    };
    double best = std::numeric_limits<double>::infinity();
    std::vector<Edge> bestEdges;
    std::vector<State> stack{{{}, 0.0}};
    while (!stack.empty()) {
        State s = std::move(stack.back());
        stack.pop_back();
        if (s.cost >= best) continue;
        const Triangle* open = nullptr;
        for (const Triangle& t : group) {
            bool covered = false;
            for (const Edge& e : edgesOf(t))
                covered = covered || std::find(s.chosen.begin(), s.chosen.end(), e) != s.chosen.end();
            if (!covered) {
                open = &t;
                break;
            }
        }
        if (!open) {
            best = s.cost;
            bestEdges = s.chosen;
            continue;
        }
        for (const Edge& e : edgesOf(*open)) {
            State next = s;
            next.chosen.push_back(e);
            next.cost += cost(e.first, e.second);
            if (next.cost < best) stack.push_back(std::move(next));
        }
    }
    return bestEdges;
}

std::vector<Edge> greedyCover(const std::vector<Triangle>& group,
                              const std::function<double(int, int)>& cost) {
    std::vector<char> covered(group.size(), 0);
    std::vector<Edge> chosen;
    std::size_t left = group.size();
    while (left > 0) {
        std::map<Edge, int> hits;
        for (std::size_t i = 0; i < group.size(); ++i)
            if (!covered[i])
                for (const Edge& e : edgesOf(group[i])) ++hits[e];
        Edge bestEdge{};
        double bestRatio = std::numeric_limits<double>::infinity();
        for (const auto& [e, h] : hits) {
            const double r = cost(e.first, e.second) / h;
            if (r < bestRatio) {
                bestRatio = r;
                bestEdge = e;
            }
        }
        chosen.push_back(bestEdge);
        for (std::size_t i = 0; i < group.size(); ++i) {
            if (covered[i]) continue;
            const auto es = edgesOf(group[i]);
            if (std::find(es.begin(), es.end(), bestEdge) != es.end()) {
                covered[i] = 1;
                --left;
            }
        }
    }
    return chosen;
}

} // namespace

std::vector<Triangle> separatingTriangles(const PlaneGraph& g, const std::vector<int>& outerFace) {
    // How often each triangle is traced as a face; the outer face's trace does
    // not count (a lone triangle is traced twice: inside and outside).
    std::map<Triangle, int> innerTraces;
    for (const std::vector<int>& f : g.faces())
        if (f.size() == 3) ++innerTraces[sorted(f[0], f[1], f[2])];
    if (outerFace.size() == 3) --innerTraces[sorted(outerFace[0], outerFace[1], outerFace[2])];

    std::vector<Triangle> out;
    for (int u = 0; u < g.vertexCount(); ++u) {
        for (int v : g.neighbours(u)) {
            if (v <= u) continue;
            for (int w : g.commonNeighbours(u, v)) {
                if (w <= v) continue;
                const auto it = innerTraces.find(Triangle{u, v, w});
                if (it == innerTraces.end() || it->second <= 0) out.push_back(Triangle{u, v, w});
            }
        }
    }
    return out;
}

Cover cheapestCover(const std::vector<Triangle>& triangles,
                    const std::function<double(int, int)>& edgeCost) {
    Cover cover;
    // Group triangles that share an edge (union-find over triangle indices).
    std::vector<int> parent(triangles.size());
    for (std::size_t i = 0; i < parent.size(); ++i) parent[i] = static_cast<int>(i);
    auto find = [&](int x) {
        while (parent[x] != x) x = parent[x] = parent[parent[x]];
        return x;
    };
    std::map<Edge, int> firstOwner;
    for (std::size_t i = 0; i < triangles.size(); ++i)
        for (const Edge& e : edgesOf(triangles[i])) {
            auto [it, fresh] = firstOwner.emplace(e, static_cast<int>(i));
            if (!fresh) parent[find(static_cast<int>(i))] = find(it->second);
        }
    std::map<int, std::vector<Triangle>> groups;
    for (std::size_t i = 0; i < triangles.size(); ++i)
        groups[find(static_cast<int>(i))].push_back(triangles[i]);
    for (const auto& [root, group] : groups) {
        std::vector<Edge> chosen;
        if (static_cast<int>(group.size()) <= exactCoverLimit) {
            chosen = exactCover(group, edgeCost);
        } else {
            chosen = greedyCover(group, edgeCost);
            cover.exact = false;
        }
        for (const Edge& e : chosen) {
            cover.edges.push_back(e);
            cover.cost += edgeCost(e.first, e.second);
        }
    }
    return cover;
}

} // namespace abut
