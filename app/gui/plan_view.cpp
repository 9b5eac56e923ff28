// SPDX-License-Identifier: MIT
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


PlanView::PlanView(QWidget* parent) : QWidget(parent) {
    setMinimumSize(240, 180);
    setAutoFillBackground(true);
    setMouseTracking(true);
    QPalette p = palette();
    p.setColor(QPalette::Window, QColor(0xF4, 0xF3, 0xEF));
    setPalette(p);
    setToolTip(tr("Drag an inner wall to move it; Alt+drag up or down on a room to change its target area; "
                  "Shift+drag to cut a rectangle out of the footprint; right-click a room to lock its size or "
                  "fix it in place."));
}

PlanView::~PlanView() = default;

void PlanView::setVariant(const Brief& brief, const Footprint& footprint, const PlanVariant& variant) {
    brief_ = brief;
    fp_ = footprint;
    v_ = variant;
    has_ = true;
    message_.clear();
    drag_ = Drag::None;
    notes_.assign(brief.rooms.size(), {});
    hint_.assign(brief.rooms.size(), {});
    planned_ = plannedBrief(brief);
    if (v_.rooms.size() == planned_.rooms.size()) {
        for (const UnmetItem& u : unmetRequirements(brief, footprint, v_)) {
            QStringList lines{QString::fromStdString(u.text)};
            for (const std::string& h : heldBy(u, v_.relaxations))
                lines << tr("  held there by %1").arg(QString::fromStdString(h));
            QString first;
            for (const Relaxation& r : v_.relaxations)
                if (std::find(r.meetsKeys.begin(), r.meetsKeys.end(), u.key()) != r.meetsKeys.end()) {
                    lines << tr("  would be met by: %1").arg(QString::fromStdString(r.text));
                    if (first.isEmpty()) first = QString::fromStdString(r.text);
                }
            for (int room : u.rooms) {
                if (room < 0 || room >= int(notes_.size())) continue;
                notes_[room] << lines;
                // Beside the room its name goes without saying.
                const QString own = QString::fromStdString(brief.rooms[room].displayName()) + QStringLiteral(": ");
                if (hint_[room].isEmpty() && !first.isEmpty())
                    hint_[room] = first.startsWith(own) ? first.mid(own.size()) : first;
            }
        }
    }
    rebuildProblem();
    update();
}

QStringList PlanView::roomNotes(int room) const {
    return room >= 0 && room < int(notes_.size()) ? notes_[room] : QStringList();
}

bool PlanView::event(QEvent* event) {
    if (event->type() == QEvent::ToolTip && has_) {
        auto* help = static_cast<QHelpEvent*>(event);
        const int i = brief_.roomIndex(roomAt(help->pos()).toStdString());
        if (!roomNotes(i).isEmpty()) {
            QToolTip::showText(help->globalPos(), roomNotes(i).join(QLatin1Char('\n')), this);
            return true;
        }
    }
    return QWidget::event(event);
}

void PlanView::showMessage(const QString& text) {
    message_ = text;
    has_ = false;
    problem_.reset();
    drag_ = Drag::None;
    update();
}

void PlanView::setHighlightedRoom(const QString& id) {
    if (highlighted_ == id) return;
    highlighted_ = id;
    update();
}

void PlanView::setShowDimensions(bool on) {
    dimensions_ = on;
    update();
}

void PlanView::setSession(const PlanSession* session) {
    if (session_) disconnect(session_, nullptr, this, nullptr);
    session_ = session;
    if (session_)
        connect(session_, &PlanSession::lockedChanged, this, [this] {
            rebuildProblem();
            update();
        });
}

const std::set<int>& PlanView::locked() const {
    static const std::set<int> none;
    return session_ ? session_->lockedRooms() : none;
}

