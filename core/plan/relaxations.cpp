// SPDX-License-Identifier: MIT
#include "plan/relaxations.h"

#include "plan/plan_builder.h"
#include "plan/unmet.h"
#include "search/requirements.h"

#include <nlohmann/json.hpp>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <map>
#include <set>

namespace abut {

namespace {

using Clock = std::chrono::steady_clock;

std::string num(double v) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.2f", v);
    std::string s = buf;
    while (!s.empty() && s.back() == '0') s.pop_back();
    if (!s.empty() && s.back() == '.') s.pop_back();
    return s;
}

const char* sideWord(Side s) {
    switch (s) {
    case Side::N: return "north";
    case Side::E: return "east";
    case Side::S: return "south";
    default: return "west";
    }
}

std::string facadeJson(const FacadeWish& f) {
    if (f.anySide) return "[\"any\"]";
    std::string out = "[";
    for (Side s : allSides)
        if (f.has(s)) out += std::string(out.size() > 1 ? ", " : "") + "\"" + sideLetter(s) + "\"";
    return out + "]";
}

std::string facadeWords(const FacadeWish& f) {
    if (f.anySide) return "an outside wall";
    std::string out;
    for (Side s : allSides)
        if (f.has(s)) out += std::string(out.empty() ? "the " : " and the ") + sideWord(s) + " facade";
    return out;
}

std::string adjacencyJson(const Adjacency& a, Priority p) {
    nlohmann::ordered_json j = {{"rooms", {a.a, a.b}}, {"kind", toString(a.kind)}, {"priority", toString(p)}};
    return j.dump();
}

// Checks a changed brief against the variant's misses: first by sizing the
// same arrangement again, then (when allowed and time is left) by a short
// re-plan, for changes one arrangement cannot absorb (a target doubled, a
// footprint grown by more than its slack).
struct Verifier {
    const Footprint& fp;
    const PlanVariant& v;
    std::set<std::string> before; // field + requirement of every item missed now
    Clock::time_point deadline;   // for re-plans
    bool haveDeadline = false;

    static std::string key(const UnmetItem& u) { return u.field + "#" + u.requirement; }

    double secondsLeft() const {
        return haveDeadline ? std::chrono::duration<double>(deadline - Clock::now()).count() : 1.0;
    }

    // How many of the missed requirements `changed` (and `changedFp`) meets:
    // 0 unless `item` is among them and nothing met before is missed now.
    // With `strict` false, only the count matters: fewer misses than now.
    int judge(const std::vector<UnmetItem>& left, const UnmetItem& item, bool strict) const {
        if (!strict) return std::max(0, static_cast<int>(before.size()) - static_cast<int>(left.size()));
        for (const UnmetItem& u : left) {
            if (key(u) == key(item)) return 0;
            if (!before.count(key(u))) return 0; // something new given up
        }
        return static_cast<int>(before.size() - left.size());
    }

    int meets(const Brief& changed, const Footprint& changedFp, const UnmetItem& item, bool strict = true,
              bool replan = false) const {
        const SizingProblem problem(changed, v.extended, v.labeling, changedFp, planSizingOptions(changed));
        SizingResult r;
        if (changedFp == fp) {
            const SizingResult start = problem.stateOf(vertexRects(v));
            r = problem.solve(&start);
        } else {
            r = problem.solve();
        }
        const PlanVariant after = applySizing(changed, changedFp, v, r);
        if (const int n = judge(unmetRequirements(changed, changedFp, after), item, strict); n > 0 || !replan) return n;
        // A short re-plan: the arrangement may change.
        const double left = secondsLeft();
        if (left < 0.05) return 0;
        PlanOptions o;
        o.threads = 1;
        o.variants = 1;
        o.variantFlips = 0;
        o.relaxations = false;
        o.timeLimit = std::min(left, 1.5);
        Brief b = changed;
        b.footprint = changedFp;
        const Plan p = buildPlan(b, o);
        if (p.variants.empty() || p.status == PlanStatus::Internal || !p.variants.front().sized) return 0;
        return judge(unmetRequirements(b, changedFp, p.variants.front()), item, strict);
    }
};

// Rooms sharing a wall with room i in the variant, the longest wall first.
std::vector<int> neighboursOf(const PlanVariant& v, int i, double tol) {
    std::vector<std::pair<double, int>> n;
    for (int j = 0; j < static_cast<int>(v.rooms.size()); ++j)
        if (j != i)
            if (const double w = sharedWallLength(v.rooms[i], v.rooms[j], tol); w > tol) n.push_back({-w, j});
    std::sort(n.begin(), n.end());
    std::vector<int> out;
    for (auto& [w, j] : n) out.push_back(j);
    return out;
}

} // namespace

