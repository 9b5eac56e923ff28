// SPDX-License-Identifier: MIT
// Small helpers for the tests of the plan search and its pieces: rooms and
// adjacencies in one line, random floor trees, a tiling check.
#pragma once

#include "brief/brief.h"
#include "dual/rectangular_dual.h"
#include "search/floor_tree.h"

#include <QString>

#include <algorithm>
#include <cmath>
#include <numeric>
#include <random>
#include <string>
#include <vector>

namespace abut::testing {

inline Room room(const std::string& id, double area) {
    Room r;
    r.id = id;
    r.area = area;
    return r;
}

inline Adjacency adjacency(const std::string& a, const std::string& b, Priority p = Priority::Must,
               AdjacencyKind k = AdjacencyKind::Door) {
    Adjacency x;
    x.a = a;
    x.b = b;
    x.priority = p;
    x.kind = k;
    return x;
}

// A random tree over n blocks: random cuts over a shuffled list.
inline FloorTree randomTree(int n, std::mt19937& rng) {
    FloorTree t(n);
    std::vector<int> nodes(n);
    std::iota(nodes.begin(), nodes.end(), 0);
    std::shuffle(nodes.begin(), nodes.end(), rng);
    while (nodes.size() > 1) {
        const std::size_t i = std::uniform_int_distribution<std::size_t>(0, nodes.size() - 2)(rng);
        nodes[i] = t.makeCut(std::uniform_int_distribution<int>(0, 1)(rng) == 1, nodes[i], nodes[i + 1]);
        nodes.erase(nodes.begin() + static_cast<long>(i) + 1);
    }
    t.setRoot(nodes[0]);
    return t;
}

// Rectangles tile [0,w]×[0,d] when their areas add up to it and no two overlap.
inline QString tilingProblem(const std::vector<Rect>& r, double w, double d) {
    double area = 0;
    for (std::size_t i = 0; i < r.size(); ++i) {
        if (!(r[i].width() > 0 && r[i].depth() > 0)) return QString("tile %1 has no area").arg(i);
        if (r[i].x0 < -1e-9 || r[i].y0 < -1e-9 || r[i].x1 > w + 1e-9 || r[i].y1 > d + 1e-9)
            return QString("tile %1 leaves the outline").arg(i);
        area += r[i].area();
        for (std::size_t j = i + 1; j < r.size(); ++j)
            if (std::min(r[i].x1, r[j].x1) - std::max(r[i].x0, r[j].x0) > 1e-9 &&
                std::min(r[i].y1, r[j].y1) - std::max(r[i].y0, r[j].y0) > 1e-9)
                return QString("tiles %1 and %2 overlap").arg(i).arg(j);
    }
    if (std::abs(area - w * d) > 1e-9 * w * d) return "the outline is not filled";
    return {};
}

} // namespace abut::testing
