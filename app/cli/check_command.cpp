// SPDX-License-Identifier: MIT
#include "cli_commands.h"

#include "augment/augment.h"
#include "plan/brief_check.h"
#include "brief/footprint_check.h"
#include "io/project_io.h"

#include <algorithm>
#include <cmath>
#include <iomanip>
#include <sstream>
#include <nlohmann/json.hpp>

namespace abut::cli {

namespace {

std::string fixed(double v, int digits = 1) {
    std::ostringstream ss;
    ss << std::fixed << std::setprecision(digits) << v;
    return ss.str();
}

struct BriefSummary {
    int rooms = 0, doors = 0, walls = 0, musts = 0, shoulds = 0, facadeWishes = 0;
    double targetArea = 0, footprintArea = 0;
    Footprint footprint;
    bool footprintGiven = false;
};

BriefSummary summarize(const Brief& brief) {
    BriefSummary s;
    s.rooms = static_cast<int>(brief.rooms.size());
    for (const Adjacency& a : brief.adjacencies) {
        (a.kind == AdjacencyKind::Door ? s.doors : s.walls)++;
        (a.priority == Priority::Must ? s.musts : s.shoulds)++;
    }
    for (const Room& r : brief.rooms) s.facadeWishes += r.facade.empty() ? 0 : 1;
    s.targetArea = brief.totalTargetArea();
    s.footprint = brief.effectiveFootprint();
    s.footprintGiven = brief.footprint.has_value();
    s.footprintArea = s.footprint.netArea(); // cut-outs are not building
    return s;
}

} // namespace

int runCheck(const std::vector<std::string>& args, std::ostream& out, std::ostream& err) {
    const ParsedArgs a = parseArgs(args, {}, {"--json"}, err, "check PROJECT [--json]");
    if (!a.ok) return exitBadInput;
    if (a.positional.size() != 1) {
        err << "usage: abut-cli check PROJECT [--json]\n";
        return exitBadInput;
    }
    const std::string& path = a.positional[0];
    const bool json = a.flags.count("--json") > 0;
    LoadResult loaded;
    if (!loadOrReport(path, loaded, err)) return exitBadInput;
    const Brief& brief = loaded.brief;
    const BriefSummary s = summarize(brief);
    const BriefCheck checked = checkBrief(brief);
    const AugmentResult& plan = checked.arrangement;
    if (plan.status == AugmentStatus::Internal) {
        err << path << ": " << plan.summary << "\n";
        return exitInternal;
    }
    // Targets over the footprint, or rooms wider than it: reported first, and no plan can meet them.
    const std::vector<Diagnostic>& diagnostics = checked.diagnostics;
    const bool fits = checked.fits;
    // No rooms, no plan: `plan` says so too.
    const int code =
        plan.status == AugmentStatus::Compromised || plan.status == AugmentStatus::Empty || !fits ? exitNoPlan : exitOk;
    const std::string u = brief.units;
    // A plan that exists by its arrangement but cannot meet the numbers is no
    // plan: the summary must not say otherwise above the errors that say so.
    const std::string summary =
        fits ? plan.summary
             : plan.status == AugmentStatus::Feasible
                   ? std::string("The rooms can be arranged with every adjacency and facade wish, but no plan meets "
                                 "these numbers:")
                   : plan.summary + " Nor can a plan meet these numbers:";
    auto idsOf = [&](const std::vector<int>& rooms) {
        std::vector<std::string> ids;
        for (int r : rooms) ids.push_back(brief.rooms[r].id);
        return ids;
    };
    if (json) {
        OrderedJson j;
        j["file"] = path;
        j["status"] = toString(plan.status);
        j["feasible"] = plan.status == AugmentStatus::Feasible && fits;
        j["summary"] = summary;
        j["rooms"] = s.rooms;
        j["adjacencies"] = {{"door", s.doors}, {"wall", s.walls}, {"must", s.musts},
                            {"should", s.shoulds}};
        j["targetArea"] = s.targetArea;
        j["footprint"] = {{"width", s.footprint.width}, {"depth", s.footprint.depth},
                          {"given", s.footprintGiven}, {"netArea", s.footprintArea}};
        OrderedJson dropped = OrderedJson::array();
        for (int d : plan.dropped)
            dropped.push_back({brief.adjacencies[d].a, brief.adjacencies[d].b});
        j["dropped"] = dropped;
        j["unmetFacade"] = idsOf(plan.unmetFacade);
        j["spareSpaces"] = plan.extended.roomCount > 0 ? plan.extended.spareCount() : 0;
        OrderedJson diags = OrderedJson::array();
        for (const Diagnostic& d : diagnostics) {
            OrderedJson adjs = OrderedJson::array();
            for (int a : d.adjacencies)
                adjs.push_back({brief.adjacencies[a].a, brief.adjacencies[a].b});
            diags.push_back({{"severity", toString(d.severity)}, {"code", toString(d.code)},
                             {"message", d.message}, {"rooms", idsOf(d.rooms)},
                             {"adjacencies", adjs}});
        }
        j["diagnostics"] = diags;
        out << j.dump(2) << "\n";
        return code;
    }
    out << path << "\n";
    out << "  rooms:        " << s.rooms << " (" << s.facadeWishes << " with facade wishes)\n";
    out << "  adjacencies:  " << (s.doors + s.walls) << " (" << s.doors << " door, " << s.walls
        << " wall; " << s.musts << " must, " << s.shoulds << " should)\n";
    out << "  target area:  " << fixed(s.targetArea) << " " << u << "²\n";
    out << "  footprint:    " << fixed(s.footprint.width, 2) << " × " << fixed(s.footprint.depth, 2)
        << " " << u << (s.footprint.cutouts.empty() ? "" : " less " + std::to_string(s.footprint.cutouts.size()) + " cut-out(s)")
        << " = " << fixed(s.footprintArea) << " " << u << "²"
        << (s.footprintGiven ? "" : " (none given: sized to the target area)") << "\n";
    if (s.footprintArea > 0) {
        double spare = s.footprintArea - s.targetArea;
        if (std::abs(spare) <= 1e-9 * s.footprintArea) spare = 0; // an exact fill, up to rounding
        out << "  spare area:   " << fixed(spare) << " " << u << "² (" << fixed(100.0 * spare / s.footprintArea)
            << "%)"
            << (spare > 0 ? brief.surplus == Surplus::Spread ? "; spread over the rooms (surplus: spread)"
                                                              : "; left as spare space beyond the rooms' bands"
                          : "")
            << "\n";
    }
    out << "\n" << summary << "\n";
    printDiagnostics(out, diagnostics, [](const Diagnostic& d) { return !costsTheBriefNothing(d); },
                     "use --json for the list");
    int added = 0;
    for (const Diagnostic& d : diagnostics) added += costsTheBriefNothing(d);
    if (added > 0)
        out << "  info: " << added << " wall(s) the brief did not ask for are added to close the plan"
            << " (use --json for the list).\n";
    return code;
}

} // namespace abut::cli
