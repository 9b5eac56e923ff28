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

#include <algorithm>
#include <functional>
#include <optional>
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

// What cutOver's loop adds up per cut position k at c (positions ascending
// with k), for blocks sorted by `at`: how far blocks lie on the wrong side
// of the cut (prefix sums and a binary search), how deep the cut runs
// through blocks (a sum of tents max(0, reach − |at − c|), swept as a
// piecewise linear function of c), and the same wrong-side measure for
// blocks held in place (few: looped). O(n log n) to start, O(log n + held)
// per position.
class SplitSweep {
public:
    void start(const std::vector<int>& items, const std::vector<Point>& pos, const std::vector<Point>& half,
               const std::vector<std::optional<Rect>>& pin, bool dir) {
        const std::size_t m = items.size();
        at_.resize(m);
        sum_.assign(m + 1, 0.0);
        events_.clear();
        held_.clear();
        for (std::size_t j = 0; j < m; ++j) {
            at_[j] = dir ? pos[items[j]].x : pos[items[j]].y;
            sum_[j + 1] = sum_[j] + at_[j];
            const double reach = dir ? half[items[j]].x : half[items[j]].y;
            if (reach > 0) {
                events_.push_back({at_[j] - reach, 1.0});
                events_.push_back({at_[j], -2.0});
                events_.push_back({at_[j] + reach, 1.0});
            }
            if (const std::optional<Rect>& f = pin[items[j]])
                held_.push_back({j, dir ? f->x0 : f->y0, dir ? f->x1 : f->y1});
        }
        std::sort(events_.begin(), events_.end(), [](const Event& a, const Event& b) { return a.x < b.x; });
        next_ = 0;
        value_ = slope_ = 0;
        c_ = events_.empty() ? 0.0 : events_.front().x;
    }

    void at(std::size_t k, double c, double& wrong, double& through) {
        // Blocks before the cut lying past it, and blocks after it lying before it.
        const std::size_t past = static_cast<std::size_t>(std::upper_bound(at_.begin(), at_.end(), c) - at_.begin());
        if (past < k) wrong += (sum_[k] - sum_[past]) - c * static_cast<double>(k - past);
        const std::size_t before = static_cast<std::size_t>(std::lower_bound(at_.begin(), at_.end(), c) - at_.begin());
        if (before > k) wrong += c * static_cast<double>(before - k) - (sum_[before] - sum_[k]);
        for (const Held& h : held_)
            wrong += 4.0 * (h.index < k ? std::max(0.0, h.hi - c) : std::max(0.0, c - h.lo));
        // The tents, advanced to c.
        while (next_ < events_.size() && events_[next_].x <= c) {
            value_ += slope_ * (events_[next_].x - c_);
            c_ = events_[next_].x;
            slope_ += events_[next_].slope;
            ++next_;
        }
        if (c > c_) {
            value_ += slope_ * (c - c_);
            c_ = c;
        }
        through += std::max(0.0, value_);
    }

private:
    struct Event {
        double x, slope;
    };
    struct Held {
        std::size_t index;
        double lo, hi;
    };
    std::vector<double> at_, sum_;
    std::vector<Event> events_;
    std::vector<Held> held_;
    std::size_t next_ = 0;
    double value_ = 0, slope_ = 0, c_ = 0;
};


} // namespace abut::detail
