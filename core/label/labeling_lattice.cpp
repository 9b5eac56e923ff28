// SPDX-License-Identifier: MIT
#include "label/labeling_lattice.h"


#include <algorithm>
#include <numeric>
#include <random>
#include <set>

namespace abut {

namespace {

bool isRed(EdgeLabel l) { return l == EdgeLabel::OutRed || l == EdgeLabel::InRed; }

EdgeLabel turned(EdgeLabel l, Turn t) {
    // Up (counter-clockwise): u west of v → u below v; u below v → u east of v.
    if (t == Turn::Up) {
        switch (l) {
        case EdgeLabel::OutBlue: return EdgeLabel::OutRed;
        case EdgeLabel::InBlue: return EdgeLabel::InRed;
        case EdgeLabel::OutRed: return EdgeLabel::InBlue;
        case EdgeLabel::InRed: return EdgeLabel::OutBlue;
        default: return l;
        }
    }
    switch (l) {
    case EdgeLabel::OutRed: return EdgeLabel::OutBlue;
    case EdgeLabel::InRed: return EdgeLabel::InBlue;
    case EdgeLabel::InBlue: return EdgeLabel::OutRed;
    case EdgeLabel::OutBlue: return EdgeLabel::InRed;
    default: return l;
    }
}

// The four-block rule at one inner vertex (counter-clockwise: out-red,
// in-blue, in-red, out-blue), reading the labels through `label(i)`. O(deg v).
template <typename LabelAt>
bool vertexRuleHolds(int d, LabelAt label) {
    static const EdgeLabel order[4] = {EdgeLabel::OutRed, EdgeLabel::InBlue, EdgeLabel::InRed,
                                       EdgeLabel::OutBlue};
    int start = -1, changes = 0;
    EdgeLabel previous = label(d - 1);
    for (int i = 0; i < d; ++i) {
        const EdgeLabel l = label(i);
        if (l != previous) {
            ++changes;
            if (l == EdgeLabel::OutRed) start = i;
        }
        previous = l;
    }
    if (changes != 4 || start < 0) return false;
    int block = 0;
    for (int k = 0; k < d; ++k) {
        const EdgeLabel l = label((start + k) % d);
        if (l == order[block]) continue;
        if (block < 3 && l == order[block + 1]) ++block;
        else return false;
    }
    return block == 3;
}

// Neighbours of v on the left of the walk p → v → q (counter-clockwise from q to p).
std::vector<int> leftArc(const PlaneGraph& g, int p, int v, int q) {
    std::vector<int> out;
    const auto& rot = g.neighbours(v);
    const int d = static_cast<int>(rot.size());
    for (int k = 1, i = g.position(v, q); k < d; ++k) {
        const int u = rot[(i + k) % d];
        if (u == p) break;
        out.push_back(u);
    }
    return out;
}

} // namespace

std::vector<FourCycle> fourCycles(const ExtendedGraph& x) {
    const PlaneGraph& g = x.graph;
    std::set<std::array<int, 4>> seen;
    std::vector<FourCycle> out;
    for (int a = 0; a < g.vertexCount(); ++a) {
        if (x.isPole(a)) continue;
        const auto& na = g.neighbours(a);
        for (std::size_t i = 0; i < na.size(); ++i) {
            const int b = na[i];
            if (x.isPole(b)) continue;
            for (std::size_t j = i + 1; j < na.size(); ++j) {
                const int d = na[j];
                if (x.isPole(d)) continue;
                for (int c : g.commonNeighbours(b, d)) {
                    if (c == a || x.isPole(c)) continue;
                    // Canonical: smallest vertex first, then the smaller neighbour next.
                    std::array<int, 4> cyc{a, b, c, d};
                    const int m = static_cast<int>(std::min_element(cyc.begin(), cyc.end()) - cyc.begin());
                    std::rotate(cyc.begin(), cyc.begin() + m, cyc.end());
                    if (cyc[1] > cyc[3]) std::swap(cyc[1], cyc[3]);
                    if (!seen.insert(cyc).second) continue;
                    FourCycle fc;
                    fc.vertices = cyc;
                    // Which side is inside: the one that does not reach a pole.
                    std::set<int> onCycle(cyc.begin(), cyc.end());
                    for (int side = 0; side < 2 && fc.insideDarts.empty(); ++side) {
                        std::vector<std::vector<int>> arcs(4);
                        for (int k = 0; k < 4; ++k) {
                            const int p = cyc[(k + 3) % 4], v = cyc[k], q = cyc[(k + 1) % 4];
                            arcs[k] = side == 0 ? leftArc(g, p, v, q) : leftArc(g, q, v, p);
                        }
                        std::vector<int> stack;
                        std::set<int> inside;
                        for (const auto& arc : arcs)
                            for (int u : arc)
                                if (!onCycle.count(u) && inside.insert(u).second) stack.push_back(u);
                        bool reachesPole = false;
                        while (!stack.empty() && !reachesPole) {
                            const int u = stack.back();
                            stack.pop_back();
                            if (x.isPole(u)) reachesPole = true;
                            for (int w : g.neighbours(u))
                                if (!onCycle.count(w) && inside.insert(w).second) stack.push_back(w);
                        }
                        if (reachesPole) continue;
                        for (int k = 0; k < 4; ++k)
                            for (int u : arcs[k]) fc.insideDarts.emplace_back(cyc[k], g.position(cyc[k], u));
                        fc.rimDarts = fc.insideDarts;
                        for (int u : inside)
                            for (int t = 0; t < g.degree(u); ++t) fc.insideDarts.emplace_back(u, t);
                        fc.insideOnLeft = side == 0;
                    }
                    if (!fc.insideDarts.empty()) out.push_back(std::move(fc));
                }
            }
        }
    }
    return out;
}

bool isAlternating(const ExtendedGraph& x, const RegularEdgeLabeling& rel, const FourCycle& c) {
    const PlaneGraph& g = x.graph;
    bool red[4];
    for (int k = 0; k < 4; ++k) red[k] = isRed(rel.label(g, c.vertices[k], c.vertices[(k + 1) % 4]));
    return red[0] != red[1] && red[1] != red[2] && red[2] != red[3];
}

std::optional<Turn> flipSense(const ExtendedGraph& x, const RegularEdgeLabeling& rel, const FourCycle& c) {
    if (!isAlternating(x, rel, c)) return std::nullopt;
    for (Turn t : {Turn::Up, Turn::Down}) {
        bool ok = true;
        for (int k = 0; k < 4 && ok; ++k) {
            const int v = c.vertices[k];
            const std::vector<EdgeLabel>& lab = rel.at[v];
            ok = vertexRuleHolds(static_cast<int>(lab.size()), [&](int i) {
                for (const auto& [w, j] : c.rimDarts)
                    if (w == v && j == i) return turned(lab[i], t);
                return lab[i];
            });
        }
        if (ok) return t;
    }
    return std::nullopt;
}

bool flip(const ExtendedGraph& x, RegularEdgeLabeling& rel, const FourCycle& c, Turn turn) {
    if (flipSense(x, rel, c) != turn) return false;
    for (const auto& [v, i] : c.insideDarts) rel.at[v][i] = turned(rel.at[v][i], turn);
    return true;
}

RegularEdgeLabeling minimalLabeling(const ExtendedGraph& x, RegularEdgeLabeling rel,
                                    const std::vector<FourCycle>& cycles) {
    for (bool changed = true; changed;) {
        changed = false;
        for (const FourCycle& c : cycles)
            if (flip(x, rel, c, Turn::Down)) changed = true;
    }
    return rel;
}

LabelingEnumerator::LabelingEnumerator(const ExtendedGraph& x, const RegularEdgeLabeling& any,
                                       std::uint32_t seed)
    : x_(x), cycles_(fourCycles(x)) {
    const int m = static_cast<int>(cycles_.size());
    byRank_.resize(m);
    std::iota(byRank_.begin(), byRank_.end(), 0);
    if (seed != 0) {
        std::mt19937 rng(seed);
        std::shuffle(byRank_.begin(), byRank_.end(), rng);
    }
    rank_.resize(m);
    for (int r = 0; r < m; ++r) rank_[byRank_[r]] = r;
    // A cycle's flip sense reads its four boundary edges and the darts inside
    // it at its own vertices; index the cycles by those darts.
    dartBase_.assign(x.graph.vertexCount() + 1, 0);
    for (int v = 0; v < x.graph.vertexCount(); ++v) dartBase_[v + 1] = dartBase_[v] + x.graph.degree(v);
    cyclesAt_.resize(dartBase_.back());
    for (int c = 0; c < m; ++c) {
        const FourCycle& fc = cycles_[c];
        for (const auto& [v, i] : fc.rimDarts) cyclesAt_[dartBase_[v] + i].push_back(c);
        for (int k = 0; k < 4; ++k) {
            const int a = fc.vertices[k], b = fc.vertices[(k + 1) % 4];
            cyclesAt_[dartBase_[a] + x.graph.position(a, b)].push_back(c);
        }
    }
    stamp_.assign(m, 0);
    current_ = any;
    sense_.assign(m, std::nullopt);
    for (int c = 0; c < m; ++c) refresh(c);
    // Down to the minimal labeling.
    while (!downRanks_.empty()) apply(byRank_[*downRanks_.begin()], Turn::Down);
}

void LabelingEnumerator::refresh(int ci) {
    const int r = rank_[ci];
    if (sense_[ci] == Turn::Up) upRanks_.erase(r);
    if (sense_[ci] == Turn::Down) downRanks_.erase(r);
    sense_[ci] = flipSense(x_, current_, cycles_[ci]);
    if (sense_[ci] == Turn::Up) upRanks_.insert(r);
    if (sense_[ci] == Turn::Down) downRanks_.insert(r);
}

void LabelingEnumerator::apply(int ci, Turn t) {
    const FourCycle& c = cycles_[ci];
    for (const auto& [v, i] : c.insideDarts) current_.at[v][i] = turned(current_.at[v][i], t);
    ++clock_;
    for (const auto& [v, i] : c.insideDarts)
        for (int other : cyclesAt_[dartBase_[v] + i])
            if (stamp_[other] != clock_) {
                stamp_[other] = clock_;
                refresh(other);
            }
}

const RegularEdgeLabeling* LabelingEnumerator::next() {
    if (!started_) {
        started_ = true;
        stack_.push_back({-1, 0});
        return &current_;
    }
    while (!stack_.empty()) {
        for (auto it = upRanks_.lower_bound(stack_.back().nextRank); it != upRanks_.end();
             it = upRanks_.lower_bound(stack_.back().nextRank)) {
            const int r = *it;
            stack_.back().nextRank = r + 1;
            const int ci = byRank_[r];
            apply(ci, Turn::Up);
            // A child exactly when flipping this cycle back is its first down-move.
            if (*downRanks_.begin() == r) {
                stack_.push_back({ci, 0});
                return &current_;
            }
            apply(ci, Turn::Down);
        }
        const int undo = stack_.back().flippedUp;
        stack_.pop_back();
        if (undo >= 0) apply(undo, Turn::Down);
    }
    return nullptr;
}

std::uint64_t countLabelings(const ExtendedGraph& x, const RegularEdgeLabeling& any, std::uint64_t cap) {
    LabelingEnumerator e(x, any);
    std::uint64_t n = 0;
    while (n < cap && e.next()) ++n;
    return n;
}


} // namespace abut
