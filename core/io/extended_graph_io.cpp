// SPDX-License-Identifier: MIT
#include "io/extended_graph_io.h"

#include <nlohmann/json.hpp>

#include <set>

namespace abut {

std::string serializeExtendedGraph(const ExtendedGraph& x) {
    // Hand-laid so that one edge is one line: diffs and reviews stay readable.
    auto str = [](const std::string& s) { return OrderedJson(s).dump(); };
    std::string out = "{\n  \"format\": \"abut.extended-graph\",\n  \"version\": 1,\n  \"vertices\": [";
    for (std::size_t i = 0; i < x.names.size(); ++i) out += (i ? ", " : "") + str(x.names[i]);
    out += "],\n  \"edges\": [\n";
    const auto edges = x.graph.edgeList();
    for (std::size_t i = 0; i < edges.size(); ++i)
        out += "    [" + str(x.names[edges[i].first]) + ", " + str(x.names[edges[i].second]) + "]" +
               (i + 1 < edges.size() ? ",\n" : "\n");
    out += "  ],\n  \"poles\": {";
    const char* letters[4] = {"N", "E", "S", "W"};
    for (int s = 0; s < 4; ++s)
        out += std::string(s ? ", " : "") + "\"" + letters[s] + "\": " + str(x.names[x.pole(allSides[s])]);
    out += "}\n}\n";
    return out;
}

} // namespace abut

#include "detail/json_locate.h"
#include "embed/planar_embedding.h"
#include "io/atomic_file.h"

#include <map>

