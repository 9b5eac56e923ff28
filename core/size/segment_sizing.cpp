// SPDX-License-Identifier: MIT
#include "size/segment_sizing.h"

#include <cstdio>
#include <Eigen/Sparse>
#include <Eigen/SparseCholesky>

#include <algorithm>
#include <functional>
#include <cmath>
#include <limits>
#include <set>

namespace abut {

SizingProblem::SizingProblem(const Brief& brief, const ExtendedGraph& x, const RegularEdgeLabeling& rel,
                             const Footprint& footprint, const SizingOptions& options)
    : brief_(brief), x_(x), segs_(maximalSegments(x, rel)), footprint_(footprint), options_(options) {
    target_.resize(brief.rooms.size());
    for (std::size_t i = 0; i < brief.rooms.size(); ++i) target_[i] = brief.rooms[i].area;
    wallMin_ = wallMinimums(brief, x, segs_, options.doorWidth, options.anyWall);
}

SizingOptions sizingOptionsFor(const Brief& brief, double anyWall, double spareMinimum, double grid) {
    SizingOptions s;
    s.doorWidth = brief.doorWidth;
    s.anyWall = anyWall;
    s.spareMinimum = spareMinimum;
    s.grid = grid;
    return s;
}

std::vector<double> wallMinimums(const Brief& brief, const ExtendedGraph& x, const SegmentStructure& segs,
                                 double doorWidth, double anyWall) {
    std::vector<double> out(segs.walls.size(), anyWall);
    // Door pairs looked up once (room ids resolve by search): O(walls + adjacencies·rooms).
    std::set<std::pair<int, int>> doors;
    for (const Adjacency& a : brief.adjacencies)
        if (a.kind == AdjacencyKind::Door) doors.insert(std::minmax(brief.roomIndex(a.a), brief.roomIndex(a.b)));
    for (std::size_t i = 0; i < segs.walls.size(); ++i) {
        const auto& wall = segs.walls[i];
        if (x.isRoom(wall.u) && x.isRoom(wall.v) && doors.count(std::minmax(wall.u, wall.v)))
            out[i] = std::max(out[i], doorWidth);
    }
    return out;
}

std::vector<SizingProblem::Gap> SizingProblem::gaps() const {
    std::vector<Gap> out;
    for (int v = 0; v < x_.graph.vertexCount(); ++v) {
        if (x_.isPole(v)) continue;
        double m = 0.0;
        if (x_.isRoom(v)) m = brief_.rooms[v].minWidth.value_or(0.0);
        else m = options_.spareMinimum;
        m = std::max(m, 1e-3);
        out.push_back({true, segs_.west[v], segs_.east[v], m, v});
        out.push_back({false, segs_.south[v], segs_.north[v], m, v});
    }
    for (std::size_t i = 0; i < segs_.walls.size(); ++i) {
        const auto& wall = segs_.walls[i];
        // A vertical wall runs north–south: its length is measured in y.
        out.push_back({!wall.vertical, wall.from, wall.to, wallMin_[i], -1});
    }
    if (!cap_.empty())
        for (std::size_t i = 0; i < out.size() && i < cap_.size(); ++i) out[i].min = std::min(out[i].min, cap_[i]);
    return out;
}

bool SizingProblem::meetsMinimums(const SizingResult& layout) const {
    if (layout.x.size() != static_cast<std::size_t>(segs_.verticalCount) ||
        layout.y.size() != static_cast<std::size_t>(segs_.horizontalCount))
        return false;
    for (const Gap& g : gaps()) {
        const auto& c = g.vertical ? layout.x : layout.y;
        if (!(c[g.to] - c[g.from] > g.min)) return false;
    }
    return true;
}

void SizingProblem::holdMinimumsAt(const SizingResult& layout) {
    cap_.clear();
    const std::vector<Gap> all = gaps();
    cap_.assign(all.size(), std::numeric_limits<double>::infinity());
    for (std::size_t i = 0; i < all.size(); ++i) {
        const Gap& g = all[i];
        const auto& c = g.vertical ? layout.x : layout.y;
        const double extent = c[g.to] - c[g.from];
        if (extent < g.min) cap_[i] = std::max(1e-4, 0.999 * extent);
    }
}

namespace {

struct Coordinates {
    std::vector<double> x, y;
    double& at(bool axisX, int s) { return axisX ? x[s] : y[s]; }
    double at(bool axisX, int s) const { return axisX ? x[s] : y[s]; }
};

double longestSpan(int count, const std::vector<std::pair<std::pair<int, int>, double>>& arcs, int from, int to,
                   std::vector<double>& dist) {
    dist = longestPaths(count, arcs);
    return dist[to] - dist[from];
}

} // namespace

// One sizing: the coordinates being moved, the gaps they must keep open and
// which segments are free, shared by the steps of SizingProblem::solve.
struct SizingProblem::Solve {
    const SizingProblem& p;
    const SegmentStructure& s;
    const double W, D;
    std::vector<Gap> gap;
    std::vector<int> varX, varY;     // per segment: its variable, −1 when held
    std::vector<char> lockX, lockY;  // held: the outline, locked segments and rooms, fixed rooms' sides
    int nv = 0;
    Coordinates c;
    bool warmStart = false; // started from a strictly feasible layout
    SizingResult result;
    // Residuals (value, [(axisX, segment, derivative)]) of the error measure.
    struct Term { bool axisX; int seg; double d; };
    std::vector<double> r;
    std::vector<std::vector<Term>> J;