void PlanView::rebuildProblem() {
    problem_.reset();
    planned_ = plannedBrief(brief_);
    if (!has_ || v_.extended.graph.vertexCount() == 0 || v_.rooms.size() != planned_.rooms.size()) return;
    SizingOptions o = planSizingOptions(brief_);
    o.lockedRooms.assign(locked().begin(), locked().end());
    problem_ = std::make_unique<SizingProblem>(planned_, v_.extended, v_.labeling, fp_, o);
    state_ = problem_->stateOf(vertexRects(v_));
}

std::vector<PlanView::Handle> PlanView::handles() const {
    std::vector<Handle> out;
    if (!problem_) return out;
    const SegmentStructure& s = problem_->segments();
    const int n = v_.extended.graph.vertexCount();
    for (int axis = 0; axis < 2; ++axis) {
        const bool vertical = axis == 0;
        const int count = vertical ? s.verticalCount : s.horizontalCount;
        for (int k = 0; k < count; ++k) {
            if (vertical ? (k == s.westSegment || k == s.eastSegment) : (k == s.southSegment || k == s.northSegment))
                continue;
            Handle h;
            h.vertical = vertical;
            h.segment = k;
            h.position = vertical ? state_.x[k] : state_.y[k];
            h.from = 1e300;
            h.to = -1e300;
            bool lockedSide = false;
            for (int u = 0; u < n; ++u) {
                if (v_.extended.isPole(u)) continue;
                const bool beside = vertical ? (s.west[u] == k || s.east[u] == k) : (s.south[u] == k || s.north[u] == k);
                if (!beside) continue;
                const Rect& r = state_.rects[u];
                h.from = std::min(h.from, vertical ? r.y0 : r.x0);
                h.to = std::max(h.to, vertical ? r.y1 : r.x1);
                // A locked room's walls stay; so do those of a room fixed in place and a cut-out's.
                lockedSide = lockedSide || (u < int(planned_.rooms.size()) && (locked().count(u) || planned_.rooms[u].fixed));
            }
            if (lockedSide || h.from > h.to) continue;
            std::tie(h.lo, h.hi) = problem_->segmentRange(state_, vertical, k);
            if (!(h.hi > h.lo)) continue;
            out.push_back(h);
        }
    }
    return out;
}

QRectF PlanView::planRect() const {
    const int dropped = has_ ? std::min<int>(int(v_.dropped.size()), 4) : 0;
    const double listH = dropped > 0 ? fontMetrics().height() * (dropped + 1) + 8 : 0;
    return QRectF(rect()).adjusted(24, 34, -24, -24 - listH);
}

double PlanView::pixelsPerUnit() const {
    const QRectF a = planRect();
    if (fp_.width <= 0 || fp_.depth <= 0) return 1;
    return std::min(a.width() / fp_.width, a.height() / fp_.depth);
}

QPointF PlanView::toScreen(double x, double y) const {
    const QRectF a = planRect();
    const double s = pixelsPerUnit();
    const QPointF origin(a.left() + (a.width() - fp_.width * s) / 2, a.top() + (a.height() - fp_.depth * s) / 2);
    return {origin.x() + x * s, origin.y() + (fp_.depth - y) * s};
}

QPointF PlanView::toPlan(const QPointF& screen) const {
    const QPointF origin = toScreen(0, 0);
    const double s = pixelsPerUnit();
    return {std::clamp((screen.x() - origin.x()) / s, 0.0, fp_.width),
            std::clamp((origin.y() - screen.y()) / s, 0.0, fp_.depth)};
}

Placement PlanView::drawnCutout() const {
    // On the planning grid, else on 5 cm; an edge near the footprint's goes onto it.
    const double step = grid_ > 0 ? grid_ : 0.05;
    auto snap = [&](double v, double edge) {
        const double on = std::round(v / step) * step;
        return std::abs(edge - v) < 3 * step ? edge : on;
    };
    const double x0 = snap(std::min(cutFrom_.x(), cutTo_.x()), 0.0), x1 = snap(std::max(cutFrom_.x(), cutTo_.x()), fp_.width);
    const double y0 = snap(std::min(cutFrom_.y(), cutTo_.y()), 0.0), y1 = snap(std::max(cutFrom_.y(), cutTo_.y()), fp_.depth);
    if (x1 - x0 < 2 * step || y1 - y0 < 2 * step) return {};
    return {x0, y0, x1 - x0, y1 - y0};
}

