// SPDX-License-Identifier: MIT
#include "augment/extended_graph.h"

#include "augment/separating_triangles.h"

#include <algorithm>
#include <set>

namespace abut {

void nameVertices(ExtendedGraph& x, const std::vector<std::string>& roomIds) {
    std::set<std::string> taken(roomIds.begin(), roomIds.end());
    x.names = roomIds;
    auto unique = [&](std::string name) {
        while (taken.count(name)) name += "~";
        taken.insert(name);
        return name;
    };
    for (const char* p : {"N", "E", "S", "W"}) x.names.push_back(unique(p));
    for (int i = 0; i < x.spareCount(); ++i) x.names.push_back(unique("spare" + std::to_string(i + 1)));
}

StageCheck checkExtendedGraph(const ExtendedGraph& x) {
    const PlaneGraph& g = x.graph;
    auto fail = [](std::string why) { return StageCheck{false, std::move(why)}; };
    if (x.roomCount < 1) return fail("no rooms");
    if (g.vertexCount() < x.roomCount + 4) return fail("poles missing");
    if (static_cast<int>(x.names.size()) != g.vertexCount()) return fail("names do not match vertices");
    const int e = x.pole(Side::E), s = x.pole(Side::S), w = x.pole(Side::W);
    for (int v = 0; v < g.vertexCount(); ++v) {
        std::vector<int> rot = g.neighbours(v);
        std::sort(rot.begin(), rot.end());
        if (std::adjacent_find(rot.begin(), rot.end()) != rot.end())
            return fail("multiple edges at " + x.names[v]);
        if (std::find(rot.begin(), rot.end(), v) != rot.end()) return fail("loop at " + x.names[v]);
        for (int u : rot)
            if (u < 0 || u >= g.vertexCount() || g.position(u, v) < 0)
                return fail("rotation of " + x.names[v] + " is inconsistent");
        if (g.degree(v) < 2) return fail(x.names[v] + " has fewer than two neighbours");
    }
    const int pn = x.pole(Side::N);
    if (!g.hasEdge(pn, e) || !g.hasEdge(e, s) || !g.hasEdge(s, w) || !g.hasEdge(w, pn))
        return fail("the poles do not form the 4-cycle N-E-S-W");
    if (g.hasEdge(pn, s) || g.hasEdge(e, w)) return fail("a chord N-S or E-W");
    const std::vector<int> outer = g.faceOf(pn, e);
    if (outer != std::vector<int>{pn, e, s, w})
        return fail("the outer face traced from N->E is not N, E, S, W");
    const auto faces = g.faces();
    const int V = g.vertexCount(), E = g.edgeCount(), F = static_cast<int>(faces.size());
    if (V - E + F != 2) return fail("the rotation system is not planar (V - E + F != 2)");
    if (E != 3 * V - 7) return fail("edge count is not 3V - 7");
    int quads = 0;
    for (const auto& f : faces) {
        if (f.size() == 4) ++quads;
        else if (f.size() != 3) return fail("a face of " + std::to_string(f.size()) + " sides");
    }
    if (quads != 1) return fail("more than one face of four sides");
    const auto sep = separatingTriangles(g, outer);
    if (!sep.empty())
        return fail("separating triangle " + x.names[sep[0][0]] + ", " + x.names[sep[0][1]] + ", " +
                    x.names[sep[0][2]]);
    return {};
}

StageCheck checkExtendedGraph(const ExtendedGraph& x, const Brief& brief,
                              const std::vector<int>& dropped) {
    StageCheck c = checkExtendedGraph(x);
    if (!c.ok) return c;
    if (x.roomCount != static_cast<int>(brief.rooms.size()))
        return {false, "room count differs from the brief"};
    for (int i = 0; i < x.roomCount; ++i)
        if (x.names[i] != brief.rooms[i].id) return {false, "room order differs from the brief"};
    for (std::size_t i = 0; i < brief.adjacencies.size(); ++i) {
        if (std::find(dropped.begin(), dropped.end(), static_cast<int>(i)) != dropped.end()) continue;
        const int a = brief.roomIndex(brief.adjacencies[i].a);
        const int b = brief.roomIndex(brief.adjacencies[i].b);
        if (!x.graph.hasEdge(a, b))
            return {false, "adjacency " + brief.adjacencies[i].a + "-" + brief.adjacencies[i].b +
                               " is missing and not reported dropped"};
    }
    return {};
}

} // namespace abut
