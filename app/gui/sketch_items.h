// SPDX-License-Identifier: MIT
// The sketch's items: a room's disc with its label, an adjacency's line.
// Private to SketchView (sketch_view.cpp is the one file that includes it).
#pragma once

#include "brief/brief.h"
#include "palette.h"

#include <QGraphicsEllipseItem>
#include <QGraphicsLineItem>
#include <QGraphicsScene>
#include <QGraphicsSimpleTextItem>
#include <QPainter>
#include <QStyleOptionGraphicsItem>
#include <QtMath>

#include <cmath>
#include <vector>

namespace abut::gui {

namespace sketch_style {

// Sketch units of disc radius per unit of √(area/π): a 10 m² room is about
// 36 units across. Same scale as core's placeUnsketchedRooms.
constexpr double radiusScale = 10.0;
const QColor ink(0x2B, 0x2B, 0x2B);
const QColor selectionInk(0x1F, 0x5F, 0xBF);
const QColor problemInk(0xC2, 0x4E, 0x00);

double discRadius(const Room& room) { return std::max(14.0, radiusScale * std::sqrt(room.area / M_PI)); }

} // namespace sketch_style

using namespace sketch_style;

// A room's name and target area, centred line by line on a pale box so it
// stays legible over lines; keeps its screen size whatever the zoom.
class RoomLabel : public QGraphicsItem {
public:
    RoomLabel(const QStringList& lines, QGraphicsItem* parent) : QGraphicsItem(parent), lines_(lines) {
        setFlag(ItemIgnoresTransformations);
        setAcceptedMouseButtons(Qt::NoButton);
        const QFontMetricsF fm(font_);
        double w = 0;
        for (const QString& l : lines_) w = std::max(w, fm.horizontalAdvance(l));
        const double h = fm.height() * lines_.size();
        box_ = QRectF(-w / 2 - 3, -h / 2 - 1, w + 6, h + 2);
    }
    QRectF boundingRect() const override { return box_; }
    void paint(QPainter* p, const QStyleOptionGraphicsItem*, QWidget*) override {
        // Zoomed out, a full label would cover its neighbours: show the name
        // only, cut to about the disc's width (the tooltip has it all).
        const double scale = scene() && !scene()->views().isEmpty() ? scene()->views().first()->transform().m11() : 1.0;
        const double disc = parentItem() ? parentItem()->boundingRect().width() * scale : box_.width();
        const QFontMetricsF fm(font_);
        QStringList shown = lines_;
        QRectF box = box_;
        if (box_.width() > disc * 2.0 + 8) {
            const double room = std::max(64.0, disc * 2.0);
            shown = {fm.elidedText(lines_.value(0), Qt::ElideMiddle, room)};
            const double w = fm.horizontalAdvance(shown[0]);
            box = QRectF(-w / 2 - 3, -fm.height() / 2 - 1, w + 6, fm.height() + 2);
        }
        p->setPen(Qt::NoPen);
        p->setBrush(QColor(255, 255, 255, 170));
        p->drawRoundedRect(box, 3, 3);
        p->setPen(ink);
        p->setFont(font_);
        const double lh = fm.height();
        for (int i = 0; i < shown.size(); ++i)
            p->drawText(QRectF(box.left(), box.top() + 1 + i * lh, box.width(), lh), Qt::AlignCenter, shown[i]);
    }
    QString firstLine() const { return lines_.value(0); }

private:
    QStringList lines_;
    QFont font_;
    QRectF box_;
};

// A room of the brief. Position = sketch position (scene y down).
class RoomItem : public QGraphicsEllipseItem {
public:
    RoomItem(const Room& room, const QString& units, double r) : id(QString::fromStdString(room.id)) {
        setRect(-r, -r, 2 * r, 2 * r);
        setBrush(categoryColor(QString::fromStdString(room.category)));
        setPen(QPen(ink, 1.2));
        setFlags(ItemIsSelectable | ItemIsMovable | ItemSendsGeometryChanges);
        setZValue(2);
        const QString name = QString::fromStdString(room.displayName());
        const QString area = QString::number(room.area, 'f', room.area < 10 ? 1 : 0) + QLatin1Char(' ') + units + QChar(0x00B2);
        label = new RoomLabel({name, area}, this);
        QString facade = QString::fromStdString(facadeText(room.facade));
        setToolTip(QObject::tr("%1 — target %2%3").arg(name, area,
                                                        facade.isEmpty() ? QString() : QObject::tr("; facade %1").arg(facade)));
    }
    void paint(QPainter* p, const QStyleOptionGraphicsItem* option, QWidget*) override {
        p->setRenderHint(QPainter::Antialiasing);
        const QRectF r = rect();
        if (hovered) {
            p->setPen(Qt::NoPen);
            p->setBrush(QColor(0x1F, 0x5F, 0xBF, 60));
            p->drawEllipse(r.adjusted(-9, -9, 9, 9));
        }
        if (flagged) {
            QPen ring(problemInk, 3.0, Qt::DotLine);
            ring.setCosmetic(true);
            p->setPen(ring);
            p->setBrush(Qt::NoBrush);
            p->drawEllipse(r.adjusted(-6, -6, 6, 6));
        }
        p->setBrush(brush());
        QPen outline = pen();
        outline.setCosmetic(true);
        if (option->state & QStyle::State_Selected) {
            outline = QPen(selectionInk, 3.0);
            outline.setCosmetic(true);
        }
        p->setPen(outline);
        p->drawEllipse(r);
    }
    QVariant itemChange(GraphicsItemChange change, const QVariant& value) override;

