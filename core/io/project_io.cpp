// SPDX-License-Identifier: MIT
#include "io/project_io.h"

#include "brief/brief_rules.h"
#include "detail/json_locate.h"
#include "io/atomic_file.h"

#include <cmath>
#include <limits>
#include <set>
#include <sstream>
#include <nlohmann/json.hpp>

namespace abut {

std::string FileError::toString() const {
    std::string s = file;
    if (line > 0) s += ":" + std::to_string(line);
    s += ": ";
    if (!pointer.empty()) s += pointer + ": ";
    return s + message;
}

namespace {


std::string describe(const OrderedJson& v) {
    std::string d = v.dump();
    if (d.size() > 40) d = d.substr(0, 37) + "...";
    return d;
}

class Reader {
public:
    Reader(const std::string& text, const std::string& file) : text_(text), file_(file) {}

    // The first `maxErrors` problems, each with its line; the rest counted
    // (finding a line reads the file: 20,000 of them took 82 s).
    void error(const std::string& pointer, const std::string& message) {
        if (errors.size() >= maxErrors) {
            ++more;
            return;
        }
        FileError e;
        e.file = file_;
        e.pointer = pointer;
        e.line = detail::lineOfJsonPointer(text_, pointer);
        e.message = message;
        errors.push_back(std::move(e));
    }

    // A number that must be finite and > 0 (or >= `atLeast` when given), and
    // at most `atMost` (the plausible range, see project_io.h).
    std::optional<double> positive(const OrderedJson& obj, const std::string& key,
                                   const std::string& ptr, const char* what,
                                   std::optional<double> atLeast = std::nullopt,
                                   std::optional<double> atMost = std::nullopt) {
        const OrderedJson& v = obj.at(key);
        if (!v.is_number()) {
            error(ptr, std::string(what) + " must be a number, got " + describe(v));
            return std::nullopt;
        }
        const double d = v.get<double>();
        const std::string problem =
            numberProblem(d, what, atLeast.value_or(minLength), atMost.value_or(std::numeric_limits<double>::max()));
        if (!problem.empty()) {
            error(ptr, problem);
            return std::nullopt;
        }
        return d;
    }

    std::optional<std::string> string(const OrderedJson& obj, const std::string& key,
                                      const std::string& ptr, const char* what) {
        const OrderedJson& v = obj.at(key);
        if (!v.is_string()) {
            error(ptr, std::string(what) + " must be a string, got " + describe(v));
            return std::nullopt;
        }
        return v.get<std::string>();
    }

    // A string of plain text on one line: control characters (tabs and line
    // breaks included) are refused, they break exports and tables.
    std::optional<std::string> text(const OrderedJson& obj, const std::string& key, const std::string& ptr,
                                    const char* what) {
        auto s = string(obj, key, ptr, what);
        if (!s) return s;
        if (const std::string problem = textProblem(*s, what); !problem.empty()) {
            error(ptr, problem);
            return std::nullopt;
        }
        return s;
    }

    // The last line of a long list of problems.
    void closeList() {
        if (more == 0) return;
        errors.push_back(FileError{file_, 0, "", "and " + std::to_string(more) + " more problems like these"});
        more = 0;
    }

