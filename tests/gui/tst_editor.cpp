// SPDX-License-Identifier: MIT
// The editor's first screen driven as a planner would: mouse on the sketch's
// viewport, typing in the brief table, files, CSV import, live check and
// recovery. Runs offscreen.
#include "brief/brief_edit.h"
#include "brief_panel.h"
#include "document.h"
#include "io/project_io.h"
#include "gui_fixture.h"
#include "main_window.h"
#include "recovery.h"
#include "sketch_view.h"

#include <QLineEdit>
#include <QListWidget>
#include <QStatusBar>
#include <QTableWidget>
#include <QTemporaryDir>
#include <QtTest>

using namespace abut;
using namespace abut::gui;
using namespace abut::gui::testing;

namespace {

std::string text(const Brief& b) { return serializeProject(b); }

// Where a room is on screen, in viewport coordinates.
QPoint onScreen(MainWindow& w, const QString& id) {
    return w.sketchView()->mapFromScene(w.sketchView()->roomScenePos(id));
}

void drag(QWidget* viewport, QPoint from, QPoint to, int steps = 6) {
    QTest::mousePress(viewport, Qt::LeftButton, {}, from);
    for (int i = 1; i <= steps; ++i) QTest::mouseMove(viewport, from + (to - from) * i / steps);
    QTest::mouseRelease(viewport, Qt::LeftButton, {}, to);
}

Brief k5() {
    Brief b;
    const char* names[] = {"Hall", "Kitchen", "Dining", "Living", "Study"};
    for (int i = 0; i < 5; ++i) {
        Room r;
        r.name = names[i];
        r.id = freshRoomId(b, r.name);
        r.area = 12;
        addRoom(b, r, SketchPoint{100 * std::cos(i * 1.2566), 100 * std::sin(i * 1.2566)});
    }
    for (int i = 0; i < 5; ++i)
        for (int j = i + 1; j < 5; ++j) addAdjacency(b, {b.rooms[i].id, b.rooms[j].id});
    return b;
}

} // namespace

class TestEditor : public QObject {
    Q_OBJECT

    QTemporaryDir recoveryDir;
    // Plans are tested in tst_plans; these tests stay on the sketch and the brief.
    MainWindowOptions options() const { return testOptions(recoveryDir.path(), 60000); }

private slots:
    void initTestCase() {
        QStandardPaths::setTestModeEnabled(true); // recent files go to a test settings file
        QVERIFY(recoveryDir.isValid());
    }

    void addRoomsAndAdjacencyByMouse() {
        MainWindow w(options());
        w.resize(1200, 800);
        w.show();
        QVERIFY(QTest::qWaitForWindowExposed(&w));
        QWidget* vp = w.sketchView()->viewport();
        std::vector<std::string> states{text(w.brief())};

        QTest::mouseDClick(vp, Qt::LeftButton, {}, QPoint(150, 200));
        QCOMPARE(w.brief().rooms.size(), std::size_t(1));
        states.push_back(text(w.brief()));
        QTest::mouseDClick(vp, Qt::LeftButton, {}, QPoint(420, 260));
        QCOMPARE(w.brief().rooms.size(), std::size_t(2));
        states.push_back(text(w.brief()));
        const QString a = QString::fromStdString(w.brief().rooms[0].id);
        const QString b = QString::fromStdString(w.brief().rooms[1].id);

        // Connect mode by its key, then a drag from one room to the other.
        w.sketchView()->setFocus();
        QTest::keyClick(w.sketchView(), Qt::Key_C);
        QVERIFY(w.sketchView()->connectMode());
        drag(vp, onScreen(w, a), onScreen(w, b));
        QCOMPARE(w.brief().adjacencies.size(), std::size_t(1));
        QCOMPARE(adjacencyIndex(w.brief(), a.toStdString(), b.toStdString()), 0);
        QCOMPARE(w.brief().adjacencies[0].kind, AdjacencyKind::Door); // default: door, must
        states.push_back(text(w.brief()));
        // A second drag between the same rooms is refused, not duplicated.
        drag(vp, onScreen(w, b), onScreen(w, a));
        QCOMPARE(w.brief().adjacencies.size(), std::size_t(1));
        QTest::keyClick(w.sketchView(), Qt::Key_Escape);
        QVERIFY(!w.sketchView()->connectMode());

        // Undo walks back through every state exactly; redo forward again.
        QUndoStack* undo = w.document()->undoStack();
        QCOMPARE(undo->count(), 3);
        for (int k = int(states.size()) - 2; k >= 0; --k) {
            undo->undo();
            QCOMPARE(text(w.brief()), states[k]);
        }
        for (std::size_t k = 1; k < states.size(); ++k) {
            undo->redo();
            QCOMPARE(text(w.brief()), states[k]);
        }
        QVERIFY(w.isWindowModified());
        dropChangesSilently(w);
    }