    QString id;
    RoomLabel* label = nullptr;
    std::vector<AdjacencyItem*> lines;
    bool flagged = false;
    bool hovered = false;
};

// An adjacency: door solid, wall dashed; must thick, should thin.
class AdjacencyItem : public QGraphicsLineItem {
public:
    AdjacencyItem(int index, const Adjacency& a, RoomItem* from, RoomItem* to)
        : index(index), from(from), to(to) {
        QPen pen(ink);
        pen.setWidthF(a.priority == Priority::Must ? 2.6 : 1.0);
        pen.setStyle(a.kind == AdjacencyKind::Door ? Qt::SolidLine : Qt::DashLine);
        pen.setCosmetic(true);
        setPen(pen);
        setFlags(ItemIsSelectable);
        setZValue(1);
        setToolTip(QObject::tr("%1 — %2, %3").arg(from->label->firstLine() + QStringLiteral(" – ") +
                                                     to->label->firstLine(),
                                                 a.kind == AdjacencyKind::Door ? QObject::tr("door") : QObject::tr("wall"),
                                                 a.priority == Priority::Must ? QObject::tr("must") : QObject::tr("should")));
        follow();
    }
    void follow() { setLine(QLineF(from->pos(), to->pos())); }
    QPainterPath shape() const override {
        // Easy to hit: 8 px either side whatever the zoom.
        QPainterPathStroker s;
        const double scale = scene() && !scene()->views().isEmpty()
                                 ? scene()->views().first()->transform().m11() : 1.0;
        s.setWidth(16.0 / std::max(1e-3, scale));
        QPainterPath path(line().p1());
        path.lineTo(line().p2());
        return s.createStroke(path);
    }
    void paint(QPainter* p, const QStyleOptionGraphicsItem* option, QWidget*) override {
        p->setRenderHint(QPainter::Antialiasing);
        if (flagged) {
            QPen band(problemInk, 9.0, Qt::DotLine);
            band.setCosmetic(true);
            p->setPen(band);
            p->drawLine(line());
        }
        if (option->state & QStyle::State_Selected) {
            QPen halo(selectionInk, 7.0);
            halo.setCosmetic(true);
            p->setPen(halo);
            p->drawLine(line());
        }
        p->setPen(pen());
        p->drawLine(line());
    }

    int index;
    RoomItem* from;
    RoomItem* to;
    bool flagged = false;
};

inline QVariant RoomItem::itemChange(GraphicsItemChange change, const QVariant& value) {
    if (change == ItemPositionHasChanged)
        for (AdjacencyItem* l : lines) l->follow();
    return QGraphicsEllipseItem::itemChange(change, value);
}

} // namespace abut::gui
