// SPDX-License-Identifier: MIT
// Where the plan search starts: floor trees cut through rough positions of
// the blocks. Positions come from the sketch (scaled into the outer
// rectangle, north up) or from a spring layout of the brief (adjacencies
// pull, overlapping discs push, facade wishes pull towards their side).
// Trees are recursive area-proportional cuts, each across the longer side
// mostly, between the blocks on either side of it (Bruls, Huizing & van Wijk,
// "Squarified treemaps", 2000) — plainly, or with circulation zones (a hub
// and the rooms that open on it) laid out first as strips: the hub along
// the strip, its rooms in a row on either side.
// Running time: a spring layout O(steps · blocks²); a cut tree O(blocks² log blocks).
#pragma once

#include "search/detail/problem.h"
#include "search/floor_tree.h"

#include <functional>
#include <random>
#include <vector>

namespace abut::detail {

// The sketch's positions (SearchProblem::sketch) when `useSketch` and every
// block has one, else a spring layout; `jitter` (0..1, × √area) moves them at
// random. Blocks held in place sit at their centres.
std::vector<Point> roughPositions(const SearchProblem& p, bool useSketch, double jitter,
                                  std::mt19937& rng);

// Recursive area-proportional cuts of `outer` through the items' positions.
// `half`: how far each item reaches from its position (a corridor along its
// rooms); `pin`: per item, where it is held (the cuts keep off it);
// `make(item, rect)`: the node of an item once its rectangle is known.
// Returns the top node.
int cutOver(FloorTree& tree, const std::vector<double>& area, const std::vector<Point>& pos,
            const std::vector<Point>& half, const std::vector<std::optional<Rect>>& pin, const Rect& outer,
            double scale, std::mt19937& rng, double noise, const std::function<int(int, const Rect&)>& make);

// How far each block reaches from its position: a share of its square's
// side; a hub along the spread of the rooms linked to it.
std::vector<Point> reaches(const SearchProblem& p, const std::vector<Point>& pos);

// A tree of plain cuts over every block.
FloorTree cutTree(const SearchProblem& p, const std::vector<Point>& pos, std::mt19937& rng, double noise);

// A hub and the rooms that open on it (a room linked to several hubs goes
// to one at random; a room linked to no hub joins the zone of a linked room).
struct Zone {
    int hub = -1;
    std::vector<int> clients;                // rooms that open on the hub
    std::vector<std::pair<int, int>> behind; // (room, the zone room it is reached through)
};
std::vector<Zone> circulationZones(const SearchProblem& p, std::mt19937& rng);

// A zone as a strip in `r`: the hub along the longer side, its rooms in a
// row on either side (or one), ordered by position. Returns its top node.
int zoneStrip(FloorTree& tree, const Zone& z, const std::vector<Point>& pos, const std::vector<double>& area,
              const Rect& r, std::mt19937& rng);

// Each zone a strip, the zones and the other blocks placed by cuts.
FloorTree zoneTree(const SearchProblem& p, const std::vector<Zone>& zones, const std::vector<Point>& pos,
                   std::mt19937& rng, double noise);

} // namespace abut::detail
