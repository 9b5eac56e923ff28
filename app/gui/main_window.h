#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <QFutureWatcher>
#include <QMainWindow>

class QListWidget;
class QTableWidget;

namespace abut::gui {

class PlanView;
class SketchView;

class MainWindow : public QMainWindow {
    Q_OBJECT
public:
    explicit MainWindow(QWidget* parent = nullptr);

    // Loads a project; on failure keeps the current one and either fills
    // `errors` (one line each) or, when it is null, shows them in a dialog.
    bool openProject(const QString& path, QStringList* errors = nullptr);
    const Brief& brief() const { return brief_; }
    SketchView* sketchView() const { return sketch_; }
    // True while plans are being computed in the background.
    bool planning() const { return planner_.isRunning(); }

public slots:
    void showAbout();

private:
    void buildMenus();
    void refreshViews();
    void startPlanning();
    void planReady();

    Brief brief_;
    QString path_;
    SketchView* sketch_ = nullptr;
    QTableWidget* roomTable_ = nullptr;
    QListWidget* diagnostics_ = nullptr;
    PlanView* planView_ = nullptr;
    QFutureWatcher<Plan> planner_;
    Plan plan_;
};

} // namespace abut::gui