    // A double-click puts the room where it was clicked and leaves the view
    // alone: the transform and the scroll position stay, so the next
    // double-click lands where the planner means it.
    void roomsStayWhereTheyArePut() {
        MainWindow w(options());
        w.resize(1200, 800);
        w.show();
        QVERIFY(QTest::qWaitForWindowExposed(&w));
        SketchView* view = w.sketchView();
        QWidget* vp = view->viewport();
        const QTransform before = view->viewportTransform();
        const QList<QPoint> clicks{QPoint(60, 50), QPoint(300, 120), QPoint(180, 330)};
        for (int k = 0; k < clicks.size(); ++k) {
            QTest::mouseDClick(vp, Qt::LeftButton, {}, clicks[k]);
            QCOMPARE(w.brief().rooms.size(), std::size_t(k + 1));
            QTest::keyClick(QApplication::focusWidget(), Qt::Key_Escape); // keep the default name
            QCOMPARE(view->viewportTransform(), before);
            const QPoint at = onScreen(w, QString::fromStdString(w.brief().rooms[k].id));
            QVERIFY2((at - clicks[k]).manhattanLength() <= 2,
                     qPrintable(QString("room %1 at (%2, %3)").arg(k).arg(at.x()).arg(at.y())));
        }
        // A 12 m² room is a modest bubble at the default zoom: under a fifth of
        // the view wide (its disc is 2 × 10·√(12/π) ≈ 39 sketch units across).
        QVERIFY(2 * 10 * std::sqrt(12 / M_PI) * view->transform().m11() < vp->width() / 5.0);
        dropChangesSilently(w);
    }

    // Typing right after the double-click names the room; the room and its
    // name are one undo step. F2 renames the selected room, one step more.
    void nameTypedInPlace() {
        MainWindow w(options());
        w.resize(1200, 800);
        w.show();
        QVERIFY(QTest::qWaitForWindowExposed(&w));
        QWidget* vp = w.sketchView()->viewport();
        QTest::mouseDClick(vp, Qt::LeftButton, {}, QPoint(200, 200));
        QVERIFY(w.sketchView()->editingName());
        QWidget* editor = QApplication::focusWidget();
        QVERIFY(qobject_cast<QLineEdit*>(editor));
        QTest::keyClicks(editor, QStringLiteral("Pantry"));
        QTest::keyClick(editor, Qt::Key_Return);
        QCOMPARE(w.brief().rooms.size(), std::size_t(1));
        QCOMPARE(w.brief().rooms[0].name, std::string("Pantry"));
        QUndoStack* undo = w.document()->undoStack();
        QCOMPARE(undo->count(), 1);
        // F2 on the selected room: a new name, its own step.
        const QString id = QString::fromStdString(w.brief().rooms[0].id);
        w.sketchView()->selectItems({id}, {});
        w.sketchView()->setFocus();
        QTest::keyClick(w.sketchView(), Qt::Key_F2);
        QVERIFY(w.sketchView()->editingName());
        editor = QApplication::focusWidget();
        QTest::keyClicks(editor, QStringLiteral("Larder"));
        QTest::keyClick(editor, Qt::Key_Return);
        QCOMPARE(w.brief().rooms[0].name, std::string("Larder"));
        QCOMPARE(undo->count(), 2);
        undo->undo();
        QCOMPARE(w.brief().rooms[0].name, std::string("Pantry"));
        undo->undo(); // one step removes the room with its name
        QVERIFY(w.brief().rooms.empty());
        // Esc keeps the default name; a control character is refused, the name kept.
        QTest::mouseDClick(vp, Qt::LeftButton, {}, QPoint(300, 260));
        QTest::keyClicks(QApplication::focusWidget(), QStringLiteral("Studio"));
        QTest::keyClick(QApplication::focusWidget(), Qt::Key_Escape);
        QCOMPARE(w.brief().rooms.size(), std::size_t(1));
        QCOMPARE(w.brief().rooms[0].name, std::string("Room 1"));
        QVERIFY(!w.sketchView()->editingName());
        dropChangesSilently(w);
    }

