// SPDX-License-Identifier: MIT
// Test helper: answers questions about graphs read from standard input, so
// that Python checks can compare Abut's core with independent libraries.
//   abut_probe planar   < {"graphs": [{"n": 5, "edges": [[0, 1], ...]}, ...]}
//                       > [true, false, ...]
//   abut_probe search PROJECT …, abut_probe fingerprint MOVES PROJECT… (below)
#include "embed/planar_embedding.h"
#include "io/project_io.h"
#include "plan/plan_builder.h"
#include "search/plan_search.h"
#include "search/zones.h"

#include <nlohmann/json.hpp>

#include <cmath>
#include <cstdlib>
#include <fstream>
#include <iostream>
#include <string>

// abut_probe search PROJECT [SEED] [THREADS] [TIME]: runs the plan search
// alone and prints what its best plans miss (for development).
int search(int argc, char** argv) {
    const abut::LoadResult loaded = abut::loadProject(argv[2]);
    if (!loaded.ok()) {
        std::cerr << "cannot load " << argv[2] << "\n";
        return 2;
    }
    abut::SearchOptions o;
    if (argc > 3) o.seed = static_cast<unsigned>(std::stoul(argv[3]));
    if (argc > 4) o.threads = std::stoi(argv[4]);
    if (argc > 5) o.timeLimit = std::stod(argv[5]);
    if (argc > 6) o.moves = std::stoll(argv[6]);
    const abut::SearchResult r = abut::searchPlans(loaded.brief, o);
    std::cout << "status " << static_cast<int>(r.status) << " plans " << r.plans.size() << " seconds " << r.seconds
              << " first usable " << r.firstUsableSeconds << " moves " << r.moves << "\n";
    if (const char* out = std::getenv("ABUT_PROBE_PLAN"); out && !r.plans.empty()) {
        nlohmann::json rooms = nlohmann::json::array(), spaces = nlohmann::json::array();
        const abut::SearchPlan& best = r.plans.front();
        for (int v = 0; v < best.extended.graph.vertexCount(); ++v) {
            if (best.extended.isPole(v)) continue;
            const abut::Rect& q = best.sized.rects[v];
            nlohmann::json j = {{"x", q.x0}, {"y", q.y0}, {"width", q.width()}, {"depth", q.depth()}};
            if (best.extended.isRoom(v)) {
                j["id"] = loaded.brief.rooms[v].id;
                rooms.push_back(j);
            } else {
                spaces.push_back(j);
            }
        }
        std::ofstream(out) << nlohmann::json{{"variants", {{{"rooms", rooms}, {"spaces", spaces}}}}}.dump();
    }
    for (const abut::SearchPlan& p : r.plans)
        std::cout << "  cost " << p.cost << " misses area " << p.misses.area << " width " << p.misses.minWidth
                  << " aspect " << p.misses.maxAspect << " must " << p.misses.must << " facade " << p.misses.facade
                  << " should " << p.misses.should << " worst " << p.misses.worstAreaError << "\n";
    return 0;
}

// abut_probe fingerprint MOVES PROJECT...: plans each brief on one thread
// with seed 1, a fixed move budget and no time limit (so the result depends
// on nothing but the code), and prints one line per brief: the file, a hash
// of its variants (rectangles to 1e-6, dropped adjacencies) and the best
// variant's misses. A refactoring that keeps behaviour keeps every line.
int fingerprint(int argc, char** argv) {
    const long long moves = std::stoll(argv[2]);
    for (int k = 3; k < argc; ++k) {
        const abut::LoadResult loaded = abut::loadProject(argv[k]);
        if (!loaded.ok()) {
            std::cout << argv[k] << " unreadable\n";
            continue;
        }
        abut::PlanOptions o;
        o.threads = 1;
        o.seed = 1;
        o.searchMoves = moves;
        o.flipBudget = 200;
        o.relaxations = false; // bounded by the clock
        const abut::Plan plan = abut::buildPlan(loaded.brief, o);
        std::uint64_t h = 1469598103934665603ULL;
        auto mix = [&](long long v) {
            for (int b = 0; b < 8; ++b) {
                h ^= (static_cast<unsigned long long>(v) >> (8 * b)) & 0xFF;
                h *= 1099511628211ULL;
            }
        };
        for (const abut::PlanVariant& v : plan.variants) {
            for (const auto* list : {&v.rooms, &v.spaces})
                for (const abut::Rect& r : *list)
                    for (double c : {r.x0, r.y0, r.x1, r.y1}) mix(std::llround(c * 1e6));
            for (int d : v.dropped) mix(d);
            if (std::getenv("ABUT_PROBE_VERBOSE")) {
                std::cout << "  variant score " << v.score << " dropped";
                for (int d : v.dropped) std::cout << " " << d;
                std::cout << " sized " << v.sized << " worst " << v.metrics.worstAreaError << "\n";
            }
        }
        std::cout << argv[k] << " " << std::hex << h << std::dec << " " << abut::toString(plan.status) << " "
                  << plan.variants.size();
        if (!plan.variants.empty()) {
            const abut::RequirementMisses& m = plan.variants.front().misses;
            std::cout << " area " << m.area << " width " << m.minWidth << " aspect " << m.maxAspect << " must "
                      << m.must << " facade " << m.facade << " fixed " << m.fixed;
        }
        std::cout << "\n";
    }
    return 0;
}

// abut_probe zones PROJECT: the zones Abut forms (search/zones.h), one line each.
int zones(const char* path) {
    const abut::LoadResult loaded = abut::loadProject(path);
    if (!loaded.ok()) return 2;
    const abut::Brief b = abut::plannedBrief(loaded.brief);
    const abut::ZoneTree t = abut::formZones(b);
    for (std::size_t k = 0; k < t.zones.size(); ++k) {
        const abut::ZoneTree::Zone& z = t.zones[k];
        std::cout << k << " parent " << z.parent << " hub " << (z.hub >= 0 ? b.rooms[z.hub].id : "-") << " area "
                  << z.area << " zones " << z.zones.size() << " rooms";
        for (int r : z.rooms) std::cout << " " << b.rooms[r].id;
        std::cout << "\n";
    }
    std::cout << "layered " << t.layered() << "\n";
    return 0;
}

int main(int argc, char** argv) {
    const std::string mode = argc > 1 ? argv[1] : "";
    if (mode == "search" && argc > 2) return search(argc, argv);
    if (mode == "fingerprint" && argc > 3) return fingerprint(argc, argv);
    if (mode == "zones" && argc > 2) return zones(argv[2]);
    if (mode != "planar") {
        std::cerr << "usage: abut_probe planar < graphs.json\n";
        return 2;
    }
    const nlohmann::json in = nlohmann::json::parse(std::cin);
    nlohmann::json out = nlohmann::json::array();
    for (const auto& g : in.at("graphs")) {
        std::vector<std::pair<int, int>> edges;
        for (const auto& e : g.at("edges")) edges.emplace_back(e[0].get<int>(), e[1].get<int>());
        out.push_back(abut::embedPlanar(g.at("n").get<int>(), edges).status ==
                      abut::EmbeddingStatus::Planar);
    }
    std::cout << out.dump() << "\n";
    return 0;
}
