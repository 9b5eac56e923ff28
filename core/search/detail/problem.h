// SPDX-License-Identifier: MIT
// The brief as the plan search sees it: blocks (rooms, then at most one
// spare space) that tile a rectangle, and links (adjacencies) between them.
// Built once per search in O(rooms + adjacencies).
#pragma once

#include "brief/brief.h"
#include "dual/rectangular_dual.h"
#include "search/requirements.h"

#include <optional>
#include <vector>

namespace abut {

struct SearchOptions;

namespace detail {

struct Point {
    double x = 0, y = 0;
};

struct SearchProblem {
    struct Block {
        double area = 0;         // units², what the layout gives it exactly
        double minWidth = 0;     // units (0: none)
        double maxAspect = 0;    // long/short (0: none)
        bool circulation = false; // category "circulation": a corridor, hall, landing
        bool spare = false;      // the spare space
        bool cutout = false;     // not building: a wall on it is an exterior wall
        double tolerance = 0.05; // area band (fraction)
        std::optional<Rect> pin; // where the block is fixed
        FacadeWish facade;
    };
    struct Link {
        int a = 0, b = 0;
        double need = 0;   // units: the wall that meets the adjacency (the measure's threshold)
        double aim = 0;    // units: the wall the cost aims at (a margin over `need` for walls)
        double weight = 1; // 'must' 1, 'should' less, two circulation spaces more
        bool must = true;
        bool door = true;
    };
    std::vector<Block> blocks;
    std::vector<Link> links;
    std::vector<std::vector<int>> linksOf; // per block: indices into links
    std::vector<int> mustDegree;           // per block: 'must' doors (what makes a hub)
    std::vector<double> area;              // per block
    std::vector<int> pinned, cutouts;      // blocks fixed in place; those of them that are cut-outs
    std::vector<Rect> cutoutRects;         // cut-outs that are not blocks of this problem (a zone's): walls on them are facades
    std::vector<std::optional<Rect>> pins; // per block when any is pinned (FloorTree::layout), else empty
    std::vector<std::optional<Point>> sketch; // per block: where the sketch has it (sketch units), when it has
    Footprint fp;
    Rect bounds;      // the footprint's rectangle [0,W]×[0,D]: facades are its sides (and cut-outs')
    Rect outer;       // the rectangle the blocks tile: the footprint's, or a zone's inside it
    // Rectangles of blocks outside `outer` that links may reach (a zone's
    // neighbours): a link's end b ≥ blockCount() is outside[b − blockCount()].
    std::vector<Rect> outside;
    double scale = 1; // √(footprint area)
    int rooms = 0;    // blocks 0..rooms−1 are the brief's rooms (cut-outs included)
    Thresholds thresholds;

    int blockCount() const { return static_cast<int>(blocks.size()); }
    bool isOutside(int b) const { return b >= blockCount(); }
    // The rectangle of end `b` of a link: a block's in `rect`, or an outside one.
    const Rect& rectOf(int b, const std::vector<Rect>& rect) const {
        return isOutside(b) ? outside[b - blockCount()] : rect[b];
    }
    // A hub: a room other rooms open on — three or more 'must' doors, or a
    // circulation space with two. Zones form round hubs (search/detail/seeds.h),
    // the moves gather a hub's rooms along it. One meaning everywhere.
    bool isHub(int i) const;
    // Sides this close are one line (the layouts' round-off).
    double lineTolerance() const { return 1e-9 * scale; }
};

// O(rooms + adjacencies). The areas are blockAreas' (search/plan_search.h).
SearchProblem makeProblem(const Brief& brief, const Footprint& fp, const SearchOptions& options);

// Completes the problem of a part of `full` (a zone's level, a part planned
// afresh) once its blocks and links are set: the links indexed per block,
// 'must' doors counted, held blocks listed, laid out in `outer`, the
// footprint and thresholds as in `full`. O(blocks + links).
void finishPart(SearchProblem& p, const SearchProblem& full, const Rect& outer);

} // namespace detail
} // namespace abut
