// SPDX-License-Identifier: MIT
#include "io/csv_import.h"

#include "brief/brief_edit.h"
#include "brief/brief_rules.h"
#include "io/atomic_file.h"

#include <algorithm>
#include <cctype>
#include <map>
#include <set>
#include <unordered_map>

namespace abut {

namespace {

std::string trimmed(const std::string& s) {
    const auto first = s.find_first_not_of(" \t\r\n");
    if (first == std::string::npos) return {};
    return s.substr(first, s.find_last_not_of(" \t\r\n") - first + 1);
}

// "Min width", "min_width", "MINWIDTH" → "minwidth".
std::string columnKey(const std::string& s) {
    std::string k;
    for (char c : s)
        if (std::isalnum(static_cast<unsigned char>(c))) k += static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    return k;
}

char detectSeparator(const std::string& text) {
    const std::string firstLine = text.substr(0, text.find('\n'));
    int counts[3] = {0, 0, 0};
    const char seps[3] = {',', ';', '\t'};
    bool quoted = false;
    for (char c : firstLine) {
        if (c == '"') quoted = !quoted;
        for (int k = 0; k < 3 && !quoted; ++k) counts[k] += c == seps[k];
    }
    return seps[std::max_element(counts, counts + 3) - counts];
}

struct Importer {
    const std::string& fileName;
    Brief brief;
    CsvImportResult result;

    void error(int line, const std::string& message) {
        result.errors.push_back({fileName, line, "", message});
    }
    static std::string column(int c, const std::string& header) {
        return "column " + std::to_string(c + 1) + (header.empty() ? "" : " (" + header + ")") + ": ";
    }

    // A room by id or by name, or -1.
    int findRoom(const std::string& key) const {
        const int byId = brief.roomIndex(key);
        if (byId >= 0) return byId;
        for (std::size_t i = 0; i < brief.rooms.size(); ++i)
            if (brief.rooms[i].name == key) return static_cast<int>(i);
        return -1;
    }

    void roomList(const std::vector<CsvRow>& rows) {
        const std::vector<std::string>& head = rows[0].cells;
        std::map<std::string, int> col;
        const std::map<std::string, RoomField> fields{
            {"name", RoomField::Name},         {"category", RoomField::Category},
            {"area", RoomField::Area},         {"targetarea", RoomField::Area},
            {"minwidth", RoomField::MinWidth}, {"maxaspect", RoomField::MaxAspect},
            {"facade", RoomField::Facade}};
        for (std::size_t c = 0; c < head.size(); ++c) {
            const std::string key = columnKey(head[c]);
            if (key.empty()) continue;
            if (key != "id" && !fields.count(key)) {
                error(rows[0].line, column(int(c), head[c]) + "unknown column; use name, area, id, category, "
                                                              "min width, max aspect, facade");
                continue;
            }
            const std::string canonical = key == "targetarea" ? "area" : key;
            if (col.count(canonical)) error(rows[0].line, column(int(c), head[c]) + "the column appears twice");
            col[canonical] = static_cast<int>(c);
        }
        for (const char* required : {"name", "area"})
            if (!col.count(required))
                error(rows[0].line, std::string("the header has no \"") + required + "\" column");
        if (!result.errors.empty()) return;
        int added = 0, updated = 0;
        for (std::size_t r = 1; r < rows.size(); ++r) {
            const CsvRow& row = rows[r];
            auto cell = [&](const std::string& key) -> std::string {
                const auto it = col.find(key);
                return it != col.end() && it->second < int(row.cells.size()) ? trimmed(row.cells[it->second]) : "";
            };
            if (std::all_of(row.cells.begin(), row.cells.end(), [](const std::string& s) { return trimmed(s).empty(); }))
                continue;
            const std::string name = cell("name"), id = cell("id");
            if (name.empty() && id.empty()) {
                error(row.line, column(col["name"], head[col["name"]]) + "a room needs a name");
                continue;
            }
            int index = findRoom(id.empty() ? name : id);
            const bool isNew = index < 0;
            if (isNew) {
                Room room;
                room.id = id.empty() ? freshRoomId(brief, name) : id;
                room.name = name;
                room.area = 1; // set below from the area column
                addRoom(brief, room);
                index = static_cast<int>(brief.rooms.size()) - 1;
                ++added;
            } else {
                ++updated;
            }
            for (const auto& [key, c] : col) {
                if (key == "id") continue;
                const std::string text = cell(key);
                // An empty cell keeps what the brief has; a new room needs an area.
                if (text.empty() && !(isNew && key == "area")) continue;
                const EditResult e = setRoomField(brief, index, fields.at(key), text);
                if (!e.ok()) error(row.line, column(c, head[c]) + e.message);
            }
        }
        result.notes.push_back("Imported " + std::to_string(added) + " new room(s) and updated " +
                               std::to_string(updated) + ".");
    }

