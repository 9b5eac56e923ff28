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

RequirementMisses requirementMisses(const Brief& brief, const Footprint& fp, const std::vector<Rect>& rooms,
                                    double anyWall) {
    RequirementMisses m;
    const double tol = 1e-7 * std::max(fp.width, fp.depth);
    for (std::size_t i = 0; i < brief.rooms.size() && i < rooms.size(); ++i) {
        const Room& room = brief.rooms[i];
        const Rect& r = rooms[i];
        const double err = std::abs(r.area() - room.area) / room.area;
        m.worstAreaError = std::max(m.worstAreaError, err);
        if (err > room.tolerance() + 1e-9) ++m.area;
        const double shortSide = std::min(r.width(), r.depth()), longSide = std::max(r.width(), r.depth());
        if (room.minWidth && shortSide < *room.minWidth - 1e-9) ++m.minWidth;
        if (room.maxAspect && longSide > *room.maxAspect * shortSide * (1 + 1e-9)) ++m.maxAspect;
        bool any = false, met = true;
        for (Side s : allSides) {
            const bool reaches = reachesSide(r, s, fp.width, fp.depth, tol);
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
