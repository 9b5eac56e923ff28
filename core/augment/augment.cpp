// SPDX-License-Identifier: MIT
#include "augment/augment.h"
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

using Edge = std::pair<int, int>;
Edge ordered(int a, int b) { return a < b ? Edge{a, b} : Edge{b, a}; }

// Cost of giving up a contact: a brief's must outweighs any number of
// shoulds in practice, a door outweighs a wall of the same priority, and a
// contact Abut added itself costs next to nothing.
double adjacencyCost(const Adjacency& a) {
    return (a.priority == Priority::Must ? 10000.0 : 100.0) +
           (a.kind == AdjacencyKind::Door ? 10.0 : 0.0);
}
constexpr double addedContactCost = 1.0;

class Builder {
public:
    Builder(const Brief& brief, const AugmentOptions& options) : brief_(brief), options_(options) {
        n_ = static_cast<int>(brief.rooms.size());
        for (std::size_t i = 0; i < brief.adjacencies.size(); ++i) {
            const Edge e = ordered(brief.roomIndex(brief.adjacencies[i].a),
                                   brief.roomIndex(brief.adjacencies[i].b));
            briefEdge_[e] = static_cast<int>(i);
        }
        for (const Room& r : brief.rooms) {
            ids_.push_back(r.id);
            wishes_.push_back(r.facade);
        }
    }

    AugmentResult run();

private:
    double cost(int u, int v) const {
        const auto it = briefEdge_.find(ordered(u, v));
        return it == briefEdge_.end() ? addedContactCost : adjacencyCost(brief_.adjacencies[it->second]);
    }
    int adjacencyIndex(int u, int v) const {
        const auto it = briefEdge_.find(ordered(u, v));
        return it == briefEdge_.end() ? -1 : it->second;
    }
    void note(Severity sev, DiagnosticCode code, std::string message, std::vector<int> rooms,
              std::vector<int> adjacencies = {}) {
        std::sort(rooms.begin(), rooms.end());
        rooms.erase(std::unique(rooms.begin(), rooms.end()), rooms.end());
        result_.diagnostics.push_back(
            {sev, std::move(code), std::move(message), std::move(rooms), std::move(adjacencies)});
    }

    PlaneGraph embedDroppingCrossings();
    std::optional<PlaneGraph> embedWithPoles(const std::vector<Edge>& edges) const;
    bool embedWithFacades(const std::vector<std::pair<int, int>>& edges, PlaneGraph& out) const;
    void reportAddedContacts(const std::vector<Edge>& added, const char* why);
    void noteSpares(int count) {
        note(Severity::Info, DiagnosticCode::SpareSpace, wording::spareSpaces(count), {});
    }
    std::vector<int> chooseOuterFace(const PlaneGraph& g) const;
    void bringWishingPendantsOut(PlaneGraph& g) const;
    bool shrinkOutlineToWishes(PlaneGraph& g, const std::vector<int>& outer);
    bool breakSeparatingTriangles(PlaneGraph& g, const std::vector<int>& outer);
    void rankCorners(OuterFrame& frame) const;
    CornerSearch relaxFacadeWishes(const PlaneGraph& g, const std::vector<int>& outer);
    bool smallBrief();
    void finish();
    std::optional<ExtendedGraph> poleRoute(const PlaneGraph& rooms, unsigned seed,
                                           std::vector<Edge>& added, int& spares) const;
    void considerPoleRoute(const PlaneGraph& rooms, std::size_t sharedNotes);

    const Brief& brief_;
    AugmentOptions options_;
    int n_ = 0;
    std::map<Edge, int> briefEdge_;
    std::vector<std::string> ids_;
    std::vector<FacadeWish> wishes_;
    std::vector<std::optional<SketchPoint>> sketch_;
    AugmentResult result_;
};

