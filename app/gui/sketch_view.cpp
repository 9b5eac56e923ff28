#include "sketch_view.h"

#include "palette.h"

#include <QGraphicsEllipseItem>
#include <QGraphicsScene>
#include <QGraphicsSimpleTextItem>
#include <QWheelEvent>
#include <QtMath>

#include <map>

namespace abut::gui {

namespace {

// Pixels of sketch per metre of circle radius: a 10 m² room is about 36 px across.
constexpr double radiusScale = 10.0;

QPointF defaultPosition(int index, int count) {
    // Rooms without a sketch position go on a circle, in brief order.
    const double angle = 2.0 * M_PI * index / std::max(1, count);
    const double r = 60.0 + 18.0 * count;
    return {r * std::cos(angle), r * std::sin(angle)};
}

} // namespace

SketchView::SketchView(QWidget* parent) : QGraphicsView(parent) {
    setScene(new QGraphicsScene(this));
    setRenderHint(QPainter::Antialiasing);
    setDragMode(QGraphicsView::ScrollHandDrag);
    setBackgroundBrush(QColor(0xFB, 0xFA, 0xF7));
    setToolTip(tr("Adjacency sketch: solid line = door, dashed = wall; thin = should"));
}

void SketchView::showBrief(const Brief& brief) {
    scene()->clear();
    std::map<std::string, QPointF> centre;
    const int n = static_cast<int>(brief.rooms.size());
    for (int i = 0; i < n; ++i) {
        const Room& room = brief.rooms[i];
        const SketchPoint* p = brief.sketchPosition(room.id);
        // Sketch y grows to the north like plan y; screen y grows down.
        centre[room.id] = p ? QPointF(p->x, -p->y) : defaultPosition(i, n);
    }
    for (const Adjacency& a : brief.adjacencies) {
        QPen pen(QColor(0x33, 0x33, 0x33));
        pen.setWidthF(a.priority == Priority::Must ? 2.5 : 1.0);
        pen.setStyle(a.kind == AdjacencyKind::Door ? Qt::SolidLine : Qt::DashLine);
        pen.setCosmetic(true);
        scene()->addLine(QLineF(centre[a.a], centre[a.b]), pen)->setZValue(0);
    }
    for (const Room& room : brief.rooms) {
        const double r = std::max(14.0, radiusScale * std::sqrt(room.area / M_PI));
        const QPointF c = centre[room.id];
        auto* disc = scene()->addEllipse(QRectF(c.x() - r, c.y() - r, 2 * r, 2 * r),
                                         QPen(QColor(0x44, 0x44, 0x44), 1.2),
                                         categoryColor(QString::fromStdString(room.category)));
        disc->setZValue(1);
        disc->setToolTip(tr("%1 — %2 %3")
                             .arg(QString::fromStdString(room.displayName()))
                             .arg(room.area)
                             .arg(QString::fromStdString(brief.units) + QChar(0x00B2)));
        // Labels keep their screen size whatever the zoom, centred on the room.
        auto* label = new QGraphicsSimpleTextItem(QString::fromStdString(room.displayName()), disc);
        const QRectF b = label->boundingRect();
        label->setFlag(QGraphicsItem::ItemIgnoresTransformations);
        label->setPos(c);
        label->setTransform(QTransform::fromTranslate(-b.width() / 2, -b.height() / 2));
    }
}

void SketchView::fitAll() {
    autoFit_ = true;
    const QRectF r = scene()->itemsBoundingRect().adjusted(-20, -20, 20, 20);
    if (!r.isEmpty()) fitInView(r, Qt::KeepAspectRatio);
}

void SketchView::resizeEvent(QResizeEvent* event) {
    QGraphicsView::resizeEvent(event);
    if (autoFit_) fitAll();
}

void SketchView::wheelEvent(QWheelEvent* event) {
    autoFit_ = false;
    const double factor = std::pow(1.0015, event->angleDelta().y());
    setTransformationAnchor(QGraphicsView::AnchorUnderMouse);
    scale(factor, factor);
}

} // namespace abut::gui
