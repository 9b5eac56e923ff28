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

// Who takes the sides room i wishes for and misses, with their wall lengths.
std::vector<std::string> facadeTakers(const Brief& planned, const Footprint& fp, const PlanVariant& v, int i,
                                      const FacadeWish& missed, double tol) {
    std::vector<std::string> out;
    const std::string& u = planned.units;
    if (missed.anySide) {
        int takers = 0;
        for (int j = 0; j < static_cast<int>(v.rooms.size()); ++j)
            for (Side s : allSides)
                if (j != i && !planned.rooms[j].cutout && facesOutside(planned, fp, v.rooms, j, s, tol)) {
                    ++takers;
                    break;
                }
        out.push_back("the outside walls (" + number(2 * (fp.width + fp.depth), 1) + " " + u + ") taken by " +
                      std::to_string(takers) + " other rooms");
    }
    for (Side s : allSides) {
        if (!missed.has(s)) continue;
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
            out.push_back(std::string("the ") + sideName(s) + " facade (" + number(length, 1) + " " + u +
                          ") taken by " + list + ": " + number(taken, 1) + " " + u);
    }
    return out;
}

// One miss of the measure in the planner's words.
UnmetItem describe(const Brief& planned, const Footprint& fp, const PlanVariant& v, const Miss& m, double tol) {
    const std::string& u = planned.units;
    const std::string u2 = u + "\xC2\xB2";
    UnmetItem item;
    item.kind = m.kind;
    item.target = m.target;
    item.achieved = m.achieved;
    if (m.adjacency >= 0) {
        const Adjacency& a = planned.adjacencies[m.adjacency];
        const bool door = m.kind == RequirementKind::Door;
        const std::string names = planned.rooms[m.room].displayName() + " and " + planned.rooms[m.other].displayName();
        item.field = "/adjacencies/" + std::to_string(m.adjacency);
        item.rooms = {m.room, m.other};
        item.adjacency = m.adjacency;
        item.text = m.achieved <= tol ? names + ": the 'must' " + std::string(toString(a.kind)) +
                                            " is dropped (they do not touch)"
                    : door ? names + ": " + number(m.achieved, 2) + " " + u + " of shared wall, a door needs " +
                                 number(m.target, 2) + " " + u
                           : names + ": " + number(m.achieved, 2) + " " + u + " of shared wall, the shortest that counts is " +
                                 number(m.target, 2) + " " + u;
        return item;
    }
    const Room& room = planned.rooms[m.room];
    const std::string& name = room.displayName();
    const std::string at = "/rooms/" + std::to_string(m.room);
    item.rooms = {m.room};
    switch (m.kind) {
    case RequirementKind::Fixed:
        item.field = at + "/fixed";
        item.text = name + ": not where it is fixed (a wall " + number(m.achieved, 2) + " " + u + " away)";
        break;
    case RequirementKind::Area: {
        const double dev = (m.achieved - m.target) / m.target;
        item.field = at + "/area";
        item.text = name + ": " + number(m.achieved, 1) + " " + u2 + " for a target of " + number(m.target, 1) + " " + u2 +
                    " (" + (dev > 0 ? "+" : "") + number(100 * dev, 0) + " %, band ±" +
                    number(100 * room.tolerance(), 0) + " %)";
        break;
    }
    case RequirementKind::MinWidth:
        item.field = at + "/minWidth";
        item.text = name + ": " + number(m.achieved, 2) + " " + u + " wide, minimum " + number(m.target, 2) + " " + u;
        break;
    case RequirementKind::MaxAspect:
        item.field = at + "/maxAspect";
        item.text = name + ": proportions 1:" + number(m.achieved, 2) + ", limit 1:" + number(m.target, 2);
        break;
    default: { // Facade
        std::string missed = m.sides.anySide ? "an outside wall" : "";
        for (Side s : allSides)
            if (m.sides.has(s)) missed += std::string(missed.empty() ? "the " : ", the ") + sideName(s) + " facade";
        item.field = at + "/facade";
        item.text = name + ": does not reach " + missed;
        item.heldBy = facadeTakers(planned, fp, v, m.room, m.sides, tol);
        break;
    }
    }
    return item;
}

} // namespace

std::vector<UnmetItem> unmetRequirements(const Brief& brief, const Footprint& fp, const PlanVariant& v,
                                         const Thresholds& t) {
    std::vector<UnmetItem> out;
    const Brief planned = plannedBrief(brief); // targets as planned (grown with `surplus: spread`), cut-outs added
    if (v.rooms.size() != planned.rooms.size()) return out;
    const double tol = lineTolerance(fp, t);
    for (const Miss& m : measureRequirements(planned, fp, v.rooms, t).misses) {
        if (m.adjacency >= 0 && !m.must) continue; // a 'should' given up keeps the plan usable
        if (planned.rooms[m.room].cutout) continue; // not a room (buildPlan drops variants with a cut-out moved)
        out.push_back(describe(planned, fp, v, m, tol));
    }
    return out;
}

} // namespace abut
