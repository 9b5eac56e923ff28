// SPDX-License-Identifier: MIT
#include "augment/triangulate.h"

#include <algorithm>

namespace abut {

namespace {

// Safe to add chord f[i]–f[j] inside face f?
bool safeChord(const PlaneGraph& g, const std::vector<int>& f, int i, int j,
               const std::function<bool(int, int)>& allowed) {
    const int k = static_cast<int>(f.size());
    const int u = f[i], w = f[j];
    if (u == w || g.hasEdge(u, w) || (allowed && !allowed(u, w))) return false;
    const int forward = (j - i + k) % k;
    for (int x : g.commonNeighbours(u, w)) {
        const bool earApex = (forward == 2 && x == f[(i + 1) % k]) ||
                             (forward == k - 2 && x == f[(j + 1) % k]);
        if (!earApex) return false;
    }
    return true;
}

// The cycle has no edge between two of its vertices that are not consecutive.
bool arcHasNoChord(const PlaneGraph& g, const std::vector<int>& f, int from, int to) {
    const int k = static_cast<int>(f.size());
    for (int p = from; p <= to; ++p)
        for (int q = p + 2; q <= to; ++q)
            if (f[p % k] != f[q % k] && g.hasEdge(f[p % k], f[q % k])) return false;
    return true;
}

void addSpares(PlaneGraph& g, const std::vector<int>& f, TriangulationReport& report) {
    const int k = static_cast<int>(f.size());
    // One spare adjacent to the whole cycle, when the cycle has no chord.
    bool wholeCycle = true;
    for (int p = 0; p < k && wholeCycle; ++p)
        for (int q = p + 2; q < k && wholeCycle; ++q)
            if (!(p == 0 && q == k - 1) && g.hasEdge(f[p], f[q])) wholeCycle = false;
    if (wholeCycle) {
        const int d = g.addVertexWithRotation(f);
        for (int i = 0; i < k; ++i) g.spliceRotation(f[i], f[(i + 1) % k], {d});
        report.spares.push_back(d);
        return;
    }
    // Greedy arcs [start, end] over positions 0..k (position k is f[0] again).
    std::vector<std::pair<int, int>> arcs;
    int start = 0;
    while (start < k) {
        int end = start + 1;
        while (end + 1 <= k && arcHasNoChord(g, f, start, end + 1)) ++end;
        arcs.emplace_back(start, end);
        start = end;
    }
    const bool twoArcsClash = arcs.size() == 2 && g.hasEdge(f[0], f[arcs[0].second % k]);
    if (arcs.size() < 3 && (arcs.size() != 2 || twoArcsClash)) {
        arcs.clear();
        for (int i = 0; i < k; ++i) arcs.emplace_back(i, i + 1);
    }
    const int m = static_cast<int>(arcs.size());
    const int first = g.vertexCount();
    auto spare = [&](int j) { return first + ((j % m) + m) % m; };
    const int centre = m >= 4 ? first + m : -1;
    for (int j = 0; j < m; ++j) {
        std::vector<int> rot;
        for (int p = arcs[j].first; p <= arcs[j].second; ++p) rot.push_back(f[p % k]);
        if (m == 2) rot.push_back(spare(j + 1));
        else {
            rot.push_back(spare(j + 1));
            if (centre >= 0) rot.push_back(centre);
            rot.push_back(spare(j - 1));
        }
        g.addVertexWithRotation(std::move(rot));
        report.spares.push_back(spare(j));
    }
    if (centre >= 0) {
        std::vector<int> rot;
        for (int j = 0; j < m; ++j) rot.push_back(spare(j));
        g.addVertexWithRotation(std::move(rot));
        report.spares.push_back(centre);
    }
    // Each cycle vertex takes its spares into the face angle, after its face
    // successor: first the spare of the arc it starts, then the one it ends.
    for (int j = 0; j < m; ++j) {
        for (int p = arcs[j].first; p < arcs[j].second; ++p) {
            const int v = f[p % k], succ = f[(p + 1) % k];
            if (p == arcs[j].first) g.spliceRotation(v, succ, {spare(j), spare(j - 1)});
            else g.spliceRotation(v, succ, {spare(j)});
        }
    }
}

} // namespace

void triangulateFace(PlaneGraph& g, const std::vector<int>& face, TriangulationReport& report,
                     std::mt19937* rng, const std::function<bool(int, int)>& allowed) {
    std::vector<std::vector<int>> stack{face};
    while (!stack.empty()) {
        std::vector<int> f = std::move(stack.back());
        stack.pop_back();
        const int k = static_cast<int>(f.size());
        if (k <= 3) continue;
        int ci = -1, cj = -1;
        std::vector<std::pair<int, int>> safe;
        for (int i = 0; i < k && (rng || safe.empty()); ++i)
            if (safeChord(g, f, i, (i + 2) % k, allowed)) safe.emplace_back(i, (i + 2) % k);
        for (int i = 0; i < k && safe.empty(); ++i)
            for (int d = 3; d <= k - 3 && safe.empty(); ++d)
                if (safeChord(g, f, i, (i + d) % k, allowed)) safe.emplace_back(i, (i + d) % k);
        if (!safe.empty()) {
            const std::size_t pick = rng ? std::uniform_int_distribution<std::size_t>(0, safe.size() - 1)(*rng) : 0;
            ci = safe[pick].first;
            cj = safe[pick].second;
        }
        if (ci < 0) {
            addSpares(g, f, report);
            continue;
        }
        const int u = f[ci], w = f[cj];
        g.insertEdge(u, w, f[(ci + 1) % k], f[(cj + 1) % k]);
        report.addedEdges.emplace_back(u, w);
        std::vector<int> a, b;
        for (int p = ci;; p = (p + 1) % k) {
            a.push_back(f[p]);
            if (p == cj) break;
        }
        for (int p = cj;; p = (p + 1) % k) {
            b.push_back(f[p]);
            if (p == ci) break;
        }
        stack.push_back(std::move(a));
        stack.push_back(std::move(b));
    }
}

TriangulationReport triangulateInnerFaces(PlaneGraph& g, int outerFrom, int outerTo, std::mt19937* rng,
                                          const std::function<bool(int, int)>& allowed) {
    TriangulationReport report;
    const std::vector<int> outer = g.faceOf(outerFrom, outerTo);
    for (const std::vector<int>& f : g.faces()) {
        if (f.size() <= 3) continue;
        // Faces are traced from different start darts: compare as rotations.
        if (f.size() == outer.size()) {
            const auto it = std::find(f.begin(), f.end(), outer[0]);
            if (it != f.end()) {
                std::vector<int> r(it, f.end());
                r.insert(r.end(), f.begin(), it);
                if (r == outer) continue;
            }
        }
        triangulateFace(g, f, report, rng, allowed);
    }
    return report;
}

} // namespace abut
