// SPDX-License-Identifier: MIT
#include "main_window.h"

#include "plan/relaxations.h"
#include "plan/unmet.h"

#include "brief/brief_edit.h"
#include "brief_panel.h"
#include "caution.h"
#include "document.h"
#include "embed/straight_line_drawing.h"
#include "io/csv_import.h"
#include "io/project_io.h"
#include "plan/plan_builder.h"
#include "plan/variant_key.h"
#include "plan_runner.h"
#include "plan_view.h"
#include "schedule_panel.h"
#include "export_plan.h"
#include "variants_strip.h"
#include "recovery.h"
#include "sketch_view.h"

#include <QtConcurrent/QtConcurrentRun>

#include <cstdio>

#include <QAction>
#include <QActionGroup>
#include <QApplication>
#include <QElapsedTimer>
#include <QCloseEvent>
#include <QDockWidget>
#include <QFileDialog>
#include <QFileInfo>
#include <QListWidget>
#include <QMenuBar>
#include <QSettings>
#include <QSplitter>
#include <QStatusBar>
#include <QStyle>
#include <QToolBar>
#include <QPrintDialog>
#include <QPrinter>

// Resources of a static library must be registered by name, outside any namespace.
static void initAbutResources() { Q_INIT_RESOURCE(abut); }