    void dragMovesRoomsInOneStep() {
        MainWindow w(options());
        w.resize(1200, 800);
        w.show();
        QVERIFY(QTest::qWaitForWindowExposed(&w));
        QVERIFY(w.openProject(ABUT_SAMPLES "/family-house.abut.json"));
        QVERIFY(!w.isWindowModified());
        const std::string before = text(w.brief());
        const Room& first = w.brief().rooms[0];
        const QString id = QString::fromStdString(first.id);
        const SketchPoint was = *w.brief().sketchPosition(first.id);
        const QPoint p = onScreen(w, id);
        drag(w.sketchView()->viewport(), p, p + QPoint(60, 25), 10);
        QCOMPARE(w.document()->undoStack()->count(), 1); // ten mouse moves, one step
        const SketchPoint now = *w.brief().sketchPosition(first.id);
        QVERIFY(now.x > was.x + 1);
        QVERIFY(now.y < was.y - 1); // screen down = south
        QVERIFY(w.isWindowModified());
        QVERIFY(w.windowTitle().contains(QStringLiteral("family-house.abut.json")));
        w.document()->undoStack()->undo();
        QCOMPARE(text(w.brief()), before);
        QVERIFY(!w.isWindowModified());
    }

    void kindPriorityAndDelete() {
        MainWindow w(options());
        w.show();
        w.document()->reset(k5(), QString());
        w.sketchView()->selectItems({}, {0, 1});
        w.toggleKind();
        QCOMPARE(w.brief().adjacencies[0].kind, AdjacencyKind::Wall);
        QCOMPARE(w.brief().adjacencies[1].kind, AdjacencyKind::Wall);
        w.togglePriority();
        QCOMPARE(w.brief().adjacencies[0].priority, Priority::Should);
        w.sketchView()->selectItems({QStringLiteral("hall")}, {});
        w.deleteSelection();
        QCOMPARE(w.brief().rooms.size(), std::size_t(4));
        QCOMPARE(w.brief().adjacencies.size(), std::size_t(6)); // K4 left
        QCOMPARE(w.document()->undoStack()->count(), 3);
        w.document()->undoStack()->undo();
        QCOMPARE(w.brief().rooms.size(), std::size_t(5));
        QCOMPARE(w.brief().adjacencies.size(), std::size_t(10));
        dropChangesSilently(w);
    }

    void tableRefusesBadValuesInPlace() {
        MainWindow w(options());
        w.show();
        QVERIFY(w.openProject(ABUT_SAMPLES "/family-house.abut.json"));
        QTableWidget* t = w.briefPanel()->roomTable();
        const std::string before = text(w.brief());
        t->item(0, BriefPanel::Area)->setText(QStringLiteral("-3"));
        QCOMPARE(text(w.brief()), before);
        QCOMPARE(t->item(0, BriefPanel::Area)->text(), QString::number(w.brief().rooms[0].area));
        QVERIFY2(w.statusBar()->currentMessage().contains(QStringLiteral("greater than 0")),
                 qPrintable(w.statusBar()->currentMessage()));
        QCOMPARE(w.document()->undoStack()->count(), 0);

        t->item(0, BriefPanel::Area)->setText(QStringLiteral("15,5"));
        QCOMPARE(w.brief().rooms[0].area, 15.5);
        QCOMPARE(w.document()->undoStack()->count(), 1);
        t->item(1, BriefPanel::Facade)->setText(QStringLiteral("n e"));
        QVERIFY(w.brief().rooms[1].facade.has(Side::N) && w.brief().rooms[1].facade.has(Side::E));
        QCOMPARE(t->item(1, BriefPanel::Facade)->text(), QStringLiteral("NE"));

        // The footprint field refuses in place as well.
        QLineEdit* width = w.briefPanel()->footprintWidth();
        const double widthBefore = w.brief().footprint->width;
        const int steps = w.document()->undoStack()->count();
        width->setText(QStringLiteral("wide"));
        emit width->editingFinished();
        QCOMPARE(w.brief().footprint->width, widthBefore);
        QCOMPARE(w.document()->undoStack()->count(), steps);
        QVERIFY(width->text() != QStringLiteral("wide"));

        // Table and sketch selection follow each other.
        t->selectRow(2);
        QCOMPARE(w.sketchView()->selectedRooms(), QStringList{QString::fromStdString(w.brief().rooms[2].id)});
        dropChangesSilently(w);
    }

