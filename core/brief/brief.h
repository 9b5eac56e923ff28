// SPDX-License-Identifier: MIT
// The brief: what the planner asks for. Rooms with target areas, required
// adjacencies, facade wishes, footprint. Plain data; the file reader
// (io/project_io.h) and every edit (brief/brief_edit.h) check the ranges
// below; brief/footprint_check.h checks targets against the footprint.
#pragma once

#include <nlohmann/json_fwd.hpp>

#include <array>
#include <cstdint>
#include <memory>
#include <optional>
#include <string>
#include <utility>
#include <vector>

namespace abut {

using OrderedJson = nlohmann::ordered_json;

// Fields of a project file that Abut does not know, kept as they were read
// so that a save writes them back. Held behind a pointer (shared, never
// changed once read) so that this header needs only the JSON library's
// forward declarations; the reader and writer include the library.
class UnknownFields {
public:
    UnknownFields() = default;
    UnknownFields(OrderedJson fields); // NOLINT: implicit, as the reader assigns an object
    // The fields as a JSON object (empty when there are none).
    const OrderedJson& json() const;
    bool empty() const;

private:
    std::shared_ptr<const OrderedJson> fields_;
};

// Facade sides, clockwise from north as seen on a plan with north up.
enum class Side : std::uint8_t { N = 0, E = 1, S = 2, W = 3 };
constexpr std::array<Side, 4> allSides{Side::N, Side::E, Side::S, Side::W};
char sideLetter(Side s);
std::optional<Side> sideFromLetter(const std::string& s);

// Which facade sides a room must reach. `anySide` means "some exterior wall".
struct FacadeWish {
    std::uint8_t sides = 0; // bit (1 << Side)
    bool anySide = false;

    bool empty() const { return sides == 0 && !anySide; }
    bool has(Side s) const { return sides & (1u << static_cast<unsigned>(s)); }
    void add(Side s) { sides |= static_cast<std::uint8_t>(1u << static_cast<unsigned>(s)); }
    bool operator==(const FacadeWish&) const = default;
};

// Plausible ranges, in the brief's units (m or ft), checked by every reader
// and editor: lengths from 0.001 to 10,000 (1 mm to 10 km in metres), areas
// from 0.000001 to 100,000,000, aspect limits up to 1000, sketch positions
// within ±10⁹. A door wall is no longer than the footprint's shorter side.
inline constexpr double minLength = 0.001, maxLength = 10000;
inline constexpr double minArea = 1e-6, maxArea = 1e8;
inline constexpr double maxAspectLimit = 1000;
inline constexpr double maxSketchCoordinate = 1e9;

// The one default for what counts as a contact and what a spare space is,
// in plan units: the shortest wall that makes two rooms adjacent (any
// positive length, kept visible on a drawing) and the smallest side of a
// spare space. Every stage (fitting, sizing, search, plan) defaults to these.
inline constexpr double minContactLength = 0.05;
inline constexpr double minSpareSide = 0.3;

// Byte index of the first control character or line break in `text` (UTF-8),
// or std::string::npos: U+0000–U+001F (tabs included), U+007F, the C1
// controls U+0080–U+009F (U+0085, the next-line mark, among them) and the
// line and paragraph separators U+2028 and U+2029. `code` gets its code
// point. Ids, names and categories hold none: they break exports, tables and
// terminals.
std::size_t controlCharacterAt(const std::string& text, char32_t* code = nullptr);

enum class AdjacencyKind : std::uint8_t { Door, Wall };
enum class Priority : std::uint8_t { Must, Should };

// A rectangle placed in the footprint: origin at its south-west corner, as
// the project file gives cut-outs and fixed rooms.
struct Placement {
    double x = 0.0, y = 0.0, width = 0.0, depth = 0.0;
    double area() const { return width * depth; }
    bool operator==(const Placement&) const = default;
};

struct Room {
    std::string id;
    std::string name;
    double area = 0.0;                   // target area, units²
    std::optional<double> minWidth;      // units
    std::optional<double> maxAspect;     // long side / short side, >= 1
    std::optional<double> areaTolerance; // fraction: the band around `area` that counts as on target
    std::string category;
    std::string zone; // the planner's zone: rooms of one zone are planned as one block first ("": Abut forms zones)
    FacadeWish facade;
    std::optional<Placement> fixed; // stays exactly there in every variant (a stair and lift core)
    // Not a room: a cut-out of the footprint, planned as a block held in place
    // (plannedBrief adds them after the rooms; never read from or written to a file).
    bool cutout = false;
    UnknownFields unknownFields; // kept for the round trip

