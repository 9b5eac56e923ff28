// SPDX-License-Identifier: MIT
#include "brief/brief_edit.h"

#include <sstream>

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdlib>
#include <set>

namespace abut {

namespace {

std::string trimmed(const std::string& s) {
    const auto first = s.find_first_not_of(" \t\r\n");
    if (first == std::string::npos) return {};
    const auto last = s.find_last_not_of(" \t\r\n");
    return s.substr(first, last - first + 1);
}

std::string formatValue(double v) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%g", v);
    return buf;
}

// A typed number in the brief's rules (brief/brief_rules.h).
EditResult readPositive(const std::string& text, const char* what, double& out, double atLeast, double atMost) {
    const auto v = parsePlannerNumber(text);
    if (!v) return EditResult::refused(std::string(what) + " must be a number, got \"" + trimmed(text) + "\".");
    if (const std::string problem = numberProblem(*v, what, atLeast, atMost); !problem.empty())
        return EditResult::refused(asSentence(problem));
    out = *v;
    return {};
}

EditResult readText(const std::string& text, const char* what, std::string& out) {
    if (const std::string problem = textProblem(text, what); !problem.empty()) return EditResult::refused(asSentence(problem));
    out = text;
    return {};
}

// The sketch radius of a room, as the editor draws it.
double sketchRadius(const Room& room) {
    return std::max(14.0, 10.0 * std::sqrt(room.area / M_PI));
}

} // namespace

std::optional<double> parsePlannerNumber(const std::string& text) {
    std::string s = trimmed(text);
    // Units after the number: m, m², m2, ft, ft², ft2, sq ft.
    for (const char* unit : {"sq ft", "m\xC2\xB2", "ft\xC2\xB2", "m2", "ft2", "m", "ft"}) {
        const std::string u(unit);
        if (s.size() > u.size() && s.compare(s.size() - u.size(), u.size(), u) == 0) {
            s = trimmed(s.substr(0, s.size() - u.size()));
            break;
        }
    }
    if (s.empty()) return std::nullopt;
    if (std::count(s.begin(), s.end(), ',') == 1 && s.find('.') == std::string::npos)
        std::replace(s.begin(), s.end(), ',', '.');
    char* end = nullptr;
    const double v = std::strtod(s.c_str(), &end);
    if (end != s.c_str() + s.size() || !std::isfinite(v)) return std::nullopt;
    return v;
}

std::optional<FacadeWish> parseFacade(const std::string& text) {
    FacadeWish wish;
    std::string s = trimmed(text);
    std::string lower;
    for (char c : s) lower += static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    if (lower == "any") {
        wish.anySide = true;
        return wish;
    }
    for (char c : s) {
        const char up = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
        if (const auto side = sideFromLetter(std::string(1, up))) wish.add(*side);
        else if (!(c == ' ' || c == ',' || c == ';' || c == '/' || c == '+')) return std::nullopt;
    }
    return wish;
}

std::string facadeText(const FacadeWish& wish) {
    if (wish.anySide) return "any";
    std::string s;
    for (Side side : allSides)
        if (wish.has(side)) s += sideLetter(side);
    return s;
}

std::string freshRoomId(const Brief& brief, const std::string& name) {
    std::string stem;
    for (char c : trimmed(name)) {
        const unsigned char u = static_cast<unsigned char>(c);
        if (std::isalnum(u)) stem += static_cast<char>(std::tolower(u));
        else if (!stem.empty() && stem.back() != '-') stem += '-';
    }
    while (!stem.empty() && stem.back() == '-') stem.pop_back();
    if (stem.empty()) stem = "room";
    if (brief.roomIndex(stem) < 0) return stem;
    for (int k = 2;; ++k) {
        const std::string id = stem + "-" + std::to_string(k);
        if (brief.roomIndex(id) < 0) return id;
    }
}

EditResult addRoom(Brief& brief, Room room, std::optional<SketchPoint> at) {
    if (room.id.empty()) return EditResult::refused("A room needs an id.");
    if (brief.roomIndex(room.id) >= 0)
        return EditResult::refused("There is already a room with the id \"" + room.id + "\".");
    if (!(room.area > 0) || !std::isfinite(room.area))
        return EditResult::refused("Target area must be greater than 0.");
    if (at) setSketchPosition(brief, room.id, *at);
    brief.rooms.push_back(std::move(room));
    return {};
}

void removeRooms(Brief& brief, const std::vector<std::string>& ids) {
    const std::set<std::string> gone(ids.begin(), ids.end());
    std::erase_if(brief.rooms, [&](const Room& r) { return gone.count(r.id) > 0; });
    std::erase_if(brief.adjacencies,
                  [&](const Adjacency& a) { return gone.count(a.a) > 0 || gone.count(a.b) > 0; });
    std::erase_if(brief.sketch, [&](const auto& entry) { return gone.count(entry.first) > 0; });
}

