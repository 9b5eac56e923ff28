// SPDX-License-Identifier: MIT
#include "plan/plan_builder.h"

#include "plan/graph_first.h"
#include "plan/plan_route.h"
#include "brief/footprint_check.h"
#include "plan/relaxations.h"
#include "plan/variant_key.h"

#include "label/labeling_lattice.h"
#include "search/plan_search.h"
#include "search/score.h"

#include <algorithm>
#include <set>
#include <cmath>
#include <numeric>
#include <chrono>
#include <functional>
#include <random>

namespace abut {

const char* toString(PlanStatus s) {
    switch (s) {
    case PlanStatus::Ok: return "ok";
    case PlanStatus::Compromised: return "compromised";
    case PlanStatus::NoPlan: return "no-plan";
    case PlanStatus::Internal: return "internal-error";
    case PlanStatus::Cancelled: return "cancelled";
    }
    return "?";
}

namespace {

// Area errors, aspects, door walls, facade wishes and score of a variant whose
// rectangles are set, all from the one measure (search/requirements.h): an
// adjacency without its wall (a door: without a door-wide one) is dropped.
void updateMetrics(const Brief& brief, const Footprint& fp, PlanVariant& out, const Thresholds& t) {
    const RequirementReport report = measureRequirements(brief, fp, out.rooms, t);
    PlanMetrics m;
    m.worstAreaError = report.counts.worstAreaError;
    m.meanAreaError = report.meanAreaError;
    m.narrowRooms = report.counts.minWidth;
    for (std::size_t i = 0; i < out.rooms.size() && i < brief.rooms.size(); ++i) {
        if (brief.rooms[i].cutout) continue;
        const Rect& r = out.rooms[i];
        m.worstAspect = std::max(m.worstAspect, std::max(r.width(), r.depth()) / std::min(r.width(), r.depth()));
    }
    for (const Rect& r : out.spaces) m.spareArea += r.area();
    out.dropped.clear();
    out.unmetFacade.clear();
    const double tol = lineTolerance(fp, t);
    for (const Miss& miss : report.misses) {
        if (miss.adjacency >= 0) {
            out.dropped.push_back(miss.adjacency);
            if (miss.kind == RequirementKind::Door && miss.achieved > tol) ++m.shortDoorWalls;
        } else if (miss.kind == RequirementKind::Facade) {
            out.unmetFacade.push_back(miss.room);
        }
    }
    std::sort(out.dropped.begin(), out.dropped.end());
    out.metrics = m;
    out.misses = report.counts;
    out.score = planScore(brief, fp, out.rooms, out.spaces, report);
}

} // namespace

// The rectangles per vertex of the extended graph, as the sizer indexes them.
std::vector<Rect> vertexRects(const PlanVariant& v) {
    std::vector<Rect> rects(v.extended.graph.vertexCount());
    std::size_t room = 0, spare = 0;
    for (int u = 0; u < v.extended.graph.vertexCount(); ++u) {
        if (v.extended.isRoom(u) && room < v.rooms.size()) rects[u] = v.rooms[room++];
        else if (v.extended.isSpare(u) && spare < v.spaces.size()) rects[u] = v.spaces[spare++];
    }
    return rects;
}

PlanVariant applySizing(const Brief& brief, const Footprint& fp, const PlanVariant& v, const SizingResult& sized,
                        const Thresholds& t) {
    PlanVariant out = v;
    out.rooms.clear();
    out.spaces.clear();
    for (int u = 0; u < v.extended.graph.vertexCount(); ++u) {
        if (v.extended.isRoom(u)) out.rooms.push_back(sized.rects[u]);
        else if (v.extended.isSpare(u)) out.spaces.push_back(sized.rects[u]);
    }
    updateMetrics(brief, fp, out, t);
    out.sized = true;
    return out;
}


double variantScore(const Brief& brief, const Footprint& fp, const PlanVariant& v) {
    return planScore(brief, fp, v.rooms, v.spaces, measureRequirements(brief, fp, v.rooms));
}

PlanVariant layoutVariant(const Brief& brief, const ExtendedGraph& x, const RegularEdgeLabeling& rel,
                          const PlanOptions& options) {
    const Footprint fp = brief.effectiveFootprint();
    const SegmentStructure segs = maximalSegments(x, rel);
    const int n = x.graph.vertexCount();
    std::vector<double> natural(n, 0.0), hardMin(n, 0.0);
    for (int v = 0; v < n; ++v) {
        if (x.isRoom(v)) {
            natural[v] = std::sqrt(brief.rooms[v].area);
            hardMin[v] = brief.rooms[v].minWidth.value_or(0.0);
        } else if (x.isSpare(v)) {
            hardMin[v] = options.spareMinimum;
        }
    }
    DualWeights w;
    w.anyWall = options.anyWall;
    w.minWall = wallMinimums(brief, x, segs, brief.doorWidth, options.anyWall);
    auto layoutAt = [&](double t) {
        w.minWidth.assign(n, 1.0);
        w.minDepth.assign(n, 1.0);
        for (int v = 0; v < n; ++v) {
            w.minWidth[v] = w.minDepth[v] = std::max(hardMin[v], t * natural[v]);
            if (w.minWidth[v] <= 0) w.minWidth[v] = w.minDepth[v] = 1e-3;
        }
        return longestPathLayout(x, segs, w);
    };
    auto fits = [&](const DualLayout& l) { return l.width <= fp.width && l.depth <= fp.depth; };
    double lo = 0.0, hi = 1.0;
    while (fits(layoutAt(hi)) && hi < 1e6) {
        lo = hi;
        hi *= 2.0;
    }
    for (int i = 0; i < 30 && fits(layoutAt(lo)); ++i) {
        const double mid = 0.5 * (lo + hi);
        (fits(layoutAt(mid)) ? lo : hi) = mid;
    }
    const DualLayout layout = layoutAt(lo);
    const double sx = fp.width / layout.width, sy = fp.depth / layout.depth;
    auto scaled = [&](const Rect& r) { return Rect{r.x0 * sx, r.y0 * sy, r.x1 * sx, r.y1 * sy}; };

    PlanVariant out;
    out.extended = x;
    out.labeling = rel;
    for (int v = 0; v < n; ++v) {
        if (x.isRoom(v)) out.rooms.push_back(scaled(layout.rects[v]));
        else if (x.isSpare(v)) out.spaces.push_back(scaled(layout.rects[v]));
    }
    // Snap the outline exactly (scaling leaves round-off at the far edges).
    auto snap = [&](Rect& r) {
        if (std::abs(r.x1 - fp.width) < 1e-9 * fp.width) r.x1 = fp.width;
        if (std::abs(r.y1 - fp.depth) < 1e-9 * fp.depth) r.y1 = fp.depth;
    };
    for (Rect& r : out.rooms) snap(r);
    for (Rect& r : out.spaces) snap(r);

    updateMetrics(brief, fp, out, Thresholds{options.anyWall});
    return out;
}

StageCheck checkVariant(const Brief& brief, const Footprint& fp, const PlanVariant& v, const Thresholds& t) {
    const double tol = 1e-6 * std::max(fp.width, fp.depth);
    std::vector<Rect> all = v.rooms;
    all.insert(all.end(), v.spaces.begin(), v.spaces.end());
    double area = 0;
    for (std::size_t i = 0; i < all.size(); ++i) {
        const Rect& r = all[i];
        if (!(r.width() > 0 && r.depth() > 0)) return StageCheck::failed("a rectangle has no area");
        if (r.x0 < -tol || r.y0 < -tol || r.x1 > fp.width + tol || r.y1 > fp.depth + tol)
            return StageCheck::failed("a rectangle leaves the footprint");
        area += r.area();
        for (std::size_t j = i + 1; j < all.size(); ++j)
            if (interiorsOverlap(r, all[j], tol)) return StageCheck::failed("two rectangles overlap");
    }
    if (std::abs(area - fp.width * fp.depth) > 1e-6 * fp.width * fp.depth) return StageCheck::failed("the footprint is not filled");
    // Every adjacency not listed as dropped has its wall, by the measure's own rule.
    const double line = lineTolerance(fp, t);
    const std::vector<std::pair<int, int>> ends = brief.adjacencyRooms();
    const std::set<int> dropped(v.dropped.begin(), v.dropped.end());
    for (std::size_t a = 0; a < brief.adjacencies.size(); ++a) {
        if (dropped.count(static_cast<int>(a))) continue;
        const Adjacency& adj = brief.adjacencies[a];
        const double wall = sharedWallLength(v.rooms[ends[a].first], v.rooms[ends[a].second], line);
        if (!wallMeets(wall, wallNeeded(brief, adj, t), t))
            return StageCheck::failed("adjacency " + adj.a + "–" + adj.b + " is not realised");
    }
    return {};
}

void reconcileDiagnostics(const Brief& brief, const PlanVariant& best, std::vector<Diagnostic>& diagnostics) {
    auto describe = [&](int k) {
        const Adjacency& a = brief.adjacencies[k];
        return brief.rooms[brief.roomIndex(a.a)].displayName() + "\u2013" + brief.rooms[brief.roomIndex(a.b)].displayName() +
               " (" + toString(a.kind) + ", " + toString(a.priority) + ")";
    };
    std::vector<int> droppedMusts;
    for (int d : best.dropped)
        if (brief.adjacencies[d].priority == Priority::Must) droppedMusts.push_back(d);
    std::vector<Diagnostic> out;
    for (Diagnostic d : diagnostics) {
        if (d.code == DiagnosticCode::FacadeUnmet || (d.code == DiagnosticCode::FacadeConflict && best.unmetFacade.empty())) continue;
        if (d.code == DiagnosticCode::DroppedAdjacency) {
            const bool same = std::all_of(d.adjacencies.begin(), d.adjacencies.end(), [&](int a) {
                return std::find(best.dropped.begin(), best.dropped.end(), a) != best.dropped.end();
            });
            if (!same) {
                // The adjacencies the best variant drops among this note's rooms.
                std::vector<int> mine;
                for (int k : droppedMusts) {
                    const Adjacency& a = brief.adjacencies[k];
                    const int ia = brief.roomIndex(a.a), ib = brief.roomIndex(a.b);
                    if (std::find(d.rooms.begin(), d.rooms.end(), ia) != d.rooms.end() &&
                        std::find(d.rooms.begin(), d.rooms.end(), ib) != d.rooms.end())
                        mine.push_back(k);
                }
                const std::size_t cut = d.message.find(". Dropped ");
                if (mine.empty() || cut == std::string::npos) continue; // the variant keeps what this note gave up
                std::string list;
                for (int k : mine) list += (list.empty() ? "" : ", ") + describe(k);
                d.message = d.message.substr(0, cut + 1) + " The best variant drops " + list + ".";
                d.adjacencies = mine;
            }
        }
        out.push_back(std::move(d));
    }
    for (int r : best.unmetFacade)
        out.push_back({Severity::Warning, DiagnosticCode::FacadeUnmet,
                       brief.rooms[r].displayName() + " does not reach the facade it wishes for in the best variant.",
                       {r}, {}});
    diagnostics = std::move(out);
}

SizingOptions planSizingOptions(const Brief& brief, const PlanOptions& options) {
    SizingOptions s = sizingOptionsFor(brief, options.anyWall, options.spareMinimum, options.grid);
    s.areaBands = true;
    return s;
}

namespace {

// Why no variant was kept when every one moved a fixed room or put a room on
// a cut-out: the rooms and cut-outs most often out of place, by name.
std::string heldPlacesSummary(const Brief& given, const std::vector<int>& away, std::size_t tried) {
    std::vector<std::string> rooms;
    bool cutouts = false;
    for (std::size_t i = 0; i < away.size(); ++i) {
        if (away[i] == 0) continue;
        if (i >= given.rooms.size()) cutouts = true;
        else rooms.push_back(given.rooms[i].displayName());
    }
    std::string list;
    for (std::size_t k = 0; k < rooms.size() && k < 4; ++k) list += (k ? ", " : "") + rooms[k];
    if (rooms.size() > 4) list += " and " + std::to_string(rooms.size() - 4) + " more";
    std::string what = !rooms.empty() ? "holds " + list + " where " + (rooms.size() == 1 ? "it is" : "they are") + " fixed"
                                      : std::string("keeps the footprint's cut-outs clear");
    if (!rooms.empty() && cutouts) what += " and keeps the cut-outs clear";
    return "No rectangular plan found " + what + " (" + std::to_string(tried) +
           " variant(s) tried): the other rooms do not fill the space round them as rectangles in the time given. "
           "Try a longer time limit, free a fixed room, or check the fixed places and cut-outs against the rooms' "
           "minimum widths.";
}

} // namespace

namespace {

// One computation of a plan: the brief as planned, the clock, and why it
// stopped (the caller asked, or the time limit ran out: what was found stands).
struct Planning {
    const Brief& given;
    const Brief brief; // plannedBrief(given): cut-outs as rooms held in place, targets spread
    const PlanOptions& options;
    const PlanMonitor* monitor;
    Plan plan;
    std::chrono::steady_clock::time_point started = std::chrono::steady_clock::now();
    bool stopped = false, outOfTime = false;

