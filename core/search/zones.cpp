// SPDX-License-Identifier: MIT
#include "search/zones.h"

#include <algorithm>
#include <cctype>
#include <deque>
#include <map>
#include <numeric>
#include <set>
#include <tuple>

namespace abut {

bool isCirculation(const Room& room) {
    std::string cat = room.category;
    std::transform(cat.begin(), cat.end(), cat.begin(), [](unsigned char c) { return std::tolower(c); });
    return cat == "circulation";
}

bool isHubRoom(const Room& room, int mustDoors) {
    return mustDoors >= 3 || (isCirculation(room) && mustDoors >= 2);
}

std::vector<int> ZoneTree::allRooms(int z) const {
    std::vector<int> out, stack{z};
    while (!stack.empty()) {
        const int k = stack.back();
        stack.pop_back();
        out.insert(out.end(), zones[k].rooms.begin(), zones[k].rooms.end());
        stack.insert(stack.end(), zones[k].zones.begin(), zones[k].zones.end());
    }
    std::sort(out.begin(), out.end());
    return out;
}

bool ZoneTree::layered() const {
    if (zones.empty()) return false;
    const Zone& floor = zones[0];
    if (floor.zones.size() + floor.rooms.size() < 2) return false;
    return std::any_of(zones.begin() + 1, zones.end(), [](const Zone& z) { return z.rooms.size() + z.zones.size() >= 2; });
}

namespace {

using Zone = ZoneTree::Zone;

struct Graph {
    std::vector<std::vector<int>> must; // per room: rooms it must have a door to
    std::vector<int> degree;
};

Graph mustGraph(const Brief& brief) {
    Graph g;
    const std::size_t n = brief.rooms.size();
    g.must.resize(n);
    g.degree.assign(n, 0);
    for (const Adjacency& a : brief.adjacencies) {
        if (a.priority != Priority::Must || a.kind != AdjacencyKind::Door) continue;
        const int u = brief.roomIndex(a.a), v = brief.roomIndex(a.b);
        if (u < 0 || v < 0 || u == v) continue;
        g.must[u].push_back(v);
        g.must[v].push_back(u);
        ++g.degree[u], ++g.degree[v];
    }
    return g;
}

// Rooms planned as they are, never inside a zone: cut-outs and rooms fixed in place.
bool heldInPlace(const Room& r) { return r.cutout || r.fixed.has_value(); }

class Builder {
public:
    explicit Builder(const Brief& brief) : brief_(brief), g_(mustGraph(brief)) {
        const int n = static_cast<int>(brief.rooms.size());
        hub_.assign(n, false);
        for (int i = 0; i < n; ++i)
            hub_[i] = !heldInPlace(brief.rooms[i]) && brief.rooms[i].zone.empty() && isHubRoom(brief.rooms[i], g_.degree[i]);
        tree_.zones.push_back({});
        tree_.zoneOf.assign(n, 0);
    }

    ZoneTree build() {
        namedZones();
        assignToHubs();
        hubZones();
        nestSmallHubs();
        mergeRuns();
        absorbLoners();
        finish();
        return std::move(tree_);
    }

private:
    int addZone(int parent, int hub, std::string name) {
        Zone z;
        z.parent = parent;
        z.hub = hub;
        z.name = std::move(name);
        tree_.zones.push_back(std::move(z));
        return static_cast<int>(tree_.zones.size()) - 1;
    }

    // The planner's zones, in the order they first appear.
    void namedZones() {
        std::map<std::string, int> byName;
        for (int i = 0; i < static_cast<int>(brief_.rooms.size()); ++i) {
            const Room& r = brief_.rooms[i];
            if (r.zone.empty() || heldInPlace(r)) continue;
            auto it = byName.find(r.zone);
            if (it == byName.end()) it = byName.emplace(r.zone, addZone(0, -1, r.zone)).first;
            tree_.zoneOf[i] = it->second;
            placed_.push_back(i);
        }
    }

