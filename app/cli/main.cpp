// SPDX-License-Identifier: MIT
// abut-cli: the command-line front end for batch use and tests. The commands
// and exit codes follow the project's file-format contract.
#include "cli_commands.h"
#include "safe_text.h"

#include <algorithm>

#include <cstring>
#include <iostream>
#include <string>
#include <vector>

namespace {

void printUsage(std::ostream& out) {
    out << "usage: abut-cli COMMAND ...\n"
           "  check PROJECT [--json]     validate a brief and say whether a plan exists\n"
           "  plan PROJECT -o PLAN.json [--variants K] [--strict] [--seed S] [--time-limit SEC] [--threads N]\n"
           "                             compute ranked, sized variants and write them\n"
           "                             (within SEC seconds, default 60; on N threads, default all cores)\n"
           "  labelings EXT.json [--count] [--limit N] [--seed S]\n"
           "                             list or count the regular edge labelings of an extended graph\n"
           "  export PROJECT -o FILE [--variant K] [--sheet A4|A3|A1] [--walls T]\n"
           "                             write .dxf, .pdf, .svg, .png or .csv of variant K (1 = best)\n"
           "  extended PROJECT -o EXT.json  write the extended graph (rooms, poles, spare spaces)\n"
           "  --help                     this text\n"
           "exit codes: 0 done/feasible, 2 bad input, 3 no plan (infeasible), 4 internal error\n";
}

} // namespace

int main(int argc, char** argv) {
    std::vector<std::string> args(argv + 1, argv + argc);
    if (args.empty() || args[0] == "--help" || args[0] == "-h") {
        printUsage(args.empty() ? std::cerr : std::cout);
        return args.empty() ? abut::cli::exitBadInput : 0;
    }
    const std::string command = args[0];
    args.erase(args.begin());
    // Control characters from the input never reach the terminal as such.
    abut::cli::SafeTextBuf errBuf(std::cerr.rdbuf()), outBuf(std::cout.rdbuf());
    std::ostream err(&errBuf);
    const bool json = command == "labelings" || std::find(args.begin(), args.end(), "--json") != args.end();
    std::ostream safeOut(&outBuf);
    std::ostream& out = json ? std::cout : safeOut;
    int rc = -1;
    if (command == "check") rc = abut::cli::runCheck(args, out, err);
    else if (command == "plan") rc = abut::cli::runPlan(args, out, err);
    else if (command == "labelings") rc = abut::cli::runLabelings(args, out, err);
    else if (command == "export") rc = abut::cli::runExport(args, out, err);
    else if (command == "extended") rc = abut::cli::runExtended(args, out, err);
    if (rc >= 0) {
        out.flush();
        err.flush();
        return rc;
    }
    err << "abut-cli: unknown command \"" << command << "\"\n";
    err.flush();
    printUsage(std::cerr);
    return abut::cli::exitBadInput;
}