std::vector<Relaxation> relaxationsFor(const Brief& given, const Footprint& fp, const PlanVariant& v, int limit,
                                       double seconds) {
    std::vector<Relaxation> out;
    const auto started = Clock::now();
    auto inTime = [&] {
        return seconds <= 0 || std::chrono::duration<double>(Clock::now() - started).count() < seconds;
    };
    const Brief brief = plannedBrief(given);
    const std::vector<UnmetItem> items = unmetRequirements(given, fp, v);
    if (items.empty() || v.rooms.size() != brief.rooms.size() || v.extended.graph.vertexCount() == 0) return out;
    Verifier check{fp, v, {}, started + std::chrono::duration_cast<Clock::duration>(std::chrono::duration<double>(seconds)),
                   seconds > 0};
    for (const UnmetItem& u : items) check.before.insert(Verifier::key(u));
    const std::string& unit = brief.units;
    const std::string unit2 = unit + "\xC2\xB2";
    const double tol = 1e-9 * std::max(fp.width, fp.depth);
    // Found so far, keyed by the change: the same change meeting several
    // requirements is one relaxation that lists them all.
    std::map<std::string, std::size_t> byChange;
    auto add = [&](Relaxation r, const std::string& meets) {
        const std::string k = r.field + "=" + r.to;
        if (auto it = byChange.find(k); it != byChange.end()) {
            std::vector<std::string>& m = out[it->second].meets;
            if (std::find(m.begin(), m.end(), meets) == m.end()) m.push_back(meets);
            return false;
        }
        if (static_cast<int>(out.size()) >= limit) return false;
        r.meets = {meets};
        byChange[k] = out.size();
        out.push_back(std::move(r));
        return true;
    };
    auto footprintRelaxation = [&](bool wide, double now, const std::string& why) {
        const double was = wide ? fp.width : fp.depth;
        return Relaxation{wide ? "/footprint/width" : "/footprint/depth", num(was), num(now),
                          std::string("Footprint ") + (wide ? "width " : "depth ") + num(now) + " " + unit +
                              " instead of " + num(was) + why,
                          std::string("the footprint's ") + (wide ? "width" : "depth") + " of " + num(was) + " " + unit,
                          {}, now / was - 1};
    };
    // Targets over the footprint: the footprint just large enough, either
    // way, or one room's target lowered by the excess; verified by a short
    // re-plan when re-sizing this arrangement cannot take it.
    const double total = given.totalTargetArea(), area = fp.width * fp.depth;
    if (given.footprint && total > area * (1 + 1e-9)) {
        const std::string why = "the targets add up to " + num(total) + " " + unit2 + ", more than the footprint's " +
                                num(area) + " " + unit2;
        std::vector<std::pair<int, Relaxation>> global;
        for (const bool wide : {true, false}) {
            if (!inTime()) break;
            Footprint f = fp;
            (wide ? f.width : f.depth) = std::ceil(total / (wide ? fp.depth : fp.width) * 100 - 1e-6) / 100;
            Brief b = given;
            b.footprint = f;
            b = plannedBrief(b);
            if (const int n = check.meets(b, f, items.front(), /*strict=*/false, /*replan=*/true); n > 0)
                global.push_back({n, footprintRelaxation(wide, wide ? f.width : f.depth, ", so that the targets fit")});
        }
        // The rooms furthest under their targets, each lowered by the excess.
        std::vector<std::pair<double, int>> under;
        for (const UnmetItem& u : items)
            if (u.requirement == "area" && u.got < u.wanted && given.surplus != Surplus::Spread)
                under.push_back({u.got - u.wanted, u.rooms.front()});
        std::sort(under.begin(), under.end());
        for (std::size_t k = 0; k < under.size() && k < 2 && inTime(); ++k) {
            const int i = under[k].second;
            const double now = std::floor((given.rooms[i].area - (total - area)) * 10) / 10;
            if (now < 0.5 * given.rooms[i].area) continue; // not a relaxation a planner would take
            Brief b = brief;
            b.rooms[i].area = now;
            if (const int n = check.meets(b, fp, items.front(), false, true); n > 0)
                global.push_back({n, {"/rooms/" + std::to_string(i) + "/area", num(given.rooms[i].area), num(now),
                                      brief.rooms[i].displayName() + ": target " + num(now) + " " + unit2 +
                                          " instead of " + num(given.rooms[i].area) + ", so that the targets fit",
                                      brief.rooms[i].displayName() + "'s target of " + num(given.rooms[i].area) + " " +
                                          unit2,
                                      {},
                                      1 - now / given.rooms[i].area}});
        }
        // Those that leave nothing missed first, then the smallest change.
        const int all = static_cast<int>(check.before.size());
        std::stable_sort(global.begin(), global.end(), [all](const auto& a, const auto& b) {
            return (a.first == all) != (b.first == all) ? a.first == all : a.second.change < b.second.change;
        });
        for (auto& [n, r] : global) add(std::move(r), why);
    }
    int tried = 0;
    bool footprintTried = false;
    for (const UnmetItem& item : items) {
        if (static_cast<int>(out.size()) >= limit || ++tried > 8 || !inTime()) break;
        std::vector<Relaxation> found;
        std::vector<int> fixes; // per entry of `found`: missed requirements it meets
        auto offer = [&](int n, Relaxation r) {
            if (n <= 0) return;
            fixes.push_back(n);
            found.push_back(std::move(r));
        };
        const int i = item.rooms.empty() ? -1 : item.rooms.front();
        const std::string name = i >= 0 ? brief.rooms[i].displayName() : std::string();
        const std::string at = "/rooms/" + std::to_string(i);
        // The room's own numbers.
        // (With `surplus: spread` a target is not what the room gets: no such suggestion.)
        if (item.requirement == "area" && i >= 0 && given.surplus != Surplus::Spread) {
            Brief b = brief;
            b.rooms[i].area = std::round(item.got * 10) / 10;
            offer(check.meets(b, fp, item),
                  {item.field, num(given.rooms[i].area), num(b.rooms[i].area),
                   name + ": target " + num(b.rooms[i].area) + " " + unit2 + " instead of " + num(given.rooms[i].area),
                   name + "'s target of " + num(given.rooms[i].area) + " " + unit2, {},
                   std::abs(b.rooms[i].area - brief.rooms[i].area) / brief.rooms[i].area});
        }
        if (item.requirement == "minWidth" && i >= 0) {
            Brief b = brief;
            b.rooms[i].minWidth = std::floor(item.got * 20) / 20;
            if (*b.rooms[i].minWidth > 0)
                offer(check.meets(b, fp, item),
                      {item.field, num(*brief.rooms[i].minWidth), num(*b.rooms[i].minWidth),
                       name + ": minimum width " + num(*b.rooms[i].minWidth) + " " + unit + " instead of " +
                           num(*brief.rooms[i].minWidth),
                       name + "'s minimum width of " + num(*brief.rooms[i].minWidth) + " " + unit, {},
                       1 - *b.rooms[i].minWidth / *brief.rooms[i].minWidth});
        }
        if (item.requirement == "maxAspect" && i >= 0) {
            Brief b = brief;
            b.rooms[i].maxAspect = std::ceil(item.got * 10) / 10;
            offer(check.meets(b, fp, item),
                  {item.field, num(*brief.rooms[i].maxAspect), num(*b.rooms[i].maxAspect),
                   name + ": aspect limit 1:" + num(*b.rooms[i].maxAspect) + " instead of 1:" +
                       num(*brief.rooms[i].maxAspect),
                   name + "'s aspect limit of 1:" + num(*brief.rooms[i].maxAspect), {},
                   *b.rooms[i].maxAspect / *brief.rooms[i].maxAspect - 1});
        }
        // The footprint, when the brief gives one: the smallest of a few steps
        // (tried for the first requirement it could meet only: eight sizings).
        if (given.footprint && !footprintTried && item.requirement != "facade" && item.requirement != "adjacency" &&
            item.requirement != "door") {
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
                    offer(n, footprintRelaxation(wide, wide ? f.width : f.depth, ""));
                    break;
                }
            }
        }
        // What holds a room's numbers there: the requirements of the rooms
        // beside it, each eased in turn (their target by this room's excess
        // or shortfall, a minimum width by 15 %, an aspect limit by 25 %, a
        // facade wish given up). Those that free it are what hold it.
        if (i >= 0 && (item.requirement == "area" || item.requirement == "minWidth" || item.requirement == "maxAspect")) {
            const std::vector<int> next = neighboursOf(v, i, tol);
            for (std::size_t k = 0; k < next.size() && k < 6 && inTime(); ++k) {
                const int j = next[k];
                const Room& rj = brief.rooms[j];
                const std::string nj = rj.displayName(), aj = "/rooms/" + std::to_string(j);
                if (item.requirement == "area" && given.surplus != Surplus::Spread) {
                    const double now = std::round((given.rooms[j].area + (item.got - item.wanted)) * 10) / 10;
                    if (now > 0 && std::abs(now - given.rooms[j].area) > 0.05) {
                        Brief b = brief;
                        b.rooms[j].area = now;
                        offer(check.meets(b, fp, item),
                              {aj + "/area", num(given.rooms[j].area), num(now),
                               nj + ": target " + num(now) + " " + unit2 + " instead of " + num(given.rooms[j].area),
                               nj + "'s target of " + num(given.rooms[j].area) + " " + unit2, {},
                               std::abs(now - given.rooms[j].area) / given.rooms[j].area});
                    }
                }
                if (rj.minWidth) {
                    Brief b = brief;
                    b.rooms[j].minWidth = std::floor(*rj.minWidth * 0.85 * 20) / 20;
                    offer(check.meets(b, fp, item),
                          {aj + "/minWidth", num(*rj.minWidth), num(*b.rooms[j].minWidth),
                           nj + ": minimum width " + num(*b.rooms[j].minWidth) + " " + unit + " instead of " +
                               num(*rj.minWidth),
                           nj + "'s minimum width of " + num(*rj.minWidth) + " " + unit, {},
                           1 - *b.rooms[j].minWidth / *rj.minWidth});
                }
                if (rj.maxAspect) {
                    Brief b = brief;
                    b.rooms[j].maxAspect = std::ceil(*rj.maxAspect * 1.25 * 10) / 10;
                    offer(check.meets(b, fp, item),
                          {aj + "/maxAspect", num(*rj.maxAspect), num(*b.rooms[j].maxAspect),
                           nj + ": aspect limit 1:" + num(*b.rooms[j].maxAspect) + " instead of 1:" + num(*rj.maxAspect),
                           nj + "'s aspect limit of 1:" + num(*rj.maxAspect), {},
                           *b.rooms[j].maxAspect / *rj.maxAspect - 1});
                }
                if (!rj.facade.empty()) {
                    Brief b = brief;
                    b.rooms[j].facade = {};
                    offer(check.meets(b, fp, item), {aj + "/facade", facadeJson(rj.facade), "[]",
                                                     nj + ": give up the wish for " + facadeWords(rj.facade),
                                                     nj + "'s wish for " + facadeWords(rj.facade), {}, 1});
                }
            }
        }
        // Giving something up.
        if (item.requirement == "facade" && i >= 0)
            offer(1, {item.field, facadeJson(brief.rooms[i].facade), "[]",
                      name + ": give up the wish for " + facadeWords(brief.rooms[i].facade),
                      name + "'s wish for " + facadeWords(brief.rooms[i].facade), {}, 1});
        if ((item.requirement == "adjacency" || item.requirement == "door") && item.adjacency >= 0) {
            const Adjacency& a = brief.adjacencies[item.adjacency];
            offer(1, {item.field, adjacencyJson(a, Priority::Must), adjacencyJson(a, Priority::Should),
                      item.text.substr(0, item.text.find(':')) + ": make the " + toString(a.kind) + " 'should'",
                      "the 'must' " + std::string(toString(a.kind)) + " between " +
                          item.text.substr(0, item.text.find(':')),
                      {}, 1});
        }
        // The change that meets the most first (a footprint that is too
        // small: the footprint, not one room), then the smallest change.
        std::vector<std::size_t> order(found.size());
        for (std::size_t k = 0; k < order.size(); ++k) order[k] = k;
        std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
            return fixes[a] != fixes[b] ? fixes[a] > fixes[b] : found[a].change < found[b].change;
        });
        for (std::size_t k : order) add(found[k], item.text);
    }
    return out;
}

std::vector<std::string> heldBy(const UnmetItem& item, const std::vector<Relaxation>& relaxations) {
    std::vector<std::string> out = item.heldBy;
    for (const Relaxation& r : relaxations) {
        if (r.field == item.field || r.holds.empty()) continue;
        if (std::find(r.meets.begin(), r.meets.end(), item.text) == r.meets.end()) continue;
        if (std::find(out.begin(), out.end(), r.holds) == out.end()) out.push_back(r.holds);
    }
    return out;
}

} // namespace abut