    explicit Solve(const SizingProblem& problem)
        : p(problem), s(problem.segs_), W(problem.footprint_.width), D(problem.footprint_.depth), gap(problem.gaps()) {}

    double slack(const Gap& g) const { return c.at(g.vertical, g.to) - c.at(g.vertical, g.from) - g.min; }
    bool strictlyFeasible() const {
        for (const Gap& g : gap)
            if (!(slack(g) > 0)) return false;
        return true;
    }
    int var(bool axisX, int seg) const { return axisX ? varX[seg] : varY[seg]; }
    void numberVariables();
    void lockOutlineAndRooms();
    bool nearestFix(const std::function<bool(bool, int)>& fixed);
    void start(const SizingResult* from);
    void coldStart(const std::vector<double>& natural);
    void holdFixedRooms();
    void residuals(bool withJacobian);
    double objective();
    double merit(double mu);
    void newton(bool warm);
    void snapToGrid();
};

void SizingProblem::Solve::numberVariables() {
    nv = 0;
    varX.assign(s.verticalCount, -1);
    varY.assign(s.horizontalCount, -1);
    for (int k = 0; k < s.verticalCount; ++k) varX[k] = lockX[k] ? -1 : nv++;
    for (int k = 0; k < s.horizontalCount; ++k) varY[k] = lockY[k] ? -1 : nv++;
}

// Free variables: every segment but the outline and the locked ones.
void SizingProblem::Solve::lockOutlineAndRooms() {
    lockX.assign(s.verticalCount, 0);
    lockY.assign(s.horizontalCount, 0);
    for (int k : p.options_.lockedVertical) lockX[k] = 1;
    for (int k : p.options_.lockedHorizontal) lockY[k] = 1;
    for (int v : p.options_.lockedRooms) {
        lockX[s.west[v]] = lockX[s.east[v]] = 1;
        lockY[s.south[v]] = lockY[s.north[v]] = 1;
    }
    lockX[s.westSegment] = lockX[s.eastSegment] = 1;
    lockY[s.southSegment] = lockY[s.northSegment] = 1;
    numberVariables();
}

// Pushes the two ends of each gap that is too small apart (a fixed end
// stays), sweep after sweep, so only what must move moves. Returns whether
// every gap is then strictly met.
bool SizingProblem::Solve::nearestFix(const std::function<bool(bool, int)>& fixed) {
    for (int sweep = 0; sweep < 400; ++sweep) {
        if (strictlyFeasible()) return true;
        for (const Gap& g : gap) {
            const double want = g.min * 1.001 + 1e-9 * std::max(W, D);
            const double deficit = want - (c.at(g.vertical, g.to) - c.at(g.vertical, g.from));
            if (deficit <= 0) continue;
            const bool fromFixed = fixed(g.vertical, g.from), toFixed = fixed(g.vertical, g.to);
            if (fromFixed && toFixed) continue;
            const double share = fromFixed || toFixed ? 1.0 : 0.5;
            if (!toFixed) c.at(g.vertical, g.to) += share * deficit;
            if (!fromFixed) c.at(g.vertical, g.from) -= share * deficit;
        }
    }
    return strictlyFeasible();
}

// Warm from `from` when it is a strictly feasible layout of this problem,
// or after the nearest fix of it; else a cold start that keeps its
// proportions (or, without one, a square of each room's target).
void SizingProblem::Solve::start(const SizingResult* from) {
    bool warm = false;
    std::vector<double> natural(gap.size(), 0.0);
    for (std::size_t i = 0; i < gap.size(); ++i)
        if (gap[i].vertex >= 0 && p.x_.isRoom(gap[i].vertex)) natural[i] = std::sqrt(p.target_[gap[i].vertex]);
    if (from && from->x.size() == static_cast<std::size_t>(s.verticalCount) &&
        from->y.size() == static_cast<std::size_t>(s.horizontalCount)) {
        c.x = from->x;
        c.y = from->y;
        warm = strictlyFeasible();
        if (!warm) {
            for (std::size_t i = 0; i < gap.size(); ++i)
                natural[i] = std::max(0.0, c.at(gap[i].vertical, gap[i].to) - c.at(gap[i].vertical, gap[i].from));
            const Coordinates saved = c;
            warm = nearestFix([&](bool axisX, int seg) { return (axisX ? varX[seg] : varY[seg]) < 0; });
            if (!warm) c = saved;
        }
    }
    if (!warm) coldStart(natural);
    c.x[s.westSegment] = 0;
    c.x[s.eastSegment] = W;
    c.y[s.southSegment] = 0;
    c.y[s.northSegment] = D;
    warmStart = warm;
}

// Longest paths of minimum gaps plus a share of each natural extent, the
// share as large as fits, then stretched to the footprint. When even the
// minimums do not fit, they are scaled down to fit (Relaxed).
void SizingProblem::Solve::coldStart(const std::vector<double>& natural) {
    auto layout = [&](double t, std::vector<double>& xs, std::vector<double>& ys) {
        std::vector<std::pair<std::pair<int, int>, double>> ax, ay;
        for (std::size_t i = 0; i < gap.size(); ++i) {
            const Gap& g = gap[i];
            (g.vertical ? ax : ay).push_back({{g.from, g.to}, std::max(g.min * 1.01, t * natural[i])});
        }
        const double sx = longestSpan(s.verticalCount, ax, s.westSegment, s.eastSegment, xs);
        const double sy = longestSpan(s.horizontalCount, ay, s.southSegment, s.northSegment, ys);
        return std::make_pair(sx, sy);
    };
    std::vector<double> xs, ys;
    auto [mx, my] = layout(0.0, xs, ys);
    if (mx >= W || my >= D) {
        const double scaleMin = 0.98 * std::min(W / mx, D / my);
        result.status = SizingStatus::Relaxed;
        result.relaxation = scaleMin;
        for (Gap& g : gap) g.min *= scaleMin;
    }
    double lo = 0.0, hi = 1.0;
    auto fits = [&](double t) {
        auto [a, b] = layout(t, xs, ys);
        return a < W && b < D;
    };
    while (fits(hi) && hi < 1e6) {
        lo = hi;
        hi *= 2;
    }
    for (int i = 0; i < 30; ++i) {
        const double mid = 0.5 * (lo + hi);
        (fits(mid) ? lo : hi) = mid;
    }
    auto [ex, ey] = layout(0.9 * lo, xs, ys);
    c.x.resize(s.verticalCount);
    c.y.resize(s.horizontalCount);
    for (int k = 0; k < s.verticalCount; ++k) c.x[k] = (xs[k] - xs[s.westSegment]) * W / ex;
    for (int k = 0; k < s.horizontalCount; ++k) c.y[k] = (ys[k] - ys[s.southSegment]) * D / ey;
}

// Rooms fixed in place (and cut-outs): their four sides go where they are
// fixed and stay; the other segments make way (nearest fix). When that
// cannot be done strictly, the layout is sized as it was and the room is
// reported away from its place.
void SizingProblem::Solve::holdFixedRooms() {
    std::vector<char> pinX(s.verticalCount, 0), pinY(s.horizontalCount, 0);
    Coordinates pinned = c;
    bool consistent = true, any = false;
    auto pin = [&](bool axisX, int seg, double value) {
        std::vector<char>& flag = axisX ? pinX : pinY;
        if (flag[seg] && std::abs(pinned.at(axisX, seg) - value) > 1e-9 * std::max(W, D)) consistent = false;
        flag[seg] = 1;
        pinned.at(axisX, seg) = value;
    };
    // The outline stays where it is: a fixed room whose side lies on it
    // in this layout but is fixed elsewhere cannot be held here.
    pin(true, s.westSegment, 0);
    pin(true, s.eastSegment, W);
    pin(false, s.southSegment, 0);
    pin(false, s.northSegment, D);
    for (int v = 0; v < static_cast<int>(p.brief_.rooms.size()) && v < p.x_.graph.vertexCount(); ++v) {
        if (!p.x_.isRoom(v) || !p.brief_.rooms[v].fixed) continue;
        const Placement& f = *p.brief_.rooms[v].fixed;
        any = true;
        pin(true, s.west[v], f.x);
        pin(true, s.east[v], f.x + f.width);
        pin(false, s.south[v], f.y);
        pin(false, s.north[v], f.y + f.depth);
    }
    if (!any || !consistent) return;
    const Coordinates saved = c;
    c = pinned;
    const bool held = nearestFix([&](bool axisX, int seg) {
        return (axisX ? lockX[seg] || pinX[seg] : lockY[seg] || pinY[seg]) != 0;
    });
    if (!held) {
        c = saved;
        return;
    }
    for (int k = 0; k < s.verticalCount; ++k) lockX[k] = lockX[k] || pinX[k];
    for (int k = 0; k < s.horizontalCount; ++k) lockY[k] = lockY[k] || pinY[k];
}

void SizingProblem::Solve::residuals(bool withJacobian) {
    const int n = p.x_.graph.vertexCount();
    double spareScale = 0;
    for (double a : p.target_) spareScale += a;
    spareScale = p.target_.empty() ? 1.0 : spareScale / p.target_.size();
    const SizingOptions& o = p.options_;
    r.clear();
    if (withJacobian) J.clear();
    for (int v = 0; v < n; ++v) {
        if (p.x_.isPole(v)) continue;
        const double w = c.x[s.east[v]] - c.x[s.west[v]], h = c.y[s.north[v]] - c.y[s.south[v]];
        if (p.x_.isRoom(v)) {
            const double A = p.target_[v];
            // The area aimed at: the preferred one when given, else the target.
            const double aim = p.preferred_.empty() || p.preferred_[v] <= 0 ? A : p.preferred_[v];
            const double e = std::log(w * h / A);
            const std::vector<Term> de{{true, s.east[v], 1.0 / w}, {true, s.west[v], -1.0 / w},
                                       {false, s.north[v], 1.0 / h}, {false, s.south[v], -1.0 / h}};
            if (o.areaBands) {
                // Free within the band; outside it, the distance to the band.
                const double tol = p.brief_.rooms[v].tolerance();
                const double up = std::log1p(tol), down = std::log1p(-std::min(tol, 0.99));
                const double outside = e > up ? e - up : e < down ? e - down : 0.0;
                r.push_back(outside);
                if (withJacobian) J.push_back(outside != 0.0 ? de : std::vector<Term>{});
                // A light pull towards the preferred area (the target
                // unless set) keeps the steps well posed.
                const double g = std::sqrt(o.inBandWeight);
                r.push_back(g * std::log(w * h / aim));
                if (withJacobian) {
                    std::vector<Term> scaled = de;
                    for (Term& t : scaled) t.d *= g;
                    J.push_back(std::move(scaled));
                }
            } else {
                r.push_back(std::log(w * h / aim));
                if (withJacobian) J.push_back(de);
            }
            const double maxAspect = p.brief_.rooms[v].maxAspect.value_or(0.0);
            if (maxAspect >= 1.0) {
                const double g = std::sqrt(o.aspectWeight);
                const bool wide = w > h;
                const double ratio = wide ? w / h : h / w;
                const double excess = std::max(0.0, ratio - maxAspect);
                r.push_back(g * excess);
                if (withJacobian) {
                    if (excess <= 0) J.push_back({});
                    else if (wide)
                        J.push_back({{true, s.east[v], g / h}, {true, s.west[v], -g / h},
                                     {false, s.north[v], -g * w / (h * h)}, {false, s.south[v], g * w / (h * h)}});
                    else
                        J.push_back({{false, s.north[v], g / w}, {false, s.south[v], -g / w},
                                     {true, s.east[v], -g * h / (w * w)}, {true, s.west[v], g * h / (w * w)}});
                }
            }
        } else if (!p.preferred_.empty() && p.preferred_[v] > 0) {
            // A spare space meant to hold this much: log error, like a room's.
            const double g = std::sqrt(o.spareWeight);
            r.push_back(g * std::log(w * h / p.preferred_[v]));
            if (withJacobian)
                J.push_back({{true, s.east[v], g / w}, {true, s.west[v], -g / w},
                             {false, s.north[v], g / h}, {false, s.south[v], -g / h}});
        } else {
            const double g = std::sqrt(o.spareWeight) / spareScale;
            r.push_back(g * w * h);
            if (withJacobian)
                J.push_back({{true, s.east[v], g * h}, {true, s.west[v], -g * h},
                             {false, s.north[v], g * w}, {false, s.south[v], -g * w}});
        }
    }
}

double SizingProblem::Solve::objective() {
    residuals(false);
    double f = 0;
    for (double q : r) f += 0.5 * q * q;
    return f;
}

double SizingProblem::Solve::merit(double mu) {
    double b = 0;
    for (const Gap& g : gap) {
        const double sl = slack(g);
        if (!(sl > 0)) return std::numeric_limits<double>::infinity();
        b -= std::log(sl);
    }
    return objective() + mu * b;
}

// Damped Gauss–Newton on the barrier merit, μ shrinking from 1e-3 (1e-9
// warm) to 1e-11; a fraction-to-the-boundary rule and backtracking keep
// every slack positive.
void SizingProblem::Solve::newton(bool warm) {
    if (nv == 0) return;
    Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>> solver;
    bool analysed = false;
    const double scale = std::max(W, D);
    double mu = warm ? 1e-9 : 1e-3;
    double damping = 1e-6;
    const double muEnd = 1e-11;
    int steps = 0;
    const int maxSteps = p.options_.maxNewtonSteps;
    while (steps < maxSteps) {
        for (int inner = 0; inner < 60 && steps < maxSteps; ++inner, ++steps) {
            if (p.deadline_ && std::chrono::steady_clock::now() >= *p.deadline_) {
                result.newtonSteps = steps;
                return;
            }
            residuals(true);
            std::vector<Eigen::Triplet<double>> trip;
            Eigen::VectorXd grad = Eigen::VectorXd::Zero(nv);
            for (std::size_t i = 0; i < r.size(); ++i) {
                for (const Term& a : J[i]) {
                    const int pa = var(a.axisX, a.seg);
                    if (pa < 0) continue;
                    grad[pa] += r[i] * a.d;
                    for (const Term& b : J[i]) {
                        const int q = var(b.axisX, b.seg);
                        if (q >= 0) trip.emplace_back(pa, q, a.d * b.d);
                    }
                }
            }
            for (const Gap& g : gap) {
                const double sl = slack(g);
                const int pt = var(g.vertical, g.to), q = var(g.vertical, g.from);
                const double h = mu / (sl * sl);
                if (pt >= 0) {
                    grad[pt] -= mu / sl;
                    trip.emplace_back(pt, pt, h);
                }
                if (q >= 0) {
                    grad[q] += mu / sl;
                    trip.emplace_back(q, q, h);
                }
                if (pt >= 0 && q >= 0) {
                    trip.emplace_back(pt, q, -h);
                    trip.emplace_back(q, pt, -h);
                }
            }
            Eigen::SparseMatrix<double> H(nv, nv);
            H.setFromTriplets(trip.begin(), trip.end());
            // Levenberg–Marquardt damping on the diagonal, adapted below.
            for (int k = 0; k < nv; ++k) H.coeffRef(k, k) += damping * H.coeff(k, k) + 1e-12;
            if (!analysed) {
                solver.analyzePattern(H);
                analysed = true;
            }
            solver.factorize(H);
            if (solver.info() != Eigen::Success) break;
            const Eigen::VectorXd step = solver.solve(-grad);
            // Fraction to the boundary: keep every slack positive.
            double alpha = 1.0;
            auto delta = [&](bool axisX, int seg) {
                const int k = var(axisX, seg);
                return k < 0 ? 0.0 : step[k];
            };
            for (const Gap& g : gap) {
                const double ds = delta(g.vertical, g.to) - delta(g.vertical, g.from);
                if (ds < 0) alpha = std::min(alpha, 0.95 * slack(g) / -ds);
            }
            const double before = merit(mu);
            const Coordinates saved = c;
            bool accepted = false;
            for (int back = 0; back < 30; ++back) {
                for (int k = 0; k < s.verticalCount; ++k)
                    if (varX[k] >= 0) c.x[k] = saved.x[k] + alpha * step[varX[k]];
                for (int k = 0; k < s.horizontalCount; ++k)
                    if (varY[k] >= 0) c.y[k] = saved.y[k] + alpha * step[varY[k]];
                if (merit(mu) <= before + 1e-4 * alpha * grad.dot(step)) {
                    accepted = true;
                    break;
                }
                alpha *= 0.5;
            }
            if (!accepted) {
                c = saved;
                if (damping > 1e6) break;
                damping *= 10;
                continue;
            }
            damping = std::max(1e-9, damping * 0.3);
            if (alpha * step.lpNorm<Eigen::Infinity>() < 1e-10 * scale) break;
        }
        if (mu <= muEnd) break;
        mu = std::max(muEnd, mu * 0.05);
    }
    result.newtonSteps = steps;
}

// Planning grid: move each free segment to the nearest module line when
// that keeps every requirement.
void SizingProblem::Solve::snapToGrid() {
    const double grid = p.options_.grid;
    if (grid <= 0) return;
    auto snap = [&](bool axisX, int seg) {
        double& v = c.at(axisX, seg);
        const double old = v;
        v = std::round(old / grid) * grid;
        for (const Gap& g : gap)
            if (g.vertical == axisX && (g.from == seg || g.to == seg) && slack(g) < -1e-12) {
                v = old;
                return false;
            }
        return true;
    };
    for (int k = 0; k < s.verticalCount; ++k)
        if (varX[k] >= 0 && !snap(true, k))
            result.unmet.push_back({RequirementKind::Grid, -1, -1, grid, c.x[k], "a wall could not be put on the planning grid"});
    for (int k = 0; k < s.horizontalCount; ++k)
        if (varY[k] >= 0 && !snap(false, k))
            result.unmet.push_back({RequirementKind::Grid, -1, -1, grid, c.y[k], "a wall could not be put on the planning grid"});
}

SizingResult SizingProblem::solve(const SizingResult* start) const {
    Solve run(*this);
    run.lockOutlineAndRooms();
    run.start(start);
    run.holdFixedRooms();
    run.numberVariables();
    run.newton(run.warmStart);
    run.snapToGrid();
    run.result.x = run.c.x;
    run.result.y = run.c.y;
    run.result.objective = run.objective();
    describe(run.result);
    return std::move(run.result);
}

namespace {
std::string shortNumber(double v) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.1f", v);
    return buf;
}
} // namespace

