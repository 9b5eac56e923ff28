// SPDX-License-Identifier: MIT
#include "search/detail/chain.h"

#include <algorithm>

#include "search/detail/seeds.h"

#include <cmath>

namespace abut::detail {

namespace {
constexpr double finalTemperature = 0.01;
constexpr double freshTemperature = 0.6;   // an epoch from a fresh seed
constexpr double settledTemperature = 0.03; // an epoch from the best plan
// Seeds tried per fresh start: 32, and past 256 blocks fewer in proportion
// (at least 4), since one seed then costs about O(n² log n) to cut (a chain
// of rooms is peeled one room per cut): 3,000 rooms took 12 s per batch.
int seedBatch(int blocks) { return blocks <= 256 ? 32 : std::max(4, 32 * 256 / blocks); }
constexpr int incrementalFrom = 40; // blocks from which a move is costed by what it moved only
} // namespace

Chain::Chain(const SearchProblem& p, unsigned seed, int index, long long epochMoves)
    : p_(p), rng_(seed), mover_(p, rng_), index_(index), epochMoves_(epochMoves),
      incremental_(p.blockCount() >= incrementalFrom && p.cutouts.empty()) {
    restart(true);
}

// One step's start: a new epoch when this one is done, the temperature
// now, a move drawn (aimed at `misses`) on a copy of the current tree and
// laid out. False when the move drawn does not apply.
bool Chain::propose(const std::vector<Violation>& misses, double& temperature) {
    if (epochDone_ >= epochMoves_) restart(false);
    const double t = double(epochDone_) / double(epochMoves_);
    temperature = startTemperature_ * std::pow(finalTemperature / startTemperature_, t);
    ++epochDone_;
    ++moves_;
    trial_ = cur_;
    if (!mover_.propose(trial_, curRects_, misses)) return false;
    trial_.layout(p_.area, p_.outer, trialRects_, scratch_, &p_.pins);
    return true;
}

void Chain::keepIfBest() {
    if (!better(curEval_, bestEval_)) return;
    best_ = cur_;
    bestEval_ = curEval_;
    bestRects_ = curRects_;
    bestChanged_ = true;
}

// The same annealing with the cost kept term by term (large problems): a
// move is measured by the blocks it moved and their links.
void Chain::runIncremental(long long count) {
    for (long long i = 0; i < count; ++i) {
        double temperature = 0;
        if (!propose(cache_.violations(), temperature)) continue;
        changed_.clear();
        for (int b = 0; b < p_.blockCount(); ++b) {
            const Rect &x = trialRects_[b], &y = curRects_[b];
            if (x.x0 != y.x0 || x.y0 != y.y0 || x.x1 != y.x1 || x.y1 != y.y1) changed_.push_back(b);
        }
        const Evaluation e = cache_.trial(p_, trialRects_, changed_);
        const double delta = e.cost - curEval_.cost;
        if (delta <= 0 || unit_(rng_) < std::exp(-delta / temperature)) {
            std::swap(cur_, trial_);
            std::swap(curRects_, trialRects_);
            cache_.commit();
            curEval_ = e;
            if (++accepted_ % 4096 == 0) { // sums drift: measure afresh now and then
                cache_.reset(p_, curRects_);
                curEval_ = cache_.total();
            }
            keepIfBest();
        }
    }
}

void Chain::run(long long count) {
    if (incremental_) {
        runIncremental(count);
        return;
    }
    for (long long i = 0; i < count; ++i) {
        double temperature = 0;
        if (!propose(curViolations_, temperature)) continue;
        const Evaluation e = evaluate(p_, trialRects_, &trialViolations_);
        const double delta = e.cost - curEval_.cost;
        if (delta <= 0 || unit_(rng_) < std::exp(-delta / temperature)) {
            std::swap(cur_, trial_);
            std::swap(curRects_, trialRects_);
            std::swap(curViolations_, trialViolations_);
            curEval_ = e;
            keepIfBest();
        }
    }
}

bool Chain::takeBestChanged() {
    const bool c = bestChanged_;
    bestChanged_ = false;
    return c;
}

void Chain::settle() {
    settled_ = true;
    epochDone_ = epochMoves_;
}

void Chain::startFrom(const FloorTree& tree) {
    cur_ = tree;
    cur_.layout(p_.area, p_.outer, curRects_, scratch_, &p_.pins);
    curEval_ = evaluate(p_, curRects_, &curViolations_);
    if (incremental_) cache_.reset(p_, curRects_);
    best_ = cur_;
    bestEval_ = curEval_;
    bestRects_ = curRects_;
    bestChanged_ = true;
    settled_ = true;
    epochDone_ = 0;
    startTemperature_ = settledTemperature;
}

// The best of a batch: positions from the sketch with noise or from spring
// layouts, cut through plainly or in circulation zones.
FloorTree Chain::freshSeed() {
    FloorTree out;
    double bestCost = 1e300;
    int bestHard = 1 << 30;
    std::vector<Point> pos;
    const int batch = seedBatch(p_.blockCount());
    for (int k = 0; k < batch; ++k) {
        if (k % 8 == 0) pos = roughPositions(p_, (k / 8) % 2 == 0, 0.3 * unit_(rng_), rng_);
        const std::vector<Zone> zones = circulationZones(p_, rng_);
        const bool zoned = !zones.empty() && k % 2 == 1;
        FloorTree seed = zoned ? zoneTree(p_, zones, pos, rng_, 1.0) : cutTree(p_, pos, rng_, 1.0);
        seed.layout(p_.area, p_.outer, trialRects_, scratch_, &p_.pins);
        const Evaluation e = evaluate(p_, trialRects_, nullptr);
        if (e.hard < bestHard || (e.hard == bestHard && e.cost < bestCost)) {
            bestHard = e.hard;
            bestCost = e.cost;
            out = std::move(seed);
        }
    }
    return out;
}

void Chain::restart(bool first) {
    epochDone_ = 0;
    if (!first && settled_) { // the best plan, shaken once
        cur_ = best_;
        mover_.propose(cur_, curRects_, incremental_ ? cache_.violations() : curViolations_);
        startTemperature_ = settledTemperature;
    } else {
        // Chain 0 starts from the sketch as drawn.
        if (first && index_ == 0) cur_ = cutTree(p_, roughPositions(p_, true, 0.0, rng_), rng_, 0.0);
        else cur_ = freshSeed();
        startTemperature_ = freshTemperature;
    }
    cur_.layout(p_.area, p_.outer, curRects_, scratch_, &p_.pins);
    curEval_ = evaluate(p_, curRects_, &curViolations_);
    if (incremental_) cache_.reset(p_, curRects_);
    if (first || better(curEval_, bestEval_)) {
        best_ = cur_;
        bestEval_ = curEval_;
        bestRects_ = curRects_;
        bestChanged_ = true;
    }
}

} // namespace abut::detail
