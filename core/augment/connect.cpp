// SPDX-License-Identifier: MIT
#include "augment/connect.h"

#include <algorithm>
#include <cmath>
#include <limits>

namespace abut {

std::pair<std::vector<int>, int> components(const PlaneGraph& g) {
    std::vector<int> comp(g.vertexCount(), -1);
    int count = 0;
    std::vector<int> stack;
    for (int s = 0; s < g.vertexCount(); ++s) {
        if (comp[s] >= 0) continue;
        comp[s] = count;
        stack.push_back(s);
        while (!stack.empty()) {
            const int v = stack.back();
            stack.pop_back();
            for (int w : g.neighbours(v))
                if (comp[w] < 0) {
                    comp[w] = count;
                    stack.push_back(w);
                }
        }
        ++count;
    }
    return {comp, count};
}

namespace {

// Neighbour of v after which w goes to keep v's rotation counter-clockwise by
// sketch angle; -1 (append) when v has no neighbours or no positions are known.
int afterByAngle(const PlaneGraph& g, int v, int w, const std::vector<std::optional<SketchPoint>>& sk) {
    const auto& rot = g.neighbours(v);
    if (rot.empty() || sk.empty() || !sk[v] || !sk[w]) return -1;
    auto angle = [&](int x) {
        if (!sk[x]) return 0.0;
        return std::atan2(sk[x]->y - sk[v]->y, sk[x]->x - sk[v]->x);
    };
    const double a = angle(w);
    // The rotation is sorted by angle when it came from the sketch: find the
    // last neighbour whose angle is below a (cyclically).
    int best = rot.back();
    for (int x : rot)
        if (angle(x) < a) best = x;
    return best;
}

} // namespace

std::vector<std::pair<int, int>> joinComponents(PlaneGraph& g,
                                                const std::vector<std::optional<SketchPoint>>& sketch) {
    std::vector<std::pair<int, int>> added;
    auto [comp, count] = components(g);
    if (count <= 1) return added;
    const bool useSketch = !sketch.empty() && std::all_of(sketch.begin(), sketch.end(),
                                                          [](const auto& p) { return p.has_value(); });
    // Grow the main group (component 0) by joining the others one by one.
    std::vector<char> inMain(g.vertexCount(), 0);
    for (int v = 0; v < g.vertexCount(); ++v) inMain[v] = comp[v] == 0;
    std::vector<int> anchors; // rooms on the main group's largest face, used round-robin
    {
        std::vector<int> largest;
        for (const auto& f : g.faces())
            if (comp[f.front()] == 0 && f.size() > largest.size()) largest = f;
        anchors = largest.empty() ? std::vector<int>{0} : largest;
        std::sort(anchors.begin(), anchors.end());
        anchors.erase(std::unique(anchors.begin(), anchors.end()), anchors.end());
    }
    std::size_t nextAnchor = 0;
    for (int c = 1; c < count; ++c) {
        int u = -1, w = -1;
        if (useSketch) {
            double best = std::numeric_limits<double>::infinity();
            for (int a = 0; a < g.vertexCount(); ++a) {
                if (!inMain[a]) continue;
                for (int b = 0; b < g.vertexCount(); ++b) {
                    if (comp[b] != c) continue;
                    const double d = std::hypot(sketch[a]->x - sketch[b]->x, sketch[a]->y - sketch[b]->y);
                    if (d < best) {
                        best = d;
                        u = a;
                        w = b;
                    }
                }
            }
        } else {
            u = anchors[nextAnchor++ % anchors.size()];
            for (int b = 0; b < g.vertexCount() && w < 0; ++b)
                if (comp[b] == c) w = b;
        }
        g.insertEdge(u, w, afterByAngle(g, u, w, useSketch ? sketch : std::vector<std::optional<SketchPoint>>{}),
                     afterByAngle(g, w, u, useSketch ? sketch : std::vector<std::optional<SketchPoint>>{}));
        added.emplace_back(u, w);
        for (int v = 0; v < g.vertexCount(); ++v)
            if (comp[v] == c) inMain[v] = 1;
    }
    return added;
}

std::vector<std::pair<int, int>> makeBiconnected(PlaneGraph& g, const EdgeFilter& allowed) {
    std::vector<std::pair<int, int>> added;
    // Each edge a–b added in the angle a–c–b splits its face into the
    // triangle a–c–b, with no room twice, and the face less that visit of c:
    // a face is finished where it is, with no new face trace per edge (that
    // was O(n²) traces of O(n) on a chain of rooms). Other faces keep their
    // walks; an added edge only takes chances from them, never gives any.
    std::vector<int> visits(g.vertexCount(), 0);
    for (std::vector<int> face : g.faces()) {
        for (int c : face) ++visits[c];
        std::size_t i = 0, quiet = 0; // stop after a whole round with no edge added
        while (face.size() > 2 && quiet < face.size()) {
            const std::size_t k = face.size();
            i %= k;
            const int c = face[i];
            bool joined = false;
            if (visits[c] >= 2) {
                const int a = face[(i + k - 1) % k], b = face[(i + 1) % k];
                if (a != b && !g.hasEdge(a, b) && (!allowed || allowed(a, b))) {
                    const std::vector<int> common = g.commonNeighbours(a, b);
                    if (common.size() == 1 && common[0] == c) {
                        // Walk: ... z → a → c → b → y ...; the new edge goes into the
                        // angle z–a–c at a (after c) and c–b–y at b (after y).
                        g.insertEdge(a, b, c, face[(i + 2) % k]);
                        added.emplace_back(a, b);
                        face.erase(face.begin() + static_cast<std::ptrdiff_t>(i));
                        --visits[c];
                        joined = true;
                    }
                }
            }
            if (joined) {
                quiet = 0;
                i = (i + face.size() - 1) % face.size(); // a, whose next room is now b
            } else {
                ++quiet;
                ++i;
            }
        }
        for (int c : face) visits[c] = 0;
    }
    return added;
}

} // namespace abut