PlaneGraph Builder::embedDroppingCrossings() {
    std::vector<Edge> edges;
    std::vector<double> costs;
    for (const Adjacency& a : brief_.adjacencies) {
        edges.push_back(ordered(brief_.roomIndex(a.a), brief_.roomIndex(a.b)));
        costs.push_back(cost(edges.back().first, edges.back().second));
    }
    for (const Room& r : brief_.rooms) {
        const SketchPoint* p = brief_.sketchPosition(r.id);
        sketch_.push_back(p ? std::optional<SketchPoint>(*p) : std::nullopt);
    }
    PlanarizedEmbedding planar = embedDroppingCheapest(n_, edges, costs, sketch_);
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
            note(Severity::Error, DiagnosticCode::NonPlanar, wording::nonPlanar(brief_, planar.witnesses[0], deg4 >= 5),
                 rooms, planar.witnesses[0]);
        }
        const int drop = planar.dropped[k];
        note(Severity::Warning, DiagnosticCode::DroppedAdjacency, wording::droppedForCrossings(brief_, drop),
             {edges[drop].first, edges[drop].second}, {drop});
    }
    std::vector<Edge> kept;
    for (std::size_t i = 0; i < edges.size(); ++i)
        if (std::find(planar.dropped.begin(), planar.dropped.end(), static_cast<int>(i)) == planar.dropped.end())
            kept.push_back(edges[i]);
    result_.embeddingFromSketch = planar.embedding.fromSketch;
    if (!planar.embedding.fromSketch) {
        PlaneGraph guided;
        if (embedWithFacades(kept, guided)) return guided;
    }
    return std::move(planar.embedding.graph);
}

// The rooms embedded together with four pole vertices: a cycle N–E–S–W, each
// pole joined to the rooms that wish its side, and a hub joined to all four
// to keep them outside; the hub is then dropped, so the poles' cycle is the
// outer face, traced N → E → S → W from the dart N → E, and each pole's
// rotation starts at the pole before it (as extendFrame writes it). Returns
// nothing when no room wishes a side or that graph is not planar (the wishes
// conflict).
std::optional<PlaneGraph> Builder::embedWithPoles(const std::vector<Edge>& edges) const {
    bool anySided = false;
    for (const FacadeWish& w : wishes_) anySided = anySided || w.sides;
    if (!anySided) return std::nullopt;
    const int R = n_, hub = n_ + 4;
    std::vector<Edge> all = edges;
    for (int s = 0; s < 4; ++s) {
        all.emplace_back(R + s, R + (s + 1) % 4);
        all.emplace_back(R + s, hub);
    }
    for (int v = 0; v < R; ++v)
        for (Side s : allSides)
            if (wishes_[v].has(s)) all.emplace_back(v, R + static_cast<int>(s));
    const EmbeddingResult e = embedPlanar(R + 5, all);
    if (e.status != EmbeddingStatus::Planar) return std::nullopt;
    // Boyer–Myrvold may return the mirror image; the sides must run N, E, S,
    // W clockwise, i.e. the hub lies to the left of the dart N → E.
    const bool mirrored = e.graph.nextOnFace(R, R + 1) != hub;
    PlaneGraph g(R + 4);
    for (int v = 0; v < R + 4; ++v) {
        std::vector<int> rot;
        for (int u : e.graph.neighbours(v))
            if (u != hub) rot.push_back(u);
        if (mirrored) std::reverse(rot.begin(), rot.end());
        if (v >= R) {
            const auto first = std::find(rot.begin(), rot.end(), R + (v - R + 3) % 4);
            std::rotate(rot.begin(), first, rot.end());
        }
        g.setRotation(v, std::move(rot));
    }
    g.rebuildEdgeSet();
    return g;
}

