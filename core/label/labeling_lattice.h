// SPDX-License-Identifier: MIT
// The lattice of regular edge labelings of one extended graph.
//
// The labelings of an irreducible triangulation of a 4-cycle form a
// distributive lattice whose cover relation is the flip of an alternating
// 4-cycle: a 4-cycle whose edges alternate red and blue; flipping it swaps the
// colours of every edge inside it, turning what lies inside a quarter turn
// (Fusy, Discrete Math. 309, 2009; Eppstein, Mumford, Speckmann & Verbeek,
// SIAM J. Comput. 41(3), 2012). Here "up" is the counter-clockwise turn.
//
// Enumeration is reverse search (Avis & Fukuda, 1996) over the flip graph
// rooted at the minimal labeling: the parent of a labeling is the one reached
// by flipping down its first down-flippable cycle; children are found by
// flipping up and checking that the flip back is the parent move. One
// current labeling and a stack as deep as the lattice is high are kept, so
// memory does not grow with the number listed; the delay between two
// labelings is polynomial (O(height · cycles · interior)).
//
// Precondition: a valid labeling of `x` (checkRegularEdgeLabeling).
#pragma once

#include "label/regular_edge_labeling.h"

#include <array>
#include <cstdint>
#include <optional>
#include <set>
#include <vector>

namespace abut {

// A 4-cycle of the extended graph with something inside it, and the edges
// inside, as darts (vertex, rotation index) — both ends of each edge listed.
struct FourCycle {
    std::array<int, 4> vertices{}; // in order around the cycle
    bool insideOnLeft = true;       // walking vertices[0] → [1] → [2], the inside is on the left
    std::vector<std::pair<int, int>> insideDarts;
    std::vector<std::pair<int, int>> rimDarts; // the inside darts at the four cycle vertices
};

// All 4-cycles that avoid the poles and enclose at least one edge.
// O(Σ deg³ + total interior size).
std::vector<FourCycle> fourCycles(const ExtendedGraph& x);

enum class Turn { Up, Down }; // counter-clockwise / clockwise quarter turn inside

bool isAlternating(const ExtendedGraph& x, const RegularEdgeLabeling& rel, const FourCycle& c);

// The sense in which an alternating cycle can be flipped (exactly one can).
// A quarter turn keeps every vertex inside valid, so only the four cycle
// vertices decide. O(degrees of the cycle vertices); nullopt if not alternating.
std::optional<Turn> flipSense(const ExtendedGraph& x, const RegularEdgeLabeling& rel, const FourCycle& c);

// Flips `c` in the given sense if that is its flip sense; returns whether it
// did. O(interior of c).
bool flip(const ExtendedGraph& x, RegularEdgeLabeling& rel, const FourCycle& c, Turn turn);

// The minimal labeling: flipped down until no cycle can be.
RegularEdgeLabeling minimalLabeling(const ExtendedGraph& x, RegularEdgeLabeling rel,
                                    const std::vector<FourCycle>& cycles);

class LabelingEnumerator {
public:
    // `seed` permutes the order in which cycles are tried (0 = natural order);
    // the listing is the same set, in an order fixed by the seed.
    LabelingEnumerator(const ExtendedGraph& x, const RegularEdgeLabeling& any, std::uint32_t seed = 0);

    // The next labeling, or nullptr when all have been listed.
    const RegularEdgeLabeling* next();

private:
    // Flips cycle `ci` (its sense must be `t`) and refreshes the cached sense
    // of every cycle through a vertex whose labels changed.
    void apply(int ci, Turn t);
    void refresh(int ci);

    const ExtendedGraph& x_;
    std::vector<FourCycle> cycles_;
    std::vector<int> rank_;                    // cycle → position in trial order
    std::vector<int> byRank_;                  // position → cycle
    std::vector<int> dartBase_;                // vertex → index of its first dart
    std::vector<std::vector<int>> cyclesAt_;   // dart → cycles whose flip sense reads it
    std::vector<std::uint64_t> stamp_;         // per cycle: last refresh round
    std::uint64_t clock_ = 0;
    std::vector<std::optional<Turn>> sense_;   // cached flipSense per cycle
    std::set<int> upRanks_, downRanks_;        // positions of up-/down-flippable cycles
    RegularEdgeLabeling current_;
    struct Frame {
        int flippedUp;  // cycle flipped up to reach this node (-1 at the root)
        int nextRank;   // next position to try for a child
    };
    std::vector<Frame> stack_;
    bool started_ = false;
};

// Counts labelings, stopping at `cap` (returns cap then).
std::uint64_t countLabelings(const ExtendedGraph& x, const RegularEdgeLabeling& any, std::uint64_t cap);

} // namespace abut
