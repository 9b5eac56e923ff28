// SPDX-License-Identifier: MIT
#include "io/plan_io.h"

#include "plan/relaxations.h"
#include "plan/unmet.h"

#include <cmath>
#include <nlohmann/json.hpp>

namespace abut {

namespace {

// Scores and metrics: six decimals are plenty and keep files readable.
double tidy(double v) { return std::round(v * 1e6) / 1e6; }

// Rectangles keep full precision: rounded sides would open hairline gaps
// between rooms that share a wall.
OrderedJson rectJson(const Rect& r) {
    return {{"x", r.x0}, {"y", r.y0}, {"width", r.width()}, {"depth", r.depth()}};
}

} // namespace

std::string serializePlan(const Brief& brief, const Plan& plan) {
    OrderedJson j;
    j["format"] = "abut.plan";
    j["version"] = 1;
    j["units"] = plan.units;
    j["footprint"] = {{"width", plan.footprint.width}, {"depth", plan.footprint.depth}};
    if (!plan.footprint.cutouts.empty()) {
        OrderedJson cuts = OrderedJson::array();
        for (const Placement& c : plan.footprint.cutouts)
            cuts.push_back({{"x", c.x}, {"y", c.y}, {"width", c.width}, {"depth", c.depth}});
        j["footprint"]["cutouts"] = cuts;
    }
    j["doorWidth"] = brief.doorWidth;
    j["status"] = toString(plan.status);
    OrderedJson variants = OrderedJson::array();
    for (const PlanVariant& v : plan.variants) {
        OrderedJson vj;
        vj["rank"] = v.rank;
        vj["score"] = tidy(v.score);
        OrderedJson rooms = OrderedJson::array();
        // The brief's rooms; the cut-outs planned after them are the footprint's.
        for (std::size_t i = 0; i < v.rooms.size() && i < brief.rooms.size(); ++i) {
            if (brief.rooms[i].cutout) continue;
            OrderedJson r = {{"id", brief.rooms[i].id}};
            r.update(rectJson(v.rooms[i]));
            rooms.push_back(r);
        }
        vj["rooms"] = rooms;
        OrderedJson spaces = OrderedJson::array();
        for (const Rect& s : v.spaces) spaces.push_back(rectJson(s));
        vj["spaces"] = spaces;
        OrderedJson dropped = OrderedJson::array();
        for (int d : v.dropped) dropped.push_back({brief.adjacencies[d].a, brief.adjacencies[d].b});
        vj["dropped"] = dropped;
        OrderedJson unmet = OrderedJson::array();
        for (int r : v.unmetFacade) unmet.push_back(brief.rooms[r].id);
        vj["unmetFacade"] = unmet;
        OrderedJson notMet = OrderedJson::array();
        for (const UnmetItem& u : unmetRequirements(brief, plan.footprint, v)) {
            OrderedJson item = {{"requirement", toString(u.kind)}, {"field", u.field}};
            OrderedJson ids = OrderedJson::array();
            for (int r : u.rooms) ids.push_back(brief.rooms[r].id);
            item["rooms"] = ids;
            if (u.kind != RequirementKind::Facade) {
                item["target"] = tidy(u.target);
                item["achieved"] = tidy(u.achieved);
            }
            item["text"] = u.text;
            if (const std::vector<std::string> held = heldBy(u, v.relaxations); !held.empty()) item["heldBy"] = held;
            notMet.push_back(item);
        }
        vj["unmet"] = notMet;
        // What must give (worked out for the best variant).
        OrderedJson give = OrderedJson::array();
        for (const Relaxation& r : v.relaxations) {
            OrderedJson item = {{"field", r.field}};
            for (const auto& [key, text] : {std::pair{"from", &r.from}, std::pair{"to", &r.to}}) {
                try {
                    item[key] = OrderedJson::parse(*text);
                } catch (const nlohmann::json::exception&) {
                    item[key] = *text;
                }
            }
            item["text"] = r.text;
            item["meets"] = r.meets;
            give.push_back(item);
        }
        vj["relaxations"] = give;
        vj["oneSided"] = v.oneSided;
        vj["usable"] = v.misses.usable();
        vj["metrics"] = {{"worstAreaError", tidy(v.metrics.worstAreaError)},
                         {"meanAreaError", tidy(v.metrics.meanAreaError)},
                         {"worstAspect", tidy(v.metrics.worstAspect)},
                         {"shortDoorWalls", v.metrics.shortDoorWalls},
                         {"narrowRooms", v.metrics.narrowRooms},
                         {"spareArea", tidy(v.metrics.spareArea)}};
        variants.push_back(vj);
    }
    j["variants"] = variants;
    OrderedJson search = {{"seconds", tidy(plan.stats.seconds)}, {"moves", plan.stats.moves}};
    if (plan.stats.firstUsableSeconds >= 0) search["firstUsableSeconds"] = tidy(plan.stats.firstUsableSeconds);
    j["search"] = search;
    return j.dump(2) + "\n";
}

} // namespace abut
