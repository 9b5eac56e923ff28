// SPDX-License-Identifier: MIT
// The pole route (see route.h): rooms and the four poles embedded together,
// the poles' cycle outside, then the inside completed as in the frame route —
// cut vertices closed, separating triangles broken (a pole–pole edge never, a
// wished side only at a facade wish's cost), inner faces triangulated without
// a chord between poles.
#include "augment/route.h"
#include "augment/wording.h"

#include "augment/connect.h"
#include "augment/separating_triangles.h"
#include "augment/triangulate.h"

#include <algorithm>
#include <random>
#include <set>

namespace abut {

namespace {

using Edge = RouteContext::Edge;

// One graph of the route; `seed` ≠ 0 draws the added contacts at random.
// Nothing when rooms and wished sides are not planar together or the result
// fails its check.
std::optional<ExtendedGraph> buildWithPoles(const RouteContext& ctx, const PlaneGraph& rooms, unsigned seed,
                                            std::vector<Edge>& added, int& spares) {
    const int R = ctx.roomCount();
    if (R < 3) return std::nullopt;
    std::optional<PlaneGraph> embedded = ctx.embedWithPoles(rooms.edgeList());
    if (!embedded) return std::nullopt;
    PlaneGraph& g = *embedded;
    auto isPole = [R](int v) { return v >= R && v < R + 4; };
    auto allowed = [&](int a, int b) { return !(isPole(a) && isPole(b)); };
    auto edgeCost = [&](int u, int v) {
        if (isPole(u) && isPole(v)) return 1e12;
        if (isPole(u) || isPole(v)) {
            const int room = std::min(u, v), side = std::max(u, v) - R;
            return ctx.wishes()[room].has(static_cast<Side>(side)) ? 5000.0 : RouteContext::addedContactCost;
        }
        return ctx.cost(u, v);
    };
    const std::vector<int> outer{R, R + 1, R + 2, R + 3};
    for (int round = 0;; ++round) {
        for (const Edge& a : makeBiconnected(g, allowed)) added.push_back(a);
        const std::vector<Triangle> sep = separatingTriangles(g, outer);
        if (sep.empty()) break;
        if (round > 4 * R) return std::nullopt;
        for (const auto& [u, v] : cheapestCover(sep, edgeCost).edges) {
            if (isPole(u) && isPole(v)) return std::nullopt;
            g.removeEdge(u, v);
        }
    }
    for (const std::vector<int>& f : g.faces()) {
        std::set<int> distinct(f.begin(), f.end());
        if (distinct.size() != f.size()) return std::nullopt; // a cut vertex stayed
    }
    std::mt19937 rng(seed);
    const TriangulationReport rep = triangulateInnerFaces(g, R, R + 1, seed ? &rng : nullptr, allowed);
    for (const Edge& a : rep.addedEdges) added.push_back(a);
    spares = static_cast<int>(rep.spares.size());
    ExtendedGraph x;
    x.roomCount = R;
    x.graph = std::move(g);
    nameVertices(x, ctx.ids());
    if (!checkExtendedGraph(x).ok) return std::nullopt;
    return x;
}

class PoleRoute final : public AugmentRoute {
public:
    const char* name() const override { return "pole"; }
    RouteOutcome run(const RouteContext& ctx, const PlaneGraph& rooms) const override {
        RouteOutcome out;
        std::vector<Edge> firstAdded;
        int firstSpares = 0;
        for (int k = 0; k < std::max(1, ctx.options().poleRouteGraphs); ++k) {
            std::vector<Edge> added;
            int spares = 0;
            std::optional<ExtendedGraph> x =
                buildWithPoles(ctx, rooms, k == 0 ? 0u : 7919u * static_cast<unsigned>(k), added, spares);
            if (!x) break;
            if (k == 0) {
                firstAdded = std::move(added);
                firstSpares = spares;
            }
            out.graphs.push_back(std::move(*x));
        }
        if (out.graphs.empty()) return out;
        const ExtendedGraph& first = out.graphs.front();
        out.unmetFacade = roomsMissingTheirFacade(first, ctx.wishes());
        const Brief& brief = ctx.brief();
        for (std::size_t i = 0; i < brief.adjacencies.size(); ++i) {
            const int a = brief.roomIndex(brief.adjacencies[i].a), b = brief.roomIndex(brief.adjacencies[i].b);
            if (rooms.hasEdge(a, b) && !first.graph.hasEdge(a, b))
                addNote(out.notes, Severity::Warning, DiagnosticCode::DroppedAdjacency,
                        wording::droppedForEnclosure(brief, static_cast<int>(i)), {a, b}, {static_cast<int>(i)});
        }
        std::vector<Edge> contacts;
        for (const Edge& a : firstAdded)
            if (a.first < ctx.roomCount() && a.second < ctx.roomCount()) contacts.push_back(a);
        addContactNotes(out.notes, brief, contacts, "to complete the plan");
        if (firstSpares > 0)
            addNote(out.notes, Severity::Info, DiagnosticCode::SpareSpace, wording::spareSpaces(firstSpares), {});
        return out;
    }
};

} // namespace

const AugmentRoute& poleRoute() {
    static const PoleRoute route;
    return route;
}

} // namespace abut