    void matrix(const std::vector<CsvRow>& rows) {
        const std::vector<std::string>& head = rows[0].cells;
        const std::string units = brief.units;
        std::vector<int> colRoom(head.size(), -1);
        std::vector<std::string> newRooms;
        auto roomFor = [&](const std::string& label) {
            int i = findRoom(label);
            if (i < 0) {
                Room room;
                room.id = freshRoomId(brief, label);
                room.name = label;
                room.area = placeholderArea(units);
                addRoom(brief, room);
                newRooms.push_back(label);
                i = static_cast<int>(brief.rooms.size()) - 1;
            }
            return i;
        };
        std::set<std::string> headerLabels;
        for (std::size_t c = 1; c < head.size(); ++c) {
            const std::string label = trimmed(head[c]);
            if (label.empty()) {
                error(rows[0].line, column(int(c), "") + "the header row needs a room name here");
                continue;
            }
            if (const std::string problem = textProblem(label, "the room name"); !problem.empty()) {
                error(rows[0].line, column(int(c), "") + problem);
                continue;
            }
            if (!headerLabels.insert(label).second) error(rows[0].line, column(int(c), label) + "room named twice");
            colRoom[c] = roomFor(label);
        }
        // Marks per unordered pair of rooms, with where they were read.
        struct Mark {
            AdjacencyKind kind;
            Priority priority;
            int line;
        };
        std::map<std::pair<int, int>, Mark> marks;
        std::vector<bool> rowSeen(brief.rooms.size(), false);
        for (std::size_t r = 1; r < rows.size(); ++r) {
            const CsvRow& row = rows[r];
            if (row.cells.empty() || (row.cells.size() == 1 && trimmed(row.cells[0]).empty())) continue;
            const std::string label = trimmed(row.cells[0]);
            const int rowRoom = findRoom(label);
            if (label.empty() || rowRoom < 0 ||
                std::find(colRoom.begin(), colRoom.end(), rowRoom) == colRoom.end()) {
                error(row.line, column(0, "") + "row \"" + label + "\" is not one of the rooms in the header row");
                continue;
            }
            if (rowSeen[rowRoom]) error(row.line, column(0, label) + "room has two rows");
            rowSeen[rowRoom] = true;
            if (row.cells.size() > head.size())
                error(row.line, "the row has " + std::to_string(row.cells.size()) + " cells, the header " +
                                    std::to_string(head.size()));
            for (std::size_t c = 1; c < row.cells.size() && c < head.size(); ++c) {
                const std::string m = trimmed(row.cells[c]);
                if (m.empty() || m == "0" || m == "-" || m == ".") continue;
                if (colRoom[c] < 0) continue;
                Mark mark{AdjacencyKind::Door, Priority::Must, row.line};
                if (m == "D" || m == "1" || m == "x" || m == "X") {
                } else if (m == "d") {
                    mark.priority = Priority::Should;
                } else if (m == "W") {
                    mark.kind = AdjacencyKind::Wall;
                } else if (m == "w") {
                    mark.kind = AdjacencyKind::Wall;
                    mark.priority = Priority::Should;
                } else {
                    error(row.line, column(int(c), trimmed(head[c])) + "unknown mark \"" + m +
                                        "\"; use D, d, W, w, 1 or leave the cell empty");
                    continue;
                }
                if (colRoom[c] == rowRoom) {
                    error(row.line, column(int(c), trimmed(head[c])) + "a room cannot be adjacent to itself");
                    continue;
                }
                const auto key = std::minmax(rowRoom, colRoom[c]);
                const auto [it, inserted] = marks.emplace(key, mark);
                if (!inserted && (it->second.kind != mark.kind || it->second.priority != mark.priority))
                    error(row.line, column(int(c), trimmed(head[c])) + "the mark \"" + m +
                                        "\" disagrees with the other half of the matrix (line " +
                                        std::to_string(it->second.line) + ")");
            }
        }
        if (!result.errors.empty()) return;
        // The brief's adjacencies by their pair of rooms, looked up once each:
        // a 1,000-room matrix holds up to half a million marks.
        std::unordered_map<std::string, int> index;
        for (std::size_t i = 0; i < brief.rooms.size(); ++i) index.emplace(brief.rooms[i].id, static_cast<int>(i));
        std::map<std::pair<int, int>, int> existing;
        for (std::size_t k = 0; k < brief.adjacencies.size(); ++k) {
            const auto a = index.find(brief.adjacencies[k].a), b = index.find(brief.adjacencies[k].b);
            if (a != index.end() && b != index.end())
                existing.emplace(std::minmax(a->second, b->second), static_cast<int>(k));
        }
        int added = 0, changed = 0;
        for (const auto& [pair, mark] : marks) {
            if (const auto it = existing.find(pair); it != existing.end()) {
                Adjacency& adj = brief.adjacencies[it->second];
                changed += adj.kind != mark.kind || adj.priority != mark.priority;
                adj.kind = mark.kind;
                adj.priority = mark.priority;
            } else {
                // Both rooms exist, they differ and the pair is new: what addAdjacency checks.
                brief.adjacencies.push_back(
                    Adjacency{brief.rooms[pair.first].id, brief.rooms[pair.second].id, mark.kind, mark.priority});
                ++added;
            }
        }
        result.notes.push_back("Imported " + std::to_string(added) + " new adjacencies and changed " +
                               std::to_string(changed) + ".");
        if (!newRooms.empty()) {
            std::string list;
            for (const std::string& n : newRooms) list += (list.empty() ? "" : ", ") + n;
            char area[32];
            std::snprintf(area, sizeof area, "%g", placeholderArea(units));
            result.notes.push_back("New rooms with a placeholder area of " + std::string(area) + " " + units +
                                   "\xC2\xB2 (set their targets): " + list + ".");
        }
    }
};

} // namespace

double placeholderArea(const std::string& units) { return units == "ft" ? 100.0 : 10.0; }

std::vector<CsvRow> splitCsv(const std::string& text, char separator) {
    std::vector<CsvRow> rows;
    CsvRow row{1, {}};
    std::string cell;
    bool quoted = false, any = false;
    int line = 1;
    std::size_t i = 0;
    if (text.compare(0, 3, "\xEF\xBB\xBF") == 0) i = 3; // spreadsheet programs often write a BOM
    for (; i < text.size(); ++i) {
        const char c = text[i];
        if (quoted) {
            if (c == '"' && i + 1 < text.size() && text[i + 1] == '"') {
                cell += '"';
                ++i;
            } else if (c == '"') {
                quoted = false;
            } else {
                if (c == '\n') ++line;
                cell += c;
            }
            continue;
        }
        if (c == '"') {
            quoted = true;
            any = true;
        } else if (c == separator) {
            row.cells.push_back(cell);
            cell.clear();
            any = true;
        } else if (c == '\n' || c == '\r') {
            if (c == '\r' && i + 1 < text.size() && text[i + 1] == '\n') ++i;
            if (any || !cell.empty()) {
                row.cells.push_back(cell);
                rows.push_back(row);
            }
            cell.clear();
            any = false;
            row = CsvRow{++line, {}};
        } else {
            cell += c;
            any = true;
        }
    }
    if (any || !cell.empty()) {
        row.cells.push_back(cell);
        rows.push_back(row);
    }
    return rows;
}

namespace {

// Well-formed UTF-8 as RFC 3629 defines it (no overlong forms, no surrogates,
// nothing above U+10FFFF): what the JSON writer accepts.
bool validUtf8(const std::string& s) {
    std::size_t i = 0;
    auto byte = [&](std::size_t k) { return static_cast<unsigned char>(s[k]); };
    while (i < s.size()) {
        const unsigned char c = byte(i);
        int more = 0;
        unsigned char lo = 0x80, hi = 0xBF; // range of the second byte
        if (c < 0x80) more = 0;
        else if (c >= 0xC2 && c <= 0xDF) more = 1;
        else if (c >= 0xE0 && c <= 0xEF) {
            more = 2;
            if (c == 0xE0) lo = 0xA0;
            if (c == 0xED) hi = 0x9F;
        } else if (c >= 0xF0 && c <= 0xF4) {
            more = 3;
            if (c == 0xF0) lo = 0x90;
            if (c == 0xF4) hi = 0x8F;
        } else {
            return false;
        }
        for (int k = 1; k <= more; ++k) {
            if (i + k >= s.size()) return false;
            const unsigned char b = byte(i + k);
            if (k == 1 ? (b < lo || b > hi) : (b >> 6) != 0x2) return false;
        }
        i += more + 1;
    }
    return true;
}

// Spreadsheet programs often save CSV in a Windows code page: read it as
// Windows-1252, which is Latin-1 (ISO 8859-1: bytes as the first 256 code
// points) but for 0x80–0x9F, where Latin-1 has C1 controls (refused in
// names) and Windows-1252 has € ‚ ƒ „ … and the like (table from memory of
// the WHATWG Encoding Standard; its five unassigned bytes become U+FFFD).
std::string latin1ToUtf8(const std::string& s) {
    static const char16_t windows1252[32] = {
        0x20AC, 0xFFFD, 0x201A, 0x0192, 0x201E, 0x2026, 0x2020, 0x2021, 0x02C6, 0x2030, 0x0160,
        0x2039, 0x0152, 0xFFFD, 0x017D, 0xFFFD, 0xFFFD, 0x2018, 0x2019, 0x201C, 0x201D, 0x2022,
        0x2013, 0x2014, 0x02DC, 0x2122, 0x0161, 0x203A, 0x0153, 0xFFFD, 0x017E, 0x0178};
    std::string out;
    out.reserve(s.size() * 3);
    for (char ch : s) {
        const unsigned char c = static_cast<unsigned char>(ch);
        const unsigned cp = c >= 0x80 && c < 0xA0 ? windows1252[c - 0x80] : c;
        if (cp < 0x80) {
            out += ch;
        } else if (cp < 0x800) {
            out += static_cast<char>(0xC0 | (cp >> 6));
            out += static_cast<char>(0x80 | (cp & 0x3F));
        } else {
            out += static_cast<char>(0xE0 | (cp >> 12));
            out += static_cast<char>(0x80 | ((cp >> 6) & 0x3F));
            out += static_cast<char>(0x80 | (cp & 0x3F));
        }
    }
    return out;
}

} // namespace

CsvImportResult importCsv(const std::string& raw, const std::string& fileName, const Brief& into) {
    Importer im{fileName, into, {}};
    // Names end up in the project file, which is UTF-8 JSON.
    const bool utf8 = validUtf8(raw);
    const std::string text = utf8 ? raw : latin1ToUtf8(raw);
    if (!utf8) im.result.notes.push_back("The file is not UTF-8; it was read as Latin-1 (Windows).");
    const std::vector<CsvRow> rows = splitCsv(text, detectSeparator(text));
    if (rows.empty()) {
        im.error(0, "the file is empty; expected a room list or an adjacency matrix");
    } else {
        const std::vector<std::string>& head = rows[0].cells;
        bool hasArea = false, hasName = false;
        for (const std::string& h : head) {
            hasArea |= columnKey(h) == "area" || columnKey(h) == "targetarea";
            hasName |= columnKey(h) == "name";
        }
        if (hasArea || hasName) {
            im.result.layout = CsvLayout::RoomList;
            im.roomList(rows);
        } else if (head.size() >= 2) {
            im.result.layout = CsvLayout::AdjacencyMatrix;
            im.matrix(rows);
        } else {
            im.error(rows[0].line, "expected a header row: room list columns (name, area, …) or room names "
                                   "for an adjacency matrix");
        }
    }
    CsvImportResult result = std::move(im.result);
    if (!result.errors.empty()) {
        result.status = LoadStatus::Invalid;
        result.notes.clear();
        return result;
    }
    result.brief = std::move(im.brief);
    placeUnsketchedRooms(result.brief);
    return result;
}

CsvImportResult importCsvFile(const std::string& path, const Brief& into) {
    std::string message;
    const auto text = readFile(path, &message);
    if (!text) {
        CsvImportResult r;
        r.status = LoadStatus::Unreadable;
        r.errors.push_back({path, 0, "", message});
        return r;
    }
    return importCsv(*text, path, into);
}

} // namespace abut
