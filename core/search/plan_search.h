// SPDX-License-Identifier: MIT
// The plan search: whole plans, arranged and sized together.
//
// Method: simulated annealing (Kirkpatrick, Gelatt & Vecchi, Science 220,
// 1983) over floor trees (search/floor_tree.h: slicing cuts and pinwheels,
// areas exact by construction; Wong & Liu, DAC 1986), in the fixed-outline
// setting — the footprint is given (Adya & Markov, IEEE TVLSI 2003). The
// moves change who touches whom (swap rooms, move a group next to another,
// turn or mirror a cut, make or undo a pinwheel); moves aimed at what the
// plan misses (a room away from its 'must' neighbour or its facade, a room
// too narrow) are drawn more often. The cost is what a planner checks:
// 'must' adjacencies (doors with a door-wide wall), facade wishes, minimum
// widths and aspect limits; 'should' adjacencies weigh less. Seeds are
// recursive area-proportional cuts through the rooms' rough positions — the
// sketch's, or a spring layout of the brief when there is none — each cut
// across the longer side (Bruls, Huizing & van Wijk, "Squarified treemaps",
// 2000).
//
// Several chains run at once on a thread pool, in rounds of a fixed number of
// moves; between rounds the best plans are turned into extended graphs with a
// regular edge labeling (dual/tiling_dual.h, checked) and sized with the
// area bands free (size/segment_sizing.h), so every plan returned is a
// rectangular dual that passes the stage checkers. Plans are judged by the
// one measure (search/requirements.h) and ranked by the one score
// (search/score.h), one per arrangement (search/arrangement_key.h). The
// search stops when a plan meets the whole brief, when its move budget is
// spent, when the time limit is reached or when the visitor says so. Rounds
// make it reproducible: the same seed and thread count give the same plans
// (unless the time limit cuts it short).
//
// The pieces live in search/detail: the problem (problem.h), the cost
// (cost.h), the seeds (seeds.h), the moves (moves.h), the chain (chain.h)
// and the sizing and pool of plans (sized_plans.h); this file orchestrates.
//
// Running time: per move O(depth) for the move, O(blocks) for the layout,
// O(blocks · cut-outs + links) for the cost; per round, for each chain whose
// best plan changed, one dual (O(blocks log blocks)) and one to three
// sizings (Newton steps with a sparse factorisation each) and an O(rooms²)
// arrangement key. The budget grows with the room count (SearchOptions::moves).
#pragma once

#include "augment/extended_graph.h"
#include "brief/brief.h"
#include "label/regular_edge_labeling.h"
#include "search/requirements.h"
#include "size/segment_sizing.h"

#include <string>
#include <functional>
#include <vector>

namespace abut {

struct SearchOptions {
    unsigned seed = 1;
    int threads = 0;            // worker threads and annealing chains (0 = every core)
    double timeLimit = 0;       // seconds (0 = none: the move budget ends the search)
    long long moves = 0;        // moves per chain (0 = 200,000 + 60,000 per room; twelve times that with rooms fixed in place or cut-outs)
    int keep = 10;              // distinct arrangements returned at most
    double anyWall = minContactLength; // m: shortest wall that counts as a contact
    double spareMinimum = minSpareSide; // m: smallest side of a spare space
    double grid = 0;            // m: planning module for walls (0 = none)
    bool stopWhenUsable = true; // stop at the first plan that meets the whole brief
    int variantFlips = -1;      // labeling flips of the best plan sized as variants (−1 = 3 × keep)
    int zonesFrom = 40;         // rooms from which a floor is planned top down by its zones first (search/zones.h)
};

// One arrangement found, sized.
struct SearchPlan {
    ExtendedGraph extended;     // rooms, poles, spare spaces
    RegularEdgeLabeling labeling;
    SizingResult sized;         // rects per vertex of `extended`
    RequirementMisses misses;
    double score = 0;           // the one ranking (search/score.h; lower is better)
    double cost = 0;            // the search's own measure (lower is better), for progress
    std::string key;            // the arrangement (search/arrangement_key.h)
};

struct SearchProgress {
    double done = 0;            // share of the budget spent, 0..1
    long long moves = 0;        // over all chains
    double bestCost = 0;
    bool usable = false;        // a plan meeting the whole brief is among the results
};

// Watches a running search (CGAL-style visitor). Called on the thread that
// called searchPlans, between rounds.
class SearchVisitor {
public:
    virtual ~SearchVisitor() = default;
    virtual bool onRound(const SearchProgress&) { return true; } // false: stop now
    virtual void onImproved(const SearchPlan&) {}                // a better plan than any before
};

enum class SearchStatus { Usable, BestEffort, Stopped, Empty };

struct SearchResult {
    SearchStatus status = SearchStatus::Empty;
    std::vector<SearchPlan> plans; // best first, by score
    double firstUsableSeconds = -1;
    double seconds = 0;
    long long moves = 0;
};

// The rooms' targets as the search sizes them: each room's target, scaled
// within its band when the footprint is larger or smaller than the targets'
// sum; `spare` gets what the bands cannot take (0 when none).
struct BlockAreas {
    std::vector<double> room;
    double spare = 0;
};
BlockAreas blockAreas(const Brief& brief, const Footprint& footprint);
// The same per vertex of an extended graph (rooms; spare spaces share the
// spare area; poles 0), for SizingProblem::setPreferredAreas.
std::vector<double> preferredAreas(const Brief& brief, const Footprint& footprint, const ExtendedGraph& x);

SearchResult searchPlans(const Brief& brief, const SearchOptions& options = {}, SearchVisitor* visitor = nullptr);

// Turns a tiling (room rectangles in brief order, then spare spaces) into
// sized plans: its extended graph and labeling (checked), sized warm from the
// tiling in one or more ways — towards the targets with every hard minimum
// enforced; with the area bands free when that leaves a room off its band;
// with the tiling's own shortfalls held when it has some. `ok` false when the
// tiling is not one.
struct SizedTiling {
    bool ok = false;
    std::string problem;
    std::vector<SearchPlan> sizings; // misses and cost not yet judged
};
SizedTiling sizeTiling(const Brief& brief, const Footprint& footprint, const std::vector<Rect>& tiles,
                       const SearchOptions& options, const std::function<bool()>& inTime = {});

} // namespace abut