    const std::string& displayName() const { return name.empty() ? id : name; }
    // The band within which the room counts as on target (common practice at
    // the briefing stage: ±5–10 %; no source).
    double tolerance() const { return areaTolerance.value_or(0.05); }
};

struct Adjacency {
    std::string a, b; // room ids
    AdjacencyKind kind = AdjacencyKind::Door;
    Priority priority = Priority::Must;
    UnknownFields unknownFields;
};

struct Footprint {
    double width = 0.0; // x extent, east-west (of the bounding rectangle)
    double depth = 0.0; // y extent, north-south
    // Rectangles inside the bounding one that are not building (an L, a U, a
    // courtyard). A wall on a cut-out is an exterior wall facing the side it faces.
    std::vector<Placement> cutouts;
    double netArea() const;
    bool operator==(const Footprint&) const = default;
};

// Area two placements share (0 when they only touch).
double overlapArea(const Placement& a, const Placement& b);
// Whether they share more than a hairline: overlapping by more than `tolerance` both ways.
bool overlaps(const Placement& a, const Placement& b, double tolerance);
// Whether the footprint minus its cut-outs is one piece (parts meeting at a
// corner only are two). O(c³) for c cut-outs.
bool isConnected(const Footprint& fp);

// The largest rectangle inside the footprint that overlaps none of its
// cut-outs nor any rectangle of `taken` (rooms fixed in place): the largest
// room that can stand beside them. O(c²) cells for c rectangles.
Placement largestFreeRectangle(const Footprint& fp, const std::vector<Placement>& taken = {});

// The outline of the footprint minus its cut-outs, as closed loops of
// corners: the outer loop counter-clockwise first, then one clockwise loop
// per courtyard. Without cut-outs, the bounding rectangle. O(c²) cells.
using OutlineLoop = std::vector<std::pair<double, double>>;
std::vector<OutlineLoop> footprintOutline(const Footprint& fp);

struct SketchPoint {
    double x = 0.0, y = 0.0;
    bool operator==(const SketchPoint&) const = default;
};

// What happens to footprint area the targets leave over: it stays as spare
// spaces once the rooms have taken what their bands allow (the default), or
// every room grows in proportion to its target.
enum class Surplus : std::uint8_t { Spare, Spread };

struct Brief {
    std::string units = "m"; // "m" or "ft"
    std::optional<Footprint> footprint;
    double doorWidth = 0.9; // shared wall needed by a door adjacency, units
    Surplus surplus = Surplus::Spare;
    std::vector<Room> rooms;
    std::vector<Adjacency> adjacencies;
    std::vector<std::pair<std::string, SketchPoint>> sketch; // in file order
    // The planner's choices among plan variants, by variantKey (plan/variant_key.h).
    std::vector<std::string> pinnedVariants, hiddenVariants;
    UnknownFields footprintUnknownFields; // fields of `footprint` beyond width, depth and cutouts, kept
    UnknownFields unknownFields;

    // Index of the room with this id, or -1. O(rooms): in a loop over the
    // adjacencies use adjacencyRooms.
    int roomIndex(const std::string& id) const;
    // Per adjacency, the indices of its two rooms (−1 for an id that is not
    // a room's). O(rooms + adjacencies).
    std::vector<std::pair<int, int>> adjacencyRooms() const;
    double totalTargetArea() const;
    // The given footprint, or a square-ish rectangle of the total target area.
    Footprint effectiveFootprint() const;
    const SketchPoint* sketchPosition(const std::string& id) const;
};

// The brief as it is planned: each cut-out of the footprint added after the
// rooms as a room held in place (`cutout` set, id "cutout-1", …); with
// `surplus: spread`, every target that is not held in place grown in
// proportion so that they fill the rest. Applying it twice changes nothing.
Brief plannedBrief(const Brief& brief);
// Rooms of the brief the planner asked for (plannedBrief's cut-outs are not).
inline bool isPlannedRoom(const Room& r) { return !r.cutout; }

const char* toString(AdjacencyKind k);
const char* toString(Priority p);

} // namespace abut