void SizingProblem::describe(SizingResult& result) const {
    const SegmentStructure& s = segs_;
    const int n = x_.graph.vertexCount();
    const std::vector<double>& cx = result.x;
    const std::vector<double>& cy = result.y;
    result.rects.resize(n);
    for (int v = 0; v < n; ++v)
        if (!x_.isPole(v))
            result.rects[v] = {cx[s.west[v]], cy[s.south[v]], cx[s.east[v]], cy[s.north[v]]};
    result.rooms.resize(brief_.rooms.size());
    for (std::size_t i = 0; i < brief_.rooms.size(); ++i) {
        const Rect& q = result.rects[i];
        RoomSize& rs = result.rooms[i];
        rs.area = q.area();
        rs.deviation = (rs.area - target_[i]) / target_[i];
        rs.aspect = std::max(q.width(), q.depth()) / std::min(q.width(), q.depth());
        const Room& room = brief_.rooms[i];
        if (std::abs(rs.deviation) > 0.01)
            result.unmet.push_back({RequirementKind::Area, static_cast<int>(i), -1, target_[i], rs.area,
                                    room.displayName() + " gets " + shortNumber(rs.area) + " instead of " +
                                        shortNumber(target_[i])});
        if (room.minWidth && std::min(q.width(), q.depth()) < *room.minWidth - 1e-9)
            result.unmet.push_back({RequirementKind::MinWidth, static_cast<int>(i), -1, *room.minWidth,
                                    std::min(q.width(), q.depth()), room.displayName() + " is narrower than its minimum width"});
        if (room.maxAspect && rs.aspect > *room.maxAspect + 1e-6)
            result.unmet.push_back({RequirementKind::MaxAspect, static_cast<int>(i), -1, *room.maxAspect, rs.aspect,
                                    room.displayName() + " is more elongated than its maximum aspect"});
    }
    for (std::size_t i = 0; i < segs_.walls.size(); ++i) {
        const auto& wall = segs_.walls[i];
        if (wallMin_[i] <= options_.anyWall) continue;
        const double len = wall.vertical ? cy[wall.to] - cy[wall.from] : cx[wall.to] - cx[wall.from];
        if (len < wallMin_[i] - 1e-9)
            result.unmet.push_back({RequirementKind::Door, wall.u, wall.v, wallMin_[i], len, "a door wall is shorter than a door"});
    }
}

