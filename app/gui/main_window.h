// SPDX-License-Identifier: MIT
#pragma once

#include "brief/brief.h"
#include "live_check.h"
#include "plan/plan.h"

#include <QFutureWatcher>
#include <QMainWindow>
#include <QMessageBox>
#include <QTimer>

#include <functional>
#include <memory>
#include <set>

class QListWidget;
class QListWidgetItem;
class QMenu;

namespace abut::gui {

class BriefPanel;
class Document;
class PlanRunner;
class PlanSession;
class PlanView;
class Recovery;
class SchedulePanel;
class SketchView;
class VariantsStrip;

struct MainWindowOptions {
    QString recoveryFolder;      // empty: Recovery::defaultFolder()
    int autosaveSeconds = 60;    // 0: no autosave timer (autosaveNow() still works)
    int checkDelayMs = 150;      // live check after the last edit
    int planDelayMs = 250;       // plan computation after the last edit (the first plan shows within 0.5 s)
};

// The editor's window: the sketch (bubble diagram) and the brief panel edit
// one Document (brief + undo stack); every edit restarts the live check
// (LiveCheck, worker thread) and, after a pause, the plan computation
// (PlanRunner).
// The plan session (PlanSession: the variants, the one on show and the
// brief it was planned from, locked rooms) is its own object; the window
// passes it each new brief and the computation's results, and redraws the
// strip, the plan view, the area schedule and the diagnostics list when it
// signals. A wall or target drag in the plan view comes back as one undoable
// edit. Files, recovery, export and printing hang off its menus
// (main_window_actions.cpp).
class MainWindow : public QMainWindow {
    Q_OBJECT
public:
    explicit MainWindow(const MainWindowOptions& options = {}, QWidget* parent = nullptr);
    ~MainWindow() override;

    // Loads a project; on failure keeps the current one and either fills
    // `errors` (one line each) or, when it is null, shows them in a dialog.
    bool openProject(const QString& path, QStringList* errors = nullptr);
    bool saveTo(const QString& path, QString* error = nullptr);
    bool importCsv(const QString& path, QStringList* errors = nullptr);
    void newProject();

    Document* document() const { return doc_; }
    const Brief& brief() const;
    SketchView* sketchView() const { return sketch_; }
    BriefPanel* briefPanel() const { return panel_; }
    QListWidget* diagnosticsList() const { return diagnostics_; }
    PlanView* planView() const { return planView_; }
    VariantsStrip* variantsStrip() const { return strip_; }
    SchedulePanel* schedulePanel() const { return schedule_; }
    PlanRunner* planRunner() const { return runner_; }
    // The variant on show, as sized for the current brief.
    PlanSession* planSession() const { return session_; }
    bool hasCurrentVariant() const;
    const PlanVariant& currentVariant() const;
    const std::vector<PlanVariant>& variants() const;
    bool exportCurrent(const QString& path, QString* error = nullptr);
    Recovery* recovery() const { return recovery_.get(); }
    // True while plans or the live check are being computed in the background.
    bool planning() const;
    bool checking() const { return checker_.isRunning() || checkTimer_.isActive(); }
    const LiveCheck& lastCheck() const { return check_; }

    // Questions to the planner go through this; tests replace it.
    std::function<QMessageBox::StandardButton(const QString& title, const QString& text,
                                              QMessageBox::StandardButtons buttons)> ask;

    // Writes the recovery file now if anything changed since the last one.
    bool autosaveNow();
    // Offers the autosaves of sessions that ended without closing; true when one was restored.
    bool offerRecovery();

public slots:
    void showAbout();
    void tidyUp();
    void addRoomAt(const QPointF& sketchPos);
    // The window as a PNG once the plans and the check are done (at most
    // `waitSeconds`, then the planning is stopped): what --screenshot writes,
    // through the atomic writer. False, with `message` ("PATH: why"), when
    // it cannot be written; the previous file is then untouched.
    bool screenshot(const QString& path, double waitSeconds, QString* message = nullptr);
    void renameRoom(const QString& id, const QString& name, const QString& mergeKey);
    void deleteSelection();
    void toggleKind();
    void togglePriority();

protected:
    void closeEvent(QCloseEvent* event) override;

private:
    void buildActions();
    bool maybeSave();
    bool save();
    bool saveAs();
    void openDialog();
    void importDialog();
    void updateTitle();
    void rememberRecent(const QString& path);
    void fillRecentMenu();
    void briefChanged();
    void startCheck();
    void showDiagnostics(); // the live check's findings and the plan on show's misses
    void checkReady();
    void startPlanning();
    void variantFound(const PlanVariant& v, quint64 revision);
    void planFinished(const Plan& plan, quint64 revision);
    void variantsChanged();
    void showCurrent();
    void wallMoved(const PlanVariant& resized, const QString& description);
    void targetDragged(int room, double area, const PlanVariant& resized);
    void hoverRoom(const QString& id);
    void exportDialog();
    void printSheet();
    void diagnosticClicked(QListWidgetItem* item);
    void syncSelection(const QStringList& rooms, const QList<int>& adjacencies, QObject* from);
    void status(const QString& text);
    void toggleSelectedAdjacencies(const std::function<void(Adjacency&, bool)>& set,
                                   const std::function<bool(const Adjacency&)>& isFirst, const QString& toSecond,
                                   const QString& toFirst);

    MainWindowOptions options_;
    Document* doc_ = nullptr;
    SketchView* sketch_ = nullptr;
    BriefPanel* panel_ = nullptr;
    QListWidget* diagnostics_ = nullptr;
    PlanView* planView_ = nullptr;
    QMenu* recentMenu_ = nullptr;
    std::unique_ptr<Recovery> recovery_;
    quint64 autosavedRevision_ = 0;
    QTimer autosaveTimer_, checkTimer_, planTimer_;
    QFutureWatcher<LiveCheck> checker_;
    PlanRunner* runner_ = nullptr;
    VariantsStrip* strip_ = nullptr;
    SchedulePanel* schedule_ = nullptr;
    LiveCheck check_;
    PlanSession* session_ = nullptr; // the variants, the one on show, locked rooms
    bool syncing_ = false;
};

} // namespace abut::gui
