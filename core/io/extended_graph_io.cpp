#include "io/extended_graph_io.h"

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
