// SPDX-License-Identifier: MIT
#include "plan/graph_first.h"

#include "label/labeling_lattice.h"
#include "plan/plan_builder.h"

#include <algorithm>
#include <cmath>
#include <numeric>
#include <random>
#include <set>

namespace abut {

namespace {

// The hard minimum extents the sizer keeps, as longest-path weights.
DualWeights hardMinimums(const Brief& brief, const ExtendedGraph& x, const SegmentStructure& segs,
                         const SizingOptions& o) {
    DualWeights w;
    const int n = x.graph.vertexCount();
    w.minWidth.assign(n, 1e-3);
    w.minDepth.assign(n, 1e-3);
    for (int v = 0; v < n; ++v) {
        if (x.isRoom(v)) w.minWidth[v] = w.minDepth[v] = std::max(1e-3, brief.rooms[v].minWidth.value_or(0.0));
        else if (x.isSpare(v)) w.minWidth[v] = w.minDepth[v] = o.spareMinimum;
    }
    w.anyWall = o.anyWall;
    w.minWall = wallMinimums(brief, x, segs, o.doorWidth, o.anyWall);
    return w;
}

} // namespace

namespace {

// The route's steps, sharing the brief, the budgets and the progress report.
class GraphFirst {
public:
    GraphFirst(const Brief& brief, const PlanOptions& options, Plan& plan,
               const std::function<bool(double, const char*)>& keepGoing, const PlanMonitor* monitor)
        : brief_(brief), options_(options), plan_(plan), keepGoing_(keepGoing), monitor_(monitor),
          sizing_(planSizingOptions(brief, options)), rng_(options.seed) {
        sizing_.areaBands = false; // this route is for briefs whose targets can be met exactly
    }

    // The extended graphs of the best-ranked corner assignments (a few
    // triangulations of each) and the pole route's.
    std::vector<ExtendedGraph> graphs(const AugmentResult& aug) const;
    // Up to labelingsPerGraph labelings of each graph, laid out and fitted,
    // best first. False on an internal error (plan status and summary set).
    bool fit(const std::vector<ExtendedGraph>& graphs, std::vector<PlanVariant>& variants);
    // The most promising fitted variants sized to their targets, sized first.
    void size(std::vector<PlanVariant>& variants);
    // A sized variant improved by labeling flips: the hard minimums made to
    // fit first, then simulated annealing over flips.
    void improve(PlanVariant& v, std::size_t i, std::size_t of);
    bool stopped() const { return stopped_; }

private:
    bool going(double done, const char* step) {
        if (!keepGoing_(done, step)) stopped_ = true;
        return !stopped_;
    }
    // Phase 1, cheap: flips that shrink how far the hard minimums are from
    // fitting (the longest paths of minimum extents over the footprint's sides,
    // ≤ 1 fits) are kept.
    void fitMinimums(const PlanVariant& v, RegularEdgeLabeling& rel, const std::vector<FourCycle>& cycles,
                     std::vector<int>& order, int budget, double from, double span);
    // Phase 2 (below).
    RegularEdgeLabeling anneal(const PlanVariant& v, const RegularEdgeLabeling& start, const std::vector<FourCycle>& cycles,
                               std::vector<int>& order, int budget, double from, double span);