namespace abut::gui {

namespace {

constexpr int maxRecent = 8;
const char* recentKey = "recentFiles";

QString displayName(const QString& path) {
    return path.isEmpty() ? QObject::tr("Untitled") : QFileInfo(path).fileName();
}

} // namespace

MainWindow::MainWindow(const MainWindowOptions& options, QWidget* parent)
    : QMainWindow(parent), options_(options) {
    initAbutResources();
    setWindowIcon(QIcon(QStringLiteral(":/icons/abut.svg")));
    doc_ = new Document(this);
    recovery_ = std::make_unique<Recovery>(options_.recoveryFolder);

    ask = [this](const QString& title, const QString& text, QMessageBox::StandardButtons buttons) {
        return QMessageBox::question(this, title, text, buttons);
    };

    sketch_ = new SketchView(this);
    sketch_->setObjectName(QStringLiteral("sketch"));
    sketch_->setDocument(doc_);
    planView_ = new PlanView(this);
    planView_->setObjectName(QStringLiteral("planView"));
    planView_->showMessage(tr("Add rooms and adjacencies, or open a brief, to see plans."));
    strip_ = new VariantsStrip(this);
    runner_ = new PlanRunner(this);

    auto* planSide = new QSplitter(Qt::Vertical, this);
    planSide->addWidget(planView_);
    planSide->addWidget(strip_);
    planSide->setStretchFactor(0, 1);
    planSide->setStretchFactor(1, 0);
    auto* split = new QSplitter(Qt::Horizontal, this);
    split->addWidget(sketch_);
    split->addWidget(planSide);
    split->setStretchFactor(0, 1);
    split->setStretchFactor(1, 1);
    split->setSizes({640, 640});
    setCentralWidget(split);

    panel_ = new BriefPanel(doc_, this);
    auto* briefDock = new QDockWidget(tr("Brief"), this);
    briefDock->setObjectName(QStringLiteral("briefDock"));
    briefDock->setWidget(panel_);
    addDockWidget(Qt::BottomDockWidgetArea, briefDock);

    diagnostics_ = new QListWidget(this);
    diagnostics_->setObjectName(QStringLiteral("diagnostics"));
    diagnostics_->setWordWrap(true);
    diagnostics_->setToolTip(tr("What the live check found, what the plan on show does not meet and what would "
                                "meet it. Click an entry to select the rooms it names."));
    auto* diagDock = new QDockWidget(tr("Diagnostics"), this);
    diagDock->setObjectName(QStringLiteral("diagnosticsDock"));
    diagDock->setWidget(diagnostics_);
    addDockWidget(Qt::BottomDockWidgetArea, diagDock);
    schedule_ = new SchedulePanel(this);
    auto* scheduleDock = new QDockWidget(tr("Area schedule"), this);
    scheduleDock->setObjectName(QStringLiteral("scheduleDock"));
    scheduleDock->setWidget(schedule_);
    addDockWidget(Qt::BottomDockWidgetArea, scheduleDock);
    tabifyDockWidget(diagDock, scheduleDock);
    diagDock->raise();
    resizeDocks({briefDock, diagDock}, {760, 440}, Qt::Horizontal);
    resizeDocks({briefDock}, {290}, Qt::Vertical);

    connect(doc_, &Document::briefChanged, this, &MainWindow::briefChanged);
    connect(doc_, &Document::modifiedChanged, this, &MainWindow::updateTitle);
    connect(doc_, &Document::pathChanged, this, &MainWindow::updateTitle);
    connect(sketch_, &SketchView::addRoomRequested, this, &MainWindow::addRoomAt);
    connect(sketch_, &SketchView::roomActivated, panel_, &BriefPanel::editRoomName);
    connect(sketch_, &SketchView::renameRequested, this, &MainWindow::renameRoom);
    connect(sketch_, &SketchView::message, this, &MainWindow::status);
    connect(panel_, &BriefPanel::message, this, &MainWindow::status);
    connect(sketch_, &SketchView::selectionChangedByUser, this,
            [this](const QStringList& r, const QList<int>& a) { syncSelection(r, a, sketch_); });
    connect(panel_, &BriefPanel::selectionChangedByUser, this,
            [this](const QStringList& r, const QList<int>& a) { syncSelection(r, a, panel_); });
    connect(diagnostics_, &QListWidget::itemClicked, this, &MainWindow::diagnosticClicked);

    checkTimer_.setSingleShot(true);
    checkTimer_.setInterval(options_.checkDelayMs);
    connect(&checkTimer_, &QTimer::timeout, this, &MainWindow::startCheck);
    connect(&checker_, &QFutureWatcher<LiveCheck>::finished, this, &MainWindow::checkReady);
    planTimer_.setSingleShot(true);
    planTimer_.setInterval(options_.planDelayMs);
    connect(&planTimer_, &QTimer::timeout, this, &MainWindow::startPlanning);
    connect(runner_, &PlanRunner::variantFound, this, &MainWindow::variantFound);
    connect(runner_, &PlanRunner::finished, this, &MainWindow::planFinished);
    connect(runner_, &PlanRunner::progress, this, [this](int permille, const QString& step) {
        strip_->setProgress(permille, step, true);
        statusBar()->showMessage(tr("Computing variants… %1 % (%2)").arg(permille / 10).arg(step));
    });
    connect(runner_, &PlanRunner::stopped, this, [this] {
        strip_->setProgress(0, QString(), false);
        status(tr("Stopped: %n variant(s) found so far.", nullptr, int(variants_.size())));
    });
    connect(strip_, &VariantsStrip::cancelRequested, this, [this] {
        planTimer_.stop();
        runner_->cancel();
    });
    connect(strip_, &VariantsStrip::variantChosen, this, [this](const QString& key) {
        chooseVariant(key);
        chosenByPlanner_ = true;
    });
    connect(strip_, &VariantsStrip::pinRequested, this, [this](const QString& key, bool pin) {
        Brief b = doc_->brief();
        setVariantPinned(b, key.toStdString(), pin);
        doc_->edit(pin ? tr("Pin variant") : tr("Unpin variant"), b);
    });
    connect(strip_, &VariantsStrip::hideRequested, this, [this](const QString& key, bool hide) {
        Brief b = doc_->brief();
        setVariantHidden(b, key.toStdString(), hide);
        doc_->edit(hide ? tr("Hide variant") : tr("Show variant"), b);
    });
    connect(planView_, &PlanView::wallMoved, this, &MainWindow::wallMoved);
    connect(planView_, &PlanView::targetDragged, this, &MainWindow::targetDragged);
    connect(planView_, &PlanView::lockToggled, this, [this](int room) {
        if (!locked_.erase(room)) locked_.insert(room);
        planView_->setLockedRooms(locked_);
    });
    connect(planView_, &PlanView::roomHovered, this, &MainWindow::hoverRoom);
    connect(sketch_, &SketchView::roomHovered, this, &MainWindow::hoverRoom);
    connect(panel_, &BriefPanel::roomHovered, this, &MainWindow::hoverRoom);
    if (options_.autosaveSeconds > 0) {
        autosaveTimer_.setInterval(options_.autosaveSeconds * 1000);
        connect(&autosaveTimer_, &QTimer::timeout, this, &MainWindow::autosaveNow);
        autosaveTimer_.start();
    }

    buildActions();
    statusBar()->showMessage(tr("Ready"));
    updateTitle();
    resize(1280, 820);
}

MainWindow::~MainWindow() {
    // Background work holds copies of the brief only; wait so nothing
    // reports to a window that is gone.
    checker_.waitForFinished();
}

const Brief& MainWindow::brief() const { return doc_->brief(); }

void MainWindow::buildActions() {
    auto make = [this](const QString& text, const char* name, const QString& tip, auto slot) {
        auto* a = new QAction(text, this);
        a->setObjectName(QString::fromLatin1(name));
        a->setToolTip(tip);
        a->setStatusTip(tip);
        connect(a, &QAction::triggered, this, slot);
        return a;
    };

    QMenu* file = menuBar()->addMenu(tr("&File"));
    QAction* newA = make(tr("&New"), "newAction", tr("Start an empty brief"), [this] {
        if (maybeSave()) newProject();
    });
    newA->setShortcut(QKeySequence::New);
    QAction* openA = make(tr("&Open…"), "openAction", tr("Open a brief (*.abut.json)"), [this] { openDialog(); });
    openA->setShortcut(QKeySequence::Open);
    recentMenu_ = new QMenu(tr("Open &Recent"), this);
    connect(recentMenu_, &QMenu::aboutToShow, this, &MainWindow::fillRecentMenu);
    QAction* saveA = make(tr("&Save"), "saveAction", tr("Save the brief"), [this] { save(); });
    saveA->setShortcut(QKeySequence::Save);
    QAction* saveAsA = make(tr("Save &As…"), "saveAsAction", tr("Save the brief under a new name"), [this] { saveAs(); });
    saveAsA->setShortcut(QKeySequence::SaveAs);
    QAction* importA = make(tr("&Import CSV…"), "importAction",
                            tr("Add rooms from a room list, or adjacencies from a matrix, kept in a spreadsheet"),
                            [this] { importDialog(); });
    importA->setShortcut(QKeySequence(Qt::CTRL | Qt::SHIFT | Qt::Key_I));
    QAction* exportA = make(tr("&Export Plan…"), "exportAction",
                            tr("Write the plan on show as PDF sheet, DXF, SVG, PNG or area schedule CSV"),
                            [this] { exportDialog(); });
    exportA->setShortcut(QKeySequence(Qt::CTRL | Qt::Key_E));
    QAction* printA = make(tr("&Print Sheet…"), "printAction", tr("Print the plan on show as a sheet with its area schedule"),
                           [this] { printSheet(); });
    printA->setShortcut(QKeySequence::Print);
    QAction* quitA = make(tr("&Quit"), "quitAction", tr("Close Abut"), [this] { close(); });
    quitA->setShortcut(QKeySequence::Quit);
    file->addActions({newA, openA});
    file->addMenu(recentMenu_);
    file->addSeparator();
    file->addActions({saveA, saveAsA});
    file->addSeparator();
    file->addAction(importA);
    file->addActions({exportA, printA});
    file->addSeparator();
    file->addAction(quitA);

    QMenu* edit = menuBar()->addMenu(tr("&Edit"));
    QAction* undoA = doc_->undoStack()->createUndoAction(this, tr("&Undo"));
    undoA->setShortcut(QKeySequence::Undo);
    undoA->setObjectName(QStringLiteral("undoAction"));
    QAction* redoA = doc_->undoStack()->createRedoAction(this, tr("&Redo"));
    redoA->setShortcut(QKeySequence::Redo);
    redoA->setObjectName(QStringLiteral("redoAction"));
    QAction* addA = make(tr("&Add Room"), "addRoomAction", tr("Add a room at the centre of the sketch (or double-click the sketch)"),
                         [this] { addRoomAt(sketch_->centreInSketch()); });
    addA->setShortcut(QKeySequence(Qt::Key_Insert));
    addA->setIcon(style()->standardIcon(QStyle::SP_FileDialogNewFolder));
    QAction* connectA = new QAction(tr("&Connect Rooms"), this);
    connectA->setObjectName(QStringLiteral("connectAction"));
    connectA->setCheckable(true);
    connectA->setShortcut(QKeySequence(Qt::Key_C));
    connectA->setShortcutContext(Qt::WidgetShortcut);
    connectA->setToolTip(tr("Drag from one room to another to make them adjacent (C)"));
    connect(connectA, &QAction::toggled, sketch_, &SketchView::setConnectMode);
    connect(sketch_, &SketchView::connectModeChanged, connectA, &QAction::setChecked);
    QAction* kindA = make(tr("Door ↔ &Wall"), "kindAction", tr("Switch the selected adjacencies between door and wall (K)"),
                          [this] { toggleKind(); });
    kindA->setShortcut(QKeySequence(Qt::Key_K));
    kindA->setShortcutContext(Qt::WidgetShortcut);
    QAction* priorityA = make(tr("Must ↔ &Should"), "priorityAction",
                              tr("Switch the selected adjacencies between must and should (P)"), [this] { togglePriority(); });
    priorityA->setShortcut(QKeySequence(Qt::Key_P));
    priorityA->setShortcutContext(Qt::WidgetShortcut);
    QAction* deleteA = make(tr("&Delete"), "deleteAction", tr("Delete the selected rooms and adjacencies"),
                            [this] { deleteSelection(); });
    deleteA->setShortcut(QKeySequence::Delete);
    deleteA->setShortcutContext(Qt::WidgetShortcut);
    QAction* selectAllA = make(tr("Select &All"), "selectAllAction", tr("Select every room and adjacency in the sketch"), [this] {
        QStringList ids;
        for (const Room& r : brief().rooms) ids << QString::fromStdString(r.id);
        QList<int> adj;
        for (int i = 0; i < int(brief().adjacencies.size()); ++i) adj << i;
        sketch_->selectItems(ids, adj);
        syncSelection(ids, adj, sketch_);
    });
    selectAllA->setShortcut(QKeySequence::SelectAll);
    selectAllA->setShortcutContext(Qt::WidgetShortcut);
    edit->addActions({undoA, redoA});
    edit->addSeparator();
    edit->addActions({addA, connectA, kindA, priorityA, deleteA, selectAllA});
    // Shortcuts of single keys work in the sketch only, not while typing in the table.
    sketch_->addActions({connectA, kindA, priorityA, deleteA, selectAllA});

    QMenu* view = menuBar()->addMenu(tr("&View"));
    QAction* tidyA = make(tr("&Tidy Up Sketch"), "tidyAction",
                          tr("Redraw the sketch without crossing lines (undoable)"), [this] { tidyUp(); });
    tidyA->setShortcut(QKeySequence(Qt::CTRL | Qt::Key_T));
    QAction* fitA = make(tr("&Fit Sketch"), "fitAction", tr("Show the whole sketch"), [this] { sketch_->fitAll(); });
    fitA->setShortcut(QKeySequence(Qt::CTRL | Qt::Key_0));
    QAction* zoomInA = make(tr("Zoom &In"), "zoomInAction", tr("Zoom into the sketch"), [this] { sketch_->zoomBy(1.25); });
    zoomInA->setShortcut(QKeySequence::ZoomIn);
    QAction* zoomOutA = make(tr("Zoom &Out"), "zoomOutAction", tr("Zoom out of the sketch"), [this] { sketch_->zoomBy(0.8); });
    zoomOutA->setShortcut(QKeySequence::ZoomOut);
    view->addActions({tidyA, fitA, zoomInA, zoomOutA});
    view->addSeparator();
    QAction* dimsA = make(tr("Show &Dimensions"), "dimensionsAction", tr("Write each room's width and depth on the plan"),
                          [this](bool on) { planView_->setShowDimensions(on); });
    dimsA->setCheckable(true);
    dimsA->setShortcut(QKeySequence(Qt::CTRL | Qt::SHIFT | Qt::Key_D));
    view->addAction(dimsA);
    QMenu* grid = view->addMenu(tr("Planning &Grid"));
    auto* gridGroup = new QActionGroup(this);
    for (double g : {0.0, 0.3, 0.6, 1.2}) {
        QAction* a = grid->addAction(g == 0 ? tr("None") : tr("%1 (walls snap while dragged)").arg(g));
        a->setCheckable(true);
        a->setChecked(g == 0);
        gridGroup->addAction(a);
        connect(a, &QAction::triggered, this, [this, g] { planView_->setGrid(g); });
    }

    QMenu* help = menuBar()->addMenu(tr("&Help"));
    help->addAction(tr("&About Abut"), this, &MainWindow::showAbout);

    QToolBar* tools = addToolBar(tr("Sketch"));
    tools->setObjectName(QStringLiteral("sketchToolBar"));
    tools->setToolButtonStyle(Qt::ToolButtonTextOnly);
    tools->addActions({undoA, redoA});
    tools->addSeparator();
    tools->addActions({addA, connectA, kindA, priorityA, deleteA});
    tools->addSeparator();
    tools->addActions({tidyA, fitA});

    // Right-click menu of the sketch.
    auto* sep = new QAction(this);
    sep->setSeparator(true);
    sketch_->addActions({sep, tidyA});
}

void MainWindow::updateTitle() {
    setWindowTitle(tr("%1[*] — Abut").arg(displayName(doc_->path())));
    setWindowModified(doc_->isModified());
}

void MainWindow::status(const QString& text) { statusBar()->showMessage(text, 8000); }

bool MainWindow::openProject(const QString& path, QStringList* errors) {
    const LoadResult r = loadProject(path.toStdString());
    if (!r.ok()) {
        QStringList lines;
        for (const FileError& e : r.errors) lines << QString::fromStdString(e.toString());
        if (errors) *errors = lines;
        else QMessageBox::warning(this, tr("Cannot open brief"), lines.join(QLatin1Char('\n')));
        return false;
    }
    Brief b = r.brief;
    // Rooms a hand-written file left without a position get one; this is
    // not an edit of the planner's, so the document stays unmodified.
    placeUnsketchedRooms(b);
    doc_->reset(b, QFileInfo(path).absoluteFilePath());
    recovery_->discard();
    autosavedRevision_ = doc_->revision();
    sketch_->fitAll();
    rememberRecent(QFileInfo(path).absoluteFilePath());
    status(tr("Opened %1: %n room(s)", nullptr, int(b.rooms.size())).arg(displayName(path)));
    return true;
}

void MainWindow::newProject() {
    doc_->reset(Brief{}, QString());
    recovery_->discard();
    autosavedRevision_ = doc_->revision();
    planView_->showMessage(tr("Add rooms and adjacencies to see plans."));
    status(tr("New brief: double-click the sketch to add a room."));
}

bool MainWindow::saveTo(const QString& path, QString* error) {
    const SaveResult r = saveProject(doc_->brief(), path.toStdString());
    if (!r.ok) {
        const QString msg = tr("Could not save %1: %2. The previous file, if any, is unchanged.")
                                .arg(path, QString::fromStdString(r.message));
        if (error) *error = msg;
        else QMessageBox::warning(this, tr("Cannot save"), msg);
        return false;
    }
    doc_->markSaved(QFileInfo(path).absoluteFilePath());
    recovery_->discard();
    autosavedRevision_ = doc_->revision();
    rememberRecent(QFileInfo(path).absoluteFilePath());
    status(tr("Saved %1").arg(displayName(path)));
    return true;
}

bool MainWindow::save() { return doc_->path().isEmpty() ? saveAs() : saveTo(doc_->path()); }

bool MainWindow::saveAs() {
    QString p = QFileDialog::getSaveFileName(this, tr("Save brief"), doc_->path(), tr("Abut briefs (*.abut.json)"));
    if (p.isEmpty()) return false;
    if (!p.endsWith(QStringLiteral(".abut.json"))) p += QStringLiteral(".abut.json");
    return saveTo(p);
}

void MainWindow::openDialog() {
    if (!maybeSave()) return;
    const QString p = QFileDialog::getOpenFileName(this, tr("Open brief"), QFileInfo(doc_->path()).path(),
                                                   tr("Abut briefs (*.abut.json);;All files (*)"));
    if (!p.isEmpty()) openProject(p);
}

bool MainWindow::importCsv(const QString& path, QStringList* errors) {
    const CsvImportResult r = importCsvFile(path.toStdString(), doc_->brief());
    if (!r.ok()) {
        QStringList lines;
        for (const FileError& e : r.errors) lines << QString::fromStdString(e.toString());
        if (errors) *errors = lines;
        else QMessageBox::warning(this, tr("Cannot import"), tr("Nothing was imported.\n\n") + lines.join(QLatin1Char('\n')));
        return false;
    }
    doc_->edit(r.layout == CsvLayout::RoomList ? tr("Import room list") : tr("Import adjacency matrix"), r.brief);
    QStringList notes;
    for (const std::string& n : r.notes) notes << QString::fromStdString(n);
    status(notes.join(QLatin1Char(' ')));
    sketch_->fitAll();
    return true;
}

void MainWindow::importDialog() {
    const QString p = QFileDialog::getOpenFileName(this, tr("Import room list or adjacency matrix"),
                                                   QFileInfo(doc_->path()).path(), tr("CSV files (*.csv *.txt)"));
    if (!p.isEmpty()) importCsv(p);
}

bool MainWindow::maybeSave() {
    if (!doc_->isModified()) return true;
    const auto answer = ask(tr("Unsaved changes"),
                            tr("%1 has changes that are not saved. Save them?").arg(displayName(doc_->path())),
                            QMessageBox::Save | QMessageBox::Discard | QMessageBox::Cancel);
    if (answer == QMessageBox::Save) return save();
    return answer == QMessageBox::Discard;
}

void MainWindow::closeEvent(QCloseEvent* event) {
    if (!maybeSave()) {
        event->ignore();
        return;
    }
    recovery_->discard();
    event->accept();
}

void MainWindow::rememberRecent(const QString& path) {
    QSettings settings;
    QStringList recent = settings.value(QLatin1String(recentKey)).toStringList();
    recent.removeAll(path);
    recent.prepend(path);
    while (recent.size() > maxRecent) recent.removeLast();
    settings.setValue(QLatin1String(recentKey), recent);
}

void MainWindow::fillRecentMenu() {
    recentMenu_->clear();
    const QStringList recent = QSettings().value(QLatin1String(recentKey)).toStringList();
    for (const QString& p : recent) {
        QAction* a = recentMenu_->addAction(displayName(p), this, [this, p] {
            if (maybeSave()) openProject(p);
        });
        a->setToolTip(p);
        a->setEnabled(QFileInfo::exists(p));
    }
    if (recent.isEmpty()) recentMenu_->addAction(tr("(none yet)"))->setEnabled(false);
}

bool MainWindow::autosaveNow() {
    if (!doc_->isModified() || doc_->revision() == autosavedRevision_) return false;
    QString message;
    if (!recovery_->autosave(doc_->brief(), doc_->path(), &message)) {
        status(tr("Autosave failed: %1").arg(message));
        return false;
    }
    autosavedRevision_ = doc_->revision();
    return true;
}

bool MainWindow::offerRecovery() {
    const QList<Recovery::Orphan> orphans = recovery_->orphans();
    for (const Recovery::Orphan& o : orphans) {
        const QString what = o.originalPath.isEmpty() ? tr("an untitled brief") : displayName(o.originalPath);
        const auto answer = ask(tr("Recover unsaved work"),
                                tr("Abut ended without closing while you were editing %1. Changes were autosaved "
                                   "at %2. Restore them?\n\nNo discards the autosave; Cancel keeps it for later.")
                                    .arg(what, QLocale().toString(o.saved, QLocale::ShortFormat)),
                                QMessageBox::Yes | QMessageBox::No | QMessageBox::Cancel);
        if (answer == QMessageBox::Cancel) continue;
        if (answer == QMessageBox::No) {
            Recovery::removeOrphan(o);
            continue;
        }
        const LoadResult r = loadProject(o.file.toStdString());
        if (!r.ok()) {
            status(tr("The autosave could not be read: %1").arg(QString::fromStdString(r.errors.front().toString())));
            continue;
        }
        doc_->reset(r.brief, o.originalPath, /*restored=*/true);
        Recovery::removeOrphan(o);
        autosavedRevision_ = 0;
        autosaveNow(); // the restored work is this session's now
        sketch_->fitAll();
        status(tr("Restored the autosave of %1. Save it to keep it.").arg(what));
        return true;
    }
    return false;
}

namespace {

// The same rooms, adjacencies, facade wishes and units: the current variant
// still fits and only needs re-sizing.
bool sameStructure(const Brief& a, const Brief& b) {
    if (a.units != b.units || a.rooms.size() != b.rooms.size() || a.adjacencies.size() != b.adjacencies.size())
        return false;
    for (std::size_t i = 0; i < a.rooms.size(); ++i)
        if (a.rooms[i].id != b.rooms[i].id || !(a.rooms[i].facade == b.rooms[i].facade)) return false;
    for (std::size_t i = 0; i < a.adjacencies.size(); ++i) {
        const Adjacency &x = a.adjacencies[i], &y = b.adjacencies[i];
        if (x.a != y.a || x.b != y.b || x.kind != y.kind || x.priority != y.priority) return false;
    }
    return true;
}

// Only the planner's choices among variants differ: no need to plan again.
bool onlyChoicesDiffer(const Brief& a, const Brief& b) {
    Brief x = a, y = b;
    x.pinnedVariants.clear();
    x.hiddenVariants.clear();
    y.pinnedVariants.clear();
    y.hiddenVariants.clear();
    return serializeProject(x) == serializeProject(y);
}

// The numbers sizing reads are the same (targets, widths, aspects, footprint, door wall).
bool sameSizes(const Brief& a, const Brief& b) {
    if (a.doorWidth != b.doorWidth || !(a.effectiveFootprint() == b.effectiveFootprint())) return false;
    for (std::size_t i = 0; i < a.rooms.size() && i < b.rooms.size(); ++i)
        if (a.rooms[i].area != b.rooms[i].area || a.rooms[i].minWidth != b.rooms[i].minWidth ||
            a.rooms[i].maxAspect != b.rooms[i].maxAspect)
            return false;
    return a.rooms.size() == b.rooms.size();
}

double twoDecimals(double v) { return std::round(v * 100.0) / 100.0; }

} // namespace

void MainWindow::briefChanged() {
    checkTimer_.start();
    const Brief& b = doc_->brief();
    const bool choicesOnly = haveCurrent_ && onlyChoicesDiffer(planBrief_, b);
    if (haveCurrent_ && !currentStale_ && sameStructure(planBrief_, b)) {
        // A moved bubble or a renamed room leaves the sizes alone.
        if (keepLayoutOnce_ || !sameSizes(planBrief_, b)) {
            resizeCurrent();
        } else {
            planBrief_ = b;
            showCurrent(); // names and categories as typed
        }
    } else if (haveCurrent_) {
        currentStale_ = true;
    }
    keepLayoutOnce_ = false;
    if (choicesOnly) {
        planBrief_ = b;
        strip_->setVariants(b, planFootprint_, variants_);
        strip_->selectKey(QString::fromStdString(variantKey(planBrief_, current_)));
        return;
    }
    if (b.rooms.empty()) {
        planTimer_.stop();
        runner_->cancel();
        haveCurrent_ = false;
        variants_.clear();
        strip_->setVariants(b, b.effectiveFootprint(), variants_);
        schedule_->clear();
        planView_->showMessage(tr("Add rooms and adjacencies to see plans."));
        return;
    }
    planTimer_.start();
}

bool MainWindow::planning() const { return runner_->busy() || planTimer_.isActive(); }

void MainWindow::resizeCurrent() {
    const Brief b = plannedBrief(doc_->brief());
    const Footprint fp = b.effectiveFootprint();
    SizingOptions o = planSizingOptions(b);
    o.lockedRooms.assign(locked_.begin(), locked_.end());
    const SizingProblem problem(b, current_.extended, current_.labeling, fp, o);
    const SizingResult start = problem.stateOf(vertexRects(current_));
    SizingResult r;
    if (keepLayoutOnce_) r = start; // a drag already placed every wall
    else if (fp == planFootprint_) r = problem.solve(&start);
    else r = problem.solve();
    current_ = applySizing(b, fp, current_, r);
    planBrief_ = b;
    planFootprint_ = fp;
    showCurrent();
}

void MainWindow::startCheck() {
    if (checker_.isRunning()) {
        checkTimer_.start(); // one at a time; try again when it is done
        return;
    }
    const Brief brief = doc_->brief();
    const quint64 revision = doc_->revision();
    checker_.setFuture(QtConcurrent::run([brief, revision] { return runLiveCheck(brief, revision); }));
}

void MainWindow::checkReady() {
    LiveCheck c = checker_.result();
    if (c.revision != doc_->revision()) return; // stale: a newer check is queued
    check_ = std::move(c);
    sketch_->setMarks(check_.marks);
    showDiagnostics();
}

void MainWindow::showDiagnostics() {
    diagnostics_->clear();
    std::vector<Diagnostic> all = check_.diagnostics;
    // The plan on show: what it does not meet, and what would meet it.
    if (haveCurrent_ && current_.rooms.size() == planBrief_.rooms.size() && planBrief_.rooms.size() == brief().rooms.size()) {
        // The check's notes name what the plan on show gives up, not what the check's own graph did.
        if (planBrief_.adjacencies.size() == brief().adjacencies.size()) reconcileDiagnostics(brief(), current_, all);
        for (const UnmetItem& u : unmetRequirements(planBrief_, planFootprint_, current_)) {
            QString text = tr("Not met in the plan on show: %1").arg(QString::fromStdString(u.text));
            const std::vector<std::string> held = heldBy(u, current_.relaxations);
            QStringList heldList;
            for (const std::string& h : held) heldList << QString::fromStdString(h);
            if (!heldList.isEmpty()) text += tr(" \u2014 held there by %1").arg(heldList.join(QStringLiteral("; ")));
            Diagnostic d{Severity::Warning, "unmet", text.toStdString(), u.rooms, {}};
            if (u.adjacency >= 0) d.adjacencies = {u.adjacency};
            all.push_back(d);
        }
        // The rooms a relaxation changes (a room's field, an adjacency's two rooms).
        auto relaxationRooms = [&](const Relaxation& r) {
            std::vector<int> rooms;
            int k = -1;
            if (std::sscanf(r.field.c_str(), "/rooms/%d", &k) == 1 && k >= 0 && k < int(planBrief_.rooms.size()))
                rooms.push_back(k);
            else if (std::sscanf(r.field.c_str(), "/adjacencies/%d", &k) == 1 && k >= 0 &&
                     k < int(planBrief_.adjacencies.size()))
                for (const std::string& id : {planBrief_.adjacencies[k].a, planBrief_.adjacencies[k].b})
                    if (const int i = planBrief_.roomIndex(id); i >= 0) rooms.push_back(i);
            return rooms;
        };
        for (const Relaxation& r : current_.relaxations)
            all.push_back({Severity::Info, "relaxation",
                           tr("Would meet \u201c%1\u201d%3: %2")
                               .arg(QString::fromStdString(r.meets.front()), QString::fromStdString(r.text),
                                    r.meets.size() > 1 ? tr(" and %n more", nullptr, int(r.meets.size() - 1)) : QString())
                               .toStdString(),
                           relaxationRooms(r), {}});
    }
    for (const Diagnostic& d : all) {
        const QString prefix = d.severity == Severity::Error     ? tr("Problem: ")
                               : d.severity == Severity::Warning ? tr("Warning: ")
                                                                 : QString();
        auto* item = new QListWidgetItem(prefix + QString::fromStdString(d.message), diagnostics_);
        item->setToolTip(QString::fromStdString(d.message));
        QStringList rooms;
        for (int r : d.rooms)
            if (r >= 0 && r < int(brief().rooms.size())) rooms << QString::fromStdString(brief().rooms[r].id);
        QList<int> adj(d.adjacencies.begin(), d.adjacencies.end());
        item->setData(Qt::UserRole, rooms);
        item->setData(Qt::UserRole + 1, QVariant::fromValue(adj));
        item->setIcon(style()->standardIcon(d.severity == Severity::Error     ? QStyle::SP_MessageBoxCritical
                                            : d.severity == Severity::Warning ? QStyle::SP_MessageBoxWarning
                                                                              : QStyle::SP_MessageBoxInformation));
    }
}

void MainWindow::diagnosticClicked(QListWidgetItem* item) {
    const QStringList rooms = item->data(Qt::UserRole).toStringList();
    const QList<int> adj = item->data(Qt::UserRole + 1).value<QList<int>>();
    sketch_->selectItems(rooms, adj);
    panel_->selectItems(rooms, adj);
}

void MainWindow::syncSelection(const QStringList& rooms, const QList<int>& adjacencies, QObject* from) {
    if (syncing_) return;
    syncing_ = true;
    if (from != sketch_) sketch_->selectItems(rooms, adjacencies);
    if (from != panel_) panel_->selectItems(rooms, adjacencies);
    syncing_ = false;
}

void MainWindow::startPlanning() {
    if (doc_->brief().rooms.empty()) return;
    variants_.clear();
    strip_->setProgress(0, tr("starting"), true);
    if (!haveCurrent_) planView_->showMessage(tr("Computing plans…"));
    // A newer brief cancels the computation under way (PlanRunner).
    runner_->start(doc_->brief(), doc_->revision());
}

void MainWindow::variantFound(const PlanVariant& v, quint64 revision) {
    if (revision != doc_->revision()) return;
    // The same arrangement found again (improved, or from another graph): keep the better one.
    const Brief& brief = doc_->brief();
    const std::string key = variantKey(brief, v);
    auto same = std::find_if(variants_.begin(), variants_.end(),
                             [&](const PlanVariant& o) { return variantKey(brief, o) == key; });
    if (same == variants_.end()) variants_.push_back(v);
    else if (v.score < same->score) *same = v;
    else return;
    const Brief& b = doc_->brief();
    rankVariants(b, b.effectiveFootprint(), variants_);
    for (std::size_t i = 0; i < variants_.size(); ++i) variants_[i].rank = int(i) + 1;
    strip_->setVariants(b, b.effectiveFootprint(), variants_);
    if (!haveCurrent_ || currentStale_) chooseVariant(QString::fromStdString(variantKey(b, variants_.front())));
    else strip_->selectKey(QString::fromStdString(variantKey(planBrief_, current_)));
}

void MainWindow::planFinished(const Plan& plan, quint64 revision) {
    if (revision != doc_->revision()) return;
    strip_->setProgress(1000, QString(), false);
    variants_ = plan.variants;
    const Brief& b = doc_->brief();
    strip_->setVariants(b, plan.footprint, variants_);
    status(QString::fromStdString(plan.summary));
    if (variants_.empty()) {
        haveCurrent_ = false;
        schedule_->clear();
        planView_->showMessage(QString::fromStdString(plan.summary));
        return;
    }
    const QString currentKey = haveCurrent_ ? QString::fromStdString(variantKey(planBrief_, current_)) : QString();
    if (!haveCurrent_ || currentStale_ || !chosenByPlanner_) {
        // The best variant the planner has not set aside; pinned ones first.
        const QStringList shown = strip_->shownKeys();
        chooseVariant(shown.isEmpty() ? QString::fromStdString(variantKey(b, variants_.front())) : shown.front());
    } else {
        strip_->selectKey(currentKey);
    }
}

void MainWindow::chooseVariant(const QString& key) {
    const Brief& b = doc_->brief();
    for (const PlanVariant& v : variants_) {
        if (QString::fromStdString(variantKey(b, v)) != key) continue;
        current_ = v;
        haveCurrent_ = true;
        currentStale_ = false;
        chosenByPlanner_ = false;
        planBrief_ = b;
        planFootprint_ = b.effectiveFootprint();
        locked_.clear();
        planView_->setLockedRooms(locked_);
        showCurrent();
        return;
    }
}

void MainWindow::showCurrent() {
    planView_->setVariant(planBrief_, planFootprint_, current_);
    schedule_->setVariant(planBrief_, planFootprint_, current_);
    strip_->selectKey(QString::fromStdString(variantKey(planBrief_, current_)));
    showDiagnostics();
}

void MainWindow::wallMoved(const PlanVariant& resized, const QString& description) {
    // The rooms beside the wall take their new areas as targets: the brief
    // says what the plan now shows, and one undo puts both back.
    Brief b = doc_->brief();
    for (std::size_t i = 0; i < b.rooms.size() && i < resized.rooms.size(); ++i)
        if (std::abs(resized.rooms[i].area() - current_.rooms[i].area()) > 1e-9)
            b.rooms[i].area = twoDecimals(resized.rooms[i].area());
    current_ = resized;
    chosenByPlanner_ = true; // a hand-sized plan stays on show when new variants arrive
    keepLayoutOnce_ = true;
    doc_->edit(description, b);
    if (keepLayoutOnce_) { // nothing in the brief changed (a spare space moved)
        keepLayoutOnce_ = false;
        showCurrent();
    }
}

void MainWindow::targetDragged(int room, double area, const PlanVariant& resized) {
    Brief b = doc_->brief();
    if (room < 0 || room >= int(b.rooms.size())) return;
    b.rooms[room].area = twoDecimals(area);
    current_ = resized;
    chosenByPlanner_ = true;
    keepLayoutOnce_ = true;
    doc_->edit(tr("Change target area of %1").arg(QString::fromStdString(b.rooms[room].displayName())), b);
    keepLayoutOnce_ = false;
}

void MainWindow::hoverRoom(const QString& id) {
    sketch_->setHoverRoom(id);
    panel_->setHoverRoom(id);
    planView_->setHighlightedRoom(id);
}

bool MainWindow::exportCurrent(const QString& path, QString* error) {
    if (!haveCurrent_) {
        if (error) *error = tr("There is no plan to export yet.");
        return false;
    }
    Plan plan;
    plan.units = planBrief_.units;
    plan.footprint = planFootprint_;
    plan.variants = {current_};
    render::ExportOptions o;
    o.sheet.project = doc_->path().isEmpty() ? tr("Untitled") : QFileInfo(doc_->path()).completeBaseName().section(QLatin1Char('.'), 0, 0);
    o.sheet.variantRank = current_.rank;
    return render::exportVariant(path, planBrief_, plan, current_, o, error);
}

void MainWindow::exportDialog() {
    if (!haveCurrent_) {
        status(tr("There is no plan to export yet."));
        return;
    }
    const QString base = doc_->path().isEmpty() ? QStringLiteral("plan") : QFileInfo(doc_->path()).path() + QLatin1Char('/') +
                                                     QFileInfo(doc_->path()).completeBaseName().section(QLatin1Char('.'), 0, 0);
    const QString p = QFileDialog::getSaveFileName(
        this, tr("Export plan"), base + QStringLiteral(".pdf"),
        tr("PDF sheet (*.pdf);;DXF for CAD (*.dxf);;SVG drawing (*.svg);;PNG image (*.png);;Area schedule CSV (*.csv)"));
    if (p.isEmpty()) return;
    QString error;
    if (exportCurrent(p, &error)) status(tr("Exported %1").arg(QFileInfo(p).fileName()));
    else QMessageBox::warning(this, tr("Cannot export"), error);
}

void MainWindow::printSheet() {
    if (!haveCurrent_) {
        status(tr("There is no plan to print yet."));
        return;
    }
    QPrinter printer(QPrinter::HighResolution);
    printer.setPageSize(QPageSize(QPageSize::A3));
    printer.setPageOrientation(QPageLayout::Landscape);
    printer.setPageMargins(QMarginsF(0, 0, 0, 0), QPageLayout::Millimeter);
    QPrintDialog dialog(&printer, this);
    if (dialog.exec() != QDialog::Accepted) return;
    Plan plan;
    plan.units = planBrief_.units;
    plan.footprint = planFootprint_;
    plan.variants = {current_};
    render::SheetOptions o;
    o.project = displayName(doc_->path());
    o.variantRank = current_.rank;
    if (!render::paintSheet(printer, printer.resolution(), planBrief_, plan, current_, o))
        QMessageBox::warning(this, tr("Cannot print"), tr("The printer could not be started."));
}

void MainWindow::addRoomAt(const QPointF& sketchPos) {
    Brief b = doc_->brief();
    QString name;
    for (int k = int(b.rooms.size()) + 1;; ++k) {
        name = tr("Room %1").arg(k);
        bool taken = false;
        for (const Room& r : b.rooms) taken |= QString::fromStdString(r.displayName()) == name;
        if (!taken) break;
    }
    Room room;
    room.name = name.toStdString();
    room.id = freshRoomId(b, room.name);
    // A small room as a start: 12 m² or 130 ft² (about the same).
    room.area = b.units == "ft" ? 130.0 : 12.0;
    const EditResult r = addRoom(b, room, SketchPoint{sketchPos.x(), sketchPos.y()});
    if (!r.ok()) {
        status(QString::fromStdString(r.message));
        return;
    }
    const QString id = QString::fromStdString(room.id);
    // The name typed next belongs to the same undo step as the room.
    const QString key = QStringLiteral("add-room:") + id;
    doc_->edit(tr("Add room %1").arg(name), b, key);
    sketch_->selectItems({id}, {});
    panel_->selectItems({id}, {});
    sketch_->editRoomName(id, key);
    status(tr("Added %1: type its name, Enter to keep it; C draws adjacencies.").arg(name));
}

void MainWindow::renameRoom(const QString& id, const QString& name, const QString& mergeKey) {
    Brief b = doc_->brief();
    const int index = b.roomIndex(id.toStdString());
    if (index < 0) return;
    const EditResult r = setRoomField(b, index, RoomField::Name, name.toStdString());
    if (!r.ok()) {
        status(QString::fromStdString(r.message));
        return;
    }
    doc_->edit(tr("Rename room to %1").arg(name), b, mergeKey);
}

void MainWindow::deleteSelection() {
    const QStringList rooms = sketch_->selectedRooms();
    const QList<int> adj = sketch_->selectedAdjacencies();
    if (rooms.isEmpty() && adj.isEmpty()) return;
    Brief b = doc_->brief();
    removeAdjacencies(b, std::vector<int>(adj.begin(), adj.end()));
    std::vector<std::string> ids;
    for (const QString& id : rooms) ids.push_back(id.toStdString());
    removeRooms(b, ids);
    doc_->edit(rooms.isEmpty() ? tr("Delete %n adjacency(ies)", nullptr, int(adj.size()))
                               : tr("Delete %n room(s)", nullptr, int(rooms.size())),
               b);
}

void MainWindow::toggleKind() {
    toggleSelectedAdjacencies([](Adjacency& a, bool allFirst) {
        a.kind = allFirst ? AdjacencyKind::Wall : AdjacencyKind::Door;
    }, [](const Adjacency& a) { return a.kind == AdjacencyKind::Door; }, tr("Make walls"), tr("Make doors"));
}

void MainWindow::togglePriority() {
    toggleSelectedAdjacencies([](Adjacency& a, bool allFirst) {
        a.priority = allFirst ? Priority::Should : Priority::Must;
    }, [](const Adjacency& a) { return a.priority == Priority::Must; }, tr("Make should"), tr("Make must"));
}

// Door ↔ wall and must ↔ should: when every selected adjacency is the first
// kind they all switch to the second, otherwise all become the first.
void MainWindow::toggleSelectedAdjacencies(const std::function<void(Adjacency&, bool)>& set,
                                           const std::function<bool(const Adjacency&)>& isFirst,
                                           const QString& toSecond, const QString& toFirst) {
    const QList<int> adj = sketch_->selectedAdjacencies();
    if (adj.isEmpty()) {
        status(tr("Select one or more adjacency lines first."));
        return;
    }
    Brief b = doc_->brief();
    bool allFirst = true;
    for (int i : adj) allFirst = allFirst && isFirst(b.adjacencies[i]);
    for (int i : adj) set(b.adjacencies[i], allFirst);
    doc_->edit(allFirst ? toSecond : toFirst, b);
}

void MainWindow::tidyUp() {
    const TidyResult t = tidySketch(doc_->brief());
    if (t.status == TidyStatus::Empty) return;
    Brief b = doc_->brief();
    for (std::size_t i = 0; i < b.rooms.size(); ++i) setSketchPosition(b, b.rooms[i].id, t.positions[i]);
    doc_->edit(tr("Tidy up sketch"), b);
    sketch_->fitAll();
    if (t.status == TidyStatus::DrawnWithout)
        status(tr("The brief is not planar: %n adjacency line(s) still cross; see Diagnostics.", nullptr,
                  int(t.leftOut.size())));
    else
        status(tr("Sketch redrawn without crossings. Undo restores the previous drawing."));
}

void MainWindow::showAbout() {
    QMessageBox::about(
        this, tr("About Abut"),
        tr("<h3>Abut %1</h3><p>Rectangular floorplans from adjacency briefs.</p>"
           "<p><b>Caution.</b> %2</p>")
            .arg(QStringLiteral(ABUT_VERSION), QString::fromUtf8(safetyCaution)));
}

bool MainWindow::screenshot(const QString& path, double waitSeconds) {
    QElapsedTimer waited;
    waited.start();
    // Planning starts after a short delay; wait for it to start and end.
    while ((planning() || checking()) && waited.elapsed() < qint64(1000 * waitSeconds))
        QApplication::processEvents(QEventLoop::AllEvents, 50);
    QApplication::processEvents();
    sketch_->fitAll();
    return grab().save(path);
}

} // namespace abut::gui
