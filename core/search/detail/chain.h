// SPDX-License-Identifier: MIT
// One annealing chain of the plan search (Kirkpatrick, Gelatt & Vecchi,
// Science 220, 1983): epochs of a fixed number of moves, each a geometric
// cooling from a start temperature to 0.01; each epoch starts from the best
// of a fresh batch of seeds (search/detail/seeds.h) — fresh restarts beat
// shaking the best plan on generated briefs — until the chain is settled,
// when epochs start from its best plan at a low temperature, for neighbours.
// Deterministic for its seed. Running time per move: O(depth) for the move,
// O(blocks) to lay the tree out and compare it, and O(blocks · cut-outs +
// links) to cost it — from 40 blocks (without cut-outs among them) only the
// moved blocks and their links are costed again (CostCache).
#pragma once

#include "search/detail/cost.h"
#include "search/detail/moves.h"
#include "search/detail/problem.h"
#include "search/floor_tree.h"

#include <random>
#include <vector>

namespace abut::detail {

class Chain {
public:
    // `index` 0 starts from the sketch as drawn; the others from a batch.
    Chain(const SearchProblem& p, unsigned seed, int index, long long epochMoves);

    // `count` annealing moves.
    void run(long long count);

    long long moves() const { return moves_; }
    const Evaluation& bestEvaluation() const { return bestEval_; }
    const std::vector<Rect>& bestRects() const { return bestRects_; }
    const FloorTree& bestTree() const { return best_; }
    const std::vector<Rect>& currentRects() const { return curRects_; }
    const Evaluation& currentEvaluation() const { return curEval_; }
    // Whether the best plan changed since the last call.
    bool takeBestChanged();
    // From now on, epochs restart from the best plan at a low temperature.
    void settle();
    // Continues from `tree` (a plan found elsewhere, a zone plan) as its best
    // plan, settled: epochs from it at a low temperature.
    void startFrom(const FloorTree& tree);

    // Fewer misses first, then the lower cost.
    static bool better(const Evaluation& a, const Evaluation& b) {
        return a.hard != b.hard ? a.hard < b.hard : a.cost < b.cost - 1e-12;
    }

private:
    void restart(bool first);
    void runIncremental(long long count);
    bool propose(const std::vector<Violation>& misses, double& temperature);
    void keepIfBest(); // the current plan as the best when it is better
    FloorTree freshSeed();

    const SearchProblem& p_;
    std::mt19937 rng_;
    std::uniform_real_distribution<double> unit_{0.0, 1.0};
    Moves mover_;
    int index_ = 0;
    long long epochMoves_ = 1, epochDone_ = 0, moves_ = 0;
    bool settled_ = false, bestChanged_ = false;
    double startTemperature_ = 0.6;
    FloorTree cur_, trial_, best_;
    std::vector<Rect> curRects_, trialRects_, bestRects_;
    std::vector<Violation> curViolations_, trialViolations_;
    Evaluation curEval_, bestEval_;
    bool incremental_ = false; // large problems: costs kept term by term (CostCache)
    CostCache cache_;
    std::vector<int> changed_;
    long long accepted_ = 0;
    FloorTree::Scratch scratch_;
};

} // namespace abut::detail
