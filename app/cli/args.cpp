// SPDX-License-Identifier: MIT
#include "cli_commands.h"

#include "diagnostics.h"

#include "io/project_io.h"

#include <filesystem>

namespace abut::cli {

ParsedArgs parseArgs(const std::vector<std::string>& args, const std::set<std::string>& withValue,
                     const std::set<std::string>& flags, std::ostream& err, const std::string& usage) {
    ParsedArgs p;
    for (std::size_t i = 0; i < args.size(); ++i) {
        const std::string& a = args[i];
        if (withValue.count(a)) {
            if (i + 1 >= args.size()) {
                err << "abut-cli: option " << a << " needs a value\nusage: abut-cli " << usage << "\n";
                p.ok = false;
                return p;
            }
            if (args[i + 1].empty()) { // `-o ""` printed only ": ; nothing written"
                err << "abut-cli: option " << a << " needs a value, not an empty one\nusage: abut-cli " << usage << "\n";
                p.ok = false;
                return p;
            }
            p.values[a] = args[++i];
        } else if (flags.count(a)) {
            p.flags.insert(a);
        } else if (a.size() > 1 && a[0] == '-') {
            err << "abut-cli: unknown option \"" << a << "\"\nusage: abut-cli " << usage << "\n";
            p.ok = false;
            return p;
        } else {
            p.positional.push_back(a);
        }
    }
    return p;
}

bool loadOrReport(const std::string& path, LoadResult& out, std::ostream& err) {
    out = loadProject(path);
    for (const FileError& e : out.errors) err << e.toString() << "\n";
    return out.ok();
}

bool refuseToOverwriteInput(const std::string& input, const std::string& target, std::ostream& err) {
    std::error_code ec;
    if (std::filesystem::exists(target, ec) && std::filesystem::equivalent(input, target, ec)) {
        err << target << ": refusing to overwrite the input file; choose another output\n";
        return false;
    }
    return true;
}

void printDiagnostics(std::ostream& out, const std::vector<Diagnostic>& diagnostics, bool (*show)(const Diagnostic&),
                      const std::string& where, int perCode) {
    std::map<DiagnosticCode, int> shown, more;
    for (const Diagnostic& d : diagnostics) {
        if (!show(d)) continue;
        if (shown[d.code] < perCode) {
            ++shown[d.code];
            out << "  " << toString(d.severity) << ": " << d.message << "\n";
        } else {
            ++more[d.code];
        }
    }
    for (const auto& [code, count] : more)
        out << "  … and " << count << " more like the " << perCode << " above (" << toString(code) << "; " << where
            << ").\n";
}

} // namespace abut::cli