    bool free(int i) const {
        return tree_.zoneOf[i] == 0 && !hub_[i] && !heldInPlace(brief_.rooms[i]) && brief_.rooms[i].zone.empty();
    }

    // Breadth first from every hub at once over the rooms that are not
    // hubs: each room goes to the nearest hub, reached from `via_` (the hub
    // itself for a room that opens on it).
    void assignToHubs() {
        const int n = static_cast<int>(brief_.rooms.size());
        via_.assign(n, -1);
        owner_.assign(n, -1);
        std::deque<int> queue;
        for (int i = 0; i < n; ++i)
            if (hub_[i]) {
                owner_[i] = i;
                queue.push_back(i);
            }
        while (!queue.empty()) {
            const int u = queue.front();
            queue.pop_front();
            for (int v : g_.must[u]) {
                if (owner_[v] >= 0 || !free(v)) continue;
                owner_[v] = owner_[u];
                via_[v] = u;
                queue.push_back(v);
            }
        }
    }

    // A zone per hub; a room that opens on it with rooms reached through
    // it is a suite: a zone inside the hub's.
    // Hubs on a cycle of hubs (a ring of corridors): per hub, its ring (−1:
    // none). The hub–hub edges on no cycle are the bridges (Tarjan's low-link,
    // with an explicit stack); a ring is a connected part of the rest.
    void findRings() {
        const int n = static_cast<int>(brief_.rooms.size());
        std::vector<int> order(n, -1), low(n, 0);
        std::set<std::pair<int, int>> bridges;
        int time = 0;
        for (int root = 0; root < n; ++root) {
            if (!hub_[root] || order[root] >= 0) continue;
            std::vector<std::tuple<int, int, std::size_t>> stack{{root, -1, 0}}; // vertex, parent, next neighbour
            order[root] = low[root] = time++;
            while (!stack.empty()) {
                auto& [v, parent, next] = stack.back();
                if (next < g_.must[v].size()) {
                    const int u = g_.must[v][next++];
                    if (!hub_[u] || u == parent) continue;
                    if (order[u] < 0) {
                        order[u] = low[u] = time++;
                        stack.emplace_back(u, v, 0);
                    } else {
                        low[v] = std::min(low[v], order[u]);
                    }
                    continue;
                }
                const int done = v, up = parent;
                stack.pop_back();
                if (up >= 0) {
                    low[up] = std::min(low[up], low[done]);
                    if (low[done] > order[up]) bridges.insert(std::minmax(up, done));
                }
            }
        }
        ringOf_.assign(n, -1);
        int rings = 0;
        for (int h = 0; h < n; ++h) {
            if (!hub_[h] || ringOf_[h] >= 0) continue;
            std::vector<int> part{h}, members;
            std::set<int> seen{h};
            while (!part.empty()) {
                const int v = part.back();
                part.pop_back();
                members.push_back(v);
                for (int u : g_.must[v])
                    if (hub_[u] && !bridges.count(std::minmax(u, v)) && seen.insert(u).second) part.push_back(u);
            }
            if (members.size() < 3) continue;
            for (int v : members) ringOf_[v] = rings;
            ++rings;
        }
        innerZone_.assign(rings, -1);
    }

    // Whether rooms of `category` on ring `ring` face outwards: a third or
    // more of them wish a facade (patient rooms; the stores in the middle
    // wish none), so those that do not say so go outside too.
    bool outerCategory(int ring, const std::string& category) const {
        int all = 0, wishing = 0;
        for (int i = 0; i < static_cast<int>(brief_.rooms.size()); ++i) {
            if (owner_[i] < 0 || hub_[i] || ringOf_[owner_[i]] != ring || brief_.rooms[i].category != category) continue;
            ++all;
            wishing += !brief_.rooms[i].facade.empty();
        }
        return all > 0 && 3 * wishing >= all;
    }

