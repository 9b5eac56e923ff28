// SPDX-License-Identifier: MIT
#include "cli_commands.h"

#include "dual/rectangular_dual.h"
#include "io/extended_graph_io.h"
#include "label/labeling_lattice.h"

#include <iostream>
#include <nlohmann/json.hpp>

namespace abut::cli {

int runLabelings(const std::vector<std::string>& args, std::ostream& out, std::ostream& err) {
    const std::string usage = "labelings EXT.json [--count] [--limit N] [--seed S]";
    const ParsedArgs a = parseArgs(args, {"--limit", "--seed"}, {"--count"}, err, usage);
    if (!a.ok) return exitBadInput;
    if (a.positional.size() != 1) {
        err << "usage: abut-cli " << usage << "\n";
        return exitBadInput;
    }
    const bool countOnly = a.flags.count("--count") > 0;
    std::uint64_t limit = countOnly ? 100000000ULL : 10000ULL;
    std::uint32_t seed = 0;
    try {
        if (a.values.count("--limit")) {
            std::size_t used = 0;
            const long long v = std::stoll(a.values.at("--limit"), &used);
            if (used != a.values.at("--limit").size() || v < 1) throw std::invalid_argument("limit");
            limit = static_cast<std::uint64_t>(v);
        }
        if (a.values.count("--seed")) {
            std::size_t used = 0;
            const long long v = std::stoll(a.values.at("--seed"), &used);
            if (used != a.values.at("--seed").size() || v < 0 || v > 4294967295LL) throw std::invalid_argument("seed");
            seed = static_cast<std::uint32_t>(v);
        }
    } catch (...) {
        err << "abut-cli labelings: --limit takes a whole number of at least 1, --seed one from 0 to 4294967295\n";
        return exitBadInput;
    }
    const ExtendedGraphLoad loaded = loadExtendedGraph(a.positional[0]);
    if (!loaded.ok) {
        err << loaded.error << "\n";
        return exitBadInput;
    }
    const ExtendedGraph& x = loaded.graph;
    const LabelingResult first = computeRegularEdgeLabeling(x);
    if (first.status != LabelingStatus::Ok || !checkRegularEdgeLabeling(x, first.labeling).ok) {
        err << a.positional[0] << ": internal error: no regular edge labeling found (" << first.message << ")\n";
        return exitInternal;
    }
    LabelingEnumerator e(x, first.labeling, seed);
    std::uint64_t n = 0;
    if (countOnly) {
        while (n < limit && e.next()) ++n;
        out << n << "\n";
        if (n == limit) err << "abut-cli labelings: stopped at the limit of " << limit << "; there may be more\n";
        return exitOk;
    }
    // One labeling per line inside a JSON document: red edges point from the
    // room below to the room above, blue ones from west to east.
    const PlaneGraph& g = x.graph;
    out << "{\"format\": \"abut.labelings\", \"version\": 1, \"labelings\": [\n";
    while (n < limit) {
        const RegularEdgeLabeling* l = e.next();
        if (!l) break;
        OrderedJson red = OrderedJson::array(), blue = OrderedJson::array();
        for (int v = 0; v < g.vertexCount(); ++v)
            for (std::size_t i = 0; i < g.neighbours(v).size(); ++i) {
                const std::string& from = x.names[v];
                const std::string& to = x.names[g.neighbours(v)[i]];
                if (l->at[v][i] == EdgeLabel::OutRed) red.push_back({from, to});
                if (l->at[v][i] == EdgeLabel::OutBlue) blue.push_back({from, to});
            }
        OrderedJson one = {{"red", red}, {"blue", blue}, {"oneSided", isOneSided(x, *l)}};
        out << (n ? ",\n  " : "  ") << one.dump();
        ++n;
    }
    out << "\n], \"count\": " << n << ", \"complete\": " << (e.next() ? "false" : "true") << "}\n";
    return exitOk;
}

} // namespace abut::cli
