// SPDX-License-Identifier: MIT
// Drawing a plan with QPainter: the PDF sheet for the client (ISO 216 page,
// standard scale, scale bar, north arrow, area schedule, title block, safety
// caution) and PNG images. Layout of our own design.
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <QImage>
#include <QByteArray>
#include <QString>

class QPagedPaintDevice;
class QPainter;
class QRectF;

namespace abut::render {

enum class SheetSize { A4, A3, A1 };

struct SheetOptions {
    SheetSize size = SheetSize::A3; // landscape
    QString project;                // title block: project name
    int variantRank = 1;
};

// The colour of the footprint outline on sheets and images; tests find the
// drawn outline by it to check the stated scale.
constexpr unsigned outlineRgb = 0x1F3A93;

// The largest standard scale denominator (1:20 … 1:2000) at which a plan of
// `widthMm` × `depthMm` (at 1:1) fits a box of `boxW` × `boxH` millimetres.
int chooseScale(double widthMm, double depthMm, double boxW, double boxH);

// The PDF sheet as bytes (written to disk by the atomic writer).
bool pdfSheet(QByteArray& bytes, const Brief& brief, const Plan& plan, const PlanVariant& v,
              const SheetOptions& options, QString* error);

// The same sheet on any paged device (a printer): its page size and
// orientation as set, at `dotsPerInch`. False when painting cannot start.
bool paintSheet(QPagedPaintDevice& device, int dotsPerInch, const Brief& brief, const Plan& plan,
                const PlanVariant& v, const SheetOptions& options);

// The plan alone, north up, `pixelsPerUnit` pixels per metre (or foot).
QImage planImage(const Brief& brief, const Footprint& footprint, const PlanVariant& v, double pixelsPerUnit);

// Draws the plan into `target` (device units), keeping proportions; returns
// the device units per plan unit used. Labels are at most 0.45 m high on the
// plan (feet plans alike); with `minTextPx` > 0 no label is smaller: a room
// too small for its name at that size gets its number in the schedule
// (brief order, from 1) instead.
double paintPlan(QPainter& p, const QRectF& target, const Brief& brief, const Footprint& footprint,
                 const PlanVariant& v, double fixedScale = 0, double minTextPx = 0);

} // namespace abut::render
