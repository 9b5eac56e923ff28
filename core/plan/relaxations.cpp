#include "plan/relaxations.h"

#include "plan/plan_builder.h"
#include "plan/unmet.h"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <set>

namespace abut {

namespace {

std::string num(double v) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.2f", v);
    std::string s = buf;
    while (!s.empty() && s.back() == '0') s.pop_back();
    if (!s.empty() && s.back() == '.') s.pop_back();
    return s;
}

std::string facadeJson(const FacadeWish& f) {
    if (f.anySide) return "[\"any\"]";
    std::string out = "[";
    for (Side s : allSides)
        if (f.has(s)) out += std::string(out.size() > 1 ? ", " : "") + "\"" + sideLetter(s) + "\"";
    return out + "]";
}

struct Verifier {
    const Footprint& fp;
    const PlanVariant& v;
    std::set<std::string> before; // field + requirement of every item missed now

    static std::string key(const UnmetItem& u) { return u.field + "#" + u.requirement; }

    // How many of the missed requirements `changed` (and `changedFp`) meets
    // on the same arrangement, re-sized: 0 unless `item` is among them and
    // nothing met before is missed now.
    // With `strict` false, only the count matters: fewer misses than now.
    int meets(const Brief& changed, const Footprint& changedFp, const UnmetItem& item, bool strict = true) const {
        SizingOptions o = planSizingOptions(changed);
        const SizingProblem problem(changed, v.extended, v.labeling, changedFp, o);
        SizingResult r;
        if (changedFp == fp) {
            const SizingResult start = problem.stateOf(vertexRects(v));
            r = problem.solve(&start);
        } else {
            r = problem.solve();
        }
        const PlanVariant after = applySizing(changed, changedFp, v, r);
        const std::vector<UnmetItem> left = unmetRequirements(changed, changedFp, after);
        if (!strict) return std::max(0, static_cast<int>(before.size()) - static_cast<int>(left.size()));
        for (const UnmetItem& u : left) {
            if (key(u) == key(item)) return 0;
            if (!before.count(key(u))) return 0; // something new given up
        }
        return static_cast<int>(before.size() - left.size());
    }
};

} // namespace

