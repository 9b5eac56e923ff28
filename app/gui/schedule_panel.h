// SPDX-License-Identifier: MIT
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <QWidget>

class QTableWidget;

namespace abut::gui {

// The area schedule of the variant on show: target against achieved per
// room, the deviation in words and numbers, width × depth, facade sides
// reached; totals for rooms, spare space and footprint.
class SchedulePanel : public QWidget {
    Q_OBJECT
public:
    explicit SchedulePanel(QWidget* parent = nullptr);
    void setVariant(const Brief& brief, const Footprint& footprint, const PlanVariant& v);
    void clear();
    QTableWidget* table() const { return table_; }

private:
    QTableWidget* table_ = nullptr;
};

} // namespace abut::gui
