// SPDX-License-Identifier: MIT
// A whole plan as a tree: every leaf is a block (a room or a spare space),
// every inner node divides its rectangle among its children — a cut in two
// (slicing floorplans; Wong & Liu, "A new algorithm for floorplan design",
// DAC 1986) or a pinwheel of five, the smallest arrangement no straight cut
// crosses. Areas are exact by construction: each node's rectangle is divided
// in proportion to the areas below it (for a pinwheel by solving for its
// four inner walls, which exist for any areas: the pinwheel is one-sided,
// hence area-universal; Eppstein, Mumford, Speckmann & Verbeek, SIAM J.
// Comput. 41(3), 2012).
//
// The moves change who touches whom: swap two blocks, move a subtree next
// to another node, turn or mirror a cut, make a pinwheel out of five
// subtrees and undo one. Any tree can reach any other by moving subtrees, so
// the search can reach every plan of this family.
//
// Storage: nodes in one vector with a free list; no recursion (explicit
// stacks). Layout O(nodes); moves O(1) to O(depth).
#pragma once

#include "dual/rectangular_dual.h"

#include <array>
#include <cstdint>
#include <functional>
#include <optional>
#include <random>
#include <vector>

namespace abut {

class FloorTree {
public:
    enum class Kind : std::uint8_t { Leaf, Cut, Wheel };
    struct Node {
        Kind kind = Kind::Leaf;
        // Cut: true for a vertical cut line (children west to east), false for
        // a horizontal one (south to north). Wheel: mirrored (counter-clockwise).
        bool flag = false;
        int block = -1; // Leaf
        int parent = -1;
        // Cut: 2 children. Wheel: arms north-west, north-east, south-east,
        // south-west of a clockwise pinwheel, then the centre.
        std::array<int, 5> child{-1, -1, -1, -1, -1};
        int childCount() const { return kind == Kind::Cut ? 2 : kind == Kind::Wheel ? 5 : 0; }
    };

    FloorTree() = default;
    explicit FloorTree(int blocks);

    int blocks() const { return static_cast<int>(leafOf_.size()); }
    int root() const { return root_; }
    const Node& node(int i) const { return nodes_[i]; }
    int leafOf(int block) const { return leafOf_[block]; }
    int nodeCapacity() const { return static_cast<int>(nodes_.size()); }
    bool live(int i) const { return nodes_[i].parent != dead_; }

    // Building (seeds): leaves exist from the start; cuts are made over two
    // parentless nodes; the last node made parentless-free becomes the root.
    int makeCut(bool vertical, int first, int second);
    // A pinwheel over five parentless nodes (arms NW, NE, SE, SW, then the centre).
    int makeWheelOver(const std::array<int, 5>& parts, bool mirrored);
    void setRoot(int i);
    // Balanced cuts over the leaves of `blocks` (parentless), in order; their top node.
    int chain(const std::vector<int>& blocks, bool vertical);
    // The same over parentless nodes.
    int chainNodes(std::vector<int> nodes, bool vertical);
    // Builds here the nodes of `from`'s subtree at `node`, children before
    // parents, and returns its top node. `standIn(v)` gives the node (of this
    // tree, parentless) that stands for `from`'s node v, asked for every leaf
    // and for `skip` (≥ 0: a node whose subtree is not copied), when its turn
    // comes. O(nodes of the subtree).
    int copySubtree(const FloorTree& from, int node, const std::function<int(int)>& standIn, int skip = -1);

    // Rectangles of every block, areas exactly in proportion to `area` (per
    // block), filling `outer`. `scratch` is reused between calls.
    // With `pins` (per block, empty: none), a cut that a pinned block's side
    // lies on goes where that side is pinned (within the parent's middle
    // 90 %) instead of where the areas put it: blocks are then in place
    // whenever the tree lets them be, and areas are no longer exact.
    struct Scratch {
        std::vector<int> order;
        std::vector<double> area;
        std::vector<Rect> rect;
        std::vector<std::array<double, 4>> pinned; // per node: pinned coordinate of its N, E, S, W side (NaN: none)
    };
    void layout(const std::vector<double>& area, const Rect& outer, std::vector<Rect>& blockRects,
                Scratch& scratch, const std::vector<std::optional<Rect>>* pins = nullptr) const;


    // Moves. Each returns false (and changes nothing) when it does not apply.
    void swapBlocks(int a, int b);
    bool flipCut(int node);   // vertical ↔ horizontal
    bool mirrorCut(int node); // children swapped
    // Takes the subtree at `node` out (its parent must be a cut) and puts it
    // beside `target` under a new cut. `target` must not lie in the subtree
    // nor be its parent.
    bool moveSubtree(int node, int target, bool vertical, bool first);
    // Two disjoint subtrees change places.
    bool swapSubtrees(int a, int b);
    // The cut `node` and cuts below it become a pinwheel of five subtrees.
    bool makeWheel(int node, std::mt19937& rng);
    // A pinwheel becomes cuts over its five children.
    bool dissolveWheel(int node, std::mt19937& rng);
    // Turns a pinwheel's arms by `quarter` steps, mirrors it, or swaps its
    // centre with arm `arm` (0–3; −1: none).
    bool turnWheel(int node, int quarter, bool mirror, int arm);

    // Takes the blocks `lower` and `upper` out (each leaf's parent must be a
    // cut) and puts them in rows either side of block `hub`, where the hub's
    // leaf was: lower row, hub, upper row, cut across `alongX` (true: rows
    // run west–east, south row first). Rows keep the given order.
    bool gatherAround(int hub, const std::vector<int>& lower, const std::vector<int>& upper, bool alongX);

    bool isAncestor(int a, int b) const; // a on the path from b to the root (a == b counts)
    // Inner nodes in use (for picking moves).
    void innerNodes(std::vector<int>& out) const;
    // Checker: every block in exactly one leaf, links consistent, the root
    // reaches every live node. O(nodes).
    bool valid() const;

private:
    static constexpr int dead_ = -2;
    int allocate(Kind kind);
    void release(int i);
    void replaceChild(int parent, int from, int to); // parent −1: the root
    int childSlot(int parent, int child) const;
    bool detach(int v); // out of the tree; its parent (a cut) is released


    std::vector<Node> nodes_;
    std::vector<int> free_;
    std::vector<int> leafOf_;
    int root_ = -1;
};

// The four inner walls of a pinwheel in [0,w]×[0,h] whose arms (north-west,
// north-east, south-east, south-west, clockwise) and centre have the given
// areas (any positive areas; scaled to w·h). Arms: NW [0,p]×[r,h],
// NE [p,w]×[q,h], SE [s,w]×[0,q], SW [0,s]×[0,r], centre [s,p]×[q,r].
// Bisection on p: with the three other arms exact, the centre grows
// strictly with p. O(log(1/ε)).
struct PinwheelWalls {
    double s = 0, p = 0, q = 0, r = 0;
};
PinwheelWalls pinwheelWalls(double w, double h, const std::array<double, 5>& area);

} // namespace abut
