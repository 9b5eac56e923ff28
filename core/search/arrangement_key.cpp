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
    for (std::size_t i = 0; i < n; ++i)
        for (std::size_t j = 0; j < n; ++j) {
            if (i == j) continue;
            const Rect &a = rooms[i], &b = rooms[j];
            const double yOverlap = std::min(a.y1, b.y1) - std::max(a.y0, b.y0);
            const double xOverlap = std::min(a.x1, b.x1) - std::max(a.x0, b.x0);
            if (std::abs(a.x1 - b.x0) < tol && yOverlap > tol)
                relations.push_back(brief.rooms[i].id + "\x1fW\x1f" + brief.rooms[j].id);
            else if (std::abs(a.y1 - b.y0) < tol && xOverlap > tol)
                relations.push_back(brief.rooms[i].id + "\x1fS\x1f" + brief.rooms[j].id);
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
