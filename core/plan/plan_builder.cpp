// SPDX-License-Identifier: MIT
#include "plan/plan_builder.h"

#include "plan/graph_first.h"
#include "brief/footprint_check.h"
#include "plan/relaxations.h"
#include "plan/variant_key.h"

#include "label/labeling_lattice.h"
#include "search/plan_search.h"

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
    out.score = variantScore(brief, fp, out);
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
    double score = v.metrics.worstAreaError + 0.25 * v.metrics.meanAreaError;
    for (int d : v.dropped) score += brief.adjacencies[d].priority == Priority::Must ? 1000.0 : 0.2;
    const RequirementMisses& m = v.misses;
    score += 1.0 * (m.area + m.minWidth + m.maxAspect + m.facade);
    score += 1000.0 * m.fixed; // a room away from where it is fixed weighs like a dropped 'must'
    for (std::size_t i = 0; i < v.rooms.size(); ++i) {
        const Rect& r = v.rooms[i];
        const double aspect = std::max(r.width(), r.depth()) / std::min(r.width(), r.depth());
        if (brief.rooms[i].maxAspect && aspect > *brief.rooms[i].maxAspect)
            score += 0.1 * (aspect - *brief.rooms[i].maxAspect);
    }
    const double area = fp.width * fp.depth;
    score += 0.2 * v.metrics.spareArea / area;
    double walls = 0;
    for (const Rect& r : v.rooms) walls += r.width() + r.depth();
    for (const Rect& r : v.spaces) walls += r.width() + r.depth();
    walls -= fp.width + fp.depth; // each interior wall is counted from both sides; the outline once
    score += 0.01 * walls / std::sqrt(area);
    return score;
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
    for (std::size_t a = 0; a < brief.adjacencies.size(); ++a) {
        if (std::count(v.dropped.begin(), v.dropped.end(), static_cast<int>(a))) continue;
        const Adjacency& adj = brief.adjacencies[a];
        const double wall = sharedWallLength(v.rooms[brief.roomIndex(adj.a)], v.rooms[brief.roomIndex(adj.b)], line);
        if (!wallMeets(wall, wallNeeded(brief, adj, t), t))
            return StageCheck::failed("adjacency " + adj.a + "–" + adj.b + " is not realised");
    }
    return {};
}

namespace {

// A sized plan found by the search, as a variant.
PlanVariant variantOf(const Brief& brief, const Footprint& fp, const SearchPlan& found) {
    PlanVariant v;
    v.extended = found.extended;
    v.labeling = found.labeling;
    v = applySizing(brief, fp, v, found.sized);
    v.oneSided = isOneSided(v.extended, v.labeling);
    return v;
}

// Streams the search's progress and improvements to a PlanMonitor.
class MonitorVisitor : public SearchVisitor {
public:
    MonitorVisitor(const Brief& brief, const Footprint& fp, const PlanMonitor* monitor, double from, double to)
        : brief_(brief), fp_(fp), monitor_(monitor), from_(from), to_(to) {}
    bool onRound(const SearchProgress& p) override {
        if (!monitor_ || !monitor_->progress) return true;
        stopped_ = !monitor_->progress(from_ + (to_ - from_) * p.done, p.usable ? "improving" : "searching");
        return !stopped_;
    }
    void onImproved(const SearchPlan& plan) override {
        if (monitor_ && monitor_->found) monitor_->found(variantOf(brief_, fp_, plan));
    }
    bool stopped() const { return stopped_; }

private:
    const Brief& brief_;
    const Footprint& fp_;
    const PlanMonitor* monitor_;
    double from_, to_;
    bool stopped_ = false;
};

} // namespace

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

