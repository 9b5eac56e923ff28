#include "main_window.h"

#include "caution.h"
#include "io/project_io.h"
#include "plan/plan_builder.h"
#include "plan_view.h"
#include "sketch_view.h"

#include <QtConcurrent/QtConcurrentRun>

#include <QApplication>
#include <QDockWidget>
#include <QFileDialog>
#include <QFileInfo>
#include <QHeaderView>
#include <QListWidget>
#include <QMenuBar>
#include <QMessageBox>
#include <QSplitter>
#include <QStatusBar>
#include <QTableWidget>

// Resources of a static library must be registered by name, outside any namespace.
static void initAbutResources() { Q_INIT_RESOURCE(abut); }

namespace abut::gui {

MainWindow::MainWindow(QWidget* parent) : QMainWindow(parent) {
    initAbutResources();
    setWindowIcon(QIcon(QStringLiteral(":/icons/abut.svg")));
    sketch_ = new SketchView(this);

    planView_ = new PlanView(this);
    planView_->showMessage(tr("Open a brief to see its plans."));
    connect(&planner_, &QFutureWatcher<Plan>::finished, this, &MainWindow::planReady);

    auto* split = new QSplitter(Qt::Horizontal, this);
    split->addWidget(sketch_);
    split->addWidget(planView_);
    split->setStretchFactor(0, 1);
    split->setStretchFactor(1, 1);
    split->setSizes({640, 640});
    setCentralWidget(split);

    roomTable_ = new QTableWidget(this);
    roomTable_->setColumnCount(6);
    roomTable_->setHorizontalHeaderLabels(
        {tr("Room"), tr("Category"), tr("Target area"), tr("Min width"), tr("Max aspect"),
         tr("Facade")});
    roomTable_->horizontalHeader()->setSectionResizeMode(QHeaderView::ResizeToContents);
    roomTable_->horizontalHeader()->setStretchLastSection(true);
    roomTable_->verticalHeader()->hide();
    roomTable_->setEditTriggers(QAbstractItemView::NoEditTriggers);
    auto* briefDock = new QDockWidget(tr("Brief"), this);
    briefDock->setObjectName(QStringLiteral("briefDock"));
    briefDock->setWidget(roomTable_);
    addDockWidget(Qt::BottomDockWidgetArea, briefDock);

    diagnostics_ = new QListWidget(this);
    auto* diagDock = new QDockWidget(tr("Diagnostics"), this);
    diagDock->setObjectName(QStringLiteral("diagnosticsDock"));
    diagDock->setWidget(diagnostics_);
    addDockWidget(Qt::BottomDockWidgetArea, diagDock);

    buildMenus();
    statusBar()->showMessage(tr("Ready"));
    setWindowTitle(tr("Untitled — Abut"));
    resize(1280, 800);
}

void MainWindow::buildMenus() {
    QMenu* file = menuBar()->addMenu(tr("&File"));
    file->addAction(tr("&Open…"), QKeySequence::Open, this, [this] {
        const QString p = QFileDialog::getOpenFileName(this, tr("Open brief"), QString(),
                                                       tr("Abut projects (*.abut.json)"));
        if (!p.isEmpty()) openProject(p);
    });
    file->addSeparator();
    file->addAction(tr("&Quit"), QKeySequence::Quit, qApp, &QApplication::closeAllWindows);
    QMenu* view = menuBar()->addMenu(tr("&View"));
    view->addAction(tr("&Fit sketch"), this, [this] { sketch_->fitAll(); });
    QMenu* help = menuBar()->addMenu(tr("&Help"));
    help->addAction(tr("&About Abut"), this, &MainWindow::showAbout);
}

bool MainWindow::openProject(const QString& path, QStringList* errors) {
    const LoadResult r = loadProject(path.toStdString());
    if (!r.ok()) {
        QStringList lines;
        for (const FileError& e : r.errors) lines << QString::fromStdString(e.toString());
        if (errors) *errors = lines;
        else QMessageBox::warning(this, tr("Cannot open brief"), lines.join(QLatin1Char('\n')));
        return false;
    }
    brief_ = r.brief;
    path_ = path;
    setWindowTitle(tr("%1 — Abut").arg(QFileInfo(path).fileName()));
    refreshViews();
    statusBar()->showMessage(tr("Opened %1: %n room(s)", nullptr, int(brief_.rooms.size()))
                                 .arg(QFileInfo(path).fileName()));
    return true;
}

void MainWindow::refreshViews() {
    sketch_->showBrief(brief_);
    sketch_->fitAll();
    roomTable_->setRowCount(static_cast<int>(brief_.rooms.size()));
    const QString u = QString::fromStdString(brief_.units);
    const QString u2 = u + QChar(0x00B2); // m², ft²
    for (int i = 0; i < roomTable_->rowCount(); ++i) {
        const Room& room = brief_.rooms[i];
        QString facade;
        if (room.facade.anySide) facade = tr("any");
        for (Side s : allSides)
            if (room.facade.has(s)) facade += QLatin1Char(sideLetter(s));
        const QStringList cells{
            QString::fromStdString(room.displayName()), QString::fromStdString(room.category),
            tr("%1 %2").arg(room.area, 0, 'f', 1).arg(u2),
            room.minWidth ? tr("%1 %2").arg(*room.minWidth, 0, 'f', 2).arg(u) : QString(),
            room.maxAspect ? QString::number(*room.maxAspect, 'f', 1) : QString(), facade};
        for (int c = 0; c < cells.size(); ++c)
            roomTable_->setItem(i, c, new QTableWidgetItem(cells[c]));
    }
    startPlanning();
    diagnostics_->clear();
    diagnostics_->addItem(tr("%n room(s), %1 adjacencies; target area %2 %3", nullptr,
                             int(brief_.rooms.size()))
                              .arg(brief_.adjacencies.size())
                              .arg(brief_.totalTargetArea(), 0, 'f', 1)
                              .arg(u2));
}

void MainWindow::startPlanning() {
    // Plans are computed off the UI thread; the window stays responsive.
    planView_->showMessage(tr("Computing plans…"));
    statusBar()->showMessage(tr("Computing plans…"));
    const Brief brief = brief_;
    planner_.setFuture(QtConcurrent::run([brief] { return buildPlan(brief); }));
}

void MainWindow::planReady() {
    plan_ = planner_.result();
    for (const Diagnostic& d : plan_.diagnostics) {
        if (d.code == "added-contact") continue;
        auto* item = new QListWidgetItem(QString::fromStdString(d.message), diagnostics_);
        item->setToolTip(item->text());
    }
    if (plan_.variants.empty()) {
        planView_->showMessage(QString::fromStdString(plan_.summary));
    } else {
        planView_->showPlan(brief_, plan_, 0);
    }
    statusBar()->showMessage(QString::fromStdString(plan_.summary));
}

void MainWindow::showAbout() {
    QMessageBox::about(
        this, tr("About Abut"),
        tr("<h3>Abut %1</h3><p>Rectangular floorplans from adjacency briefs.</p>"
           "<p><b>Caution.</b> %2</p>")
            .arg(QStringLiteral(ABUT_VERSION), QString::fromUtf8(safetyCaution)));
}

} // namespace abut::gui
