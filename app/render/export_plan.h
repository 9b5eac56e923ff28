// SPDX-License-Identifier: MIT
// Writing one plan variant to a file, the format chosen by the extension:
// .dxf (CAD), .pdf (sheet for the client), .svg, .png, .csv (area schedule).
// Shared by `abut-cli export` and the editor's Export action. Written beside
// the target and renamed over it, so a failure leaves any previous file.
#pragma once

#include "export/dxf_writer.h"
#include "sheet.h"

#include <QString>

namespace abut::render {

struct ExportOptions {
    SheetOptions sheet; // PDF
    DxfOptions dxf;     // DXF
};

// "dxf", "pdf", "svg", "png", "csv", or "" when the extension is none of these.
QString exportFormat(const QString& path);

// Needs a QGuiApplication for PDF and PNG. False with a one-line `error`.
bool exportVariant(const QString& target, const Brief& brief, const Plan& plan, const PlanVariant& v,
                   const ExportOptions& options, QString* error);

} // namespace abut::render
