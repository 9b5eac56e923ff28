// SPDX-License-Identifier: MIT
#include "search/requirements.h"

#include <algorithm>
#include <cmath>

namespace abut {

double sharedWallLength(const Rect& a, const Rect& b, double tol) {
    const double ox = std::min(a.x1, b.x1) - std::max(a.x0, b.x0);
    const double oy = std::min(a.y1, b.y1) - std::max(a.y0, b.y0);
    if ((std::abs(a.x1 - b.x0) <= tol || std::abs(b.x1 - a.x0) <= tol) && oy > tol) return oy;
    if ((std::abs(a.y1 - b.y0) <= tol || std::abs(b.y1 - a.y0) <= tol) && ox > tol) return ox;
    return 0.0;
}

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

bool facesOutside(const Brief& brief, const Footprint& fp, const std::vector<Rect>& rooms, int i, Side s,
                  double tol) {
    const Rect& r = rooms[i];
    if (reachesSide(r, s, fp.width, fp.depth, tol)) return true;
    for (std::size_t k = 0; k < brief.rooms.size() && k < rooms.size(); ++k) {
        if (!brief.rooms[k].cutout || sharedWallLength(r, rooms[k], tol) <= tol) continue;
        const Rect& c = rooms[k];
        switch (s) {
        case Side::N: if (std::abs(c.y0 - r.y1) <= tol) return true; break;
        case Side::E: if (std::abs(c.x0 - r.x1) <= tol) return true; break;
        case Side::S: if (std::abs(c.y1 - r.y0) <= tol) return true; break;
        case Side::W: if (std::abs(c.x1 - r.x0) <= tol) return true; break;
        }
    }
    return false;
}

RequirementMisses requirementMisses(const Brief& brief, const Footprint& fp, const std::vector<Rect>& rooms,
                                    double anyWall) {
    RequirementMisses m;
    const double tol = 1e-7 * std::max(fp.width, fp.depth);
    for (std::size_t i = 0; i < brief.rooms.size() && i < rooms.size(); ++i) {
        const Room& room = brief.rooms[i];
        const Rect& r = rooms[i];
        if (!inPlace(room, r, 1e-6 * std::max(fp.width, fp.depth))) ++m.fixed;
        if (room.cutout) continue;
        const double err = std::abs(r.area() - room.area) / room.area;
        m.worstAreaError = std::max(m.worstAreaError, err);
        if (err > room.tolerance() + 1e-9) ++m.area;
        const double shortSide = std::min(r.width(), r.depth()), longSide = std::max(r.width(), r.depth());
        if (room.minWidth && shortSide < *room.minWidth - 1e-9) ++m.minWidth;
        if (room.maxAspect && longSide > *room.maxAspect * shortSide * (1 + 1e-9)) ++m.maxAspect;
        bool any = false, met = true;
        for (Side s : allSides) {
            const bool reaches = facesOutside(brief, fp, rooms, static_cast<int>(i), s, tol);
            any = any || reaches;
            if (room.facade.has(s) && !reaches) met = false;
        }
        if (room.facade.anySide && !any) met = false;
        if (!met) ++m.facade;
    }
    for (const Adjacency& a : brief.adjacencies) {
        const int u = brief.roomIndex(a.a), v = brief.roomIndex(a.b);
        if (u < 0 || v < 0 || u >= static_cast<int>(rooms.size()) || v >= static_cast<int>(rooms.size())) continue;
        const double need = a.kind == AdjacencyKind::Door ? brief.doorWidth : anyWall;
        if (sharedWallLength(rooms[u], rooms[v], tol) < need * (1 - 1e-6)) {
            if (a.priority == Priority::Must) ++m.must;
            else ++m.should;
        }
    }
    return m;
}

} // namespace abut
