// SPDX-License-Identifier: MIT
#include "search/floor_tree.h"

#include <limits>

#include <algorithm>
#include <cmath>

namespace abut {

FloorTree::FloorTree(int blocks) : leafOf_(blocks) {
    nodes_.reserve(2 * blocks);
    for (int b = 0; b < blocks; ++b) {
        Node n;
        n.kind = Kind::Leaf;
        n.block = b;
        nodes_.push_back(n);
        leafOf_[b] = b;
    }
    if (blocks == 1) root_ = 0;
}

int FloorTree::allocate(Kind kind) {
    int i;
    if (!free_.empty()) {
        i = free_.back();
        free_.pop_back();
    } else {
        i = static_cast<int>(nodes_.size());
        nodes_.emplace_back();
    }
    nodes_[i] = Node{};
    nodes_[i].kind = kind;
    return i;
}

void FloorTree::release(int i) {
    nodes_[i] = Node{};
    nodes_[i].parent = dead_;
    free_.push_back(i);
}

int FloorTree::makeCut(bool vertical, int first, int second) {
    const int c = allocate(Kind::Cut);
    nodes_[c].flag = vertical;
    nodes_[c].child[0] = first;
    nodes_[c].child[1] = second;
    nodes_[first].parent = c;
    nodes_[second].parent = c;
    return c;
}

int FloorTree::makeWheelOver(const std::array<int, 5>& parts, bool mirrored) {
    const int w = allocate(Kind::Wheel);
    nodes_[w].flag = mirrored;
    for (int k = 0; k < 5; ++k) {
        nodes_[w].child[k] = parts[k];
        nodes_[parts[k]].parent = w;
    }
    return w;
}

void FloorTree::setRoot(int i) {
    root_ = i;
    nodes_[i].parent = -1;
}

int FloorTree::childSlot(int parent, int child) const {
    const Node& p = nodes_[parent];
    for (int k = 0; k < p.childCount(); ++k)
        if (p.child[k] == child) return k;
    return -1;
}

void FloorTree::replaceChild(int parent, int from, int to) {
    if (parent < 0) {
        root_ = to;
        nodes_[to].parent = -1;
        return;
    }
    nodes_[parent].child[childSlot(parent, from)] = to;
    nodes_[to].parent = parent;
}

PinwheelWalls pinwheelWalls(double w, double h, const std::array<double, 5>& area) {
    double total = 0;
    for (double a : area) total += a;
    const double k = w * h / total;
    const double A = area[0] * k, C = area[2] * k, D = area[3] * k, centre = area[4] * k;
    PinwheelWalls pw;
    // For a given p the north-west, south-west and south-east arms fix r, s, q.
    auto at = [&](double p, PinwheelWalls& out) {
        out.p = p;
        out.r = h - A / p;
        if (!(out.r > 0)) return -1.0;
        out.s = D / out.r;
        if (!(out.s < w)) return -1.0;
        out.q = C / (w - out.s);
        if (!(p > out.s) || !(out.r > out.q)) return -1.0;
        return (p - out.s) * (out.r - out.q) - centre;
    };
    double lo = A / h, hi = w;
    for (int i = 0; i < 60 && hi - lo > 1e-12 * w; ++i) {
        const double mid = 0.5 * (lo + hi);
        (at(mid, pw) < 0 ? lo : hi) = mid;
    }
    at(hi, pw);
    return pw;
}

void FloorTree::layout(const std::vector<double>& area, const Rect& outer, std::vector<Rect>& blockRects,
                       Scratch& sc, const std::vector<std::optional<Rect>>* pins) const {
    blockRects.resize(leafOf_.size());
    const int top = root_;
    sc.order.clear();
    sc.order.push_back(top);
    for (std::size_t i = 0; i < sc.order.size(); ++i) {
        const Node& n = nodes_[sc.order[i]];
        for (int k = 0; k < n.childCount(); ++k) sc.order.push_back(n.child[k]);
    }
    sc.area.resize(nodes_.size());
    sc.rect.resize(nodes_.size());
    for (std::size_t i = sc.order.size(); i-- > 0;) {
        const int v = sc.order[i];
        const Node& n = nodes_[v];
        if (n.kind == Kind::Leaf) {
            sc.area[v] = area[n.block];
        } else {
            double a = 0;
            for (int k = 0; k < n.childCount(); ++k) a += sc.area[n.child[k]];
            sc.area[v] = a;
        }
    }
    // Pinned sides, bottom-up: a side of a node is pinned when a pinned block
    // lies along it (N, E, S, W = 0..3).
    const bool pinning = pins && !pins->empty();
    if (pinning) {
        constexpr double none = std::numeric_limits<double>::quiet_NaN();
        sc.pinned.resize(nodes_.size());
        auto take = [](double& side, double value) {
            if (std::isnan(side)) side = value;
        };
        for (std::size_t i = sc.order.size(); i-- > 0;) {
            const int v = sc.order[i];
            const Node& n = nodes_[v];
            std::array<double, 4>& out = sc.pinned[v];
            out = {none, none, none, none};
            if (n.kind == Kind::Leaf) {
                if (const std::optional<Rect>& f = (*pins)[n.block]) out = {f->y1, f->x1, f->y0, f->x0};
                continue;
            }
            // Children on each side: per side, the children whose side lies on it.
            static constexpr int cutV[4][2] = {{0, 1}, {1, 1}, {0, 1}, {0, 0}}; // vertical: W child 0, E child 1
            static constexpr int cutH[4][2] = {{1, 1}, {0, 1}, {0, 0}, {0, 1}}; // horizontal: S child 0, N child 1
            static constexpr int wheel[4][2] = {{0, 1}, {1, 2}, {2, 3}, {3, 0}}; // NW, NE, SE, SW arms
            for (int side = 0; side < 4; ++side) {
                int s = side;
                if (n.kind == Kind::Wheel && n.flag && (side == 1 || side == 3)) s = 4 - side; // mirrored E ↔ W
                const int* kids = n.kind == Kind::Wheel ? wheel[s] : n.flag ? cutV[side] : cutH[side];
                for (int k = 0; k < 2; ++k) take(out[side], sc.pinned[n.child[kids[k]]][side]);
            }
        }
    }
    auto cutAt = [&](double proportional, double lo, double hi, double fromFirst, double fromSecond) {
        const double want = !std::isnan(fromFirst) ? fromFirst : fromSecond;
        if (std::isnan(want)) return proportional;
        const double margin = 0.05 * (hi - lo);
        return std::clamp(want, lo + margin, hi - margin);
    };
    sc.rect[top] = outer;
    for (int v : sc.order) {
        const Node& n = nodes_[v];
        const Rect r = sc.rect[v];
        if (n.kind == Kind::Leaf) {
            blockRects[n.block] = r;
        } else if (n.kind == Kind::Cut) {
            const double f = sc.area[n.child[0]] / sc.area[v];
            if (n.flag) {
                double x = r.x0 + f * (r.x1 - r.x0);
                if (pinning) x = cutAt(x, r.x0, r.x1, sc.pinned[n.child[0]][1], sc.pinned[n.child[1]][3]);
                sc.rect[n.child[0]] = {r.x0, r.y0, x, r.y1};
                sc.rect[n.child[1]] = {x, r.y0, r.x1, r.y1};
            } else {
                double y = r.y0 + f * (r.y1 - r.y0);
                if (pinning) y = cutAt(y, r.y0, r.y1, sc.pinned[n.child[0]][0], sc.pinned[n.child[1]][2]);
                sc.rect[n.child[0]] = {r.x0, r.y0, r.x1, y};
                sc.rect[n.child[1]] = {r.x0, y, r.x1, r.y1};
            }
        } else {
            const double w = r.width(), h = r.depth();
            std::array<double, 5> a{};
            for (int k = 0; k < 5; ++k) a[k] = sc.area[n.child[k]];
            const PinwheelWalls pw = pinwheelWalls(w, h, a);
            std::array<Rect, 5> local{Rect{0, pw.r, pw.p, h}, Rect{pw.p, pw.q, w, h}, Rect{pw.s, 0, w, pw.q},
                                      Rect{0, 0, pw.s, pw.r}, Rect{pw.s, pw.q, pw.p, pw.r}};
            if (n.flag) // mirrored: the same pinwheel reflected east–west
                for (Rect& q : local) q = {w - q.x1, q.y0, w - q.x0, q.y1};
            for (int k = 0; k < 5; ++k) {
                const Rect& q = local[k];
                // Outer edges exact: the far sides are the parent's own.
                sc.rect[n.child[k]] = {q.x0 == 0 ? r.x0 : r.x0 + q.x0, q.y0 == 0 ? r.y0 : r.y0 + q.y0,
                                       q.x1 == w ? r.x1 : r.x0 + q.x1, q.y1 == h ? r.y1 : r.y0 + q.y1};
            }
        }
    }
}

void FloorTree::swapBlocks(int a, int b) {
    if (a == b) return;
    std::swap(nodes_[leafOf_[a]].block, nodes_[leafOf_[b]].block);
    std::swap(leafOf_[a], leafOf_[b]);
}

bool FloorTree::flipCut(int v) {
    if (nodes_[v].kind != Kind::Cut) return false;
    nodes_[v].flag = !nodes_[v].flag;
    return true;
}

bool FloorTree::mirrorCut(int v) {
    if (nodes_[v].kind != Kind::Cut) return false;
    std::swap(nodes_[v].child[0], nodes_[v].child[1]);
    return true;
}

bool FloorTree::isAncestor(int a, int b) const {
    for (int v = b; v >= 0; v = nodes_[v].parent)
        if (v == a) return true;
    return false;
}

bool FloorTree::detach(int v) {
    const int p = nodes_[v].parent;
    if (p < 0 || nodes_[p].kind != Kind::Cut) return false;
    const int sibling = nodes_[p].child[0] == v ? nodes_[p].child[1] : nodes_[p].child[0];
    replaceChild(nodes_[p].parent, p, sibling);
    release(p);
    nodes_[v].parent = -1;
    return true;
}

int FloorTree::chain(const std::vector<int>& blocks, bool vertical) {
    std::vector<int> nodes;
    for (int b : blocks) nodes.push_back(leafOf_[b]);
    return chainNodes(std::move(nodes), vertical);
}

int FloorTree::chainNodes(std::vector<int> nodes, bool vertical) {
    while (nodes.size() > 1) {
        std::vector<int> next;
        for (std::size_t k = 0; k + 1 < nodes.size(); k += 2) next.push_back(makeCut(vertical, nodes[k], nodes[k + 1]));
        if (nodes.size() % 2) next.push_back(nodes.back());
        nodes = std::move(next);
    }
    return nodes.front();
}

int FloorTree::copySubtree(const FloorTree& from, int node, const std::function<int(int)>& standIn, int skip) {
    std::vector<int> order{node}, mapped(from.nodeCapacity(), -1);
    for (std::size_t i = 0; i < order.size(); ++i) {
        if (order[i] == skip) continue;
        const Node& n = from.node(order[i]);
        for (int k = 0; k < n.childCount(); ++k) order.push_back(n.child[k]);
    }
    for (std::size_t i = order.size(); i-- > 0;) {
        const int v = order[i];
        const Node& n = from.node(v);
        if (v == skip || n.kind == Kind::Leaf) mapped[v] = standIn(v);
        else if (n.kind == Kind::Cut) mapped[v] = makeCut(n.flag, mapped[n.child[0]], mapped[n.child[1]]);
        else {
            std::array<int, 5> parts{};
            for (int k = 0; k < 5; ++k) parts[k] = mapped[n.child[k]];
            mapped[v] = makeWheelOver(parts, n.flag);
        }
    }
    return mapped[node];
}

bool FloorTree::gatherAround(int hub, const std::vector<int>& lower, const std::vector<int>& upper, bool alongX) {
    if (lower.empty() && upper.empty()) return false;
    std::vector<char> listed(leafOf_.size(), 0);
    for (const auto* side : {&lower, &upper})
        for (int b : *side)
            if (b < 0 || b >= blocks() || b == hub || listed[b]++) return false;
    // Detaching one leaf can leave another under a pinwheel (its sibling
    // cut gone), where it cannot be detached: then nothing changes.
    const FloorTree before = *this;
    for (const auto* side : {&lower, &upper})
        for (int b : *side)
            if (!detach(leafOf_[b])) {
                *this = before;
                return false;
            }
    const int h = leafOf_[hub];
    const int parent = nodes_[h].parent;
    const int slot = parent >= 0 ? childSlot(parent, h) : -1;
    int node = h;
    if (!lower.empty()) node = makeCut(!alongX, chain(lower, alongX), node);
    if (!upper.empty()) node = makeCut(!alongX, node, chain(upper, alongX));
    if (parent >= 0) {
        nodes_[parent].child[slot] = node;
        nodes_[node].parent = parent;
    } else {
        setRoot(node);
    }
    return true;
}

bool FloorTree::moveSubtree(int v, int target, bool vertical, bool first) {
    const int p = nodes_[v].parent;
    if (p < 0 || nodes_[p].kind != Kind::Cut || target == p || isAncestor(v, target)) return false;
    detach(v); // the sibling takes the parent's place
    // In: a new cut over the target and the subtree.
    const int tp = nodes_[target].parent;
    const int c = allocate(Kind::Cut);
    nodes_[c].flag = vertical;
    nodes_[c].child[0] = first ? v : target;
    nodes_[c].child[1] = first ? target : v;
    replaceChild(tp, target, c);
    nodes_[v].parent = c;
    nodes_[target].parent = c;
    return true;
}

bool FloorTree::swapSubtrees(int a, int b) {
    if (a == b || isAncestor(a, b) || isAncestor(b, a)) return false;
    const int pa = nodes_[a].parent, pb = nodes_[b].parent;
    const int sa = childSlot(pa, a), sb = childSlot(pb, b);
    nodes_[pa].child[sa] = b;
    nodes_[pb].child[sb] = a;
    nodes_[a].parent = pb;
    nodes_[b].parent = pa;
    return true;
}

bool FloorTree::makeWheel(int v, std::mt19937& rng) {
    if (nodes_[v].kind != Kind::Cut) return false;
    std::vector<int> frontier{nodes_[v].child[0], nodes_[v].child[1]};
    std::vector<int> used;
    while (frontier.size() < 5) {
        std::vector<int> cuts;
        for (std::size_t i = 0; i < frontier.size(); ++i)
            if (nodes_[frontier[i]].kind == Kind::Cut) cuts.push_back(static_cast<int>(i));
        if (cuts.empty()) return false;
        const int i = cuts[std::uniform_int_distribution<std::size_t>(0, cuts.size() - 1)(rng)];
        const int c = frontier[i];
        frontier[i] = nodes_[c].child[0];
        frontier.push_back(nodes_[c].child[1]);
        used.push_back(c);
    }
    for (int c : used) release(c);
    std::shuffle(frontier.begin(), frontier.end(), rng);
    Node& w = nodes_[v];
    w.kind = Kind::Wheel;
    w.flag = std::uniform_int_distribution<int>(0, 1)(rng) == 1;
    for (int k = 0; k < 5; ++k) {
        w.child[k] = frontier[k];
        nodes_[frontier[k]].parent = v;
    }
    return true;
}

bool FloorTree::dissolveWheel(int v, std::mt19937& rng) {
    if (nodes_[v].kind != Kind::Wheel) return false;
    std::vector<int> parts(nodes_[v].child.begin(), nodes_[v].child.end());
    std::uniform_int_distribution<int> coin(0, 1);
    while (parts.size() > 2) {
        const std::size_t i = std::uniform_int_distribution<std::size_t>(0, parts.size() - 2)(rng);
        const int c = makeCut(coin(rng) == 1, parts[i], parts[i + 1]);
        parts[i] = c;
        parts.erase(parts.begin() + static_cast<long>(i) + 1);
    }
    Node& n = nodes_[v];
    n.kind = Kind::Cut;
    n.flag = coin(rng) == 1;
    n.child = {parts[0], parts[1], -1, -1, -1};
    nodes_[parts[0]].parent = v;
    nodes_[parts[1]].parent = v;
    return true;
}

bool FloorTree::turnWheel(int v, int quarter, bool mirror, int arm) {
    Node& n = nodes_[v];
    if (n.kind != Kind::Wheel) return false;
    std::rotate(n.child.begin(), n.child.begin() + ((quarter % 4) + 4) % 4, n.child.begin() + 4);
    if (mirror) n.flag = !n.flag;
    if (arm >= 0 && arm < 4) std::swap(n.child[arm], n.child[4]);
    return true;
}

void FloorTree::innerNodes(std::vector<int>& out) const {
    out.clear();
    for (int i = 0; i < static_cast<int>(nodes_.size()); ++i)
        if (nodes_[i].parent != dead_ && nodes_[i].kind != Kind::Leaf) out.push_back(i);
}

bool FloorTree::valid() const {
    if (root_ < 0 || root_ >= static_cast<int>(nodes_.size()) || nodes_[root_].parent != -1) return false;
    std::vector<int> seenBlock(leafOf_.size(), 0);
    std::vector<int> stack{root_};
    std::size_t visited = 0;
    while (!stack.empty()) {
        const int v = stack.back();
        stack.pop_back();
        if (++visited > nodes_.size()) return false; // a cycle
        const Node& n = nodes_[v];
        if (n.kind == Kind::Leaf) {
            if (n.block < 0 || n.block >= blocks() || leafOf_[n.block] != v || seenBlock[n.block]++) return false;
            continue;
        }
        for (int k = 0; k < n.childCount(); ++k) {
            const int c = n.child[k];
            if (c < 0 || c >= static_cast<int>(nodes_.size()) || nodes_[c].parent != v) return false;
            stack.push_back(c);
        }
    }
    for (int b = 0; b < blocks(); ++b)
        if (!seenBlock[b]) return false;
    return true;
}

} // namespace abut
