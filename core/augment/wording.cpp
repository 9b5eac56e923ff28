// SPDX-License-Identifier: MIT
#include "augment/wording.h"

namespace abut::wording {

namespace {
std::string name(const Brief& b, int room) { return b.rooms[room].displayName(); }
} // namespace

std::string adjacency(const Brief& brief, int adj) {
    const Adjacency& a = brief.adjacencies[adj];
    return name(brief, brief.roomIndex(a.a)) + "\u2013" + name(brief, brief.roomIndex(a.b)) + " (" + toString(a.kind) +
           ", " + toString(a.priority) + ")";
}

std::string roomList(const Brief& brief, const std::vector<int>& rooms) {
    std::string s;
    for (std::size_t i = 0; i < rooms.size(); ++i) {
        if (i) s += (i + 1 == rooms.size()) ? " and " : ", ";
        s += name(brief, rooms[i]);
    }
    return s;
}

std::string nonPlanar(const Brief& brief, const std::vector<int>& witness, bool k5) {
    std::string list;
    for (std::size_t i = 0; i < witness.size(); ++i) list += (i ? "; " : "") + adjacency(brief, witness[i]);
    return "These adjacencies cannot all be drawn on one floor without two of them crossing "
           "(they contain the pattern of " +
           std::string(k5 ? "five rooms all touching each other, K5"
                          : "two groups of three rooms each touching all of the other group, K3,3") +
           "): " + list + ".";
}

std::string droppedForCrossings(const Brief& brief, int adj) {
    return "Dropped " + adjacency(brief, adj) + " so that the rest can be drawn without crossings.";
}

std::string droppedForSeparatingTriangle(const Brief& brief, const std::vector<int>& triangle, int fourth, int adj) {
    std::string why;
    if (fourth >= 0) {
        std::vector<int> rooms = triangle;
        rooms.push_back(fourth);
        why = roomList(brief, rooms) + " must all touch each other. Four rectangles cannot all share "
                                       "walls pairwise: one of them would be boxed in by the other three";
    } else {
        why = roomList(brief, triangle) + " all touch each other around other rooms; rectangles cannot enclose rooms "
                                          "that way (a separating triangle)";
    }
    return why + ". Dropped " + adjacency(brief, adj) +
           "; to keep it, let one of these pairs meet through another room or make it 'should'.";
}

std::string droppedForOutline(const Brief& brief, int adj) {
    return "Dropped " + adjacency(brief, adj) +
           ": with it, the rooms on the outline could not be split into four facade sides.";
}

std::string droppedForEnclosure(const Brief& brief, int adj) {
    return "Dropped " + adjacency(brief, adj) + ": with it, some rooms would enclose others (a separating triangle).";
}

std::string addedContact(const Brief& brief, int u, int v, const std::string& why) {
    return name(brief, u) + " and " + name(brief, v) + " share a wall the brief did not ask for (" + why + ").";
}

std::string spareSpaces(int count) {
    return "The plan needs " + std::to_string(count) +
           " spare space(s): gaps where no further wall between rooms could be added.";
}

std::string coverApproximate() {
    return "Many rooms enclose each other here; the adjacencies to give up were chosen greedily and may "
           "not be the fewest possible.";
}

std::string facadeConflict(const Brief& brief, const std::vector<int>& sided, const std::vector<int>& ignored) {
    return "The facade sides asked for " + roomList(brief, sided) + " cannot all be met at once; the plan gives up the sides of " +
           roomList(brief, ignored) + ".";
}

std::string facadeUnmet(const Brief& brief, int room) {
    std::string sides;
    for (Side s : allSides)
        if (brief.rooms[room].facade.has(s))
            sides += sides.empty() ? std::string(1, sideLetter(s)) : std::string(", ") + sideLetter(s);
    return name(brief, room) + " does not reach " +
           (sides.empty() ? std::string("an outside wall") : "the " + sides + " facade") + " in this plan.";
}

std::string summaryFeasible(int shouldsDropped) {
    return shouldsDropped == 0 ? std::string("A rectangular plan exists with every adjacency and facade wish.")
                               : "A rectangular plan exists with every 'must' adjacency and facade wish; " +
                                     std::to_string(shouldsDropped) + " 'should' adjacency(ies) dropped.";
}

std::string summaryCompromised(int mustsDropped, int facadesUnmet) {
    return "No rectangular plan keeps the whole brief: " + std::to_string(mustsDropped) +
           " 'must' adjacency(ies) dropped, " + std::to_string(facadesUnmet) + " facade wish(es) unmet.";
}

std::string summaryInternal(const std::string& problem) {
    return "Internal error: the extended graph failed its check (" + problem + "). Please report this brief.";
}

std::string summaryEmpty() { return "The brief has no rooms yet."; }

} // namespace abut::wording
