// SPDX-License-Identifier: MIT
// The window's menus, toolbar and shortcuts, and the sketch edits they
// trigger (add, rename, delete, door/wall and must/should, tidy up, about).
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


namespace abut::gui {

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

} // namespace abut::gui
