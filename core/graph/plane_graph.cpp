// SPDX-License-Identifier: MIT
#include "graph/plane_graph.h"

#include <algorithm>
#include <cassert>

namespace abut {

void PlaneGraph::insertEdge(int u, int v, int uAfter, int vAfter) {
    assert(u != v && !hasEdge(u, v));
    auto place = [this](int at, int nb, int after) {
        std::vector<int>& rot = rotation_[at];
        if (after < 0) {
            rot.push_back(nb);
            return;
        }
        const int p = position(at, after);
        assert(p >= 0);
        rot.insert(rot.begin() + p + 1, nb);
    };
    place(u, v, uAfter);
    place(v, u, vAfter);
    edges_.insert(key(u, v));
}

void PlaneGraph::removeEdge(int u, int v) {
    assert(hasEdge(u, v));
    auto drop = [this](int at, int nb) {
        std::vector<int>& rot = rotation_[at];
        rot.erase(std::find(rot.begin(), rot.end(), nb));
    };
    drop(u, v);
    drop(v, u);
    edges_.erase(key(u, v));
}

int PlaneGraph::addVertexWithRotation(std::vector<int> ccwNeighbours) {
    const int v = vertexCount();
    for (int w : ccwNeighbours) edges_.insert(key(v, w));
    rotation_.push_back(std::move(ccwNeighbours));
    return v;
}

void PlaneGraph::spliceRotation(int v, int after, const std::vector<int>& newNeighbours) {
    std::vector<int>& rot = rotation_[v];
    const int p = position(v, after);
    assert(p >= 0);
    rot.insert(rot.begin() + p + 1, newNeighbours.begin(), newNeighbours.end());
    for (int w : newNeighbours) edges_.insert(key(v, w));
}

void PlaneGraph::rebuildEdgeSet() {
    edges_.clear();
    for (int v = 0; v < vertexCount(); ++v)
        for (int w : rotation_[v]) edges_.insert(key(v, w));
}

int PlaneGraph::position(int v, int w) const {
    const std::vector<int>& rot = rotation_[v];
    for (std::size_t i = 0; i < rot.size(); ++i)
        if (rot[i] == w) return static_cast<int>(i);
    return -1;
}

int PlaneGraph::nextOnFace(int u, int v) const {
    const std::vector<int>& rot = rotation_[v];
    const int p = position(v, u);
    return rot[(p + static_cast<int>(rot.size()) - 1) % rot.size()];
}

std::vector<int> PlaneGraph::faceOf(int u, int v) const {
    std::vector<int> face;
    int a = u, b = v;
    do {
        face.push_back(a);
        const int c = nextOnFace(a, b);
        a = b;
        b = c;
    } while (a != u || b != v);
    return face;
}

std::vector<std::vector<int>> PlaneGraph::faces() const {
    // Dart (v, i) = v → rotation_[v][i]; mark each dart once.
    std::vector<std::vector<char>> seen(rotation_.size());
    for (std::size_t v = 0; v < rotation_.size(); ++v) seen[v].assign(rotation_[v].size(), 0);
    std::vector<std::vector<int>> result;
    for (int v = 0; v < vertexCount(); ++v) {
        for (int i = 0; i < degree(v); ++i) {
            if (seen[v][i]) continue;
            std::vector<int> face;
            int a = v, b = rotation_[v][i];
            int ia = i;
            while (!seen[a][ia]) {
                seen[a][ia] = 1;
                face.push_back(a);
                const std::vector<int>& rot = rotation_[b];
                const int p = position(b, a);
                const int ib = (p + static_cast<int>(rot.size()) - 1) % static_cast<int>(rot.size());
                a = b;
                b = rot[ib];
                ia = ib;
            }
            result.push_back(std::move(face));
        }
    }
    return result;
}

std::vector<int> PlaneGraph::commonNeighbours(int u, int v) const {
    if (degree(u) > degree(v)) std::swap(u, v);
    std::vector<int> out;
    for (int w : rotation_[u])
        if (hasEdge(w, v)) out.push_back(w);
    return out;
}

std::vector<std::pair<int, int>> PlaneGraph::edgeList() const {
    std::vector<std::pair<int, int>> out;
    for (int v = 0; v < vertexCount(); ++v)
        for (int w : rotation_[v])
            if (v < w) out.emplace_back(v, w);
    return out;
}

} // namespace abut