QRectF PlanView::toScreen(const Rect& r) const { return QRectF(toScreen(r.x0, r.y1), toScreen(r.x1, r.y0)); }

QPointF PlanView::screenPointOn(const Handle& h) const {
    const double mid = 0.5 * (h.from + h.to);
    return h.vertical ? toScreen(h.position, mid) : toScreen(mid, h.position);
}

QString PlanView::roomAt(const QPointF& screen) const {
    if (!has_) return {};
    for (std::size_t i = 0; i < v_.rooms.size() && i < brief_.rooms.size(); ++i)
        if (toScreen(v_.rooms[i]).contains(screen)) return QString::fromStdString(brief_.rooms[i].id);
    return {};
}

std::optional<PlanView::Handle> PlanView::handleAt(const QPointF& screen) const {
    const double s = pixelsPerUnit();
    for (const Handle& h : handles()) {
        const QPointF a = h.vertical ? toScreen(h.position, h.from) : toScreen(h.from, h.position);
        const QPointF b = h.vertical ? toScreen(h.position, h.to) : toScreen(h.to, h.position);
        const double across = h.vertical ? std::abs(screen.x() - a.x()) : std::abs(screen.y() - a.y());
        const double along = h.vertical ? screen.y() : screen.x();
        const double lo = std::min(h.vertical ? a.y() : a.x(), h.vertical ? b.y() : b.x());
        const double hi = std::max(h.vertical ? a.y() : a.x(), h.vertical ? b.y() : b.x());
        if (across <= std::max(4.0, 0.05 * s) && along >= lo && along <= hi) return h;
    }
    return std::nullopt;
}

void PlanView::mousePressEvent(QMouseEvent* event) {
    if (!has_ || event->button() != Qt::LeftButton) return;
    const QPointF at = event->position();
    if (event->modifiers() & Qt::ShiftModifier) { // draw a cut-out
        drag_ = Drag::Cutout;
        cutFrom_ = cutTo_ = toPlan(at);
        return;
    }
    if (!problem_) return;
    if (event->modifiers() & Qt::AltModifier) {
        const QString id = roomAt(at);
        if (id.isEmpty()) return;
        dragRoom_ = brief_.roomIndex(id.toStdString());
        if (locked().count(dragRoom_) || brief_.rooms[dragRoom_].fixed) return; // its size is held
        drag_ = Drag::Target;
        dragStartY_ = at.y();
        dragStartArea_ = dragArea_ = brief_.rooms[dragRoom_].area;
        beforeDrag_ = v_;
        return;
    }
    if (const std::optional<Handle> h = handleAt(at)) {
        drag_ = Drag::Wall;
        dragHandle_ = *h;
        beforeDrag_ = v_;
    }
}

