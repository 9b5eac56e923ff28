// SPDX-License-Identifier: MIT
#include "search/requirements.h"

#include <algorithm>
#include <cmath>

namespace abut {

bool areaMeets(const Room& room, double area) {
    return std::abs(area - room.area) / room.area <= room.tolerance() + 1e-9;
}

bool widthMeets(const Room& room, const Rect& r, const Thresholds& t) {
    return !room.minWidth || std::min(r.width(), r.depth()) >= *room.minWidth * (1 - t.slack);
}

bool aspectMeets(const Room& room, const Rect& r, const Thresholds& t) {
    const double shortSide = std::min(r.width(), r.depth()), longSide = std::max(r.width(), r.depth());
    return !room.maxAspect || longSide <= *room.maxAspect * shortSide * (1 + t.slack);
}

double wallNeeded(const Brief& brief, const Adjacency& a, const Thresholds& t) {
    return a.kind == AdjacencyKind::Door ? brief.doorWidth : t.anyWall;
}

bool wallMeets(double length, double need, const Thresholds& t) { return length >= need * (1 - t.slack); }

double lineTolerance(const Footprint& fp, const Thresholds& t) { return t.line * std::max(fp.width, fp.depth); }

bool reachesSide(const Rect& r, Side s, double width, double depth, double tol) {
    switch (s) {
    case Side::N: return std::abs(r.y1 - depth) <= tol;
    case Side::E: return std::abs(r.x1 - width) <= tol;
    case Side::S: return std::abs(r.y0) <= tol;
    case Side::W: return std::abs(r.x0) <= tol;
    }
    return false;
}

Rect toRect(const Placement& p) { return {p.x, p.y, p.x + p.width, p.y + p.depth}; }

bool inPlace(const Room& room, const Rect& r, double tol) {
    if (!room.fixed) return true;
    const Rect f = toRect(*room.fixed);
    return std::abs(r.x0 - f.x0) <= tol && std::abs(r.x1 - f.x1) <= tol && std::abs(r.y0 - f.y0) <= tol &&
           std::abs(r.y1 - f.y1) <= tol;
}

namespace {

// Whether `r` has an exterior wall on cut-out `c` facing side `s`.
bool facesCutout(const Rect& r, const Rect& c, Side s, double tol) {
    if (sharedWallLength(r, c, tol) <= tol) return false;
    switch (s) {
    case Side::N: return std::abs(c.y0 - r.y1) <= tol;
    case Side::E: return std::abs(c.x0 - r.x1) <= tol;
    case Side::S: return std::abs(c.y1 - r.y0) <= tol;
    case Side::W: return std::abs(c.x1 - r.x0) <= tol;
    }
    return false;
}

bool facesOutsideAmong(const std::vector<int>& cutouts, const Footprint& fp, const std::vector<Rect>& rooms, int i,
                       Side s, double tol) {
    const Rect& r = rooms[i];
    if (reachesSide(r, s, fp.width, fp.depth, tol)) return true;
    for (int k : cutouts)
        if (facesCutout(r, rooms[k], s, tol)) return true;
    return false;
}

std::vector<int> cutoutsOf(const Brief& brief, std::size_t rects) {
    std::vector<int> out;
    for (std::size_t k = 0; k < brief.rooms.size() && k < rects; ++k)
        if (brief.rooms[k].cutout) out.push_back(static_cast<int>(k));
    return out;
}

} // namespace

bool facesOutside(const Brief& brief, const Footprint& fp, const std::vector<Rect>& rooms, int i, Side s,
                  double tol) {
    return facesOutsideAmong(cutoutsOf(brief, rooms.size()), fp, rooms, i, s, tol);
}

RequirementReport measureRequirements(const Brief& brief, const Footprint& fp, const std::vector<Rect>& rooms,
                                      const Thresholds& t) {
    RequirementReport out;
    RequirementMisses& m = out.counts;
    const double L = std::max(fp.width, fp.depth);
    const double tol = t.line * L;
    const std::vector<int> cutouts = cutoutsOf(brief, rooms.size());
    const std::size_t n = std::min(brief.rooms.size(), rooms.size());
    double sumErr = 0;
    int measured = 0;
    for (std::size_t i = 0; i < n; ++i) {
        const Room& room = brief.rooms[i];
        const Rect& r = rooms[i];
        const int at = static_cast<int>(i);
        if (!inPlace(room, r, t.place * L)) {
            const Rect f = toRect(*room.fixed);
            const double off = std::max({std::abs(r.x0 - f.x0), std::abs(r.y0 - f.y0), std::abs(r.x1 - f.x1),
                                         std::abs(r.y1 - f.y1)});
            out.misses.push_back({RequirementKind::Fixed, at, -1, -1, true, 0, off, {}});
            ++m.fixed;
        }
        if (room.cutout) continue;
        const double err = std::abs(r.area() - room.area) / room.area;
        m.worstAreaError = std::max(m.worstAreaError, err);
        sumErr += err;
        ++measured;
        if (!areaMeets(room, r.area())) {
            out.misses.push_back({RequirementKind::Area, at, -1, -1, true, room.area, r.area(), {}});
            ++m.area;
        }
        const double shortSide = std::min(r.width(), r.depth()), longSide = std::max(r.width(), r.depth());
        if (!widthMeets(room, r, t)) {
            out.misses.push_back({RequirementKind::MinWidth, at, -1, -1, true, *room.minWidth, shortSide, {}});
            ++m.minWidth;
        }
        if (!aspectMeets(room, r, t)) {
            out.misses.push_back({RequirementKind::MaxAspect, at, -1, -1, true, *room.maxAspect,
                                  shortSide > 0 ? longSide / shortSide : 0.0, {}});
            ++m.maxAspect;
        }
        if (room.facade.empty()) continue;
        FacadeWish missed;
        bool any = false;
        for (Side s : allSides) {
            const bool reaches = facesOutsideAmong(cutouts, fp, rooms, at, s, tol);
            any = any || reaches;
            if (room.facade.has(s) && !reaches) missed.add(s);
        }
        missed.anySide = room.facade.anySide && !any;
        if (!missed.empty()) {
            out.misses.push_back({RequirementKind::Facade, at, -1, -1, true, 0, 0, missed});
            ++m.facade;
        }
    }
    out.meanAreaError = measured > 0 ? sumErr / measured : 0.0;
    const std::vector<std::pair<int, int>> ends = brief.adjacencyRooms();
    for (std::size_t k = 0; k < brief.adjacencies.size(); ++k) {
        const Adjacency& a = brief.adjacencies[k];
        const auto [u, v] = ends[k];
        if (u < 0 || v < 0 || u >= static_cast<int>(rooms.size()) || v >= static_cast<int>(rooms.size())) continue;
        const double need = wallNeeded(brief, a, t), wall = sharedWallLength(rooms[u], rooms[v], tol);
        if (wallMeets(wall, need, t)) continue;
        const bool must = a.priority == Priority::Must;
        out.misses.push_back({a.kind == AdjacencyKind::Door ? RequirementKind::Door : RequirementKind::Adjacency, u, v,
                              static_cast<int>(k), must, need, wall, {}});
        ++(must ? m.must : m.should);
    }
    return out;
}

RequirementMisses requirementMisses(const Brief& brief, const Footprint& fp, const std::vector<Rect>& rooms,
                                    const Thresholds& t) {
    return measureRequirements(brief, fp, rooms, t).counts;
}

} // namespace abut
