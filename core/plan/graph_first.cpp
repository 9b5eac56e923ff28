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

// Today's pipeline before the plan search, kept as a further seed: the
// augmentation's extended graphs (corner assignments, triangulations, the
// pole route), a few labelings of each, fitted; the best sized; the best of
// those improved by labeling flips (`anneal`). Adds to plan.variants.
// Returns false on an internal error (plan.status and summary set).
bool graphFirstVariants(const Brief& brief, const AugmentResult& aug, const PlanOptions& options, Plan& plan,
                    const std::function<bool(double, const char*)>& keepGoing, bool anneal,
                    const PlanMonitor* monitor) {
    bool stopped = false;
    // Variants: the extended graphs of the best-ranked corner assignments.
    std::vector<ExtendedGraph> graphs;
    if (aug.frame.corners.empty()) {
        graphs.push_back(aug.extended);
    } else {
        std::vector<std::string> ids;
        for (const Room& r : brief.rooms) ids.push_back(r.id);
        const int trials = std::min<int>(options.cornerTrials, static_cast<int>(aug.frame.corners.size()));
        for (int c = 0; c < trials; ++c)
            for (int a = 0; a < std::max(1, options.augmentations); ++a)
                graphs.push_back(extendFrame(aug.frame, ids, aug.frame.corners[c], nullptr,
                                             a == 0 ? 0u : options.seed * 7919u + static_cast<unsigned>(a)));
    }
    graphs.insert(graphs.end(), aug.alternatives.begin(), aug.alternatives.end());
    std::vector<PlanVariant> variants;
    // Labelings of each graph, alternating between graphs so that a small
    // budget still samples every corner assignment.
    const int perGraph = std::max(1, std::min(options.labelingsPerGraph,
                                              options.layoutBudget / static_cast<int>(graphs.size())));
    for (std::size_t g = 0; g < graphs.size(); ++g) {
        if (!keepGoing(0.3 * double(g) / double(graphs.size()), "arrangements")) {
            stopped = true;
            break;
        }
        const ExtendedGraph& x = graphs[g];
        const LabelingResult r = computeRegularEdgeLabeling(x);
        const StageCheck c = r.status == LabelingStatus::Ok ? checkRegularEdgeLabeling(x, r.labeling)
                                                               : StageCheck{false, r.message};
        if (!c.ok) {
            plan.status = PlanStatus::Internal;
            plan.summary = "Internal error: no regular edge labeling (" + c.problem + "). Please report this brief.";
            return false;
        }
        LabelingEnumerator labelings(x, r.labeling, options.seed);
        for (int k = 0; k < perGraph; ++k) {
            const RegularEdgeLabeling* rel = labelings.next();
            if (!rel) break;
            PlanVariant v = layoutVariant(brief, x, *rel, options);
            const StageCheck check = checkVariant(brief, plan.footprint, v);
            if (!check.ok) {
                plan.status = PlanStatus::Internal;
                plan.summary = "Internal error: the plan failed its check (" + check.problem + "). Please report this brief.";
                return false;
            }
            v.oneSided = isOneSided(x, *rel);
            variants.push_back(std::move(v));
        }
    }
    auto byScore = [](const PlanVariant& a, const PlanVariant& b) { return a.score < b.score; };
    std::stable_sort(variants.begin(), variants.end(), byScore);
    // Size the most promising fitted variants to their target areas (exactly:
    // this route is for briefs whose targets can be met exactly).
    SizingOptions sizing = planSizingOptions(brief, options);
    sizing.areaBands = false;
    const std::size_t toSize = std::min<std::size_t>(variants.size(), options.sizedCandidates);
    for (std::size_t i = 0; i < toSize && !stopped; ++i) {
        if (!keepGoing(0.3 + 0.4 * double(i) / double(toSize), "sizing")) {
            stopped = true;
            break;
        }
        PlanVariant& v = variants[i];
        const SizingProblem problem(brief, v.extended, v.labeling, plan.footprint, sizing);
        PlanVariant candidate = applySizing(brief, plan.footprint, v, problem.solve());
        if (!checkVariant(brief, plan.footprint, candidate).ok) continue; // keep the fitted one
        v = std::move(candidate);
    }
    // A sized variant has its unmet requirements worked out; a merely fitted
    // one does not, so it must never be offered ahead of a sized one.
    auto sizedFirst = [](const PlanVariant& a, const PlanVariant& b) {
        return a.sized != b.sized ? a.sized : a.score < b.score;
    };
    std::stable_sort(variants.begin(), variants.end(), sizedFirst);
    const std::size_t toImprove = anneal ? std::min<std::size_t>(variants.size(), options.improvedCandidates) : 0;
    // The labelings that meet achievable targets were found after a number of
    // sizings growing about with the square of the room count (random tilings
    // of 20–100 rooms, tests/python/check_sizing.py): 8 n² up to 50 rooms,
    // 400 n above.
    const int rooms = static_cast<int>(brief.rooms.size());
    const int budget = options.flipBudget > 0 ? options.flipBudget : 40 + rooms * std::min(400, 8 * rooms);
    std::mt19937 rng(options.seed);
    for (std::size_t i = 0; i < toImprove; ++i) {
        if (!keepGoing(0.7 + 0.3 * double(i) / double(toImprove), "improving")) {
            stopped = true;
            break;
        }
        PlanVariant& v = variants[i];
        if (!v.sized) continue;
        const std::vector<FourCycle> cycles = fourCycles(v.extended);
        auto penalised = [](const SizingResult& r) {
            // Hard minimums that had to shrink weigh most, in proportion.
            return r.objective + 100.0 * (1.0 - r.relaxation);
        };
        RegularEdgeLabeling rel = v.labeling;
        std::vector<int> order(cycles.size());
        std::iota(order.begin(), order.end(), 0);
        // Phase 1, cheap: make the hard minimums fit. The longest paths of
        // minimum extents over the footprint's sides measure how far they are
        // from fitting (≤ 1 fits); flips that shrink it are kept.
        auto overfill = [&](const RegularEdgeLabeling& l) {
            const SegmentStructure segs = maximalSegments(v.extended, l);
            DualWeights w = hardMinimums(brief, v.extended, segs, sizing);
            const DualLayout lay = longestPathLayout(v.extended, segs, w);
            return std::max(lay.width / plan.footprint.width, lay.depth / plan.footprint.depth);
        };
        double fill = overfill(rel);
        const int cheapBudget = 10 * budget;
        int cheap = 0;
        for (bool improved = fill > 1.0; improved && cheap < cheapBudget;) {
            improved = false;
            std::shuffle(order.begin(), order.end(), rng);
            for (int c : order) {
                if (cheap >= cheapBudget || !keepGoing(0.7 + 0.3 * (double(i) + 0.5 * cheap / cheapBudget) / double(toImprove), "improving")) break;
                const std::optional<Turn> sense = flipSense(v.extended, rel, cycles[c]);
                if (!sense) continue;
                flip(v.extended, rel, cycles[c], *sense);
                ++cheap;
                const double f = overfill(rel);
                if (f < fill - 1e-12) {
                    fill = f;
                    improved = fill > 1.0;
                    break;
                }
                flip(v.extended, rel, cycles[c], *sense == Turn::Up ? Turn::Down : Turn::Up);
            }
        }
        // Phase 2: simulated annealing over the flips (Kirkpatrick, Gelatt &
        // Vecchi, Science 220, 1983). Hill climbing stops at the first labeling
        // no single flip improves, and the labelings that meet the targets are
        // few among thousands; accepting a worse neighbour now and then, less
        // often as the temperature falls, gets past those. Each labeling is
        // sized with a short Newton budget (enough to rank them); the best is
        // sized in full at the end. The budget is shared by `annealRuns` runs,
        // the first from the labeling phase 1 left, the others from a random
        // walk away from it; each ends with a descent (every flip tried, the
        // first that lowers the energy taken, until none does: the last
        // annealing moves are still random at energy differences this
        // small). Stops as soon as the targets are met.
        SizingOptions quick = sizing;
        quick.maxNewtonSteps = std::min(sizing.maxNewtonSteps, 20);
        auto quickEnergy = [&](const RegularEdgeLabeling& l) {
            return penalised(SizingProblem(brief, v.extended, l, plan.footprint, quick).solve());
        };
        constexpr int annealRuns = 4;
        constexpr double metEnergy = 1e-8; // areas within about 0.01 %, nothing relaxed
        const RegularEdgeLabeling startRel = rel;
        const double startEnergy = quickEnergy(rel);
        const double startTemperature = 0.3 * std::max(startEnergy, 1e-3);
        const int runBudget = std::max(1, budget / annealRuns);
        RegularEdgeLabeling bestRel = rel;
        double bestEnergy = startEnergy;
        std::uniform_int_distribution<std::size_t> pickCycle(0, cycles.empty() ? 0 : cycles.size() - 1);
        std::uniform_real_distribution<double> unit(0.0, 1.0);
        int evaluations = 0;
        auto going = [&]() {
            return evaluations % 16 != 0 ||
                   keepGoing(0.7 + 0.3 * (double(i) + 0.5 + 0.5 * std::min(1.0, double(evaluations) / budget)) /
                                       double(toImprove), "improving");
        };
        for (int run = 0; run < annealRuns && !cycles.empty() && bestEnergy > metEnergy && !stopped; ++run) {
            RegularEdgeLabeling cur = startRel, runBest = startRel;
            double energy = startEnergy;
            if (run > 0) { // a fresh start: a random walk of flips away from the first one
                for (std::size_t w = 0; w < 10 * cycles.size(); ++w) {
                    const FourCycle& c = cycles[pickCycle(rng)];
                    if (const std::optional<Turn> sense = flipSense(v.extended, cur, c)) flip(v.extended, cur, c, *sense);
                }
                energy = quickEnergy(cur);
                runBest = cur;
                ++evaluations;
            }
            double runBestEnergy = energy;
            int runEvaluations = 0;
            for (long attempts = 0; runEvaluations < runBudget && runBestEnergy > metEnergy &&
                                    attempts < 50L * runBudget && going();
                 ++attempts) {
                const FourCycle& c = cycles[pickCycle(rng)];
                const std::optional<Turn> sense = flipSense(v.extended, cur, c);
                if (!sense) continue;
                RegularEdgeLabeling trial = cur;
                flip(v.extended, trial, c, *sense);
                const double e = quickEnergy(trial);
                const double temperature = startTemperature * std::pow(1e-4, double(runEvaluations) / runBudget);
                ++runEvaluations;
                ++evaluations;
                if (e < energy || unit(rng) < std::exp(-(e - energy) / temperature)) {
                    cur = std::move(trial);
                    energy = e;
                    if (energy < runBestEnergy) {
                        runBestEnergy = energy;
                        runBest = cur;
                    }
                }
            }
            for (bool improved = runBestEnergy > metEnergy; improved && !stopped;) {
                improved = false;
                std::shuffle(order.begin(), order.end(), rng);
                for (int ci : order) {
                    if (!going()) break;
                    const std::optional<Turn> sense = flipSense(v.extended, runBest, cycles[ci]);
                    if (!sense) continue;
                    RegularEdgeLabeling trial = runBest;
                    flip(v.extended, trial, cycles[ci], *sense);
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
        rel = std::move(bestRel);
        const SizingResult best = SizingProblem(brief, v.extended, rel, plan.footprint, sizing).solve();
        PlanVariant relabelled = v;
        relabelled.labeling = rel;
        PlanVariant candidate = applySizing(brief, plan.footprint, relabelled, best);
        candidate.oneSided = isOneSided(v.extended, rel);
        if (checkVariant(brief, plan.footprint, candidate).ok && candidate.score <= v.score) {
            v = std::move(candidate);
            if (monitor && monitor->found) monitor->found(v);
        }
    }
    for (PlanVariant& v : variants) plan.variants.push_back(std::move(v));
    return true;
}

} // namespace abut
