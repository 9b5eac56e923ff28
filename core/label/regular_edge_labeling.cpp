// SPDX-License-Identifier: MIT
#include "label/regular_edge_labeling.h"

#include <algorithm>

namespace abut {

namespace {

EdgeLabel opposite(EdgeLabel l) {
    switch (l) {
    case EdgeLabel::OutRed: return EdgeLabel::InRed;
    case EdgeLabel::InRed: return EdgeLabel::OutRed;
    case EdgeLabel::OutBlue: return EdgeLabel::InBlue;
    case EdgeLabel::InBlue: return EdgeLabel::OutBlue;
    case EdgeLabel::Outer: return EdgeLabel::Outer;
    }
    return EdgeLabel::Outer;
}

// Canonical ordering by peeling from the north-east (Kant & He 1997): the
// rooms not yet peeled, with W and S, are bounded by a contour from W to S; a
// contour vertex with no chord to the contour and at least two peeled
// neighbours can go. Reversed, this adds every vertex onto a contour of
// consecutive earlier neighbours with at least two later neighbours left.
class Peeling {
public:
    explicit Peeling(const ExtendedGraph& x)
        : x_(x), g_(x.graph), n_(g_.vertexCount()), next_(n_, -1), prev_(n_, -1),
          removed_(n_, 0), removedNeighbours_(n_, 0) {}

    // Vertices from the last peeled to the first; empty when peeling stops early.
    std::vector<int> forwardOrder() {
        const int N = x_.pole(Side::N), E = x_.pole(Side::E), W = x_.pole(Side::W),
                  S = x_.pole(Side::S);
        for (int p : {N, E}) remove(p);
        // Initial contour: W, the rooms along N (west to east), then along E
        // (north to south), then S. rot[N] = [W, ..., E], rot[E] = [N, ..., S].
        std::vector<int> contour{W};
        for (int v : g_.neighbours(N))
            if (!x_.isPole(v)) contour.push_back(v);
        for (int v : g_.neighbours(E))
            if (!x_.isPole(v) && v != contour.back()) contour.push_back(v);
        contour.push_back(S);
        for (std::size_t i = 0; i + 1 < contour.size(); ++i) link(contour[i], contour[i + 1]);
        std::vector<int> work(contour.begin(), contour.end());
        std::vector<int> peeled;
        const int inner = n_ - 4;
        while (!work.empty()) {
            const int v = work.back();
            work.pop_back();
            if (!removable(v)) continue;
            const int p = prev_[v], q = next_[v];
            // v's unpeeled neighbours, counter-clockwise from p to q, replace it.
            std::vector<int> inside;
            const std::vector<int>& rot = g_.neighbours(v);
            const int d = static_cast<int>(rot.size());
            for (int k = 1, i = g_.position(v, p); k < d; ++k) {
                const int u = rot[(i + k) % d];
                if (u == q) break;
                inside.push_back(u);
            }
            remove(v);
            peeled.push_back(v);
            next_[v] = prev_[v] = -1;
            int last = p;
            for (int u : inside) {
                link(last, u);
                last = u;
            }
            link(last, q);
            for (int u : inside) {
                work.push_back(u);
                for (int w : g_.neighbours(u))
                    if (onContour(w)) work.push_back(w);
            }
            work.push_back(p);
            work.push_back(q);
        }
        if (static_cast<int>(peeled.size()) != inner) return {};
        std::reverse(peeled.begin(), peeled.end());
        return peeled;
    }

private:
    bool onContour(int v) const { return next_[v] >= 0 || prev_[v] >= 0; }
    void link(int a, int b) {
        next_[a] = b;
        prev_[b] = a;
    }
    void remove(int v) {
        removed_[v] = 1;
        for (int u : g_.neighbours(v)) ++removedNeighbours_[u];
    }
    bool removable(int v) const {
        if (removed_[v] || x_.isPole(v) || !onContour(v)) return false;
        if (removedNeighbours_[v] < 2) return false;
        for (int u : g_.neighbours(v))
            if (u != prev_[v] && u != next_[v] && onContour(u)) return false; // a chord
        return true;
    }

    const ExtendedGraph& x_;
    const PlaneGraph& g_;
    int n_;
    std::vector<int> next_, prev_;
    std::vector<char> removed_;
    std::vector<int> removedNeighbours_;
};

// Replays the canonical ordering from the south-west, labelling each vertex's
// edges to its earlier neighbours: the run of contour vertices it lies on
// reads "red upward" (rooms stacked to its west) then "blue eastward" (rooms
// in a row below it); the upper part is west of it, the lower part below.
class Labeller {
public:
    explicit Labeller(const ExtendedGraph& x)
        : x_(x), g_(x.graph), n_(g_.vertexCount()), next_(n_, -1), placed_(n_, 0) {
        rel_.at.resize(n_);
        for (int v = 0; v < n_; ++v) rel_.at[v].assign(g_.degree(v), EdgeLabel::Outer);
    }

