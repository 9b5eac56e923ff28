// SPDX-License-Identifier: MIT
#include "search/detail/seeds.h"

#include <algorithm>
#include <cmath>
#include <numeric>

namespace abut::detail {

namespace {

// The pairs (i, j), i < j, of discs that may overlap, visited in the order
// of the double loop over every pair (i ascending, then j ascending), so the
// forces add up exactly as they would over all pairs. Discs are binned in a
// grid of cells twice the largest radius wide, so only neighbouring cells
// can hold an overlapping pair: O(B + pairs near) per visit instead of
// O(B²) (a spring layout of 3,000 rooms took 15 s, four per seed batch).
class NearPairs {
public:
    NearPairs(const std::vector<double>& radius, double W, double D) : n_(static_cast<int>(radius.size())) {
        const double largest = radius.empty() ? 0.0 : *std::max_element(radius.begin(), radius.end());
        cell_ = 2.0 * largest;
        if (n_ < 64 || !(cell_ > 0)) return; // few blocks: every pair
        cols_ = std::max(1, std::min(4096, static_cast<int>(std::ceil(W / cell_)) + 1));
        rows_ = std::max(1, std::min(4096, static_cast<int>(std::ceil(D / cell_)) + 1));
    }

    template <typename F>
    void pairs(const std::vector<Point>& pos, F&& visit) const {
        if (cols_ == 0) {
            for (int i = 0; i < n_; ++i)
                for (int j = i + 1; j < n_; ++j) visit(i, j);
            return;
        }
        // Blocks per cell, in ascending order (filled in index order).
        std::vector<int> start(static_cast<std::size_t>(cols_) * rows_ + 1, 0), cellOf(n_), members(n_);
        for (int i = 0; i < n_; ++i) {
            cellOf[i] = cellAt(pos[i]);
            ++start[cellOf[i] + 1];
        }
        for (std::size_t c = 1; c < start.size(); ++c) start[c] += start[c - 1];
        std::vector<int> fill(start.begin(), start.end() - 1);
        for (int i = 0; i < n_; ++i) members[fill[cellOf[i]]++] = i;
        std::vector<int> near;
        for (int i = 0; i < n_; ++i) {
            near.clear();
            const int cx = cellOf[i] % cols_, cy = cellOf[i] / cols_;
            for (int y = std::max(0, cy - 1); y <= std::min(rows_ - 1, cy + 1); ++y)
                for (int x = std::max(0, cx - 1); x <= std::min(cols_ - 1, cx + 1); ++x) {
                    const int c = y * cols_ + x;
                    for (int k = start[c]; k < start[c + 1]; ++k)
                        if (members[k] > i) near.push_back(members[k]);
                }
            std::sort(near.begin(), near.end());
            for (int j : near) visit(i, j);
        }
    }

private:
    int cellAt(const Point& q) const {
        const int x = std::clamp(static_cast<int>(q.x / cell_), 0, cols_ - 1);
        const int y = std::clamp(static_cast<int>(q.y / cell_), 0, rows_ - 1);
        return y * cols_ + x;
    }

