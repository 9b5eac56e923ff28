// SPDX-License-Identifier: MIT
#include "sketch_view.h"

#include "brief/brief_edit.h"
#include "document.h"
#include "palette.h"
#include "sketch_items.h"

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
