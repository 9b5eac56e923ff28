#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <QWidget>

namespace abut::gui {

// The selected variant drawn to scale, north up, with room names and
// achieved areas. Read-only for now; walls become draggable with sizing in
// the editor.
class PlanView : public QWidget {
    Q_OBJECT
public:
    explicit PlanView(QWidget* parent = nullptr);
    void showPlan(const Brief& brief, const Plan& plan, int variant);
    void showMessage(const QString& text);

protected:
    void paintEvent(QPaintEvent* event) override;

private:
    Brief brief_;
    Plan plan_;
    int variant_ = -1;
    QString message_;
};

} // namespace abut::gui
