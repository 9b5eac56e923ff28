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

    static std::string key(const UnmetItem& u) { return u.key(); }

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
        if (haveDeadline && Clock::now() >= deadline) return 0; // out of time: not verified, not offered
        SizingProblem problem(changed, v.extended, v.labeling, changedFp, planSizingOptions(changed));
        if (haveDeadline) problem.setDeadline(deadline); // a sizing of thousands of rooms takes seconds
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
        o.timeLimit = std::min(left, 1.5);
        Brief b = changed;
        b.footprint = changedFp;
        const Plan p = planVariants(b, o);
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

namespace {

// What every part of the search for relaxations shares.
struct Context {
    const Brief& given;     // as the planner wrote it
    Brief brief;            // as planned (cut-outs added, targets spread)
    const Footprint& fp;
    const PlanVariant& v;
    Verifier check;
    Clock::time_point started;
    double seconds = 0;
    std::string unit, unit2;
    double tol = 0;

    bool inTime() const {
        return seconds <= 0 || std::chrono::duration<double>(Clock::now() - started).count() < seconds;
    }
    std::string roomField(int i, const char* name) const { return "/rooms/" + std::to_string(i) + "/" + name; }
};

Relaxation make(std::string field, std::string from, std::string to, std::string text, std::string holds,
                double change, std::vector<int> rooms = {}, int adjacency = -1) {
    Relaxation r;
    r.field = std::move(field);
    r.from = std::move(from);
    r.to = std::move(to);
    r.text = std::move(text);
    r.holds = std::move(holds);
    r.change = change;
    r.rooms = std::move(rooms);
    r.adjacency = adjacency;
    return r;
}

Relaxation footprintRelaxation(const Context& c, bool wide, double now, const std::string& why) {
    const double was = wide ? c.fp.width : c.fp.depth;
    return make(wide ? "/footprint/width" : "/footprint/depth", num(was), num(now),
                std::string("Footprint ") + (wide ? "width " : "depth ") + num(now) + " " + c.unit + " instead of " +
                    num(was) + why,
                std::string("the footprint's ") + (wide ? "width" : "depth") + " of " + num(was) + " " + c.unit,
                now / was - 1);
}

Relaxation targetRelaxation(const Context& c, int i, double now, const std::string& why = {}) {
    const std::string& name = c.brief.rooms[i].displayName();
    const double was = c.given.rooms[i].area;
    return make(c.roomField(i, "area"), num(was), num(now),
                name + ": target " + num(now) + " " + c.unit2 + " instead of " + num(was) + why,
                name + "'s target of " + num(was) + " " + c.unit2, std::abs(now - was) / was, {i});
}

Relaxation minWidthRelaxation(const Context& c, int i, double now) {
    const Room& r = c.brief.rooms[i];
    return make(c.roomField(i, "minWidth"), num(*r.minWidth), num(now),
                r.displayName() + ": minimum width " + num(now) + " " + c.unit + " instead of " + num(*r.minWidth),
                r.displayName() + "'s minimum width of " + num(*r.minWidth) + " " + c.unit, 1 - now / *r.minWidth, {i});
}

Relaxation aspectRelaxation(const Context& c, int i, double now) {
    const Room& r = c.brief.rooms[i];
    return make(c.roomField(i, "maxAspect"), num(*r.maxAspect), num(now),
                r.displayName() + ": aspect limit 1:" + num(now) + " instead of 1:" + num(*r.maxAspect),
                r.displayName() + "'s aspect limit of 1:" + num(*r.maxAspect), now / *r.maxAspect - 1, {i});
}

Relaxation facadeRelaxation(const Context& c, int i) {
    const Room& r = c.brief.rooms[i];
    return make(c.roomField(i, "facade"), facadeJson(r.facade), "[]",
                r.displayName() + ": give up the wish for " + facadeWords(r.facade),
                r.displayName() + "'s wish for " + facadeWords(r.facade), 1, {i});
}

// Relaxations found for one requirement, each with how many missed
// requirements it meets.
struct Offers {
    std::vector<Relaxation> found;
    std::vector<int> fixes;
    void offer(int n, Relaxation r) {
        if (n <= 0) return;
        fixes.push_back(n);
        found.push_back(std::move(r));
    }
    // The change that meets the most first (a footprint that is too small:
    // the footprint, not one room), then the smallest change.
    std::vector<std::size_t> order() const {
        std::vector<std::size_t> o(found.size());
        for (std::size_t k = 0; k < o.size(); ++k) o[k] = k;
        std::stable_sort(o.begin(), o.end(), [&](std::size_t a, std::size_t b) {
            return fixes[a] != fixes[b] ? fixes[a] > fixes[b] : found[a].change < found[b].change;
        });
        return o;
    }
};

// Targets over the footprint: the footprint just large enough, either way,
// or one room's target lowered by the excess; verified by a short re-plan
// when re-sizing this arrangement cannot take it. Those that leave nothing
// missed first, then the smallest change.
std::vector<Relaxation> overFull(const Context& c, const std::vector<UnmetItem>& items) {
    std::vector<std::pair<int, Relaxation>> global;
    const double total = c.given.totalTargetArea(), area = c.fp.width * c.fp.depth;
    for (const bool wide : {true, false}) {
        if (!c.inTime()) break;
        Footprint f = c.fp;
        (wide ? f.width : f.depth) = std::ceil(total / (wide ? c.fp.depth : c.fp.width) * 100 - 1e-6) / 100;
        Brief b = c.given;
        b.footprint = f;
        b = plannedBrief(b);
        if (const int n = c.check.meets(b, f, items.front(), /*strict=*/false, /*replan=*/true); n > 0)
            global.push_back({n, footprintRelaxation(c, wide, wide ? f.width : f.depth, ", so that the targets fit")});
    }
    // The rooms furthest under their targets, each lowered by the excess.
    std::vector<std::pair<double, int>> under;
    for (const UnmetItem& u : items)
        if (u.kind == RequirementKind::Area && u.achieved < u.target && c.given.surplus != Surplus::Spread)
            under.push_back({u.achieved - u.target, u.rooms.front()});
    std::sort(under.begin(), under.end());
    for (std::size_t k = 0; k < under.size() && k < 2 && c.inTime(); ++k) {
        const int i = under[k].second;
        const double now = std::floor((c.given.rooms[i].area - (total - area)) * 10) / 10;
        if (now < 0.5 * c.given.rooms[i].area) continue; // not a relaxation a planner would take
        Brief b = c.brief;
        b.rooms[i].area = now;
        if (const int n = c.check.meets(b, c.fp, items.front(), false, true); n > 0)
            global.push_back({n, targetRelaxation(c, i, now, ", so that the targets fit")});
    }
    const int all = static_cast<int>(c.check.before.size());
    std::stable_sort(global.begin(), global.end(), [all](const auto& a, const auto& b) {
        return (a.first == all) != (b.first == all) ? a.first == all : a.second.change < b.second.change;
    });
    std::vector<Relaxation> out;
    for (auto& [n, r] : global) out.push_back(std::move(r));
    return out;
}

// The room's own numbers: its target set to what it gets, its minimum width
// or aspect limit eased to what it is. (With `surplus: spread` a target is
// not what the room gets: no such suggestion.) An eased width or aspect may
// need another arrangement (this one was bent round the old number): when
// re-sizing it does not meet the brief, a short re-plan is tried.
void ownNumbers(const Context& c, const UnmetItem& item, int i, Offers& o) {
    if (item.kind == RequirementKind::Area && c.given.surplus != Surplus::Spread) {
        Brief b = c.brief;
        b.rooms[i].area = std::round(item.achieved * 10) / 10;
        o.offer(c.check.meets(b, c.fp, item), targetRelaxation(c, i, b.rooms[i].area));
    }
    if (item.kind == RequirementKind::MinWidth) {
        Brief b = c.brief;
        b.rooms[i].minWidth = std::floor(item.achieved * 20) / 20;
        if (*b.rooms[i].minWidth > 0)
            o.offer(c.check.meets(b, c.fp, item, true, true), minWidthRelaxation(c, i, *b.rooms[i].minWidth));
    }
    if (item.kind == RequirementKind::MaxAspect) {
        Brief b = c.brief;
        b.rooms[i].maxAspect = std::ceil(item.achieved * 10) / 10;
        o.offer(c.check.meets(b, c.fp, item, true, true), aspectRelaxation(c, i, *b.rooms[i].maxAspect));
    }
}

// The footprint, when the brief gives one: the smallest of a few steps.
void footprintSteps(const Context& c, const UnmetItem& item, Offers& o) {
    for (const bool wide : {true, false}) {
        for (double step : {0.02, 0.05, 0.1, 0.2}) {
            Footprint f = c.fp;
            (wide ? f.width : f.depth) = std::round((wide ? c.fp.width : c.fp.depth) * (1 + step) * 100) / 100;
            Brief b = c.given;
            b.footprint = f;
            b = plannedBrief(b); // with `surplus: spread` the targets follow the footprint
            const int n = c.check.meets(b, f, item);
            if (n == 0) continue;
            o.offer(n, footprintRelaxation(c, wide, wide ? f.width : f.depth, ""));
            break;
        }
    }
}

// What holds a room's numbers there: the requirements of the rooms beside
// it, each eased in turn (their target by this room's excess or shortfall, a
// minimum width by 15 %, an aspect limit by 25 %, a facade wish given up).
// Those that free it are what hold it.
void neighbours(const Context& c, const UnmetItem& item, int i, Offers& o) {
    const std::vector<int> next = neighboursOf(c.v, i, c.tol);
    for (std::size_t k = 0; k < next.size() && k < 6 && c.inTime(); ++k) {
        const int j = next[k];
        const Room& rj = c.brief.rooms[j];
        if (item.kind == RequirementKind::Area && c.given.surplus != Surplus::Spread) {
            const double now = std::round((c.given.rooms[j].area + (item.achieved - item.target)) * 10) / 10;
            if (now > 0 && std::abs(now - c.given.rooms[j].area) > 0.05) {
                Brief b = c.brief;
                b.rooms[j].area = now;
                o.offer(c.check.meets(b, c.fp, item), targetRelaxation(c, j, now));
            }
        }
        if (rj.minWidth) {
            Brief b = c.brief;
            b.rooms[j].minWidth = std::floor(*rj.minWidth * 0.85 * 20) / 20;
            o.offer(c.check.meets(b, c.fp, item), minWidthRelaxation(c, j, *b.rooms[j].minWidth));
        }
        if (rj.maxAspect) {
            Brief b = c.brief;
            b.rooms[j].maxAspect = std::ceil(*rj.maxAspect * 1.25 * 10) / 10;
            o.offer(c.check.meets(b, c.fp, item), aspectRelaxation(c, j, *b.rooms[j].maxAspect));
        }
        if (!rj.facade.empty()) {
            Brief b = c.brief;
            b.rooms[j].facade = {};
            o.offer(c.check.meets(b, c.fp, item), facadeRelaxation(c, j));
        }
    }
}

// Giving the requirement up: a facade wish, or a 'must' made 'should'.
void givingUp(const Context& c, const UnmetItem& item, int i, Offers& o) {
    if (item.kind == RequirementKind::Facade && i >= 0) o.offer(1, facadeRelaxation(c, i));
    if ((item.kind == RequirementKind::Adjacency || item.kind == RequirementKind::Door) && item.adjacency >= 0) {
        const Adjacency& a = c.brief.adjacencies[item.adjacency];
        const std::string names =
            c.brief.rooms[item.rooms[0]].displayName() + " and " + c.brief.rooms[item.rooms[1]].displayName();
        o.offer(1, make("/adjacencies/" + std::to_string(item.adjacency), adjacencyJson(a, Priority::Must),
                        adjacencyJson(a, Priority::Should), names + ": make the " + toString(a.kind) + " 'should'",
                        "the 'must' " + std::string(toString(a.kind)) + " between " + names, 1, item.rooms,
                        item.adjacency));
    }
}

} // namespace

