// SPDX-License-Identifier: MIT
#pragma once

#include "brief/brief.h"

#include <QGraphicsView>
#include <QLineEdit>
#include <QPointer>

#include <set>
#include <vector>

class QGraphicsLineItem;


namespace abut::gui {

class Document;
class RoomItem;
class AdjacencyItem;

// What the live check found, in brief indices, for highlighting.
struct SketchMarks {
    quint64 revision = 0;                // the document revision it was computed for
    std::set<int> rooms, adjacencies;    // involved in a problem
    std::vector<QPointF> crossings;      // where two adjacency lines cross (sketch coordinates, y north)
};

// The adjacency sketch (bubble diagram), an editable view of the document's
// brief. Rooms are discs sized by target area and filled by category;
// adjacencies are lines: door solid, wall dashed, must thick, should thin,
// so kinds and priorities read without colour. Problems found by the live
// check get a dotted ring (rooms) or a wide dotted band (adjacencies) and
// crossings a small ×.
//
// The view moves only when the planner pans, zooms, fits (Ctrl+0), tidies
// up or opens a file: adding a room puts it where the double-click was and
// leaves the view as it is.
//
// Mouse: double-click on empty canvas adds a room and opens its name for
// typing (Enter keeps it, Esc keeps the default); double-click on a room or
// F2 renames it in place; drag a room to move it
// (all selected rooms move; one undo step per drag); drag on empty canvas
// selects with a rubber band; in connect mode (key C) drag from one room to
// another to add an adjacency; middle button or Space+drag pans; wheel
// zooms. The scene is rebuilt from the brief after every change.
class SketchView : public QGraphicsView {
    Q_OBJECT
public:
    explicit SketchView(QWidget* parent = nullptr);
    ~SketchView() override;
    void setDocument(Document* doc);

    void fitAll();
    void zoomBy(double factor);
    // Opens an editor for the room's name on its bubble. `mergeKey` (the
    // room's addition) makes the name part of that one undo step.
    void editRoomName(const QString& id, const QString& mergeKey = {});
    bool editingName() const { return nameEditor_ != nullptr; }
    bool connectMode() const { return connectMode_; }
    void setConnectMode(bool on);

    // Selection by brief ids / adjacency indices.
    QStringList selectedRooms() const;
    QList<int> selectedAdjacencies() const;
    void selectItems(const QStringList& rooms, const QList<int>& adjacencies);

    void setMarks(const SketchMarks& marks);
    // A room pointed at elsewhere (plan, table): drawn with a halo.
    void setHoverRoom(const QString& id);
    const SketchMarks& marks() const { return marks_; }
    // Scene position of a room (for tests and for placing new rooms).
    QPointF roomScenePos(const QString& id) const;
    // Where a new room goes when added without a click: the view's centre.
    QPointF centreInSketch() const;

    static QPointF toScene(const SketchPoint& p) { return {p.x, -p.y}; }
    static SketchPoint toSketch(const QPointF& p) { return {p.x(), -p.y()}; }

signals:
    void selectionChangedByUser(const QStringList& rooms, const QList<int>& adjacencies);
    void addRoomRequested(const QPointF& sketchPos);
    void roomActivated(const QString& id);
    void renameRequested(const QString& id, const QString& name, const QString& mergeKey);
    void connectModeChanged(bool on);
    void message(const QString& text);
    void roomHovered(const QString& id); // "" when the pointer leaves rooms

protected:
    void mousePressEvent(QMouseEvent* event) override;
    void mouseMoveEvent(QMouseEvent* event) override;
    void mouseReleaseEvent(QMouseEvent* event) override;
    void mouseDoubleClickEvent(QMouseEvent* event) override;
    void keyPressEvent(QKeyEvent* event) override;
    void keyReleaseEvent(QKeyEvent* event) override;
    void wheelEvent(QWheelEvent* event) override;
    void resizeEvent(QResizeEvent* event) override;
    void contextMenuEvent(QContextMenuEvent* event) override;
    bool eventFilter(QObject* watched, QEvent* event) override;

private:
    void rebuild();
    void applyMarks();
    void commitMoves();
    RoomItem* roomAt(const QPoint& viewPos) const;
    void nudge(double dx, double dy);

    QPointer<Document> doc_;
    std::vector<RoomItem*> rooms_;          // brief order
    std::vector<AdjacencyItem*> adjacencies_; // brief order
    std::vector<QGraphicsItem*> crossingMarks_;
    SketchMarks marks_;
    bool autoFit_ = true;      // re-fit on resize until the planner zooms, pans or adds a room
    QPointer<QLineEdit> nameEditor_; // the in-place name editor, while open
    bool connectMode_ = false;
    bool rebuilding_ = false;
    bool spaceHeld_ = false;
    bool panning_ = false;
    QPoint panFrom_;
    RoomItem* connectFrom_ = nullptr;
    QGraphicsLineItem* rubberLine_ = nullptr;
    bool pressedOnRoom_ = false;
    QString hoverRoom_;   // shown with a halo
    QString pointedRoom_; // under the pointer in this view
};

} // namespace abut::gui