Plan buildPlan(const Brief& given, const PlanOptions& options, const PlanMonitor* monitor) {
    const Brief brief = plannedBrief(given); // `surplus: spread` grows the targets to fill the footprint
    Plan plan;
    const auto started = std::chrono::steady_clock::now();
    auto elapsed = [&] { return std::chrono::duration<double>(std::chrono::steady_clock::now() - started).count(); };
    bool stopped = false;  // the caller asked to stop
    bool outOfTime = false; // the time limit ended the work: what was found stands
    auto keepGoing = [&](double done, const char* step) {
        if (!stopped && monitor && monitor->progress && !monitor->progress(done, step)) stopped = true;
        if (options.timeLimit > 0 && elapsed() > options.timeLimit) outOfTime = true;
        return !stopped && !outOfTime;
    };
    plan.units = brief.units;
    plan.footprint = brief.effectiveFootprint();
    // A room no rectangle beside the cut-outs and fixed rooms can hold: proven, nothing to search.
    for (const Diagnostic& d : footprintProblems(given))
        if (d.code == DiagnosticCode::NoRectangleFits) {
            plan.status = PlanStatus::NoPlan;
            plan.summary = "No rectangular plan exists: " + d.message;
            plan.diagnostics.push_back(d);
            return plan;
        }
    AugmentOptions augment;
    augment.poleRouteGraphs = std::max(1, options.augmentations);
    const AugmentResult aug = buildExtendedGraph(brief, augment);
    plan.diagnostics = aug.diagnostics;
    if (aug.status == AugmentStatus::Empty) {
        plan.status = PlanStatus::NoPlan;
        plan.summary = aug.summary;
        return plan;
    }
    if (aug.status == AugmentStatus::Internal) {
        plan.status = PlanStatus::Internal;
        plan.summary = aug.summary;
        return plan;
    }
    // When the brief names most contacts ('must' adjacencies ≥ 1.6 per room,
    // as in a brief read off a drawn plan), its graph nearly is the extended
    // graph: the graph-first pipeline goes straight to it and comes first.
    // Otherwise the plan search leads and that pipeline is the fallback.
    int musts = 0;
    for (const Adjacency& a : brief.adjacencies) musts += a.priority == Priority::Must;
    const bool dense = brief.rooms.size() >= 4 && musts >= 1.6 * static_cast<double>(brief.rooms.size());
    auto anyUsable = [&] {
        for (const PlanVariant& v : plan.variants)
            if (v.sized && v.misses.usable()) return true;
        return false;
    };
    auto runGraphFirst = [&](bool anneal, double from, double to) {
        auto going = [&](double done, const char* step) { return keepGoing(from + (to - from) * done, step); };
        return graphFirstVariants(brief, aug, options, plan, going, anneal && options.improvedCandidates > 0, monitor);
    };
    if (dense) {
        if (!runGraphFirst(true, 0.0, 0.5)) return plan;
        if (anyUsable()) plan.stats.firstUsableSeconds = elapsed();
    }
    if (!anyUsable() && !stopped && (options.timeLimit <= 0 || elapsed() < options.timeLimit)) {
        // The plan search: whole plans, arranged and sized together.
        SearchOptions search;
        search.seed = options.seed;
        search.threads = options.threads;
        search.timeLimit = options.timeLimit > 0 ? options.timeLimit - elapsed() : 0;
        search.moves = options.searchMoves;
        search.variantFlips = options.variantFlips;
        search.keep = std::max(1, options.variants);
        search.anyWall = options.anyWall;
        search.spareMinimum = options.spareMinimum;
        search.grid = options.grid;
        const double from = dense ? 0.5 : 0.0;
        MonitorVisitor visitor(brief, plan.footprint, monitor, from, dense ? 1.0 : 0.85);
        const SearchResult found = searchPlans(brief, search, &visitor);
        stopped = visitor.stopped();
        if (found.firstUsableSeconds >= 0) plan.stats.firstUsableSeconds = elapsed() - found.seconds + found.firstUsableSeconds;
        plan.stats.moves = found.moves;
        for (const SearchPlan& sp : found.plans) {
            PlanVariant v = variantOf(brief, plan.footprint, sp);
            const StageCheck check = checkVariant(brief, plan.footprint, v);
            if (!check.ok) {
                plan.status = PlanStatus::Internal;
                plan.summary = "Internal error: a searched plan failed its check (" + check.problem + "). Please report this brief.";
                return plan;
            }
            plan.variants.push_back(std::move(v));
        }
        // The graph-first pipeline as a fallback.
        if (!dense && found.status != SearchStatus::Usable && !stopped &&
            (options.timeLimit <= 0 || elapsed() < options.timeLimit))
            if (!runGraphFirst(true, 0.85, 1.0)) return plan;
    }
    if (plan.variants.empty()) { // stopped before the first layout
        plan.status = stopped ? PlanStatus::Cancelled : PlanStatus::NoPlan;
        plan.summary = stopped     ? "Stopped before any variant was found."
                       : outOfTime ? "The time limit ended the work before any variant was found."
                                   : aug.summary;
        return plan;
    }
    // A variant with a room on a cut-out, or a fixed room moved, is no plan
    // of this building: a fixed room stays exactly where it is fixed.
    const double tol = 1e-6 * std::max(plan.footprint.width, plan.footprint.depth);
    const std::size_t before = plan.variants.size();
    std::vector<int> away(brief.rooms.size(), 0);
    std::erase_if(plan.variants, [&](const PlanVariant& v) {
        bool moved = false;
        for (std::size_t i = 0; i < brief.rooms.size() && i < v.rooms.size(); ++i)
            if (brief.rooms[i].fixed && !inPlace(brief.rooms[i], v.rooms[i], tol)) {
                ++away[i];
                moved = true;
            }
        return moved;
    });
    if (plan.variants.empty()) {
        plan.status = stopped ? PlanStatus::Cancelled : PlanStatus::NoPlan;
        plan.summary = heldPlacesSummary(given, away, before);
        return plan;
    }
    rankVariants(brief, plan.footprint, plan.variants);
    // One variant per arrangement of rooms (the same arrangement is reached
    // from graphs that differ only by an added contact, or sized twice), the
    // better ranked kept: the planner compares arrangements, not sizings.
    std::vector<PlanVariant> kept;
    std::set<std::string> keys;
    for (PlanVariant& v : plan.variants) {
        if (static_cast<int>(kept.size()) >= options.variants) break;
        if (keys.insert(variantKey(brief, v)).second) kept.push_back(std::move(v));
    }
    plan.variants = std::move(kept);
    for (std::size_t i = 0; i < plan.variants.size(); ++i) plan.variants[i].rank = static_cast<int>(i) + 1;
    const PlanVariant& v = plan.variants.front();
    reconcileDiagnostics(brief, v, plan.diagnostics);
    bool mustLost = !v.unmetFacade.empty();
    for (int d : v.dropped) mustLost = mustLost || brief.adjacencies[d].priority == Priority::Must;
    if (v.metrics.shortDoorWalls > 0)
        plan.diagnostics.push_back({Severity::Warning, DiagnosticCode::ShortDoorWall,
                                    std::to_string(v.metrics.shortDoorWalls) +
                                        " door adjacency(ies) get less than a door's width of wall in the footprint.",
                                    {}, {}});
    // What must give, for the best variant: a few re-sizings per requirement it misses.
    // Bounded: a tenth of the time limit (0.2 to 2 s), 1 s without one.
    if (!stopped && options.relaxations)
        plan.variants.front().relaxations = relaxationsFor(
            given, plan.footprint, v, 12, options.timeLimit > 0 ? std::clamp(0.1 * options.timeLimit, 0.2, 2.0) : 1.0);
    plan.status = stopped ? PlanStatus::Cancelled : mustLost ? PlanStatus::Compromised : PlanStatus::Ok;
    // The summary speaks of the best variant, not of the augmentation's graph:
    // it keeps everything, every 'must' (some 'should' not realised), or the
    // augmentation says why it cannot.
    int shouldsDropped = 0, givenUp = static_cast<int>(v.unmetFacade.size());
    for (int d : v.dropped) (brief.adjacencies[d].priority == Priority::Should ? shouldsDropped : givenUp) += 1;
    plan.summary = stopped ? "Stopped: " + std::to_string(plan.variants.size()) + " variant(s) found so far."
                   : mustLost
                       ? aug.status == AugmentStatus::Compromised
                             ? aug.summary
                             : "No variant found keeps every 'must' adjacency and facade wish: the best gives up " +
                                   std::to_string(givenUp) + "."
                   : shouldsDropped == 0
                       ? std::string("A rectangular plan exists with every adjacency and facade wish.")
                       : "A rectangular plan exists with every 'must' adjacency and facade wish; " +
                             std::to_string(shouldsDropped) + " 'should' adjacency(ies) not realised in the best variant.";
    plan.stats.seconds = elapsed();
    if (!stopped) keepGoing(1.0, "done");
    return plan;
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
