// SPDX-License-Identifier: MIT
#include "cli_commands.h"

#include "augment/augment.h"
#include "io/atomic_file.h"
#include "plan/brief_check.h"
#include "io/extended_graph_io.h"
#include "io/project_io.h"

namespace abut::cli {

int runExtended(const std::vector<std::string>& args, std::ostream& out, std::ostream& err) {
    const ParsedArgs a = parseArgs(args, {"-o"}, {}, err, "extended PROJECT -o EXT.json");
    if (!a.ok) return exitBadInput;
    if (a.positional.size() != 1 || !a.values.count("-o")) {
        err << "usage: abut-cli extended PROJECT -o EXT.json\n";
        return exitBadInput;
    }
    const std::string& path = a.positional[0];
    const std::string& target = a.values.at("-o");
    if (!refuseToOverwriteInput(path, target, err)) return exitBadInput;
    LoadResult loaded;
    if (!loadOrReport(path, loaded, err)) return exitBadInput;
    // The same check as `check`, so the graph written agrees with what it reports.
    const AugmentResult r = checkBrief(loaded.brief).arrangement;
    if (r.status == AugmentStatus::Empty || r.status == AugmentStatus::Internal) {
        err << path << ": " << r.summary << "\n";
        return r.status == AugmentStatus::Empty ? exitBadInput : exitInternal;
    }
    const WriteResult w = writeFileAtomically(target, serializeExtendedGraph(r.extended));
    if (!w.ok) {
        err << w.message << "\n";
        return exitBadInput;
    }
    out << target << ": " << r.extended.roomCount << " rooms, " << r.extended.spareCount()
        << " spare spaces, " << r.extended.graph.edgeCount() << " contacts\n";
    return exitOk;
}

} // namespace abut::cli
