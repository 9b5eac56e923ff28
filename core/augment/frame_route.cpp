// SPDX-License-Identifier: MIT
// The frame route (see route.h): the outline as a cycle of rooms.
//
//   put rooms with facade wishes on the outline → close cut vertices →
//   choose the outer cycle → break separating triangles (cheapest cover) →
//   assign the four corners (facade wishes; ranked) → add the poles →
//   triangulate inner faces.
#include "augment/route.h"
#include "augment/wording.h"

#include "augment/connect.h"
#include "augment/separating_triangles.h"
#include "augment/triangulate.h"

#include <algorithm>
#include <cmath>
#include <set>

namespace abut {

namespace {

using Edge = RouteContext::Edge;

class FrameBuilder {
public:
    explicit FrameBuilder(const RouteContext& ctx) : ctx_(ctx), n_(ctx.roomCount()) {}
    RouteOutcome run(PlaneGraph g);

private:
    std::vector<int> chooseOuterFace(const PlaneGraph& g) const;
    void bringWishingPendantsOut(PlaneGraph& g) const;
    bool shrinkOutlineToWishes(PlaneGraph& g, const std::vector<int>& outer);
    bool breakSeparatingTriangles(PlaneGraph& g, const std::vector<int>& outer);
    void rankCorners(OuterFrame& frame) const;
    CornerSearch relaxFacadeWishes(const PlaneGraph& g, const std::vector<int>& outer);

