// SPDX-License-Identifier: MIT
// libFuzzer target: the whole brief → plan pipeline. The input bytes are
// read as a small brief (room count, areas, min widths, facade wishes,
// adjacencies with kind and priority, footprint, cut-outs, a fixed room)
// so that every input is a
// brief and the fuzzer explores the pipeline rather than the JSON reader.
// Every variant must pass checkVariant and the labeling checker; the plan
// must never report an internal error.
#include "label/regular_edge_labeling.h"
#include "brief/brief_rules.h"
#include "plan/brief_check.h"
#include "plan/plan_builder.h"

#include <algorithm>
#include <cstdint>
#include <cstdlib>
#include <string>

namespace {

struct Bytes {
    const std::uint8_t* p;
    std::size_t n, i = 0;
    unsigned next() { return i < n ? p[i++] : 0u; }
    bool more() const { return i < n; }
};

} // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    Bytes in{data, size};
    abut::Brief b;
    const int rooms = 1 + static_cast<int>(in.next() % 24);
    for (int r = 0; r < rooms; ++r) {
        abut::Room room;
        room.id = "r" + std::to_string(r);
        room.area = 1.0 + in.next() % 40;
        const unsigned flags = in.next();
        if (flags & 1) room.minWidth = 0.5 + (in.next() % 40) / 10.0;
        if (flags & 2) room.maxAspect = 1.0 + (in.next() % 30) / 10.0;
        if (flags & 4) room.facade.sides = static_cast<std::uint8_t>((flags >> 4) & 15);
        if (flags & 8) room.facade.anySide = true;
        b.rooms.push_back(room);
    }
    const unsigned fp = in.next();
    if (fp & 1) {
        const double w = 2.0 + in.next() % 60, d = 2.0 + in.next() % 60;
        b.footprint = abut::Footprint{w, d};
    }
    if (fp & 2) b.doorWidth = 0.3 + (in.next() % 30) / 10.0;
    // Cut-outs and a room fixed in place, on the half-metre grid, kept only
    // when the brief's own rules accept them (the loader would refuse the rest).
    auto placement = [&](double w, double d) {
        abut::Placement c;
        c.x = (in.next() % static_cast<unsigned>(2 * w)) / 2.0;
        c.y = (in.next() % static_cast<unsigned>(2 * d)) / 2.0;
        c.width = std::min(w - c.x, 0.5 + (in.next() % 40) / 2.0);
        c.depth = std::min(d - c.y, 0.5 + (in.next() % 40) / 2.0);
        return c;
    };
    if ((fp & 4) && b.footprint) {
        const int cutouts = 1 + static_cast<int>(in.next() % 3);
        for (int k = 0; k < cutouts; ++k) b.footprint->cutouts.push_back(placement(b.footprint->width, b.footprint->depth));
        bool fine = abut::splitProblem(*b.footprint).empty();
        for (std::size_t k = 0; k < b.footprint->cutouts.size(); ++k) fine = fine && abut::cutoutProblem(*b.footprint, k).empty();
        if (!fine) b.footprint->cutouts.clear();
    }
    if ((fp & 8) && b.footprint) {
        b.rooms[0].fixed = placement(b.footprint->width, b.footprint->depth);
        if (!abut::fixedRoomProblem(b, 0).empty() || !abut::placementProblem(b).empty()) b.rooms[0].fixed.reset();
    }
    while (in.more() && b.adjacencies.size() < 80) {
        const int u = static_cast<int>(in.next() % rooms), v = static_cast<int>(in.next() % rooms);
        const unsigned kind = in.next();
        if (u == v) continue;
        bool dup = false;
        for (const abut::Adjacency& a : b.adjacencies)
            dup |= (a.a == b.rooms[u].id && a.b == b.rooms[v].id) || (a.a == b.rooms[v].id && a.b == b.rooms[u].id);
        if (dup) continue;
        b.adjacencies.push_back({b.rooms[u].id, b.rooms[v].id,
                                 (kind & 1) ? abut::AdjacencyKind::Wall : abut::AdjacencyKind::Door,
                                 (kind & 2) ? abut::Priority::Should : abut::Priority::Must});
    }
    abut::PlanOptions light;
    light.variants = 2;
    light.cornerTrials = 2;
    light.augmentations = 1;
    light.labelingsPerGraph = 3;
    light.sizedCandidates = 1;
    light.improvedCandidates = 0;
    light.searchMoves = 2000; // a short plan search: every variant is still checked
    light.threads = 1;
    light.variantFlips = 0;
    // The check (what `check --json` reports) names only the brief's rooms.
    const abut::BriefCheck check = abut::checkBrief(b);
    for (const abut::Diagnostic& d : check.diagnostics)
        for (int r : d.rooms)
            if (r < 0 || r >= rooms) std::abort();
    const abut::Plan plan = abut::buildPlan(b, light);
    // With cut-outs or a fixed room there may be no plan (a room that would be
    // L-shaped, a part too thin for any room); never an internal error.
    const bool held = b.rooms[0].fixed || (b.footprint && !b.footprint->cutouts.empty());
    if (plan.status == abut::PlanStatus::Internal) std::abort();
    if (plan.variants.empty() && !(held && plan.status == abut::PlanStatus::NoPlan)) std::abort();
    for (const abut::PlanVariant& v : plan.variants) {
        if (!abut::checkVariant(b, plan.footprint, v).ok) std::abort();
        if (!abut::checkRegularEdgeLabeling(v.extended, v.labeling).ok) std::abort();
    }
    return 0;
}