std::vector<Relaxation> relaxationsFor(const Brief& given, const Footprint& fp, const PlanVariant& v, int limit,
                                       double seconds) {
    std::vector<Relaxation> out;
    const auto started = Clock::now();
    const std::vector<UnmetItem> items = unmetRequirements(given, fp, v);
    Context c{given, plannedBrief(given), fp, v,
              Verifier{fp, v, {}, started + std::chrono::duration_cast<Clock::duration>(std::chrono::duration<double>(seconds)),
                       seconds > 0},
              started, seconds, given.units, given.units + "\xC2\xB2", 1e-9 * std::max(fp.width, fp.depth)};
    if (items.empty() || v.rooms.size() != c.brief.rooms.size() || v.extended.graph.vertexCount() == 0) return out;
    for (const UnmetItem& u : items) c.check.before.insert(Verifier::key(u));
    // Found so far, keyed by the change: the same change meeting several
    // requirements is one relaxation that lists them all.
    std::map<std::string, std::size_t> byChange;
    auto add = [&](Relaxation r, const UnmetItem& meets) {
        const std::string k = r.field + "=" + r.to;
        if (auto it = byChange.find(k); it != byChange.end()) {
            Relaxation& known = out[it->second];
            if (std::find(known.meetsKeys.begin(), known.meetsKeys.end(), meets.key()) == known.meetsKeys.end()) {
                known.meets.push_back(meets.text);
                known.meetsKeys.push_back(meets.key());
            }
            return;
        }
        if (static_cast<int>(out.size()) >= limit) return;
        r.meets = {meets.text};
        r.meetsKeys = {meets.key()};
        byChange[k] = out.size();
        out.push_back(std::move(r));
    };
    const double total = given.totalTargetArea(), area = fp.width * fp.depth;
    if (given.footprint && total > area * (1 + 1e-9)) {
        UnmetItem why; // the targets over the footprint: not an item of the plan, a fact of the brief
        why.text = "the targets add up to " + num(total) + " " + c.unit2 + ", more than the footprint's " + num(area) +
                   " " + c.unit2;
        why.field = "/footprint";
        for (Relaxation& r : overFull(c, items)) add(std::move(r), why);
    }
    int tried = 0;
    bool footprintTried = false;
    for (const UnmetItem& item : items) {
        if (static_cast<int>(out.size()) >= limit || ++tried > 8 || !c.inTime()) break;
        Offers o;
        const bool room = item.kind == RequirementKind::Area || item.kind == RequirementKind::MinWidth ||
                          item.kind == RequirementKind::MaxAspect;
        const int i = item.rooms.empty() ? -1 : item.rooms.front();
        if (room && i >= 0) ownNumbers(c, item, i, o);
        // (tried for the first requirement it could meet only: eight sizings)
        if (given.footprint && !footprintTried && (room || item.kind == RequirementKind::Fixed)) {
            footprintTried = true;
            footprintSteps(c, item, o);
        }
        if (room && i >= 0) neighbours(c, item, i, o);
        givingUp(c, item, i, o);
        for (std::size_t k : o.order()) add(o.found[k], item);
    }
    return out;
}

std::vector<std::string> heldBy(const UnmetItem& item, const std::vector<Relaxation>& relaxations) {
    std::vector<std::string> out = item.heldBy;
    for (const Relaxation& r : relaxations) {
        if (r.field == item.field || r.holds.empty()) continue;
        if (std::find(r.meetsKeys.begin(), r.meetsKeys.end(), item.key()) == r.meetsKeys.end()) continue;
        if (std::find(out.begin(), out.end(), r.holds) == out.end()) out.push_back(r.holds);
    }
    return out;
}

} // namespace abut
