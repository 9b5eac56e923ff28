// SPDX-License-Identifier: MIT
// The rules a brief's fields keep, with one wording for every place that
// checks them: the project reader (which adds the file, line and JSON
// pointer) and the edits of the editor and the CSV import (which start the
// sentence with a capital and end it with a full stop). Each returns what
// is wrong, or an empty string. O(1) unless said.
#pragma once

#include "brief/brief.h"

#include <string>

namespace abut {

// A number as the rules and the diagnostics write it: the shortest form
// (ostream's default, six significant digits), e.g. 0.001, 1e+08, 12.5.
std::string formatNumber(double v);

// A finite number in [atLeast, atMost]; a positive `atLeast` below 1 (a
// plausible minimum such as 0.001) is said as "greater than 0" for values up
// to 0, e.g. "area must be greater than 0, got -3", "maxAspect must be at
// least 1, got 0.5".
std::string numberProblem(double value, const std::string& what, double atLeast, double atMost);

// Plain text on one line: no control characters (tabs and line breaks
// included), e.g. "name holds a control character (U+0009) at character 4;
// use plain text on one line". O(length).
std::string textProblem(const std::string& text, const std::string& what);

// A door wall no longer than the footprint's shorter side.
std::string doorWidthProblem(double doorWidth, const Footprint& fp);

// Cut-out `k` of `fp` against the footprint and the cut-outs before it: past
// the footprint, overlapping one, leaving nothing with those before it. O(k).
std::string cutoutProblem(const Footprint& fp, std::size_t k);

// Whether the cut-outs split the footprint; `which` gets the first cut-out
// that does. O(c³) when they do not (one check), O(c⁴) to name it when they do.
std::string splitProblem(const Footprint& fp, std::size_t* which = nullptr);

// Room `i` of `brief`, fixed: inside the footprint, on no cut-out, on no
// fixed room before it (its `fixed` must be set). O(rooms + cut-outs).
std::string fixedRoomProblem(const Brief& brief, std::size_t i);

// The first problem of the footprint's cut-outs and the fixed rooms (a fixed
// room without a footprint included), as the edits report it.
std::string placementProblem(const Brief& brief);

// "name holds…" → "Name holds….": the edits' sentences.
std::string asSentence(std::string problem);

} // namespace abut
