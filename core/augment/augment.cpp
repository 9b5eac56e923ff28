// SPDX-License-Identifier: MIT
#include "augment/augment.h"
#include "augment/route.h"
#include "augment/wording.h"

#include "augment/connect.h"
#include "augment/separating_triangles.h"
#include "augment/triangulate.h"
#include "embed/planar_embedding.h"

#include <algorithm>
#include <cmath>
#include <iterator>
#include <map>
#include <optional>
#include <random>
#include <set>

namespace abut {

const char* toString(AugmentStatus s) {
    switch (s) {
    case AugmentStatus::Feasible: return "feasible";
    case AugmentStatus::Compromised: return "compromised";
    case AugmentStatus::Empty: return "empty";
    case AugmentStatus::Internal: return "internal-error";
    }
    return "?";
}


namespace {

using Edge = RouteContext::Edge;

// The stages both routes share — the embedding (crossings dropped), the
// small briefs written out directly, joining separate groups — then the two
// routes (route.h), the one that keeps more of the brief chosen, and the
// result checked.
class Builder {
public:
    Builder(const Brief& brief, const AugmentOptions& options)
        : ctx_(brief, options), n_(static_cast<int>(brief.rooms.size())) {}
    AugmentResult run();

private:
    PlaneGraph embedDroppingCrossings();
    bool embedWithFacades(const std::vector<Edge>& edges, PlaneGraph& out) const;
    bool smallBrief();
    void adopt(RouteOutcome&& outcome);
    int losses(const ExtendedGraph& x) const;
    void finish();

