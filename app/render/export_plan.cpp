// SPDX-License-Identifier: MIT
#include "export_plan.h"

#include "export/schedule.h"
#include "export/svg_writer.h"
#include "io/atomic_file.h"

#include <QBuffer>
#include <QFile>
#include <QFileInfo>

#include <algorithm>
#include <cstdio>

namespace abut::render {

QString exportFormat(const QString& path) {
    const QString ext = QFileInfo(path).suffix().toLower();
    for (const char* known : {"dxf", "pdf", "svg", "png", "csv"})
        if (ext == QLatin1String(known)) return ext;
    return {};
}

bool exportVariant(const QString& target, const Brief& brief, const Plan& plan, const PlanVariant& v,
                   const ExportOptions& options, QString* error) {
    const QString format = exportFormat(target);
    auto fail = [&](const QString& why) {
        if (error) *error = why;
        return false;
    };
    if (format.isEmpty())
        return fail(target + QStringLiteral(": unknown format; use .dxf, .pdf, .svg, .png or .csv"));
    std::string text;
    if (format == QLatin1String("dxf")) text = planDxf(brief, plan.footprint, v, options.dxf);
    else if (format == QLatin1String("svg")) text = planSvg(brief, plan.footprint, v);
    else if (format == QLatin1String("csv")) text = scheduleCsv(areaSchedule(brief, plan.footprint, v));
    if (!text.empty()) {
        const WriteResult w = writeFileAtomically(target.toStdString(), text);
        return w.ok || fail(QString::fromStdString(w.message));
    }
    // PDF and PNG are drawn in memory and written by the same atomic writer.
    QByteArray bytes;
    if (format == QLatin1String("pdf")) {
        QString why;
        if (!pdfSheet(bytes, brief, plan, v, options.sheet, &why)) return fail(target + QStringLiteral(": ") + why);
    } else {
        // About 1600 pixels along the longer side, at most 200 per unit: a 10 km
        // footprint still gives an image of plausible size.
        const double ppu = std::min(200.0, 1600.0 / std::max(plan.footprint.width, plan.footprint.depth));
        QBuffer buffer(&bytes);
        buffer.open(QIODevice::WriteOnly);
        if (!planImage(brief, plan.footprint, v, ppu).save(&buffer, "PNG"))
            return fail(target + QStringLiteral(": cannot draw the image"));
    }
    const WriteResult w = writeFileAtomically(target.toStdString(), bytes.toStdString());
    return w.ok || fail(QString::fromStdString(w.message));
}

} // namespace abut::render
