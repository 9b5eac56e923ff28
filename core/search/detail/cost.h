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

} // namespace abut::detail
