// SPDX-License-Identifier: MIT
#include "search/plan_search.h"

#include "detail/thread_pool.h"
#include "dual/tiling_dual.h"
#include "label/labeling_lattice.h"
#include "search/floor_tree.h"

#include <algorithm>
#include <array>
#include <chrono>
#include <cmath>
#include <cstdint>
#include <functional>
#include <memory>
#include <numeric>
#include <random>
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

namespace {

using Clock = std::chrono::steady_clock;


struct Point {
    double x = 0, y = 0;
};

// The brief as the search sees it: blocks (rooms, then at most one spare
// space) and links (adjacencies).
struct Problem {
    struct Block {
        double area = 0;
        double minWidth = 0;   // 0: none
        double maxAspect = 0;  // 0: none
        bool circulation = false;
        bool spare = false;
        bool cutout = false;     // not building: a wall on it is an exterior wall
        double tolerance = 0.05; // area band (fraction)
        std::optional<Rect> pin; // where the block is fixed
        FacadeWish facade;
    };
    struct Link {
        int a = 0, b = 0;
        double need = 0;   // shared wall wanted
        double weight = 1; // 'must' 1, 'should' less
        bool must = true;
    };
    std::vector<Block> blocks;
    std::vector<Link> links;
    std::vector<std::vector<int>> linksOf; // per block
    std::vector<int> mustDegree;           // per block: 'must' links
    std::vector<double> area;              // per block
    std::vector<int> pinned, cutouts;      // blocks fixed in place; those of them that are cut-outs
    std::vector<std::optional<Rect>> pins; // per block when any is pinned (FloorTree::layout), else empty
    Footprint fp;
    double scale = 1; // √(footprint area)
    int rooms = 0;
};

Problem makeProblem(const Brief& brief, const Footprint& fp, const SearchOptions& o) {
    Problem p;
    p.fp = fp;
    p.scale = std::sqrt(fp.width * fp.depth);
    p.rooms = static_cast<int>(brief.rooms.size());
    const BlockAreas areas = blockAreas(brief, fp);
    for (std::size_t i = 0; i < brief.rooms.size(); ++i) {
        const Room& r = brief.rooms[i];
        Problem::Block b;
        b.area = areas.room[i];
        b.minWidth = r.minWidth.value_or(0.0);
        b.maxAspect = r.maxAspect.value_or(0.0);
        std::string cat = r.category;
        std::transform(cat.begin(), cat.end(), cat.begin(), [](unsigned char c) { return std::tolower(c); });
        b.circulation = cat == "circulation";
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
        Problem::Block b;
        b.area = areas.spare;
        b.spare = true;
        b.minWidth = o.spareMinimum;
        p.blocks.push_back(b);
    }
    for (const Problem::Block& b : p.blocks) p.area.push_back(b.area);
    if (!p.pinned.empty())
        for (const Problem::Block& b : p.blocks) p.pins.push_back(b.pin);
    p.linksOf.resize(p.blocks.size());
    p.mustDegree.assign(p.blocks.size(), 0);
    for (const Adjacency& a : brief.adjacencies) {
        const int u = brief.roomIndex(a.a), v = brief.roomIndex(a.b);
        if (u < 0 || v < 0 || u == v) continue;
        if (a.priority == Priority::Must) ++p.mustDegree[u], ++p.mustDegree[v];
        Problem::Link l;
        l.a = u;
        l.b = v;
        l.must = a.priority == Priority::Must;
        l.need = a.kind == AdjacencyKind::Door ? brief.doorWidth : std::max(4 * o.anyWall, 0.2);
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

// What a layout misses, for the moves aimed at it.
struct Violation {
    enum Kind : std::uint8_t { Link, Facade, Width, Aspect } kind;
    int block;
    int other; // Link: the other block; Facade: the side (−1: any)
};

struct Evaluation {
    double cost = 0;
    int hard = 0; // requirements missed: 'must' links, facades, widths, aspects
};

double sideDistance(const Rect& r, Side s, const Footprint& fp) {
    switch (s) {
    case Side::N: return fp.depth - r.y1;
    case Side::E: return fp.width - r.x1;
    case Side::S: return r.y0;
    case Side::W: return r.x0;
    }
    return 0;
}

// The search's measure of a layout (lower is better; 0 meets everything),
// as a sum of terms per block and per link so that a part of the plan can
// be measured alone.
// How far `r` is from an exterior wall facing `s`: the footprint's side, or a
// cut-out beyond it on that side (overlapping it across).
double exteriorDistance(const Problem& p, const std::vector<Rect>& rect, const Rect& r, Side s) {
    double d = sideDistance(r, s, p.fp);
    const double tol = 1e-9 * p.scale;
    for (int k : p.cutouts) {
        const Rect& c = rect[k];
        const bool acrossX = std::min(r.x1, c.x1) - std::max(r.x0, c.x0) > tol;
        const bool acrossY = std::min(r.y1, c.y1) - std::max(r.y0, c.y0) > tol;
        switch (s) {
        case Side::N: if (acrossX && c.y0 >= r.y1 - tol) d = std::min(d, c.y0 - r.y1); break;
        case Side::S: if (acrossX && c.y1 <= r.y0 + tol) d = std::min(d, r.y0 - c.y1); break;
        case Side::E: if (acrossY && c.x0 >= r.x1 - tol) d = std::min(d, c.x0 - r.x1); break;
        case Side::W: if (acrossY && c.x1 <= r.x0 + tol) d = std::min(d, r.x0 - c.x1); break;
        }
    }
    return d;
}

void blockTerm(const Problem& p, int i, const std::vector<Rect>& rect, Evaluation& e, std::vector<Violation>* out) {
    const Problem::Block& b = p.blocks[i];
    const Rect& r = rect[i];
    const double L = p.scale;
    const double tol = 1e-9 * L;
    if (b.pin) {
        // Fixed in place: the search's layouts have exact areas, so the block
        // is pulled towards its place; the sizing then holds it exactly.
        const Rect& f = *b.pin;
        const double d = (std::abs(r.x0 - f.x0) + std::abs(r.x1 - f.x1) + std::abs(r.y0 - f.y0) +
                          std::abs(r.y1 - f.y1)) / L;
        e.cost += 6.0 * d + (d > 0.02 ? 0.5 : 0.0);
        if (d > 0.08) ++e.hard;
    }
    if (b.cutout) return;
    if (!p.pins.empty() && !b.spare) {
        // Layouts that hold blocks in place bend the areas: off the area the
        // search aims at costs, far off counts as a miss.
        const double off = std::abs(std::log(r.area() / p.area[i]));
        if (off > 0.5 * b.tolerance) e.cost += 3.0 * (off - 0.5 * b.tolerance);
        if (off > 2.0 * b.tolerance + 0.02) ++e.hard;
    }
    const double w = r.width(), h = r.depth();
    const double shortSide = std::min(w, h), longSide = std::max(w, h);
    const double aspect = longSide / std::max(shortSide, 1e-12);
    if (b.spare) {
        if (shortSide < b.minWidth) e.cost += 0.5 * (0.3 + (b.minWidth - shortSide) / b.minWidth);
        if (aspect > 4) e.cost += 0.05 * (aspect - 4) / 4;
        return;
    }
    if (b.minWidth > 0 && shortSide < b.minWidth * (1 - 1e-9)) {
        e.cost += 0.3 + 3.0 * (b.minWidth - shortSide) / b.minWidth;
        ++e.hard;
        if (out) out->push_back({Violation::Width, i, -1});
    }
    if (b.maxAspect > 0 && aspect > b.maxAspect * (1 + 1e-9)) {
        e.cost += 0.3 + 2.0 * (aspect - b.maxAspect) / b.maxAspect;
        ++e.hard;
        if (out) out->push_back({Violation::Aspect, i, -1});
    } else if (b.maxAspect <= 0 && !b.circulation && aspect > 3) {
        e.cost += 0.05 * (aspect - 3) / 3; // no limit given: still no slivers
    }
    if (!b.facade.empty()) {
        double nearest = 1e300;
        bool missed = false;
        for (Side s : allSides) {
            const double d = std::max(0.0, exteriorDistance(p, rect, r, s));
            nearest = std::min(nearest, d);
            if (b.facade.has(s) && d > tol) {
                e.cost += 1.0 + 2.0 * d / L;
                missed = true;
                if (out) out->push_back({Violation::Facade, i, static_cast<int>(s)});
            }
        }
        if (b.facade.anySide && nearest > tol) {
            e.cost += 1.0 + 2.0 * nearest / L;
            missed = true;
            if (out) out->push_back({Violation::Facade, i, -1});
        }
        if (missed) ++e.hard;
    }
}

void linkTerm(const Problem& p, const Problem::Link& l, const std::vector<Rect>& rect, Evaluation& e,
              std::vector<Violation>* out) {
    const double L = p.scale;
    const Rect& a = rect[l.a];
    const Rect& b = rect[l.b];
    const double len = sharedWallLength(a, b, 1e-9 * L);
    if (len >= l.need * (1 - 1e-9)) return;
    if (len > 0) {
        e.cost += l.weight * (0.3 + 0.7 * (l.need - len) / l.need);
    } else {
        const double gx = std::max(0.0, std::max(a.x0, b.x0) - std::min(a.x1, b.x1));
        const double gy = std::max(0.0, std::max(a.y0, b.y0) - std::min(a.y1, b.y1));
        e.cost += l.weight * (1.0 + 2.0 * (gx + gy) / L);
    }
    if (l.must) ++e.hard;
    if (out) out->push_back({Violation::Link, l.a, l.b});
}

Evaluation evaluate(const Problem& p, const std::vector<Rect>& rect, std::vector<Violation>* out) {
    Evaluation e;
    if (out) out->clear();
    for (int i = 0; i < static_cast<int>(p.blocks.size()); ++i) blockTerm(p, i, rect, e, out);
    for (const Problem::Link& l : p.links) linkTerm(p, l, rect, e, out);
    return e;
}

// ------------------------------------------------------------------ seeds

// Rough positions of the blocks in the footprint: the sketch's, scaled to
// the footprint (north up), when every room has one; else a spring layout:
// adjacencies pull rooms together, overlapping discs push apart, facade
// wishes pull towards their side. `jitter` (0..1) moves them at random.
std::vector<Point> roughPositions(const Problem& p, const Brief& brief, bool useSketch, double jitter,
                                  std::mt19937& rng) {
    const int B = static_cast<int>(p.blocks.size());
    const double W = p.fp.width, D = p.fp.depth;
    std::vector<Point> pos(B);
    std::uniform_real_distribution<double> unit(0.0, 1.0);
    std::normal_distribution<double> gauss(0.0, 1.0);
    bool sketched = useSketch && p.rooms > 0;
    for (int i = 0; i < p.rooms && sketched; ++i)
        sketched = brief.rooms[i].cutout || brief.sketchPosition(brief.rooms[i].id) != nullptr;
    // Blocks fixed in place sit at their centres throughout.
    auto holdPins = [&]() {
        for (int i : p.pinned) pos[i] = {0.5 * (p.blocks[i].pin->x0 + p.blocks[i].pin->x1),
                                         0.5 * (p.blocks[i].pin->y0 + p.blocks[i].pin->y1)};
    };
    if (sketched) {
        double x0 = 1e300, x1 = -1e300, y0 = 1e300, y1 = -1e300;
        for (int i = 0; i < p.rooms; ++i) {
            if (brief.rooms[i].cutout) continue;
            const SketchPoint* s = brief.sketchPosition(brief.rooms[i].id);
            x0 = std::min(x0, s->x), x1 = std::max(x1, s->x), y0 = std::min(y0, s->y), y1 = std::max(y1, s->y);
        }
        for (int i = 0; i < p.rooms; ++i) {
            if (brief.rooms[i].cutout) continue;
            const SketchPoint* s = brief.sketchPosition(brief.rooms[i].id);
            pos[i].x = x1 > x0 ? W * (0.1 + 0.8 * (s->x - x0) / (x1 - x0)) : 0.5 * W;
            pos[i].y = y1 > y0 ? D * (0.1 + 0.8 * (s->y - y0) / (y1 - y0)) : 0.5 * D;
        }
        for (int i = p.rooms; i < B; ++i) pos[i] = {unit(rng) * W, unit(rng) * D};
    } else {
        for (Point& q : pos) q = {unit(rng) * W, unit(rng) * D};
        holdPins();
        std::vector<double> radius(B);
        for (int i = 0; i < B; ++i) radius[i] = 0.5 * std::sqrt(p.blocks[i].area);
        const int steps = 250;
        for (int it = 0; it < steps; ++it) {
            const double cool = 1.0 - double(it) / steps;
            std::vector<Point> f(B);
            for (const Problem::Link& l : p.links) {
                const double dx = pos[l.b].x - pos[l.a].x, dy = pos[l.b].y - pos[l.a].y;
                const double dist = std::max(1e-9, std::hypot(dx, dy));
                const double k = l.weight * 0.25 * (dist - (radius[l.a] + radius[l.b])) / dist;
                f[l.a].x += k * dx, f[l.a].y += k * dy;
                f[l.b].x -= k * dx, f[l.b].y -= k * dy;
            }
            for (int i = 0; i < B; ++i)
                for (int j = i + 1; j < B; ++j) {
                    const double dx = pos[j].x - pos[i].x, dy = pos[j].y - pos[i].y;
                    const double reach = radius[i] + radius[j];
                    if (dx * dx + dy * dy >= reach * reach) continue; // apart: no push
                    const double dist = std::max(1e-9, std::sqrt(dx * dx + dy * dy));
                    const double overlap = reach - dist;
                    const double k = 0.25 * overlap / dist;
                    f[i].x -= k * dx, f[i].y -= k * dy;
                    f[j].x += k * dx, f[j].y += k * dy;
                }
            for (int i = 0; i < p.rooms; ++i) {
                const FacadeWish& wish = p.blocks[i].facade;
                if (wish.has(Side::N)) f[i].y += 0.5 * (D - radius[i] - pos[i].y);
                if (wish.has(Side::S)) f[i].y += 0.5 * (radius[i] - pos[i].y);
                if (wish.has(Side::E)) f[i].x += 0.5 * (W - radius[i] - pos[i].x);
                if (wish.has(Side::W)) f[i].x += 0.5 * (radius[i] - pos[i].x);
            }
            const double cap = (0.02 + 0.15 * cool) * p.scale;
            for (int i = 0; i < B; ++i) {
                const double len = std::hypot(f[i].x, f[i].y);
                const double k = len > cap ? cap / len : 1.0;
                pos[i].x = std::clamp(pos[i].x + k * f[i].x, 0.0, W);
                pos[i].y = std::clamp(pos[i].y + k * f[i].y, 0.0, D);
            }
            holdPins();
        }
    }
    if (jitter > 0)
        for (int i = 0; i < B; ++i) {
            const double r = jitter * std::sqrt(p.blocks[i].area);
            pos[i].x = std::clamp(pos[i].x + r * gauss(rng), 0.0, W);
            pos[i].y = std::clamp(pos[i].y + r * gauss(rng), 0.0, D);
        }
    holdPins();
    return pos;
}

// Recursive area-proportional cuts through the items' positions: each
// rectangle is cut across its longer side (mostly), between the items that
// lie on either side of the cut, as few on the wrong side as may be.
// `half` is how far each item reaches from its position (a corridor along
// its rooms). `make(item, rect)` gives the node of an item once its
// rectangle is known.
int cutOver(FloorTree& tree, const std::vector<double>& area, const std::vector<Point>& pos,
            const std::vector<Point>& half, const std::vector<std::optional<Rect>>& pin, const Rect& outer,
            double scale, std::mt19937& rng, double noise, const std::function<int(int, const Rect&)>& make) {
    struct Task {
        std::vector<int> items;
        Rect r;
        bool vertical = false;
        int first = -1, second = -1;
    };
    std::vector<Task> tasks;
    Task all;
    all.items.resize(area.size());
    std::iota(all.items.begin(), all.items.end(), 0);
    all.r = outer;
    tasks.push_back(std::move(all));
    std::uniform_real_distribution<double> unit(0.0, 1.0);
    for (std::size_t t = 0; t < tasks.size(); ++t) {
        if (tasks[t].items.size() < 2) continue;
        std::vector<int> items = tasks[t].items;
        const Rect r = tasks[t].r;
        double total = 0;
        for (int i : items) total += area[i];
        // Both directions, every split: blocks on the wrong side of the cut
        // and blocks the cut runs through (a corridor spans its rooms) count
        // against it; cuts across the longer side are preferred.
        double bestScore = 1e300;
        std::size_t bestK = 1;
        bool vertical = r.width() >= r.depth();
        std::vector<int> bestOrder;
        for (const bool dir : {true, false}) {
            std::sort(items.begin(), items.end(),
                      [&](int a, int b) { return dir ? pos[a].x < pos[b].x : pos[a].y < pos[b].y; });
            const double lo = dir ? r.x0 : r.y0, len = dir ? r.width() : r.depth();
            const double across = dir ? r.depth() : r.width();
            const double turn = (dir == (r.width() >= r.depth()) ? 0.0 : 0.15) + noise * 0.2 * unit(rng);
            double prefix = 0;
            for (std::size_t k = 1; k < items.size(); ++k) {
                prefix += area[items[k - 1]];
                const double c = lo + len * prefix / total;
                double wrong = 0, through = 0;
                for (std::size_t j = 0; j < items.size(); ++j) {
                    const double at = dir ? pos[items[j]].x : pos[items[j]].y;
                    const double reach = dir ? half[items[j]].x : half[items[j]].y;
                    wrong += j < k ? std::max(0.0, at - c) : std::max(0.0, c - at);
                    through += std::max(0.0, reach - std::abs(at - c));
                    if (const std::optional<Rect>& f = pin[items[j]]) // held in place: the cut keeps off it
                        wrong += 4.0 * (j < k ? std::max(0.0, (dir ? f->x1 : f->y1) - c)
                                              : std::max(0.0, c - (dir ? f->x0 : f->y0)));
                }
                double shape = 0;
                const double a = len * prefix / total, b = len - a;
                if (k == 1) shape += 0.2 * std::max(0.0, std::max(a / across, across / a) - 2.0);
                if (k + 1 == items.size()) shape += 0.2 * std::max(0.0, std::max(b / across, across / b) - 2.0);
                const double score = (wrong + through) / scale + shape + turn + noise * 0.3 * unit(rng);
                if (score < bestScore) {
                    bestScore = score;
                    bestK = k;
                    vertical = dir;
                    bestOrder = items;
                }
            }
        }
        items = bestOrder;
        const double lo = vertical ? r.x0 : r.y0, len = vertical ? r.width() : r.depth();
        Task first, second;
        first.items.assign(items.begin(), items.begin() + static_cast<long>(bestK));
        second.items.assign(items.begin() + static_cast<long>(bestK), items.end());
        double a = 0;
        for (int i : first.items) a += area[i];
        const double c = lo + len * a / total;
        first.r = vertical ? Rect{r.x0, r.y0, c, r.y1} : Rect{r.x0, r.y0, r.x1, c};
        second.r = vertical ? Rect{c, r.y0, r.x1, r.y1} : Rect{r.x0, c, r.x1, r.y1};
        tasks[t].vertical = vertical;
        tasks[t].first = static_cast<int>(tasks.size());
        tasks.push_back(std::move(first));
        tasks[t].second = static_cast<int>(tasks.size());
        tasks.push_back(std::move(second));
    }
    std::vector<int> nodeOf(tasks.size(), -1);
    for (std::size_t t = tasks.size(); t-- > 0;) {
        if (tasks[t].items.size() == 1) nodeOf[t] = make(tasks[t].items[0], tasks[t].r);
        else nodeOf[t] = tree.makeCut(tasks[t].vertical, nodeOf[tasks[t].first], nodeOf[tasks[t].second]);
    }
    return nodeOf[0];
}

bool isHub(const Problem& p, int i) {
    return i < p.rooms && (p.mustDegree[i] >= 3 || (p.blocks[i].circulation && p.mustDegree[i] >= 2));
}

// How far each block reaches from its position: a share of its square's
// side; a hub (a corridor) along the longer spread of the rooms linked to it.
std::vector<Point> reaches(const Problem& p, const std::vector<Point>& pos) {
    const int B = static_cast<int>(p.blocks.size());
    std::vector<Point> half(B);
    for (int i = 0; i < B; ++i) {
        const double base = 0.3 * std::sqrt(p.area[i]);
        half[i] = {base, base};
        if (!isHub(p, i)) continue;
        // Along the spread of the rooms that open on it (other hubs' positions
        // say little: they are the middles of other corridors); across, half
        // its width.
        double x0 = pos[i].x, x1 = pos[i].x, y0 = pos[i].y, y1 = pos[i].y;
        int rooms = 0;
        for (int li : p.linksOf[i]) {
            const Problem::Link& l = p.links[li];
            const int o = l.a == i ? l.b : l.a;
            if (!l.must || isHub(p, o)) continue;
            x0 = std::min(x0, pos[o].x), x1 = std::max(x1, pos[o].x);
            y0 = std::min(y0, pos[o].y), y1 = std::max(y1, pos[o].y);
            ++rooms;
        }
        if (rooms < 2) continue;
        const double narrow = 0.5 * std::max(p.blocks[i].minWidth, 1.0);
        if (x1 - x0 >= y1 - y0) half[i] = {std::max(base, 0.45 * (x1 - x0)), narrow};
        else half[i] = {narrow, std::max(base, 0.45 * (y1 - y0))};
    }
    return half;
}

FloorTree cutTree(const Problem& p, const std::vector<Point>& pos, std::mt19937& rng, double noise) {
    const int B = static_cast<int>(p.blocks.size());
    FloorTree tree(B);
    if (B == 1) return tree;
    std::vector<std::optional<Rect>> pin;
    for (const Problem::Block& b : p.blocks) pin.push_back(b.pin);
    const int root = cutOver(tree, p.area, pos, reaches(p, pos), pin, {0, 0, p.fp.width, p.fp.depth}, p.scale, rng, noise,
                             [&](int block, const Rect&) { return tree.leafOf(block); });
    tree.setRoot(root);
    return tree;
}

// Circulation zones: a hub — a room with three or more 'must' links, or a
// circulation room with two — and the rooms that open on it (a room linked
// to several hubs goes to one at random; a room linked to no hub joins the
// zone of a linked room).
struct Zone {
    int hub = -1;
    std::vector<int> clients;                 // rooms that open on the hub
    std::vector<std::pair<int, int>> behind;  // (room, the zone room it is reached through)
};

std::vector<Zone> circulationZones(const Problem& p, std::mt19937& rng) {
    std::vector<int> zoneOf(p.blocks.size(), -1);
    std::vector<Zone> zones;
    for (int i = 0; i < p.rooms; ++i)
        if (isHub(p, i)) {
            zoneOf[i] = static_cast<int>(zones.size());
            zones.push_back({i, {}, {}});
        }
    if (zones.empty()) return zones;
    auto isHub = [&](int i) { return zoneOf[i] >= 0 && zones[zoneOf[i]].hub == i; };
    for (int pass = 0; pass < 3; ++pass)
        for (int i = 0; i < p.rooms; ++i) {
            if (zoneOf[i] >= 0) continue;
            std::vector<int> options, via;
            for (int li : p.linksOf[i]) {
                const Problem::Link& l = p.links[li];
                if (!l.must) continue;
                const int other = l.a == i ? l.b : l.a;
                if (pass == 0 ? isHub(other) : zoneOf[other] >= 0 && !isHub(other)) {
                    options.push_back(zoneOf[other]);
                    via.push_back(other);
                }
            }
            if (options.empty()) continue;
            const std::size_t pick = std::uniform_int_distribution<std::size_t>(0, options.size() - 1)(rng);
            zoneOf[i] = options[pick];
            if (pass == 0) zones[zoneOf[i]].clients.push_back(i);
            else zones[zoneOf[i]].behind.emplace_back(i, via[pick]);
        }
    return zones;
}

// A zone laid out as a strip: the hub along the rectangle's longer side, its
// rooms in a row on either side (or one side), ordered by position.
int zoneStrip(FloorTree& tree, const Zone& z, const std::vector<Point>& pos, const std::vector<double>& area,
              const Rect& r, std::mt19937& rng) {
    const int hub = tree.leafOf(z.hub);
    if (z.clients.empty() && z.behind.empty()) return hub;
    const bool alongX = r.width() >= r.depth(); // the hub runs west–east
    std::vector<int> c = z.clients;
    // The upper half (by area) of the rooms across the strip go on one side.
    std::sort(c.begin(), c.end(), [&](int a, int b) { return alongX ? pos[a].y > pos[b].y : pos[a].x > pos[b].x; });
    double total = 0;
    for (int i : c) total += area[i];
    const bool oneSided = std::uniform_real_distribution<double>(0.0, 1.0)(rng) < 0.2 || c.size() < 2;
    std::vector<int> upper, lower;
    double acc = 0;
    for (int i : c) {
        (oneSided || acc < 0.5 * total ? upper : lower).push_back(i);
        acc += area[i];
    }
    // A room with the rooms reached through it stacked behind it, away
    // from the hub (`towardHubFirst`: the hub lies before it across the strip).
    auto stack = [&](int room, bool towardHubFirst) {
        std::vector<int> nodes{tree.leafOf(room)};
        for (std::size_t k = 0; k < z.behind.size(); ++k)
            if (z.behind[k].second == room) nodes.push_back(tree.leafOf(z.behind[k].first));
        if (!towardHubFirst) std::reverse(nodes.begin(), nodes.end());
        return tree.chainNodes(nodes, !alongX);
    };
    auto row = [&](std::vector<int> items, bool upperRow) {
        std::sort(items.begin(), items.end(),
                  [&](int a, int b) { return alongX ? pos[a].x < pos[b].x : pos[a].y < pos[b].y; });
        std::vector<int> nodes;
        for (int i : items) nodes.push_back(stack(i, upperRow));
        return tree.chainNodes(nodes, alongX);
    };
    // Cuts along the strip: lower row, hub, upper row (south to north, or west to east).
    int node = hub;
    if (!lower.empty()) node = tree.makeCut(!alongX, row(lower, false), node);
    if (!upper.empty()) node = tree.makeCut(!alongX, node, row(upper, true));
    // Rooms reached through rooms that are themselves behind others: beside them.
    for (const auto& [room, through] : z.behind) {
        const int leaf = tree.leafOf(room);
        if (tree.node(leaf).parent >= 0 || leaf == node) continue;
        node = tree.makeCut(alongX, node, leaf);
    }
    return node;
}

// A seed made of circulation zones: each zone a strip, the zones and the
// other rooms placed by cuts through their positions.
FloorTree zoneTree(const Problem& p, const std::vector<Zone>& zones, const std::vector<Point>& pos,
                   std::mt19937& rng, double noise) {
    const int B = static_cast<int>(p.blocks.size());
    FloorTree tree(B);
    if (B == 1) return tree;
    std::vector<int> itemOf(B, -1);
    std::vector<double> area;
    std::vector<Point> at;
    std::vector<int> zoneOfItem, blockOfItem;
    std::vector<Point> half;
    const std::vector<Point> blockHalf = reaches(p, pos);
    for (std::size_t z = 0; z < zones.size(); ++z) {
        double a = 0, x = 0, y = 0;
        const int h = zones[z].hub;
        double x0 = pos[h].x, x1 = x0, y0 = pos[h].y, y1 = y0;
        std::vector<int> members = zones[z].clients;
        for (const auto& [room, through] : zones[z].behind) members.push_back(room);
        for (int i : members) {
            a += p.area[i], x += p.area[i] * pos[i].x, y += p.area[i] * pos[i].y;
            itemOf[i] = static_cast<int>(area.size());
            x0 = std::min(x0, pos[i].x), x1 = std::max(x1, pos[i].x);
            y0 = std::min(y0, pos[i].y), y1 = std::max(y1, pos[i].y);
        }
        a += p.area[h], x += p.area[h] * pos[h].x, y += p.area[h] * pos[h].y;
        itemOf[h] = static_cast<int>(area.size());
        area.push_back(a);
        at.push_back({x / a, y / a});
        const double base = 0.3 * std::sqrt(a);
        half.push_back({std::max(0.4 * (x1 - x0), 0.5 * base), std::max(0.4 * (y1 - y0), 0.5 * base)});
        zoneOfItem.push_back(static_cast<int>(z));
        blockOfItem.push_back(-1);
    }
    for (int i = 0; i < B; ++i)
        if (itemOf[i] < 0) {
            itemOf[i] = static_cast<int>(area.size());
            area.push_back(p.area[i]);
            at.push_back(pos[i]);
            half.push_back(blockHalf[i]);
            zoneOfItem.push_back(-1);
            blockOfItem.push_back(i);
        }
    std::vector<std::optional<Rect>> pin;
    for (int b : blockOfItem) pin.push_back(b >= 0 ? p.blocks[b].pin : std::nullopt);
    const int root = cutOver(tree, area, at, half, pin, {0, 0, p.fp.width, p.fp.depth}, p.scale, rng, noise,
                             [&](int item, const Rect& r) {
                                 return zoneOfItem[item] >= 0 ? zoneStrip(tree, zones[zoneOfItem[item]], pos, p.area, r, rng)
                                                              : tree.leafOf(blockOfItem[item]);
                             });
    tree.setRoot(root);
    return tree;
}

// ------------------------------------------------------------------ chains

class Chain {
public:
    Chain(const Problem& p, const Brief& brief, unsigned seed, int index, long long epochMoves)
        : p_(p), brief_(brief), rng_(seed), index_(index), epochMoves_(epochMoves) {
        restart(true);
    }

    // `count` annealing moves. Deterministic for the chain's seed.
    void run(long long count) {
        for (long long i = 0; i < count; ++i) {
            if (epochDone_ >= epochLength_) restart(false);
            const double t = double(epochDone_) / double(epochLength_);
            const double temperature = t0_ * std::pow(t1_ / t0_, t);
            ++epochDone_;
            ++moves_;
            trial_ = cur_;
            if (!propose(trial_)) continue;
            trial_.layout(p_.area, outer(), trialRects_, scratch_, &p_.pins);
            const Evaluation e = evaluate(p_, trialRects_, &trialViolations_);
            const double delta = e.cost - curEval_.cost;
            if (delta <= 0 || unit_(rng_) < std::exp(-delta / temperature)) {
                std::swap(cur_, trial_);
                std::swap(curRects_, trialRects_);
                std::swap(curViolations_, trialViolations_);
                curEval_ = e;
                if (better(e, bestEval_)) {
                    best_ = cur_;
                    bestEval_ = e;
                    bestRects_ = curRects_;
                    bestChanged_ = true;
                }
            }
        }
    }

    long long moves() const { return moves_; }
    const Evaluation& bestEvaluation() const { return bestEval_; }
    const std::vector<Rect>& bestRects() const { return bestRects_; }
    const std::vector<Rect>& currentRects() const { return curRects_; }
    const Evaluation& currentEvaluation() const { return curEval_; }
    bool takeBestChanged() {
        const bool c = bestChanged_;
        bestChanged_ = false;
        return c;
    }
    // From now on, epochs restart from the best plan at a low temperature:
    // neighbours of a good plan, for variants.
    void settle() {
        settled_ = true;
        epochDone_ = epochLength_;
    }

private:
    static bool better(const Evaluation& a, const Evaluation& b) {
        return a.hard != b.hard ? a.hard < b.hard : a.cost < b.cost - 1e-12;
    }
    Rect outer() const { return {0, 0, p_.fp.width, p_.fp.depth}; }

    // A new epoch: a fresh seed, or the chain's best shaken a little.
    void restart(bool first) {
        // Fresh seeds beat shaking the best plan: each sweep starts from the
        // best of a new batch (measured on generated briefs), except once
        // settled, when neighbours of the best plan are wanted.
        const bool fromBest = !first && settled_;
        ++epoch_;
        epochDone_ = 0;
        epochLength_ = epochMoves_;
        if (fromBest) {
            cur_ = best_;
            const int shakes = settled_ ? 1 : 2 + static_cast<int>(p_.blocks.size()) / 10;
            for (int k = 0; k < shakes; ++k) propose(cur_);
            t0_ = 0.03;
        } else {
            // Chain 0 starts from the sketch as drawn. Later seeds are the
            // best of a batch: positions from the sketch with noise or from
            // spring layouts, cut through plainly or in circulation zones.
            if (first && index_ == 0) {
                const std::vector<Point> pos = roughPositions(p_, brief_, true, 0.0, rng_);
                cur_ = cutTree(p_, pos, rng_, 0.0);
            } else {
                const int batch = 32;
                double bestCost = 1e300;
                int bestHard = 1 << 30;
                std::vector<Point> pos;
                for (int k = 0; k < batch; ++k) {
                    if (k % 8 == 0) pos = roughPositions(p_, brief_, (k / 8) % 2 == 0, 0.3 * unit_(rng_), rng_);
                    const std::vector<Zone> zones = circulationZones(p_, rng_);
                    const bool zoned = !zones.empty() && k % 2 == 1;
                    FloorTree seed = zoned ? zoneTree(p_, zones, pos, rng_, 1.0) : cutTree(p_, pos, rng_, 1.0);
                    seed.layout(p_.area, outer(), trialRects_, scratch_, &p_.pins);
                    const Evaluation e = evaluate(p_, trialRects_, nullptr);
                    if (e.hard < bestHard || (e.hard == bestHard && e.cost < bestCost)) {
                        bestHard = e.hard;
                        bestCost = e.cost;
                        cur_ = std::move(seed);
                    }
                }
            }
            t0_ = 0.6;
        }
        t1_ = 0.01;
        cur_.layout(p_.area, outer(), curRects_, scratch_, &p_.pins);
        curEval_ = evaluate(p_, curRects_, &curViolations_);
        if (first || better(curEval_, bestEval_)) {
            best_ = cur_;
            bestEval_ = curEval_;
            bestRects_ = curRects_;
            bestChanged_ = true;
        }
    }

    int randomInt(int n) { return std::uniform_int_distribution<int>(0, n - 1)(rng_); }
    bool coin() { return randomInt(2) == 1; }

    // A node on the path from block b's leaf to the root, at most `up` steps up.
    int ancestorOf(const FloorTree& t, int block, int up) {
        int v = t.leafOf(block);
        for (int k = 0; k < up && t.node(v).parent >= 0; ++k) v = t.node(v).parent;
        return v;
    }

    // One move on `t` (from the current plan's misses or at random).
    bool propose(FloorTree& t) {
        const int B = static_cast<int>(p_.blocks.size());
        if (B < 2) return false;
        if (!curViolations_.empty() && unit_(rng_) < 0.4) {
            const Violation& v = curViolations_[randomInt(static_cast<int>(curViolations_.size()))];
            switch (v.kind) {
            case Violation::Link: {
                int a = v.block, b = v.other;
                const int hub = p_.mustDegree[a] >= 3 && p_.mustDegree[a] >= p_.mustDegree[b] ? a
                                : p_.mustDegree[b] >= 3                                ? b
                                                                                       : -1;
                if (hub >= 0 && unit_(rng_) < 0.08) return gather(t, hub);
                if (coin()) std::swap(a, b);
                const double u = unit_(rng_);
                if (u < 0.5) { // beside a block c that touches b, both against b's wall
                    const int c = touching(b);
                    if (c >= 0 && c != a) {
                        if (u < 0.2) {
                            t.swapBlocks(a, c);
                            return true;
                        }
                        const Rect& rc = curRects_[c];
                        const Rect& rb = curRects_[b];
                        const double tol = 1e-9 * p_.scale;
                        const bool wallVertical = std::abs(rc.x1 - rb.x0) <= tol || std::abs(rb.x1 - rc.x0) <= tol;
                        return t.moveSubtree(t.leafOf(a), t.leafOf(c), !wallVertical, coin());
                    }
                }
                const int target = ancestorOf(t, b, randomInt(3));
                const int moving = ancestorOf(t, a, randomInt(4) == 0 ? 1 : 0);
                return t.moveSubtree(moving, target, coin(), coin());
            }
            case Violation::Facade: {
                const int a = v.block;
                const Side s = v.other >= 0 ? static_cast<Side>(v.other) : allSides[randomInt(4)];
                if (unit_(rng_) < 0.5) { // swap with a block on that side
                    std::vector<int> onSide;
                    for (int i = 0; i < B; ++i)
                        if (i != a && sideDistance(curRects_[i], s, p_.fp) <= 1e-9 * p_.scale) onSide.push_back(i);
                    if (!onSide.empty()) {
                        t.swapBlocks(a, onSide[randomInt(static_cast<int>(onSide.size()))]);
                        return true;
                    }
                }
                // Beside a block on that side, both against the facade; or as
                // a strip along the whole facade.
                if (unit_(rng_) < 0.6) {
                    std::vector<int> onSide;
                    for (int i = 0; i < B; ++i)
                        if (i != a && sideDistance(curRects_[i], s, p_.fp) <= 1e-9 * p_.scale) onSide.push_back(i);
                    if (!onSide.empty()) {
                        const int c = onSide[randomInt(static_cast<int>(onSide.size()))];
                        return t.moveSubtree(t.leafOf(a), t.leafOf(c), s == Side::N || s == Side::S, coin());
                    }
                }
                return t.moveSubtree(t.leafOf(a), t.root(), s == Side::E || s == Side::W, s == Side::W || s == Side::S);
            }
            case Violation::Width:
            case Violation::Aspect: {
                const int leaf = t.leafOf(v.block);
                const int parent = t.node(leaf).parent;
                if (parent < 0) return false;
                const double u = unit_(rng_);
                if (u < 0.3) return t.flipCut(parent);
                if (u < 0.5) return t.flipCut(ancestorOf(t, v.block, 1 + randomInt(3)));
                if (u < 0.75) {
                    t.swapBlocks(v.block, randomInt(B));
                    return true;
                }
                const int target = ancestorOf(t, randomInt(B), randomInt(3));
                return t.moveSubtree(leaf, target, coin(), coin());
            }
            }
        }
        const double u = unit_(rng_);
        if (u < 0.28) {
            t.swapBlocks(randomInt(B), randomInt(B));
            return true;
        }
        if (u < 0.58) {
            const int a = randomInt(B);
            int moving = ancestorOf(t, a, randomInt(5) == 0 ? 1 + randomInt(2) : 0);
            if (randomInt(8) == 0) { // a whole group, at any depth
                t.innerNodes(inner_);
                if (!inner_.empty()) moving = inner_[randomInt(static_cast<int>(inner_.size()))];
            }
            const int target = ancestorOf(t, randomInt(B), randomInt(3));
            return t.moveSubtree(moving, target, coin(), coin());
        }
        t.innerNodes(inner_);
        if (inner_.empty()) return false;
        const int v = inner_[randomInt(static_cast<int>(inner_.size()))];
        if (u < 0.72) return t.flipCut(v);
        if (u < 0.82) return t.mirrorCut(v);
        if (u < 0.9) return t.swapSubtrees(ancestorOf(t, randomInt(B), randomInt(3)),
                                           ancestorOf(t, randomInt(B), randomInt(3)));
        if (t.node(v).kind == FloorTree::Kind::Wheel) {
            if (u < 0.95) return t.turnWheel(v, randomInt(4), coin(), randomInt(5) - 1);
            return t.dissolveWheel(v, rng_);
        }
        return t.makeWheel(v, rng_);
    }

    // The rooms linked to `hub` (all of them, or those without their wall)
    // in rows either side of it, along its longer side, in their order.
    bool gather(FloorTree& t, int hub) {
        const Rect& h = curRects_[hub];
        const bool alongX = h.width() >= h.depth();
        const bool all = coin();
        std::vector<std::pair<double, int>> lower, upper;
        for (int li : p_.linksOf[hub]) {
            const Problem::Link& l = p_.links[li];
            const int c = l.a == hub ? l.b : l.a;
            if (!l.must || p_.mustDegree[c] >= 3) continue;
            if (!all && sharedWallLength(curRects_[c], h, 1e-9 * p_.scale) >= l.need) continue;
            const Rect& r = curRects_[c];
            const double along = alongX ? r.x0 + r.x1 : r.y0 + r.y1;
            const double across = alongX ? (r.y0 + r.y1) - (h.y0 + h.y1) : (r.x0 + r.x1) - (h.x0 + h.x1);
            (across < 0 ? lower : upper).emplace_back(along, c);
        }
        std::sort(lower.begin(), lower.end());
        std::sort(upper.begin(), upper.end());
        std::vector<int> lo, up;
        for (const auto& [k, c] : lower) lo.push_back(c);
        for (const auto& [k, c] : upper) up.push_back(c);
        return t.gatherAround(hub, lo, up, alongX);
    }

    // A block whose rectangle shares a wall with block b's (−1: none found).
    int touching(int b) {
        const int B = static_cast<int>(p_.blocks.size());
        std::vector<int> near;
        for (int i = 0; i < B; ++i)
            if (i != b && sharedWallLength(curRects_[i], curRects_[b], 1e-9 * p_.scale) > 0) near.push_back(i);
        return near.empty() ? -1 : near[randomInt(static_cast<int>(near.size()))];
    }

    const Problem& p_;
    const Brief& brief_;
    std::mt19937 rng_;
    std::uniform_real_distribution<double> unit_{0.0, 1.0};
    int index_ = 0;
    long long epochMoves_ = 1, epochLength_ = 1, epochDone_ = 0, moves_ = 0;
    int epoch_ = 0;
    bool settled_ = false, bestChanged_ = false;
    double t0_ = 0.4, t1_ = 0.002;
    FloorTree cur_, trial_, best_;
    std::vector<Rect> curRects_, trialRects_, bestRects_;
    std::vector<Violation> curViolations_, trialViolations_;
    Evaluation curEval_, bestEval_;
    FloorTree::Scratch scratch_;
    std::vector<int> inner_;
};

// FNV-1a over the contacts of rooms (and with the outline) and how they
// meet: the arrangement, whatever the sizes.
std::string arrangementKey(const ExtendedGraph& x, const RegularEdgeLabeling& rel) {
    std::uint64_t h = 1469598103934665603ULL;
    auto mix = [&](std::uint64_t v) {
        for (int k = 0; k < 8; ++k) {
            h ^= (v >> (8 * k)) & 0xFF;
            h *= 1099511628211ULL;
        }
    };
    std::vector<std::array<int, 3>> edges;
    for (int v = 0; v < x.graph.vertexCount(); ++v) {
        if (!x.isRoom(v)) continue;
        const auto& nb = x.graph.neighbours(v);
        for (std::size_t i = 0; i < nb.size(); ++i)
            if (!x.isSpare(nb[i]) && (x.isPole(nb[i]) || nb[i] > v))
                edges.push_back({v, nb[i], static_cast<int>(rel.at[v][i])});
    }
    std::sort(edges.begin(), edges.end());
    for (const auto& e : edges) mix((std::uint64_t(e[0]) << 40) ^ (std::uint64_t(e[1]) << 8) ^ std::uint64_t(e[2]));
    static const char* hex = "0123456789abcdef";
    std::string out(16, '0');
    for (int k = 0; k < 16; ++k) out[k] = hex[(h >> (60 - 4 * k)) & 0xF];
    return out;
}

bool ranksBefore(const SearchPlan& a, const SearchPlan& b) {
    if (a.misses.must != b.misses.must) return a.misses.must < b.misses.must;
    if (a.misses.count() != b.misses.count()) return a.misses.count() < b.misses.count();
    return a.cost < b.cost;
}

// The ways a plan's arrangement (extended graph and labeling set) is sized,
// warm from `rects` (per vertex): towards the areas the search lays out (the
// targets; within their bands when the footprint has room to spare); when
// that leaves a room off its band, with the bands free; when `rects` falls
// short of a hard minimum, also with its shortfalls held
// (SizingProblem::holdMinimumsAt). The caller judges which is best.
std::vector<SearchPlan> sizeArrangement(const Brief& brief, const Footprint& fp, const SearchOptions& o,
                                        const std::vector<Rect>& rects, const SearchPlan& arrangement) {
    std::vector<SearchPlan> out;
    const SizingOptions so = sizingOptionsFor(brief, o.anyWall, o.spareMinimum, o.grid);
    SizingProblem problem(brief, arrangement.extended, arrangement.labeling, fp, so);
    problem.setPreferredAreas(preferredAreas(brief, fp, arrangement.extended));
    const SizingResult start = problem.stateOf(rects);
    auto add = [&](SizingResult sized) {
        out.push_back(arrangement);
        out.back().sized = std::move(sized);
    };
    const bool anyFixed = std::any_of(brief.rooms.begin(), brief.rooms.end(), [](const Room& r) { return r.fixed.has_value(); });
    if (problem.meetsMinimums(start) && !anyFixed) { // nothing has to move
        add(start);
        return out;
    }
    add(problem.solve(&start));
    bool offBand = false;
    for (std::size_t i = 0; i < brief.rooms.size(); ++i)
        offBand = offBand || std::abs(out.back().sized.rooms[i].deviation) > brief.rooms[i].tolerance();
    if (offBand) {
        SizingOptions banded = so;
        banded.areaBands = true;
        problem.setOptions(banded);
        add(problem.solve(&start));
        problem.setOptions(so);
    }
    bool shortfall = false;
    for (const UnmetRequirement& u : start.unmet) shortfall = shortfall || u.kind == RequirementKind::MinWidth || u.kind == RequirementKind::Door;
    if (shortfall) {
        problem.holdMinimumsAt(start);
        add(problem.solve(&start));
    }
    return out;
}

// Misses and cost of a sized plan.
void judge(const Brief& brief, const Problem& p, const SearchOptions& o, SearchPlan& plan) {
    std::vector<Rect> blocks;
    for (int v = 0; v < plan.extended.graph.vertexCount(); ++v)
        if (!plan.extended.isPole(v)) blocks.push_back(plan.sized.rects[v]);
    std::vector<Rect> rooms(blocks.begin(), blocks.begin() + p.rooms);
    plan.misses = requirementMisses(brief, p.fp, rooms, Thresholds{o.anyWall});
    if (static_cast<int>(blocks.size()) == static_cast<int>(p.blocks.size())) {
        plan.cost = evaluate(p, blocks, nullptr).cost;
    } else { // more spare spaces than the search made (a plan from elsewhere): rooms only
        Problem roomsOnly = p;
        roomsOnly.blocks.resize(p.rooms);
        plan.cost = evaluate(roomsOnly, blocks, nullptr).cost;
    }
    double err = 0;
    for (int i = 0; i < p.rooms; ++i)
        err += std::abs(rooms[i].area() - brief.rooms[i].area) / brief.rooms[i].area;
    plan.cost += 0.1 * plan.misses.worstAreaError + 0.02 * err / std::max(1, p.rooms);
}

// The best of several sizings of one arrangement, judged.
SearchPlan pickSizing(const Brief& brief, const Problem& p, const SearchOptions& o, std::vector<SearchPlan> sizings) {
    std::size_t best = 0;
    for (std::size_t k = 0; k < sizings.size(); ++k) {
        judge(brief, p, o, sizings[k]);
        if (ranksBefore(sizings[k], sizings[best])) best = k;
    }
    return std::move(sizings[best]);
}

class Pool {
public:
    explicit Pool(std::size_t capacity) : capacity_(capacity) {}
    // Returns true if `plan` is new and kept.
    bool offer(SearchPlan plan) {
        for (SearchPlan& q : plans_)
            if (q.key == plan.key) {
                if (ranksBefore(plan, q)) {
                    q = std::move(plan);
                    sort();
                    return true;
                }
                return false;
            }
        if (plans_.size() >= capacity_ && !ranksBefore(plan, plans_.back())) return false;
        plans_.push_back(std::move(plan));
        sort();
        if (plans_.size() > capacity_) plans_.pop_back();
        return true;
    }
    const std::vector<SearchPlan>& plans() const { return plans_; }
    std::vector<SearchPlan> take() { return std::move(plans_); }
    bool usable() const { return !plans_.empty() && plans_.front().misses.usable(); }

private:
    void sort() { std::stable_sort(plans_.begin(), plans_.end(), ranksBefore); }
    std::size_t capacity_;
    std::vector<SearchPlan> plans_;
};

} // namespace

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
                       const SearchOptions& options) {
    SizedTiling out;
    const int n = static_cast<int>(brief.rooms.size());
    std::vector<std::string> ids;
    for (const Room& r : brief.rooms) ids.push_back(r.id);
    std::set<std::pair<int, int>> wanted;
    for (const Adjacency& a : brief.adjacencies)
        wanted.insert(std::minmax(brief.roomIndex(a.a), brief.roomIndex(a.b)));
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
    arrangement.key = arrangementKey(arrangement.extended, arrangement.labeling);
    out.sizings = sizeArrangement(brief, fp, options, dual.rects, arrangement);
    out.ok = true;
    return out;
}

SearchResult searchPlans(const Brief& brief, const SearchOptions& options, SearchVisitor* visitor) {
    SearchResult result;
    const auto started = Clock::now();
    auto elapsed = [&] { return std::chrono::duration<double>(Clock::now() - started).count(); };
    if (brief.rooms.empty()) return result;
    const Footprint fp = brief.effectiveFootprint();
    const Problem p = makeProblem(brief, fp, options);
    const int B = static_cast<int>(p.blocks.size());

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
    std::vector<std::unique_ptr<Chain>> chains;
    for (int c = 0; c < threads; ++c)
        chains.push_back(std::make_unique<Chain>(p, brief, options.seed * 1000003u + 7919u * static_cast<unsigned>(c),
                                                 c, epoch));
    detail::ThreadPool pool(threads);
    Pool found(static_cast<std::size_t>(std::max(1, options.keep)) * 2);

    auto consider = [&](const std::vector<Rect>& rects) {
        SizedTiling s = sizeTiling(brief, fp, rects, options);
        if (!s.ok) return;
        SearchPlan best = pickSizing(brief, p, options, std::move(s.sizings));
        const bool wasUsable = found.usable();
        const std::string key = best.key;
        if (found.offer(std::move(best))) {
            // On top: a better plan than any before.
            if (visitor && found.plans().front().key == key) visitor->onImproved(found.plans().front());
            if (!wasUsable && found.usable()) result.firstUsableSeconds = elapsed();
        }
    };

    bool stopped = visitor && !visitor->onRound(SearchProgress{}); // asked before any work
    bool settled = false;
    long long roundsAfterUsable = 0;
    for (long long spent = 0; spent < budget && !stopped;) {
        const long long step = std::min(round, budget - spent);
        pool.run(threads, [&](int c) { chains[c]->run(step); });
        spent += step;
        for (auto& c : chains) {
            if (c->takeBestChanged()) consider(c->bestRects());
            // Once settled, good neighbours of the best plan become variants.
            if (settled && c->currentEvaluation().hard == 0) consider(c->currentRects());
        }
        result.moves = spent * threads;
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

    // Variants: labelings one flip away from the best plan's (the same rooms
    // meet, walls slide past each other differently).
    if (!stopped && !found.plans().empty()) {
        const SearchPlan best = found.plans().front();
        const std::vector<FourCycle> cycles = fourCycles(best.extended);
        const double flipDeadline = options.timeLimit > 0 ? std::max(elapsed(), options.timeLimit) : 1e300;
        const int flips = options.variantFlips >= 0 ? options.variantFlips : 3 * options.keep;
        int tried = 0;
        for (const FourCycle& c : cycles) {
            if (tried >= flips || elapsed() > flipDeadline) break;
            const std::optional<Turn> sense = flipSense(best.extended, best.labeling, c);
            if (!sense) continue;
            ++tried;
            SearchPlan q;
            q.extended = best.extended;
            q.labeling = best.labeling;
            flip(q.extended, q.labeling, c, *sense);
            q.key = arrangementKey(q.extended, q.labeling);
            // Warm from the best plan's rectangles: their proportions are kept.
            found.offer(pickSizing(brief, p, options, sizeArrangement(brief, fp, options, best.sized.rects, q)));
        }
    }

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