namespace abut {

ExtendedGraphLoad parseExtendedGraph(const std::string& text, const std::string& file) {
    ExtendedGraphLoad out;
    auto fail = [&](const std::string& pointer, const std::string& what) {
        out.ok = false;
        const int line = pointer.empty() ? 0 : detail::lineOfJsonPointer(text, pointer);
        out.error = file + (line > 0 ? ":" + std::to_string(line) : "") + ": " +
                    (pointer.empty() ? "" : pointer + ": ") + what;
        return out;
    };
    if (const std::size_t deep = detail::nestingTooDeep(text, detail::maxJsonDepth); deep != std::string::npos) {
        out.ok = false;
        out.error = file + ":" + std::to_string(detail::lineOfOffset(text, deep)) + ": nested more than " +
                    std::to_string(detail::maxJsonDepth) + " levels deep (lists and objects inside each other)";
        return out;
    }
    OrderedJson j;
    try {
        j = OrderedJson::parse(text);
    } catch (const nlohmann::json::exception& e) {
        std::string what = e.what();
        const auto cut = what.find("] ");
        return fail("", "not valid JSON: " + (cut == std::string::npos ? what : what.substr(cut + 2)));
    }
    if (!j.is_object() || !j.contains("format") || !j["format"].is_string() ||
        j["format"].get<std::string>() != "abut.extended-graph")
        return fail(j.is_object() && j.contains("format") ? "/format" : "",
                    "not an extended-graph file (\"format\" must be \"abut.extended-graph\")");
    if (!j.contains("version") || !j["version"].is_number_integer() || j["version"].get<long long>() != 1)
        return fail(j.contains("version") ? "/version" : "", "this version reads extended-graph files of version 1 only");
    if (!j.contains("vertices") || !j["vertices"].is_array()) return fail("", "no \"vertices\" list");
    if (!j.contains("edges") || !j["edges"].is_array()) return fail("", "no \"edges\" list");
    if (!j.contains("poles") || !j["poles"].is_object()) return fail("", "no \"poles\" object");
    std::map<std::string, int> index;
    std::vector<std::string> names;
    for (std::size_t i = 0; i < j["vertices"].size(); ++i) {
        const auto& v = j["vertices"][i];
        const std::string ptr = "/vertices/" + std::to_string(i);
        if (!v.is_string() || v.get<std::string>().empty()) return fail(ptr, "a vertex must be a non-empty name");
        if (!index.emplace(v.get<std::string>(), static_cast<int>(i)).second)
            return fail(ptr, "duplicate vertex \"" + v.get<std::string>() + "\"");
        names.push_back(v.get<std::string>());
    }
    int pole[4];
    for (Side s : allSides) {
        const std::string key(1, sideLetter(s));
        const auto& p = j["poles"];
        if (!p.contains(key) || !p[key].is_string() || !index.count(p[key].get<std::string>()))
            return fail("/poles", "pole " + key + " must name one of the vertices");
        pole[static_cast<int>(s)] = index.at(p[key].get<std::string>());
    }
    for (int a = 0; a < 4; ++a)
        for (int b = a + 1; b < 4; ++b)
            if (pole[a] == pole[b]) return fail("/poles", "the four poles must be different vertices");
    std::vector<std::pair<int, int>> edges;
    std::set<std::pair<int, int>> seen;
    for (std::size_t i = 0; i < j["edges"].size(); ++i) {
        const auto& e = j["edges"][i];
        const std::string ptr = "/edges/" + std::to_string(i);
        if (!e.is_array() || e.size() != 2 || !e[0].is_string() || !e[1].is_string())
            return fail(ptr, "an edge must be a pair of vertex names");
        const std::string a = e[0].get<std::string>(), b = e[1].get<std::string>();
        if (!index.count(a) || !index.count(b)) return fail(ptr, "edge names a vertex that is not listed");
        if (a == b) return fail(ptr, "an edge cannot join a vertex to itself");
        if (!seen.insert(std::minmax(index.at(a), index.at(b))).second) return fail(ptr, "duplicate edge " + a + "-" + b);
        edges.emplace_back(index.at(a), index.at(b));
    }
    const int n = static_cast<int>(names.size());
    if (n < 5) return fail("/vertices", "an extended graph has the four poles and at least one room");
    // Renumber: rooms first (in file order), then N, E, S, W.
    std::vector<int> to(n);
    int next = 0;
    for (int v = 0; v < n; ++v)
        if (std::find(pole, pole + 4, v) == pole + 4) to[v] = next++;
    for (int s = 0; s < 4; ++s) to[pole[s]] = next++;
    std::vector<std::pair<int, int>> mapped;
    for (const auto& [a, b] : edges) mapped.emplace_back(to[a], to[b]);
    const int rooms = n - 4;
    for (int s = 0; s < 4; ++s) mapped.emplace_back(n, rooms + s); // the helper vertex
    const EmbeddingResult emb = embedPlanar(n + 1, mapped);
    if (emb.status != EmbeddingStatus::Planar)
        return fail("/edges", "the graph with its poles closed off is not planar");
    PlaneGraph g(n);
    const int N = rooms, E = rooms + 1;
    for (int v = 0; v < n; ++v) {
        std::vector<int> rot;
        for (int u : emb.graph.neighbours(v))
            if (u != n) rot.push_back(u);
        g.setRotation(v, rot);
    }
    // The helper sat in the outer face: poles' rotations now have a gap there;
    // rotate each pole's list so it starts right after the helper, which keeps
    // counter-clockwise order. Then fix the orientation.
    for (int s = 0; s < 4; ++s) {
        const int v = rooms + s;
        const auto& full = emb.graph.neighbours(v);
        const int h = emb.graph.position(v, n);
        std::vector<int> rot;
        for (std::size_t k = 1; k < full.size(); ++k) rot.push_back(full[(h + k) % full.size()]);
        g.setRotation(v, rot);
    }
    g.rebuildEdgeSet();
    if (!g.hasEdge(N, E) || g.faceOf(N, E).size() != 4 || g.faceOf(N, E)[2] != rooms + 2) {
        for (int v = 0; v < n; ++v) {
            std::vector<int> rot(g.neighbours(v).rbegin(), g.neighbours(v).rend());
            g.setRotation(v, rot);
        }
        g.rebuildEdgeSet();
    }
    ExtendedGraph x;
    x.roomCount = rooms;
    x.graph = std::move(g);
    std::vector<std::string> roomNames(rooms);
    for (int v = 0; v < n; ++v)
        if (to[v] < rooms) roomNames[to[v]] = names[v];
    x.names = roomNames;
    for (int s = 0; s < 4; ++s) x.names.push_back(names[pole[s]]);
    const StageCheck check = checkExtendedGraph(x);
    if (!check.ok) return fail("", "not an irreducible triangulation of the 4-cycle N-E-S-W: " + check.problem);
    out.ok = true;
    out.graph = std::move(x);
    return out;
}

ExtendedGraphLoad loadExtendedGraph(const std::string& path) {
    std::string message;
    const auto text = readFile(path, &message);
    if (!text) {
        ExtendedGraphLoad out;
        out.error = message;
        return out;
    }
    return parseExtendedGraph(*text, path);
}

} // namespace abut
