// SPDX-License-Identifier: MIT
// The area schedule of a plan variant: one row per room, target against
// achieved, plus totals. Shared by the CSV, DXF, SVG and PDF writers.
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <string>
#include <vector>

namespace abut {

struct ScheduleRow {
    std::string id, name, category, facade;
    double target = 0, achieved = 0, deviation = 0; // deviation relative, (achieved − target)/target
    double width = 0, depth = 0;                    // width east–west, depth north–south
};

struct AreaSchedule {
    std::string units;
    std::vector<ScheduleRow> rows;
    double totalTarget = 0, totalAchieved = 0, spareArea = 0, footprintArea = 0;
};

AreaSchedule areaSchedule(const Brief& brief, const Footprint& footprint, const PlanVariant& v);

// "m²" or "ft²".
std::string areaUnit(const std::string& units);

// CSV with a header row, one room per row, then a totals row (RFC 4180 quoting).
std::string scheduleCsv(const AreaSchedule& s);

} // namespace abut
