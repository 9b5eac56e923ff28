// SPDX-License-Identifier: MIT
#include "cli_commands.h"

#include "export/dxf_writer.h"
#include "export/schedule.h"
#include "export/svg_writer.h"
#include "io/atomic_file.h"
#include "io/project_io.h"
#include "plan/plan_builder.h"
#include "export_plan.h"
#include "sheet.h"

#include <QFileInfo>
#include <QGuiApplication>
#include <cstdio>

#include <algorithm>
#include <memory>

namespace abut::cli {

namespace {

std::string extensionOf(const std::string& path) {
    const auto dot = path.find_last_of('.');
    if (dot == std::string::npos) return {};
    std::string ext = path.substr(dot + 1);
    std::transform(ext.begin(), ext.end(), ext.begin(), [](unsigned char c) { return std::tolower(c); });
    return ext;
}

// Painting text needs a GUI application; without a display, draw offscreen.
void ensureGuiApplication() {
    if (QGuiApplication::instance()) return;
    if (qEnvironmentVariableIsEmpty("QT_QPA_PLATFORM")) qputenv("QT_QPA_PLATFORM", "offscreen");
    static int argc = 1;
    static char name[] = "abut-cli";
    static char* argv[] = {name, nullptr};
    static std::unique_ptr<QGuiApplication> app = std::make_unique<QGuiApplication>(argc, argv);
}

} // namespace

int runExport(const std::vector<std::string>& args, std::ostream& out, std::ostream& err) {
    const std::string usage = "export PROJECT -o FILE.{dxf,pdf,svg,png,csv} [--variant K] [--sheet A4|A3|A1] [--walls T]";
    const ParsedArgs a = parseArgs(args, {"-o", "--variant", "--sheet", "--walls"}, {}, err, usage);
    if (!a.ok) return exitBadInput;
    if (a.positional.size() != 1 || !a.values.count("-o")) {
        err << "usage: abut-cli " << usage << "\n";
        return exitBadInput;
    }
    const std::string& path = a.positional[0];
    const std::string& target = a.values.at("-o");
    const std::string ext = extensionOf(target);
    if (ext != "dxf" && ext != "pdf" && ext != "svg" && ext != "png" && ext != "csv") {
        err << target << ": unknown format \"." << ext << "\"; use .dxf, .pdf, .svg, .png or .csv\n";
        return exitBadInput;
    }
    int variant = 1;
    if (a.values.count("--variant")) {
        try {
            std::size_t used = 0;
            variant = std::stoi(a.values.at("--variant"), &used);
            if (used != a.values.at("--variant").size() || variant < 1) throw std::invalid_argument("variant");
        } catch (...) {
            err << "abut-cli export: --variant takes a whole number of at least 1\n";
            return exitBadInput;
        }
    }
    render::SheetOptions sheet;
    if (a.values.count("--sheet")) {
        const std::string s = a.values.at("--sheet");
        if (s == "A4" || s == "a4") sheet.size = render::SheetSize::A4;
        else if (s == "A3" || s == "a3") sheet.size = render::SheetSize::A3;
        else if (s == "A1" || s == "a1") sheet.size = render::SheetSize::A1;
        else {
            err << "abut-cli export: --sheet takes A4, A3 or A1\n";
            return exitBadInput;
        }
    }
    DxfOptions dxf;
    if (a.values.count("--walls")) {
        try {
            dxf.wallThickness = std::stod(a.values.at("--walls"));
            if (!(dxf.wallThickness >= 0 && dxf.wallThickness < 2)) throw std::invalid_argument("walls");
        } catch (...) {
            err << "abut-cli export: --walls takes a wall thickness from 0 to 2 (plan units)\n";
            return exitBadInput;
        }
    }
    if (!refuseToOverwriteInput(path, target, err)) return exitBadInput;
    LoadResult loaded;
    if (!loadOrReport(path, loaded, err)) return exitBadInput;
    const Brief& brief = loaded.brief;
    PlanOptions options;
    options.timeLimit = defaultTimeLimit;
    options.variants = std::max(options.variants, variant);
    const Plan plan = buildPlan(brief, options);
    if (plan.status == PlanStatus::Internal) {
        err << path << ": " << plan.summary << "\n";
        return exitInternal;
    }
    if (plan.variants.empty()) {
        err << path << ": no plan: " << plan.summary << "\n";
        return exitNoPlan;
    }
    if (variant > static_cast<int>(plan.variants.size())) {
        err << path << ": --variant " << variant << ": the brief has only " << plan.variants.size() << " variant(s)\n";
        return exitBadInput;
    }
    const PlanVariant& v = plan.variants[variant - 1];
    if (ext == "pdf" || ext == "png") ensureGuiApplication();
    render::ExportOptions eo;
    eo.sheet = sheet;
    eo.sheet.project = QFileInfo(QString::fromStdString(path)).completeBaseName().section('.', 0, 0);
    eo.sheet.variantRank = variant;
    eo.dxf = dxf;
    QString error;
    if (!render::exportVariant(QString::fromStdString(target), brief, plan, v, eo, &error)) {
        err << error.toStdString() << "\n";
        return exitBadInput;
    }
    out << target << ": variant " << variant << " of " << plan.variants.size() << "\n";
    return exitOk;
}

} // namespace abut::cli
