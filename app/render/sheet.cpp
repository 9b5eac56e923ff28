// SPDX-License-Identifier: MIT
#include "sheet.h"

#include "caution.h"
#include "export/schedule.h"
#include "plan/unmet.h"

#include <QBuffer>
#include <QDate>
#include <QFileInfo>
#include <QPageSize>
#include <QPainter>
#include <QPdfWriter>

#include <cmath>

namespace abut::render {

namespace {

double mmPerUnit(const std::string& units) { return units == "ft" ? 304.8 : 1000.0; }

QString areaText(double a, const std::string& units) {
    return QString::number(a, 'f', 1) + QStringLiteral(" ") + QString::fromStdString(areaUnit(units));
}

// Font of `sizeMm` height on a device with `dpmm` dots per millimetre.
// Text for the sheet: no typographic ligatures, so that "Office" stays
// searchable as typed in the PDF.
QFont plainFont() {
    QFont f(QStringLiteral("DejaVu Sans"));
    f.setStyleStrategy(QFont::PreferNoShaping);
    return f;
}

QFont fontMm(double sizeMm, double dpmm, bool bold = false) {
    QFont f = plainFont();
    f.setPixelSize(std::max(1, static_cast<int>(std::lround(sizeMm * dpmm))));
    f.setBold(bold);
    return f;
}

} // namespace

int chooseScale(double widthMm, double depthMm, double boxW, double boxH) {
    // ISO 5455 scales plus 1:250, common practice for building plans (no source).
    for (int denom : {20, 50, 100, 200, 250, 500, 1000, 2000})
        if (widthMm / denom <= boxW && depthMm / denom <= boxH) return denom;
    return 5000;
}

double paintPlan(QPainter& p, const QRectF& target, const Brief& brief, const Footprint& fp, const PlanVariant& v,
                 double fixedScale, double minTextPx) {
    const double s = fixedScale > 0 ? fixedScale : std::min(target.width() / fp.width, target.height() / fp.depth);
    const QPointF origin(target.left() + (target.width() - fp.width * s) / 2,
                         target.top() + (target.height() - fp.depth * s) / 2);
    auto toDevice = [&](const Rect& r) {
        return QRectF(origin.x() + r.x0 * s, origin.y() + (fp.depth - r.y1) * s, r.width() * s, r.depth() * s);
    };
    p.save();
    p.setRenderHint(QPainter::Antialiasing);
    const double line = std::max(1.0, s * 0.02);
    for (const Rect& r : v.spaces) {
        p.setPen(QPen(QColor(0x77, 0x77, 0x77), line * 0.6, Qt::DashLine));
        p.setBrush(QBrush(QColor(0xCC, 0xCC, 0xCC), Qt::BDiagPattern));
        p.drawRect(toDevice(r));
    }
    // The rooms of the brief (a plan of the planned brief also holds its
    // cut-outs, after the rooms: drawn as not building, hatched).
    const std::size_t rooms = std::min(v.rooms.size(), brief.rooms.size());
    for (const Placement& c : fp.cutouts) {
        p.setPen(Qt::NoPen);
        p.setBrush(QBrush(QColor(0x99, 0x99, 0x99), Qt::FDiagPattern));
        p.drawRect(toDevice(Rect{c.x, c.y, c.x + c.width, c.y + c.depth}));
    }
    p.setPen(QPen(QColor(0x22, 0x22, 0x22), line));
    p.setBrush(QColor(0xFA, 0xF7, 0xF0));
    for (std::size_t i = 0; i < rooms; ++i)
        if (!brief.rooms[i].cutout) p.drawRect(toDevice(v.rooms[i]));
    // A room fixed in place: a second line inside its walls (shape, not colour).
    p.setBrush(Qt::NoBrush);
    p.setPen(QPen(QColor(0x22, 0x22, 0x22), line * 0.8, Qt::DashDotLine));
    for (std::size_t i = 0; i < rooms; ++i)
        if (brief.rooms[i].fixed && !brief.rooms[i].cutout)
            p.drawRect(toDevice(v.rooms[i]).adjusted(line * 3, line * 3, -line * 3, -line * 3));
    p.setPen(QPen(QColor::fromRgb(outlineRgb), line * 2.5));
    for (const OutlineLoop& loop : footprintOutline(fp)) {
        QPolygonF poly;
        for (const auto& [x, y] : loop) poly << QPointF(origin.x() + x * s, origin.y() + (fp.depth - y) * s);
        p.drawPolygon(poly);
    }
    // Labels: name over area, sized to the room.
    p.setPen(QColor(0x11, 0x11, 0x11));
    const double metre = 1000.0 / mmPerUnit(brief.units); // plan units per metre
    for (std::size_t i = 0; i < rooms; ++i) {
        if (brief.rooms[i].cutout) continue;
        const QRectF box = toDevice(v.rooms[i]).adjusted(line * 2, line * 2, -line * 2, -line * 2);
        QString name = QString::fromStdString(brief.rooms[i].displayName());
        double px = std::max(minTextPx, std::min(box.height() / 3.2, 0.45 * metre * s));
        QFont f = plainFont();
        f.setPixelSize(std::max(1, static_cast<int>(px)));
        QFontMetricsF fm(f);
        while (px > std::max(2.0, minTextPx) && fm.horizontalAdvance(name) > box.width()) {
            px = std::max(px * 0.9, minTextPx);
            f.setPixelSize(std::max(1, static_cast<int>(px)));
            fm = QFontMetricsF(f);
        }
        if (minTextPx > 0 && (fm.horizontalAdvance(name) > box.width() || 2.2 * fm.height() > box.height())) {
            // Too small for its name at the smallest legible size: its number.
            px = minTextPx;
            f.setPixelSize(std::max(1, static_cast<int>(std::ceil(px))));
            p.setFont(f);
            p.drawText(toDevice(v.rooms[i]), Qt::AlignCenter, QString::number(i + 1));
            continue;
        }
        p.setFont(f);
        QRectF top = box, bottom = box;
        top.setBottom(box.center().y());
        bottom.setTop(box.center().y());
        p.drawText(top, Qt::AlignHCenter | Qt::AlignBottom, name);
        f.setPixelSize(std::max(1, static_cast<int>(std::max(px * 0.85, minTextPx))));
        p.setFont(f);
        p.drawText(bottom, Qt::AlignHCenter | Qt::AlignTop, areaText(v.rooms[i].area(), brief.units));
    }
    p.restore();
    return s;
}

QImage planImage(const Brief& brief, const Footprint& fp, const PlanVariant& v, double ppu) {
    const int margin = 20;
    QImage img(static_cast<int>(std::ceil(fp.width * ppu)) + 2 * margin,
               static_cast<int>(std::ceil(fp.depth * ppu)) + 2 * margin, QImage::Format_ARGB32);
    img.fill(Qt::white);
    QPainter p(&img);
    paintPlan(p, QRectF(margin, margin, fp.width * ppu, fp.depth * ppu), brief, fp, v, ppu);
    return img;
}

bool pdfSheet(QByteArray& bytes, const Brief& brief, const Plan& plan, const PlanVariant& v, const SheetOptions& o,
              QString* error) {
    QBuffer buffer(&bytes);
    buffer.open(QIODevice::WriteOnly);
    QPdfWriter pdf(&buffer);
    const QPageSize::PageSizeId id = o.size == SheetSize::A4   ? QPageSize::A4
                                     : o.size == SheetSize::A1 ? QPageSize::A1
                                                               : QPageSize::A3;
    pdf.setPageSize(QPageSize(id));
    pdf.setPageOrientation(QPageLayout::Landscape);
    pdf.setPageMargins(QMarginsF(0, 0, 0, 0), QPageLayout::Millimeter);
    pdf.setResolution(600);
    pdf.setTitle(o.project + QStringLiteral(" — plan"));
    pdf.setCreator(QStringLiteral("Abut"));
    if (!paintSheet(pdf, 600, brief, plan, v, o)) {
        if (error) *error = QStringLiteral("cannot draw the PDF sheet");
        return false;
    }
    return true;
}

bool paintSheet(QPagedPaintDevice& device, int dotsPerInch, const Brief& brief, const Plan& plan,
                const PlanVariant& v, const SheetOptions& o) {
    QPainter p;
    if (!p.begin(&device)) return false;
    const double dpmm = dotsPerInch / 25.4;
    const QSizeF pageMm = device.pageLayout().fullRect(QPageLayout::Millimeter).size();
    auto mm = [&](double x, double y, double w, double h) { return QRectF(x * dpmm, y * dpmm, w * dpmm, h * dpmm); };
    const double W = pageMm.width(), H = pageMm.height();
    const double margin = 10, side = std::max(100.0, W * 0.3);
    // Frame.
    p.setPen(QPen(Qt::black, 0.5 * dpmm));
    p.drawRect(mm(margin, margin, W - 2 * margin, H - 2 * margin));
    const double planW = W - 3 * margin - side, planH = H - 2 * margin - 30;
    p.drawLine(QPointF((W - margin - side - margin / 2) * dpmm, margin * dpmm),
               QPointF((W - margin - side - margin / 2) * dpmm, (H - margin) * dpmm));

    // Plan to a standard scale.
    const Footprint& fp = plan.footprint;
    const double unitMm = mmPerUnit(brief.units);
    const int denom = chooseScale(fp.width * unitMm, fp.depth * unitMm, planW - 10, planH - 10);
    const double s = unitMm / denom * dpmm; // device units per plan unit
    // No label under 2 mm printed height; smaller rooms show their schedule number.
    paintPlan(p, mm(margin + 5, margin + 5, planW - 10, planH - 10), brief, fp, v, s, 2.0 * dpmm);

    // Scale bar and north arrow under the plan.
    const double barY = H - margin - 14;
    double barUnits = 1;
    for (double step : {1.0, 2.0, 5.0, 10.0, 20.0, 50.0, 100.0, 200.0})
        if (step * unitMm / denom <= 60) barUnits = step;
    const double seg = barUnits * unitMm / denom / 5;
    for (int k = 0; k < 5; ++k) {
        p.setBrush(k % 2 ? Qt::white : Qt::black);
        p.setPen(QPen(Qt::black, 0.25 * dpmm));
        p.drawRect(mm(margin + 8 + k * seg, barY, seg, 2));
    }
    p.setFont(fontMm(3, dpmm));
    p.drawText(mm(margin + 8 - 5, barY + 2.5, 10, 5), Qt::AlignCenter, QStringLiteral("0"));
    p.drawText(mm(margin + 8 + 5 * seg - 10, barY + 2.5, 20, 5), Qt::AlignCenter,
               QString::number(barUnits) + QStringLiteral(" ") + QString::fromStdString(brief.units));
    p.setFont(fontMm(3.5, dpmm, true));
    p.drawText(mm(margin + 8 + 5 * seg + 8, barY - 1.5, 60, 6), Qt::AlignLeft | Qt::AlignVCenter,
               QStringLiteral("Scale 1:%1 at %2").arg(denom).arg(o.size == SheetSize::A4 ? "A4" : o.size == SheetSize::A1 ? "A1" : "A3"));
    const double nx = margin + planW - 12, ny = H - margin - 22;
    QPolygonF arrow;
    arrow << QPointF(nx * dpmm, ny * dpmm) << QPointF((nx - 3.5) * dpmm, (ny + 10) * dpmm)
          << QPointF(nx * dpmm, (ny + 7.5) * dpmm) << QPointF((nx + 3.5) * dpmm, (ny + 10) * dpmm);
    p.setBrush(Qt::black);
    p.drawPolygon(arrow);
    p.setFont(fontMm(4, dpmm, true));
    p.drawText(mm(nx - 5, ny - 7, 10, 6), Qt::AlignCenter, QStringLiteral("N"));

    // Area schedule.
    const AreaSchedule sched = areaSchedule(brief, fp, v);
    const double x0 = W - margin - side, colW = side - 6;
    double y = margin + 6;
    p.setFont(fontMm(4.5, dpmm, true));
    p.drawText(mm(x0 + 3, y, colW, 7), Qt::AlignLeft | Qt::AlignVCenter, QStringLiteral("Area schedule"));
    y += 9;
    // What the variant does not meet, listed under the schedule (at most
    // eight lines; the plan file has them all).
    const std::vector<UnmetItem> unmet = unmetRequirements(brief, fp, v);
    const int unmetShown = std::min<int>(static_cast<int>(unmet.size()), unmet.size() > 8 ? 7 : 8);
    const int unmetLines = 2 + unmetShown + (static_cast<int>(unmet.size()) > unmetShown ? 1 : 0);
    const int rows = static_cast<int>(sched.rows.size()) + 4 + unmetLines;
    const double titleH = 42, cautionH = 24;
    const double rowH = std::min(5.0, (H - margin - titleH - cautionH - y - 6) / rows);
    const double text = rowH * 0.62;
    const double cols[5] = {0.0, 0.30, 0.46, 0.62, 0.75};
    const char* heads[5] = {"Room", "Target", "Actual", "Dev.", "W × D"};
    auto row = [&](const QStringList& cells, bool bold) {
        for (int c = 0; c < 5; ++c) {
            const double cx = x0 + 3 + cols[c] * colW;
            const double cw = (c < 4 ? cols[c + 1] * colW : colW) - cols[c] * colW - 1;
            // A name that does not fit is set smaller (down to 2 mm) before it
            // is cut short: the schedule is where a numbered room is named.
            double size = text;
            p.setFont(fontMm(size, dpmm, bold));
            while (size > 2.0 && QFontMetricsF(p.font()).horizontalAdvance(cells.value(c)) > cw * dpmm) {
                size = std::max(2.0, size - 0.1);
                p.setFont(fontMm(size, dpmm, bold));
            }
            p.drawText(mm(cx, y, cw, rowH), (c == 0 ? Qt::AlignLeft : Qt::AlignRight) | Qt::AlignVCenter,
                       QFontMetricsF(p.font()).elidedText(cells.value(c), Qt::ElideRight, cw * dpmm));
        }
        y += rowH;
    };
    const QString u2 = QString::fromStdString(areaUnit(brief.units));
    row({heads[0], QString(heads[1]) + " " + u2, QString(heads[2]) + " " + u2, QString(heads[3]) + " %",
         QString::fromUtf8(heads[4]) + " " + QString::fromStdString(brief.units)},
        true);
    p.setPen(QPen(Qt::black, 0.2 * dpmm));
    p.drawLine(QPointF((x0 + 3) * dpmm, y * dpmm), QPointF((x0 + 3 + colW) * dpmm, y * dpmm));
    int number = 0;
    for (const ScheduleRow& r : sched.rows)
        row({QString::number(++number) + QStringLiteral("  ") + QString::fromStdString(r.name),
             QString::number(r.target, 'f', 1), QString::number(r.achieved, 'f', 1),
             QString::number(100 * r.deviation, 'f', 1),
             QString::number(r.width, 'f', 2) + QString::fromUtf8(" × ") + QString::number(r.depth, 'f', 2)},
            false);
    p.drawLine(QPointF((x0 + 3) * dpmm, y * dpmm), QPointF((x0 + 3 + colW) * dpmm, y * dpmm));
    row({QStringLiteral("Total rooms"), QString::number(sched.totalTarget, 'f', 1),
         QString::number(sched.totalAchieved, 'f', 1),
         QString::number(sched.totalTarget > 0 ? 100 * (sched.totalAchieved - sched.totalTarget) / sched.totalTarget : 0, 'f', 1),
         QString()},
        true);
    row({QStringLiteral("Spare spaces"), QString(), QString::number(sched.spareArea, 'f', 1), QString(), QString()}, false);
    row({QStringLiteral("Footprint"), QString(), QString::number(sched.footprintArea, 'f', 1), QString(),
         QString::number(fp.width, 'f', 2) + QString::fromUtf8(" × ") + QString::number(fp.depth, 'f', 2) +
             (fp.cutouts.empty() ? QString() : QStringLiteral(" less cut-outs"))},
        true);

    y += rowH * 0.5;
    p.setFont(fontMm(text, dpmm, true));
    p.drawText(mm(x0 + 3, y, colW, rowH), Qt::AlignLeft | Qt::AlignVCenter,
               unmet.empty() ? QStringLiteral("Every requirement of the brief is met.") : QStringLiteral("Not met:"));
    y += rowH;
    p.setFont(fontMm(text, dpmm));
    for (int k = 0; k < unmetShown; ++k) {
        p.drawText(mm(x0 + 3, y, colW, rowH), Qt::AlignLeft | Qt::AlignVCenter,
                   QFontMetricsF(p.font()).elidedText(QStringLiteral("\u2013 ") + QString::fromStdString(unmet[k].text),
                                                      Qt::ElideRight, colW * dpmm));
        y += rowH;
    }
    if (static_cast<int>(unmet.size()) > unmetShown) {
        p.drawText(mm(x0 + 3, y, colW, rowH), Qt::AlignLeft | Qt::AlignVCenter,
                   QStringLiteral("and %1 more (see the plan file)").arg(unmet.size() - unmetShown));
        y += rowH;
    }

    // Caution and title block at the foot of the side column.
    const double cy = H - margin - titleH - cautionH;
    p.setFont(fontMm(2.6, dpmm));
    p.drawText(mm(x0 + 3, cy, colW, cautionH - 2), Qt::TextWordWrap | Qt::AlignLeft | Qt::AlignBottom,
               QStringLiteral("Caution: ") + QString::fromUtf8(safetyCaution));
    const double ty = H - margin - titleH;
    p.drawLine(QPointF(x0 * dpmm, ty * dpmm), QPointF((W - margin) * dpmm, ty * dpmm));
    p.setFont(fontMm(5.5, dpmm, true));
    p.drawText(mm(x0 + 3, ty + 3, colW, 9), Qt::AlignLeft | Qt::AlignVCenter, o.project);
    p.setFont(fontMm(3.2, dpmm));
    const QStringList lines{QStringLiteral("Variant %1 of %2").arg(o.variantRank).arg(plan.variants.size()),
                            QStringLiteral("Date %1").arg(QDate::currentDate().toString(Qt::ISODate)),
                            QStringLiteral("Units: %1, areas in %2").arg(brief.units == "ft" ? "feet" : "metres", u2),
                            QStringLiteral("Drawn with Abut — schematic plan")};
    for (int k = 0; k < lines.size(); ++k)
        p.drawText(mm(x0 + 3, ty + 13 + 6 * k, colW, 6), Qt::AlignLeft | Qt::AlignVCenter, lines[k]);
    return p.end();
}

} // namespace abut::render
