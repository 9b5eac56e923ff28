// SPDX-License-Identifier: MIT
#pragma once

#include <map>
#include <ostream>
#include <set>
#include <string>
#include <vector>

namespace abut {
struct LoadResult;
struct Diagnostic;
}

namespace abut::cli {

constexpr int exitOk = 0;
constexpr int exitBadInput = 2;
constexpr int exitNoPlan = 3;
constexpr int exitInternal = 4; // a result failed its own checker: a bug, never silent
// Seconds `plan` and `export` spend at most on a plan unless --time-limit
// says otherwise: the best plan found by then is written.
constexpr double defaultTimeLimit = 60;

struct ParsedArgs {
    bool ok = true;
    std::vector<std::string> positional;
    std::map<std::string, std::string> values; // options that take a value
    std::set<std::string> flags;               // options without one
};

// Options in `withValue` take the next argument; those in `flags` stand
// alone; anything else starting with '-' is an error naming the command.
ParsedArgs parseArgs(const std::vector<std::string>& args, const std::set<std::string>& withValue,
                     const std::set<std::string>& flags, std::ostream& err, const std::string& usage);

// Loads a project; on failure writes every error, one line each, and
// returns false.
bool loadOrReport(const std::string& path, LoadResult& out, std::ostream& err);

// False (with a message) when `target` is the same file as `input`.
bool refuseToOverwriteInput(const std::string& input, const std::string& target, std::ostream& err);

// Writes "  severity: message" per diagnostic that `show` accepts, at most
// `perCode` of each code, then one line saying how many more like them
// there are and `where` to find them all (a 200-room complete graph drops
// 19,000 adjacencies: a terminal needs the first few).
void printDiagnostics(std::ostream& out, const std::vector<Diagnostic>& diagnostics, bool (*show)(const Diagnostic&),
                      const std::string& where, int perCode = 20);

int runCheck(const std::vector<std::string>& args, std::ostream& out, std::ostream& err);
int runPlan(const std::vector<std::string>& args, std::ostream& out, std::ostream& err);
int runLabelings(const std::vector<std::string>& args, std::ostream& out, std::ostream& err);
int runExport(const std::vector<std::string>& args, std::ostream& out, std::ostream& err);
int runExtended(const std::vector<std::string>& args, std::ostream& out, std::ostream& err);

} // namespace abut::cli
