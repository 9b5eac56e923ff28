// SPDX-License-Identifier: MIT
#include "search/detail/repair.h"

#include "search/detail/chain.h"
#include "search/detail/cost.h"

#include <algorithm>
#include <cmath>
#include <map>

namespace abut::detail {

namespace {

// Every slicing tree over a few blocks, as Polish expressions (blocks ≥ 0,
// −1 a vertical cut, −2 a horizontal one), the first part holding the
// lowest block of each split: all arrangements of cuts and orders. 4 blocks
// give a few hundred, 5 a few thousand (Yan & Chu, "DeFer", IEEE TCAD 29(3),
// 2010, enumerate small subsets at the leaves the same way).
void expressions(unsigned mask, std::vector<std::vector<int>>& out) {
    if ((mask & (mask - 1)) == 0) {
        int b = 0;
        while (!(mask >> b & 1u)) ++b;
        out.push_back({b});
        return;
    }
    for (unsigned a = (mask - 1) & mask; a != 0; a = (a - 1) & mask) {
        const unsigned b = mask & ~a;
        std::vector<std::vector<int>> left, right;
        expressions(a, left);
        expressions(b, right);
        for (const auto& x : left)
            for (const auto& y : right)
                for (int op : {-1, -2}) {
                    std::vector<int> e = x;
                    e.insert(e.end(), y.begin(), y.end());
                    e.push_back(op);
                    out.push_back(std::move(e));
                }
    }
}

FloorTree treeOf(const std::vector<int>& e, int blocks) {
    FloorTree t(blocks);
    std::vector<int> stack;
    for (int x : e) {
        if (x >= 0) {
            stack.push_back(t.leafOf(x));
            continue;
        }
        const int second = stack.back();
        stack.pop_back();
        const int first = stack.back();
        stack.pop_back();
        stack.push_back(t.makeCut(x == -1, first, second));
    }
    t.setRoot(stack.back());
    return t;
}

} // namespace

FloorTree bestSmallTree(const SearchProblem& p, long long* tried) {
    const int B = p.blockCount();
    std::vector<std::vector<int>> all;
    expressions((1u << B) - 1, all);
    if (tried) *tried += static_cast<long long>(all.size());
    FloorTree best;
    Evaluation bestEval{1e300, 1 << 30};
    std::vector<Rect> rects;
    FloorTree::Scratch scratch;
    for (const std::vector<int>& e : all) {
        FloorTree t = treeOf(e, B);
        t.layout(p.area, p.outer, rects, scratch, &p.pins);
        const Evaluation v = evaluate(p, rects, nullptr);
        if (Chain::better(v, bestEval)) {
            bestEval = v;
            best = std::move(t);
        }
    }
    return best;
}


namespace {

// The blocks under `node`, in order, and the nodes of the subtree.
std::vector<int> leavesUnder(const FloorTree& t, int node) {
    std::vector<int> out, stack{node};
    while (!stack.empty()) {
        const int v = stack.back();
        stack.pop_back();
        const FloorTree::Node& n = t.node(v);
        if (n.kind == FloorTree::Kind::Leaf) {
            out.push_back(n.block);
            continue;
        }
        for (int k = n.childCount() - 1; k >= 0; --k) stack.push_back(n.child[k]);
    }
    return out;
}

int countUnder(const FloorTree& t, int node) { return static_cast<int>(leavesUnder(t, node).size()); }

// `tree` with the subtree at `node` replaced by `part` (over the part's blocks `blocks`).
FloorTree graft(const FloorTree& tree, int node, const FloorTree& part, const std::vector<int>& blocks) {
    FloorTree out(tree.blocks());
    const int partTop = out.copySubtree(part, part.root(), [&](int v) { return out.leafOf(blocks[part.node(v).block]); });
    // The rest, with the part's top standing in for `node`.
    out.setRoot(out.copySubtree(
        tree, tree.root(), [&](int v) { return v == node ? partTop : out.leafOf(tree.node(v).block); }, node));
    return out;
}

} // namespace

SearchProblem partProblem(const SearchProblem& f, const FloorTree& tree, const std::vector<Rect>& rects, int node,
                          std::vector<int>& blocks) {
    blocks = leavesUnder(tree, node);
    // Rooms first, the spare block (if it is in the part) last.
    std::stable_partition(blocks.begin(), blocks.end(), [&](int b) { return b < f.rooms; });
    const int B = static_cast<int>(blocks.size());
    std::vector<int> local(f.blockCount(), -1);
    for (int k = 0; k < B; ++k) local[blocks[k]] = k;
    SearchProblem p;
    Rect outer{1e300, 1e300, -1e300, -1e300};
    for (int b : blocks) {
        const Rect& r = rects[b];
        outer = {std::min(outer.x0, r.x0), std::min(outer.y0, r.y0), std::max(outer.x1, r.x1), std::max(outer.y1, r.y1)};
        p.blocks.push_back(f.blocks[b]);
        p.area.push_back(f.area[b]);
        p.sketch.push_back(b < static_cast<int>(f.sketch.size()) ? f.sketch[b] : std::nullopt);
    }
    std::map<std::pair<int, int>, int> outsideOf; // (block outside) → index
    for (const SearchProblem::Link& l : f.links) {
        const int a = local[l.a], b = f.isOutside(l.b) ? -1 : local[l.b];
        if (a < 0 && b < 0) continue;
        SearchProblem::Link n = l;
        if (a >= 0 && b >= 0) {
            n.a = a;
            n.b = b;
        } else {
            const int inside = a >= 0 ? a : b, other = a >= 0 ? l.b : l.a;
            auto [it, fresh] = outsideOf.emplace(std::make_pair(other, 0), static_cast<int>(p.outside.size()));
            if (fresh) p.outside.push_back(f.rectOf(other, rects));
            n.a = inside;
            n.b = B + it->second;
        }
        p.links.push_back(n);
    }
    p.cutoutRects = f.cutoutRects;
    for (int c : f.cutouts)
        if (local[c] < 0) p.cutoutRects.push_back(rects[c]);
    finishPart(p, f, outer);
    p.rooms = static_cast<int>(std::count_if(blocks.begin(), blocks.end(), [&](int b) { return b < f.rooms; }));
    return p;
}

RepairResult repairTree(const SearchProblem& full, FloorTree& tree, std::mt19937& rng,
                        const std::function<bool()>& keepGoing, const RepairOptions& o) {
    std::vector<Rect> rects;
    FloorTree::Scratch scratch;
    tree.layout(full.area, full.outer, rects, scratch, &full.pins);
    std::vector<Violation> misses;
    Evaluation now = evaluate(full, rects, &misses);
    RepairResult out;
    for (int attempt = 0; attempt < o.attempts && now.hard > 0; ++attempt) {
        if (keepGoing && !keepGoing()) break;
        if (o.moves > 0 && out.moves >= o.moves) break;
        std::vector<Violation> hard;
        for (const Violation& v : misses)
            if (v.kind != RequirementKind::Door && v.kind != RequirementKind::Adjacency ? true
                : !full.isOutside(v.other) && std::any_of(full.links.begin(), full.links.end(), [&](const SearchProblem::Link& l) {
                      return l.must && ((l.a == v.block && l.b == v.other) || (l.b == v.block && l.a == v.other));
                  }))
                hard.push_back(v);
        if (hard.empty()) break;
        const Violation& v = hard[std::uniform_int_distribution<std::size_t>(0, hard.size() - 1)(rng)];
        // The part: from the room (for a link, from where both rooms meet) up
        // until it holds enough blocks, no more than the largest.
        int node = tree.leafOf(v.block);
        if ((v.kind == RequirementKind::Door || v.kind == RequirementKind::Adjacency) && !full.isOutside(v.other)) {
            int w = tree.leafOf(v.other);
            while (!tree.isAncestor(node, w)) node = tree.node(node).parent;
            if (countUnder(tree, node) > o.largest) node = tree.leafOf(v.block);
        }
        while (tree.node(node).parent >= 0 && countUnder(tree, node) < o.smallest &&
               countUnder(tree, tree.node(node).parent) <= o.largest)
            node = tree.node(node).parent;
        std::vector<int> blocks;
        const SearchProblem part = partProblem(full, tree, rects, node, blocks);
        const int B = part.blockCount();
        if (B < 2) continue;
        std::vector<int> local(full.blockCount(), -1);
        for (int k = 0; k < B; ++k) local[blocks[k]] = k;
        FloorTree current(B);
        if (B > 1) current.setRoot(current.copySubtree(tree, node, [&](int v) { return current.leafOf(local[tree.node(v).block]); }));
        FloorTree candidate;
        if (B <= 5) {
            candidate = bestSmallTree(part, &out.moves);
        } else {
            Chain fresh(part, static_cast<unsigned>(rng()), 1, std::max<long long>(6000, 500LL * B));
            Chain kept(part, static_cast<unsigned>(rng()), 1, std::max<long long>(6000, 500LL * B));
            kept.startFrom(current);
            long long budget = 20000 + 2500LL * B;
            if (o.moves > 0) budget = std::max(1LL, std::min(budget, (o.moves - out.moves) / 2));
            fresh.run(budget);
            kept.run(budget);
            out.moves += 2 * budget;
            candidate = Chain::better(kept.bestEvaluation(), fresh.bestEvaluation()) ? kept.bestTree() : fresh.bestTree();
        }
        FloorTree next = graft(tree, node, candidate, blocks);
        if (!next.valid()) continue;
        std::vector<Rect> nextRects;
        next.layout(full.area, full.outer, nextRects, scratch, &full.pins);
        std::vector<Violation> nextMisses;
        const Evaluation e = evaluate(full, nextRects, &nextMisses);
        if (Chain::better(e, now)) {
            tree = std::move(next);
            rects = std::move(nextRects);
            misses = std::move(nextMisses);
            now = e;
            ++out.improved;
        }
    }
    return out;
}

} // namespace abut::detail
