// SPDX-License-Identifier: MIT
#include "main_window.h"

#include "plan/relaxations.h"
#include "plan/unmet.h"

#include "brief/brief_edit.h"
#include "brief_panel.h"
#include "caution.h"
#include "document.h"
#include "embed/straight_line_drawing.h"
#include "io/atomic_file.h"
#include "io/csv_import.h"
#include "io/project_io.h"
#include "plan/plan_builder.h"
#include "plan/variant_key.h"
#include "plan_runner.h"
#include "plan_session.h"
#include "plan_view.h"
#include "schedule_panel.h"
#include "export_plan.h"
#include "variants_strip.h"
#include "recovery.h"
#include "sketch_view.h"

#include <QtConcurrent/QtConcurrentRun>

#include <cstdio>

#include <QAction>
#include <QBuffer>
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
    session_ = new PlanSession(this);

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
        status(tr("Stopped: %n variant(s) found so far.", nullptr, int(session_->variants().size())));
    });
    connect(strip_, &VariantsStrip::cancelRequested, this, [this] {
        planTimer_.stop();
        runner_->cancel();
    });
    connect(strip_, &VariantsStrip::variantChosen, this,
            [this](const QString& key) { session_->choose(brief(), key, true); });
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
    planView_->setSession(session_);
    connect(planView_, &PlanView::lockToggled, session_, &PlanSession::toggleLock);
    connect(planView_, &PlanView::cutoutDrawn, this, [this](const Placement& c) {
        Brief b = doc_->brief();
        if (!b.footprint) {
            statusBar()->showMessage(tr("Give the footprint a width and depth before cutting parts out of it."), 8000);
            return;
        }
        b.footprint->cutouts.push_back(c);
        if (const std::string problem = placementProblem(b); !problem.empty()) {
            statusBar()->showMessage(QString::fromStdString(problem), 8000);
            return;
        }
        doc_->edit(tr("Cut out %1 × %2").arg(c.width, 0, 'f', 2).arg(c.depth, 0, 'f', 2), b);
    });
    connect(planView_, &PlanView::fixToggled, this, [this](int room, std::optional<Placement> at) {
        Brief b = doc_->brief();
        if (room < 0 || room >= int(b.rooms.size())) return;
        const QString name = QString::fromStdString(b.rooms[room].displayName());
        const EditResult r = setRoomFixed(b, room, at);
        if (!r.ok()) {
            statusBar()->showMessage(QString::fromStdString(r.message), 8000);
            return;
        }
        doc_->edit(at ? tr("Fix %1 in place").arg(name) : tr("Free %1").arg(name), b);
    });
    connect(session_, &PlanSession::currentChanged, this, &MainWindow::showCurrent);
    connect(session_, &PlanSession::variantsChanged, this, &MainWindow::variantsChanged);
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

void MainWindow::status(const QString& text) { statusBar()->showMessage(text, 8000); }

void MainWindow::briefChanged() {
    checkTimer_.start();
    switch (session_->briefChanged(doc_->brief())) {
    case PlanSession::Next::Nothing: return;
    case PlanSession::Next::Clear:
        planTimer_.stop();
        runner_->cancel();
        schedule_->clear();
        planView_->showMessage(tr("Add rooms and adjacencies to see plans."));
        return;
    case PlanSession::Next::Plan: planTimer_.start(); return;
    }
}

bool MainWindow::hasCurrentVariant() const { return session_->hasCurrent(); }
const PlanVariant& MainWindow::currentVariant() const { return session_->current(); }
const std::vector<PlanVariant>& MainWindow::variants() const { return session_->variants(); }

