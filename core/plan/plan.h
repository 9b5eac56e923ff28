// SPDX-License-Identifier: MIT
// A plan: one or more sized variants of a brief, each a set of axis-aligned
// room rectangles and spare spaces that tile the footprint.
#pragma once

#include "augment/extended_graph.h"
#include "brief/brief.h"
#include "diagnostics.h"
#include "dual/rectangular_dual.h"
#include "label/regular_edge_labeling.h"
#include "search/requirements.h"
#include "size/segment_sizing.h"

#include <string>
#include <vector>

namespace abut {

struct PlanMetrics {
    double worstAreaError = 0;   // max |achieved − target| / target over rooms
    double meanAreaError = 0;
    double worstAspect = 0;      // max long/short side over rooms
    int shortDoorWalls = 0;      // door adjacencies with less than doorWidth of wall
    int narrowRooms = 0;         // rooms narrower than their minWidth
    double spareArea = 0;        // total area of spare spaces
};

// A change to the brief that would meet one requirement a variant misses
// (plan/relaxations.h finds and verifies them).
struct Relaxation {
    std::string field;              // the project field it changes, as a JSON Pointer
    std::string from, to;           // JSON values: the field now, and as suggested
    std::string text;               // one line in the planner's words
    std::string holds;              // the requirement it relaxes, as it stands, e.g. "Store's minimum width of 1.8 m"
    std::vector<std::string> meets; // the requirements it meets (UnmetItem texts, as the plan file lists them)
    std::vector<std::string> meetsKeys; // the same as UnmetItem::key(), to find them
    std::vector<int> rooms;         // brief room indices the change concerns (none for the footprint)
    int adjacency = -1;             // the brief adjacency it gives up, or −1
    double change = 0;              // relative size of the change (for ranking; giving up counts 1)
};

struct PlanVariant {
    int rank = 1;
    double score = 0;
    std::vector<Rect> rooms;  // one per brief room, brief order
    std::vector<Rect> spaces; // spare spaces
    std::vector<int> dropped; // brief adjacency indices not realised (door walls too short included)
    std::vector<int> unmetFacade; // rooms that miss a facade side they wish for
    bool oneSided = false;        // area-universal: any area targets can be met exactly
    bool sized = false;           // segment positions chosen by the sizer (not just fitted)
    RequirementMisses misses;            // what keeps it from being usable (none: usable)
    std::vector<Relaxation> relaxations; // what must give (the best variant only; see plan/relaxations.h)
    PlanMetrics metrics;
    // The combinatorial layout the rectangles come from (for sizing and dragging).
    ExtendedGraph extended;
    RegularEdgeLabeling labeling;
};

enum class PlanStatus {
    Ok,          // every must adjacency and facade wish kept
    Compromised, // the best variant gives some up
    NoPlan,      // nothing to plan (no rooms)
    Internal,    // a result failed its own checker: a bug, reported
    Cancelled    // stopped by the caller; the variants found so far are kept
};
const char* toString(PlanStatus s);

// How the computation went (for benchmarks and the plan file).
struct PlanStats {
    double firstUsableSeconds = -1; // when the first usable variant was found (−1: none)
    double seconds = 0;             // the whole computation
    long long moves = 0;            // plan search moves over all chains
};

struct Plan {
    PlanStatus status = PlanStatus::Ok;
    std::string summary;
    std::string units = "m";
    Footprint footprint;
    std::vector<PlanVariant> variants; // best first
    std::vector<Diagnostic> diagnostics;
    PlanStats stats;
};

struct PlanOptions {
    int variants = 10;               // how many to keep
    unsigned seed = 1;               // for choices that are made at random
    int threads = 0;                 // plan search threads (0 = every core)
    double timeLimit = 0;            // seconds (0 = none: the search's move budget ends it)
    long long searchMoves = 0;       // plan search moves per chain (0 = from the room count)
    int variantFlips = -1;           // labeling flips of the best plan tried as variants (−1 = 3 × variants)
    double anyWall = minContactLength; // m: shortest wall that counts as a contact (brief.h)
    double spareMinimum = minSpareSide; // m: smallest side of a spare space
    int cornerTrials = 40;           // corner assignments tried per brief
    int augmentations = 4;           // triangulations tried per corner assignment (1 = the first only)
    int labelingsPerGraph = 24;      // labelings tried per extended graph
    int layoutBudget = 600;          // variants laid out at most, over all graphs
    int sizedCandidates = 30;        // best fitted variants that are then sized
    int improvedCandidates = 1;      // best sized variants then improved by labeling flips
    int flipBudget = 0;              // sizings per improved variant (0 = 40 + n·min(400, 8n) for n rooms)
    double grid = 0.0;               // m: planning module for walls (0 = none)
    bool relaxations = true;         // work out what must give for the best variant (plan/relaxations.h)
};

// Score of a variant (lower is better): planScore (search/score.h) of its rectangles.
double variantScore(const Brief& brief, const Footprint& footprint, const PlanVariant& v);

} // namespace abut
