// SPDX-License-Identifier: MIT
// The plan search's moves on a floor tree (search/floor_tree.h). 40 % of
// them are aimed at a miss of the current layout: a room away from the one
// it must open on goes beside it (or a hub gathers its rooms in rows along
// it), a room away from its facade goes to a block on that side or along
// the whole facade, a room too narrow or too elongated gets its cut turned
// or goes elsewhere. The others are swaps, subtree moves, cut flips and
// mirrors, subtree swaps and pinwheels, at random.
// Running time: O(depth) for most moves; an aimed one O(blocks) to find its
// partner; gathering O(blocks).
#pragma once

#include "search/detail/cost.h"
#include "search/detail/problem.h"
#include "search/floor_tree.h"

#include <random>
#include <vector>

namespace abut::detail {

class Moves {
public:
    Moves(const SearchProblem& p, std::mt19937& rng) : p_(p), rng_(rng) {}

    // One move on `t`, whose layout is `rects` with misses `violations`.
    // Returns false (and changes nothing) when the move drawn does not apply.
    bool propose(FloorTree& t, const std::vector<Rect>& rects, const std::vector<Violation>& violations);

    // The rooms that must open on `hub` (all of them, or those without their
    // wall) in rows either side of it, along its longer side, in their order.
    bool gather(FloorTree& t, const std::vector<Rect>& rects, int hub);

private:
    bool aimed(FloorTree& t, const Violation& v);
    bool atLink(FloorTree& t, const Violation& v);
    bool atFacade(FloorTree& t, const Violation& v);
    bool atShape(FloorTree& t, const Violation& v);
    bool atPort(FloorTree& t, int block, const Rect& port);
    bool atRandom(FloorTree& t);
    int randomInt(int n) { return std::uniform_int_distribution<int>(0, n - 1)(rng_); }
    bool coin() { return randomInt(2) == 1; }
    double unit() { return unit_(rng_); }
    // A node on the path from block b's leaf to the root, at most `up` steps up.
    int ancestorOf(const FloorTree& t, int block, int up) const;
    // Whether blocks i and a both must open on one block (O(links of both)).
    bool sharesMustNeighbour(int i, int a) const;
    // A block whose rectangle shares a wall with block b's (−1: none).
    int touching(int b);
    // Whether block i (not `a`, not a cut-out) lies on an exterior wall facing `s`.
    bool onExterior(int i, int a, Side s) const;

    const SearchProblem& p_;
    std::mt19937& rng_;
    std::uniform_real_distribution<double> unit_{0.0, 1.0};
    const std::vector<Rect>* rects_ = nullptr;
    std::vector<int> inner_;
};

} // namespace abut::detail