    void hubZones() {
        const int n = static_cast<int>(brief_.rooms.size());
        findRings();
        hubZone_.assign(n, -1);
        for (int h = 0; h < n; ++h)
            if (hub_[h]) hubZone_[h] = addZone(0, h, "");
        std::vector<int> suiteOf(n, -1); // a client's suite zone
        for (int i = 0; i < n; ++i) {
            if (owner_[i] < 0 || hub_[i]) continue;
            // The client this room is reached through (itself when it opens on the hub).
            int c = i;
            while (!hub_[via_[c]]) c = via_[c];
            const bool hasInner = std::any_of(g_.must[c].begin(), g_.must[c].end(),
                                              [&](int o) { return via_[o] == c && !hub_[o]; });
            if (!hasInner && c == i) {
                // On a ring of corridors, a room that wishes no facade belongs
                // to the block the ring runs round, not to one side of it.
                const int ring = ringOf_.empty() ? -1 : ringOf_[owner_[i]];
                const Room& r = brief_.rooms[i];
                if (ring >= 0 && r.facade.empty() && !isCirculation(r) && !outerCategory(ring, r.category)) {
                    if (innerZone_[ring] < 0) innerZone_[ring] = addZone(0, -1, "");
                    tree_.zoneOf[i] = innerZone_[ring];
                } else {
                    tree_.zoneOf[i] = hubZone_[owner_[i]];
                }
                continue;
            }
            if (suiteOf[c] < 0) suiteOf[c] = addZone(hubZone_[owner_[i]], -1, "");
            tree_.zoneOf[i] = suiteOf[c];
        }
        for (int h = 0; h < n; ++h)
            if (hub_[h]) tree_.zoneOf[h] = hubZone_[h];
    }

    double zoneArea(int hub) const {
        double a = 0;
        for (int i = 0; i < static_cast<int>(brief_.rooms.size()); ++i)
            if (owner_[i] == hub) a += brief_.rooms[i].area;
        return a;
    }

    // A hub that opens on few other hubs goes inside the zone of the one
    // that opens on the most, when that one opens on clearly more and would
    // hold at least twice as much (a flat's hall or a suite's entry on a
    // corridor that meets others, not a corridor piece on a cross corridor),
    // or — two hubs alone — when its zone is much smaller (a hall on a lone corridor).
    // One level: only into a zone at the top.
    void nestSmallHubs() {
        const int n = static_cast<int>(brief_.rooms.size());
        std::vector<double> area(n, 0);
        std::vector<int> hubDegree(n, 0);
        for (int h = 0; h < n; ++h) {
            if (!hub_[h]) continue;
            area[h] = zoneArea(h);
            for (int v : g_.must[h]) hubDegree[h] += hub_[v] ? 1 : 0;
        }
        for (int h = 0; h < n; ++h) {
            if (!hub_[h] || hubDegree[h] == 0 || hubDegree[h] > 2) continue;
            int o = -1;
            for (int v : g_.must[h])
                if (hub_[v] && (o < 0 || hubDegree[v] > hubDegree[o] || (hubDegree[v] == hubDegree[o] && area[v] > area[o])))
                    o = v;
            // What each would hold with the hubs that hang off it alone.
            auto potential = [&](int k) {
                double a = area[k];
                for (int v : g_.must[k])
                    if (hub_[v] && v != h && hubDegree[v] == 1) a += area[v];
                return a;
            };
            const bool branch = hubDegree[o] >= hubDegree[h] + 2 && potential(h) <= 0.5 * potential(o);
            const bool smaller = hubDegree[h] == 1 && hubDegree[o] == 1 && area[h] <= 0.35 * area[o];
            if (branch || smaller) tree_.zones[hubZone_[h]].parent = hubZone_[o];
        }
        // No cycles (two hubs each nesting in the other): such a pair stays at the top.
        for (int h = 0; h < n; ++h) {
            if (!hub_[h]) continue;
            int z = tree_.zones[hubZone_[h]].parent, steps = 0;
            while (z != 0 && z != hubZone_[h] && steps++ < n) z = tree_.zones[z].parent;
            if (z != 0) tree_.zones[hubZone_[h]].parent = 0;
        }
        // Into a zone at the top only: a hub nested in a nested hub goes to its parent.
        for (int h = 0; h < n; ++h) {
            if (!hub_[h]) continue;
            int& parent = tree_.zones[hubZone_[h]].parent;
            while (parent != 0 && tree_.zones[parent].parent != 0) parent = tree_.zones[parent].parent;
        }
    }

