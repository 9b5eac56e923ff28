// SPDX-License-Identifier: MIT
#include "brief/brief_rules.h"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdio>
#include <sstream>

namespace abut {

namespace {

std::string number(double v) { return formatNumber(v); }

bool inside(const Placement& p, const Footprint& fp) {
    const double tol = 1e-9 * std::max(fp.width, fp.depth);
    return p.x >= -tol && p.y >= -tol && p.x + p.width <= fp.width + tol && p.y + p.depth <= fp.depth + tol;
}

double placeTolerance(const Footprint& fp) { return 1e-6 * std::max(fp.width, fp.depth); }

} // namespace

std::string formatNumber(double v) {
    std::ostringstream ss;
    ss << v;
    return ss.str();
}

std::string numberProblem(double v, const std::string& what, double atLeast, double atMost) {
    if (!std::isfinite(v)) return what + " must be a finite number";
    if (v <= 0.0 && atLeast > 0.0 && atLeast < 1.0) return what + " must be greater than 0, got " + number(v);
    if (v < atLeast) return what + " must be at least " + number(atLeast) + ", got " + number(v);
    if (v > atMost) return what + " must be at most " + number(atMost) + ", got " + number(v);
    return {};
}

std::string textProblem(const std::string& text, const std::string& what) {
    char32_t cp = 0;
    const std::size_t at = controlCharacterAt(text, &cp);
    if (at == std::string::npos) return {};
    char code[12];
    std::snprintf(code, sizeof code, "U+%04X", static_cast<unsigned>(cp));
    // Counted in characters, not bytes (continuation bytes are not counted).
    std::size_t character = 1;
    for (std::size_t i = 0; i < at; ++i)
        if ((static_cast<unsigned char>(text[i]) & 0xC0) != 0x80) ++character;
    const bool lineBreak = cp == 0x85 || cp == 0x2028 || cp == 0x2029;
    return what + " holds " + (lineBreak ? "a line break" : "a control character") + " (" + code +
           ") at character " + std::to_string(character) + "; use plain text on one line";
}

std::string doorWidthProblem(double w, const Footprint& fp) {
    if (w <= std::min(fp.width, fp.depth)) return {};
    return "doorWidth " + number(w) + " is wider than the footprint's shorter side (" +
           number(std::min(fp.width, fp.depth)) + ")";
}

std::string cutoutProblem(const Footprint& fp, std::size_t k) {
    const Placement& c = fp.cutouts[k];
    const std::string name = "cut-out " + std::to_string(k + 1);
    if (!inside(c, fp))
        return name + " reaches past the footprint (" + number(fp.width) + " × " + number(fp.depth) + "): it ends at x " +
               number(c.x + c.width) + ", y " + number(c.y + c.depth);
    for (std::size_t i = 0; i < k; ++i)
        if (overlaps(c, fp.cutouts[i], placeTolerance(fp)))
            return name + " overlaps cut-out " + std::to_string(i + 1) + "; draw the part they share once";
    double net = fp.width * fp.depth;
    for (std::size_t i = 0; i <= k; ++i) net -= fp.cutouts[i].area();
    const double tol = placeTolerance(fp);
    if (net <= tol * tol) return "the cut-outs leave nothing of the footprint to build on";
    return {};
}

std::string splitProblem(const Footprint& fp, std::size_t* which) {
    if (fp.cutouts.empty() || isConnected(fp)) return {};
    Footprint upTo = fp;
    for (std::size_t k = 0; k < fp.cutouts.size(); ++k) {
        upTo.cutouts.assign(fp.cutouts.begin(), fp.cutouts.begin() + static_cast<long>(k) + 1);
        if (isConnected(upTo)) continue;
        if (which) *which = k;
        return "cut-out " + std::to_string(k + 1) +
               " splits the footprint in two; a plan is one piece (make it smaller or move it to an edge)";
    }
    if (which) *which = fp.cutouts.size() - 1;
    return "the cut-outs split the footprint in two; a plan is one piece (make one smaller or move it to an edge)";
}

std::string fixedRoomProblem(const Brief& brief, std::size_t i) {
    const Room& r = brief.rooms[i];
    const std::string name = "room \"" + r.id + "\"";
    if (!brief.footprint) return "a fixed room needs a footprint to be placed in; give \"footprint\" a width and depth";
    const Footprint& fp = *brief.footprint;
    const Placement& p = *r.fixed;
    if (!inside(p, fp))
        return name + " is fixed past the footprint (" + number(fp.width) + " × " + number(fp.depth) + "): it ends at x " +
               number(p.x + p.width) + ", y " + number(p.y + p.depth);
    for (std::size_t k = 0; k < fp.cutouts.size(); ++k)
        if (overlaps(p, fp.cutouts[k], placeTolerance(fp)))
            return name + " is fixed over cut-out " + std::to_string(k + 1) + " of the footprint, which is not building";
    for (std::size_t j = 0; j < i; ++j)
        if (brief.rooms[j].fixed && !brief.rooms[j].cutout && overlaps(p, *brief.rooms[j].fixed, placeTolerance(fp)))
            return name + " is fixed where room \"" + brief.rooms[j].id + "\" is fixed; two rooms cannot share floor";
    return {};
}

std::string placementProblem(const Brief& brief) {
    if (brief.footprint)
    {
        for (std::size_t k = 0; k < brief.footprint->cutouts.size(); ++k)
            if (std::string p = cutoutProblem(*brief.footprint, k); !p.empty()) return asSentence(p);
        if (std::string p = splitProblem(*brief.footprint); !p.empty()) return asSentence(p);
    }
    for (std::size_t i = 0; i < brief.rooms.size(); ++i)
        if (brief.rooms[i].fixed && !brief.rooms[i].cutout)
            if (std::string p = fixedRoomProblem(brief, i); !p.empty()) return asSentence(p);
    return {};
}

std::string asSentence(std::string problem) {
    if (problem.empty()) return problem;
    problem[0] = static_cast<char>(std::toupper(static_cast<unsigned char>(problem[0])));
    if (problem.back() != '.') problem += '.';
    return problem;
}

} // namespace abut
