#include "brief/footprint_check.h"

#include <algorithm>
#include <sstream>

namespace abut {

namespace {
std::string formatNumber(double v) {
    std::ostringstream ss;
    ss << v;
    return ss.str();
}
} // namespace

std::vector<Diagnostic> footprintProblems(const Brief& brief) {
    std::vector<Diagnostic> out;
    if (!brief.footprint) return out;
    const Footprint fp = *brief.footprint;
    const double total = brief.totalTargetArea();
    const double available = fp.width * fp.depth;
    const std::string u = brief.units;
    if (total > available * (1.0 + 1e-9)) {
        Diagnostic d;
        d.severity = Severity::Error;
        d.code = "over-footprint";
        d.message = "The rooms' target areas add up to " + formatNumber(total) + " " + u +
                    "\xC2\xB2, more than the footprint's " + formatNumber(available) + " " + u + "\xC2\xB2 (" +
                    formatNumber(fp.width) + " \xC3\x97 " + formatNumber(fp.depth) +
                    "): enlarge the footprint or lower some targets.";
        out.push_back(d);
    }
    for (std::size_t i = 0; i < brief.rooms.size(); ++i) {
        const Room& room = brief.rooms[i];
        if (room.minWidth && *room.minWidth > std::max(fp.width, fp.depth)) {
            Diagnostic d;
            d.severity = Severity::Error;
            d.code = "wider-than-footprint";
            d.message = room.displayName() + " needs a width of " + formatNumber(*room.minWidth) + " " + u +
                        ", wider than the footprint.";
            d.rooms = {static_cast<int>(i)};
            out.push_back(d);
        }
    }
    return out;
}

} // namespace abut