    // Corridor pieces that follow one another — circulation hubs at the top
    // whose doors to each other form a path — are one run: one zone holding
    // every piece with all that opens on them, so that the corridor is laid
    // out as one line (search/detail/zone_plan.h) rather than piece by piece.
    void mergeRuns() {
        const int n = static_cast<int>(brief_.rooms.size());
        std::vector<char> cut(n, 0); // hubs a ring of corridors is broken at
        auto top = [&](int h) {
            return hub_[h] && !cut[h] && isCirculation(brief_.rooms[h]) && tree_.zones[hubZone_[h]].parent == 0;
        };
        // A hub that meets two others that meet each other (a hall or stair on
        // the joint of two pieces) hangs off them: into the zone of the one
        // holding more.
        std::vector<double> held(tree_.zones.size(), 0);
        for (int i = 0; i < n; ++i) held[topOf(tree_.zoneOf[i])] += brief_.rooms[i].area;
        for (bool again = true; again;) {
            again = false;
            for (int h = 0; h < n; ++h) {
                if (!top(h)) continue;
                std::vector<int> next;
                for (int u : g_.must[h])
                    if (top(u)) next.push_back(u);
                if (next.size() != 2) continue;
                const auto& a = g_.must[next[0]];
                if (std::find(a.begin(), a.end(), next[1]) == a.end()) continue;
                const int into = held[hubZone_[next[0]]] >= held[hubZone_[next[1]]] ? next[0] : next[1];
                tree_.zones[hubZone_[h]].parent = hubZone_[into];
                held[hubZone_[into]] += held[hubZone_[h]];
                again = true;
            }
        }
        // A ring of pieces (two runs joined by cross corridors, a ward's ring):
        // a component of the top circulation hubs in which each meets two
        // others; broken at its two smallest zones (the cross corridors) into runs.
        // The component of top circulation hubs through h (marked in `seen`),
        // and per member the top hubs it meets.
        auto component = [&](int h, std::vector<char>& seen, std::vector<int>& degree) {
            std::vector<int> part{h}, stack{h};
            seen[h] = 1;
            degree.clear();
            while (!stack.empty()) {
                const int v = stack.back();
                stack.pop_back();
                for (int u : g_.must[v]) {
                    if (!top(u)) continue;
                    if (!seen[u]) {
                        seen[u] = 1;
                        part.push_back(u);
                        stack.push_back(u);
                    }
                }
            }
            for (int v : part) degree.push_back(static_cast<int>(std::count_if(g_.must[v].begin(), g_.must[v].end(), top)));
            return part;
        };
        std::vector<int> degree;
        std::vector<char> visited(n, 0);
        for (int h = 0; h < n; ++h) {
            if (!top(h) || visited[h]) continue;
            std::vector<int> part = component(h, visited, degree);
            const bool twoEach = std::all_of(degree.begin(), degree.end(), [](int d) { return d == 2; });
            if (!twoEach || part.size() < 4) continue;
            std::sort(part.begin(), part.end(), [&](int a, int b) { return held[hubZone_[a]] < held[hubZone_[b]]; });
            cut[part[0]] = cut[part[1]] = 1;
        }
        std::vector<char> seen(n, 0);
        for (int h = 0; h < n; ++h) {
            if (!top(h) || seen[h]) continue;
            const std::vector<int> part = component(h, seen, degree);
            const int edges = std::accumulate(degree.begin(), degree.end(), 0) / 2;
            const int widest = *std::max_element(degree.begin(), degree.end());
            if (part.size() < 2 || widest > 2 || edges != static_cast<int>(part.size()) - 1) continue;
            // In order along the path, from an end.
            int end = part.front();
            for (std::size_t k = 0; k < part.size(); ++k)
                if (degree[k] == 1) {
                    end = part[k];
                    break;
                }
            std::vector<int> run{end};
            for (int prev = -1, v = end; run.size() < part.size();) {
                int next = -1;
                for (int u : g_.must[v])
                    if (top(u) && u != prev && std::find(run.begin(), run.end(), u) == run.end()) next = u;
                if (next < 0) break;
                prev = v;
                v = next;
                run.push_back(v);
            }
            const int zone = addZone(0, -1, "");
            tree_.zones[zone].run = run;
            for (int piece : run) {
                const int from = hubZone_[piece];
                for (int& z : tree_.zoneOf) z = z == from ? zone : z;
                for (Zone& child : tree_.zones)
                    if (child.parent == from) child.parent = zone;
                tree_.zones[from].parent = zone; // emptied; dropped by finish()
            }
        }
    }