SizingResult SizingProblem::evaluate(std::vector<double> x, std::vector<double> y) const {
    SizingResult r;
    r.x = std::move(x);
    r.y = std::move(y);
    describe(r);
    return r;
}

SizingResult SizingProblem::stateOf(const std::vector<Rect>& rects) const {
    const SegmentStructure& s = segs_;
    std::vector<double> x(s.verticalCount, 0.0), y(s.horizontalCount, 0.0);
    for (int v = 0; v < x_.graph.vertexCount() && v < static_cast<int>(rects.size()); ++v) {
        if (x_.isPole(v)) continue;
        x[s.west[v]] = rects[v].x0;
        x[s.east[v]] = rects[v].x1;
        y[s.south[v]] = rects[v].y0;
        y[s.north[v]] = rects[v].y1;
    }
    return evaluate(std::move(x), std::move(y));
}

std::pair<double, double> SizingProblem::segmentRange(const SizingResult& current, bool vertical, int segment) const {
    double lo = -std::numeric_limits<double>::infinity(), hi = std::numeric_limits<double>::infinity();
    const auto& co = vertical ? current.x : current.y;
    for (const Gap& g : gaps()) {
        if (g.vertical != vertical) continue;
        if (g.to == segment) lo = std::max(lo, co[g.from] + g.min);
        if (g.from == segment) hi = std::min(hi, co[g.to] - g.min);
    }
    return {lo, hi};
}

} // namespace abut
