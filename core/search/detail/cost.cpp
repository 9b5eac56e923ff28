// SPDX-License-Identifier: MIT
#include "search/detail/cost.h"

#include <algorithm>
#include <cmath>

namespace abut::detail {

namespace {

double sideDistance(const Rect& r, Side s, const Rect& outer) {
    switch (s) {
    case Side::N: return outer.y1 - r.y1;
    case Side::E: return outer.x1 - r.x1;
    case Side::S: return r.y0 - outer.y0;
    case Side::W: return r.x0 - outer.x0;
    }
    return 0;
}

} // namespace

double exteriorDistance(const SearchProblem& p, const std::vector<Rect>& rect, const Rect& r, Side s) {
    double d = sideDistance(r, s, p.bounds);
    const double tol = p.lineTolerance();
    // Cut-outs that are blocks count where the layout has them (the search
    // pulls them to their places), the others where they are.
    auto beyond = [&](const Rect& c) {
        const bool acrossX = std::min(r.x1, c.x1) - std::max(r.x0, c.x0) > tol;
        const bool acrossY = std::min(r.y1, c.y1) - std::max(r.y0, c.y0) > tol;
        switch (s) {
        case Side::N: if (acrossX && c.y0 >= r.y1 - tol) d = std::min(d, c.y0 - r.y1); break;
        case Side::S: if (acrossX && c.y1 <= r.y0 + tol) d = std::min(d, r.y0 - c.y1); break;
        case Side::E: if (acrossY && c.x0 >= r.x1 - tol) d = std::min(d, c.x0 - r.x1); break;
        case Side::W: if (acrossY && c.x1 <= r.x0 + tol) d = std::min(d, r.x0 - c.x1); break;
        }
    };
    for (int k : p.cutouts) beyond(rect[k]);
    for (const Rect& c : p.cutoutRects) beyond(c);
    return d;
}

namespace {

// A block held in place: the search's layouts have exact areas, so it is
// pulled towards its place (the sizing then holds it exactly); the layouts
// that hold blocks bend the areas of the others, which costs.
void placeTerm(const SearchProblem& p, int i, const Rect& r, Evaluation& e, const CostWeights& w) {
    const SearchProblem::Block& b = p.blocks[i];
    const double L = p.scale;
    if (b.pin) {
        const Rect& f = *b.pin;
        const double d = (std::abs(r.x0 - f.x0) + std::abs(r.x1 - f.x1) + std::abs(r.y0 - f.y0) +
                          std::abs(r.y1 - f.y1)) / L;
        e.cost += w.pinned * d + (d > 0.02 ? w.pinnedAway : 0.0);
        if (d > 0.08) ++e.hard;
    }
    if (!b.cutout && !p.pins.empty() && !b.spare) {
        const double off = std::abs(std::log(r.area() / p.area[i]));
        if (off > 0.5 * b.tolerance) e.cost += w.bentArea * (off - 0.5 * b.tolerance);
        if (off > 2.0 * b.tolerance + 0.02) ++e.hard;
    }
}

void facadeTerm(const SearchProblem& p, int i, const std::vector<Rect>& rect, Evaluation& e,
                std::vector<Violation>* out, const CostWeights& w) {
    const SearchProblem::Block& b = p.blocks[i];
    const Rect& r = rect[i];
    const double L = p.scale, tol = p.lineTolerance();
    double nearest = 1e300;
    bool missed = false;
    for (Side s : allSides) {
        const double d = std::max(0.0, exteriorDistance(p, rect, r, s));
        nearest = std::min(nearest, d);
        if (b.facade.has(s) && d > tol) {
            e.cost += w.facade + 2.0 * d / L;
            missed = true;
            if (out) out->push_back({RequirementKind::Facade, i, static_cast<int>(s)});
        }
    }
    if (b.facade.anySide && nearest > tol) {
        e.cost += w.facade + 2.0 * nearest / L;
        missed = true;
        if (out) out->push_back({RequirementKind::Facade, i, -1});
    }
    if (missed) ++e.hard;
}

} // namespace

void blockTerm(const SearchProblem& p, int i, const std::vector<Rect>& rect, Evaluation& e,
               std::vector<Violation>* out, const CostWeights& w) {
    const SearchProblem::Block& b = p.blocks[i];
    const Rect& r = rect[i];
    placeTerm(p, i, r, e, w);
    if (b.cutout) return;
    const double width = r.width(), depth = r.depth();
    const double shortSide = std::min(width, depth), longSide = std::max(width, depth);
    const double aspect = longSide / std::max(shortSide, 1e-12);
    if (b.spare) {
        if (shortSide < b.minWidth) e.cost += 0.5 * (0.3 + (b.minWidth - shortSide) / b.minWidth);
        if (aspect > 4) e.cost += 0.05 * (aspect - 4) / 4;
        return;
    }
    const double slack = p.thresholds.slack;
    if (b.minWidth > 0 && shortSide < b.minWidth * (1 - slack)) {
        e.cost += 0.3 + w.narrow * (b.minWidth - shortSide) / b.minWidth;
        ++e.hard;
        if (out) out->push_back({RequirementKind::MinWidth, i, -1});
    }
    if (b.maxAspect > 0 && longSide > b.maxAspect * shortSide * (1 + slack)) {
        e.cost += 0.3 + w.elongated * (aspect - b.maxAspect) / b.maxAspect;
        ++e.hard;
        if (out) out->push_back({RequirementKind::MaxAspect, i, -1});
    } else if (b.maxAspect <= 0 && !b.circulation && aspect > 3) {
        e.cost += w.sliver * (aspect - 3) / 3; // no limit given: still no slivers
    }
    if (!b.facade.empty()) facadeTerm(p, i, rect, e, out, w);
}

void linkTerm(const SearchProblem& p, int li, const std::vector<Rect>& rect, Evaluation& e,
              std::vector<Violation>* out, const CostWeights& w) {
    const SearchProblem::Link& l = p.links[li];
    const double L = p.scale;
    const Rect& a = rect[l.a];
    const Rect& b = p.rectOf(l.b, rect);
    const double len = sharedWallLength(a, b, p.lineTolerance());
    if (len >= l.aim * (1 - p.thresholds.slack)) return;
    if (len > 0) {
        e.cost += l.weight * (w.shortWall + 0.7 * (l.aim - len) / l.aim);
    } else {
        const double gx = std::max(0.0, std::max(a.x0, b.x0) - std::min(a.x1, b.x1));
        const double gy = std::max(0.0, std::max(a.y0, b.y0) - std::min(a.y1, b.y1));
        e.cost += l.weight * (w.missingWall + 2.0 * (gx + gy) / L);
    }
    // Short of the aim costs and draws the moves; short of the threshold is a miss.
    if (l.must && !wallMeets(len, l.need, p.thresholds)) ++e.hard;
    if (out) out->push_back({l.door ? RequirementKind::Door : RequirementKind::Adjacency, l.a, l.b});
}

Evaluation evaluate(const SearchProblem& p, const std::vector<Rect>& rect, std::vector<Violation>* out,
                    const CostWeights& w) {
    Evaluation e;
    if (out) out->clear();
    for (int i = 0; i < p.blockCount(); ++i) blockTerm(p, i, rect, e, out, w);
    for (int l = 0; l < static_cast<int>(p.links.size()); ++l) linkTerm(p, l, rect, e, out, w);
    return e;
}

void CostCache::reset(const SearchProblem& p, const std::vector<Rect>& rects, const CostWeights& w) {
    block_.assign(p.blockCount(), {});
    link_.assign(p.links.size(), {});
    total_ = {};
    for (int i = 0; i < p.blockCount(); ++i) {
        blockTerm(p, i, rects, block_[i].e, &block_[i].v, w);
        total_.cost += block_[i].e.cost;
        total_.hard += block_[i].e.hard;
    }
    for (int l = 0; l < static_cast<int>(p.links.size()); ++l) {
        linkTerm(p, l, rects, link_[l].e, &link_[l].v, w);
        total_.cost += link_[l].e.cost;
        total_.hard += link_[l].e.hard;
    }
    stamp_.assign(p.links.size(), 0);
    stale_ = true;
}

Evaluation CostCache::trial(const SearchProblem& p, const std::vector<Rect>& rects, const std::vector<int>& changed,
                            const CostWeights& w) {
    newBlock_.clear();
    newLink_.clear();
    ++epoch_;
    Evaluation t = total_;
    for (int i : changed) {
        Term term;
        blockTerm(p, i, rects, term.e, &term.v, w);
        t.cost += term.e.cost - block_[i].e.cost;
        t.hard += term.e.hard - block_[i].e.hard;
        newBlock_.emplace_back(i, std::move(term));
        for (int l : p.linksOf[i]) {
            if (stamp_[l] == epoch_) continue;
            stamp_[l] = epoch_;
            Term lt;
            linkTerm(p, l, rects, lt.e, &lt.v, w);
            t.cost += lt.e.cost - link_[l].e.cost;
            t.hard += lt.e.hard - link_[l].e.hard;
            newLink_.emplace_back(l, std::move(lt));
        }
    }
    trialTotal_ = t;
    return t;
}

void CostCache::commit() {
    for (auto& [i, term] : newBlock_) block_[i] = std::move(term);
    for (auto& [l, term] : newLink_) link_[l] = std::move(term);
    total_ = trialTotal_;
    stale_ = true;
}

const std::vector<Violation>& CostCache::violations() {
    if (!stale_) return flat_;
    flat_.clear();
    for (const Term& t : block_) flat_.insert(flat_.end(), t.v.begin(), t.v.end());
    for (const Term& t : link_) flat_.insert(flat_.end(), t.v.begin(), t.v.end());
    stale_ = false;
    return flat_;
}

} // namespace abut::detail