    // The zone at the top a raw zone lies in (0 for the floor itself).
    int topOf(int z) const {
        while (z != 0 && tree_.zones[z].parent != 0) z = tree_.zones[z].parent;
        return z;
    }

    // A small zone or room at the top whose doors all lead into one other
    // zone at the top (a suite that opens on a stair inside a run) goes in
    // there: at the top it could sit anywhere along that zone, inside it
    // sits by the room it opens on.
    void absorbLoners() {
        const int n = static_cast<int>(brief_.rooms.size());
        std::vector<double> area(tree_.zones.size(), 0);
        for (int i = 0; i < n; ++i) area[topOf(tree_.zoneOf[i])] += brief_.rooms[i].area;
        auto target = [&](const std::vector<int>& rooms, int self) {
            int into = -1;
            for (int i : rooms)
                for (int u : g_.must[i]) {
                    const int t = topOf(tree_.zoneOf[u]);
                    if (t == self) continue;
                    if (t == 0 || (into >= 0 && into != t)) return -1;
                    into = t;
                }
            return into;
        };
        for (int z = 1; z < static_cast<int>(tree_.zones.size()); ++z) {
            if (tree_.zones[z].parent != 0) continue;
            std::vector<int> rooms;
            for (int i = 0; i < n; ++i)
                if (topOf(tree_.zoneOf[i]) == z) rooms.push_back(i);
            if (rooms.empty()) continue;
            const int into = target(rooms, z);
            if (into > 0 && area[z] < 0.5 * area[into]) tree_.zones[z].parent = into;
        }
        for (int i = 0; i < n; ++i) {
            if (tree_.zoneOf[i] != 0 || hub_[i] || heldInPlace(brief_.rooms[i])) continue;
            if (const int into = target({i}, 0); into > 0) tree_.zoneOf[i] = into;
        }
    }

