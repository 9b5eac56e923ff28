// SPDX-License-Identifier: MIT
#include "sketch_view.h"

#include "brief/brief_edit.h"
#include "document.h"
#include "palette.h"

#include <QContextMenuEvent>
#include <QGraphicsEllipseItem>
#include <QGraphicsLineItem>
#include <QGraphicsScene>
#include <QGraphicsSimpleTextItem>
#include <QLineEdit>
#include <QMenu>
#include <QScrollBar>
#include <QStyleOptionGraphicsItem>
#include <QWheelEvent>
#include <QtMath>

namespace abut::gui {

namespace {

// Sketch units of disc radius per unit of √(area/π): a 10 m² room is about
// 36 units across. Same scale as core's placeUnsketchedRooms.
constexpr double radiusScale = 10.0;
const QColor ink(0x2B, 0x2B, 0x2B);
const QColor selectionInk(0x1F, 0x5F, 0xBF);
const QColor problemInk(0xC2, 0x4E, 0x00);

double discRadius(const Room& room) { return std::max(14.0, radiusScale * std::sqrt(room.area / M_PI)); }

} // namespace

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

QVariant RoomItem::itemChange(GraphicsItemChange change, const QVariant& value) {
    if (change == ItemPositionHasChanged)
        for (AdjacencyItem* l : lines) l->follow();
    return QGraphicsEllipseItem::itemChange(change, value);
}

SketchView::SketchView(QWidget* parent) : QGraphicsView(parent) {
    setScene(new QGraphicsScene(this));
    setRenderHint(QPainter::Antialiasing);
    setDragMode(QGraphicsView::RubberBandDrag);
    setBackgroundBrush(QColor(0xFB, 0xFA, 0xF7));
    setTransformationAnchor(QGraphicsView::AnchorUnderMouse);
    // Panning is by the middle button or Space+drag. Scroll bars that come and
    // go change the viewport, which re-fits it, which brings them back: off.
    setHorizontalScrollBarPolicy(Qt::ScrollBarAlwaysOff);
    setVerticalScrollBarPolicy(Qt::ScrollBarAlwaysOff);
    setFocusPolicy(Qt::StrongFocus);
    viewport()->setMouseTracking(true);
    setToolTip(tr("Adjacency sketch: solid line = door, dashed = wall; thick = must, thin = should.\n"
                  "Double-click to add a room; C to draw adjacencies; Delete removes the selection."));
    connect(scene(), &QGraphicsScene::selectionChanged, this, [this] {
        if (!rebuilding_) emit selectionChangedByUser(selectedRooms(), selectedAdjacencies());
    });
}

SketchView::~SketchView() {
    // The scene outlives this object's members; its items must not call back.
    scene()->disconnect(this);
    rooms_.clear();
    adjacencies_.clear();
}

void SketchView::setDocument(Document* doc) {
    doc_ = doc;
    connect(doc, &Document::briefChanged, this, &SketchView::rebuild);
    rebuild();
}

void SketchView::rebuild() {
    if (!doc_) return;
    rebuilding_ = true;
    const QStringList keepRooms = selectedRooms();
    QList<std::pair<QString, QString>> keepPairs;
    for (AdjacencyItem* a : adjacencies_)
        if (a->isSelected()) keepPairs.append({a->from->id, a->to->id});
    connectFrom_ = nullptr;
    rubberLine_ = nullptr;
    scene()->clear();
    rooms_.clear();
    adjacencies_.clear();
    crossingMarks_.clear();

    const Brief& brief = doc_->brief();
    const QString units = QString::fromStdString(brief.units);
    for (std::size_t i = 0; i < brief.rooms.size(); ++i) {
        const Room& room = brief.rooms[i];
        auto* item = new RoomItem(room, units, discRadius(room));
        const SketchPoint* p = brief.sketchPosition(room.id);
        // Rooms without a position (a file written by hand) line up on a row
        // until they are moved; the document fills positions on open.
        item->setPos(p ? toScene(*p) : QPointF(80.0 * double(i), 0));
        scene()->addItem(item);
        item->setSelected(keepRooms.contains(item->id));
        item->hovered = item->id == hoverRoom_;
        rooms_.push_back(item);
    }
    for (std::size_t i = 0; i < brief.adjacencies.size(); ++i) {
        const Adjacency& a = brief.adjacencies[i];
        const int u = brief.roomIndex(a.a), v = brief.roomIndex(a.b);
        if (u < 0 || v < 0) continue;
        auto* line = new AdjacencyItem(int(i), a, rooms_[u], rooms_[v]);
        scene()->addItem(line);
        rooms_[u]->lines.push_back(line);
        rooms_[v]->lines.push_back(line);
        line->setSelected(keepPairs.contains({line->from->id, line->to->id}));
        adjacencies_.push_back(line);
    }
    applyMarks();
    rebuilding_ = false;
}

void SketchView::setHoverRoom(const QString& id) {
    if (hoverRoom_ == id) return;
    hoverRoom_ = id;
    for (RoomItem* r : rooms_) {
        const bool on = r->id == id;
        if (r->hovered != on) {
            r->hovered = on;
            r->update();
        }
    }
}

void SketchView::setMarks(const SketchMarks& marks) {
    marks_ = marks;
    applyMarks();
}

void SketchView::applyMarks() {
    for (QGraphicsItem* m : crossingMarks_) delete m;
    crossingMarks_.clear();
    // Marks computed for an older brief would point at the wrong items.
    const bool current = doc_ && marks_.revision == doc_->revision();
    for (std::size_t i = 0; i < rooms_.size(); ++i) {
        rooms_[i]->flagged = current && marks_.rooms.count(int(i));
        rooms_[i]->update();
    }
    for (AdjacencyItem* a : adjacencies_) {
        a->flagged = current && marks_.adjacencies.count(a->index);
        a->update();
    }
    if (!current) return;
    for (const QPointF& p : marks_.crossings) {
        auto* mark = scene()->addSimpleText(QStringLiteral("\u00D7"));
        QFont f = mark->font();
        f.setPointSizeF(f.pointSizeF() * 1.8);
        f.setBold(true);
        mark->setFont(f);
        mark->setBrush(problemInk);
        mark->setFlag(QGraphicsItem::ItemIgnoresTransformations);
        const QRectF b = mark->boundingRect();
        mark->setTransform(QTransform::fromTranslate(-b.width() / 2, -b.height() / 2));
        mark->setPos(p.x(), -p.y());
        mark->setZValue(3);
        mark->setToolTip(tr("Two adjacency lines cross here"));
        crossingMarks_.push_back(mark);
    }
}

QStringList SketchView::selectedRooms() const {
    QStringList ids;
    for (RoomItem* r : rooms_)
        if (r->isSelected()) ids << r->id;
    return ids;
}

QList<int> SketchView::selectedAdjacencies() const {
    QList<int> out;
    for (AdjacencyItem* a : adjacencies_)
        if (a->isSelected()) out << a->index;
    return out;
}

void SketchView::selectItems(const QStringList& rooms, const QList<int>& adjacencies) {
    rebuilding_ = true; // programmatic: do not echo back as a user selection
    for (RoomItem* r : rooms_) r->setSelected(rooms.contains(r->id));
    for (AdjacencyItem* a : adjacencies_) a->setSelected(adjacencies.contains(a->index));
    rebuilding_ = false;
    for (RoomItem* r : rooms_)
        if (r->isSelected()) {
            ensureVisible(r, 20, 20);
            break;
        }
}

QPointF SketchView::roomScenePos(const QString& id) const {
    for (RoomItem* r : rooms_)
        if (r->id == id) return r->pos();
    return {};
}

QPointF SketchView::centreInSketch() const {
    const QPointF c = mapToScene(viewport()->rect().center());
    return {c.x(), -c.y()};
}

void SketchView::fitAll() {
    autoFit_ = true;
    const QRectF r = scene()->itemsBoundingRect().adjusted(-30, -30, 30, 30);
    if (r.isEmpty()) return;
    // The whole sketch in the viewport, but a room or two is not blown up: at
    // most twice the natural size. Never more than fits, so that no scroll
    // bar appears (one appearing and leaving would re-fit without end).
    const QRectF vp = viewport()->rect().adjusted(2, 2, -2, -2);
    const double k = std::min({vp.width() / r.width(), vp.height() / r.height(), 2.0});
    if (!(k > 0)) return;
    setTransform(QTransform::fromScale(k, k));
    centerOn(r.center());
}

void SketchView::zoomBy(double factor) {
    autoFit_ = false;
    scale(factor, factor);
}

void SketchView::setConnectMode(bool on) {
    if (connectMode_ == on) return;
    connectMode_ = on;
    setDragMode(on ? QGraphicsView::NoDrag : QGraphicsView::RubberBandDrag);
    viewport()->setCursor(on ? Qt::CrossCursor : Qt::ArrowCursor);
    emit connectModeChanged(on);
    emit message(on ? tr("Drag from one room to another to make them adjacent. Press C or Esc to stop.")
                    : QString());
}

RoomItem* SketchView::roomAt(const QPoint& viewPos) const {
    for (QGraphicsItem* item : items(viewPos)) {
        if (auto* r = dynamic_cast<RoomItem*>(item)) return r;
        if (auto* r = dynamic_cast<RoomItem*>(item->parentItem())) return r;
    }
    return nullptr;
}

void SketchView::mousePressEvent(QMouseEvent* event) {
    setFocus();
    if (event->button() == Qt::MiddleButton || (event->button() == Qt::LeftButton && spaceHeld_)) {
        panning_ = true;
        autoFit_ = false;
        panFrom_ = event->position().toPoint();
        viewport()->setCursor(Qt::ClosedHandCursor);
        event->accept();
        return;
    }
    if (connectMode_ && event->button() == Qt::LeftButton) {
        connectFrom_ = roomAt(event->position().toPoint());
        if (connectFrom_) {
            QPen pen(selectionInk, 2.0, Qt::DashLine);
            pen.setCosmetic(true);
            rubberLine_ = scene()->addLine(QLineF(connectFrom_->pos(), connectFrom_->pos()), pen);
            rubberLine_->setZValue(4);
        }
        event->accept();
        return;
    }
    pressedOnRoom_ = event->button() == Qt::LeftButton && roomAt(event->position().toPoint());
    QGraphicsView::mousePressEvent(event);
}

void SketchView::mouseMoveEvent(QMouseEvent* event) {
    if (panning_) {
        const QPoint d = event->position().toPoint() - panFrom_;
        panFrom_ = event->position().toPoint();
        horizontalScrollBar()->setValue(horizontalScrollBar()->value() - d.x());
        verticalScrollBar()->setValue(verticalScrollBar()->value() - d.y());
        return;
    }
    if (rubberLine_ && connectFrom_) {
        rubberLine_->setLine(QLineF(connectFrom_->pos(), mapToScene(event->position().toPoint())));
        return;
    }
    if (event->buttons() == Qt::NoButton) {
        RoomItem* r = roomAt(event->position().toPoint());
        const QString id = r ? r->id : QString();
        if (id != pointedRoom_) {
            pointedRoom_ = id;
            emit roomHovered(id);
        }
    }
    QGraphicsView::mouseMoveEvent(event);
}

void SketchView::mouseReleaseEvent(QMouseEvent* event) {
    if (panning_) {
        panning_ = false;
        viewport()->setCursor(connectMode_ ? Qt::CrossCursor : Qt::ArrowCursor);
        return;
    }
    if (connectMode_ && connectFrom_) {
        RoomItem* to = roomAt(event->position().toPoint());
        const QString from = connectFrom_->id;
        delete rubberLine_;
        rubberLine_ = nullptr;
        connectFrom_ = nullptr;
        if (to && to->id != from && doc_) {
            Brief b = doc_->brief();
            const EditResult r = addAdjacency(b, Adjacency{from.toStdString(), to->id.toStdString()});
            if (r.ok()) doc_->edit(tr("Add adjacency"), b);
            else emit message(QString::fromStdString(r.message));
        }
        return;
    }
    QGraphicsView::mouseReleaseEvent(event);
    if (pressedOnRoom_) commitMoves();
    pressedOnRoom_ = false;
}

void SketchView::commitMoves() {
    if (!doc_) return;
    Brief b = doc_->brief();
    int moved = 0;
    for (RoomItem* r : rooms_) {
        const SketchPoint now = toSketch(r->pos());
        const SketchPoint* was = b.sketchPosition(r->id.toStdString());
        if (was && std::abs(was->x - now.x) < 1e-9 && std::abs(was->y - now.y) < 1e-9) continue;
        setSketchPosition(b, r->id.toStdString(), now);
        ++moved;
    }
    if (moved) doc_->edit(tr("Move %n room(s)", nullptr, moved), b);
}

void SketchView::nudge(double dx, double dy) {
    if (!doc_ || selectedRooms().isEmpty()) return;
    Brief b = doc_->brief();
    for (const QString& id : selectedRooms()) {
        const SketchPoint* p = b.sketchPosition(id.toStdString());
        const SketchPoint at = p ? *p : toSketch(roomScenePos(id));
        setSketchPosition(b, id.toStdString(), {at.x + dx, at.y + dy});
    }
    // Key presses in a row on the same rooms are one step.
    doc_->edit(tr("Nudge rooms"), b, QStringLiteral("nudge:") + selectedRooms().join(QLatin1Char(',')));
}

void SketchView::mouseDoubleClickEvent(QMouseEvent* event) {
    if (event->button() != Qt::LeftButton) return;
    if (RoomItem* r = roomAt(event->position().toPoint())) {
        editRoomName(r->id);
        return;
    }
    autoFit_ = false; // the planner placed it: the view stays where it is
    const QPointF s = mapToScene(event->position().toPoint());
    emit addRoomRequested(QPointF(s.x(), -s.y()));
}

void SketchView::editRoomName(const QString& id, const QString& mergeKey) {
    if (!doc_) return;
    const int index = doc_->brief().roomIndex(id.toStdString());
    if (index < 0) return;
    if (nameEditor_) nameEditor_->deleteLater();
    auto* editor = new QLineEdit(viewport());
    nameEditor_ = editor;
    editor->setObjectName(QStringLiteral("roomNameEditor"));
    editor->setText(QString::fromStdString(doc_->brief().rooms[index].displayName()));
    editor->selectAll();
    const QFontMetrics fm(editor->font());
    const int w = std::max(140, fm.horizontalAdvance(editor->text()) + 30), h = fm.height() + 10;
    const QPoint c = mapFromScene(roomScenePos(id));
    editor->setGeometry(c.x() - w / 2, c.y() - h / 2, w, h);
    editor->installEventFilter(this);
    // Enter or leaving the field keeps the name; Esc (see eventFilter) keeps the old one.
    connect(editor, &QLineEdit::editingFinished, this, [this, editor, id, mergeKey] {
        if (nameEditor_ != editor) return;
        nameEditor_ = nullptr;
        const QString name = editor->text().trimmed();
        editor->deleteLater();
        if (!name.isEmpty()) emit renameRequested(id, name, mergeKey);
        setFocus();
    });
    editor->show();
    editor->setFocus();
}

bool SketchView::eventFilter(QObject* watched, QEvent* event) {
    if (watched == nameEditor_ && event->type() == QEvent::KeyPress &&
        static_cast<QKeyEvent*>(event)->key() == Qt::Key_Escape) {
        QLineEdit* editor = nameEditor_;
        nameEditor_ = nullptr; // editingFinished from losing focus now does nothing
        editor->deleteLater();
        setFocus();
        return true;
    }
    return QGraphicsView::eventFilter(watched, event);
}

void SketchView::keyPressEvent(QKeyEvent* event) {
    const double step = (event->modifiers() & Qt::ShiftModifier) ? 20.0 : 4.0;
    switch (event->key()) {
    case Qt::Key_Space:
        if (!event->isAutoRepeat()) spaceHeld_ = true;
        return;
    case Qt::Key_C:
        if (event->modifiers() == Qt::NoModifier) {
            setConnectMode(!connectMode_);
            return;
        }
        break;
    case Qt::Key_F2:
        if (selectedRooms().size() == 1) editRoomName(selectedRooms().front());
        return;
    case Qt::Key_Escape:
        if (connectMode_) setConnectMode(false);
        else scene()->clearSelection();
        return;
    case Qt::Key_Left: nudge(-step, 0); return;
    case Qt::Key_Right: nudge(step, 0); return;
    case Qt::Key_Up: nudge(0, step); return;
    case Qt::Key_Down: nudge(0, -step); return;
    default: break;
    }
    QGraphicsView::keyPressEvent(event);
}

void SketchView::keyReleaseEvent(QKeyEvent* event) {
    if (event->key() == Qt::Key_Space && !event->isAutoRepeat()) spaceHeld_ = false;
    QGraphicsView::keyReleaseEvent(event);
}

void SketchView::contextMenuEvent(QContextMenuEvent* event) {
    // Right-click acts on what is under the pointer; the window's actions
    // apply to the selection.
    QGraphicsItem* hit = nullptr;
    for (QGraphicsItem* item : items(event->pos())) {
        if (dynamic_cast<RoomItem*>(item) || dynamic_cast<AdjacencyItem*>(item)) {
            hit = item;
            break;
        }
        if (dynamic_cast<RoomItem*>(item->parentItem())) {
            hit = item->parentItem();
            break;
        }
    }
    if (hit && !hit->isSelected()) {
        scene()->clearSelection();
        hit->setSelected(true);
    }
    if (actions().isEmpty()) return;
    QMenu menu(this);
    menu.addActions(actions());
    menu.exec(event->globalPos());
}

void SketchView::resizeEvent(QResizeEvent* event) {
    QGraphicsView::resizeEvent(event);
    if (autoFit_) fitAll();
}

void SketchView::wheelEvent(QWheelEvent* event) {
    zoomBy(std::pow(1.0015, event->angleDelta().y()));
}

} // namespace abut::gui
