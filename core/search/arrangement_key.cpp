// SPDX-License-Identifier: MIT
#include "search/arrangement_key.h"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <cstdio>

namespace abut {

std::string arrangementKey(const Brief& brief, const std::vector<Rect>& rooms) {
    const double tol = 1e-6;
    std::vector<std::string> relations;
    const std::size_t n = std::min(brief.rooms.size(), rooms.size());
    // Every ordered pair (i, j) where i's east side lies on j's west side
    // ("W") or else i's north side on j's south side ("S"), with a common
    // stretch: found by sorting the west and south sides and looking up each
    // room's east and north side, O(n log n + pairs) rather than all n² pairs.
    std::vector<std::size_t> byWest(n), bySouth(n);
    for (std::size_t i = 0; i < n; ++i) byWest[i] = bySouth[i] = i;
    std::sort(byWest.begin(), byWest.end(), [&](std::size_t a, std::size_t b) { return rooms[a].x0 < rooms[b].x0; });
    std::sort(bySouth.begin(), bySouth.end(), [&](std::size_t a, std::size_t b) { return rooms[a].y0 < rooms[b].y0; });
    auto touchesEast = [&](std::size_t i, std::size_t j) {
        const Rect &a = rooms[i], &b = rooms[j];
        return std::abs(a.x1 - b.x0) < tol && std::min(a.y1, b.y1) - std::max(a.y0, b.y0) > tol;
    };
    for (std::size_t i = 0; i < n; ++i) {
        const Rect& a = rooms[i];
        auto from = std::lower_bound(byWest.begin(), byWest.end(), a.x1 - tol,
                                     [&](std::size_t k, double v) { return rooms[k].x0 < v; });
        for (auto it = from; it != byWest.end() && rooms[*it].x0 < a.x1 + tol; ++it)
            if (*it != i && touchesEast(i, *it)) relations.push_back(brief.rooms[i].id + "\x1fW\x1f" + brief.rooms[*it].id);
        from = std::lower_bound(bySouth.begin(), bySouth.end(), a.y1 - tol,
                                [&](std::size_t k, double v) { return rooms[k].y0 < v; });
        for (auto it = from; it != bySouth.end() && rooms[*it].y0 < a.y1 + tol; ++it) {
            const std::size_t j = *it;
            const Rect& b = rooms[j];
            if (j != i && !touchesEast(i, j) && std::abs(a.y1 - b.y0) < tol &&
                std::min(a.x1, b.x1) - std::max(a.x0, b.x0) > tol)
                relations.push_back(brief.rooms[i].id + "\x1fS\x1f" + brief.rooms[j].id);
        }
    }
    std::sort(relations.begin(), relations.end());
    std::uint64_t h = 1469598103934665603ull;
    for (const std::string& r : relations) {
        for (unsigned char c : r) {
            h ^= c;
            h *= 1099511628211ull;
        }
        h ^= 0x1e;
        h *= 1099511628211ull;
    }
    char buf[17];
    std::snprintf(buf, sizeof buf, "%016llx", static_cast<unsigned long long>(h));
    return buf;
}

} // namespace abut