    int n_ = 0, cols_ = 0, rows_ = 0;
    double cell_ = 0;
};

} // namespace

std::vector<Point> roughPositions(const SearchProblem& p, bool useSketch, double jitter,
                                  std::mt19937& rng) {
    const int B = static_cast<int>(p.blocks.size());
    // Worked out in the outer rectangle's own frame, shifted into place at the end.
    const double W = p.outer.width(), D = p.outer.depth(), X = p.outer.x0, Y = p.outer.y0;
    std::vector<Point> pos(B);
    std::uniform_real_distribution<double> unit(0.0, 1.0);
    std::normal_distribution<double> gauss(0.0, 1.0);
    // Sketched when every block that is not held in place has a position.
    bool sketched = useSketch && p.rooms > 0 && p.sketch.size() == p.blocks.size();
    for (int i = 0; i < p.rooms && sketched; ++i) sketched = p.blocks[i].pin || p.sketch[i].has_value();
    // Blocks fixed in place sit at their centres throughout.
    auto holdPins = [&]() {
        for (int i : p.pinned) pos[i] = {0.5 * (p.blocks[i].pin->x0 + p.blocks[i].pin->x1) - X,
                                         0.5 * (p.blocks[i].pin->y0 + p.blocks[i].pin->y1) - Y};
    };
    if (sketched) {
        double x0 = 1e300, x1 = -1e300, y0 = 1e300, y1 = -1e300;
        for (int i = 0; i < p.rooms; ++i) {
            if (!p.sketch[i]) continue;
            const Point& s = *p.sketch[i];
            x0 = std::min(x0, s.x), x1 = std::max(x1, s.x), y0 = std::min(y0, s.y), y1 = std::max(y1, s.y);
        }
        for (int i = 0; i < p.rooms; ++i) {
            if (!p.sketch[i]) continue;
            const Point& s = *p.sketch[i];
            pos[i].x = x1 > x0 ? W * (0.1 + 0.8 * (s.x - x0) / (x1 - x0)) : 0.5 * W;
            pos[i].y = y1 > y0 ? D * (0.1 + 0.8 * (s.y - y0) / (y1 - y0)) : 0.5 * D;
        }
        for (int i = p.rooms; i < B; ++i) pos[i] = {unit(rng) * W, unit(rng) * D};
    } else {
        for (Point& q : pos) q = {unit(rng) * W, unit(rng) * D};
        holdPins();
        std::vector<double> radius(B);
        for (int i = 0; i < B; ++i) radius[i] = 0.5 * std::sqrt(p.blocks[i].area);
        const NearPairs near(radius, W, D);
        const int steps = 250;
        for (int it = 0; it < steps; ++it) {
            const double cool = 1.0 - double(it) / steps;
            std::vector<Point> f(B);
            for (const SearchProblem::Link& l : p.links) {
                if (p.isOutside(l.b)) { // towards the outside rectangle it must reach, kept inside
                    const Rect& o = p.outside[l.b - B];
                    const double tx = std::clamp(0.5 * (o.x0 + o.x1) - X, 0.0, W), ty = std::clamp(0.5 * (o.y0 + o.y1) - Y, 0.0, D);
                    f[l.a].x += 0.5 * l.weight * (tx - pos[l.a].x);
                    f[l.a].y += 0.5 * l.weight * (ty - pos[l.a].y);
                    continue;
                }
                const double dx = pos[l.b].x - pos[l.a].x, dy = pos[l.b].y - pos[l.a].y;
                const double dist = std::max(1e-9, std::hypot(dx, dy));
                const double k = l.weight * 0.25 * (dist - (radius[l.a] + radius[l.b])) / dist;
                f[l.a].x += k * dx, f[l.a].y += k * dy;
                f[l.b].x -= k * dx, f[l.b].y -= k * dy;
            }
            near.pairs(pos, [&](int i, int j) {
                const double dx = pos[j].x - pos[i].x, dy = pos[j].y - pos[i].y;
                const double reach = radius[i] + radius[j];
                if (dx * dx + dy * dy >= reach * reach) return; // apart: no push
                const double dist = std::max(1e-9, std::sqrt(dx * dx + dy * dy));
                const double overlap = reach - dist;
                const double k = 0.25 * overlap / dist;
                f[i].x -= k * dx, f[i].y -= k * dy;
                f[j].x += k * dx, f[j].y += k * dy;
            });
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
    for (Point& q : pos) q.x += X, q.y += Y;
    return pos;
}

namespace {

// Above this many blocks a split's measures come from a sweep, not a loop
// over every block per cut position: a chain of 3,000 rooms is peeled one
// room per cut, so the loop cost O(n³) (40 s before a seed). Below it the
// loop stays, so that plans of up to this many rooms keep their exact sums.
constexpr std::size_t directSplitLimit = 256;

} // namespace

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
            const bool many = items.size() > directSplitLimit;
            SplitSweep sweep;
            if (many) sweep.start(items, pos, half, pin, dir);
            double prefix = 0;
            for (std::size_t k = 1; k < items.size(); ++k) {
                prefix += area[items[k - 1]];
                const double c = lo + len * prefix / total;
                double wrong = 0, through = 0;
                if (many) {
                    sweep.at(k, c, wrong, through);
                } else {
                    for (std::size_t j = 0; j < items.size(); ++j) {
                        const double at = dir ? pos[items[j]].x : pos[items[j]].y;
                        const double reach = dir ? half[items[j]].x : half[items[j]].y;
                        wrong += j < k ? std::max(0.0, at - c) : std::max(0.0, c - at);
                        through += std::max(0.0, reach - std::abs(at - c));
                        if (const std::optional<Rect>& f = pin[items[j]]) // held in place: the cut keeps off it
                            wrong += 4.0 * (j < k ? std::max(0.0, (dir ? f->x1 : f->y1) - c)
                                                  : std::max(0.0, c - (dir ? f->x0 : f->y0)));
                    }
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


std::vector<Point> reaches(const SearchProblem& p, const std::vector<Point>& pos) {
    const int B = static_cast<int>(p.blocks.size());
    std::vector<Point> half(B);
    for (int i = 0; i < B; ++i) {
        const double base = 0.3 * std::sqrt(p.area[i]);
        half[i] = {base, base};
        if (!p.isHub(i)) continue;
        // Along the spread of the rooms that open on it (other hubs' positions
        // say little: they are the middles of other corridors); across, half
        // its width.
        double x0 = pos[i].x, x1 = pos[i].x, y0 = pos[i].y, y1 = pos[i].y;
        int rooms = 0;
        for (int li : p.linksOf[i]) {
            const SearchProblem::Link& l = p.links[li];
            const int o = l.a == i ? l.b : l.a;
            if (!l.must || p.isOutside(o) || p.isHub(o)) continue;
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

FloorTree cutTree(const SearchProblem& p, const std::vector<Point>& pos, std::mt19937& rng, double noise) {
    const int B = static_cast<int>(p.blocks.size());
    FloorTree tree(B);
    if (B == 1) return tree;
    std::vector<std::optional<Rect>> pin;
    for (const SearchProblem::Block& b : p.blocks) pin.push_back(b.pin);
    const int root = cutOver(tree, p.area, pos, reaches(p, pos), pin, p.outer, p.scale, rng, noise,
                             [&](int block, const Rect&) { return tree.leafOf(block); });
    tree.setRoot(root);
    return tree;
}

std::vector<Zone> circulationZones(const SearchProblem& p, std::mt19937& rng) {
    std::vector<int> zoneOf(p.blocks.size(), -1);
    std::vector<Zone> zones;
    for (int i = 0; i < p.rooms; ++i)
        if (p.isHub(i)) {
            zoneOf[i] = static_cast<int>(zones.size());
            zones.push_back({i, {}, {}});
        }
    if (zones.empty()) return zones;
    for (int pass = 0; pass < 3; ++pass)
        for (int i = 0; i < p.rooms; ++i) {
            if (zoneOf[i] >= 0) continue;
            std::vector<int> options, via;
            for (int li : p.linksOf[i]) {
                const SearchProblem::Link& l = p.links[li];
                if (!l.must) continue;
                const int other = l.a == i ? l.b : l.a;
                if (p.isOutside(other)) continue;
                if (pass == 0 ? p.isHub(other) : zoneOf[other] >= 0 && !p.isHub(other)) {
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

FloorTree zoneTree(const SearchProblem& p, const std::vector<Zone>& zones, const std::vector<Point>& pos,
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
    const int root = cutOver(tree, area, at, half, pin, p.outer, p.scale, rng, noise,
                             [&](int item, const Rect& r) {
                                 return zoneOfItem[item] >= 0 ? zoneStrip(tree, zones[zoneOfItem[item]], pos, p.area, r, rng)
                                                              : tree.leafOf(blockOfItem[item]);
                             });
    tree.setRoot(root);
    return tree;
}

} // namespace abut::detail
