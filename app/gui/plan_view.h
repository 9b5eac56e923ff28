// SPDX-License-Identifier: MIT
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"
#include "size/segment_sizing.h"

#include <QWidget>

#include <memory>
#include <optional>
#include <set>

class QPainter;

namespace abut::gui {

class PlanSession;

// The selected variant to scale, north up: rooms with their names and
// achieved area against the target ("12.4 of 14 m², −11 %" with an arrow
// down or up, so the deviation reads without colour), spare spaces hatched,
// dropped adjacencies drawn as dashed lines marked × and listed under the
// plan, room dimensions on demand. A room that misses a requirement carries
// a "!" tag and, where it fits, the first change that would meet it; its
// tooltip says what is missed, what holds it there and what would meet it.
//
// Sizing by hand: drag an inner wall (a maximal segment) — it moves only
// within the range the sizing core allows and only the rooms beside it
// change; Alt+drag up or down on a room changes its target area, the plan
// re-sized as the pointer moves. Each drag ends in one signal, which the
// window turns into one undoable edit.
class PlanView : public QWidget {
    Q_OBJECT
public:
    explicit PlanView(QWidget* parent = nullptr);
    ~PlanView() override;

    // Shows a variant of `brief` (its rectangles are taken as they are).
    void setVariant(const Brief& brief, const Footprint& footprint, const PlanVariant& variant);
    void showMessage(const QString& text);
    bool hasVariant() const { return has_; }
    const PlanVariant& variant() const { return v_; }

    void setHighlightedRoom(const QString& id);
    const QString& highlightedRoom() const { return highlighted_; }
    void setShowDimensions(bool on);
    // The session whose locked rooms the view honours (and shows).
    void setSession(const PlanSession* session);
    // Planning module walls snap to while dragged (0 = none), plan units.
    void setGrid(double module) { grid_ = module; }

    // For tests and tooltips: inner segments that can be dragged, where a
    // point on them is on screen, and the range the sizing core allows.
    struct Handle {
        bool vertical = true;
        int segment = -1;
        double position = 0; // plan units
        double lo = 0, hi = 0;
        double from = 0, to = 0; // its extent along the other axis
    };
    std::vector<Handle> handles() const;
    QPointF screenPointOn(const Handle& h) const;
    QPointF toScreen(double x, double y) const;
    double pixelsPerUnit() const;
    QString roomAt(const QPointF& screen) const;
    // What the variant does not meet for a room, what holds it there and
    // what would meet it (the room's tooltip; a "!" tag marks the room).
    QStringList roomNotes(int room) const;

signals:
    void roomHovered(const QString& id); // "" when none
    void wallMoved(const abut::PlanVariant& resized, const QString& description);
    void targetDragged(int room, double area, const abut::PlanVariant& resized);
    void lockToggled(int room);
    // Fix the room where it is (a placement) or free it (nullopt): a brief edit.
    void fixToggled(int room, std::optional<abut::Placement> at);
    // A rectangle drawn with Shift+drag, to be cut out of the footprint (a brief edit).
    void cutoutDrawn(const abut::Placement& cutout);

protected:
    void paintEvent(QPaintEvent* event) override;
    void mousePressEvent(QMouseEvent* event) override;
    void mouseMoveEvent(QMouseEvent* event) override;
    void mouseReleaseEvent(QMouseEvent* event) override;
    void leaveEvent(QEvent* event) override;
    void contextMenuEvent(QContextMenuEvent* event) override;
    bool event(QEvent* event) override;

private:
    void rebuildProblem();
    std::optional<Handle> handleAt(const QPointF& screen) const;
    QRectF planRect() const;
    QRectF toScreen(const Rect& r) const;
    QPointF toPlan(const QPointF& screen) const; // clamped to the footprint
    Placement drawnCutout() const;               // the cut-out being drawn, snapped (empty: too small)
    // The drawing, in the order paintEvent lays it down (plan_view_paint.cpp).
    struct Label {
        bool turned = false;    // set to run up the room
        double lineHeight = 0;  // of the label's font, px
    };
    void paintTitle(QPainter& p) const;
    void paintSparesAndCutouts(QPainter& p) const;
    void paintRoom(QPainter& p, std::size_t i) const;
    Label paintRoomLabel(QPainter& p, std::size_t i, const QRectF& box) const;
    void paintRoomMarks(QPainter& p, std::size_t i, const QRectF& box, const Label& label) const;
    void paintOutlineAndDrawnCutout(QPainter& p) const;
    void paintDropped(QPainter& p) const;
    void paintWallRange(QPainter& p) const;

    Brief brief_;
    Brief planned_; // brief_ as planned (targets grown with `surplus: spread`); the sizing problem refers to it
    Footprint fp_;
    PlanVariant v_;
    bool has_ = false;
    QString message_;
    QString hovered_, highlighted_;
    bool dimensions_ = false;
    const PlanSession* session_ = nullptr;
    const std::set<int>& locked() const; // the session's locked rooms
    std::vector<QStringList> notes_; // per room: unmet, held by, would meet (see roomNotes)
    std::vector<QString> hint_;      // per room: the first change that would meet its misses
    std::unique_ptr<SizingProblem> problem_;
    SizingResult state_; // segment positions of v_
    double grid_ = 0;
    // Drag state.
    enum class Drag { None, Wall, Target, Cutout } drag_ = Drag::None;
    QPointF cutFrom_, cutTo_; // a cut-out being drawn (Shift+drag), plan units
    Handle dragHandle_;
    int dragRoom_ = -1;
    double dragStartY_ = 0, dragStartArea_ = 0, dragArea_ = 0;
    PlanVariant beforeDrag_;
};

} // namespace abut::gui
