// SPDX-License-Identifier: MIT
// The plan view's drawing: rooms with their numbers and tags, spare
// spaces, the footprint, dropped adjacencies, the range of a dragged wall.
#include "plan_view.h"

#include "palette.h"
#include "plan_session.h"
#include "plan/plan_builder.h"
#include "plan/relaxations.h"
#include "plan/unmet.h"

#include <QContextMenuEvent>
#include <QHelpEvent>
#include <QMenu>
#include <QMouseEvent>
#include <QPainter>
#include <QToolTip>

#include <algorithm>
#include <cmath>

namespace abut::gui {

namespace {

const QColor ink(0x22, 0x22, 0x22);
const QColor highlightInk(0x1F, 0x5F, 0xBF);

QString deviationText(double deviation) {
    if (std::abs(deviation) < 0.005) return QObject::tr("on target");
    // Arrow and sign both say which way: no colour needed.
    return (deviation < 0 ? QStringLiteral("\u25BC ") : QStringLiteral("\u25B2 ")) +
           QObject::tr("%1%2 %").arg(deviation < 0 ? QStringLiteral("\u2212") : QStringLiteral("+"))
               .arg(std::abs(100.0 * deviation), 0, 'f', std::abs(deviation) < 0.1 ? 1 : 0);
}

// Largest pixel size ≤ `px` at which every line fits `width`.
double fitFont(QFont& f, const QStringList& lines, double width, double px) {
    while (px > 5) {
        f.setPixelSize(int(px));
        const QFontMetricsF fm(f);
        bool fits = true;
        for (const QString& l : lines) fits = fits && fm.horizontalAdvance(l) <= width;
        if (fits) break;
        px *= 0.9;
    }
    f.setPixelSize(std::max(5, int(px)));
    return px;
}

} // namespace

void PlanView::paintEvent(QPaintEvent*) {
    QPainter p(this);
    p.setRenderHint(QPainter::Antialiasing);
    if (!has_) {
        p.setPen(QColor(0x55, 0x55, 0x55));
        p.drawText(rect().adjusted(20, 20, -20, -20), Qt::AlignCenter | Qt::TextWordWrap, message_);
        return;
    }
    paintTitle(p);
    paintSparesAndCutouts(p);
    for (std::size_t i = 0; i < v_.rooms.size() && i < brief_.rooms.size(); ++i) paintRoom(p, i);
    paintOutlineAndDrawnCutout(p);
    paintDropped(p);
    paintWallRange(p);
}

void PlanView::paintTitle(QPainter& p) const {
    const QString u = QString::fromStdString(brief_.units);
    QFont title = font();
    title.setBold(true);
    p.setFont(title);
    p.setPen(ink);
    p.drawText(QRectF(24, 6, width() - 48, 24), Qt::AlignLeft | Qt::AlignVCenter,
               tr("Variant %1 — %2 × %3 %4 — worst area deviation %5 %")
                   .arg(v_.rank)
                   .arg(fp_.width, 0, 'f', 2)
                   .arg(fp_.depth, 0, 'f', 2)
                   .arg(u)
                   .arg(100.0 * v_.metrics.worstAreaError, 0, 'f', 1));
}

void PlanView::paintSparesAndCutouts(QPainter& p) const {
    for (const Rect& r : v_.spaces) {
        p.setPen(QPen(QColor(0x77, 0x77, 0x77), 1, Qt::DashLine));
        p.setBrush(QBrush(QColor(0xAA, 0xAA, 0xAA), Qt::BDiagPattern));
        const QRectF box = toScreen(r);
        p.drawRect(box);
        if (box.width() > 40 && box.height() > 14) {
            p.setPen(QColor(0x55, 0x55, 0x55));
            p.drawText(box, Qt::AlignCenter, tr("spare"));
        }
    }
    // Cut-outs: not building, hatched and named.
    for (std::size_t k = 0; k < fp_.cutouts.size(); ++k) {
        const Placement& c = fp_.cutouts[k];
        const QRectF box = toScreen(Rect{c.x, c.y, c.x + c.width, c.y + c.depth});
        p.setPen(Qt::NoPen);
        p.setBrush(QBrush(QColor(0x88, 0x88, 0x88), Qt::FDiagPattern));
        p.drawRect(box);
        if (box.width() > 60 && box.height() > 16) {
            p.setPen(QColor(0x44, 0x44, 0x44));
            p.drawText(box, Qt::AlignCenter, tr("cut-out %1 (not building)").arg(k + 1));
        }
    }
}

void PlanView::paintRoom(QPainter& p, std::size_t i) const {
    const Room& room = brief_.rooms[i];
    const QRectF box = toScreen(v_.rooms[i]);
    QColor fill = categoryColor(QString::fromStdString(room.category)).lighter(115);
    p.setPen(QPen(ink, 1.2));
    p.setBrush(fill);
    p.drawRect(box);
    const QString id = QString::fromStdString(room.id);
    if (id == hovered_ || id == highlighted_) {
        p.setPen(QPen(highlightInk, 3.5));
        p.setBrush(Qt::NoBrush);
        p.drawRect(box.adjusted(2, 2, -2, -2));
    }
    paintRoomMarks(p, i, box, paintRoomLabel(p, i, box));
}

// Name, area against target and deviation, set across the room or up it.
PlanView::Label PlanView::paintRoomLabel(QPainter& p, std::size_t i, const QRectF& box) const {
    const Room& room = brief_.rooms[i];
    const QString u2 = QString::fromStdString(brief_.units) + QChar(0x00B2);
    const double area = v_.rooms[i].area();
    const double dev = (area - room.area) / room.area;
    const QStringList lines{QString::fromStdString(room.displayName()),
                            tr("%1 of %2 %3").arg(area, 0, 'f', 1).arg(room.area, 0, 'f', 1).arg(u2),
                            deviationText(dev)};
    // Narrow tall rooms get their label turned to run up the room, when
    // that gives the larger text.
    const QRectF inner = box.adjusted(4, 3, -4, -3);
    QFont across = font(), up = font();
    const double pxAcross = fitFont(across, lines, inner.width(), std::min(15.0, inner.height() / 3.6));
    const double pxUp = fitFont(up, lines, inner.height(), std::min(15.0, inner.width() / 3.6));
    const bool turn = pxUp > pxAcross * 1.2 && inner.height() > inner.width();
    const QFont f = turn ? up : across;
    p.save();
    p.translate(inner.center());
    if (turn) p.rotate(-90);
    const QRectF local = turn ? QRectF(-inner.height() / 2, -inner.width() / 2, inner.height(), inner.width())
                              : QRectF(-inner.width() / 2, -inner.height() / 2, inner.width(), inner.height());
    p.setFont(f);
    p.setPen(ink);
    const QFontMetricsF fm(f);
    const double lh = fm.height();
    if (lh * 3 <= local.height() + 1) {
        for (int k = 0; k < 3; ++k)
            p.drawText(QRectF(local.left(), -1.5 * lh + k * lh, local.width(), lh), Qt::AlignCenter,
                       fm.elidedText(lines[k], Qt::ElideRight, local.width()));
    } else if (lh <= local.height() + 1) {
        p.drawText(local, Qt::AlignCenter, fm.elidedText(lines[0], Qt::ElideRight, local.width()));
    }
    p.restore();
    return {turn, lh};
}

// Tags and marks: what the room misses, fixed, locked, its dimensions.
void PlanView::paintRoomMarks(QPainter& p, std::size_t i, const QRectF& box, const Label& label) const {
    const Room& room = brief_.rooms[i];
    // A room that misses something: a "!" tag in its top right corner
    // (shape and text, not colour alone), and the first change that
    // would meet it along its bottom edge where that fits.
    if (i < notes_.size() && !notes_[i].isEmpty() && box.width() > 18 && box.height() > 18) {
        const QRectF tag(box.right() - 17, box.top() + 3, 14, 14);
        p.setPen(QPen(QColor(0x8B, 0x1A, 0x1A), 1.2));
        p.setBrush(QColor(0xFF, 0xF4, 0xD6));
        p.drawEllipse(tag);
        QFont bold = font();
        bold.setBold(true);
        bold.setPixelSize(11);
        p.setFont(bold);
        p.drawText(tag, Qt::AlignCenter, QStringLiteral("!"));
        if (!dimensions_ && !label.turned && !hint_[i].isEmpty() && box.height() > 3 * label.lineHeight + 28 && box.width() > 90) {
            QFont small = font();
            small.setItalic(true);
            small.setPixelSize(10);
            p.setFont(small);
            const QFontMetricsF sm(small);
            p.drawText(box.adjusted(4, 2, -4, -3), Qt::AlignBottom | Qt::AlignHCenter,
                       sm.elidedText(QStringLiteral("\u2192 ") + hint_[i], Qt::ElideRight, box.width() - 8));
        }
    }
    if (room.fixed) {
        // Fixed in place: a second, dash-dotted line inside its walls and
        // the word, not colour alone.
        p.setPen(QPen(ink, 1.2, Qt::DashDotLine));
        p.setBrush(Qt::NoBrush);
        p.drawRect(box.adjusted(4, 4, -4, -4));
        QFont small = font();
        small.setPixelSize(10);
        p.setFont(small);
        p.setPen(ink);
        p.drawText(box.adjusted(6, 5, -6, -5), Qt::AlignTop | Qt::AlignLeft, tr("fixed"));
    }
    if (locked().count(int(i))) {
        QFont small = font();
        small.setPixelSize(10);
        p.setFont(small);
        p.drawText(box.adjusted(3, 2, -3, -2), Qt::AlignTop | Qt::AlignLeft, tr("locked"));
    }
    if (dimensions_) {
        QFont small = font();
        small.setPixelSize(10);
        p.setFont(small);
        p.setPen(QColor(0x33, 0x33, 0x33));
        p.drawText(box.adjusted(2, 2, -2, -2), Qt::AlignBottom | Qt::AlignHCenter,
                   QString::number(v_.rooms[i].width(), 'f', 2));
        p.save();
        p.translate(box.left() + 2, box.center().y());
        p.rotate(-90);
        p.drawText(QRectF(-box.height() / 2, 0, box.height(), 12), Qt::AlignCenter,
                   QString::number(v_.rooms[i].depth(), 'f', 2));
        p.restore();
    }
}

void PlanView::paintOutlineAndDrawnCutout(QPainter& p) const {
    // The footprint outline.
    p.setBrush(Qt::NoBrush);
    p.setPen(QPen(QColor(0x1F, 0x3A, 0x93), 3));
    for (const OutlineLoop& loop : footprintOutline(fp_)) {
        QPolygonF poly;
        for (const auto& [x, y] : loop) poly << toScreen(x, y);
        p.drawPolygon(poly);
    }
    // A cut-out being drawn (Shift+drag): its snapped rectangle, dashed.
    if (drag_ == Drag::Cutout) {
        const Placement c = drawnCutout();
        if (c.width > 0) {
            const QRectF box = toScreen(Rect{c.x, c.y, c.x + c.width, c.y + c.depth});
            p.setPen(QPen(ink, 1.5, Qt::DashLine));
            p.setBrush(QBrush(QColor(0x88, 0x88, 0x88), Qt::FDiagPattern));
            p.drawRect(box);
            p.setPen(ink);
            p.drawText(box.adjusted(4, 2, -4, -2), Qt::AlignCenter,
                       tr("cut out %1 × %2").arg(c.width, 0, 'f', 2).arg(c.depth, 0, 'f', 2));
        }
    }
}

void PlanView::paintDropped(QPainter& p) const {
    // Dropped adjacencies: a dashed line between the rooms, × in the middle.
    QStringList droppedText;
    for (int a : v_.dropped) {
        if (a < 0 || a >= int(brief_.adjacencies.size())) continue;
        const Adjacency& adj = brief_.adjacencies[a];
        const int i = brief_.roomIndex(adj.a), j = brief_.roomIndex(adj.b);
        if (i < 0 || j < 0) continue;
        const QPointF c1 = toScreen(v_.rooms[i]).center(), c2 = toScreen(v_.rooms[j]).center();
        p.setPen(QPen(QColor(0x8B, 0x1A, 0x1A), 2, Qt::DashLine));
        p.drawLine(c1, c2);
        QFont bold = font();
        bold.setBold(true);
        bold.setPixelSize(16);
        p.setFont(bold);
        p.drawText(QRectF((c1 + c2) / 2 - QPointF(8, 9), QSizeF(16, 18)), Qt::AlignCenter, QStringLiteral("\u00D7"));
        droppedText << tr("%1–%2 (%3, %4)")
                           .arg(QString::fromStdString(brief_.rooms[i].displayName()),
                                QString::fromStdString(brief_.rooms[j].displayName()),
                                adj.kind == AdjacencyKind::Door ? tr("door") : tr("wall"),
                                adj.priority == Priority::Must ? tr("must") : tr("should"));
    }
    if (!droppedText.isEmpty()) {
        p.setFont(font());
        p.setPen(ink);
        const double lh = fontMetrics().height();
        double y = planRect().bottom() + 8;
        p.drawText(QRectF(24, y, width() - 48, lh), Qt::AlignLeft, tr("Not realised in this variant (× on the plan):"));
        for (int k = 0; k < std::min<int>(4, droppedText.size()); ++k) {
            y += lh;
            const QString line = k == 3 && droppedText.size() > 4
                                     ? tr("… and %1 more").arg(droppedText.size() - 3)
                                     : droppedText[k];
            p.drawText(QRectF(36, y, width() - 60, lh), Qt::AlignLeft, line);
        }
    }
}

void PlanView::paintWallRange(QPainter& p) const {
    // While a wall is dragged: the range it may move in.
    if (drag_ == Drag::Wall) {
        const Handle& h = dragHandle_;
        const QRectF band = h.vertical ? QRectF(toScreen(h.lo, h.to), toScreen(h.hi, h.from))
                                       : QRectF(toScreen(h.from, h.hi), toScreen(h.to, h.lo));
        p.setPen(Qt::NoPen);
        p.setBrush(QColor(0x1F, 0x5F, 0xBF, 40));
        p.drawRect(band.normalized());
        p.setPen(QPen(highlightInk, 3));
        p.drawLine(h.vertical ? toScreen(h.position, h.from) : toScreen(h.from, h.position),
                   h.vertical ? toScreen(h.position, h.to) : toScreen(h.to, h.position));
    }
}

} // namespace abut::gui