    void saveOpenRoundTrip() {
        QTemporaryDir dir;
        const QString path = dir.filePath(QStringLiteral("house.abut.json"));
        std::string saved;
        {
            MainWindow w(options());
            QVERIFY(w.openProject(ABUT_SAMPLES "/family-house.abut.json"));
            w.addRoomAt(QPointF(10, 20));
            QVERIFY(w.isWindowModified());
            QVERIFY(w.saveTo(path));
            QVERIFY(!w.isWindowModified());
            QVERIFY(w.windowTitle().startsWith(QStringLiteral("house.abut.json")));
            saved = text(w.brief());
        }
        MainWindow w2(options());
        QStringList errors;
        QVERIFY2(w2.openProject(path, &errors), qPrintable(errors.join(QLatin1Char('\n'))));
        QCOMPARE(text(w2.brief()), saved);
        QCOMPARE(w2.document()->undoStack()->count(), 0);
    }

    void unsavedChangesPrompt() {
        MainWindow w(options());
        w.show();
        w.addRoomAt(QPointF(0, 0));
        int asked = 0;
        w.ask = [&](auto&&...) {
            ++asked;
            return QMessageBox::Cancel;
        };
        QVERIFY(!w.close()); // cancelled: the window stays, the work too
        QCOMPARE(asked, 1);
        QCOMPARE(w.brief().rooms.size(), std::size_t(1));
        w.ask = [&](auto&&...) {
            ++asked;
            return QMessageBox::Discard;
        };
        QVERIFY(w.close());
        QCOMPARE(asked, 2);
    }

    void csvImportSampleMatrix() {
        MainWindow w(options());
        QVERIFY(w.importCsv(ABUT_SAMPLES "/small-office-rooms.csv"));
        QCOMPARE(w.brief().rooms.size(), std::size_t(8));
        QVERIFY(w.importCsv(ABUT_SAMPLES "/small-office-matrix.csv"));
        QCOMPARE(w.brief().rooms.size(), std::size_t(8)); // matched by name
        QCOMPARE(w.brief().adjacencies.size(), std::size_t(11));
        QCOMPARE(w.brief().rooms[1].area, 48.0); // from the room list, kept
        QCOMPARE(w.document()->undoStack()->count(), 2);
        w.document()->undoStack()->undo();
        QVERIFY(w.brief().adjacencies.empty());

        QStringList errors;
        QVERIFY(!w.importCsv(ABUT_TEST_DATA "/csv/invalid/unknown-mark.csv", &errors));
        QVERIFY(!errors.isEmpty() && errors[0].contains(QStringLiteral("unknown-mark.csv:2")));
        QCOMPARE(w.document()->undoStack()->count(), 2); // nothing imported
        dropChangesSilently(w);
    }

