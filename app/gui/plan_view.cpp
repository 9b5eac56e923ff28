#include "plan_view.h"

#include "sheet.h"

#include <QPainter>

namespace abut::gui {

PlanView::PlanView(QWidget* parent) : QWidget(parent) {
    setMinimumSize(240, 180);
    setAutoFillBackground(true);
    QPalette p = palette();
    p.setColor(QPalette::Window, QColor(0xF4, 0xF3, 0xEF));
    setPalette(p);
}

void PlanView::showPlan(const Brief& brief, const Plan& plan, int variant) {
    brief_ = brief;
    plan_ = plan;
    variant_ = variant;
    message_.clear();
    update();
}

void PlanView::showMessage(const QString& text) {
    message_ = text;
    variant_ = -1;
    update();
}

void PlanView::paintEvent(QPaintEvent*) {
    QPainter p(this);
    if (variant_ < 0 || variant_ >= static_cast<int>(plan_.variants.size())) {
        p.setPen(QColor(0x55, 0x55, 0x55));
        p.drawText(rect().adjusted(20, 20, -20, -20), Qt::AlignCenter | Qt::TextWordWrap, message_);
        return;
    }
    const PlanVariant& v = plan_.variants[variant_];
    const QRectF area = QRectF(rect()).adjusted(24, 36, -24, -24);
    render::paintPlan(p, area, brief_, plan_.footprint, v);
    p.setPen(QColor(0x22, 0x22, 0x22));
    QFont f = font();
    f.setBold(true);
    p.setFont(f);
    const QString u = QString::fromStdString(brief_.units);
    p.drawText(QRectF(24, 6, width() - 48, 24), Qt::AlignLeft | Qt::AlignVCenter,
               tr("Variant %1 of %2 — %3 × %4 %5 — worst area deviation %6%")
                   .arg(variant_ + 1)
                   .arg(plan_.variants.size())
                   .arg(plan_.footprint.width, 0, 'f', 2)
                   .arg(plan_.footprint.depth, 0, 'f', 2)
                   .arg(u)
                   .arg(100.0 * v.metrics.worstAreaError, 0, 'f', 1));
}

} // namespace abut::gui
