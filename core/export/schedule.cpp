// SPDX-License-Identifier: MIT
#include "export/schedule.h"

#include <cstdio>

namespace abut {

std::string areaUnit(const std::string& units) { return units == "ft" ? "ft²" : "m²"; }

AreaSchedule areaSchedule(const Brief& brief, const Footprint& fp, const PlanVariant& v) {
    AreaSchedule s;
    s.units = brief.units;
    s.footprintArea = fp.netArea(); // the building's, cut-outs taken off
    for (std::size_t i = 0; i < brief.rooms.size() && i < v.rooms.size(); ++i) {
        const Room& room = brief.rooms[i];
        if (room.cutout) continue;
        const Rect& r = v.rooms[i];
        ScheduleRow row;
        row.id = room.id;
        row.name = room.displayName();
        row.category = room.category;
        if (room.facade.anySide) row.facade = "any";
        for (Side side : allSides)
            if (room.facade.has(side)) row.facade += (row.facade.empty() ? "" : " ") + std::string(1, sideLetter(side));
        row.target = room.area;
        row.achieved = r.area();
        row.deviation = (row.achieved - row.target) / row.target;
        row.width = r.width();
        row.depth = r.depth();
        s.totalTarget += row.target;
        s.totalAchieved += row.achieved;
        s.rows.push_back(row);
    }
    for (const Rect& r : v.spaces) s.spareArea += r.area();
    return s;
}

namespace {

// A text cell: a leading '=', '+', '-', '@', tab or carriage return gets an
// apostrophe so that a spreadsheet shows it instead of running it as a
// formula (OWASP, "CSV Injection"); quoted when it holds a separator, a
// quote or a line break (RFC 4180).
std::string quoted(const std::string& text) {
    std::string field = text;
    if (!field.empty() && std::string("=+-@\t\r").find(field[0]) != std::string::npos) field.insert(0, 1, '\'');
    if (field.find_first_of(",\"\r\n") == std::string::npos) return field;
    std::string out = "\"";
    for (char c : field) out += c == '"' ? std::string("\"\"") : std::string(1, c);
    return out + "\"";
}

std::string number(double v, int decimals) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.*f", decimals, v);
    return buf;
}

} // namespace

std::string scheduleCsv(const AreaSchedule& s) {
    const std::string a = s.units == "ft" ? "ft2" : "m2";
    const std::string l = s.units;
    std::string out = "room,name,category,target_" + a + ",achieved_" + a + ",deviation_percent,width_" + l +
                      ",depth_" + l + ",facade\r\n";
    for (const ScheduleRow& r : s.rows)
        out += quoted(r.id) + "," + quoted(r.name) + "," + quoted(r.category) + "," + number(r.target, 2) + "," +
               number(r.achieved, 2) + "," + number(100.0 * r.deviation, 1) + "," + number(r.width, 2) + "," +
               number(r.depth, 2) + "," + quoted(r.facade) + "\r\n";
    out += "TOTAL,Rooms,," + number(s.totalTarget, 2) + "," + number(s.totalAchieved, 2) + "," +
           number(s.totalTarget > 0 ? 100.0 * (s.totalAchieved - s.totalTarget) / s.totalTarget : 0, 1) + ",,,\r\n";
    out += "SPARE,Spare spaces,,," + number(s.spareArea, 2) + ",,,,\r\n";
    out += "FOOTPRINT,Footprint,,," + number(s.footprintArea, 2) + ",,,,\r\n";
    return out;
}

} // namespace abut
