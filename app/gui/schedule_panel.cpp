// SPDX-License-Identifier: MIT
#include "schedule_panel.h"

#include "export/schedule.h"

#include <QHeaderView>
#include <QTableWidget>
#include <QVBoxLayout>

namespace abut::gui {

SchedulePanel::SchedulePanel(QWidget* parent) : QWidget(parent) {
    auto* layout = new QVBoxLayout(this);
    layout->setContentsMargins(4, 4, 4, 4);
    table_ = new QTableWidget(this);
    table_->setObjectName(QStringLiteral("schedule"));
    table_->setColumnCount(6);
    table_->verticalHeader()->hide();
    table_->setEditTriggers(QAbstractItemView::NoEditTriggers);
    table_->horizontalHeader()->setStretchLastSection(true);
    layout->addWidget(table_);
}

void SchedulePanel::clear() { table_->setRowCount(0); }

void SchedulePanel::setVariant(const Brief& brief, const Footprint& footprint, const PlanVariant& v) {
    const AreaSchedule s = areaSchedule(brief, footprint, v);
    const QString u = QString::fromStdString(brief.units);
    const QString u2 = QString::fromStdString(areaUnit(brief.units));
    table_->setHorizontalHeaderLabels({tr("Room"), tr("Target (%1)").arg(u2), tr("Achieved (%1)").arg(u2),
                                       tr("Deviation"), tr("Width × depth (%1)").arg(u), tr("Facade")});
    table_->setRowCount(int(s.rows.size()) + 3);
    auto put = [&](int row, int col, const QString& text, bool number) {
        auto* item = new QTableWidgetItem(text);
        if (number) item->setTextAlignment(Qt::AlignRight | Qt::AlignVCenter);
        table_->setItem(row, col, item);
    };
    int row = 0;
    for (const ScheduleRow& r : s.rows) {
        put(row, 0, QString::fromStdString(r.name), false);
        put(row, 1, QString::number(r.target, 'f', 1), true);
        put(row, 2, QString::number(r.achieved, 'f', 1), true);
        const QString dev = std::abs(r.deviation) < 0.005
                                ? tr("on target")
                                : (r.deviation < 0 ? tr("%1 % under") : tr("%1 % over"))
                                      .arg(std::abs(100 * r.deviation), 0, 'f', 1);
        put(row, 3, dev, true);
        put(row, 4, QStringLiteral("%1 × %2").arg(r.width, 0, 'f', 2).arg(r.depth, 0, 'f', 2), true);
        put(row, 5, QString::fromStdString(r.facade), false);
        ++row;
    }
    QFont bold = table_->font();
    bold.setBold(true);
    auto total = [&](const QString& name, const QString& target, const QString& achieved, const QString& size) {
        put(row, 0, name, false);
        put(row, 1, target, true);
        put(row, 2, achieved, true);
        put(row, 4, size, true);
        for (int c = 0; c < 6; ++c)
            if (QTableWidgetItem* it = table_->item(row, c)) it->setFont(bold);
        ++row;
    };
    total(tr("Total rooms"), QString::number(s.totalTarget, 'f', 1), QString::number(s.totalAchieved, 'f', 1), QString());
    total(tr("Spare spaces"), QString(), QString::number(s.spareArea, 'f', 1), QString());
    total(tr("Footprint"), QString(), QString::number(s.footprintArea, 'f', 1),
          QStringLiteral("%1 × %2").arg(footprint.width, 0, 'f', 2).arg(footprint.depth, 0, 'f', 2));
    table_->resizeColumnsToContents();
}

} // namespace abut::gui
