// SPDX-License-Identifier: MIT
#include "live_check.h"

#include "augment/augment.h"
#include "plan/brief_check.h"
#include "brief/footprint_check.h"
#include "embed/planar_embedding.h"

#include <QCoreApplication>
#include <QLineF>

#include <algorithm>

namespace abut::gui {

LiveCheck runLiveCheck(const Brief& brief, quint64 revision) {
    LiveCheck out;
    out.revision = revision;
    out.marks.revision = revision;

    // Crossings of the drawing, on the brief's adjacencies with both rooms drawn.
    std::vector<std::pair<int, int>> edges;
    std::vector<int> edgeAdjacency;
    for (std::size_t i = 0; i < brief.adjacencies.size(); ++i) {
        const int u = brief.roomIndex(brief.adjacencies[i].a), v = brief.roomIndex(brief.adjacencies[i].b);
        if (u < 0 || v < 0 || u == v) continue;
        edges.emplace_back(u, v);
        edgeAdjacency.push_back(static_cast<int>(i));
    }
    std::vector<std::optional<SketchPoint>> sketch(brief.rooms.size());
    for (std::size_t r = 0; r < brief.rooms.size(); ++r)
        if (const SketchPoint* p = brief.sketchPosition(brief.rooms[r].id)) sketch[r] = *p;
    if (edges.size() <= sketchCrossingLimit) {
        const auto crossings = sketchCrossings(edges, sketch);
        for (const auto& [e, f] : crossings) {
            const SketchPoint &a = *sketch[edges[e].first], &b = *sketch[edges[e].second];
            const SketchPoint &c = *sketch[edges[f].first], &d = *sketch[edges[f].second];
            QPointF at;
            if (QLineF(a.x, a.y, b.x, b.y).intersects(QLineF(c.x, c.y, d.x, d.y), &at) != QLineF::NoIntersection)
                out.marks.crossings.push_back(at);
        }
        if (!crossings.empty()) {
            Diagnostic d;
            d.severity = Severity::Info;
            d.code = DiagnosticCode::SketchCrossing;
            d.message = QCoreApplication::translate(
                            "LiveCheck", "%n pair(s) of adjacency lines cross in the sketch. Planning still works; "
                                         "Tidy up redraws the sketch without crossings when the brief allows it.",
                            nullptr, int(crossings.size()))
                            .toStdString();
            for (const auto& [e, f] : crossings) {
                d.adjacencies.push_back(edgeAdjacency[e]);
                d.adjacencies.push_back(edgeAdjacency[f]);
            }
            std::sort(d.adjacencies.begin(), d.adjacencies.end());
            d.adjacencies.erase(std::unique(d.adjacencies.begin(), d.adjacencies.end()), d.adjacencies.end());
            out.diagnostics.push_back(d);
        }
    }

    // A short search on one thread: the editor plans on the other cores.
    BriefCheckOptions o;
    o.searchSeconds = 1.5;
    const BriefCheck checked = checkBrief(brief, o);
    for (const Diagnostic& d : checked.diagnostics) {
        if (costsTheBriefNothing(d)) continue;
        out.diagnostics.push_back(d);
        if (d.severity == Severity::Info) continue;
        out.marks.rooms.insert(d.rooms.begin(), d.rooms.end());
        out.marks.adjacencies.insert(d.adjacencies.begin(), d.adjacencies.end());
    }
    if (!brief.rooms.empty()) {
        const AugmentResult& aug = checked.arrangement;
        if (aug.status == AugmentStatus::Feasible && out.diagnostics.empty()) {
            Diagnostic ok;
            ok.code = DiagnosticCode::Feasible;
            ok.message = QCoreApplication::translate(
                             "LiveCheck", "Every must adjacency and facade wish can be met by a rectangular plan.")
                             .toStdString();
            out.diagnostics.push_back(ok);
        }
    }
    std::stable_sort(out.diagnostics.begin(), out.diagnostics.end(),
                     [](const Diagnostic& a, const Diagnostic& b) { return a.severity > b.severity; });
    return out;
}

} // namespace abut::gui