    static constexpr std::size_t maxErrors = 50;
    std::vector<FileError> errors;
    std::size_t more = 0;              // problems past maxErrors
    std::set<std::string> refusedIds; // room ids refused as written

private:
    const std::string& text_;
    const std::string& file_;
};

OrderedJson unknownOf(const OrderedJson& obj, std::initializer_list<const char*> known) {
    OrderedJson extra = OrderedJson::object();
    for (auto it = obj.begin(); it != obj.end(); ++it) {
        bool isKnown = false;
        for (const char* k : known) isKnown = isKnown || it.key() == k;
        if (!isKnown) extra[it.key()] = it.value();
    }
    return extra;
}

// {"x", "y", "width", "depth"} inside the footprint's bounding rectangle.
std::optional<Placement> readPlacement(Reader& r, const OrderedJson& j, const std::string& ptr, const char* what) {
    if (!j.is_object()) {
        r.error(ptr, std::string(what) + " must be an object with \"x\", \"y\", \"width\" and \"depth\", got " +
                         describe(j));
        return std::nullopt;
    }
    Placement p;
    bool ok = true;
    for (const char* key : {"x", "y", "width", "depth"}) {
        if (!j.contains(key)) {
            r.error(ptr, std::string(what) + " has no \"" + key + "\"");
            ok = false;
            continue;
        }
        const bool length = std::string(key) == "width" || std::string(key) == "depth";
        const std::string field = std::string(what) + " " + key;
        const auto v = r.positive(j, key, ptr + "/" + key, field.c_str(),
                                  length ? std::optional<double>(minLength) : std::optional<double>(0.0), maxLength);
        if (!v) {
            ok = false;
            continue;
        }
        (key[0] == 'x' ? p.x : key[0] == 'y' ? p.y : key[0] == 'w' ? p.width : p.depth) = *v;
    }
    if (!ok) return std::nullopt;
    return p;
}

void readRoom(Reader& r, const OrderedJson& j, const std::string& ptr, Brief& brief) {
    if (!j.is_object()) {
        r.error(ptr, "each room must be a JSON object, got " + describe(j));
        return;
    }
    Room room;
    if (!j.contains("id")) r.error(ptr, "room has no \"id\"");
    else if (auto id = r.text(j, "id", ptr + "/id", "id")) {
        if (id->empty()) r.error(ptr + "/id", "id must not be empty");
        room.id = *id;
    } else if (j.at("id").is_string()) {
        r.refusedIds.insert(j.at("id").get<std::string>()); // said once, here: not again per adjacency
    }
    if (j.contains("name"))
        if (auto name = r.text(j, "name", ptr + "/name", "name")) room.name = *name;
    if (!j.contains("area")) r.error(ptr, "room \"" + room.id + "\" has no \"area\" (target area)");
    else if (auto a = r.positive(j, "area", ptr + "/area", "area", minArea, maxArea)) room.area = *a;
    if (j.contains("minWidth"))
        if (auto w = r.positive(j, "minWidth", ptr + "/minWidth", "minWidth", minLength, maxLength)) room.minWidth = *w;
    if (j.contains("maxAspect"))
        if (auto m = r.positive(j, "maxAspect", ptr + "/maxAspect", "maxAspect", 1.0, maxAspectLimit))
            room.maxAspect = *m;
    if (j.contains("areaTolerance"))
        if (auto t = r.positive(j, "areaTolerance", ptr + "/areaTolerance", "areaTolerance", 0.0)) {
            if (*t >= 1.0) r.error(ptr + "/areaTolerance", "areaTolerance is a fraction of the target area below 1 (0.05 = 5 %), got " + formatNumber(*t));
            else room.areaTolerance = *t;
        }
    if (j.contains("category"))
        if (auto c = r.text(j, "category", ptr + "/category", "category")) room.category = *c;
    if (j.contains("zone"))
        if (auto z = r.text(j, "zone", ptr + "/zone", "zone")) room.zone = *z;
    if (j.contains("facade")) {
        const OrderedJson& f = j.at("facade");
        if (!f.is_array()) {
            r.error(ptr + "/facade", "facade must be a list of sides such as [\"N\", \"E\"] or [\"any\"]");
        } else {
            for (std::size_t k = 0; k < f.size(); ++k) {
                const std::string p = ptr + "/facade/" + std::to_string(k);
                const std::string s = f[k].is_string() ? f[k].get<std::string>() : "";
                if (s == "any") room.facade.anySide = true;
                else if (auto side = sideFromLetter(s)) room.facade.add(*side);
                else
                    r.error(p, "unknown facade side " + describe(f[k]) +
                                   "; use \"N\", \"E\", \"S\", \"W\" or \"any\"");
            }
        }
    }
    std::optional<Placement> fixed;
    if (j.contains("fixed")) {
        if (!brief.footprint)
            r.error(ptr + "/fixed", "a fixed room needs a footprint to be placed in; give \"footprint\" a width and depth");
        else
            fixed = readPlacement(r, j.at("fixed"), ptr + "/fixed", "fixed");
    }
    room.unknownFields = unknownOf(
        j, {"id", "name", "area", "minWidth", "maxAspect", "areaTolerance", "category", "zone", "facade", "fixed"});
    brief.rooms.push_back(std::move(room));
    if (fixed) {
        brief.rooms.back().fixed = fixed;
        if (const std::string problem = fixedRoomProblem(brief, brief.rooms.size() - 1); !problem.empty()) {
            r.error(ptr + "/fixed", problem);
            brief.rooms.back().fixed.reset();
        }
    }
}

void readCutouts(Reader& r, const OrderedJson& list, Footprint& fp) {
    if (!list.is_array()) {
        r.error("/footprint/cutouts", "cutouts must be a list of rectangles {\"x\", \"y\", \"width\", \"depth\"}");
        return;
    }
    std::vector<std::string> where; // the pointer of each cut-out kept
    for (std::size_t k = 0; k < list.size(); ++k) {
        const std::string ptr = "/footprint/cutouts/" + std::to_string(k);
        auto c = readPlacement(r, list[k], ptr, "cut-out");
        if (!c) continue;
        fp.cutouts.push_back(*c);
        if (const std::string problem = cutoutProblem(fp, fp.cutouts.size() - 1); !problem.empty()) {
            r.error(ptr, problem);
            fp.cutouts.pop_back();
        } else {
            where.push_back(ptr);
        }
    }
    std::size_t which = 0;
    if (const std::string problem = splitProblem(fp, &which); !problem.empty()) {
        r.error(where[which], problem);
        fp.cutouts.resize(which);
    }
}

void readAdjacency(Reader& r, const OrderedJson& j, const std::string& ptr, Brief& brief) {
    if (!j.is_object()) {
        r.error(ptr, "each adjacency must be a JSON object, got " + describe(j));
        return;
    }
    Adjacency adj;
    bool ok = true;
    if (!j.contains("rooms")) {
        r.error(ptr, "adjacency has no \"rooms\" (the two room ids it joins)");
        ok = false;
    } else {
        const OrderedJson& pair = j.at("rooms");
        if (!pair.is_array() || pair.size() != 2 || !pair[0].is_string() || !pair[1].is_string()) {
            r.error(ptr + "/rooms", "rooms must be a list of two room ids, got " + describe(pair));
            ok = false;
        } else {
            adj.a = pair[0].get<std::string>();
            adj.b = pair[1].get<std::string>();
            for (int k = 0; k < 2; ++k) {
                const std::string& id = k == 0 ? adj.a : adj.b;
                if (brief.roomIndex(id) < 0) {
                    if (!r.refusedIds.count(id))
                        r.error(ptr + "/rooms/" + std::to_string(k),
                                "adjacency names room \"" + id + "\", which the brief does not have");
                    ok = false;
                }
            }
            if (ok && adj.a == adj.b) {
                r.error(ptr + "/rooms", "room \"" + adj.a + "\" cannot be adjacent to itself");
                ok = false;
            }
        }
    }
    if (j.contains("kind")) {
        auto k = r.string(j, "kind", ptr + "/kind", "kind");
        if (k && *k == "door") adj.kind = AdjacencyKind::Door;
        else if (k && *k == "wall") adj.kind = AdjacencyKind::Wall;
        else if (k) r.error(ptr + "/kind", "unknown kind \"" + *k + "\"; use \"door\" or \"wall\"");
    }
    if (j.contains("priority")) {
        auto p = r.string(j, "priority", ptr + "/priority", "priority");
        if (p && *p == "must") adj.priority = Priority::Must;
        else if (p && *p == "should") adj.priority = Priority::Should;
        else if (p)
            r.error(ptr + "/priority", "unknown priority \"" + *p + "\"; use \"must\" or \"should\"");
    }
    adj.unknownFields = unknownOf(j, {"rooms", "kind", "priority"});
    if (ok) brief.adjacencies.push_back(std::move(adj));
}

void readBody(Reader& r, const OrderedJson& doc, Brief& brief) {
    if (doc.contains("units")) {
        auto u = r.string(doc, "units", "/units", "units");
        if (u && (*u == "m" || *u == "ft")) brief.units = *u;
        else if (u) r.error("/units", "unknown units \"" + *u + "\"; use \"m\" or \"ft\"");
    }
    if (doc.contains("footprint")) {
        const OrderedJson& f = doc.at("footprint");
        if (!f.is_object() || !f.contains("width") || !f.contains("depth")) {
            r.error("/footprint", "footprint must be an object with \"width\" and \"depth\"");
        } else {
            auto w = r.positive(f, "width", "/footprint/width", "footprint width", minLength, maxLength);
            auto d = r.positive(f, "depth", "/footprint/depth", "footprint depth", minLength, maxLength);
            if (w && d) brief.footprint = Footprint{*w, *d, {}};
            if (w && d && f.contains("cutouts")) readCutouts(r, f.at("cutouts"), *brief.footprint);
            brief.footprintUnknownFields = unknownOf(f, {"width", "depth", "cutouts"});
        }
    }
    if (doc.contains("surplus")) {
        auto v = r.string(doc, "surplus", "/surplus", "surplus");
        if (v && *v == "spare") brief.surplus = Surplus::Spare;
        else if (v && *v == "spread") brief.surplus = Surplus::Spread;
        else if (v)
            r.error("/surplus", "unknown surplus \"" + *v + "\"; use \"spare\" (area left over stays as spare space) "
                                "or \"spread\" (every room grows in proportion)");
    }
    if (doc.contains("doorWidth"))
        if (auto w = r.positive(doc, "doorWidth", "/doorWidth", "doorWidth", minLength, maxLength)) {
            if (const std::string problem = brief.footprint ? doorWidthProblem(*w, *brief.footprint) : std::string();
                !problem.empty())
                r.error("/doorWidth", problem);
            else
                brief.doorWidth = *w;
        }

    bool roomsRead = false; // without a room list, adjacencies and sketch would only repeat its error
    if (!doc.contains("rooms")) {
        r.error("", "the project has no \"rooms\" list");
    } else if (!doc.at("rooms").is_array()) {
        r.error("/rooms", "rooms must be a list, got " + describe(doc.at("rooms")));
    } else {
        roomsRead = true;
        const OrderedJson& rooms = doc.at("rooms");
        std::set<std::string> seen;
        for (std::size_t i = 0; i < rooms.size(); ++i) {
            const std::string ptr = "/rooms/" + std::to_string(i);
            const std::size_t before = brief.rooms.size();
            readRoom(r, rooms[i], ptr, brief);
            if (brief.rooms.size() > before && !brief.rooms.back().id.empty() &&
                !seen.insert(brief.rooms.back().id).second)
                r.error(ptr + "/id", "duplicate room id \"" + brief.rooms.back().id + "\"");
        }
    }
    if (roomsRead && doc.contains("adjacencies")) {
        const OrderedJson& adjs = doc.at("adjacencies");
        if (!adjs.is_array()) {
            r.error("/adjacencies", "adjacencies must be a list");
        } else {
            std::set<std::pair<std::string, std::string>> seen;
            for (std::size_t i = 0; i < adjs.size(); ++i) {
                const std::string ptr = "/adjacencies/" + std::to_string(i);
                const std::size_t before = brief.adjacencies.size();
                readAdjacency(r, adjs[i], ptr, brief);
                if (brief.adjacencies.size() == before) continue;
                const Adjacency& a = brief.adjacencies.back();
                if (!seen.insert(std::minmax(a.a, a.b)).second)
                    r.error(ptr + "/rooms", "rooms \"" + a.a + "\" and \"" + a.b +
                                                "\" are listed as adjacent twice");
            }
        }
    }
    if (roomsRead && doc.contains("sketch")) {
        const OrderedJson& sk = doc.at("sketch");
        if (!sk.is_object()) {
            r.error("/sketch", "sketch must be an object mapping room ids to [x, y]");
        } else {
            for (auto it = sk.begin(); it != sk.end(); ++it) {
                const std::string ptr = "/sketch/" + detail::escapePointerToken(it.key());
                const OrderedJson& p = it.value();
                if (r.refusedIds.count(it.key())) {
                    continue;
                } else if (brief.roomIndex(it.key()) < 0) {
                    r.error(ptr, "sketch position for room \"" + it.key() +
                                     "\", which the brief does not have");
                } else if (!p.is_array() || p.size() != 2 || !p[0].is_number() ||
                           !p[1].is_number() || !(std::abs(p[0].get<double>()) <= maxSketchCoordinate) ||
                           !(std::abs(p[1].get<double>()) <= maxSketchCoordinate)) {
                    r.error(ptr, "a sketch position must be [x, y] with two numbers of at most " +
                                     formatNumber(maxSketchCoordinate) + " either way");
                } else {
                    brief.sketch.emplace_back(it.key(),
                                              SketchPoint{p[0].get<double>(), p[1].get<double>()});
                }
            }
        }
    }
    if (doc.contains("variants")) {
        const OrderedJson& v = doc.at("variants");
        if (!v.is_object()) {
            r.error("/variants", "variants must be an object with \"pinned\" and \"hidden\" lists of variant keys");
        } else {
            for (const char* key : {"pinned", "hidden"}) {
                if (!v.contains(key)) continue;
                const OrderedJson& list = v.at(key);
                const std::string ptr = std::string("/variants/") + key;
                std::vector<std::string>& out = std::string(key) == "pinned" ? brief.pinnedVariants : brief.hiddenVariants;
                if (!list.is_array()) {
                    r.error(ptr, std::string(key) + " must be a list of variant keys");
                    continue;
                }
                for (std::size_t i = 0; i < list.size(); ++i) {
                    if (!list[i].is_string() || list[i].get<std::string>().empty())
                        r.error(ptr + "/" + std::to_string(i), "a variant key must be a non-empty string");
                    else
                        out.push_back(list[i].get<std::string>());
                }
            }
        }
    }
    brief.unknownFields = unknownOf(doc, {"format", "version", "units", "footprint", "doorWidth", "surplus",
                                          "rooms", "adjacencies", "sketch", "variants"});
}

} // namespace

LoadResult parseProject(const std::string& text, const std::string& fileName) {
    LoadResult result;
    if (const std::size_t deep = detail::nestingTooDeep(text, detail::maxJsonDepth); deep != std::string::npos) {
        result.status = LoadStatus::NotJson;
        result.errors.push_back(FileError{fileName, detail::lineOfOffset(text, deep), "",
                                          "nested more than " + std::to_string(detail::maxJsonDepth) +
                                              " levels deep (lists and objects inside each other); "
                                              "a project file needs a handful"});
        return result;
    }
    OrderedJson doc;
    try {
        doc = OrderedJson::parse(text);
    } catch (const nlohmann::json::parse_error& e) {
        FileError err;
        err.file = fileName;
        err.line = detail::lineOfOffset(text, e.byte > 0 ? e.byte - 1 : 0);
        std::string what = e.what();
        const auto colon = what.find("syntax error");
        err.message = "not valid JSON: " + (colon != std::string::npos ? what.substr(colon) : what);
        result.status = LoadStatus::NotJson;
        result.errors.push_back(err);
        return result;
    } catch (const nlohmann::json::exception& e) {
        // Out-of-range numbers such as 1e999: name the line of the literal.
        std::string what = e.what();
        const auto q1 = what.find('\'');
        const auto q2 = what.rfind('\'');
        std::size_t at = std::string::npos;
        if (q1 != std::string::npos && q2 > q1) at = text.find(what.substr(q1 + 1, q2 - q1 - 1));
        FileError err;
        err.file = fileName;
        err.line = at == std::string::npos ? 0 : detail::lineOfOffset(text, at);
        const auto tail = what.find("] ");
        err.message = "not valid JSON: " + (tail != std::string::npos ? what.substr(tail + 2) : what);
        result.status = LoadStatus::NotJson;
        result.errors.push_back(err);
        return result;
    }
    Reader r(text, fileName);
    if (const detail::DuplicateKey dup = detail::duplicateKeyAt(text); dup.offset != std::string::npos) {
        // Readers disagree on which one counts ("area": 20, "area": 15 was
        // read as 15; a second "rooms" gave unrelated errors): refused.
        result.status = LoadStatus::Invalid;
        result.errors.push_back(FileError{fileName, detail::lineOfOffset(text, dup.offset), dup.object,
                                          "the key \"" + dup.key +
                                              "\" appears twice in one object; keep one"});
        return result;
    }
    if (!doc.is_object()) {
        r.error("", "a project file must hold a JSON object");
    } else if (!doc.contains("format") || doc.at("format") != "abut.project") {
        r.error(doc.contains("format") ? "/format" : "",
                "not an Abut project file (\"format\" must be \"abut.project\")");
    } else if (!doc.contains("version") || !doc.at("version").is_number_integer()) {
        r.error(doc.contains("version") ? "/version" : "", "\"version\" must be a whole number");
    } else if (doc.at("version").get<long long>() > projectFormatVersion) {
        r.error("/version", "the file is version " + doc.at("version").dump() +
                                ", made by a newer Abut; this version reads version " +
                                std::to_string(projectFormatVersion) + " and will not half-read it");
        result.status = LoadStatus::NewerVersion;
        result.errors = std::move(r.errors);
        return result;
    } else if (doc.at("version").get<long long>() < 1) {
        r.error("/version", "unknown version " + doc.at("version").dump());
    } else {
        readBody(r, doc, result.brief);
    }
    r.closeList();
    if (!r.errors.empty()) {
        result.status = LoadStatus::Invalid;
        result.errors = std::move(r.errors);
        result.brief = Brief{};
    }
    return result;
}

LoadResult loadProject(const std::string& path) {
    std::string message;
    auto text = readFile(path, &message);
    if (!text) {
        LoadResult result;
        result.status = LoadStatus::Unreadable;
        result.errors.push_back(FileError{path, 0, "", message.substr(message.find(": ") + 2)});
        return result;
    }
    return parseProject(*text, path);
}

namespace {
OrderedJson placementJson(const Placement& p) {
    OrderedJson j = OrderedJson::object();
    j["x"] = p.x;
    j["y"] = p.y;
    j["width"] = p.width;
    j["depth"] = p.depth;
    return j;
}
} // namespace

std::string serializeProject(const Brief& brief) {
    OrderedJson doc = OrderedJson::object();
    doc["format"] = "abut.project";
    doc["version"] = projectFormatVersion;
    doc["units"] = brief.units;
    if (brief.footprint) {
        doc["footprint"] = {{"width", brief.footprint->width}, {"depth", brief.footprint->depth}};
        if (!brief.footprint->cutouts.empty()) {
            OrderedJson list = OrderedJson::array();
            for (const Placement& c : brief.footprint->cutouts) list.push_back(placementJson(c));
            doc["footprint"]["cutouts"] = list;
        }
        for (auto it = brief.footprintUnknownFields.json().begin(); it != brief.footprintUnknownFields.json().end(); ++it)
            doc["footprint"][it.key()] = it.value();
    }
    doc["doorWidth"] = brief.doorWidth;
    if (brief.surplus == Surplus::Spread) doc["surplus"] = "spread"; // "spare" is the default
    OrderedJson rooms = OrderedJson::array();
    for (const Room& room : brief.rooms) {
        if (room.cutout) continue; // plannedBrief's, written as footprint.cutouts
        OrderedJson j = OrderedJson::object();
        j["id"] = room.id;
        if (!room.name.empty()) j["name"] = room.name;
        j["area"] = room.area;
        if (room.minWidth) j["minWidth"] = *room.minWidth;
        if (room.maxAspect) j["maxAspect"] = *room.maxAspect;
        if (room.areaTolerance) j["areaTolerance"] = *room.areaTolerance;
        if (!room.category.empty()) j["category"] = room.category;
        if (!room.zone.empty()) j["zone"] = room.zone;
        if (!room.facade.empty()) {
            OrderedJson f = OrderedJson::array();
            if (room.facade.anySide) f.push_back("any");
            for (Side s : allSides)
                if (room.facade.has(s)) f.push_back(std::string(1, sideLetter(s)));
            j["facade"] = f;
        }
        if (room.fixed) j["fixed"] = placementJson(*room.fixed);
        for (auto it = room.unknownFields.json().begin(); it != room.unknownFields.json().end(); ++it)
            j[it.key()] = it.value();
        rooms.push_back(j);
    }
    doc["rooms"] = rooms;
    OrderedJson adjs = OrderedJson::array();
    for (const Adjacency& a : brief.adjacencies) {
        OrderedJson j = OrderedJson::object();
        j["rooms"] = {a.a, a.b};
        j["kind"] = toString(a.kind);
        j["priority"] = toString(a.priority);
        for (auto it = a.unknownFields.json().begin(); it != a.unknownFields.json().end(); ++it)
            j[it.key()] = it.value();
        adjs.push_back(j);
    }
    doc["adjacencies"] = adjs;
    if (!brief.sketch.empty()) {
        OrderedJson sk = OrderedJson::object();
        for (const auto& [id, p] : brief.sketch) sk[id] = {p.x, p.y};
        doc["sketch"] = sk;
    }
    if (!brief.pinnedVariants.empty() || !brief.hiddenVariants.empty()) {
        OrderedJson v = OrderedJson::object();
        if (!brief.pinnedVariants.empty()) v["pinned"] = brief.pinnedVariants;
        if (!brief.hiddenVariants.empty()) v["hidden"] = brief.hiddenVariants;
        doc["variants"] = v;
    }
    for (auto it = brief.unknownFields.json().begin(); it != brief.unknownFields.json().end(); ++it)
        doc[it.key()] = it.value();
    return doc.dump(2) + "\n";
}

SaveResult saveProject(const Brief& brief, const std::string& path) {
    const WriteResult w = writeFileAtomically(path, serializeProject(brief));
    return {w.ok, w.message};
}

} // namespace abut