    const Brief& brief_;
    const PlanOptions& options_;
    Plan& plan_;
    const std::function<bool(double, const char*)>& keepGoing_;
    const PlanMonitor* monitor_;
    SizingOptions sizing_;
    std::mt19937 rng_;
    bool stopped_ = false;
};

std::vector<ExtendedGraph> GraphFirst::graphs(const AugmentResult& aug) const {
    std::vector<ExtendedGraph> graphs;
    if (aug.frame.corners.empty()) {
        graphs.push_back(aug.extended);
    } else {
        std::vector<std::string> ids;
        for (const Room& r : brief_.rooms) ids.push_back(r.id);
        const int trials = std::min<int>(options_.cornerTrials, static_cast<int>(aug.frame.corners.size()));
        for (int c = 0; c < trials; ++c)
            for (int a = 0; a < std::max(1, options_.augmentations); ++a)
                graphs.push_back(extendFrame(aug.frame, ids, aug.frame.corners[c], nullptr,
                                             a == 0 ? 0u : options_.seed * 7919u + static_cast<unsigned>(a)));
    }
    graphs.insert(graphs.end(), aug.alternatives.begin(), aug.alternatives.end());
    return graphs;
}

bool GraphFirst::fit(const std::vector<ExtendedGraph>& graphs, std::vector<PlanVariant>& variants) {
    // Labelings of each graph, alternating between graphs so that a small
    // budget still samples every corner assignment.
    const int perGraph = std::max(1, std::min(options_.labelingsPerGraph,
                                              options_.layoutBudget / static_cast<int>(graphs.size())));
    for (std::size_t g = 0; g < graphs.size(); ++g) {
        if (!going(0.3 * double(g) / double(graphs.size()), "arrangements")) break;
        const ExtendedGraph& x = graphs[g];
        const LabelingResult r = computeRegularEdgeLabeling(x);
        const StageCheck c = r.status == LabelingStatus::Ok ? checkRegularEdgeLabeling(x, r.labeling)
                                                               : StageCheck{false, r.message};
        if (!c.ok) {
            plan_.status = PlanStatus::Internal;
            plan_.summary = "Internal error: no regular edge labeling (" + c.problem + "). Please report this brief.";
            return false;
        }
        LabelingEnumerator labelings(x, r.labeling, options_.seed);
        for (int k = 0; k < perGraph; ++k) {
            const RegularEdgeLabeling* rel = labelings.next();
            if (!rel) break;
            PlanVariant v = layoutVariant(brief_, x, *rel, options_);
            const StageCheck check = checkVariant(brief_, plan_.footprint, v);
            if (!check.ok) {
                plan_.status = PlanStatus::Internal;
                plan_.summary = "Internal error: the plan failed its check (" + check.problem + "). Please report this brief.";
                return false;
            }
            v.oneSided = isOneSided(x, *rel);
            variants.push_back(std::move(v));
        }
    }
    auto byScore = [](const PlanVariant& a, const PlanVariant& b) { return a.score < b.score; };
    std::stable_sort(variants.begin(), variants.end(), byScore);
    return true;
}

void GraphFirst::size(std::vector<PlanVariant>& variants) {
    const std::size_t toSize = std::min<std::size_t>(variants.size(), options_.sizedCandidates);
    for (std::size_t i = 0; i < toSize && !stopped_; ++i) {
        if (!going(0.3 + 0.4 * double(i) / double(toSize), "sizing")) break;
        PlanVariant& v = variants[i];
        const SizingProblem problem(brief_, v.extended, v.labeling, plan_.footprint, sizing_);
        PlanVariant candidate = applySizing(brief_, plan_.footprint, v, problem.solve());
        if (!checkVariant(brief_, plan_.footprint, candidate).ok) continue; // keep the fitted one
        v = std::move(candidate);
    }
    // A sized variant has its unmet requirements worked out; a merely fitted
    // one does not, so it must never be offered ahead of a sized one.
    auto sizedFirst = [](const PlanVariant& a, const PlanVariant& b) {
        return a.sized != b.sized ? a.sized : a.score < b.score;
    };
    std::stable_sort(variants.begin(), variants.end(), sizedFirst);
}

void GraphFirst::fitMinimums(const PlanVariant& v, RegularEdgeLabeling& rel, const std::vector<FourCycle>& cycles,
                             std::vector<int>& order, int budget, double from, double span) {
    auto overfill = [&](const RegularEdgeLabeling& l) {
        const SegmentStructure segs = maximalSegments(v.extended, l);
        DualWeights w = hardMinimums(brief_, v.extended, segs, sizing_);
        const DualLayout lay = longestPathLayout(v.extended, segs, w);
        return std::max(lay.width / plan_.footprint.width, lay.depth / plan_.footprint.depth);
    };
    const ExtendedGraph& x = v.extended;
    double fill = overfill(rel);
    const int cheapBudget = 10 * budget;
    int cheap = 0;
    for (bool improved = fill > 1.0; improved && cheap < cheapBudget;) {
        improved = false;
        std::shuffle(order.begin(), order.end(), rng_);
        for (int c : order) {
            if (cheap >= cheapBudget || !going(from + span * 0.5 * cheap / cheapBudget, "improving")) break;
            const std::optional<Turn> sense = flipSense(x, rel, cycles[c]);
            if (!sense) continue;
            flip(x, rel, cycles[c], *sense);
            ++cheap;
            const double f = overfill(rel);
            if (f < fill - 1e-12) {
                fill = f;
                improved = fill > 1.0;
                break;
            }
            flip(x, rel, cycles[c], *sense == Turn::Up ? Turn::Down : Turn::Up);
        }
    }
}

// Phase 2: simulated annealing over the flips (Kirkpatrick, Gelatt &
// Vecchi, Science 220, 1983). Hill climbing stops at the first labeling no
// single flip improves, and the labelings that meet the targets are few
// among thousands; accepting a worse neighbour now and then, less often as
// the temperature falls, gets past those. Each labeling is sized with a
// short Newton budget (enough to rank them); the best is sized in full at
// the end. The budget is shared by `annealRuns` runs, the first from the
// labeling phase 1 left, the others from a random walk away from it; each
// ends with a descent (every flip tried, the first that lowers the energy
// taken, until none does: the last annealing moves are still random at
// energy differences this small). Stops as soon as the targets are met.
RegularEdgeLabeling GraphFirst::anneal(const PlanVariant& v, const RegularEdgeLabeling& start,
                                       const std::vector<FourCycle>& cycles, std::vector<int>& order, int budget,
                                       double from, double span) {
    const ExtendedGraph& x = v.extended;
    SizingOptions quick = sizing_;
    quick.maxNewtonSteps = std::min(sizing_.maxNewtonSteps, 20);
    std::uniform_real_distribution<double> unit01(0.0, 1.0);
    // Half the flips are drawn among the cycles through one of the three rooms
    // furthest off their targets in the current labeling (moves aimed at a
    // miss); the others among all cycles.
    std::vector<std::vector<int>> cyclesAt(x.graph.vertexCount());
    for (std::size_t ci = 0; ci < cycles.size(); ++ci)
        for (int w : cycles[ci].vertices)
            if (w >= 0 && w < static_cast<int>(cyclesAt.size())) cyclesAt[w].push_back(static_cast<int>(ci));
    std::vector<int> worst; // the rooms furthest off in the labeling last accepted
    auto quickEnergy = [&](const RegularEdgeLabeling& l, std::vector<int>* off = nullptr) {
        const SizingResult r = SizingProblem(brief_, x, l, plan_.footprint, quick).solve();
        if (off) {
            off->clear();
            std::vector<std::pair<double, int>> by;
            for (std::size_t i = 0; i < r.rooms.size(); ++i) by.emplace_back(-std::abs(r.rooms[i].deviation), static_cast<int>(i));
            std::partial_sort(by.begin(), by.begin() + std::min<std::ptrdiff_t>(3, by.size()), by.end());
            for (std::size_t k = 0; k < by.size() && k < 3; ++k) off->push_back(by[k].second);
        }
        return r.objective + 100.0 * (1.0 - r.relaxation); // hard minimums that had to shrink weigh most
    };
    auto drawCycle = [&]() -> const FourCycle& {
        if (!worst.empty() && unit01(rng_) < 0.5) {
            const int room = worst[std::uniform_int_distribution<std::size_t>(0, worst.size() - 1)(rng_)];
            if (room < static_cast<int>(cyclesAt.size()) && !cyclesAt[room].empty()) {
                const std::vector<int>& at = cyclesAt[room];
                return cycles[at[std::uniform_int_distribution<std::size_t>(0, at.size() - 1)(rng_)]];
            }
        }
        return cycles[std::uniform_int_distribution<std::size_t>(0, cycles.size() - 1)(rng_)];
    };
    constexpr int annealRuns = 4;
    constexpr double metEnergy = 1e-8; // areas within about 0.01 %, nothing relaxed
    const double startEnergy = quickEnergy(start, &worst);
    const double startTemperature = 0.3 * std::max(startEnergy, 1e-3);
    const int runBudget = std::max(1, budget / annealRuns);
    RegularEdgeLabeling bestRel = start;
    double bestEnergy = startEnergy;
    std::uniform_int_distribution<std::size_t> pickCycle(0, cycles.empty() ? 0 : cycles.size() - 1);
    std::uniform_real_distribution<double> unit(0.0, 1.0);
    int evaluations = 0;
    auto onTime = [&]() {
        return evaluations % 16 != 0 ||
               going(from + span * (0.5 + 0.5 * std::min(1.0, double(evaluations) / budget)), "improving");
    };
    for (int run = 0; run < annealRuns && !cycles.empty() && bestEnergy > metEnergy && !stopped_; ++run) {
        RegularEdgeLabeling cur = start, runBest = start;
        double energy = startEnergy;
        if (run > 0) { // a fresh start: a random walk of flips away from the first one
            for (std::size_t w = 0; w < 10 * cycles.size(); ++w) {
                const FourCycle& c = cycles[pickCycle(rng_)];
                if (const std::optional<Turn> sense = flipSense(x, cur, c)) flip(x, cur, c, *sense);
            }
            energy = quickEnergy(cur, &worst);
            runBest = cur;
            ++evaluations;
        }
        double runBestEnergy = energy;
        int runEvaluations = 0;
        for (long attempts = 0; runEvaluations < runBudget && runBestEnergy > metEnergy && attempts < 50L * runBudget &&
                                onTime();
             ++attempts) {
            const FourCycle& c = drawCycle();
            const std::optional<Turn> sense = flipSense(x, cur, c);
            if (!sense) continue;
            RegularEdgeLabeling trial = cur;
            flip(x, trial, c, *sense);
            std::vector<int> trialWorst;
            const double e = quickEnergy(trial, &trialWorst);
            const double temperature = startTemperature * std::pow(1e-4, double(runEvaluations) / runBudget);
            ++runEvaluations;
            ++evaluations;
            if (e < energy || unit(rng_) < std::exp(-(e - energy) / temperature)) {
                cur = std::move(trial);
                energy = e;
                worst = std::move(trialWorst);
                if (energy < runBestEnergy) {
                    runBestEnergy = energy;
                    runBest = cur;
                }
            }
        }
        for (bool improved = runBestEnergy > metEnergy; improved && !stopped_;) {
            improved = false;
            std::shuffle(order.begin(), order.end(), rng_);
            for (int ci : order) {
                if (!onTime()) break;
                const std::optional<Turn> sense = flipSense(x, runBest, cycles[ci]);
                if (!sense) continue;
                RegularEdgeLabeling trial = runBest;
                flip(x, trial, cycles[ci], *sense);
                const double e = quickEnergy(trial);
                ++evaluations;
                if (e < runBestEnergy - 1e-15) {
                    runBestEnergy = e;
                    runBest = std::move(trial);
                    improved = runBestEnergy > metEnergy;
                    break;
                }
            }
        }
        if (runBestEnergy < bestEnergy) {
            bestEnergy = runBestEnergy;
            bestRel = std::move(runBest);
        }
    }
    return bestRel;
}

void GraphFirst::improve(PlanVariant& v, std::size_t i, std::size_t of) {
    if (!going(0.7 + 0.3 * double(i) / double(of), "improving") || !v.sized) return;
    // The labelings that meet achievable targets were found after a number of
    // sizings growing about with the square of the room count (random tilings
    // of 20–100 rooms, tests/python/check_sizing.py): 8 n² up to 50 rooms,
    // 400 n above.
    const int rooms = static_cast<int>(brief_.rooms.size());
    const int budget = options_.flipBudget > 0 ? options_.flipBudget : 40 + rooms * std::min(400, 8 * rooms);
    const std::vector<FourCycle> cycles = fourCycles(v.extended);
    std::vector<int> order(cycles.size());
    std::iota(order.begin(), order.end(), 0);
    const double from = 0.7 + 0.3 * double(i) / double(of), span = 0.3 / double(of);
    RegularEdgeLabeling rel = v.labeling;
    fitMinimums(v, rel, cycles, order, budget, from, span);
    rel = anneal(v, rel, cycles, order, budget, from, span);
    const SizingResult best = SizingProblem(brief_, v.extended, rel, plan_.footprint, sizing_).solve();
    PlanVariant relabelled = v;
    relabelled.labeling = rel;
    PlanVariant candidate = applySizing(brief_, plan_.footprint, relabelled, best);
    candidate.oneSided = isOneSided(v.extended, rel);
    if (checkVariant(brief_, plan_.footprint, candidate).ok && candidate.score <= v.score) {
        v = std::move(candidate);
        if (monitor_ && monitor_->found) monitor_->found(v);
    }
}

} // namespace

bool graphFirstVariants(const Brief& brief, const AugmentResult& aug, const PlanOptions& options, Plan& plan,
                        const std::function<bool(double, const char*)>& keepGoing, bool anneal,
                        const PlanMonitor* monitor) {
    GraphFirst route(brief, options, plan, keepGoing, monitor);
    std::vector<PlanVariant> variants;
    if (!route.fit(route.graphs(aug), variants)) return false;
    route.size(variants);
    const std::size_t toImprove = anneal ? std::min<std::size_t>(variants.size(), options.improvedCandidates) : 0;
    for (std::size_t i = 0; i < toImprove && !route.stopped(); ++i) route.improve(variants[i], i, toImprove);
    for (PlanVariant& v : variants) plan.variants.push_back(std::move(v));
    return true;
}

} // namespace abut