    // Members and children from the assignments; empty zones dropped; zones
    // of a single room dissolved into their parent; areas summed.
    void finish() {
        std::vector<Zone>& z = tree_.zones;
        for (int i = 0; i < static_cast<int>(brief_.rooms.size()); ++i) z[tree_.zoneOf[i]].rooms.push_back(i);
        // Dissolve zones holding a single room and nothing else (deepest first).
        for (int k = static_cast<int>(z.size()) - 1; k > 0; --k) {
            int children = 0;
            for (int c = 1; c < static_cast<int>(z.size()); ++c) children += c != k && z[c].parent == k;
            if (z[k].rooms.size() + children == 1 && children == 0 && z[k].name.empty()) {
                const int room = z[k].rooms.front();
                z[k].rooms.clear();
                z[z[k].parent].rooms.push_back(room);
                tree_.zoneOf[room] = z[k].parent;
            }
        }
        // Renumber the zones that hold something, parents first (a parent's index is below its children's).
        std::vector<int> order{0}, index(z.size(), -1);
        index[0] = 0;
        for (std::size_t q = 0; q < order.size(); ++q)
            for (int c = 1; c < static_cast<int>(z.size()); ++c)
                if (z[c].parent == order[q] && index[c] < 0 && (!z[c].rooms.empty() || hasChildren(c))) {
                    index[c] = static_cast<int>(order.size());
                    order.push_back(c);
                }
        std::vector<Zone> out;
        for (int k : order) {
            Zone nz = z[k];
            nz.parent = k == 0 ? -1 : index[z[k].parent];
            nz.zones.clear();
            std::sort(nz.rooms.begin(), nz.rooms.end());
            out.push_back(std::move(nz));
        }
        for (int k = 1; k < static_cast<int>(out.size()); ++k) out[out[k].parent].zones.push_back(k);
        for (int& zo : tree_.zoneOf) zo = index[zo] >= 0 ? index[zo] : 0;
        tree_.zones = std::move(out);
        for (int k = static_cast<int>(tree_.zones.size()) - 1; k >= 0; --k) {
            Zone& zk = tree_.zones[k];
            zk.area = 0;
            for (int r : zk.rooms) zk.area += brief_.rooms[r].area;
            for (int c : zk.zones) zk.area += tree_.zones[c].area;
        }
        // A floor that is one zone: that zone is the floor.
        while (tree_.zones[0].rooms.empty() && tree_.zones[0].zones.size() == 1) {
            ZoneTree t;
            const int only = tree_.zones[0].zones.front();
            std::vector<int> map(tree_.zones.size(), -1);
            for (int k = only; k < static_cast<int>(tree_.zones.size()); ++k) {
                if (k != only && (tree_.zones[k].parent < 0 || map[tree_.zones[k].parent] < 0)) continue;
                map[k] = static_cast<int>(t.zones.size());
                Zone nz = tree_.zones[k];
                nz.parent = k == only ? -1 : map[nz.parent];
                nz.zones.clear();
                t.zones.push_back(std::move(nz));
            }
            for (int k = 1; k < static_cast<int>(t.zones.size()); ++k) t.zones[t.zones[k].parent].zones.push_back(k);
            t.zoneOf = tree_.zoneOf;
            for (int& zo : t.zoneOf) zo = map[zo];
            tree_ = std::move(t);
        }
    }

    bool hasChildren(int k) const {
        for (int c = 1; c < static_cast<int>(tree_.zones.size()); ++c)
            if (c != k && tree_.zones[c].parent == k && (!tree_.zones[c].rooms.empty() || hasChildren(c))) return true;
        return false;
    }

    const Brief& brief_;
    Graph g_;
    std::vector<char> hub_;
    std::vector<int> via_, owner_, hubZone_, placed_, ringOf_, innerZone_;
    ZoneTree tree_;
};

} // namespace

ZoneTree formZones(const Brief& brief) {
    ZoneTree t = Builder(brief).build();
    // Every room in exactly one zone, and there as zoneOf says; else (a bug)
    // the floor is planned as one zone.
    std::vector<int> seen(brief.rooms.size(), 0);
    bool whole = t.zoneOf.size() == brief.rooms.size();
    for (std::size_t k = 0; k < t.zones.size() && whole; ++k)
        for (int r : t.zones[k].rooms) whole = whole && ++seen[r] == 1 && t.zoneOf[r] == static_cast<int>(k);
    whole = whole && std::all_of(seen.begin(), seen.end(), [](int n) { return n == 1; });
    if (whole) return t;
    ZoneTree flat;
    flat.zones.resize(1);
    for (int i = 0; i < static_cast<int>(brief.rooms.size()); ++i) {
        flat.zones[0].rooms.push_back(i);
        flat.zones[0].area += brief.rooms[i].area;
    }
    flat.zoneOf.assign(brief.rooms.size(), 0);
    return flat;
}

} // namespace abut
