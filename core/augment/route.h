// SPDX-License-Identifier: MIT
// The augmentation's routes: two ways from the rooms' plane graph to an
// extended graph, behind one interface and one contract.
//
// Both start where the brief's graph has been embedded (crossings dropped)
// and joined into one piece. The frame route works on the rooms alone: it
// chooses the outline as a cycle of rooms, breaks separating triangles and
// splits the cycle into four sides at ranked corners. The pole route puts
// the four sides in first, each joined to the rooms that wish it, and
// completes the inside: it finds plans where a room must appear twice on the
// outline (a room reaching two opposite sides cuts the rest in two), which a
// cycle cannot describe. buildExtendedGraph runs both and keeps the one that
// gives up less of the brief.
//
// The contract every route keeps (tests/augment/tst_routes.cpp runs it over
// both on the samples and on random briefs):
//  - a route that finds nothing returns no graphs and no notes of its own
//    making about the result (it may have none at all);
//  - every graph it returns has the brief's rooms as vertices 0..n−1, four
//    poles after them, and passes checkExtendedGraph;
//  - for the first graph, every contact between rooms that the input graph
//    lacks is reported as an added contact, every brief adjacency the input
//    has and the graph lacks as a dropped adjacency, and `unmetFacade` lists
//    exactly the rooms whose facade wish the poles' contacts do not meet;
//  - the same input gives the same output.
#pragma once

#include "augment/augment.h"
#include "graph/plane_graph.h"

#include <map>
#include <optional>
#include <utility>
#include <vector>

namespace abut {

// What both routes read of the brief: rooms as indices, the cost of giving
// up a contact, the facade wishes, the sketch. Also collects notes.
class RouteContext {
public:
    using Edge = std::pair<int, int>;
    static Edge ordered(int a, int b) { return a < b ? Edge{a, b} : Edge{b, a}; }
    RouteContext(const Brief& brief, const AugmentOptions& options);

    const Brief& brief() const { return brief_; }
    const AugmentOptions& options() const { return options_; }
    int roomCount() const { return n_; }
    const std::vector<std::string>& ids() const { return ids_; }
    const std::vector<FacadeWish>& wishes() const { return wishes_; }
    // Sketch positions per room (all set when the embedding came from the sketch).
    const std::vector<std::optional<SketchPoint>>& sketch() const { return sketch_; }
    bool embeddingFromSketch() const { return embeddingFromSketch_; }
    void setEmbeddingFromSketch(bool fromSketch) { embeddingFromSketch_ = fromSketch; }

    // Cost of giving up the contact u–v: a brief's must outweighs any number
    // of shoulds in practice, a door outweighs a wall of the same priority,
    // and a contact Abut added itself costs next to nothing.
    double cost(int u, int v) const;
    static constexpr double addedContactCost = 1.0;
    // The brief adjacency joining u and v, or −1.
    int adjacencyIndex(int u, int v) const;

    // The rooms embedded together with four poles whose cycle N–E–S–W is the
    // outer face, each pole joined to the rooms that wish its side; nothing
    // when no room wishes a side or the wishes conflict with planarity.
    std::optional<PlaneGraph> embedWithPoles(const std::vector<Edge>& edges) const;

private:
    const Brief& brief_;
    AugmentOptions options_;
    int n_ = 0;
    std::map<Edge, int> briefEdge_;
    std::vector<std::string> ids_;
    std::vector<FacadeWish> wishes_;
    std::vector<std::optional<SketchPoint>> sketch_;
    bool embeddingFromSketch_ = false;
};

// Notes in the augmentation's voice, rooms sorted and unique.
void addNote(std::vector<Diagnostic>& notes, Severity severity, DiagnosticCode code, std::string message,
             std::vector<int> rooms, std::vector<int> adjacencies = {});
void addContactNotes(std::vector<Diagnostic>& notes, const Brief& brief,
                     const std::vector<std::pair<int, int>>& added, const char* why);

struct RouteOutcome {
    std::vector<ExtendedGraph> graphs; // best first; none when the route found nothing
    OuterFrame frame;                  // the frame route's outline (empty for the pole route)
    std::vector<int> unmetFacade;      // rooms of graphs.front() whose facade wish is not met
    std::vector<Diagnostic> notes;     // what the route changed, for the planner
};

class AugmentRoute {
public:
    virtual ~AugmentRoute() = default;
    virtual const char* name() const = 0;
    // `rooms`: the brief's kept adjacencies between rooms 0..n−1, embedded
    // and in one piece (n ≥ 3).
    virtual RouteOutcome run(const RouteContext& context, const PlaneGraph& rooms) const = 0;
};

const AugmentRoute& frameRoute();
const AugmentRoute& poleRoute();

// Rooms whose facade wish the graph's pole contacts do not meet.
std::vector<int> roomsMissingTheirFacade(const ExtendedGraph& x, const std::vector<FacadeWish>& wishes);

} // namespace abut
