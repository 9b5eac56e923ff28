// SPDX-License-Identifier: MIT
#include "search/plan_search.h"

#include "detail/thread_pool.h"
#include "dual/tiling_dual.h"
#include "label/labeling_lattice.h"
#include "search/detail/chain.h"
#include "search/detail/problem.h"
#include "search/detail/sized_plans.h"
#include "search/detail/repair.h"
#include "search/detail/zone_plan.h"
#include "search/zones.h"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <memory>
#include <set>
#include <thread>

namespace abut {

BlockAreas blockAreas(const Brief& brief, const Footprint& fp) {
    // Rooms fixed in place (and cut-outs) take exactly their rectangles; the
    // others share the rest.
    BlockAreas out;
    double F = fp.width * fp.depth;
    double total = 0, band = 0;
    for (const Room& r : brief.rooms) {
        if (r.fixed) {
            F -= r.fixed->area();
            continue;
        }
        total += r.area;
        band += r.area * r.tolerance();
    }
    auto each = [&](auto&& area) {
        for (const Room& r : brief.rooms) out.room.push_back(r.fixed ? r.fixed->area() : area(r));
    };
    out.room.reserve(brief.rooms.size());
    if (total <= 0 || F <= 0) {
        each([](const Room& r) { return r.area; });
        return out;
    }
    if (total >= F * (1 - 1e-9)) { // no surplus: every room shrinks alike
        each([&](const Room& r) { return r.area * F / total; });
        return out;
    }
    // A surplus: the rooms take it within 90 % of their bands (the rest of the
    // band is the sizer's margin); what is left becomes a spare space unless
    // it fits in the last tenth of the bands.
    const double surplus = F - total;
    const double share = band > 0 ? std::min(1.0, surplus / (0.9 * band)) : 0.0;
    each([&](const Room& r) { return r.area * (1 + 0.9 * share * r.tolerance()); });
    double taken = 0;
    for (std::size_t i = 0; i < brief.rooms.size(); ++i)
        if (!brief.rooms[i].fixed) taken += out.room[i];
    const double left = F - taken;
    if (left <= 0.1 * band + 1e-12 * F) {
        for (std::size_t i = 0; i < brief.rooms.size(); ++i)
            if (!brief.rooms[i].fixed) out.room[i] *= F / taken;
    } else {
        out.spare = left;
    }
    return out;
}

std::vector<double> preferredAreas(const Brief& brief, const Footprint& fp, const ExtendedGraph& x) {
    const BlockAreas areas = blockAreas(brief, fp);
    std::vector<double> out(x.graph.vertexCount(), 0.0);
    for (int v = 0; v < x.roomCount && v < static_cast<int>(areas.room.size()); ++v) out[v] = areas.room[v];
    const int spares = x.spareCount();
    if (spares > 0 && areas.spare > 0)
        for (int v = x.roomCount + 4; v < x.graph.vertexCount(); ++v) out[v] = areas.spare / spares;
    return out;
}

SizedTiling sizeTiling(const Brief& brief, const Footprint& fp, const std::vector<Rect>& tiles,
                       const SearchOptions& options, const std::function<bool()>& inTime) {
    SizedTiling out;
    const int n = static_cast<int>(brief.rooms.size());
    std::vector<std::string> ids;
    for (const Room& r : brief.rooms) ids.push_back(r.id);
    std::set<std::pair<int, int>> wanted;
    for (const auto& [a, b] : brief.adjacencyRooms()) wanted.insert(std::minmax(a, b));
    TilingDualOptions td;
    td.nudge = std::max(1.2 * options.anyWall, 1e-4 * std::max(fp.width, fp.depth));
    td.preferContact = [&](int a, int b) { return wanted.count(std::minmax(a, b)) > 0; };
    TilingDual dual = dualOfTiling(tiles, n, fp.width, fp.depth, ids, td);
    if (!dual.ok) {
        out.problem = dual.problem;
        return out;
    }
    SearchPlan arrangement;
    arrangement.extended = std::move(dual.extended);
    arrangement.labeling = std::move(dual.labeling);
    out.sizings = detail::sizeArrangement(brief, fp, options, dual.rects, arrangement, inTime);
    out.ok = true;
    return out;
}

namespace {

using Clock = std::chrono::steady_clock;

// Variants: labelings one flip away from the best plan's (the same rooms
// meet, walls slide past each other differently), sized warm from the best
// plan's rectangles so that their proportions are kept, until `deadline`.
void offerFlips(const Brief& brief, const Footprint& fp, const SearchOptions& options, const detail::SearchProblem& p,
                detail::PlanPool& found, const std::function<double()>& elapsed, double deadline) {
    const SearchPlan best = found.plans().front();
    const int flips = options.variantFlips >= 0 ? options.variantFlips : 3 * options.keep;
    int tried = 0;
    for (const FourCycle& c : fourCycles(best.extended)) {
        if (tried >= flips || elapsed() > deadline) break;
        const std::optional<Turn> sense = flipSense(best.extended, best.labeling, c);
        if (!sense) continue;
        ++tried;
        SearchPlan q;
        q.extended = best.extended;
        q.labeling = best.labeling;
        flip(q.extended, q.labeling, c, *sense);
        found.offer(detail::pickSizing(brief, p, detail::sizeArrangement(brief, fp, options, best.sized.rects, q)));
    }
}

} // namespace

SearchResult searchPlans(const Brief& brief, const SearchOptions& options, SearchVisitor* visitor) {
    SearchResult result;
    const auto started = Clock::now();
    auto elapsed = [&] { return std::chrono::duration<double>(Clock::now() - started).count(); };
    if (brief.rooms.empty()) return result;
    const Footprint fp = brief.effectiveFootprint();
    const detail::SearchProblem p = detail::makeProblem(brief, fp, options);
    const int B = p.blockCount();

    const int threads = options.threads > 0 ? options.threads
                                            : std::max(1, static_cast<int>(std::thread::hardware_concurrency()));
    // Blocks held in place narrow the plans that fit: twelve times the moves
    // (measured on generated L, U, courtyard and fixed-core briefs; the time
    // limit still ends it).
    const long long budget = options.moves > 0 ? options.moves
                                               : (200000LL + 60000LL * p.rooms) * (p.pinned.empty() ? 1 : 12);
    // Rounds of about 20–40 ms; epochs (one temperature sweep each) long
    // enough for a sweep to settle.
    const long long round = std::clamp<long long>(400000 / std::max(1, B), 500, 20000);
    const long long epoch = std::max<long long>(20000LL, std::min<long long>(budget / 3, 800LL * B));
    bool settled = false;
    // Large floors are planned top down by their zones first (search/zones.h),
    // one zone plan per chain, each with its own seed; the chains then polish
    // them. Up to twice `zonesFrom` rooms, half the chains (at least one, so
    // at least two chains) start as usual instead: on a floor of 40–80 rooms
    // either may win (an office floor of 44 rooms is planned better without).
    const ZoneTree zones = formZones(brief);
    const bool zoned = p.rooms >= options.zonesFrom && zones.layered();
    const bool mixed = zoned && p.rooms < 2 * options.zonesFrom;
    const int chainCount = mixed ? std::max(threads, 2) : threads;
    auto fromZones = [&](int c) { return zoned && (!mixed || c % 2 == 0); };
    std::vector<std::unique_ptr<detail::Chain>> chains;
    for (int c = 0; c < chainCount; ++c)
        chains.push_back(std::make_unique<detail::Chain>(
            p, options.seed * 1000003u + 7919u * static_cast<unsigned>(c), c, epoch));
    detail::ThreadPool pool(threads);
    detail::PlanPool found(static_cast<std::size_t>(std::max(1, options.keep)) * 2);

    auto consider = [&](const std::vector<Rect>& rects) {
        // Sizing a tiling of 3,000 rooms takes seconds: past the time limit
        // only a first plan is still sized.
        if (options.timeLimit > 0 && elapsed() >= options.timeLimit && !found.plans().empty()) return;
        SizedTiling s = sizeTiling(brief, fp, rects, options,
                                   [&] { return options.timeLimit <= 0 || elapsed() < options.timeLimit; });
        if (!s.ok) return;
        SearchPlan best = detail::pickSizing(brief, p, std::move(s.sizings));
        const bool wasUsable = found.usable();
        const std::string key = best.key;
        if (found.offer(std::move(best))) {
            // On top: a better plan than any before.
            if (visitor && found.plans().front().key == key) visitor->onImproved(found.plans().front());
            if (!wasUsable && found.usable()) result.firstUsableSeconds = elapsed();
        }
    };

    bool stopped = visitor && !visitor->onRound(SearchProgress{}); // asked before any work
    std::vector<long long> used(chains.size(), 0); // per chain: moves spent on its zone plan (they count against the budget)
    if (!stopped && zoned) {
        pool.run(chainCount, [&](int c) {
            if (!fromZones(c)) return;
            detail::ZonePlanner planner(p, zones, options.seed * 1000003u + 7919u * static_cast<unsigned>(c) + 17u);
            planner.plan([&] { return options.timeLimit <= 0 || elapsed() < options.timeLimit; }, std::max(1LL, budget / 2));
            FloorTree tree = planner.tree();
            used[c] = planner.movesUsed();
            if (!tree.valid()) return;
            // What the zones left unmet, part by part.
            std::mt19937 rng(options.seed * 7919u + static_cast<unsigned>(c));
            detail::RepairOptions repair;
            repair.moves = std::max(1LL, budget / 2);
            used[c] += detail::repairTree(p, tree, rng,
                                          [&] { return options.timeLimit <= 0 || elapsed() < 0.5 * options.timeLimit; },
                                          repair)
                           .moves;
            chains[c]->startFrom(tree);
        });
        for (auto& c : chains)
            if (c->takeBestChanged()) consider(c->bestRects());
        settled = true;
    }
    long long roundsAfterUsable = 0;
    for (long long spent = 0; spent < budget && !stopped;) {
        const long long step = std::min(round, budget - spent);
        pool.run(chainCount, [&](int c) { chains[c]->run(std::clamp(budget - used[c] - spent, 0LL, step)); });
        spent += step;
        for (auto& c : chains) {
            if (c->takeBestChanged()) consider(c->bestRects());
            // Once settled, good neighbours of the best plan become variants.
            if (settled && c->currentEvaluation().hard == 0) consider(c->currentRects());
        }
        result.moves = spent * chainCount;
        SearchProgress progress;
        progress.moves = result.moves;
        progress.done = double(spent) / double(budget);
        if (options.timeLimit > 0) progress.done = std::max(progress.done, elapsed() / options.timeLimit);
        progress.done = std::min(1.0, progress.done);
        progress.usable = found.usable();
        progress.bestCost = found.plans().empty() ? 0 : found.plans().front().cost;
        if (visitor && !visitor->onRound(progress)) {
            stopped = true;
            break;
        }
        if (options.timeLimit > 0 && elapsed() >= options.timeLimit) break;
        if (found.usable() && options.stopWhenUsable) {
            if (!settled) {
                settled = true;
                for (auto& c : chains) c->settle();
            }
            // A few rounds of neighbours of the usable plan, for variants.
            if (++roundsAfterUsable > 3 || static_cast<int>(found.plans().size()) >= options.keep) break;
        }
    }
    if (!stopped && !found.plans().empty())
        offerFlips(brief, fp, options, p, found, elapsed,
                   options.timeLimit > 0 ? std::max(elapsed(), options.timeLimit) : 1e300);

    result.plans = found.take();
    if (static_cast<int>(result.plans.size()) > options.keep) result.plans.resize(options.keep);
    result.seconds = elapsed();
    result.status = result.plans.empty() ? SearchStatus::Empty
                    : stopped            ? SearchStatus::Stopped
                    : result.plans.front().misses.usable() ? SearchStatus::Usable
                                                           : SearchStatus::BestEffort;
    return result;
}

} // namespace abut