std::vector<Relaxation> relaxationsFor(const Brief& given, const Footprint& fp, const PlanVariant& v, int limit,
                                       double seconds) {
    std::vector<Relaxation> out;
    const auto started = std::chrono::steady_clock::now();
    auto inTime = [&] {
        return seconds <= 0 ||
               std::chrono::duration<double>(std::chrono::steady_clock::now() - started).count() < seconds;
    };
    const Brief brief = plannedBrief(given);
    const std::vector<UnmetItem> items = unmetRequirements(given, fp, v);
    if (items.empty() || v.rooms.size() != brief.rooms.size() || v.extended.graph.vertexCount() == 0) return out;
    Verifier check{fp, v, {}};
    for (const UnmetItem& u : items) check.before.insert(Verifier::key(u));
    const std::string& unit = brief.units;
    // Targets over the footprint: the footprint just large enough, either way.
    const double total = given.totalTargetArea(), area = fp.width * fp.depth;
    if (given.footprint && total > area * (1 + 1e-9)) {
        std::vector<std::pair<int, Relaxation>> global;
        for (const bool wide : {true, false}) {
            Footprint f = fp;
            (wide ? f.width : f.depth) = std::ceil(total / (wide ? fp.depth : fp.width) * 100 - 1e-6) / 100;
            Brief b = given;
            b.footprint = f;
            b = plannedBrief(b);
            // What counts here is how many fewer requirements are missed.
            const int n = check.meets(b, f, items.front(), /*strict=*/false);
            if (n == 0) continue;
            const double was = wide ? fp.width : fp.depth, now = wide ? f.width : f.depth;
            global.push_back({n, {wide ? "/footprint/width" : "/footprint/depth", num(was), num(now),
                                  std::string("Footprint ") + (wide ? "width " : "depth ") + num(now) + " " + unit +
                                      " instead of " + num(was) + ", so that the targets fit",
                                  "the targets add up to " + num(total) + " " + unit + "\xC2\xB2, more than the footprint's " +
                                      num(area) + " " + unit + "\xC2\xB2",
                                  now / was - 1}});
        }
        std::stable_sort(global.begin(), global.end(), [](const auto& a, const auto& b) {
            return a.first != b.first ? a.first > b.first : a.second.change < b.second.change;
        });
        for (auto& [n, r] : global) out.push_back(std::move(r));
    }
    int tried = 0;
    bool footprintTried = false;
    for (const UnmetItem& item : items) {
        if (static_cast<int>(out.size()) >= limit || ++tried > 8 || !inTime()) break;
        std::vector<Relaxation> found;
        std::vector<int> fixes; // per entry of `found`: missed requirements it meets
        const int i = item.rooms.empty() ? -1 : item.rooms.front();
        const std::string name = i >= 0 ? brief.rooms[i].displayName() : std::string();
        // The room's own numbers.
        // (With `surplus: spread` a target is not what the room gets: no such suggestion.)
        if (item.requirement == "area" && i >= 0 && given.surplus != Surplus::Spread) {
            Brief b = brief;
            b.rooms[i].area = std::round(item.got * 10) / 10;
            if (const int n = check.meets(b, fp, item); n > 0 && (fixes.push_back(n), true))
                found.push_back({item.field, num(given.rooms[i].area), num(b.rooms[i].area),
                                 name + ": target " + num(b.rooms[i].area) + " " + unit + "\xC2\xB2 instead of " +
                                     num(given.rooms[i].area),
                                 item.text, std::abs(b.rooms[i].area - brief.rooms[i].area) / brief.rooms[i].area});
        }
        if (item.requirement == "minWidth" && i >= 0) {
            Brief b = brief;
            b.rooms[i].minWidth = std::floor(item.got * 20) / 20;
            if (const int n = *b.rooms[i].minWidth > 0 ? check.meets(b, fp, item) : 0; n > 0 && (fixes.push_back(n), true))
                found.push_back({item.field, num(*brief.rooms[i].minWidth), num(*b.rooms[i].minWidth),
                                 name + ": minimum width " + num(*b.rooms[i].minWidth) + " " + unit + " instead of " +
                                     num(*brief.rooms[i].minWidth),
                                 item.text, 1 - *b.rooms[i].minWidth / *brief.rooms[i].minWidth});
        }
        if (item.requirement == "maxAspect" && i >= 0) {
            Brief b = brief;
            b.rooms[i].maxAspect = std::ceil(item.got * 10) / 10;
            if (const int n = check.meets(b, fp, item); n > 0 && (fixes.push_back(n), true))
                found.push_back({item.field, num(*brief.rooms[i].maxAspect), num(*b.rooms[i].maxAspect),
                                 name + ": aspect limit 1:" + num(*b.rooms[i].maxAspect) + " instead of 1:" +
                                     num(*brief.rooms[i].maxAspect),
                                 item.text, *b.rooms[i].maxAspect / *brief.rooms[i].maxAspect - 1});
        }
        // The footprint, when the brief gives one: the smallest of a few steps
        // (tried for the first requirement it could meet only: eight sizings).
        if (given.footprint && !footprintTried && item.requirement != "facade" && item.requirement != "adjacency") {
            footprintTried = true;
            for (const bool wide : {true, false}) {
                for (double step : {0.02, 0.05, 0.1, 0.2}) {
                    Footprint f = fp;
                    (wide ? f.width : f.depth) = std::round((wide ? fp.width : fp.depth) * (1 + step) * 100) / 100;
                    Brief b = given;
                    b.footprint = f;
                    b = plannedBrief(b); // with `surplus: spread` the targets follow the footprint
                    const int n = check.meets(b, f, item);
                    if (n == 0) continue;
                    fixes.push_back(n);
                    const double was = wide ? fp.width : fp.depth, now = wide ? f.width : f.depth;
                    found.push_back({wide ? "/footprint/width" : "/footprint/depth", num(was), num(now),
                                     std::string("Footprint ") + (wide ? "width " : "depth ") + num(now) + " " + unit +
                                         " instead of " + num(was),
                                     item.text, now / was - 1});
                    break;
                }
            }
        }
        // Giving something up.
        if (item.requirement == "facade" && i >= 0 && (fixes.push_back(1), true))
            found.push_back({item.field, facadeJson(brief.rooms[i].facade), "[]",
                             name + ": give up the facade wish", item.text, 1});
        if (item.requirement == "adjacency" && item.adjacency >= 0 && (fixes.push_back(1), true))
            found.push_back({item.field + "/priority", "\"must\"", "\"should\"",
                             item.text.substr(0, item.text.find(':')) + ": make the adjacency 'should'", item.text, 1});
        // The change that meets the most first (a footprint that is too
        // small: the footprint, not one room), then the smallest change.
        std::vector<std::size_t> order(found.size());
        for (std::size_t k = 0; k < order.size(); ++k) order[k] = k;
        std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
            return fixes[a] != fixes[b] ? fixes[a] > fixes[b] : found[a].change < found[b].change;
        });
        for (std::size_t k : order)
            if (static_cast<int>(out.size()) < limit) out.push_back(found[k]);
    }
    return out;
}

} // namespace abut