bool MainWindow::planning() const { return runner_->busy() || planTimer_.isActive(); }

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
    const PlanVariant& current_ = session_->current();
    const Brief& planBrief_ = session_->plannedFor();
    if (session_->hasCurrent() && current_.rooms.size() == planBrief_.rooms.size() &&
        planBrief_.rooms.size() == brief().rooms.size()) {
        // The check's notes name what the plan on show gives up, not what the check's own graph did.
        if (planBrief_.adjacencies.size() == brief().adjacencies.size()) reconcileDiagnostics(brief(), current_, all);
        for (const UnmetItem& u : unmetRequirements(planBrief_, session_->footprint(), current_)) {
            QString text = tr("Not met in the plan on show: %1").arg(QString::fromStdString(u.text));
            const std::vector<std::string> held = heldBy(u, current_.relaxations);
            QStringList heldList;
            for (const std::string& h : held) heldList << QString::fromStdString(h);
            if (!heldList.isEmpty()) text += tr(" \u2014 held there by %1").arg(heldList.join(QStringLiteral("; ")));
            Diagnostic d{Severity::Warning, DiagnosticCode::Unmet, text.toStdString(), u.rooms, {}};
            if (u.adjacency >= 0) d.adjacencies = {u.adjacency};
            all.push_back(d);
        }
        for (const Relaxation& r : current_.relaxations)
            all.push_back({Severity::Info, DiagnosticCode::Relaxation,
                           tr("Would meet \u201c%1\u201d%3: %2")
                               .arg(QString::fromStdString(r.meets.front()), QString::fromStdString(r.text),
                                    r.meets.size() > 1 ? tr(" and %n more", nullptr, int(r.meets.size() - 1)) : QString())
                               .toStdString(),
                           r.rooms, r.adjacency >= 0 ? std::vector<int>{r.adjacency} : std::vector<int>{}});
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
    session_->startComputation();
    strip_->setProgress(0, tr("starting"), true);
    if (!session_->hasCurrent()) planView_->showMessage(tr("Computing plans…"));
    // A newer brief cancels the computation under way (PlanRunner).
    runner_->start(doc_->brief(), doc_->revision());
}

void MainWindow::variantFound(const PlanVariant& v, quint64 revision) {
    if (revision == doc_->revision()) session_->variantFound(doc_->brief(), v);
}

void MainWindow::planFinished(const Plan& plan, quint64 revision) {
    if (revision != doc_->revision()) return;
    strip_->setProgress(1000, QString(), false);
    status(QString::fromStdString(plan.summary));
    if (session_->planFinished(plan)) {
        // The best variant the planner has not set aside; pinned ones first.
        const QStringList shown = strip_->shownKeys();
        session_->choose(brief(), shown.isEmpty() ? QString::fromStdString(variantKey(brief(), plan.variants.front()))
                                                  : shown.front(),
                         false);
    }
    if (!session_->hasCurrent()) {
        schedule_->clear();
        planView_->showMessage(QString::fromStdString(plan.summary));
    }
}

void MainWindow::variantsChanged() {
    strip_->setVariants(brief(), brief().effectiveFootprint(), session_->variants());
    if (session_->hasCurrent()) strip_->selectKey(session_->currentKey());
}

void MainWindow::showCurrent() {
    if (!session_->hasCurrent()) return;
    planView_->setVariant(session_->plannedFor(), session_->footprint(), session_->current());
    schedule_->setVariant(session_->plannedFor(), session_->footprint(), session_->current());
    strip_->selectKey(session_->currentKey());
    showDiagnostics();
}

void MainWindow::wallMoved(const PlanVariant& resized, const QString& description) {
    // The rooms beside the wall take their new areas as targets: the brief
    // says what the plan now shows, and one undo puts both back.
    doc_->edit(description, session_->handSized(doc_->brief(), resized));
    if (session_->takeWaitingLayout()) showCurrent(); // nothing in the brief changed (a spare space moved)
}

void MainWindow::targetDragged(int room, double area, const PlanVariant& resized) {
    if (room < 0 || room >= int(brief().rooms.size())) return;
    doc_->edit(tr("Change target area of %1").arg(QString::fromStdString(brief().rooms[room].displayName())),
               session_->handSized(doc_->brief(), resized, room, area));
    session_->takeWaitingLayout();
}

void MainWindow::hoverRoom(const QString& id) {
    sketch_->setHoverRoom(id);
    panel_->setHoverRoom(id);
    planView_->setHighlightedRoom(id);
}

bool MainWindow::screenshot(const QString& path, double waitSeconds, QString* message) {
    QElapsedTimer waited;
    waited.start();
    // Planning starts after a short delay; wait for it to start and end, at
    // most `waitSeconds`: then the planning is stopped and what is on show
    // goes in the picture.
    while ((planning() || checking()) && waited.elapsed() < qint64(1000 * waitSeconds))
        QApplication::processEvents(QEventLoop::AllEvents, 50);
    planTimer_.stop();
    runner_->cancel();
    QApplication::processEvents();
    sketch_->fitAll();
    // Encoded in memory, then written as every output is: a full disk keeps
    // the previous picture.
    QByteArray png;
    QBuffer buffer(&png);
    buffer.open(QIODevice::WriteOnly);
    if (!grab().save(&buffer, "PNG")) {
        if (message) *message = path + QStringLiteral(": the picture could not be encoded");
        return false;
    }
    const WriteResult w = writeFileAtomically(path.toStdString(), png.toStdString());
    if (!w.ok && message) *message = QString::fromStdString(w.message);
    return w.ok;
}

} // namespace abut::gui
