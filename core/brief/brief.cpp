// SPDX-License-Identifier: MIT
#include "brief/brief.h"

#include <string_view>
#include <unordered_map>

#include <algorithm>
#include <map>

#include <nlohmann/json.hpp>

#include <cmath>

namespace abut {

UnknownFields::UnknownFields(OrderedJson fields)
    : fields_(fields.is_object() && !fields.empty() ? std::make_shared<const OrderedJson>(std::move(fields)) : nullptr) {}

const OrderedJson& UnknownFields::json() const {
    static const OrderedJson none = OrderedJson::object();
    return fields_ ? *fields_ : none;
}

bool UnknownFields::empty() const { return !fields_ || fields_->empty(); }

char sideLetter(Side s) { return "NESW"[static_cast<int>(s)]; }

std::optional<Side> sideFromLetter(const std::string& s) {
    if (s == "N") return Side::N;
    if (s == "E") return Side::E;
    if (s == "S") return Side::S;
    if (s == "W") return Side::W;
    return std::nullopt;
}

int Brief::roomIndex(const std::string& id) const {
    for (std::size_t i = 0; i < rooms.size(); ++i)
        if (rooms[i].id == id) return static_cast<int>(i);
    return -1;
}

std::vector<std::pair<int, int>> Brief::adjacencyRooms() const {
    std::unordered_map<std::string_view, int> index;
    index.reserve(rooms.size());
    for (std::size_t i = 0; i < rooms.size(); ++i) index.emplace(rooms[i].id, static_cast<int>(i));
    auto at = [&](const std::string& id) {
        const auto it = index.find(id);
        return it == index.end() ? -1 : it->second;
    };
    std::vector<std::pair<int, int>> out;
    out.reserve(adjacencies.size());
    for (const Adjacency& a : adjacencies) out.emplace_back(at(a.a), at(a.b));
    return out;
}

double Brief::totalTargetArea() const {
    double sum = 0.0;
    for (const Room& r : rooms) sum += r.area;
    return sum;
}

Footprint Brief::effectiveFootprint() const {
    if (footprint) return *footprint;
    // No footprint given: a rectangle of the total target area with the
    // proportion 4:3, a common plan proportion (common practice, no source).
    const double area = totalTargetArea();
    const double width = std::sqrt(area * 4.0 / 3.0);
    return {width, width > 0 ? area / width : 0.0, {}};
}

const SketchPoint* Brief::sketchPosition(const std::string& id) const {
    for (const auto& [key, p] : sketch)
        if (key == id) return &p;
    return nullptr;
}

const char* toString(AdjacencyKind k) { return k == AdjacencyKind::Door ? "door" : "wall"; }
const char* toString(Priority p) { return p == Priority::Must ? "must" : "should"; }

std::size_t controlCharacterAt(const std::string& text, char32_t* code) {
    auto at = [&](std::size_t i, char32_t cp) {
        if (code) *code = cp;
        return i;
    };
    for (std::size_t i = 0; i < text.size(); ++i) {
        const unsigned char c = static_cast<unsigned char>(text[i]);
        if (c < 0x20 || c == 0x7F) return at(i, c);
        const unsigned char c1 = i + 1 < text.size() ? static_cast<unsigned char>(text[i + 1]) : 0;
        if (c == 0xC2 && c1 >= 0x80 && c1 <= 0x9F) return at(i, c1);
        if (c == 0xE2 && c1 == 0x80 && i + 2 < text.size()) {
            const unsigned char c2 = static_cast<unsigned char>(text[i + 2]);
            if (c2 == 0xA8 || c2 == 0xA9) return at(i, 0x2000 + c2 - 0x80);
        }
    }
    return std::string::npos;
}

double Footprint::netArea() const {
    double a = width * depth;
    for (const Placement& c : cutouts) a -= c.area();
    return a;
}

double overlapArea(const Placement& a, const Placement& b) {
    const double w = std::min(a.x + a.width, b.x + b.width) - std::max(a.x, b.x);
    const double d = std::min(a.y + a.depth, b.y + b.depth) - std::max(a.y, b.y);
    return w > 0 && d > 0 ? w * d : 0.0;
}

bool overlaps(const Placement& a, const Placement& b, double tolerance) {
    const double w = std::min(a.x + a.width, b.x + b.width) - std::max(a.x, b.x);
    const double d = std::min(a.y + a.depth, b.y + b.depth) - std::max(a.y, b.y);
    return w > tolerance && d > tolerance;
}

namespace {

// The grid through every cut-out edge: its lines, and per cell (i, j) at
// index i·ny + j whether it is building.
struct CellGrid {
    std::vector<double> xs, ys;
    int nx = 0, ny = 0;
    std::vector<char> building;
    bool at(int i, int j) const { return i >= 0 && j >= 0 && i < nx && j < ny && building[i * ny + j]; }
};

// `taken`: further rectangles that are not free (rooms fixed in place).
CellGrid cellGrid(const Footprint& fp, const std::vector<Placement>& taken = {}) {
    CellGrid g;
    g.xs = {0.0, fp.width};
    g.ys = {0.0, fp.depth};
    std::vector<Placement> blocked = fp.cutouts;
    blocked.insert(blocked.end(), taken.begin(), taken.end());
    for (const Placement& c : blocked) {
        g.xs.insert(g.xs.end(), {std::clamp(c.x, 0.0, fp.width), std::clamp(c.x + c.width, 0.0, fp.width)});
        g.ys.insert(g.ys.end(), {std::clamp(c.y, 0.0, fp.depth), std::clamp(c.y + c.depth, 0.0, fp.depth)});
    }
    for (auto* v : {&g.xs, &g.ys}) {
        std::sort(v->begin(), v->end());
        v->erase(std::unique(v->begin(), v->end()), v->end());
    }
    g.nx = std::max(0, static_cast<int>(g.xs.size()) - 1);
    g.ny = std::max(0, static_cast<int>(g.ys.size()) - 1);
    g.building.assign(static_cast<std::size_t>(g.nx * g.ny), 1);
    for (int i = 0; i < g.nx; ++i)
        for (int j = 0; j < g.ny; ++j) {
            const Placement cell{g.xs[i], g.ys[j], g.xs[i + 1] - g.xs[i], g.ys[j + 1] - g.ys[j]};
            for (const Placement& c : blocked)
                if (overlapArea(cell, c) > 0.5 * cell.area()) g.building[i * g.ny + j] = 0;
        }
    return g;
}

} // namespace

Placement largestFreeRectangle(const Footprint& fp, const std::vector<Placement>& taken) {
    // Largest rectangle under a histogram, row by row: heights[i] is how far
    // free cells reach down from the current row in column i; a stack of
    // rising heights gives every maximal rectangle once (widths weighted).
    const CellGrid g = cellGrid(fp, taken);
    Placement best;
    std::vector<double> height(static_cast<std::size_t>(g.nx), 0.0);
    for (int j = 0; j < g.ny; ++j) {
        const double top = g.ys[j + 1];
        for (int i = 0; i < g.nx; ++i) height[i] = g.at(i, j) ? height[i] + (g.ys[j + 1] - g.ys[j]) : 0.0;
        std::vector<int> stack; // column indices, heights rising
        for (int i = 0; i <= g.nx; ++i) {
            const double h = i < g.nx ? height[i] : 0.0;
            while (!stack.empty() && height[stack.back()] >= h) {
                const double hh = height[stack.back()];
                stack.pop_back();
                const double x0 = stack.empty() ? g.xs[0] : g.xs[stack.back() + 1];
                const double x1 = g.xs[i];
                if (hh * (x1 - x0) > best.area()) best = {x0, top - hh, x1 - x0, hh};
            }
            stack.push_back(i);
        }
    }
    return best;
}

bool isConnected(const Footprint& fp) {
    // The building's cells, joined through shared sides.
    const CellGrid grid = cellGrid(fp);
    const int nx = grid.nx, ny = grid.ny;
    std::vector<char> building = grid.building;
    int count = 0, start = -1;
    for (int c = 0; c < nx * ny; ++c)
        if (building[c]) {
            ++count;
            start = c;
        }
    if (count == 0) return false;
    std::vector<int> stack{start};
    building[start] = 2;
    int reached = 1;
    while (!stack.empty()) {
        const int c = stack.back();
        stack.pop_back();
        const int i = c / ny, j = c % ny;
        const int next[4][2] = {{i + 1, j}, {i - 1, j}, {i, j + 1}, {i, j - 1}};
        for (const auto& n : next) {
            if (n[0] < 0 || n[0] >= nx || n[1] < 0 || n[1] >= ny) continue;
            char& b = building[n[0] * ny + n[1]];
            if (b != 1) continue;
            b = 2;
            ++reached;
            stack.push_back(n[0] * ny + n[1]);
        }
    }
    return reached == count;
}

std::vector<OutlineLoop> footprintOutline(const Footprint& fp) {
    const CellGrid grid = cellGrid(fp);
    const std::vector<double>& xs = grid.xs;
    const std::vector<double>& ys = grid.ys;
    auto building = [&](int i, int j) { return grid.at(i, j); };
    const int nx = grid.nx, ny = grid.ny;
    // Boundary edges between grid points (i, j), building on their left.
    std::map<std::pair<int, int>, std::vector<std::pair<int, int>>> next;
    for (int i = 0; i < nx; ++i)
        for (int j = 0; j < ny; ++j) {
            if (!building(i, j)) continue;
            if (!building(i, j - 1)) next[{i, j}].push_back({i + 1, j});         // south side, eastwards
            if (!building(i + 1, j)) next[{i + 1, j}].push_back({i + 1, j + 1}); // east side, northwards
            if (!building(i, j + 1)) next[{i + 1, j + 1}].push_back({i, j + 1}); // north side, westwards
            if (!building(i - 1, j)) next[{i, j + 1}].push_back({i, j});         // west side, southwards
        }
    std::vector<OutlineLoop> loops;
    while (!next.empty()) {
        std::vector<std::pair<int, int>> walk{next.begin()->first};
        for (;;) {
            auto it = next.find(walk.back());
            if (it == next.end()) break;
            const std::pair<int, int> to = it->second.back();
            it->second.pop_back();
            if (it->second.empty()) next.erase(it);
            if (to == walk.front()) break;
            walk.push_back(to);
        }
        OutlineLoop loop;
        const std::size_t k = walk.size();
        for (std::size_t a = 0; a < k; ++a) { // corners only
            const auto& p = walk[(a + k - 1) % k];
            const auto& q = walk[a];
            const auto& r = walk[(a + 1) % k];
            const bool straight = (p.first == q.first && q.first == r.first) || (p.second == q.second && q.second == r.second);
            if (!straight) loop.emplace_back(xs[q.first], ys[q.second]);
        }
        loops.push_back(std::move(loop));
    }
    // The outer loop (largest signed area, counter-clockwise) first.
    auto signedArea = [](const OutlineLoop& l) {
        double a = 0;
        for (std::size_t i = 0; i < l.size(); ++i) {
            const auto& p = l[i];
            const auto& q = l[(i + 1) % l.size()];
            a += p.first * q.second - q.first * p.second;
        }
        return a / 2;
    };
    std::stable_sort(loops.begin(), loops.end(),
                     [&](const OutlineLoop& a, const OutlineLoop& b) { return signedArea(a) > signedArea(b); });
    return loops;
}

Brief plannedBrief(const Brief& brief) {
    Brief out = brief;
    if (!brief.footprint) return out;
    const bool added = std::any_of(brief.rooms.begin(), brief.rooms.end(), [](const Room& r) { return r.cutout; });
    if (!added)
        for (std::size_t k = 0; k < brief.footprint->cutouts.size(); ++k) {
            const Placement& c = brief.footprint->cutouts[k];
            Room r;
            r.id = "cutout-" + std::to_string(k + 1);
            while (out.roomIndex(r.id) >= 0) r.id += "+"; // never a room of the brief
            r.name = "Cut-out " + std::to_string(k + 1);
            r.area = c.area();
            r.areaTolerance = 0.0;
            r.fixed = c;
            r.cutout = true;
            out.rooms.push_back(std::move(r));
        }
    if (brief.surplus != Surplus::Spread) return out;
    double total = 0, area = brief.footprint->width * brief.footprint->depth;
    for (const Room& r : out.rooms) {
        if (r.fixed) area -= r.fixed->area();
        else total += r.area;
    }
    if (total <= 0 || total >= area) return out;
    for (Room& r : out.rooms)
        if (!r.fixed) r.area *= area / total;
    return out;
}

} // namespace abut