    RouteContext ctx_;
    int n_ = 0;
    AugmentResult result_;
};

PlaneGraph Builder::embedDroppingCrossings() {
    std::vector<Edge> edges;
    std::vector<double> costs;
    for (const auto& [a, b] : ctx_.brief().adjacencyRooms()) {
        edges.push_back(RouteContext::ordered(a, b));
        costs.push_back(ctx_.cost(edges.back().first, edges.back().second));
    }
    PlanarizedEmbedding planar = embedDroppingCheapest(n_, edges, costs, ctx_.sketch(), ctx_.options().keepGoing);
    // Name the first conflict, then each adjacency given up.
    for (std::size_t k = 0; k < planar.dropped.size(); ++k) {
        if (k == 0) {
            std::vector<int> rooms;
            std::map<int, int> degree;
            for (int adj : planar.witnesses[0]) {
                rooms.push_back(edges[adj].first);
                rooms.push_back(edges[adj].second);
                ++degree[edges[adj].first];
                ++degree[edges[adj].second];
            }
            int deg4 = 0;
            for (const auto& [v, d] : degree) deg4 += d == 4;
            addNote(result_.diagnostics, Severity::Error, DiagnosticCode::NonPlanar, wording::nonPlanar(ctx_.brief(), planar.witnesses[0], deg4 >= 5),
                 rooms, planar.witnesses[0]);
        }
        const int drop = planar.dropped[k];
        addNote(result_.diagnostics, Severity::Warning, DiagnosticCode::DroppedAdjacency, wording::droppedForCrossings(ctx_.brief(), drop),
             {edges[drop].first, edges[drop].second}, {drop});
    }
    std::vector<Edge> kept;
    for (std::size_t i = 0; i < edges.size(); ++i)
        if (std::find(planar.dropped.begin(), planar.dropped.end(), static_cast<int>(i)) == planar.dropped.end())
            kept.push_back(edges[i]);
    ctx_.setEmbeddingFromSketch(planar.embedding.fromSketch);
    result_.embeddingFromSketch = planar.embedding.fromSketch;
    if (!planar.embedding.fromSketch) {
        PlaneGraph guided;
        if (embedWithFacades(kept, guided)) return guided;
    }
    return std::move(planar.embedding.graph);
}

// A planar graph can have several embeddings; pick one that puts the rooms
// with facade wishes around the outside, in the order of their sides: the
// embedding with the poles (above), the poles then dropped. Returns false
// when there is none (the plain embedding is used).
bool Builder::embedWithFacades(const std::vector<std::pair<int, int>>& edges, PlaneGraph& out) const {
    const std::optional<PlaneGraph> withPoles = ctx_.embedWithPoles(edges);
    if (!withPoles) return false;
    out = PlaneGraph(n_);
    for (int v = 0; v < n_; ++v) {
        std::vector<int> rot;
        for (int u : withPoles->neighbours(v))
            if (u < n_) rot.push_back(u);
        out.setRotation(v, rot);
    }
    out.rebuildEdgeSet();
    return true;
}

// One or two rooms: the extended graph is written out directly.
bool Builder::smallBrief() {
    if (n_ > 2) return false;
    ExtendedGraph& x = result_.extended;
    x.roomCount = n_;
    const int N = n_, E = n_ + 1, S = n_ + 2, W = n_ + 3;
    PlaneGraph g(n_ + 4);
    if (n_ == 1) {
        g.setRotation(0, {E, N, W, S});
        g.setRotation(N, {W, 0, E});
        g.setRotation(E, {N, 0, S});
        g.setRotation(S, {E, 0, W});
        g.setRotation(W, {S, 0, N});
    } else {
        if (ctx_.brief().adjacencies.empty()) addContactNotes(result_.diagnostics, ctx_.brief(), {{0, 1}}, "a plan of two rooms always joins them");
        // Four arrangements: 0 west of 1, 1 west of 0, 0 north of 1, 1 north of 0.
        // Sides reached: west-of: the west room N,S,W and the east room N,E,S.
        auto reaches = [](int arrangement, int room) {
            const bool first = (arrangement % 2 == 0) == (room == 0);
            FacadeWish w;
            if (arrangement < 2) {
                for (Side s : {Side::N, Side::S}) w.add(s);
                w.add(first ? Side::W : Side::E);
            } else {
                for (Side s : {Side::E, Side::W}) w.add(s);
                w.add(first ? Side::N : Side::S);
            }
            return w;
        };
        int arrangement = 0;
        for (int a = 3; a >= 0; --a) {
            bool ok = true;
            for (int r = 0; r < 2; ++r) ok = ok && (ctx_.wishes()[r].sides & ~reaches(a, r).sides) == 0;
            if (ok) arrangement = a;
        }
        for (int r = 0; r < 2; ++r)
            if ((ctx_.wishes()[r].sides & ~reaches(arrangement, r).sides) != 0) result_.unmetFacade.push_back(r);
        const int x0 = arrangement % 2 == 0 ? 0 : 1, y0 = 1 - x0; // x0 west/north of y0
        if (arrangement < 2) {
            g.setRotation(x0, {y0, N, W, S});
            g.setRotation(y0, {E, N, x0, S});
            g.setRotation(N, {W, x0, y0, E});
            g.setRotation(E, {N, y0, S});
            g.setRotation(S, {E, y0, x0, W});
            g.setRotation(W, {S, x0, N});
        } else {
            g.setRotation(x0, {E, N, W, y0});
            g.setRotation(y0, {E, x0, W, S});
            g.setRotation(N, {W, x0, E});
            g.setRotation(E, {N, x0, y0, S});
            g.setRotation(S, {E, y0, W});
            g.setRotation(W, {S, y0, x0, N});
        }
    }
    g.rebuildEdgeSet();
    x.graph = std::move(g);
    nameVertices(x, ctx_.ids());
    return true;
}

AugmentResult Builder::run() {
    if (n_ == 0) {
        result_.status = AugmentStatus::Empty;
        result_.summary = wording::summaryEmpty();
        return result_;
    }
    PlaneGraph g = embedDroppingCrossings();
    if (smallBrief()) {
        finish();
        return result_;
    }
    const auto [comp, groups] = components(g);
    if (groups > 1) {
        const auto joined = joinComponents(g, result_.embeddingFromSketch ? ctx_.sketch()
                                                 : std::vector<std::optional<SketchPoint>>{});
        addContactNotes(result_.diagnostics, ctx_.brief(), joined,
                        "the brief has separate groups of rooms, and a plan is one piece");
    }
    // Where the two routes part.
    const std::size_t sharedNotes = result_.diagnostics.size();
    adopt(frameRoute().run(ctx_, g));
    finish();
    if (result_.status == AugmentStatus::Internal) return result_;
    RouteOutcome poles = poleRoute().run(ctx_, g);
    if (poles.graphs.empty()) return result_;
    if (losses(poles.graphs.front()) >= losses(result_.extended)) {
        result_.alternatives = std::move(poles.graphs);
        return result_;
    }
    result_.diagnostics.resize(sharedNotes);
    result_.dropped.clear();
    adopt(std::move(poles));
    finish();
    return result_;
}

// The first graph becomes the result, the others its alternatives.
void Builder::adopt(RouteOutcome&& outcome) {
    result_.frame = std::move(outcome.frame);
    result_.extended = std::move(outcome.graphs.front());
    result_.alternatives.assign(std::make_move_iterator(outcome.graphs.begin() + 1),
                                std::make_move_iterator(outcome.graphs.end()));
    result_.unmetFacade = std::move(outcome.unmetFacade);
    for (Diagnostic& d : outcome.notes) result_.diagnostics.push_back(std::move(d));
}

// Must adjacencies and facade wishes a graph gives up.
int Builder::losses(const ExtendedGraph& x) const {
    int lost = static_cast<int>(roomsMissingTheirFacade(x, ctx_.wishes()).size());
    for (const Adjacency& a : ctx_.brief().adjacencies)
        if (a.priority == Priority::Must && !x.graph.hasEdge(ctx_.brief().roomIndex(a.a), ctx_.brief().roomIndex(a.b)))
            ++lost;
    return lost;
}

void Builder::finish() {
    ExtendedGraph& x = result_.extended;
    for (std::size_t i = 0; i < ctx_.brief().adjacencies.size(); ++i) {
        const int a = ctx_.brief().roomIndex(ctx_.brief().adjacencies[i].a), b = ctx_.brief().roomIndex(ctx_.brief().adjacencies[i].b);
        if (!x.graph.hasEdge(a, b)) result_.dropped.push_back(static_cast<int>(i));
    }
    for (int v : result_.unmetFacade)
        addNote(result_.diagnostics, Severity::Warning, DiagnosticCode::FacadeUnmet, wording::facadeUnmet(ctx_.brief(), v), {v});
    bool mustLost = false;
    for (int d : result_.dropped) mustLost = mustLost || ctx_.brief().adjacencies[d].priority == Priority::Must;
    result_.status = (mustLost || !result_.unmetFacade.empty()) ? AugmentStatus::Compromised
                                                                : AugmentStatus::Feasible;
    const StageCheck check = checkExtendedGraph(x, ctx_.brief(), result_.dropped);
    if (!check.ok) {
        result_.status = AugmentStatus::Internal;
        result_.summary = wording::summaryInternal(check.problem);
        return;
    }
    if (result_.status == AugmentStatus::Feasible) {
        result_.summary = wording::summaryFeasible(static_cast<int>(result_.dropped.size()));
    } else {
        int musts = 0;
        for (int d : result_.dropped) musts += ctx_.brief().adjacencies[d].priority == Priority::Must;
        result_.summary = wording::summaryCompromised(musts, static_cast<int>(result_.unmetFacade.size()));
    }
}

} // namespace

ExtendedGraph extendFrame(const OuterFrame& frame, const std::vector<std::string>& roomIds,
                          const CornerAssignment& corners, TriangulationReport* report, unsigned seed) {
    ExtendedGraph x;
    x.roomCount = static_cast<int>(roomIds.size());
    x.graph = frame.graph;
    PlaneGraph& g = x.graph;
    const int R = x.roomCount;
    const auto sides = sidesOf(frame.cycle, corners);
    for (int s = 0; s < 4; ++s) {
        std::vector<int> rot{R + (s + 3) % 4};
        rot.insert(rot.end(), sides[s].begin(), sides[s].end());
        rot.push_back(R + (s + 1) % 4);
        g.addVertexWithRotation(std::move(rot));
    }
    const int k = static_cast<int>(frame.cycle.size());
    for (int i = 0; i < k; ++i) {
        // The sides that hold position i, in walk order: the first is the one
        // whose predecessor side does not hold it.
        bool on[4];
        for (int s = 0; s < 4; ++s) {
            const int from = corners.corner[s];
            const int to = s < 3 ? corners.corner[s + 1] : corners.corner[0] + k;
            on[s] = ((i - from) % k + k) % k <= to - from;
        }
        int first = 0;
        for (int s = 0; s < 4; ++s)
            if (on[s] && !on[(s + 3) % 4]) first = s;
        std::vector<int> poles;
        for (int t = 0; t < 4; ++t)
            if (on[(first + t) % 4]) poles.insert(poles.begin(), R + (first + t) % 4);
            else break;
        g.spliceRotation(frame.cycle[i], frame.cycle[(i + 1) % k], poles);
    }
    TriangulationReport local;
    TriangulationReport& rep = report ? *report : local;
    std::mt19937 rng(seed);
    rep = triangulateInnerFaces(g, R + 0, R + 1, seed ? &rng : nullptr);
    nameVertices(x, roomIds);
    return x;
}

AugmentResult buildExtendedGraph(const Brief& brief, const AugmentOptions& options) {
    return Builder(brief, options).run();
}

} // namespace abut