void PlanView::mouseMoveEvent(QMouseEvent* event) {
    const QPointF at = event->position();
    if (drag_ == Drag::Cutout) {
        cutTo_ = toPlan(at);
        update();
        return;
    }
    if (drag_ == Drag::Wall) {
        const double s = pixelsPerUnit();
        const QPointF origin = toScreen(0, 0);
        double pos = dragHandle_.vertical ? (at.x() - origin.x()) / s : (origin.y() - at.y()) / s;
        if (grid_ > 0) {
            const double snapped = std::round(pos / grid_) * grid_;
            if (snapped >= dragHandle_.lo && snapped <= dragHandle_.hi) pos = snapped;
        }
        pos = std::clamp(pos, dragHandle_.lo, dragHandle_.hi);
        std::vector<double> x = state_.x, y = state_.y;
        (dragHandle_.vertical ? x : y)[dragHandle_.segment] = pos;
        const SizingResult r = problem_->evaluate(x, y);
        v_ = applySizing(brief_, fp_, v_, r);
        state_ = r;
        dragHandle_.position = pos;
        update();
        return;
    }
    if (drag_ == Drag::Target) {
        // 200 px up doubles the target; down halves it.
        dragArea_ = std::max(0.1, dragStartArea_ * std::pow(2.0, (dragStartY_ - at.y()) / 200.0));
        problem_->setTargetArea(dragRoom_, dragArea_);
        const SizingResult r = problem_->solve(&state_);
        Brief b = brief_;
        b.rooms[dragRoom_].area = dragArea_;
        v_ = applySizing(b, fp_, v_, r);
        state_ = r;
        update();
        return;
    }
    const QString id = roomAt(at);
    if (id != hovered_) {
        hovered_ = id;
        emit roomHovered(id);
        update();
    }
    const std::optional<Handle> h = problem_ ? handleAt(at) : std::nullopt;
    setCursor(h ? (h->vertical ? Qt::SplitHCursor : Qt::SplitVCursor) : Qt::ArrowCursor);
}

void PlanView::mouseReleaseEvent(QMouseEvent*) {
    const Drag was = drag_;
    drag_ = Drag::None;
    if (was == Drag::Cutout) {
        update();
        const Placement c = drawnCutout();
        if (c.width > 0 && c.depth > 0) emit cutoutDrawn(c);
        return;
    }
    if (was == Drag::Wall) {
        bool moved = false;
        for (std::size_t i = 0; i < v_.rooms.size(); ++i)
            moved = moved || std::abs(v_.rooms[i].area() - beforeDrag_.rooms[i].area()) > 1e-12;
        if (!moved) return;
        QStringList beside;
        const SegmentStructure& s = problem_->segments();
        for (std::size_t i = 0; i < brief_.rooms.size(); ++i) {
            const int k = dragHandle_.segment;
            const bool on = dragHandle_.vertical ? (s.west[i] == k || s.east[i] == k) : (s.south[i] == k || s.north[i] == k);
            if (on) beside << QString::fromStdString(brief_.rooms[i].displayName());
        }
        emit wallMoved(v_, tr("Move wall of %1").arg(beside.mid(0, 3).join(QStringLiteral(", "))));
    } else if (was == Drag::Target) {
        if (std::abs(dragArea_ - dragStartArea_) > 1e-9) emit targetDragged(dragRoom_, dragArea_, v_);
    }
}

void PlanView::leaveEvent(QEvent*) {
    if (!hovered_.isEmpty()) {
        hovered_.clear();
        emit roomHovered(QString());
        update();
    }
}

void PlanView::contextMenuEvent(QContextMenuEvent* event) {
    const QString id = roomAt(event->pos());
    if (id.isEmpty()) return;
    const int room = brief_.roomIndex(id.toStdString());
    QMenu menu(this);
    const QString name = QString::fromStdString(brief_.rooms[room].displayName());
    const bool fixed = brief_.rooms[room].fixed.has_value();
    QAction* lock = fixed ? nullptr
                          : menu.addAction(locked().count(room) ? tr("Unlock size of %1").arg(name)
                                                                : tr("Lock size of %1").arg(name));
    // Fixing keeps the room exactly where it is in every variant (a stair
    // core that lines up with the floors below); the brief records it.
    QAction* fix = menu.addAction(fixed ? tr("Free %1 (no longer fixed in place)").arg(name)
                                        : tr("Fix %1 where it is").arg(name));
    QAction* chosen = menu.exec(event->globalPos());
    if (chosen && chosen == lock) emit lockToggled(room);
    if (chosen && chosen == fix) {
        if (fixed) {
            emit fixToggled(room, std::nullopt);
        } else {
            const Rect& r = v_.rooms[room];
            emit fixToggled(room, Placement{r.x0, r.y0, r.width(), r.depth()});
        }
    }
}


} // namespace abut::gui
