// SPDX-License-Identifier: MIT
// Zones: a large floor's rooms grouped the way a planner reads the brief,
// for planning top down (search/detail/zone_plan.h). A hub — a corridor, hall
// or landing: a room with 'must' doors to three or more rooms, or a
// circulation space with two — forms a zone with the rooms that open on it; a room reached
// through such a room (a bathroom through a guest room, a flat's rooms
// through its hall) goes with it, so that suite is a zone inside the hub's;
// a hub that opens on few other hubs goes inside the zone of the one that
// opens on clearly more (a flat's hall or a suite's entry on the corridor);
// corridor pieces that follow one another are one zone, a run, planned as
// one line; on a ring of corridors, rooms that wish no facade (and are not
// of a kind that mostly does) form the block the ring runs round.
// Rooms the planner puts in a zone (`rooms[].zone`) form that zone
// whatever the adjacencies say. Rooms fixed in place, cut-outs and rooms
// that open on no hub stay at the top. Hubs are SearchProblem::isHub's.
//
// Running time: O(rooms + adjacencies) for the breadth-first assignment,
// O(zones · rooms) to gather them.
#pragma once

#include "brief/brief.h"

#include <string>
#include <vector>

namespace abut {

// A room of category "circulation" (in any case): a corridor, hall, landing, stair.
bool isCirculation(const Room& room);
// A hub: a room with three or more 'must' doors, or a circulation space with two.
bool isHubRoom(const Room& room, int mustDoors);

struct ZoneTree {
    struct Zone {
        int parent = -1;            // −1 for the floor
        int hub = -1;               // the hub room (brief index), or −1
        std::vector<int> rooms;     // brief rooms directly in this zone
        std::vector<int> zones;     // zones directly inside it
        std::string name;           // the planner's zone id ("" for one Abut formed)
        std::vector<int> run;       // corridor pieces in order along a run (rooms of this zone), or none
        double area = 0;            // the targets of all its rooms, nested zones' included
    };
    std::vector<Zone> zones;        // zones[0] is the floor; parents before their children
    std::vector<int> zoneOf;        // per brief room: the innermost zone holding it
    // Rooms of zone z and of the zones inside it, in brief order.
    std::vector<int> allRooms(int z) const;
    // Whether planning top down is worth it: the floor holds two or more
    // zones or rooms besides, and some zone holds rooms of its own.
    bool layered() const;
};

// `brief`: as planned (plannedBrief).
ZoneTree formZones(const Brief& brief);

} // namespace abut