    double elapsed() const {
        return std::chrono::duration<double>(std::chrono::steady_clock::now() - started).count();
    }
    bool timeLeft() const { return options.timeLimit <= 0 || elapsed() < options.timeLimit; }
    // Reports progress; false once the caller asks to stop (time limits are
    // the routes' own: PlanRouteContext::timeLimit).
    bool report(double done, const char* step) {
        if (!stopped && monitor && monitor->progress && !monitor->progress(done, step)) stopped = true;
        return !stopped;
    }
};

// Runs one route in the share [from, to] of the progress; its variants join
// the plan's. False on an internal error (the plan says so).
bool runRoute(Planning& run, const PlanRoute& route, const AugmentResult& aug, double from, double to) {
    PlanRouteContext c{run.brief, aug, run.options, run.monitor, run.plan.footprint,
                   run.options.timeLimit > 0 ? std::max(1e-3, run.options.timeLimit - run.elapsed()) : 0.0,
                   [&run, from, to](double done, const char* step) { return run.report(from + (to - from) * done, step); }};
    const double began = run.elapsed();
    PlanRouteResult r = route.run(c);
    if (!run.timeLeft()) run.outOfTime = true;
    if (r.status == PlanRouteResult::Status::Internal) {
        run.plan.status = PlanStatus::Internal;
        run.plan.summary = r.problem;
        return false;
    }
    if (r.firstUsableSeconds >= 0 && run.plan.stats.firstUsableSeconds < 0)
        run.plan.stats.firstUsableSeconds = began + r.firstUsableSeconds;
    run.plan.stats.moves += r.moves;
    for (PlanVariant& v : r.variants) run.plan.variants.push_back(std::move(v));
    return true;
}

bool anyUsable(const Plan& plan) {
    for (const PlanVariant& v : plan.variants)
        if (v.sized && v.misses.usable()) return true;
    return false;
}

// The routes in order: when the brief names most contacts ('must'
// adjacencies ≥ 1.6 per room, as in a brief read off a drawn plan), its graph
// nearly is the extended graph, so the graph-first route goes first and the
// search follows if it finds nothing usable; otherwise the search leads and
// the graph-first route is the fallback.
bool runRoutes(Planning& run, const AugmentResult& aug) {
    int musts = 0;
    for (const Adjacency& a : run.brief.adjacencies) musts += a.priority == Priority::Must;
    const bool dense = run.brief.rooms.size() >= 4 && musts >= 1.6 * static_cast<double>(run.brief.rooms.size());
    const auto search = makeSearchRoute();
    const auto graphFirst = makeGraphFirstRoute(true);
    if (dense) {
        if (!runRoute(run, *graphFirst, aug, 0.0, 0.5)) return false;
        if (!anyUsable(run.plan) && !run.stopped && run.timeLeft()) return runRoute(run, *search, aug, 0.5, 1.0);
        return true;
    }
    if (!runRoute(run, *search, aug, 0.0, 0.85)) return false;
    if (!anyUsable(run.plan) && !run.stopped && run.timeLeft()) return runRoute(run, *graphFirst, aug, 0.85, 1.0);
    return true;
}

// A variant with a room on a cut-out, or a fixed room moved, is no plan of
// this building: a fixed room stays exactly where it is fixed. False when
// none is left (the plan says why).
bool keepHeldPlaces(Planning& run) {
    Plan& plan = run.plan;
    const double tol = 1e-6 * std::max(plan.footprint.width, plan.footprint.depth);
    const std::size_t before = plan.variants.size();
    std::vector<int> away(run.brief.rooms.size(), 0);
    std::erase_if(plan.variants, [&](const PlanVariant& v) {
        bool moved = false;
        for (std::size_t i = 0; i < run.brief.rooms.size() && i < v.rooms.size(); ++i)
            if (run.brief.rooms[i].fixed && !inPlace(run.brief.rooms[i], v.rooms[i], tol)) {
                ++away[i];
                moved = true;
            }
        return moved;
    });
    if (!plan.variants.empty()) return true;
    plan.status = run.stopped ? PlanStatus::Cancelled : PlanStatus::NoPlan;
    plan.summary = heldPlacesSummary(run.given, away, before);
    return false;
}

// One variant per arrangement of rooms (the same arrangement is reached from
// graphs that differ only by an added contact, or sized twice), the better
// ranked kept: the planner compares arrangements, not sizings.
void rankAndKeep(Planning& run) {
    Plan& plan = run.plan;
    rankVariants(run.brief, plan.footprint, plan.variants);
    std::vector<PlanVariant> kept;
    std::set<std::string> keys;
    for (PlanVariant& v : plan.variants) {
        if (static_cast<int>(kept.size()) >= run.options.variants) break;
        if (keys.insert(variantKey(run.brief, v)).second) kept.push_back(std::move(v));
    }
    plan.variants = std::move(kept);
    for (std::size_t i = 0; i < plan.variants.size(); ++i) plan.variants[i].rank = static_cast<int>(i) + 1;
}

// Status, diagnostics and summary, spoken of the best variant rather than of
// the augmentation's graph: it keeps everything, every 'must' (some 'should'
// not realised), or the augmentation says why it cannot.
void summarize(Planning& run, const AugmentResult& aug) {
    Plan& plan = run.plan;
    const Brief& brief = run.brief;
    const PlanVariant& v = plan.variants.front();
    reconcileDiagnostics(brief, v, plan.diagnostics);
    bool mustLost = !v.unmetFacade.empty();
    for (int d : v.dropped) mustLost = mustLost || brief.adjacencies[d].priority == Priority::Must;
    if (v.metrics.shortDoorWalls > 0)
        plan.diagnostics.push_back({Severity::Warning, DiagnosticCode::ShortDoorWall,
                                    std::to_string(v.metrics.shortDoorWalls) +
                                        " door adjacency(ies) get less than a door's width of wall in the footprint.",
                                    {}, {}});
    plan.status = run.stopped ? PlanStatus::Cancelled : mustLost ? PlanStatus::Compromised : PlanStatus::Ok;
    int shouldsDropped = 0, givenUp = static_cast<int>(v.unmetFacade.size());
    for (int d : v.dropped) (brief.adjacencies[d].priority == Priority::Should ? shouldsDropped : givenUp) += 1;
    plan.summary = run.stopped ? "Stopped: " + std::to_string(plan.variants.size()) + " variant(s) found so far."
                   : mustLost
                       ? aug.status == AugmentStatus::Compromised
                             ? aug.summary
                             : "No variant found keeps every 'must' adjacency and facade wish: the best gives up " +
                                   std::to_string(givenUp) + "."
                   : shouldsDropped == 0
                       ? std::string("A rectangular plan exists with every adjacency and facade wish.")
                       : "A rectangular plan exists with every 'must' adjacency and facade wish; " +
                             std::to_string(shouldsDropped) + " 'should' adjacency(ies) not realised in the best variant.";
}

// Everything but the relaxations. `run.plan` holds the result.
void plan(Planning& run) {
    Plan& plan = run.plan;
    plan.units = run.brief.units;
    plan.footprint = run.brief.effectiveFootprint();
    // A room no rectangle beside the cut-outs and fixed rooms can hold: proven, nothing to search.
    for (const Diagnostic& d : footprintProblems(run.given))
        if (d.code == DiagnosticCode::NoRectangleFits || d.code == DiagnosticCode::ThinPart) {
            plan.status = PlanStatus::NoPlan;
            plan.summary = "No rectangular plan exists: " + d.message;
            plan.diagnostics.push_back(d);
            return;
        }
    AugmentOptions augment;
    augment.poleRouteGraphs = std::max(1, run.options.augmentations);
    int asked = 0; // the caller is asked now and then, the clock every time
    augment.keepGoing = [&run, &asked] {
        return run.timeLeft() && (++asked % 64 != 0 || run.report(0.0, "drawing the adjacencies"));
    };
    const AugmentResult aug = buildExtendedGraph(run.brief, augment);
    if (run.stopped || !run.timeLeft()) { // the preparation took the time: nothing planned
        run.outOfTime = !run.stopped;
        plan.status = run.stopped ? PlanStatus::Cancelled : PlanStatus::NoPlan;
        plan.summary = run.stopped ? "Stopped before any variant was found."
                                   : "The time limit ended the work before any variant was found.";
        return;
    }
    plan.diagnostics = aug.diagnostics;
    if (aug.status == AugmentStatus::Empty || aug.status == AugmentStatus::Internal) {
        plan.status = aug.status == AugmentStatus::Empty ? PlanStatus::NoPlan : PlanStatus::Internal;
        plan.summary = aug.summary;
        return;
    }
    if (!runRoutes(run, aug)) return;
    if (plan.variants.empty()) { // stopped before the first layout
        plan.status = run.stopped ? PlanStatus::Cancelled : PlanStatus::NoPlan;
        plan.summary = run.stopped     ? "Stopped before any variant was found."
                       : run.outOfTime ? "The time limit ended the work before any variant was found."
                                       : aug.summary;
        return;
    }
    if (!keepHeldPlaces(run)) return;
    rankAndKeep(run);
    summarize(run, aug);
}

} // namespace

Plan planVariants(const Brief& given, const PlanOptions& options, const PlanMonitor* monitor) {
    Planning run{given, plannedBrief(given), options, monitor, {}};
    plan(run);
    run.plan.stats.seconds = run.elapsed();
    return std::move(run.plan);
}

Plan buildPlan(const Brief& given, const PlanOptions& options, const PlanMonitor* monitor) {
    // What must give, for the best variant: a few re-sizings per requirement
    // it misses, in a tenth of the time limit (0.2 to 2 s; 1 s without one)
    // kept back from the planning, so that the limit covers the whole run.
    const double relaxing = options.timeLimit > 0 ? std::clamp(0.1 * options.timeLimit, 0.2, 2.0) : 1.0;
    PlanOptions planning = options;
    if (options.relaxations && options.timeLimit > 0)
        planning.timeLimit = std::max(0.5 * options.timeLimit, options.timeLimit - relaxing);
    Planning run{given, plannedBrief(given), planning, monitor, {}};
    plan(run);
    Plan& plan = run.plan;
    const bool planned = !plan.variants.empty() && plan.status != PlanStatus::Internal;
    const double left = options.timeLimit > 0 ? std::min(relaxing, options.timeLimit - run.elapsed()) : relaxing;
    if (planned && !run.stopped && options.relaxations && left > 0.01)
        plan.variants.front().relaxations = relaxationsFor(given, plan.footprint, plan.variants.front(), 12, left);
    plan.stats.seconds = run.elapsed();
    if (planned && !run.stopped) run.report(1.0, "done");
    return std::move(plan);
}

void rankVariants(const Brief& brief, const Footprint& fp, std::vector<PlanVariant>& variants) {
    (void)brief;
    (void)fp;
    // A sized variant has its unmet requirements worked out; a merely fitted
    // one does not, so it never comes first. Then the score, which puts any
    // plan that keeps every 'must' ahead of one that does not.
    std::stable_sort(variants.begin(), variants.end(), [](const PlanVariant& a, const PlanVariant& b) {
        return a.sized != b.sized ? a.sized : a.score < b.score;
    });
}

} // namespace abut