    const RouteContext& ctx_;
    int n_ = 0;
    RouteOutcome out_;
};

std::vector<int> FrameBuilder::chooseOuterFace(const PlaneGraph& g) const {
    std::vector<int> best;
    double bestScore = -1e300;
    for (const std::vector<int>& f : g.faces()) {
        double score = 0.01 * static_cast<double>(f.size());
        std::set<int> on(f.begin(), f.end());
        for (int v = 0; v < n_; ++v)
            if (!ctx_.wishes()[v].empty() && on.count(v)) score += 10.0;
        if (f.size() == 3 && n_ > 3) score -= 5.0; // would enclose everything else
        if (ctx_.embeddingFromSketch()) {
            // The sketch's own outline is traced clockwise: negative area.
            double area = 0.0;
            for (std::size_t i = 0; i < f.size(); ++i) {
                const SketchPoint& a = *ctx_.sketch()[f[i]];
                const SketchPoint& b = *ctx_.sketch()[f[(i + 1) % f.size()]];
                area += a.x * b.y - b.x * a.y;
            }
            if (area < 0) score += 3.0;
        }
        if (score > bestScore) {
            bestScore = score;
            best = f;
        }
    }
    return best;
}

bool FrameBuilder::breakSeparatingTriangles(PlaneGraph& g, const std::vector<int>& outer) {
    const std::vector<Triangle> sep = separatingTriangles(g, outer);
    if (sep.empty()) return false;
    const Cover cover = cheapestCover(sep, [this](int u, int v) { return ctx_.cost(u, v); });
    if (!cover.exact)
        addNote(out_.notes, Severity::Info, DiagnosticCode::CoverApproximate, wording::coverApproximate(), {});
    for (const auto& [u, v] : cover.edges) {
        // Explain with one triangle this edge breaks, and what it encloses.
        const Triangle* t = nullptr;
        for (const Triangle& tr : sep)
            if (std::count(tr.begin(), tr.end(), u) && std::count(tr.begin(), tr.end(), v)) t = &tr;
        // A fourth room touching all three is the classic case: four rooms that
        // must all touch each other.
        int fourth = -1;
        for (int x = 0; x < n_ && fourth < 0; ++x)
            if (std::none_of(t->begin(), t->end(), [x](int y) { return x == y; }) &&
                std::all_of(t->begin(), t->end(), [&](int y) { return g.hasEdge(x, y); }))
                fourth = x;
        const int adj = ctx_.adjacencyIndex(u, v);
        g.removeEdge(u, v);
        if (adj < 0) continue; // an added contact: nothing of the brief is lost
        std::vector<int> rooms{(*t)[0], (*t)[1], (*t)[2]};
        const std::string text = wording::droppedForSeparatingTriangle(ctx_.brief(), rooms, fourth, adj);
        if (fourth >= 0) rooms.push_back(fourth);
        addNote(out_.notes, Severity::Warning, DiagnosticCode::DroppedAdjacency, text, rooms, {adj});
    }
    return true;
}

// A room hanging on a single neighbour can sit in any angle at that
// neighbour; when it wishes a facade, put it on the outline.
void FrameBuilder::bringWishingPendantsOut(PlaneGraph& g) const {
    const std::vector<int> outer = chooseOuterFace(g);
    const int k = static_cast<int>(outer.size());
    for (int v = 0; v < n_; ++v) {
        if (ctx_.wishes()[v].empty() || g.degree(v) != 1) continue;
        if (std::count(outer.begin(), outer.end(), v)) continue;
        const int c = g.neighbours(v)[0];
        for (int i = 0; i < k; ++i) {
            if (outer[i] != c || outer[(i + 1) % k] == v || outer[(i + k - 1) % k] == v) continue;
            const int after = outer[(i + 1) % k];
            g.removeEdge(c, v);
            g.insertEdge(c, v, after, -1);
            break;
        }
    }
}

// Cuts rooms without a facade wish off the outline: a contact between two
// consecutive wishing rooms of the outer cycle, drawn outside, puts the rooms
// between them inside. Returns whether anything changed.
bool FrameBuilder::shrinkOutlineToWishes(PlaneGraph& g, const std::vector<int>& outer) {
    std::vector<int> walk = outer; // kept up to date as chords go in
    auto isWishing = [&](int v) { return v < n_ && !ctx_.wishes()[v].empty(); };
    if (std::count_if(walk.begin(), walk.end(), isWishing) < 3) return false;
    std::vector<Edge> added;
    // First cut single rooms without wishes off the outline where their two
    // outline neighbours may touch (an ear), rooms with most chords first.
    for (bool cut = true; cut && walk.size() > 4;) {
        cut = false;
        const int k = static_cast<int>(walk.size());
        int best = -1, bestChords = -1;
        for (int i = 0; i < k; ++i) {
            const int x = walk[i], a = walk[(i + k - 1) % k], b = walk[(i + 1) % k];
            if (isWishing(x) || a == b || std::count(walk.begin(), walk.end(), x) > 1) continue;
            if (g.hasEdge(a, b)) continue;
            const std::vector<int> common = g.commonNeighbours(a, b);
            if (common.size() != 1 || common[0] != x) continue;
            int chords = 0;
            for (int w : g.neighbours(x)) chords += std::count(walk.begin(), walk.end(), w) > 0;
            if (chords > bestChords) {
                bestChords = chords;
                best = i;
            }
        }
        if (best >= 0 && bestChords > 2) {
            const int a = walk[(best + k - 1) % k], b = walk[(best + 1) % k];
            g.insertEdge(a, b, walk[best], walk[(best + 2) % k]);
            added.emplace_back(a, b);
            walk.erase(walk.begin() + best);
            cut = true;
        }
    }
    for (std::size_t guard = 0; guard < outer.size(); ++guard) {
        const int k = static_cast<int>(walk.size());
        bool changed = false;
        for (int p = 0; p < k && !changed; ++p) {
            if (!isWishing(walk[p])) continue;
            int q = (p + 1) % k;
            while (!isWishing(walk[q])) q = (q + 1) % k;
            const int gap = (q - p + k) % k;
            if (gap < 2) continue;
            const int a = walk[p], b = walk[q];
            if (a == b || g.hasEdge(a, b)) continue;
            const std::vector<int> common = g.commonNeighbours(a, b);
            if (!(common.empty() || (gap == 2 && common.size() == 1 && common[0] == walk[(p + 1) % k])))
                continue;
            g.insertEdge(a, b, walk[(p + 1) % k], walk[(q + 1) % k]);
            added.emplace_back(a, b);
            // The outline now runs b → ... → a; the rooms between a and b are inside.
            std::vector<int> next;
            for (int i = q;; i = (i + 1) % k) {
                next.push_back(walk[i]);
                if (i == p) break;
            }
            walk = std::move(next);
            changed = true;
        }
        if (!changed || walk.size() <= 3) break;
    }
    addContactNotes(out_.notes, ctx_.brief(), added, "so that the rooms with facade wishes form the outline");
    return !added.empty();
}

// No corner assignment meets every side wish: give up as few as possible —
// one room's sides, then two rooms', then all — and say which.
CornerSearch FrameBuilder::relaxFacadeWishes(const PlaneGraph& g, const std::vector<int>& outer) {
    std::vector<int> sided;
    for (int v = 0; v < n_; ++v)
        if (ctx_.wishes()[v].sides) sided.push_back(v);
    auto without = [&](std::vector<int> ignored) {
        std::vector<FacadeWish> w = ctx_.wishes();
        for (int v : ignored) w[v].sides = 0;
        return cornerAssignments(g, outer, w, ctx_.options().cornerLimit);
    };
    const int m = static_cast<int>(sided.size());
    std::vector<std::vector<int>> tries;
    for (int i = 0; i < m; ++i) tries.push_back({sided[i]});
    if (m <= 16)
        for (int i = 0; i < m; ++i)
            for (int j = i + 1; j < m; ++j) tries.push_back({sided[i], sided[j]});
    tries.push_back(sided);
    for (const std::vector<int>& ignored : tries) {
        CornerSearch s = without(ignored);
        if (s.assignments.empty()) continue;
        addNote(out_.notes, Severity::Warning, DiagnosticCode::FacadeConflict, wording::facadeConflict(ctx_.brief(), sided, ignored),
             ignored);
        return s;
    }
    return {};
}

void FrameBuilder::rankCorners(OuterFrame& frame) const {
    // Prefer sides whose room counts follow the footprint's proportions and,
    // with a sketch, rooms on the side they were drawn towards.
    const Footprint fp = ctx_.brief().effectiveFootprint();
    const double k = static_cast<double>(frame.cycle.size());
    const double along[4] = {fp.width, fp.depth, fp.width, fp.depth};
    const double perimeter = 2.0 * (fp.width + fp.depth);
    double cx = 0, cy = 0;
    const bool useSketch = ctx_.embeddingFromSketch();
    if (useSketch) {
        for (int v : frame.cycle) {
            cx += ctx_.sketch()[v]->x;
            cy += ctx_.sketch()[v]->y;
        }
        cx /= k;
        cy /= k;
    }
    const double normal[4][2] = {{0, 1}, {1, 0}, {0, -1}, {-1, 0}};
    std::vector<std::pair<double, std::size_t>> scored;
    for (std::size_t i = 0; i < frame.corners.size(); ++i) {
        const auto sides = sidesOf(frame.cycle, frame.corners[i]);
        double penalty = 0.0;
        for (int s = 0; s < 4; ++s) {
            const double target = std::max(1.0, (k + 4.0) * along[s] / perimeter);
            const double d = static_cast<double>(sides[s].size()) - target;
            penalty += d * d;
            if (useSketch)
                for (int v : sides[s]) {
                    const double dx = ctx_.sketch()[v]->x - cx, dy = ctx_.sketch()[v]->y - cy;
                    const double len = std::hypot(dx, dy);
                    if (len > 0) penalty -= 2.0 * (dx * normal[s][0] + dy * normal[s][1]) / len;
                }
        }
        scored.emplace_back(penalty, i);
    }
    std::stable_sort(scored.begin(), scored.end());
    std::vector<CornerAssignment> ranked;
    for (const auto& [p, i] : scored) ranked.push_back(frame.corners[i]);
    frame.corners = std::move(ranked);
}

RouteOutcome FrameBuilder::run(PlaneGraph g) {
    // Shape the outline before cut vertices are closed: fewer contacts stand
    // in the way of the ones that put wishing rooms on the outline.
    bringWishingPendantsOut(g);
    shrinkOutlineToWishes(g, chooseOuterFace(g));
    std::vector<int> outer;
    bool shrunk = false;
    for (int round = 0;; ++round) {
        addContactNotes(out_.notes, ctx_.brief(), makeBiconnected(g), "so that no single room links two parts of the plan");
        outer = chooseOuterFace(g);
        if (breakSeparatingTriangles(g, outer)) continue;
        // Corners: with the wishes; else with fewer rooms on the outline;
        // else without the side wishes (reported).
        CornerSearch search = cornerAssignments(g, outer, ctx_.wishes(), ctx_.options().cornerLimit);
        if (search.assignments.empty() && !shrunk) {
            shrunk = true;
            if (shrinkOutlineToWishes(g, outer)) continue;
        }
        if (search.assignments.empty()) search = relaxFacadeWishes(g, outer);
        if (search.assignments.empty()) {
            // Too many rooms cut off parts of the outline: give up the
            // cheapest chord of the outer cycle and try again.
            std::set<int> on(outer.begin(), outer.end());
            Edge chord{-1, -1};
            const int k = static_cast<int>(outer.size());
            for (int i = 0; i < k; ++i)
                for (int w : g.neighbours(outer[i])) {
                    const auto it = std::find(outer.begin(), outer.end(), w);
                    if (it == outer.end()) continue;
                    const int d = (static_cast<int>(it - outer.begin()) - i + k) % k;
                    if (d == 1 || d == k - 1) continue;
                    if (chord.first < 0 || ctx_.cost(outer[i], w) < ctx_.cost(chord.first, chord.second))
                        chord = RouteContext::ordered(outer[i], w);
                }
            const int adj = ctx_.adjacencyIndex(chord.first, chord.second);
            g.removeEdge(chord.first, chord.second);
            if (adj >= 0)
                addNote(out_.notes, Severity::Warning, DiagnosticCode::DroppedAdjacency, wording::droppedForOutline(ctx_.brief(), adj),
                     {chord.first, chord.second}, {adj});
            continue;
        }
        out_.frame.graph = g;
        out_.frame.cycle = outer;
        out_.frame.corners = std::move(search.assignments);
        out_.frame.cornersTruncated = search.truncated;
        break;
    }
    rankCorners(out_.frame);
    const int choice = std::clamp(ctx_.options().cornerChoice, 0,
                                  static_cast<int>(out_.frame.corners.size()) - 1);
    const CornerAssignment& corners = out_.frame.corners[choice];
    TriangulationReport report;
    out_.graphs.push_back(extendFrame(out_.frame, ctx_.ids(), corners, &report));
    out_.unmetFacade = roomsMissingTheirFacade(out_.graphs.front(), ctx_.wishes());
    addContactNotes(out_.notes, ctx_.brief(), report.addedEdges, "to complete the plan");
    if (!report.spares.empty())
        addNote(out_.notes, Severity::Info, DiagnosticCode::SpareSpace,
                wording::spareSpaces(static_cast<int>(report.spares.size())), {});
    return std::move(out_);
}

class FrameRoute final : public AugmentRoute {
public:
    const char* name() const override { return "frame"; }
    RouteOutcome run(const RouteContext& context, const PlaneGraph& rooms) const override {
        return FrameBuilder(context).run(rooms);
    }
};

} // namespace

const AugmentRoute& frameRoute() {
    static const FrameRoute route;
    return route;
}

} // namespace abut
