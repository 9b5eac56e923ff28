// SPDX-License-Identifier: MIT
#include "search/detail/zone_plan.h"

#include "search/detail/chain.h"
#include "search/detail/repair.h"

#include <algorithm>
#include <cmath>
#include <deque>
#include <map>
#include <string>

namespace abut::detail {

ZonePlanner::ZonePlanner(const SearchProblem& full, const ZoneTree& zones, unsigned seed)
    : full_(full), zones_(zones), rng_(seed) {
    const int B = full.blockCount();
    zoneOfBlock_.assign(B, 0);
    for (int b = 0; b < full.rooms && b < static_cast<int>(zones.zoneOf.size()); ++b) zoneOfBlock_[b] = zones.zoneOf[b];
    known_.assign(B, full.outer);
    knownOwner_.assign(B, ~0);
    levels_.resize(zones.zones.size());
    trees_.resize(zones.zones.size());
    planned_.assign(zones.zones.size(), 0);
}

namespace {

// Joins a link into the level's links: one per pair of ends, the need and
// aim the largest, the weight the sum (at most 3), 'must' and door if any is.
void joinLink(SearchProblem& p, std::map<std::pair<int, int>, int>& index, int a, int b, const SearchProblem::Link& l) {
    auto [it, fresh] = index.emplace(std::make_pair(a, b), static_cast<int>(p.links.size()));
    if (fresh) {
        SearchProblem::Link n = l;
        n.a = a;
        n.b = b;
        p.links.push_back(n);
        return;
    }
    SearchProblem::Link& n = p.links[it->second];
    n.need = std::max(n.need, l.need);
    n.aim = std::max(n.aim, l.aim);
    n.weight = std::min(3.0, n.weight + l.weight);
    n.must = n.must || l.must;
    n.door = n.door || l.door;
}

} // namespace

ZonePlanner::Level ZonePlanner::level(int z, const Rect& outer) const {
    const ZoneTree::Zone& zone = zones_.zones[z];
    const SearchProblem& f = full_;
    Level out;
    SearchProblem& p = out.problem;
    std::vector<int> item(f.blockCount(), -1); // per full block: the level's block holding it
    for (int r : zone.rooms) {
        item[r] = static_cast<int>(out.room.size());
        out.room.push_back(r);
        out.zone.push_back(-1);
    }
    for (int c : zone.zones) {
        for (int r : zones_.allRooms(c)) item[r] = static_cast<int>(out.room.size());
        out.room.push_back(-1);
        out.zone.push_back(c);
    }
    const bool spare = z == 0 && f.blockCount() > f.rooms;
    if (spare) {
        item[f.rooms] = static_cast<int>(out.room.size());
        out.room.push_back(f.rooms);
        out.zone.push_back(-1);
    }
    const int B = static_cast<int>(out.room.size());
    for (int r : zone.run) out.run.push_back(item[r]);
    // Blocks: a room as it is; a zone with its rooms' area, the widest of
    // their minimum widths and every facade side one of them wishes.
    std::vector<std::vector<Point>> sketched(B);
    std::vector<int> members(B, 0);
    p.blocks.resize(B);
    for (int k = 0; k < B; ++k) {
        if (out.room[k] >= 0) {
            p.blocks[k] = f.blocks[out.room[k]];
            continue;
        }
        SearchProblem::Block& b = p.blocks[k];
        b = {};
        for (int r : zones_.allRooms(out.zone[k])) {
            const SearchProblem::Block& m = f.blocks[r];
            b.area += f.area[r];
            b.minWidth = std::max(b.minWidth, m.minWidth);
            b.facade.sides |= m.facade.sides;
            b.facade.anySide = b.facade.anySide || m.facade.anySide;
        }
    }
    // Blocks that go beyond a run's end: a circulation room, or a zone round one (a stair with its stores).
    out.endish.assign(B, 0);
    for (int k = 0; k < B; ++k) {
        if (out.room[k] >= 0) out.endish[k] = out.room[k] < f.rooms && f.blocks[out.room[k]].circulation;
        else if (const int h = out.zone[k] >= 0 ? zones_.zones[out.zone[k]].hub : -1; h >= 0)
            // Mostly its circulation (a stair with a store), not a suite round a small entry.
            out.endish[k] = f.blocks[h].circulation && f.area[h] >= 0.3 * p.blocks[k].area;
    }
    for (int r = 0; r < f.rooms; ++r) {
        if (item[r] < 0) continue;
        ++members[item[r]];
        if (r < static_cast<int>(f.sketch.size()) && f.sketch[r]) sketched[item[r]].push_back(*f.sketch[r]);
    }
    p.sketch.assign(B, std::nullopt);
    for (int k = 0; k < B; ++k) {
        if (sketched[k].empty() || static_cast<int>(sketched[k].size()) < members[k]) continue;
        Point c;
        for (const Point& q : sketched[k]) c.x += q.x / sketched[k].size(), c.y += q.y / sketched[k].size();
        p.sketch[k] = c;
    }
    // Links inside the level, and to rooms outside it as far as they are planned.
    std::map<std::pair<int, int>, int> linkIndex;
    std::map<int, int> outsideIndex; // per planned owner: its index in p.outside
    for (const SearchProblem::Link& l : f.links) {
        const int a = item[l.a], b = item[l.b];
        if (a < 0 && b < 0) continue;
        if (a >= 0 && b >= 0) {
            if (a != b) joinLink(p, linkIndex, std::min(a, b), std::max(a, b), l);
            continue;
        }
        const int inside = a >= 0 ? a : b, other = a >= 0 ? l.b : l.a;
        auto [it, fresh] = outsideIndex.emplace(knownOwner_[other], static_cast<int>(p.outside.size()));
        if (fresh) p.outside.push_back(known_[other]);
        joinLink(p, linkIndex, inside, B + it->second, l);
    }
    for (const SearchProblem::Block& b : p.blocks) p.area.push_back(b.area);
    if (z != 0)
        for (int r : f.cutouts) p.cutoutRects.push_back(*f.blocks[r].pin);
    finishPart(p, f, outer);
    p.rooms = spare ? B - 1 : B;
    return out;
}

FloorTree ZonePlanner::runStrip(const Level& l) {
    const SearchProblem& p = l.problem;
    const int B = p.blockCount();
    FloorTree t(B);
    const bool alongX = p.outer.width() >= p.outer.depth();
    const Side upperSide = alongX ? Side::N : Side::E, lowerSide = alongX ? Side::S : Side::W;
    const int pieces = static_cast<int>(l.run.size());
    const Side startSide = alongX ? Side::W : Side::S, endSide = alongX ? Side::E : Side::N;
    std::vector<int> position(B, -1), pieceOf(B, -1);
    for (int k = 0; k < pieces; ++k) position[l.run[k]] = k;
    // Each other block to the piece it must open on most.
    for (int b = 0; b < B; ++b) {
        if (position[b] >= 0) continue;
        double best = 0;
        for (int li : p.linksOf[b]) {
            const SearchProblem::Link& link = p.links[li];
            const int o = link.a == b ? link.b : link.a;
            if (p.isOutside(o) || position[o] < 0 || !link.must) continue;
            if (link.weight > best) best = link.weight, pieceOf[b] = position[o];
        }
    }
    // Sides: by the facade a block wishes; the others so that every column
    // has about the share of its area on the lower side that the decided
    // blocks have overall (so that the pieces line up).
    std::vector<std::vector<int>> upper(pieces), lower(pieces);
    std::vector<double> up(pieces, 0), down(pieces, 0);
    std::vector<int> before, after, loose, open;
    double decidedUp = 0, decidedDown = 0;
    for (int b = 0; b < B; ++b) {
        if (position[b] >= 0) continue;
        const int k = pieceOf[b];
        if (k < 0) {
            // Opening on something beyond an end (a stair): beside it; else after the strip.
            int end = 0;
            for (int li : p.linksOf[b]) {
                const SearchProblem::Link& link = p.links[li];
                const int o = link.a == b ? link.b : link.a;
                if (!p.isOutside(o) && l.endish[o] && pieceOf[o] >= 0) end = pieceOf[o] == 0 ? -1 : pieceOf[o] == pieces - 1 ? 1 : 0;
            }
            (end < 0 ? before : end > 0 ? after : loose).push_back(b);
            continue;
        }
        if (l.endish[b] && (k == 0 || k == pieces - 1) && pieces > 1) {
            (k == 0 ? before : after).push_back(b);
            continue;
        }
        const FacadeWish& w = p.blocks[b].facade;
        if (w.has(upperSide) != w.has(lowerSide)) {
            const bool toUpper = w.has(upperSide);
            (toUpper ? upper[k] : lower[k]).push_back(b);
            (toUpper ? up[k] : down[k]) += p.area[b];
            (toUpper ? decidedUp : decidedDown) += p.area[b];
        } else {
            open.push_back(b);
        }
    }
    // The run's direction: its first piece at the start (west or south)
    // unless what goes beyond the ends wishes the other way round.
    int pull = 0;
    for (int b : before) pull += p.blocks[b].facade.has(endSide) - p.blocks[b].facade.has(startSide);
    for (int b : after) pull += p.blocks[b].facade.has(startSide) - p.blocks[b].facade.has(endSide);
    std::vector<int> run = l.run;
    if (pull > 0) {
        std::reverse(run.begin(), run.end());
        std::reverse(upper.begin(), upper.end());
        std::reverse(lower.begin(), lower.end());
        std::reverse(up.begin(), up.end());
        std::reverse(down.begin(), down.end());
        std::swap(before, after);
    }
    const double share = decidedUp + decidedDown > 0 ? decidedDown / (decidedUp + decidedDown) : 0.5;
    std::sort(open.begin(), open.end(), [&](int a, int b) { return p.area[a] > p.area[b]; });
    for (int b : open) {
        const int k = pull > 0 ? pieces - 1 - pieceOf[b] : pieceOf[b];
        const double total = up[k] + down[k] + p.area[b];
        const bool toLower = std::abs((down[k] + p.area[b]) / total - share) < std::abs(down[k] / total - share);
        (toLower ? lower[k] : upper[k]).push_back(b);
        (toLower ? down[k] : up[k]) += p.area[b];
    }
    auto leaves = [&](const std::vector<int>& blocks) {
        std::vector<int> nodes;
        for (int b : blocks) nodes.push_back(t.leafOf(b));
        return nodes;
    };
    // The pieces end to end in one line, so the corridor runs straight
    // through; each row holds what opens on the pieces in the pieces' order,
    // so what opens on a piece lies along it (in a plan read off a drawing
    // the pieces are as long as what opens on them: the spans agree).
    std::vector<int> line, lowRow, highRow;
    for (int k = 0; k < pieces; ++k) {
        line.push_back(t.leafOf(run[k]));
        for (int b : lower[k]) lowRow.push_back(t.leafOf(b));
        for (int b : upper[k]) highRow.push_back(t.leafOf(b));
    }
    int strip = t.chainNodes(line, alongX);
    if (!lowRow.empty()) strip = t.makeCut(!alongX, t.chainNodes(lowRow, alongX), strip);
    if (!highRow.empty()) strip = t.makeCut(!alongX, strip, t.chainNodes(highRow, alongX));
    if (!before.empty()) strip = t.makeCut(alongX, t.chainNodes(leaves(before), !alongX), strip);
    if (!after.empty()) strip = t.makeCut(alongX, strip, t.chainNodes(leaves(after), !alongX));
    for (int b : loose) strip = t.makeCut(alongX, strip, t.leafOf(b));
    t.setRoot(strip);
    return t;
}

FloorTree ZonePlanner::solve(const Level& l) {
    const SearchProblem& p = l.problem;
    const int B = p.blockCount();
    if (B == 1) return FloorTree(1);
    std::vector<Rect> rects;
    FloorTree::Scratch scratch;
    if (B <= 4) { // few enough to try every slicing tree
        FloorTree t = bestSmallTree(p, &moves_);
        t.layout(p.area, p.outer, rects, scratch, &p.pins);
        return t;
    }
    Chain chain(p, static_cast<unsigned>(rng_()), 1, std::max<long long>(8000, 600LL * B));
    long long budget = 30000 + 4000LL * B;
    if (allowance_ > 0) budget = std::max(0LL, std::min(budget, allowance_ - moves_));
    const long long round = 5000;
    int metRounds = 0;
    // A run: its line laid out first, then polished (the line is what a
    // planner draws; annealing from scratch rarely finds it for long runs).
    if (l.run.size() >= 2) {
        const FloorTree line = runStrip(l);
        if (line.valid()) chain.startFrom(line);
    }
    for (long long spent = 0; spent < budget && metRounds < 2;) {
        const long long step = std::min(round, budget - spent);
        chain.run(step);
        spent += step;
        moves_ += step;
        if (chain.bestEvaluation().hard == 0) ++metRounds;
    }
    if (B == 5 && chain.bestEvaluation().hard > 0 && (allowance_ <= 0 || moves_ < allowance_)) {
        FloorTree t = bestSmallTree(p, &moves_);
        t.layout(p.area, p.outer, rects, scratch, &p.pins);
        if (Chain::better(evaluate(p, rects, nullptr), chain.bestEvaluation())) {
            return t;
        }
    }
    return chain.bestTree();
}

// The order a level's inner zones are planned in: the largest first, then
// always the one linked most strongly to those planned before it (larger
// first on a tie), so that a corridor continues where the last piece left it
// rather than between two pieces planned apart.
std::vector<int> ZonePlanner::plannedOrder(const Level& l, std::vector<std::pair<double, int>> children) const {
    std::vector<int> out;
    if (children.empty()) return out;
    std::sort(children.begin(), children.end());
    std::vector<int> blockOf(zones_.zones.size(), -1);
    for (int k = 0; k < static_cast<int>(l.zone.size()); ++k)
        if (l.zone[k] >= 0) blockOf[l.zone[k]] = k;
    std::vector<double> pull(l.problem.blockCount(), 0.0);
    std::vector<char> done(children.size(), 0);
    for (std::size_t n = 0; n < children.size(); ++n) {
        std::size_t pick = children.size();
        for (std::size_t i = 0; i < children.size(); ++i)
            if (!done[i] && (pick == children.size() || pull[blockOf[children[i].second]] > pull[blockOf[children[pick].second]]))
                pick = i;
        done[pick] = 1;
        const int b = blockOf[children[pick].second];
        out.push_back(children[pick].second);
        for (int li : l.problem.linksOf[b]) {
            const SearchProblem::Link& link = l.problem.links[li];
            const int other = link.a == b ? link.b : link.a;
            if (!l.problem.isOutside(other)) pull[other] += link.weight;
        }
    }
    return out;
}

void ZonePlanner::plan(const std::function<bool()>& keepGoing, long long moves) {
    allowance_ = moves;
    std::deque<int> queue{0};
    std::vector<Rect>& rectOfZone = zoneRect_;
    rectOfZone.assign(zones_.zones.size(), full_.outer);
    std::vector<Rect> rects;
    FloorTree::Scratch scratch;
    while (!queue.empty()) {
        if (keepGoing && !keepGoing()) return;
        if (allowance_ > 0 && moves_ >= allowance_) return;
        const int z = queue.front();
        queue.pop_front();
        levels_[z] = level(z, rectOfZone[z]);
        trees_[z] = solve(levels_[z]);
        planned_[z] = 1;
        const Level& l = levels_[z];
        trees_[z].layout(l.problem.area, l.problem.outer, rects, scratch, &l.problem.pins);
        std::vector<std::pair<double, int>> children;
        for (int k = 0; k < static_cast<int>(l.room.size()); ++k) {
            if (l.room[k] >= 0) {
                known_[l.room[k]] = rects[k];
                knownOwner_[l.room[k]] = l.room[k];
                continue;
            }
            const int c = l.zone[k];
            rectOfZone[c] = rects[k];
            for (int r : zones_.allRooms(c)) {
                known_[r] = rects[k];
                knownOwner_[r] = ~c;
            }
            children.emplace_back(-zones_.zones[c].area, c);
        }
        for (int c : plannedOrder(l, children)) queue.push_back(c);
    }
}

int ZonePlanner::compose(FloorTree& out, int z) const {
    if (!planned_[z]) { // stopped before this zone: its rooms in a row
        const Rect& r = z == 0 ? full_.outer : zoneRect_[z];
        return out.chain(zones_.allRooms(z), r.width() >= r.depth());
    }
    const Level& l = levels_[z];
    const FloorTree& t = trees_[z];
    // The level tree's nodes, children before parents, each mapped to a node of `out`.
    return out.copySubtree(t, t.root(), [&](int v) {
        const int k = t.node(v).block;
        return l.room[k] >= 0 ? out.leafOf(l.room[k]) : compose(out, l.zone[k]); // nesting is shallow
    });
}

FloorTree ZonePlanner::tree() const {
    FloorTree out(full_.blockCount());
    if (full_.blockCount() > 1) out.setRoot(compose(out, 0));
    return out;
}

} // namespace abut::detail