void removeAdjacencies(Brief& brief, std::vector<int> indices) {
    std::sort(indices.begin(), indices.end(), std::greater<>());
    indices.erase(std::unique(indices.begin(), indices.end()), indices.end());
    for (int i : indices)
        if (i >= 0 && i < static_cast<int>(brief.adjacencies.size()))
            brief.adjacencies.erase(brief.adjacencies.begin() + i);
}

int adjacencyIndex(const Brief& brief, const std::string& a, const std::string& b) {
    for (std::size_t i = 0; i < brief.adjacencies.size(); ++i) {
        const Adjacency& adj = brief.adjacencies[i];
        if ((adj.a == a && adj.b == b) || (adj.a == b && adj.b == a)) return static_cast<int>(i);
    }
    return -1;
}

EditResult addAdjacency(Brief& brief, const Adjacency& adjacency) {
    const int a = brief.roomIndex(adjacency.a), b = brief.roomIndex(adjacency.b);
    if (a < 0 || b < 0) return EditResult::refused("An adjacency joins two rooms of the brief.");
    if (a == b) return EditResult::refused("A room cannot be adjacent to itself.");
    if (adjacencyIndex(brief, adjacency.a, adjacency.b) >= 0)
        return EditResult::refused(brief.rooms[a].displayName() + " and " + brief.rooms[b].displayName() +
                                   " are already adjacent.");
    brief.adjacencies.push_back(adjacency);
    return {};
}

void setSketchPosition(Brief& brief, const std::string& id, SketchPoint at) {
    for (auto& [key, p] : brief.sketch)
        if (key == id) {
            p = at;
            return;
        }
    brief.sketch.emplace_back(id, at);
}

EditResult setRoomField(Brief& brief, int index, RoomField field, const std::string& text) {
    if (index < 0 || index >= static_cast<int>(brief.rooms.size()))
        return EditResult::refused("There is no such room.");
    Room& room = brief.rooms[index];
    const std::string t = trimmed(text);
    switch (field) {
    case RoomField::Name:
        return readText(t, "Name", room.name);
    case RoomField::Category:
        return readText(t, "Category", room.category);
    case RoomField::Area:
        return readPositive(t, "Target area", room.area, minArea, maxArea);
    case RoomField::MinWidth:
    case RoomField::MaxAspect: {
        std::optional<double>& slot = field == RoomField::MinWidth ? room.minWidth : room.maxAspect;
        if (t.empty()) {
            slot.reset();
            return {};
        }
        double v = 0;
        const EditResult r = field == RoomField::MinWidth ? readPositive(t, "Min width", v, minLength, maxLength)
                                                          : readPositive(t, "Max aspect", v, 1.0, maxAspectLimit);
        if (r.ok()) slot = v;
        return r;
    }
    case RoomField::Facade: {
        const auto wish = parseFacade(t);
        if (!wish)
            return EditResult::refused("Facade must be sides N, E, S, W (for example \"NE\"), \"any\" or "
                                       "empty, got \"" + t + "\".");
        room.facade = *wish;
        return {};
    }
    }
    return EditResult::refused("Unknown field.");
}

namespace {
EditResult setBriefFieldUnchecked(Brief& brief, BriefField field, const std::string& t);
} // namespace

EditResult setBriefField(Brief& brief, BriefField field, const std::string& text) {
    const std::string t = trimmed(text);
    const std::optional<Footprint> footprint = brief.footprint; // put back when refused
    const EditResult r = setBriefFieldUnchecked(brief, field, t);
    if (!r.ok()) {
        brief.footprint = footprint;
        return r;
    }
    if (const std::string problem = placementProblem(brief); !problem.empty()) {
        brief.footprint = footprint;
        return EditResult::refused(problem);
    }
    return {};
}

