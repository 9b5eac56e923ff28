// SPDX-License-Identifier: MIT
#include "augment/route.h"
#include "augment/wording.h"

#include "embed/planar_embedding.h"

#include <algorithm>

namespace abut {

namespace {


double adjacencyCost(const Adjacency& a) {
    return (a.priority == Priority::Must ? 10000.0 : 100.0) + (a.kind == AdjacencyKind::Door ? 10.0 : 0.0);
}

} // namespace

RouteContext::RouteContext(const Brief& brief, const AugmentOptions& options) : brief_(brief), options_(options) {
    n_ = static_cast<int>(brief.rooms.size());
    for (std::size_t i = 0; i < brief.adjacencies.size(); ++i)
        briefEdge_[RouteContext::ordered(brief.roomIndex(brief.adjacencies[i].a), brief.roomIndex(brief.adjacencies[i].b))] =
            static_cast<int>(i);
    for (const Room& r : brief.rooms) {
        ids_.push_back(r.id);
        wishes_.push_back(r.facade);
        const SketchPoint* p = brief.sketchPosition(r.id);
        sketch_.push_back(p ? std::optional<SketchPoint>(*p) : std::nullopt);
    }
}

double RouteContext::cost(int u, int v) const {
    const auto it = briefEdge_.find(RouteContext::ordered(u, v));
    return it == briefEdge_.end() ? addedContactCost : adjacencyCost(brief_.adjacencies[it->second]);
}

int RouteContext::adjacencyIndex(int u, int v) const {
    const auto it = briefEdge_.find(RouteContext::ordered(u, v));
    return it == briefEdge_.end() ? -1 : it->second;
}

// The hub joined to the four poles keeps their cycle a face; it is dropped
// afterwards, so the cycle is the outer face, traced N → E → S → W from the
// dart N → E, and each pole's rotation starts at the pole before it (as
// extendFrame writes it).
std::optional<PlaneGraph> RouteContext::embedWithPoles(const std::vector<Edge>& edges) const {
    bool anySided = false;
    for (const FacadeWish& w : wishes_) anySided = anySided || w.sides;
    if (!anySided) return std::nullopt;
    const int R = n_, hub = n_ + 4;
    std::vector<Edge> all = edges;
    for (int s = 0; s < 4; ++s) {
        all.emplace_back(R + s, R + (s + 1) % 4);
        all.emplace_back(R + s, hub);
    }
    for (int v = 0; v < R; ++v)
        for (Side s : allSides)
            if (wishes_[v].has(s)) all.emplace_back(v, R + static_cast<int>(s));
    const EmbeddingResult e = embedPlanar(R + 5, all);
    if (e.status != EmbeddingStatus::Planar) return std::nullopt;
    // Boyer–Myrvold may return the mirror image; the sides must run N, E, S,
    // W clockwise, i.e. the hub lies to the left of the dart N → E.
    const bool mirrored = e.graph.nextOnFace(R, R + 1) != hub;
    PlaneGraph g(R + 4);
    for (int v = 0; v < R + 4; ++v) {
        std::vector<int> rot;
        for (int u : e.graph.neighbours(v))
            if (u != hub) rot.push_back(u);
        if (mirrored) std::reverse(rot.begin(), rot.end());
        if (v >= R) {
            const auto first = std::find(rot.begin(), rot.end(), R + (v - R + 3) % 4);
            std::rotate(rot.begin(), first, rot.end());
        }
        g.setRotation(v, std::move(rot));
    }
    g.rebuildEdgeSet();
    return g;
}

void addNote(std::vector<Diagnostic>& notes, Severity severity, DiagnosticCode code, std::string message,
             std::vector<int> rooms, std::vector<int> adjacencies) {
    std::sort(rooms.begin(), rooms.end());
    rooms.erase(std::unique(rooms.begin(), rooms.end()), rooms.end());
    notes.push_back({severity, code, std::move(message), std::move(rooms), std::move(adjacencies)});
}

void addContactNotes(std::vector<Diagnostic>& notes, const Brief& brief,
                     const std::vector<std::pair<int, int>>& added, const char* why) {
    for (const auto& [u, v] : added)
        addNote(notes, Severity::Info, DiagnosticCode::AddedContact, wording::addedContact(brief, u, v, why), {u, v});
}

std::vector<int> roomsMissingTheirFacade(const ExtendedGraph& x, const std::vector<FacadeWish>& wishes) {
    std::vector<int> unmet;
    for (int v = 0; v < static_cast<int>(wishes.size()); ++v) {
        if (wishes[v].empty()) continue;
        bool met = true, any = false;
        for (Side s : allSides) {
            const bool touches = x.graph.hasEdge(v, x.pole(s));
            any = any || touches;
            if (wishes[v].has(s)) met = met && touches;
        }
        if (wishes[v].anySide) met = met && any;
        if (!met) unmet.push_back(v);
    }
    return unmet;
}

} // namespace abut
