// SPDX-License-Identifier: MIT
// The window's files: open, save, import, recent files, autosave and
// recovery, export and printing of the variant on show.
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

namespace {

constexpr int maxRecent = 8;
const char* recentKey = "recentFiles";

QString displayName(const QString& path) {
    return path.isEmpty() ? QObject::tr("Untitled") : QFileInfo(path).fileName();
}

} // namespace

void MainWindow::updateTitle() {
    setWindowTitle(tr("%1[*] — Abut").arg(displayName(doc_->path())));
    setWindowModified(doc_->isModified());
}


bool MainWindow::openProject(const QString& path, QStringList* errors) {
    removeStaleTemporaries(QFileInfo(path).absolutePath().toStdString()); // a save stopped hard last time
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

bool MainWindow::exportCurrent(const QString& path, QString* error) {
    if (!session_->hasCurrent()) {
        if (error) *error = tr("There is no plan to export yet.");
        return false;
    }
    const Plan plan = session_->currentAsPlan();
    const PlanVariant& current = session_->current();
    render::ExportOptions o;
    o.sheet.project = doc_->path().isEmpty() ? tr("Untitled") : QFileInfo(doc_->path()).completeBaseName().section(QLatin1Char('.'), 0, 0);
    o.sheet.variantRank = current.rank;
    return render::exportVariant(path, session_->plannedFor(), plan, current, o, error);
}

void MainWindow::exportDialog() {
    if (!session_->hasCurrent()) {
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
    if (!session_->hasCurrent()) {
        status(tr("There is no plan to print yet."));
        return;
    }
    QPrinter printer(QPrinter::HighResolution);
    printer.setPageSize(QPageSize(QPageSize::A3));
    printer.setPageOrientation(QPageLayout::Landscape);
    printer.setPageMargins(QMarginsF(0, 0, 0, 0), QPageLayout::Millimeter);
    QPrintDialog dialog(&printer, this);
    if (dialog.exec() != QDialog::Accepted) return;
    const Plan plan = session_->currentAsPlan();
    const PlanVariant& current = session_->current();
    render::SheetOptions o;
    o.project = displayName(doc_->path());
    o.variantRank = current.rank;
    if (!render::paintSheet(printer, printer.resolution(), session_->plannedFor(), plan, current, o))
        QMessageBox::warning(this, tr("Cannot print"), tr("The printer could not be started."));
}

} // namespace abut::gui