namespace {
EditResult setBriefFieldUnchecked(Brief& brief, BriefField field, const std::string& t) {
    switch (field) {
    case BriefField::FootprintWidth:
    case BriefField::FootprintDepth: {
        if (t.empty()) {
            brief.footprint.reset();
            break;
        }
        double v = 0;
        const bool width = field == BriefField::FootprintWidth;
        const EditResult r = readPositive(t, width ? "Footprint width" : "Footprint depth", v, minLength, maxLength);
        if (!r.ok()) return r;
        Footprint f = brief.footprint.value_or(brief.effectiveFootprint());
        (width ? f.width : f.depth) = v;
        brief.footprint = f;
        break;
    }
    case BriefField::DoorWidth:
    {
        double v = 0;
        const EditResult r = readPositive(t, "Door wall length", v, minLength, maxLength);
        if (!r.ok()) return r;
        if (brief.footprint)
            if (const std::string problem = doorWidthProblem(v, *brief.footprint); !problem.empty())
                return EditResult::refused(asSentence(problem));
        brief.doorWidth = v;
        break;
    }
    case BriefField::Units:
        if (t != "m" && t != "ft") return EditResult::refused("Units must be \"m\" or \"ft\", got \"" + t + "\".");
        brief.units = t;
        return {};
    case BriefField::Cutouts: {
        std::vector<Placement> cuts;
        std::size_t from = 0;
        while (from <= t.size() && !t.empty()) {
            const std::size_t semi = std::min(t.find(';', from), t.size());
            const std::string part = trimmed(t.substr(from, semi - from));
            from = semi + 1;
            if (part.empty()) continue;
            std::vector<double> v;
            std::istringstream words(part);
            for (std::string w; words >> w;) {
                const std::optional<double> x = parsePlannerNumber(w);
                if (!x) return EditResult::refused("Cut-out \"" + part + "\": \"" + w + "\" is not a number.");
                v.push_back(*x);
            }
            if (v.size() != 4)
                return EditResult::refused("Cut-out \"" + part +
                                           "\" needs four numbers: x and y of its south-west corner, its width and its depth.");
            if (v[2] <= 0 || v[3] <= 0 || v[0] < 0 || v[1] < 0)
                return EditResult::refused("Cut-out \"" + part + "\": its corner cannot be below 0 and its width and depth must be greater than 0.");
            cuts.push_back({v[0], v[1], v[2], v[3]});
        }
        if (!cuts.empty() && !brief.footprint)
            return EditResult::refused("Give the footprint a width and depth before cutting parts out of it.");
        if (brief.footprint) brief.footprint->cutouts = std::move(cuts);
        break;
    }
    }
    return {};
}
} // namespace

EditResult setRoomFixed(Brief& brief, int room, std::optional<Placement> at) {
    if (room < 0 || room >= static_cast<int>(brief.rooms.size())) return EditResult::refused("No such room.");
    const std::optional<Placement> before = brief.rooms[room].fixed;
    brief.rooms[room].fixed = at;
    if (const std::string problem = placementProblem(brief); !problem.empty()) {
        brief.rooms[room].fixed = before;
        return EditResult::refused(problem);
    }
    return {};
}

std::string cutoutsText(const std::vector<Placement>& cutouts) {
    std::string out;
    for (const Placement& c : cutouts)
        out += (out.empty() ? "" : "; ") + formatValue(c.x) + " " + formatValue(c.y) + " " + formatValue(c.width) + " " +
               formatValue(c.depth);
    return out;
}

namespace {
void setListed(std::vector<std::string>& list, const std::string& key, bool listed) {
    const auto it = std::find(list.begin(), list.end(), key);
    if (listed && it == list.end()) list.push_back(key);
    if (!listed && it != list.end()) list.erase(it);
}
} // namespace

void setVariantPinned(Brief& brief, const std::string& key, bool pinned) {
    setListed(brief.pinnedVariants, key, pinned);
    if (pinned) setListed(brief.hiddenVariants, key, false);
}

void setVariantHidden(Brief& brief, const std::string& key, bool hidden) {
    setListed(brief.hiddenVariants, key, hidden);
    if (hidden) setListed(brief.pinnedVariants, key, false);
}

void placeUnsketchedRooms(Brief& brief) {
    double bottom = 0, left = 0;
    bool any = false;
    for (const Room& room : brief.rooms)
        if (const SketchPoint* p = brief.sketchPosition(room.id)) {
            const double r = sketchRadius(room);
            bottom = any ? std::min(bottom, p->y - r) : p->y - r;
            left = any ? std::min(left, p->x - r) : p->x - r;
            any = true;
        }
    // Rows of at most about √n rooms, below everything already drawn.
    int missing = 0;
    for (const Room& room : brief.rooms) missing += brief.sketchPosition(room.id) ? 0 : 1;
    if (missing == 0) return;
    const int perRow = std::max(1, static_cast<int>(std::ceil(std::sqrt(double(missing)))));
    double x = left, y = any ? bottom - 40.0 : 0.0, rowHeight = 0;
    int inRow = 0;
    for (const Room& room : brief.rooms) {
        if (brief.sketchPosition(room.id)) continue;
        const double r = sketchRadius(room);
        if (inRow == perRow) {
            y -= rowHeight + 30.0;
            x = left;
            rowHeight = 0;
            inRow = 0;
        }
        brief.sketch.emplace_back(room.id, SketchPoint{x + r, y - r});
        x += 2 * r + 30.0;
        rowHeight = std::max(rowHeight, 2 * r);
        ++inRow;
    }
}

} // namespace abut
