// SPDX-License-Identifier: MIT
// SVG 1.1 of a plan variant: one <rect> per room (class "room", id = room id)
// and per spare space (class "spare"), labels with name and achieved area,
// the footprint outline. North is up; 1 plan unit = `pixelsPerUnit` px.
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <string>

namespace abut {

std::string planSvg(const Brief& brief, const Footprint& footprint, const PlanVariant& v,
                    double pixelsPerUnit = 50.0);

} // namespace abut