// A planar graph can have several embeddings; pick one that puts the rooms
// with facade wishes around the outside, in the order of their sides: the
// embedding with the poles (above), the poles then dropped. Returns false
// when there is none (the plain embedding is used).
bool Builder::embedWithFacades(const std::vector<std::pair<int, int>>& edges, PlaneGraph& out) const {
    const std::optional<PlaneGraph> withPoles = embedWithPoles(edges);
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

void Builder::reportAddedContacts(const std::vector<Edge>& added, const char* why) {
    for (const auto& [u, v] : added)
        note(Severity::Info, DiagnosticCode::AddedContact, wording::addedContact(brief_, u, v, why), {u, v});
}

std::vector<int> Builder::chooseOuterFace(const PlaneGraph& g) const {
    std::vector<int> best;
    double bestScore = -1e300;
    for (const std::vector<int>& f : g.faces()) {
        double score = 0.01 * static_cast<double>(f.size());
        std::set<int> on(f.begin(), f.end());
        for (int v = 0; v < n_; ++v)
            if (!wishes_[v].empty() && on.count(v)) score += 10.0;
        if (f.size() == 3 && n_ > 3) score -= 5.0; // would enclose everything else
        if (result_.embeddingFromSketch) {
            // The sketch's own outline is traced clockwise: negative area.
            double area = 0.0;
            for (std::size_t i = 0; i < f.size(); ++i) {
                const SketchPoint& a = *sketch_[f[i]];
                const SketchPoint& b = *sketch_[f[(i + 1) % f.size()]];
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

bool Builder::breakSeparatingTriangles(PlaneGraph& g, const std::vector<int>& outer) {
    const std::vector<Triangle> sep = separatingTriangles(g, outer);
    if (sep.empty()) return false;
    const Cover cover = cheapestCover(sep, [this](int u, int v) { return cost(u, v); });
    if (!cover.exact)
        note(Severity::Info, DiagnosticCode::CoverApproximate, wording::coverApproximate(), {});
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
        const int adj = adjacencyIndex(u, v);
        g.removeEdge(u, v);
        if (adj < 0) continue; // an added contact: nothing of the brief is lost
        std::vector<int> rooms{(*t)[0], (*t)[1], (*t)[2]};
        const std::string text = wording::droppedForSeparatingTriangle(brief_, rooms, fourth, adj);
        if (fourth >= 0) rooms.push_back(fourth);
        note(Severity::Warning, DiagnosticCode::DroppedAdjacency, text, rooms, {adj});
    }
    return true;
}

// A room hanging on a single neighbour can sit in any angle at that
// neighbour; when it wishes a facade, put it on the outline.
void Builder::bringWishingPendantsOut(PlaneGraph& g) const {
    const std::vector<int> outer = chooseOuterFace(g);
    const int k = static_cast<int>(outer.size());
    for (int v = 0; v < n_; ++v) {
        if (wishes_[v].empty() || g.degree(v) != 1) continue;
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
bool Builder::shrinkOutlineToWishes(PlaneGraph& g, const std::vector<int>& outer) {
    std::vector<int> walk = outer; // kept up to date as chords go in
    auto isWishing = [&](int v) { return v < n_ && !wishes_[v].empty(); };
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
    reportAddedContacts(added, "so that the rooms with facade wishes form the outline");
    return !added.empty();
}

// No corner assignment meets every side wish: give up as few as possible —
// one room's sides, then two rooms', then all — and say which.
CornerSearch Builder::relaxFacadeWishes(const PlaneGraph& g, const std::vector<int>& outer) {
    std::vector<int> sided;
    for (int v = 0; v < n_; ++v)
        if (wishes_[v].sides) sided.push_back(v);
    auto without = [&](std::vector<int> ignored) {
        std::vector<FacadeWish> w = wishes_;
        for (int v : ignored) w[v].sides = 0;
        return cornerAssignments(g, outer, w, options_.cornerLimit);
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
        note(Severity::Warning, DiagnosticCode::FacadeConflict, wording::facadeConflict(brief_, sided, ignored),
             ignored);
        return s;
    }
    return {};
}

void Builder::rankCorners(OuterFrame& frame) const {
    // Prefer sides whose room counts follow the footprint's proportions and,
    // with a sketch, rooms on the side they were drawn towards.
    const Footprint fp = brief_.effectiveFootprint();
    const double k = static_cast<double>(frame.cycle.size());
    const double along[4] = {fp.width, fp.depth, fp.width, fp.depth};
    const double perimeter = 2.0 * (fp.width + fp.depth);
    double cx = 0, cy = 0;
    const bool useSketch = result_.embeddingFromSketch;
    if (useSketch) {
        for (int v : frame.cycle) {
            cx += sketch_[v]->x;
            cy += sketch_[v]->y;
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
                    const double dx = sketch_[v]->x - cx, dy = sketch_[v]->y - cy;
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
        if (briefEdge_.empty()) reportAddedContacts({{0, 1}}, "a plan of two rooms always joins them");
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
            for (int r = 0; r < 2; ++r) ok = ok && (wishes_[r].sides & ~reaches(a, r).sides) == 0;
            if (ok) arrangement = a;
        }
        for (int r = 0; r < 2; ++r)
            if ((wishes_[r].sides & ~reaches(arrangement, r).sides) != 0) result_.unmetFacade.push_back(r);
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
    nameVertices(x, ids_);
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
        const auto joined = joinComponents(g, result_.embeddingFromSketch ? sketch_
                                                 : std::vector<std::optional<SketchPoint>>{});
        reportAddedContacts(joined, "the brief has separate groups of rooms, and a plan is one piece");
    }
    const PlaneGraph joined = g; // where the two routes part
    const std::size_t sharedNotes = result_.diagnostics.size();
    // Shape the outline before cut vertices are closed: fewer contacts stand
    // in the way of the ones that put wishing rooms on the outline.
    bringWishingPendantsOut(g);
    shrinkOutlineToWishes(g, chooseOuterFace(g));
    std::vector<int> outer;
    bool shrunk = false;
    for (int round = 0;; ++round) {
        reportAddedContacts(makeBiconnected(g), "so that no single room links two parts of the plan");
        outer = chooseOuterFace(g);
        if (breakSeparatingTriangles(g, outer)) continue;
        // Corners: with the wishes; else with fewer rooms on the outline;
        // else without the side wishes (reported).
        CornerSearch search = cornerAssignments(g, outer, wishes_, options_.cornerLimit);
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
                    if (chord.first < 0 || cost(outer[i], w) < cost(chord.first, chord.second))
                        chord = ordered(outer[i], w);
                }
            const int adj = adjacencyIndex(chord.first, chord.second);
            g.removeEdge(chord.first, chord.second);
            if (adj >= 0)
                note(Severity::Warning, DiagnosticCode::DroppedAdjacency, wording::droppedForOutline(brief_, adj),
                     {chord.first, chord.second}, {adj});
            continue;
        }
        result_.frame.graph = g;
        result_.frame.cycle = outer;
        result_.frame.corners = std::move(search.assignments);
        result_.frame.cornersTruncated = search.truncated;
        break;
    }
    rankCorners(result_.frame);
    const int choice = std::clamp(options_.cornerChoice, 0,
                                  static_cast<int>(result_.frame.corners.size()) - 1);
    const CornerAssignment& corners = result_.frame.corners[choice];
    // Facade wishes met?
    const auto sides = sidesOf(result_.frame.cycle, corners);
    for (int v = 0; v < n_; ++v) {
        if (wishes_[v].empty()) continue;
        bool met = true;
        for (Side s : allSides)
            if (wishes_[v].has(s))
                met = met && std::count(sides[static_cast<int>(s)].begin(), sides[static_cast<int>(s)].end(), v);
        if (wishes_[v].anySide)
            met = met && std::count(result_.frame.cycle.begin(), result_.frame.cycle.end(), v);
        if (!met) result_.unmetFacade.push_back(v);
    }
    TriangulationReport report;
    result_.extended = extendFrame(result_.frame, ids_, corners, &report);
    reportAddedContacts(report.addedEdges, "to complete the plan");
    if (!report.spares.empty())
        noteSpares(static_cast<int>(report.spares.size()));
    finish();
    considerPoleRoute(joined, sharedNotes);
    return result_;
}

// The pole route (see buildExtendedGraph): rooms and the four poles embedded
// together, the poles' cycle outside (a hub joined to the poles keeps it a
// face), then the inside completed as in the frame route — cut vertices
// closed, separating triangles broken (a pole–pole edge never, a wished side
// only at a facade wish's cost), inner faces triangulated without a chord
// between poles. Returns nothing when rooms and wished sides are not planar
// together or the result fails its check.
std::optional<ExtendedGraph> Builder::poleRoute(const PlaneGraph& rooms, unsigned seed,
                                                std::vector<Edge>& added, int& spares) const {
    if (n_ < 3) return std::nullopt;
    std::optional<PlaneGraph> embedded = embedWithPoles(rooms.edgeList());
    if (!embedded) return std::nullopt;
    PlaneGraph& g = *embedded;
    const int R = n_;
    auto isPole = [R](int v) { return v >= R && v < R + 4; };
    auto allowed = [&](int a, int b) { return !(isPole(a) && isPole(b)); };
    auto edgeCost = [&](int u, int v) {
        if (isPole(u) && isPole(v)) return 1e12;
        if (isPole(u) || isPole(v)) {
            const int room = std::min(u, v), side = std::max(u, v) - R;
            return wishes_[room].has(static_cast<Side>(side)) ? 5000.0 : addedContactCost;
        }
        return cost(u, v);
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
    nameVertices(x, ids_);
    if (!checkExtendedGraph(x).ok) return std::nullopt;
    return x;
}

// Runs the pole route after the frame route has finished; takes it over when
// it keeps more of the brief (fewer must adjacencies dropped and facade wishes
// unmet), else keeps its graphs as alternatives.
void Builder::considerPoleRoute(const PlaneGraph& rooms, std::size_t sharedNotes) {
    if (result_.status == AugmentStatus::Internal) return;
    std::vector<ExtendedGraph> graphs;
    std::vector<Edge> firstAdded;
    int firstSpares = 0;
    for (int k = 0; k < std::max(1, options_.poleRouteGraphs); ++k) {
        std::vector<Edge> added;
        int spares = 0;
        std::optional<ExtendedGraph> x = poleRoute(rooms, k == 0 ? 0u : 7919u * static_cast<unsigned>(k), added, spares);
        if (!x) break;
        if (k == 0) {
            firstAdded = std::move(added);
            firstSpares = spares;
        }
        graphs.push_back(std::move(*x));
    }
    if (graphs.empty()) return;
    auto losses = [&](const ExtendedGraph& x, std::vector<int>* unmet) {
        int lost = 0;
        for (const Adjacency& a : brief_.adjacencies)
            if (a.priority == Priority::Must && !x.graph.hasEdge(brief_.roomIndex(a.a), brief_.roomIndex(a.b)))
                ++lost;
        for (int v = 0; v < n_; ++v) {
            bool met = true, any = false;
            for (Side s : allSides) {
                const bool touches = x.graph.hasEdge(v, x.pole(s));
                any = any || touches;
                if (wishes_[v].has(s)) met = met && touches;
            }
            if (wishes_[v].anySide) met = met && any;
            if (!met) {
                ++lost;
                if (unmet) unmet->push_back(v);
            }
        }
        return lost;
    };
    std::vector<int> unmet;
    if (losses(graphs.front(), &unmet) >= losses(result_.extended, nullptr)) {
        result_.alternatives = std::move(graphs);
        return;
    }
    result_.diagnostics.resize(sharedNotes);
    result_.frame = OuterFrame{};
    result_.extended = std::move(graphs.front());
    result_.alternatives.assign(std::make_move_iterator(graphs.begin() + 1), std::make_move_iterator(graphs.end()));
    result_.unmetFacade = std::move(unmet);
    result_.dropped.clear();
    for (std::size_t i = 0; i < brief_.adjacencies.size(); ++i) {
        const int a = brief_.roomIndex(brief_.adjacencies[i].a), b = brief_.roomIndex(brief_.adjacencies[i].b);
        if (rooms.hasEdge(a, b) && !result_.extended.graph.hasEdge(a, b))
            note(Severity::Warning, DiagnosticCode::DroppedAdjacency,
                 wording::droppedForEnclosure(brief_, static_cast<int>(i)), {a, b}, {static_cast<int>(i)});
    }
    std::vector<Edge> contacts;
    for (const Edge& a : firstAdded)
        if (a.first < n_ && a.second < n_) contacts.push_back(a);
    reportAddedContacts(contacts, "to complete the plan");
    if (firstSpares > 0)
        noteSpares(firstSpares);
    finish();
}

void Builder::finish() {
    ExtendedGraph& x = result_.extended;
    for (std::size_t i = 0; i < brief_.adjacencies.size(); ++i) {
        const int a = brief_.roomIndex(brief_.adjacencies[i].a), b = brief_.roomIndex(brief_.adjacencies[i].b);
        if (!x.graph.hasEdge(a, b)) result_.dropped.push_back(static_cast<int>(i));
    }
    for (int v : result_.unmetFacade)
        note(Severity::Warning, DiagnosticCode::FacadeUnmet, wording::facadeUnmet(brief_, v), {v});
    bool mustLost = false;
    for (int d : result_.dropped) mustLost = mustLost || brief_.adjacencies[d].priority == Priority::Must;
    result_.status = (mustLost || !result_.unmetFacade.empty()) ? AugmentStatus::Compromised
                                                                : AugmentStatus::Feasible;
    const StageCheck check = checkExtendedGraph(x, brief_, result_.dropped);
    if (!check.ok) {
        result_.status = AugmentStatus::Internal;
        result_.summary = wording::summaryInternal(check.problem);
        return;
    }
    if (result_.status == AugmentStatus::Feasible) {
        result_.summary = wording::summaryFeasible(static_cast<int>(result_.dropped.size()));
    } else {
        int musts = 0;
        for (int d : result_.dropped) musts += brief_.adjacencies[d].priority == Priority::Must;
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
