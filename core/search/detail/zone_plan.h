// SPDX-License-Identifier: MIT
// Planning a large floor top down, zone by zone (search/zones.h), as the
// published fixed-outline floorplanners that handle hundreds of blocks do:
// a legal layout at every level (Cong, Romesis & Shinnerl, IEEE TCAD 25(9),
// 2006), hierarchical room layout zone by zone (Wu, Fan, Liu & Wonka, Comput.
// Graph. Forum 37(2), 2018).
//
// The floor's zones and loose rooms are arranged first as blocks (a zone's
// area is its rooms', it wishes every facade its rooms wish, and its links
// are its rooms' links to the others). Then each zone is planned inside the
// rectangle it got, its rooms and inner zones as blocks, with every link to
// a room outside it measured against that room's rectangle as far as it is
// planned (a port: the corridor piece that must meet the next one reaches
// the side where the next one is). Siblings are planned one after another,
// larger first, so a later zone meets the rooms of an earlier one. Each level
// is an annealing chain (search/detail/chain.h) on a problem of a few dozen
// blocks at most. The trees of the levels are put together into one floor
// tree over all rooms, which the plan search then polishes and sizes.
//
// Running time: per level O(budget · blocks) for the chain, O(links) to
// build it; all levels together about O(rooms · budget per block).
#pragma once

#include "search/detail/problem.h"
#include "search/floor_tree.h"
#include "search/zones.h"

#include <functional>
#include <random>
#include <vector>

namespace abut::detail {

class ZonePlanner {
public:
    // `full`: the whole brief's problem (rooms, then the spare block); `zones`
    // formed from the same brief.
    ZonePlanner(const SearchProblem& full, const ZoneTree& zones, unsigned seed);

    // Plans every zone, top down. `keepGoing` is asked between levels; false
    // stops early (the tree then holds what was planned, the rest as seeded),
    // and so does spending `moves` chain moves and trees tried (0: no bound).
    void plan(const std::function<bool()>& keepGoing = {}, long long moves = 0);
    // Chain moves and trees tried so far.
    long long movesUsed() const { return moves_; }
    // The floor tree over `full`'s blocks.
    FloorTree tree() const;

    // One level: a zone's rooms and inner zones as the blocks of a problem
    // laid out in `outer` (public for the tests).
    struct Level {
        SearchProblem problem;
        std::vector<int> room; // per block: the full problem's block it is, or −1
        std::vector<int> zone; // per block: the zone it is, or −1
        std::vector<int> run;  // blocks that are corridor pieces of a run, in order along it
        std::vector<char> endish; // per block: a circulation room or a zone round one (a stair and its stores)
    };
    // A run laid out as one line: its pieces end to end along the longer
    // side, what opens on them in a row either side in the pieces' order (by
    // the facade it wishes, else to even out the rows piece by piece), stairs
    // and the like that open on an end piece beyond that end. Public for the tests.
    static FloorTree runStrip(const Level& l);
    Level level(int zone, const Rect& outer) const;

private:
    FloorTree solve(const Level& l);
    int compose(FloorTree& out, int zone) const;
    std::vector<int> plannedOrder(const Level& l, std::vector<std::pair<double, int>> children) const;

    const SearchProblem& full_;
    const ZoneTree& zones_;
    std::mt19937 rng_;
    std::vector<int> zoneOfBlock_;  // per full block: its innermost zone (the spare block: 0)
    std::vector<Rect> known_;       // per full block: the rectangle of the smallest planned block holding it
    std::vector<int> knownOwner_;   // per full block: which planned block that is (a zone ~z, or a block b)
    std::vector<Level> levels_;     // per zone
    std::vector<FloorTree> trees_;  // per zone: its level's tree
    std::vector<char> planned_;     // per zone
    std::vector<Rect> zoneRect_;    // per zone: the rectangle it got
    long long moves_ = 0;           // chain moves and trees tried
    long long allowance_ = 0;       // at most (0: no bound)
};

} // namespace abut::detail
