// SPDX-License-Identifier: MIT
// A simple plane graph stored as a rotation system: for every vertex, its
// neighbours in counter-clockwise order. Faces are traced with the face on the
// left of each dart, so bounded faces come out counter-clockwise and the outer
// face clockwise. This is the embedding every stage after `embed` works on.
#pragma once

#include <cstdint>
#include <unordered_set>
#include <utility>
#include <vector>

namespace abut {

class PlaneGraph {
public:
    PlaneGraph() = default;
    explicit PlaneGraph(int vertexCount) : rotation_(vertexCount) {}

    int vertexCount() const { return static_cast<int>(rotation_.size()); }
    int edgeCount() const { return static_cast<int>(edges_.size()); }
    int addVertex() {
        rotation_.emplace_back();
        return vertexCount() - 1;
    }

    const std::vector<int>& neighbours(int v) const { return rotation_[v]; }
    int degree(int v) const { return static_cast<int>(rotation_[v].size()); }
    bool hasEdge(int u, int v) const { return edges_.count(key(u, v)) > 0; }

    // Inserts edge u–v so that, counter-clockwise, v follows `uAfter` at u and u
    // follows `vAfter` at v; -1 appends (for vertices being built up in order).
    // Precondition: no edge u–v yet, u != v. O(deg u + deg v).
    void insertEdge(int u, int v, int uAfter, int vAfter);
    // Precondition: edge exists. O(deg u + deg v).
    void removeEdge(int u, int v);

    // Low-level building of several edges at once, for gadgets whose rotations
    // are known in full: a new vertex with its whole rotation, and neighbours
    // spliced into an existing rotation after `after`. The caller keeps both
    // ends consistent (every edge appears in both rotations).
    int addVertexWithRotation(std::vector<int> ccwNeighbours);
    void spliceRotation(int v, int after, const std::vector<int>& newNeighbours);
    // Replaces the whole rotation of v (used when building from an embedding);
    // call rebuildEdgeSet() afterwards.
    void setRotation(int v, std::vector<int> ccwNeighbours) { rotation_[v] = std::move(ccwNeighbours); }
    void rebuildEdgeSet();

    // Index of `w` in the rotation of `v`, -1 if absent. O(deg v).
    int position(int v, int w) const;
    // The dart that follows u→v on the face to its left: v→w.
    int nextOnFace(int u, int v) const;
    // Vertices of the face to the left of dart u→v, starting with u. O(face size).
    std::vector<int> faceOf(int u, int v) const;
    // Every face once, as its vertex cycle. O(V + E).
    std::vector<std::vector<int>> faces() const;

    // Common neighbours of u and v. O(min degree).
    std::vector<int> commonNeighbours(int u, int v) const;
    std::vector<std::pair<int, int>> edgeList() const;

private:
    static std::uint64_t key(int u, int v) {
        if (u > v) std::swap(u, v);
        return (static_cast<std::uint64_t>(static_cast<std::uint32_t>(u)) << 32) |
               static_cast<std::uint32_t>(v);
    }
    std::vector<std::vector<int>> rotation_;
    std::unordered_set<std::uint64_t> edges_;
};

} // namespace abut
