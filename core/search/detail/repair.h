// SPDX-License-Identifier: MIT
// Local re-planning of a floor tree, miss by miss (windowed local search, as
// placement tools refine a floorplan window by window): for a room that
// misses something, the smallest part of the tree round it holding a few
// rooms is planned afresh inside its rectangle — every slicing tree tried
// when it holds five blocks or fewer, else an annealing chain from scratch
// and one from the part as it is — with every link to a room outside
// measured against that room's rectangle. The part's rectangle does not
// change, so the rest of the plan stays as it was; the new part is kept when
// the whole plan then misses less (or as much, at a lower cost).
//
// Running time: per attempt O(part budget) for the part's chains plus
// O(blocks + links) to lay out and measure the whole plan once.
#pragma once

#include "search/detail/problem.h"
#include "search/floor_tree.h"

#include <functional>
#include <random>

namespace abut::detail {

struct RepairOptions {
    int attempts = 60;   // parts re-planned at most
    int smallest = 6;    // blocks a part holds at least (unless the whole tree is smaller)
    int largest = 24;    // and at most
    long long moves = 0; // chain moves (and trees tried) at most, all attempts together (0: no bound)
};

struct RepairResult {
    int improved = 0;     // attempts that improved the plan
    long long moves = 0;  // chain moves and trees tried
};

// The best slicing tree of a problem of at most five blocks, by trying
// every one (Polish expressions over all orders and cuts). `tried`, when
// given, is increased by the number of trees laid out.
FloorTree bestSmallTree(const SearchProblem& p, long long* tried = nullptr);

// `tree` over `full`'s blocks, improved in place. `keepGoing` is asked
// between attempts; the attempts stop once `options.moves` are spent.
RepairResult repairTree(const SearchProblem& full, FloorTree& tree, std::mt19937& rng, const std::function<bool()>& keepGoing,
               const RepairOptions& options = {});

// The problem of the part of `tree` under `node`: its blocks (`blocks`: the
// full problem's block of each) laid out in the part's rectangle, links to
// the blocks outside against their rectangles in `rects`.
SearchProblem partProblem(const SearchProblem& full, const FloorTree& tree, const std::vector<Rect>& rects, int node,
                          std::vector<int>& blocks);

} // namespace abut::detail