    void nonPlanarSketchHighlightsWitness() {
        MainWindow w(options());
        w.show();
        w.document()->reset(k5(), QString());
        QTRY_VERIFY_WITH_TIMEOUT(!w.checking() && w.lastCheck().revision == w.document()->revision(), 10000);
        QListWidget* list = w.diagnosticsList();
        QListWidgetItem* witness = nullptr;
        int at = -1;
        for (int i = 0; i < int(w.lastCheck().diagnostics.size()); ++i)
            if (w.lastCheck().diagnostics[i].code == DiagnosticCode::NonPlanar) at = i;
        QVERIFY(at >= 0);
        witness = list->item(at);
        QVERIFY(witness->text().contains(QStringLiteral("K5")));
        // The witness is highlighted: all five rooms and the ten lines.
        QCOMPARE(w.sketchView()->marks().rooms.size(), std::size_t(5));
        QVERIFY(w.sketchView()->marks().adjacencies.size() >= 10);
        // Clicking the diagnostic selects its rooms.
        list->scrollToItem(witness);
        QTest::mouseClick(list->viewport(), Qt::LeftButton, {}, list->visualItemRect(witness).center());
        QCOMPARE(w.sketchView()->selectedRooms().size(), 5);

        // Tidy up cannot draw K5 without a crossing, and says so; undo restores the drawing.
        const std::string before = text(w.brief());
        w.tidyUp();
        QVERIFY(w.statusBar()->currentMessage().contains(QStringLiteral("not planar")));
        w.document()->undoStack()->undo();
        QCOMPARE(text(w.brief()), before);
    }

    void tidyUpRemovesCrossings() {
        MainWindow w(options());
        Brief b = k5();
        removeAdjacencies(b, {adjacencyIndex(b, "hall", "dining")}); // K5 minus an edge: planar
        // Draw it tangled: the rooms on a line in a bad order.
        for (std::size_t i = 0; i < b.rooms.size(); ++i)
            setSketchPosition(b, b.rooms[i].id, {double((i * 3) % 5) * 80, double(i % 2) * 30});
        w.document()->reset(b, QString());
        QTRY_VERIFY_WITH_TIMEOUT(!w.checking() && w.lastCheck().revision == w.document()->revision(), 10000);
        QVERIFY(!w.sketchView()->marks().crossings.empty());
        w.tidyUp();
        QTRY_VERIFY_WITH_TIMEOUT(!w.checking() && w.lastCheck().revision == w.document()->revision(), 10000);
        QVERIFY(w.sketchView()->marks().crossings.empty());
        dropChangesSilently(w);
    }

    void recoveryWrittenAndOffered() {
        QTemporaryDir folder;
        MainWindowOptions o = options();
        o.recoveryFolder = folder.path();
        std::string lost;
        QString recoveryFile;
        {
            MainWindow w(o);
            QVERIFY(w.openProject(ABUT_SAMPLES "/family-house.abut.json"));
            QVERIFY(!w.autosaveNow()); // nothing changed yet
            w.addRoomAt(QPointF(5, 5));
            QVERIFY(w.autosaveNow());
            recoveryFile = w.recovery()->file();
            QVERIFY(QFileInfo::exists(recoveryFile));
            const LoadResult r = loadProject(recoveryFile.toStdString());
            QVERIFY(r.ok());
            QCOMPARE(text(r.brief), text(w.brief()));
            lost = text(w.brief());
            // A second window in the same folder sees nothing to recover while this one runs.
            MainWindow other(o);
            QVERIFY(other.recovery()->orphans().isEmpty());
            w.recovery()->abandonForTests(); // what a crash leaves behind
            dropChangesSilently(w);
        }
        QVERIFY(QFileInfo::exists(recoveryFile));
        MainWindow w(o);
        QString asked;
        w.ask = [&](const QString&, const QString& question, QMessageBox::StandardButtons) {
            asked = question;
            return QMessageBox::Yes;
        };
        QVERIFY(w.offerRecovery());
        QVERIFY(asked.contains(QStringLiteral("family-house.abut.json")));
        QCOMPARE(text(w.brief()), lost);
        QVERIFY(w.isWindowModified()); // restored work is not saved yet
        QVERIFY(w.document()->path().endsWith(QStringLiteral("family-house.abut.json")));
        QVERIFY(!QFileInfo::exists(recoveryFile));
        QVERIFY(w.recovery()->orphans().isEmpty());
        dropChangesSilently(w);
    }
};

QTEST_MAIN(TestEditor)
#include "tst_editor.moc"
