// SPDX-License-Identifier: MIT
#include "search/score.h"

#include <algorithm>
#include <cmath>

namespace abut {

double planScore(const Brief& brief, const Footprint& fp, const std::vector<Rect>& rooms,
                 const std::vector<Rect>& spaces, const RequirementReport& report) {
    const RequirementMisses& m = report.counts;
    double score = m.worstAreaError + 0.25 * report.meanAreaError;
    score += 1000.0 * m.must + 0.2 * m.should;
    score += 1.0 * (m.area + m.minWidth + m.maxAspect + m.facade);
    score += 1000.0 * m.fixed; // a room away from where it is fixed weighs like a dropped 'must'
    for (std::size_t i = 0; i < rooms.size() && i < brief.rooms.size(); ++i) {
        const Rect& r = rooms[i];
        const double aspect = std::max(r.width(), r.depth()) / std::min(r.width(), r.depth());
        if (brief.rooms[i].maxAspect && aspect > *brief.rooms[i].maxAspect)
            score += 0.1 * (aspect - *brief.rooms[i].maxAspect);
    }
    const double area = fp.width * fp.depth;
    double spare = 0;
    for (const Rect& r : spaces) spare += r.area();
    score += 0.2 * spare / area;
    double walls = 0;
    for (const Rect& r : rooms) walls += r.width() + r.depth();
    for (const Rect& r : spaces) walls += r.width() + r.depth();
    walls -= fp.width + fp.depth; // each interior wall is counted from both sides; the outline once
    score += 0.01 * walls / std::sqrt(area);
    return score;
}

} // namespace abut
