// SPDX-License-Identifier: MIT
// The plan search's measure of a layout (lower is better; 0 meets
// everything): a sum of terms per block and per link, so that a part of the
// plan can be measured alone. Its count of misses (`hard`) is the one
// measure's (search/requirements.h: the same thresholds), its cost adds how
// far each miss is from being met, so the annealing can follow it.
// Running time: O(blocks · cut-outs + links) for a whole layout; a block's
// term O(cut-outs), a link's O(1).
#pragma once

#include "brief/requirement_kind.h"
#include "search/detail/problem.h"

#include <vector>

namespace abut::detail {

// What each kind of miss costs (dimensionless; distances are divided by
// √(footprint area)). One default each, used by every search.
struct CostWeights {
    double pinned = 6.0;        // per unit of distance of a fixed block from its place
    double pinnedAway = 0.5;    // once it is visibly away (2 % of the scale)
    double bentArea = 3.0;      // per unit of log area error past half the band (layouts that hold blocks)
    double narrow = 3.0;        // per unit of relative shortfall under a minimum width (plus 0.3 for missing it)
    double elongated = 2.0;     // per unit of relative excess over an aspect limit (plus 0.3)
    double sliver = 0.05;       // rooms without a limit beyond 1:3
    double facade = 1.0;        // a facade side missed (plus 2 per unit of distance)
    double missingWall = 1.0;   // a link whose rooms do not touch (plus 2 per unit of gap)
    double shortWall = 0.3;     // a link whose wall is too short (plus 0.7 × the missing share)
};

// What a layout misses, for the moves aimed at it.
struct Violation {
    RequirementKind kind = RequirementKind::Area; // Door or Adjacency (a link), Facade, MinWidth, MaxAspect
    int block = -1;
    int other = -1; // a link: the other block; a facade: the side (−1: any)
};

struct Evaluation {
    double cost = 0;
    int hard = 0; // requirements missed: 'must' links, facades, widths, aspects, blocks away from their place
};

// How far `r` is from an exterior wall facing `s`: the footprint's side, or
// a cut-out beyond it on that side (overlapping it across). 0 or less: on it.
// The facade moves and the cost both use it.
double exteriorDistance(const SearchProblem& p, const std::vector<Rect>& rect, const Rect& r, Side s);

void blockTerm(const SearchProblem& p, int block, const std::vector<Rect>& rect, Evaluation& e,
               std::vector<Violation>* out, const CostWeights& w = {});
void linkTerm(const SearchProblem& p, int link, const std::vector<Rect>& rect, Evaluation& e,
              std::vector<Violation>* out, const CostWeights& w = {});
// The whole layout; `out` (cleared first) gets every miss when given.
Evaluation evaluate(const SearchProblem& p, const std::vector<Rect>& rect, std::vector<Violation>* out,
                    const CostWeights& w = {});

// The cost of a layout kept term by term, so that a move is measured by the
// terms of the blocks it moved and of their links only: O(changed blocks +
// their links) per move instead of O(blocks + links). Exact: the terms are
// the same functions evaluate() sums. Requires no cut-out among the blocks
// (a cut-out that moves would change every facade term).
class CostCache {
public:
    void reset(const SearchProblem& p, const std::vector<Rect>& rects, const CostWeights& w = {});
    // The total if `rects` replaced the cached rectangles, where only the
    // blocks `changed` differ. The change is remembered for commit().
    Evaluation trial(const SearchProblem& p, const std::vector<Rect>& rects, const std::vector<int>& changed,
                     const CostWeights& w = {});
    void commit();
    const Evaluation& total() const { return total_; }
    // Every miss of the cached layout (rebuilt from the terms when stale).
    const std::vector<Violation>& violations();

private:
    struct Term {
        Evaluation e;
        std::vector<Violation> v;
    };
    std::vector<Term> block_, link_;
    std::vector<std::pair<int, Term>> newBlock_, newLink_;
    std::vector<int> stamp_;
    int epoch_ = 0;
    Evaluation total_, trialTotal_;
    std::vector<Violation> flat_;
    bool stale_ = true;
};

} // namespace abut::detail
