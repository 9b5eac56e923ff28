// SPDX-License-Identifier: MIT
// DXF (AutoCAD R2000, AC1015) of a plan variant for CAD: each room a closed
// LWPOLYLINE on a layer per room category, its name and achieved area as
// TEXT inside it; spare spaces on their own layer; the footprint outline; and,
// when asked, walls as offset outlines. Units in $INSUNITS (6 metres, 2 feet).
// Written by hand: Debian's DXF library (libdxflib) is GPL-licensed, which
// would decide the project's licence for it. Kept to the tables, blocks and
// entities a reader needs; tests read it back with ezdxf and require its
// audit to report no errors and the polylines to equal the plan.
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <cstddef>
#include <string>

namespace abut {

struct DxfOptions {
    double wallThickness = 0.0; // m (or ft): 0 = rooms only; > 0 adds inner wall lines
    double textHeight = 0.0;    // 0 = chosen from the footprint size
};

std::string planDxf(const Brief& brief, const Footprint& footprint, const PlanVariant& v,
                    const DxfOptions& options = {});

// The longest string a group may hold: 255 characters (the DXF reference's
// limit for strings; longer ones are cut, with an ellipsis or a hash).
inline constexpr std::size_t dxfStringLimit = 255;

// Layer name of a room category: "ROOM-" + letters, digits, '-' and '_' only,
// at most dxfStringLimit characters (a longer one cut and told apart by a hash).
std::string dxfLayerOf(const std::string& category);

// A name as TEXT content: 7-bit, at most dxfStringLimit characters (cut
// short with "…"), with nothing a reader would take for a control code:
// backslashes as \U+005C, a percent sign before another as "%%%",
// non-ASCII as \U+XXXX, control characters left out.
std::string dxfText(const std::string& utf8);

} // namespace abut
