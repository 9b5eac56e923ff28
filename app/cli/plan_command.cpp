// SPDX-License-Identifier: MIT
#include "cli_commands.h"

#include "io/atomic_file.h"
#include "plan/relaxations.h"
#include "plan/unmet.h"
#include "io/plan_io.h"
#include "io/project_io.h"
#include "plan/plan_builder.h"

namespace abut::cli {

namespace {

bool parsePositive(const std::string& text, long long& value) {
    try {
        std::size_t used = 0;
        value = std::stoll(text, &used);
        return used == text.size() && value >= 0;
    } catch (...) {
        return false;
    }
}

} // namespace

int runPlan(const std::vector<std::string>& args, std::ostream& out, std::ostream& err) {
    const std::string usage =
        "plan PROJECT -o PLAN.json [--variants K] [--strict] [--seed S] [--time-limit SEC] [--threads N]";
    const ParsedArgs a =
        parseArgs(args, {"-o", "--variants", "--seed", "--time-limit", "--threads"}, {"--strict"}, err, usage);
    if (!a.ok) return exitBadInput;
    if (a.positional.size() != 1 || !a.values.count("-o")) {
        err << "usage: abut-cli " << usage << "\n";
        return exitBadInput;
    }
    PlanOptions options;
    options.timeLimit = defaultTimeLimit;
    long long number = 0;
    if (a.values.count("--variants")) {
        if (!parsePositive(a.values.at("--variants"), number) || number < 1 || number > 10000) {
            err << "abut-cli plan: --variants takes a whole number from 1 to 10000\n";
            return exitBadInput;
        }
        options.variants = static_cast<int>(number);
    }
    if (a.values.count("--seed")) {
        if (!parsePositive(a.values.at("--seed"), number) || number > 4294967295LL) {
            err << "abut-cli plan: --seed takes a whole number from 0 to 4294967295\n";
            return exitBadInput;
        }
        options.seed = static_cast<unsigned>(number);
    }
    if (a.values.count("--threads")) {
        if (!parsePositive(a.values.at("--threads"), number) || number < 1 || number > 256) {
            err << "abut-cli plan: --threads takes a whole number from 1 to 256\n";
            return exitBadInput;
        }
        options.threads = static_cast<int>(number);
    }
    if (a.values.count("--time-limit")) {
        const std::string& t = a.values.at("--time-limit");
        double seconds = 0;
        std::size_t used = 0;
        try {
            seconds = std::stod(t, &used);
        } catch (...) {
            used = 0;
        }
        if (used != t.size() || !(seconds > 0) || seconds > 86400) {
            err << "abut-cli plan: --time-limit takes a number of seconds above 0 and at most 86400\n";
            return exitBadInput;
        }
        options.timeLimit = seconds;
    }
    const std::string& path = a.positional[0];
    const std::string& target = a.values.at("-o");
    if (!refuseToOverwriteInput(path, target, err)) return exitBadInput;
    LoadResult loaded;
    if (!loadOrReport(path, loaded, err)) return exitBadInput;
    const Plan plan = buildPlan(loaded.brief, options);
    if (plan.status == PlanStatus::Internal) {
        err << path << ": " << plan.summary << "\n";
        return exitInternal;
    }
    if (plan.status == PlanStatus::NoPlan) {
        err << path << ": no plan: " << plan.summary << "\n";
        return exitNoPlan;
    }
    const bool strict = a.flags.count("--strict") > 0;
    if (strict && plan.status == PlanStatus::Compromised) {
        err << path << ": no plan keeps every 'must' adjacency and facade wish (--strict): " << plan.summary
            << "\n";
        printDiagnostics(err, plan.diagnostics, [](const Diagnostic& d) { return d.severity != Severity::Info; },
                         "abut-cli check --json lists them all");
        return exitNoPlan;
    }
    const WriteResult w = writeFileAtomically(target, serializePlan(loaded.brief, plan));
    if (!w.ok) {
        err << w.message << "\n";
        return exitBadInput;
    }
    out << target << ": " << plan.variants.size() << " variant(s); " << plan.summary << "\n";
    printDiagnostics(out, plan.diagnostics, [](const Diagnostic& d) { return d.severity != Severity::Info; },
                     "abut-cli check --json lists them all");
    // What the best variant does not meet, so the output never says less than the plan shows.
    const std::vector<UnmetItem> unmet = unmetRequirements(loaded.brief, plan.footprint, plan.variants.front());
    if (unmet.empty()) {
        out << "  The best variant meets every requirement of the brief.\n";
    } else {
        out << "  The best variant does not meet " << unmet.size() << " requirement(s):\n";
        const std::vector<Relaxation>& give = plan.variants.front().relaxations;
        for (std::size_t k = 0; k < unmet.size() && k < 20; ++k) {
            out << "    " << unmet[k].text << "\n";
            const std::vector<std::string> held = heldBy(unmet[k], give);
            for (std::size_t h = 0; h < held.size() && h < 4; ++h)
                out << "      " << (h == 0 ? "held there by " : "          and ") << held[h] << "\n";
        }
        if (unmet.size() > 20) out << "    and " << unmet.size() - 20 << " more (see \"unmet\" in the plan file)\n";
        if (!give.empty()) {
            out << "  What would meet them (one change each, checked by planning again):\n";
            for (const Relaxation& r : give) {
                out << "    " << r.text << "  \u2192 meets: " << r.meets.front();
                if (r.meets.size() > 1) out << " (and " << r.meets.size() - 1 << " more)";
                out << "\n";
            }
        }
    }
    return exitOk;
}

} // namespace abut::cli
