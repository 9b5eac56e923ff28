// SPDX-License-Identifier: MIT
#include "brief/footprint_check.h"

#include "brief/brief_rules.h"

#include <algorithm>
#include <cmath>
#include <sstream>

namespace abut {

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
