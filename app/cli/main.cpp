// SPDX-License-Identifier: MIT
// abut-cli: the command-line front end for batch use and tests. The commands
// and exit codes follow the project's file-format contract.
#include "cli_commands.h"

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
    if (command == "check") return abut::cli::runCheck(args, std::cout, std::cerr);
    if (command == "plan") return abut::cli::runPlan(args, std::cout, std::cerr);
    if (command == "labelings") return abut::cli::runLabelings(args, std::cout, std::cerr);
    if (command == "export") return abut::cli::runExport(args, std::cout, std::cerr);
    if (command == "extended") return abut::cli::runExtended(args, std::cout, std::cerr);
    std::cerr << "abut-cli: unknown command \"" << command << "\"\n";
    printUsage(std::cerr);
    return abut::cli::exitBadInput;
}
