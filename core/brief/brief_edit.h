// SPDX-License-Identifier: MIT
// Edits of a brief as the editor makes them: add and remove rooms and
// adjacencies, move rooms in the sketch, change one field from text the
// planner typed. Each edit either applies completely or refuses with a
// message in the planner's words and leaves the brief untouched. The editor
// wraps these in undoable commands; they hold no state of their own.
//
// Field rules and their wording are the project file's (brief/brief_rules.h,
// formats contract): area > 0, minWidth > 0, maxAspect >= 1, facade a subset
// of N, E, S, W or "any".
#pragma once

#include "brief/brief.h"
#include "brief/brief_rules.h"

#include <optional>
#include <string>
#include <vector>

namespace abut {

enum class EditStatus { Done, Refused };

struct EditResult {
    EditStatus status = EditStatus::Done;
    std::string message; // why it was refused, in the planner's words
    bool ok() const { return status == EditStatus::Done; }
    static EditResult refused(std::string why) { return {EditStatus::Refused, std::move(why)}; }
};

// An id for a new room, derived from its name ("Guest room" → "guest-room"),
// made unique with a number. O(rooms).
std::string freshRoomId(const Brief& brief, const std::string& name);

// Appends a room (its id must be new and non-empty, its area > 0) and, when
// given, its sketch position. O(rooms).
EditResult addRoom(Brief& brief, Room room, std::optional<SketchPoint> at = std::nullopt);

// Removes rooms together with their adjacencies and sketch positions.
// Unknown ids are ignored. O(rooms + adjacencies).
void removeRooms(Brief& brief, const std::vector<std::string>& ids);

// Removes adjacencies by index; out-of-range indices are ignored.
void removeAdjacencies(Brief& brief, std::vector<int> indices);

// Index of the adjacency joining a and b (either order), or -1.
int adjacencyIndex(const Brief& brief, const std::string& a, const std::string& b);

// Adds an adjacency between two different existing rooms that are not yet
// joined. O(adjacencies).
EditResult addAdjacency(Brief& brief, const Adjacency& adjacency);

void setSketchPosition(Brief& brief, const std::string& id, SketchPoint at);

enum class RoomField { Name, Category, Area, MinWidth, MaxAspect, Facade };

// Sets one field of room `room` from typed text. Numbers accept a decimal
// comma and a trailing unit ("12,5 m²"); an empty min width or max aspect
// clears it; the facade is letters N, E, S, W in any order and with any
// separators, "any", or empty.
EditResult setRoomField(Brief& brief, int room, RoomField field, const std::string& text);

enum class BriefField { FootprintWidth, FootprintDepth, DoorWidth, Units, Cutouts };

// Sets a brief-wide field from typed text. An empty footprint width or depth
// removes the footprint (the plan then uses a rectangle of the total area).
// Cut-outs are typed as four numbers each — x, y (south-west corner), width,
// depth — separated by spaces, cut-outs by ";" ("12 9 12 9; 0 0 3 2");
// empty: none. A footprint change that would leave a cut-out or a fixed room
// outside, or a cut-out that splits the footprint, is refused.
EditResult setBriefField(Brief& brief, BriefField field, const std::string& text);

// Fixes room `room` where `at` says (nullopt: frees it). Refused when it
// would stand outside the footprint, on a cut-out or on another fixed room.
EditResult setRoomFixed(Brief& brief, int room, std::optional<Placement> at);


// "12 9 12 9; 0 0 3 2" for the cut-outs.
std::string cutoutsText(const std::vector<Placement>& cutouts);

// Parses a length or area typed by a planner: "12.5", "12,5", "12.5 m²".
// Returns nullopt when the text is not one finite number.
std::optional<double> parsePlannerNumber(const std::string& text);

// Parses a facade wish: "NE", "n, e", "any", "" (no wish).
std::optional<FacadeWish> parseFacade(const std::string& text);
std::string facadeText(const FacadeWish& wish);

// Pins or unpins, hides or shows a plan variant by its key (plan/variant_key.h).
void setVariantPinned(Brief& brief, const std::string& key, bool pinned);
void setVariantHidden(Brief& brief, const std::string& key, bool hidden);

// Gives every room without a sketch position one, on rows below the rooms
// that have one, spaced for their size (sketch units: 10 per metre of
// radius, as the editor draws them). O(rooms).
void placeUnsketchedRooms(Brief& brief);

} // namespace abut
