// SPDX-License-Identifier: MIT
// Whether the brief's numbers fit its footprint at all: the rooms' targets
// must not add up to more than the footprint's area, and no room may need to
// be wider than the footprint. Such a brief is still a valid file (the
// planner may be half-way through editing it); these are problems to report
// beside the plan, not reasons to refuse the file. O(rooms).
#pragma once

#include "brief/brief.h"
#include "diagnostics.h"

#include <vector>

namespace abut {

// Error diagnostics, codes OverFootprint and WiderThanFootprint; a
// warning FacadeTooShort when the rooms that wish one side alone need
// more of it at their minimum widths than it is long.
std::vector<Diagnostic> footprintProblems(const Brief& brief);

} // namespace abut
