// SPDX-License-Identifier: MIT
#include "search/detail/problem.h"

#include "search/plan_search.h"
#include "search/zones.h"

#include <algorithm>
#include <cctype>
#include <cmath>

namespace abut::detail {

bool SearchProblem::isHub(int i) const {
    return i < rooms && (mustDegree[i] >= 3 || (blocks[i].circulation && mustDegree[i] >= 2)); // isHubRoom's rule
}

SearchProblem makeProblem(const Brief& brief, const Footprint& fp, const SearchOptions& o) {
    SearchProblem p;
    p.fp = fp;
    p.outer = {0, 0, fp.width, fp.depth};
    p.bounds = p.outer;
    p.scale = std::sqrt(fp.width * fp.depth);
    p.rooms = static_cast<int>(brief.rooms.size());
    p.thresholds.anyWall = o.anyWall;
    const BlockAreas areas = blockAreas(brief, fp);
    for (std::size_t i = 0; i < brief.rooms.size(); ++i) {
        const Room& r = brief.rooms[i];
        SearchProblem::Block b;
        b.area = areas.room[i];
        b.minWidth = r.minWidth.value_or(0.0);
        b.maxAspect = r.maxAspect.value_or(0.0);
        b.circulation = isCirculation(r);
        b.facade = r.facade;
        b.cutout = r.cutout;
        b.tolerance = r.tolerance();
        if (r.fixed) {
            b.pin = toRect(*r.fixed);
            p.pinned.push_back(static_cast<int>(i));
            if (r.cutout) p.cutouts.push_back(static_cast<int>(i));
        }
        p.blocks.push_back(b);
    }
    if (areas.spare > 0) {
        SearchProblem::Block b;
        b.area = areas.spare;
        b.spare = true;
        b.minWidth = o.spareMinimum;
        p.blocks.push_back(b);
    }
    for (const SearchProblem::Block& b : p.blocks) p.area.push_back(b.area);
    p.sketch.resize(p.blocks.size());
    for (std::size_t i = 0; i < brief.rooms.size(); ++i)
        if (const SketchPoint* s = brief.sketchPosition(brief.rooms[i].id); s && !brief.rooms[i].cutout)
            p.sketch[i] = Point{s->x, s->y};
    if (!p.pinned.empty())
        for (const SearchProblem::Block& b : p.blocks) p.pins.push_back(b.pin);
    p.linksOf.resize(p.blocks.size());
    p.mustDegree.assign(p.blocks.size(), 0);
    const std::vector<std::pair<int, int>> ends = brief.adjacencyRooms();
    for (std::size_t k = 0; k < brief.adjacencies.size(); ++k) {
        const Adjacency& a = brief.adjacencies[k];
        const auto [u, v] = ends[k];
        if (u < 0 || v < 0 || u == v) continue;
        if (a.priority == Priority::Must && a.kind == AdjacencyKind::Door) ++p.mustDegree[u], ++p.mustDegree[v];
        SearchProblem::Link l;
        l.a = u;
        l.b = v;
        l.must = a.priority == Priority::Must;
        l.door = a.kind == AdjacencyKind::Door;
        l.need = wallNeeded(brief, a, p.thresholds);
        // A wall adjacency is aimed at four times the shortest contact (at
        // least 0.2 m) so that sizing keeps it: a margin, not the threshold.
        l.aim = l.door ? l.need : std::max(4 * o.anyWall, 0.2);
        l.weight = l.must ? 1.0 : 0.12;
        // Two circulation spaces that must meet carry the building's routes:
        // their link weighs more than a room's door.
        if (l.must && p.blocks[u].circulation && p.blocks[v].circulation) l.weight = 3.0;
        p.linksOf[u].push_back(static_cast<int>(p.links.size()));
        p.linksOf[v].push_back(static_cast<int>(p.links.size()));
        p.links.push_back(l);
    }
    return p;
}

void finishPart(SearchProblem& p, const SearchProblem& full, const Rect& outer) {
    const int B = p.blockCount();
    p.linksOf.assign(B, {});
    p.mustDegree.assign(B, 0);
    for (int k = 0; k < static_cast<int>(p.links.size()); ++k) {
        const SearchProblem::Link& l = p.links[k];
        p.linksOf[l.a].push_back(k);
        if (!p.isOutside(l.b)) p.linksOf[l.b].push_back(k);
        if (l.must && l.door) {
            ++p.mustDegree[l.a];
            if (!p.isOutside(l.b)) ++p.mustDegree[l.b];
        }
    }
    p.pinned.clear();
    p.cutouts.clear();
    p.pins.clear();
    for (int k = 0; k < B; ++k)
        if (p.blocks[k].pin) {
            p.pinned.push_back(k);
            if (p.blocks[k].cutout) p.cutouts.push_back(k);
        }
    if (!p.pinned.empty())
        for (const SearchProblem::Block& b : p.blocks) p.pins.push_back(b.pin);
    p.fp = full.fp;
    p.bounds = full.bounds;
    p.outer = outer;
    p.scale = std::sqrt(std::max(outer.area(), 1e-12));
    p.thresholds = full.thresholds;
}

} // namespace abut::detail
