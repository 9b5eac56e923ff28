// SPDX-License-Identifier: MIT
#include "search/detail/moves.h"

#include <algorithm>
#include <cmath>

namespace abut::detail {

namespace {
// The side of the outer rectangle that an outside rectangle lies beyond.
Side sideFacing(const Rect& outer, const Rect& o, double tol) {
    if (o.y0 >= outer.y1 - tol) return Side::N;
    if (o.y1 <= outer.y0 + tol) return Side::S;
    if (o.x0 >= outer.x1 - tol) return Side::E;
    return Side::W;
}

} // namespace

int Moves::ancestorOf(const FloorTree& t, int block, int up) const {
    int v = t.leafOf(block);
    for (int k = 0; k < up && t.node(v).parent >= 0; ++k) v = t.node(v).parent;
    return v;
}

bool Moves::onExterior(int i, int a, Side s) const {
    return i != a && !p_.blocks[i].cutout && exteriorDistance(p_, *rects_, (*rects_)[i], s) <= p_.lineTolerance();
}

bool Moves::sharesMustNeighbour(int i, int a) const {
    for (int li : p_.linksOf[a]) {
        const SearchProblem::Link& l = p_.links[li];
        if (!l.must) continue;
        const int n = l.a == a ? l.b : l.a;
        for (int lj : p_.linksOf[i]) {
            const SearchProblem::Link& m = p_.links[lj];
            if (m.must && (m.a == i ? m.b : m.a) == n) return true;
        }
    }
    return false;
}

int Moves::touching(int b) {
    std::vector<int> near;
    for (int i = 0; i < p_.blockCount(); ++i)
        if (i != b && sharedWallLength((*rects_)[i], (*rects_)[b], p_.lineTolerance()) > 0) near.push_back(i);
    return near.empty() ? -1 : near[randomInt(static_cast<int>(near.size()))];
}

bool Moves::propose(FloorTree& t, const std::vector<Rect>& rects, const std::vector<Violation>& violations) {
    rects_ = &rects;
    if (p_.blockCount() < 2) return false;
    if (!violations.empty() && unit() < 0.4)
        return aimed(t, violations[randomInt(static_cast<int>(violations.size()))]);
    return atRandom(t);
}

bool Moves::aimed(FloorTree& t, const Violation& v) {
    switch (v.kind) {
    case RequirementKind::Door:
    case RequirementKind::Adjacency: return atLink(t, v);
    case RequirementKind::Facade: return atFacade(t, v);
    default: return atShape(t, v); // MinWidth, MaxAspect
    }
}

// A block that must reach a rectangle outside: towards the side it faces —
// swapped with a block there, beside one, or as a strip along that side.
bool Moves::atPort(FloorTree& t, int a, const Rect& port) {
    const double tol = p_.lineTolerance();
    const Side s = sideFacing(p_.outer, port, tol);
    std::vector<int> there;
    for (int i = 0; i < p_.blockCount(); ++i) {
        if (i == a || p_.blocks[i].cutout) continue;
        const Rect& r = (*rects_)[i];
        const bool on = s == Side::N ? r.y1 >= p_.outer.y1 - tol
                        : s == Side::S ? r.y0 <= p_.outer.y0 + tol
                        : s == Side::E ? r.x1 >= p_.outer.x1 - tol
                                       : r.x0 <= p_.outer.x0 + tol;
        const bool facing = s == Side::N || s == Side::S ? std::min(r.x1, port.x1) - std::max(r.x0, port.x0) > tol
                                                         : std::min(r.y1, port.y1) - std::max(r.y0, port.y0) > tol;
        if (on && facing) there.push_back(i);
    }
    const double u = unit();
    if (!there.empty() && u < 0.4) {
        t.swapBlocks(a, there[randomInt(static_cast<int>(there.size()))]);
        return true;
    }
    if (!there.empty() && u < 0.8) {
        const int c = there[randomInt(static_cast<int>(there.size()))];
        return t.moveSubtree(t.leafOf(a), t.leafOf(c), s == Side::N || s == Side::S, coin());
    }
    return t.moveSubtree(t.leafOf(a), t.root(), s == Side::E || s == Side::W, s == Side::W || s == Side::S);
}

bool Moves::atLink(FloorTree& t, const Violation& v) {
    if (p_.isOutside(v.other)) return atPort(t, v.block, p_.rectOf(v.other, *rects_));
    int a = v.block, b = v.other;
    const int hub = p_.isHub(a) && (!p_.isHub(b) || p_.mustDegree[a] >= p_.mustDegree[b]) ? a
                    : p_.isHub(b)                                                         ? b
                                                                                          : -1;
    if (hub >= 0 && unit() < 0.08) return gather(t, *rects_, hub);
    if (coin()) std::swap(a, b);
    const double u = unit();
    if (u < 0.5) { // beside a block c that touches b, both against b's wall
        const int c = touching(b);
        if (c >= 0 && c != a) {
            if (u < 0.2) {
                t.swapBlocks(a, c);
                return true;
            }
            const Rect& rc = (*rects_)[c];
            const Rect& rb = (*rects_)[b];
            const double tol = p_.lineTolerance();
            const bool wallVertical = std::abs(rc.x1 - rb.x0) <= tol || std::abs(rb.x1 - rc.x0) <= tol;
            return t.moveSubtree(t.leafOf(a), t.leafOf(c), !wallVertical, coin());
        }
    }
    const int target = ancestorOf(t, b, randomInt(3));
    const int moving = ancestorOf(t, a, randomInt(4) == 0 ? 1 : 0);
    return t.moveSubtree(moving, target, coin(), coin());
}

bool Moves::atFacade(FloorTree& t, const Violation& v) {
    const int a = v.block, B = p_.blockCount();
    const Side s = v.other >= 0 ? static_cast<Side>(v.other) : allSides[randomInt(4)];
    auto onSide = [&] {
        std::vector<int> out;
        for (int i = 0; i < B; ++i)
            if (onExterior(i, a, s)) out.push_back(i);
        return out;
    };
    if (unit() < 0.5) { // swap with a block on that side
        std::vector<int> there = onSide();
        if (!there.empty() && unit() < 0.25) {
            // A quarter of the time with one that has no need of that side,
            // better one that opens on the same room (two offices on a
            // corridor): a swap with a room that wants the side only moves
            // the miss. (Half the time narrowed the search too much: the
            // shaped acceptance fell to 53 of 60.)
            std::vector<int> free, near;
            for (int i : there) {
                if (p_.blocks[i].facade.has(s) || p_.blocks[i].facade.anySide) continue;
                free.push_back(i);
                if (sharesMustNeighbour(i, a)) near.push_back(i);
            }
            if (!near.empty() && coin()) there = std::move(near);
            else if (!free.empty()) there = std::move(free);
        }
        if (!there.empty()) {
            t.swapBlocks(a, there[randomInt(static_cast<int>(there.size()))]);
            return true;
        }
    }
    // Beside a block on that side, both against the facade; or as a strip
    // along the whole facade.
    if (unit() < 0.6) {
        const std::vector<int> there = onSide();
        if (!there.empty()) {
            const int c = there[randomInt(static_cast<int>(there.size()))];
            return t.moveSubtree(t.leafOf(a), t.leafOf(c), s == Side::N || s == Side::S, coin());
        }
    }
    return t.moveSubtree(t.leafOf(a), t.root(), s == Side::E || s == Side::W, s == Side::W || s == Side::S);
}

bool Moves::atShape(FloorTree& t, const Violation& v) {
    const int B = p_.blockCount();
    const int leaf = t.leafOf(v.block);
    const int parent = t.node(leaf).parent;
    if (parent < 0) return false;
    const double u = unit();
    if (u < 0.3) return t.flipCut(parent);
    if (u < 0.5) return t.flipCut(ancestorOf(t, v.block, 1 + randomInt(3)));
    if (u < 0.75) {
        t.swapBlocks(v.block, randomInt(B));
        return true;
    }
    const int target = ancestorOf(t, randomInt(B), randomInt(3));
    return t.moveSubtree(leaf, target, coin(), coin());
}

bool Moves::atRandom(FloorTree& t) {
    const int B = p_.blockCount();
    const double u = unit();
    if (u < 0.28) {
        t.swapBlocks(randomInt(B), randomInt(B));
        return true;
    }
    if (u < 0.58) {
        const int a = randomInt(B);
        int moving = ancestorOf(t, a, randomInt(5) == 0 ? 1 + randomInt(2) : 0);
        if (randomInt(8) == 0) { // a whole group, at any depth
            t.innerNodes(inner_);
            if (!inner_.empty()) moving = inner_[randomInt(static_cast<int>(inner_.size()))];
        }
        const int target = ancestorOf(t, randomInt(B), randomInt(3));
        return t.moveSubtree(moving, target, coin(), coin());
    }
    t.innerNodes(inner_);
    if (inner_.empty()) return false;
    const int v = inner_[randomInt(static_cast<int>(inner_.size()))];
    if (u < 0.72) return t.flipCut(v);
    if (u < 0.82) return t.mirrorCut(v);
    if (u < 0.9) return t.swapSubtrees(ancestorOf(t, randomInt(B), randomInt(3)), ancestorOf(t, randomInt(B), randomInt(3)));
    if (t.node(v).kind == FloorTree::Kind::Wheel) {
        if (u < 0.95) return t.turnWheel(v, randomInt(4), coin(), randomInt(5) - 1);
        return t.dissolveWheel(v, rng_);
    }
    return t.makeWheel(v, rng_);
}

bool Moves::gather(FloorTree& t, const std::vector<Rect>& rects, int hub) {
    rects_ = &rects;
    const Rect& h = rects[hub];
    const bool alongX = h.width() >= h.depth();
    const bool all = coin();
    std::vector<std::pair<double, int>> lower, upper;
    for (int li : p_.linksOf[hub]) {
        const SearchProblem::Link& l = p_.links[li];
        const int c = l.a == hub ? l.b : l.a;
        if (!l.must || p_.isOutside(c) || p_.isHub(c)) continue;
        if (!all && sharedWallLength(rects[c], h, p_.lineTolerance()) >= l.aim) continue;
        const Rect& r = rects[c];
        const double along = alongX ? r.x0 + r.x1 : r.y0 + r.y1;
        const double across = alongX ? (r.y0 + r.y1) - (h.y0 + h.y1) : (r.x0 + r.x1) - (h.x0 + h.x1);
        (across < 0 ? lower : upper).emplace_back(along, c);
    }
    std::sort(lower.begin(), lower.end());
    std::sort(upper.begin(), upper.end());
    std::vector<int> lo, up;
    for (const auto& [k, c] : lower) lo.push_back(c);
    for (const auto& [k, c] : upper) up.push_back(c);
    return t.gatherAround(hub, lo, up, alongX);
}

} // namespace abut::detail
