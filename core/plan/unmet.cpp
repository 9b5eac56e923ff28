// SPDX-License-Identifier: MIT
#include "plan/unmet.h"

#include "search/requirements.h"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace abut {

namespace {

std::string number(double v, int decimals) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.*f", decimals, v);
    return buf;
}

const char* sideName(Side s) {
    switch (s) {
    case Side::N: return "north";
    case Side::E: return "east";
    case Side::S: return "south";
    default: return "west";
    }
}

} // namespace

std::vector<UnmetItem> unmetRequirements(const Brief& brief, const Footprint& fp, const PlanVariant& v) {
    std::vector<UnmetItem> out;
    const Brief planned = plannedBrief(brief); // targets as planned (grown with `surplus: spread`), cut-outs added
    if (v.rooms.size() != planned.rooms.size()) return out;
    auto outside = [&](int j, Side s) {
        return facesOutside(planned, fp, v.rooms, j, s, 1e-9 * std::max(fp.width, fp.depth));
    };
    const std::string& u = brief.units;
    const std::string u2 = u + "\xC2\xB2";
    for (int i = 0; i < static_cast<int>(planned.rooms.size()); ++i) {
        const Room& room = planned.rooms[i];
        if (room.cutout) continue;
        const Rect& r = v.rooms[i];
        const std::string at = "/rooms/" + std::to_string(i);
        const std::string& name = room.displayName();
        if (!inPlace(room, r, 1e-6 * std::max(fp.width, fp.depth))) {
            const double off = std::max({std::abs(r.x0 - room.fixed->x), std::abs(r.y0 - room.fixed->y),
                                         std::abs(r.x1 - room.fixed->x - room.fixed->width),
                                         std::abs(r.y1 - room.fixed->y - room.fixed->depth)});
            out.push_back({"fixed", at + "/fixed", {i}, -1, 0, off,
                           name + ": not where it is fixed (a wall " + number(off, 2) + " " + u + " away)", {}});
        }
        const double area = r.area(), dev = (area - room.area) / room.area;
        if (std::abs(dev) > room.tolerance() + 1e-9)
            out.push_back({"area", at + "/area", {i}, -1, room.area, area,
                           name + ": " + number(area, 1) + " " + u2 + " for a target of " + number(room.area, 1) + " " +
                               u2 + " (" + (dev > 0 ? "+" : "") + number(100 * dev, 0) + " %, band ±" +
                               number(100 * room.tolerance(), 0) + " %)",
                           {}});
        const double shortSide = std::min(r.width(), r.depth()), longSide = std::max(r.width(), r.depth());
        if (room.minWidth && shortSide < *room.minWidth - 1e-6)
            out.push_back({"minWidth", at + "/minWidth", {i}, -1, *room.minWidth, shortSide,
                           name + ": " + number(shortSide, 2) + " " + u + " wide, minimum " + number(*room.minWidth, 2) +
                               " " + u,
                           {}});
        if (room.maxAspect && shortSide > 0 && longSide / shortSide > *room.maxAspect + 1e-6)
            out.push_back({"maxAspect", at + "/maxAspect", {i}, -1, *room.maxAspect, longSide / shortSide,
                           name + ": proportions 1:" + number(longSide / shortSide, 2) + ", limit 1:" +
                               number(*room.maxAspect, 2),
                           {}});
        if (!room.facade.empty()) {
            const double tol = 1e-9 * std::max(fp.width, fp.depth);
            std::string missed;
            if (room.facade.anySide) {
                bool any = false;
                for (Side s : allSides) any = any || outside(i, s);
                if (!any) missed = "an outside wall";
            }
            for (Side s : allSides)
                if (room.facade.has(s) && !outside(i, s))
                    missed += std::string(missed.empty() ? "the " : ", the ") + sideName(s) + " facade";
            if (!missed.empty()) {
                UnmetItem item{"facade", at + "/facade", {i}, -1, 0, 0, name + ": does not reach " + missed, {}};
                // Who takes the sides it wishes for, with their wall lengths.
                if (room.facade.anySide && !room.facade.sides) {
                    int takers = 0;
                    for (int j = 0; j < static_cast<int>(v.rooms.size()); ++j)
                        for (Side s : allSides)
                            if (j != i && !planned.rooms[j].cutout && outside(j, s)) {
                                ++takers;
                                break;
                            }
                    item.heldBy.push_back("the outside walls (" + number(2 * (fp.width + fp.depth), 1) + " " + u +
                                          ") taken by " + std::to_string(takers) + " other rooms");
                }
                for (Side s : allSides) {
                    if (!room.facade.has(s) || outside(i, s)) continue;
                    const bool ew = s == Side::E || s == Side::W;
                    const double length = ew ? fp.depth : fp.width;
                    std::vector<std::pair<double, int>> takers;
                    for (int j = 0; j < static_cast<int>(v.rooms.size()); ++j)
                        if (j != i && !planned.rooms[j].cutout && reachesSide(v.rooms[j], s, fp.width, fp.depth, tol))
                            takers.push_back({-(ew ? v.rooms[j].depth() : v.rooms[j].width()), j});
                    std::sort(takers.begin(), takers.end());
                    std::string list;
                    double taken = 0;
                    for (std::size_t k = 0; k < takers.size(); ++k) {
                        taken -= takers[k].first;
                        if (k < 4)
                            list += (list.empty() ? "" : ", ") + planned.rooms[takers[k].second].displayName() + " (" +
                                    number(-takers[k].first, 1) + " " + u + ")";
                    }
                    if (takers.size() > 4) list += " and " + std::to_string(takers.size() - 4) + " more";
                    if (!takers.empty())
                        item.heldBy.push_back(std::string("the ") + sideName(s) + " facade (" + number(length, 1) +
                                              " " + u + ") taken by " + list + ": " + number(taken, 1) + " " + u);
                }
                out.push_back(std::move(item));
            }
        }
    }
    for (int k = 0; k < static_cast<int>(brief.adjacencies.size()); ++k) {
        const Adjacency& a = brief.adjacencies[k];
        if (a.priority != Priority::Must) continue;
        const int ia = brief.roomIndex(a.a), ib = brief.roomIndex(a.b);
        if (ia < 0 || ib < 0) continue;
        const double wall = sharedWallLength(v.rooms[ia], v.rooms[ib], 1e-9 * std::max(fp.width, fp.depth));
        const bool door = a.kind == AdjacencyKind::Door;
        const double need = door ? brief.doorWidth : 1e-9;
        if (wall >= need - 1e-6) continue;
        const std::string names = brief.rooms[ia].displayName() + " and " + brief.rooms[ib].displayName();
        out.push_back({door ? "door" : "adjacency", "/adjacencies/" + std::to_string(k), {ia, ib}, k,
                       door ? brief.doorWidth : 0, wall,
                       wall <= 1e-9 ? names + ": the 'must' " + std::string(door ? "door" : "wall") +
                                          " is dropped (they do not touch)"
                                    : names + ": " + number(wall, 2) + " " + u + " of shared wall, a door needs " +
                                          number(brief.doorWidth, 2) + " " + u,
                       {}});
    }
    return out;
}

} // namespace abut
