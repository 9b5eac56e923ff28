#pragma once

#include "brief/brief.h"

#include <QMainWindow>

class QLabel;
class QListWidget;
class QTableWidget;

namespace abut::gui {

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

public slots:
    void showAbout();

private:
    void buildMenus();
    void refreshViews();

    Brief brief_;
    QString path_;
    SketchView* sketch_ = nullptr;
    QTableWidget* roomTable_ = nullptr;
    QListWidget* diagnostics_ = nullptr;
    QLabel* planPlaceholder_ = nullptr;
};

} // namespace abut::gui