    LabelingResult run(const std::vector<int>& order) {
        LabelingResult result;
        const int W = x_.pole(Side::W), S = x_.pole(Side::S);
        placed_[W] = placed_[S] = 1;
        next_[W] = S;
        for (int v : order) {
            std::vector<int> run = placedRun(v);
            if (run.size() < 2) return stuck(result, v, "its earlier neighbours are not a run of the contour");
            std::size_t firstBelow = run.size() - 1;
            bool seenBlue = false;
            for (std::size_t i = 0; i + 1 < run.size(); ++i) {
                const int a = run[i], b = run[i + 1];
                if (a == W && b == S) continue;
                if (blueEast(a, b)) {
                    if (!seenBlue) firstBelow = i + 1;
                    seenBlue = true;
                } else if (!redUp(a, b) || seenBlue) {
                    return stuck(result, v, "the contour under it is not a staircase");
                }
            }
            for (std::size_t i = 0; i < run.size(); ++i)
                set(run[i], v, i < firstBelow ? EdgeLabel::OutBlue : EdgeLabel::OutRed);
            placed_[v] = 1;
            next_[run.front()] = v;
            next_[v] = run.back();
        }
        const int N = x_.pole(Side::N), E = x_.pole(Side::E);
        for (int u : g_.neighbours(N))
            if (!x_.isPole(u)) set(u, N, EdgeLabel::OutRed);
        for (int u : g_.neighbours(E))
            if (!x_.isPole(u)) set(u, E, EdgeLabel::OutBlue);
        result.labeling = std::move(rel_);
        return result;
    }

private:
    LabelingResult& stuck(LabelingResult& r, int v, const std::string& why) {
        r.status = LabelingStatus::Stuck;
        r.message = "cannot place " + x_.names[v] + ": " + why;
        return r;
    }
    void set(int from, int to, EdgeLabel l) {
        rel_.at[from][g_.position(from, to)] = l;
        rel_.at[to][g_.position(to, from)] = opposite(l);
    }
    EdgeLabel get(int from, int to) const { return rel_.at[from][g_.position(from, to)]; }
    bool redUp(int a, int b) const { return get(b, a) == EdgeLabel::OutRed; }
    bool blueEast(int a, int b) const { return get(a, b) == EdgeLabel::OutBlue; }

    // Placed neighbours of v, counter-clockwise (= along the contour from the
    // W end to the S end), if they form one block that is a run of the contour.
    std::vector<int> placedRun(int v) const {
        const std::vector<int>& rot = g_.neighbours(v);
        const int d = static_cast<int>(rot.size());
        int start = -1, count = 0;
        for (int i = 0; i < d; ++i) {
            if (!placed_[rot[i]]) continue;
            ++count;
            if (!placed_[rot[(i + d - 1) % d]]) {
                if (start >= 0) return {};
                start = i;
            }
        }
        if (start < 0) return {};
        std::vector<int> run;
        for (int i = 0; i < count; ++i) run.push_back(rot[(start + i) % d]);
        for (std::size_t i = 0; i + 1 < run.size(); ++i)
            if (next_[run[i]] != run[i + 1]) return {};
        return run;
    }

    const ExtendedGraph& x_;
    const PlaneGraph& g_;
    int n_;
    std::vector<int> next_;
    std::vector<char> placed_;
    RegularEdgeLabeling rel_;
};

} // namespace

LabelingResult computeRegularEdgeLabeling(const ExtendedGraph& x) {
    const std::vector<int> order = Peeling(x).forwardOrder();
    if (order.empty() && x.graph.vertexCount() > 4) {
        LabelingResult r;
        r.status = LabelingStatus::Stuck;
        r.message = "no canonical ordering found (is this an irreducible triangulation?)";
        return r;
    }
    return Labeller(x).run(order);
}

StageCheck checkRegularEdgeLabeling(const ExtendedGraph& x, const RegularEdgeLabeling& rel) {
    const PlaneGraph& g = x.graph;
    auto fail = [&](int v, const std::string& why) {
        return StageCheck{false, x.names[v] + ": " + why};
    };
    if (static_cast<int>(rel.at.size()) != g.vertexCount()) return {false, "size mismatch"};
    for (int v = 0; v < g.vertexCount(); ++v) {
        const auto& rot = g.neighbours(v);
        const auto& lab = rel.at[v];
        if (lab.size() != rot.size()) return fail(v, "label count differs from degree");
        for (std::size_t i = 0; i < rot.size(); ++i) {
            const int u = rot[i];
            const bool outer = x.isPole(v) && x.isPole(u);
            if (outer != (lab[i] == EdgeLabel::Outer)) return fail(v, "outer edge labels");
            if (rel.at[u][g.position(u, v)] != opposite(lab[i])) return fail(v, "ends disagree with " + x.names[u]);
        }
        if (x.isPole(v)) {
            const EdgeLabel want = v == x.pole(Side::N)   ? EdgeLabel::InRed
                                   : v == x.pole(Side::S) ? EdgeLabel::OutRed
                                   : v == x.pole(Side::W) ? EdgeLabel::OutBlue
                                                          : EdgeLabel::InBlue;
            for (std::size_t i = 0; i < rot.size(); ++i)
                if (!x.isPole(rot[i]) && lab[i] != want) return fail(v, "pole edge has the wrong label");
            continue;
        }
        // Counter-clockwise blocks: OutRed, InBlue, InRed, OutBlue — each once.
        static const EdgeLabel order[4] = {EdgeLabel::OutRed, EdgeLabel::InBlue, EdgeLabel::InRed,
                                           EdgeLabel::OutBlue};
        const int d = static_cast<int>(lab.size());
        int changes = 0, start = -1;
        for (int i = 0; i < d; ++i)
            if (lab[i] != lab[(i + d - 1) % d]) {
                ++changes;
                if (lab[i] == EdgeLabel::OutRed) start = i;
            }
        if (changes != 4 || start < 0) return fail(v, "labels do not form four blocks");
        int block = 0;
        for (int k = 0; k < d; ++k) {
            const EdgeLabel l = lab[(start + k) % d];
            if (l != order[block]) {
                if (block + 1 < 4 && l == order[block + 1]) ++block;
                else return fail(v, "blocks are not in the order north, west, south, east");
            }
        }
        if (block != 3) return fail(v, "a block is missing");
    }
    return {};
}

} // namespace abut
