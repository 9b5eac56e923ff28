// SPDX-License-Identifier: MIT
#include "augment/corner_assignment.h"

#include <algorithm>

namespace abut {

std::array<std::vector<int>, 4> sidesOf(const std::vector<int>& cycle, const CornerAssignment& a) {
    const int k = static_cast<int>(cycle.size());
    std::array<std::vector<int>, 4> sides;
    for (int s = 0; s < 4; ++s) {
        const int from = a.corner[s];
        const int to = s < 3 ? a.corner[s + 1] : a.corner[0] + k;
        for (int p = from; p <= to; ++p) sides[s].push_back(cycle[p % k]);
    }
    return sides;
}

CornerSearch cornerAssignments(const PlaneGraph& g, const std::vector<int>& cycle,
                               const std::vector<FacadeWish>& wish, int limit) {
    CornerSearch out;
    const int k = static_cast<int>(cycle.size());
    if (k < 3) return out;
    std::vector<int> pos(g.vertexCount(), -1);
    for (int i = 0; i < k; ++i) pos[cycle[i]] = i;

    // reach[i]: the longest span s such that positions i..i+s hold no two
    // rooms joined by a chord of the cycle. At most k − 2: a side of span
    // k − 1 would hold both ends of a cycle edge without holding that edge.
    std::vector<int> reach(k, k - 2);
    for (int i = 0; i < k; ++i) {
        const int u = cycle[i];
        for (int w : g.neighbours(u)) {
            const int j = pos[w];
            if (j < 0) continue;
            const int d = (j - i + k) % k;
            if (d == 1 || d == k - 1) continue; // an edge of the cycle
            // Chord u–w: a side starting at or before i must stop before j.
            for (int start = 0; start < k; ++start) {
                const int toI = (i - start + k) % k, toJ = (j - start + k) % k;
                if (toI < toJ) reach[start] = std::min(reach[start], toJ - 1);
            }
        }
    }
    // Cycle positions each side must cover.
    std::array<std::vector<int>, 4> needs;
    for (int i = 0; i < k; ++i) {
        const int v = cycle[i];
        if (v >= static_cast<int>(wish.size())) continue;
        for (Side s : allSides)
            if (wish[v].has(s)) needs[static_cast<int>(s)].push_back(i);
    }
    // Does the side starting at cycle position `from` and spanning `span`
    // further positions hold every room that wishes it?
    auto covers = [&](int side, int from, int span) {
        for (int p : needs[side])
            if ((p - from % k + k) % k > span) return false;
        return true;
    };
    for (int nw = 0; nw < k; ++nw) {
        for (int ne = nw; ne <= nw + reach[nw]; ++ne) {
            if (!covers(0, nw, ne - nw)) continue;
            for (int se = ne; se <= ne + reach[ne % k] && se <= nw + k; ++se) {
                if (!covers(1, ne, se - ne)) continue;
                for (int sw = se; sw <= se + reach[se % k] && sw <= nw + k; ++sw) {
                    const int westSpan = nw + k - sw;
                    if (westSpan > reach[sw % k]) continue;
                    if (!covers(2, se, sw - se) || !covers(3, sw, westSpan)) continue;
                    // Two empty sides in a row would put one room on all four.
                    const int span[4] = {ne - nw, se - ne, sw - se, westSpan};
                    bool fourSided = false;
                    for (int s = 0; s < 4; ++s) fourSided = fourSided || (span[s] == 0 && span[(s + 1) % 4] == 0);
                    if (fourSided) continue;
                    out.assignments.push_back({{nw, ne, se, sw}});
                    if (static_cast<int>(out.assignments.size()) >= limit) {
                        out.truncated = true;
                        return out;
                    }
                }
            }
        }
    }
    return out;
}

} // namespace abut
