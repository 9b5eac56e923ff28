// SPDX-License-Identifier: MIT
#include "brief/footprint_check.h"

#include "brief/brief_rules.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <optional>
#include <sstream>

namespace abut {

namespace {

// A part of the footprint narrower than `least` between two things that face
// each other across it — a cut-out or fixed room and the footprint's edge, or
// two of them — and not filled by a third: no room and no spare space can
// take it (each rectangle there is that narrow), so there is no plan. Things
// that touch (no gap) are fine: two cut-outs edge to edge make an L.
// O(k³) for k cut-outs and fixed rooms.
struct Box {
    double x0, y0, x1, y1;
    double area() const { return (x1 - x0) * (y1 - y0); }
};

std::optional<Diagnostic> thinPart(const Brief& brief, const Footprint& fp, double least) {
    struct Thing {
        Box r;
        std::string name;
    };
    std::vector<Thing> things;
    for (std::size_t k = 0; k < fp.cutouts.size(); ++k) {
        const Placement& c = fp.cutouts[k];
        things.push_back({{c.x, c.y, c.x + c.width, c.y + c.depth}, "cut-out " + std::to_string(k + 1)});
    }
    for (const Room& room : brief.rooms)
        if (room.fixed && !room.cutout) {
            const Placement& f = *room.fixed;
            things.push_back({{f.x, f.y, f.x + f.width, f.y + f.depth}, room.displayName() + " (fixed)"});
        }
    if (things.empty()) return std::nullopt;
    // Touching is to rounding only: a strip of a nanometre is a thin part.
    const double tol = 1e-12 * std::max({1.0, fp.width, fp.depth});
    // Is the gap `g` (a rectangle) more than covered by the other things?
    auto open = [&](const Box& g) {
        double covered = 0;
        for (const Thing& t : things)
            covered += std::max(0.0, std::min(g.x1, t.r.x1) - std::max(g.x0, t.r.x0)) *
                       std::max(0.0, std::min(g.y1, t.r.y1) - std::max(g.y0, t.r.y0));
        return covered < g.area() * (1 - 1e-9);
    };
    const std::string u = brief.units;
    auto report = [&](double gap, const std::string& between, const Box& g) {
        char width[32];
        std::snprintf(width, sizeof width, "%.3g", gap);
        Diagnostic d;
        d.severity = Severity::Error;
        d.code = DiagnosticCode::ThinPart;
        d.message = "The footprint has a part only " + std::string(width) + " " + u + " wide between " + between +
                    " (x " + formatNumber(g.x0) + "\xE2\x80\x93" + formatNumber(g.x1) + ", y " + formatNumber(g.y0) +
                    "\xE2\x80\x93" + formatNumber(g.y1) + "): narrower than the shortest wall Abut plans (" +
                    formatNumber(least) + " " + u + "), so no room can take it. Let them meet, or keep them at least " +
                    formatNumber(least) + " " + u + " apart.";
        return d;
    };
    const Box outer{0, 0, fp.width, fp.depth};
    for (std::size_t a = 0; a < things.size(); ++a) {
        const Box& r = things[a].r;
        // To the footprint's four edges.
        const struct {
            double gap;
            Box g;
            const char* edge;
        } edges[] = {{r.x0 - outer.x0, {outer.x0, r.y0, r.x0, r.y1}, "west"},
                     {outer.x1 - r.x1, {r.x1, r.y0, outer.x1, r.y1}, "east"},
                     {r.y0 - outer.y0, {r.x0, outer.y0, r.x1, r.y0}, "south"},
                     {outer.y1 - r.y1, {r.x0, r.y1, r.x1, outer.y1}, "north"}};
        for (const auto& e : edges)
            if (e.gap > tol && e.gap < least && open(e.g))
                return report(e.gap, things[a].name + " and the footprint's " + e.edge + " edge", e.g);
        // To every other thing it faces.
        for (std::size_t b = 0; b < things.size(); ++b) {
            if (a == b) continue;
            const Box& q = things[b].r;
            const double yOverlap = std::min(r.y1, q.y1) - std::max(r.y0, q.y0);
            const double xOverlap = std::min(r.x1, q.x1) - std::max(r.x0, q.x0);
            if (const double gap = q.x0 - r.x1; yOverlap > tol && gap > tol && gap < least) {
                const Box g{r.x1, std::max(r.y0, q.y0), q.x0, std::min(r.y1, q.y1)};
                if (open(g)) return report(gap, things[a].name + " and " + things[b].name, g);
            }
            if (const double gap = q.y0 - r.y1; xOverlap > tol && gap > tol && gap < least) {
                const Box g{std::max(r.x0, q.x0), r.y1, std::min(r.x1, q.x1), q.y0};
                if (open(g)) return report(gap, things[a].name + " and " + things[b].name, g);
            }
        }
    }
    return std::nullopt;
}

} // namespace

std::vector<Diagnostic> footprintProblems(const Brief& brief) {
    std::vector<Diagnostic> out;
    if (!brief.footprint) return out;
    const Footprint fp = *brief.footprint;
    const double total = brief.totalTargetArea();
    const double available = fp.netArea(); // cut-outs are not building
    const std::string u = brief.units;
    if (total > available * (1.0 + 1e-9)) {
        Diagnostic d;
        d.severity = Severity::Error;
        d.code = DiagnosticCode::OverFootprint;
        d.message = "The rooms' target areas add up to " + formatNumber(total) + " " + u +
                    "\xC2\xB2, more than the footprint's " + formatNumber(available) + " " + u + "\xC2\xB2 (" +
                    formatNumber(fp.width) + " \xC3\x97 " + formatNumber(fp.depth) +
                    (fp.cutouts.empty() ? std::string() : std::string(" less its cut-outs")) +
                    "): enlarge the footprint or lower some targets.";
        out.push_back(d);
    }
    for (std::size_t i = 0; i < brief.rooms.size(); ++i) {
        const Room& room = brief.rooms[i];
        if (room.minWidth && *room.minWidth > std::max(fp.width, fp.depth)) {
            Diagnostic d;
            d.severity = Severity::Error;
            d.code = DiagnosticCode::WiderThanFootprint;
            d.message = room.displayName() + " needs a width of " + formatNumber(*room.minWidth) + " " + u +
                        ", wider than the footprint.";
            d.rooms = {static_cast<int>(i)};
            out.push_back(d);
        }
    }
    if (std::optional<Diagnostic> thin = thinPart(brief, fp, minContactLength)) out.push_back(*thin);
    // Every room is a rectangle beside the cut-outs and the rooms fixed in
    // place: one that cannot be as small as its band allows in the largest
    // such rectangle has no plan (it would have to be L-shaped).
    std::vector<Placement> taken;
    for (const Room& room : brief.rooms)
        if (room.fixed && !room.cutout) taken.push_back(*room.fixed);
    if (!fp.cutouts.empty() || !taken.empty()) {
        const Placement free = largestFreeRectangle(fp, taken);
        for (std::size_t i = 0; i < brief.rooms.size(); ++i) {
            const Room& room = brief.rooms[i];
            if (room.fixed || room.cutout) continue;
            const double least = room.area * (1 - room.tolerance());
            if (least <= free.area() * (1 + 1e-9)) continue;
            Diagnostic d;
            d.severity = Severity::Error;
            d.code = DiagnosticCode::NoRectangleFits;
            d.message = room.displayName() + " needs at least " + formatNumber(std::round(least * 100) / 100) + " " +
                        u + "\xC2\xB2 (its target less its band), but the largest rectangle beside the " +
                        (taken.empty() ? "cut-outs" : fp.cutouts.empty() ? "fixed rooms" : "cut-outs and fixed rooms") +
                        " is " + formatNumber(std::round(free.area() * 100) / 100) + " " + u + "\xC2\xB2 (" +
                        formatNumber(free.width) + " \xC3\x97 " + formatNumber(free.depth) + " " + u +
                        "): it would have to be L-shaped. Lower its target, move or free a fixed room, or change the "
                        "cut-outs.";
            d.rooms = {static_cast<int>(i)};
            out.push_back(d);
        }
    }
    // Rooms that wish one side only all need a stretch of that facade at
    // least their minimum width long (a room wider than its minimum on the
    // facade is fine; narrower is not).
    // Exterior wall facing each side: the outline's edges, building on their
    // left (cut-outs' walls included, facing away from the building).
    double facing[4] = {0, 0, 0, 0};
    for (const OutlineLoop& loop : footprintOutline(fp))
        for (std::size_t k = 0; k < loop.size(); ++k) {
            const auto& [x0, y0] = loop[k];
            const auto& [x1, y1] = loop[(k + 1) % loop.size()];
            const Side s = x1 > x0 ? Side::S : x1 < x0 ? Side::N : y1 > y0 ? Side::E : Side::W;
            facing[static_cast<int>(s)] += std::abs(x1 - x0) + std::abs(y1 - y0);
        }
    for (std::size_t i = 0; i < brief.rooms.size(); ++i) {
        const Room& room = brief.rooms[i];
        if (!room.fixed || room.cutout) continue;
        const double a = room.fixed->area(), dev = (a - room.area) / room.area;
        if (std::abs(dev) <= room.tolerance() + 1e-9) continue;
        Diagnostic d;
        d.severity = Severity::Warning;
        d.code = DiagnosticCode::FixedOffTarget;
        d.message = room.displayName() + " is fixed at " + formatNumber(room.fixed->width) + " \xC3\x97 " +
                    formatNumber(room.fixed->depth) + " = " + formatNumber(a) + " " + u + "\xC2\xB2, but its target is " +
                    formatNumber(room.area) + " " + u + "\xC2\xB2: set the target to what it is fixed at, or fix it larger or smaller.";
        d.rooms = {static_cast<int>(i)};
        out.push_back(d);
    }
    for (Side side : allSides) {
        const double length = facing[static_cast<int>(side)];
        double need = 0;
        std::vector<int> rooms;
        for (std::size_t i = 0; i < brief.rooms.size(); ++i) {
            const Room& room = brief.rooms[i];
            if (room.facade.anySide || room.facade.sides != (1u << static_cast<unsigned>(side)) || !room.minWidth)
                continue;
            need += *room.minWidth;
            rooms.push_back(static_cast<int>(i));
        }
        if (need <= length * (1 + 1e-9)) continue;
        static const char* names[] = {"north", "east", "south", "west"};
        Diagnostic d;
        d.severity = Severity::Warning;
        d.code = DiagnosticCode::FacadeTooShort;
        d.message = "The " + std::to_string(rooms.size()) + " rooms that wish the " + names[static_cast<int>(side)] +
                    " facade alone need " + formatNumber(need) + " " + u + " of it at their minimum widths; the facade is " +
                    formatNumber(length) + " " + u + ": lengthen it by " + formatNumber(std::ceil((need - length) * 100 - 1e-6) / 100) +
                    " " + u + ", narrow some rooms' minimum widths, or let some rooms take another side.";
        d.rooms = rooms;
        out.push_back(d);
    }
    return out;
}

} // namespace abut
