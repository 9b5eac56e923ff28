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
#include <vector>

namespace abut {

// A 4-cycle of the extended graph with something inside it, and the edges
// inside, as darts (vertex, rotation index) — both ends of each edge listed.
struct FourCycle {
    std::array<int, 4> vertices{};
    std::vector<std::pair<int, int>> insideDarts;
    std::vector<int> touched; // vertices whose local rules a flip can change
};

// All 4-cycles that avoid the poles and enclose at least one edge.
// O(Σ deg³ + total interior size).
std::vector<FourCycle> fourCycles(const ExtendedGraph& x);

enum class Turn { Up, Down }; // counter-clockwise / clockwise quarter turn inside

bool isAlternating(const ExtendedGraph& x, const RegularEdgeLabeling& rel, const FourCycle& c);

// Flips `c` in the given sense if that yields a valid labeling (checked at the
// touched vertices only); returns whether it did. O(interior of c).
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
    std::uint64_t listed() const { return listed_; }

private:
    int firstDownFlippable(const RegularEdgeLabeling& rel) const;

    const ExtendedGraph& x_;
    std::vector<FourCycle> cycles_;
    std::vector<int> order_; // cycle indices in trial order
    RegularEdgeLabeling current_;
    struct Frame {
        int flippedUp;  // cycle flipped up to reach this node (-1 at the root)
        int nextChild;  // position in order_ of the next cycle to try
    };
    std::vector<Frame> stack_;
    bool started_ = false;
    std::uint64_t listed_ = 0;
};

// Counts labelings, stopping at `cap` (returns cap then).
std::uint64_t countLabelings(const ExtendedGraph& x, const RegularEdgeLabeling& any, std::uint64_t cap);

// One-sided layout: every maximal segment is a whole side of some room. Such
// layouts are area-universal: any area targets can be met exactly (Eppstein,
// Mumford, Speckmann & Verbeek 2012). O(V + E).
bool isOneSided(const ExtendedGraph& x, const RegularEdgeLabeling& rel);

} // namespace abut
