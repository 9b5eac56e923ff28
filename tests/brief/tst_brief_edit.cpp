// SPDX-License-Identifier: MIT
// Editing a brief, importing CSV, placing unsketched rooms (core side of the
// editor; the tidy-up drawing is tested with the embed stage, tests/embed).
#include "brief/brief_edit.h"
#include "embed/straight_line_drawing.h"
#include "io/csv_import.h"
#include "io/project_io.h"

#include "../support/random_briefs.h"

#include <QLineF>
#include <QtTest>

using namespace abut;

namespace {

Brief threeRooms() {
    Brief b;
    for (const char* id : {"hall", "kitchen", "study"}) {
        Room r;
        r.id = id;
        r.area = 10;
        addRoom(b, r, SketchPoint{double(b.rooms.size()) * 50, 0});
    }
    addAdjacency(b, {"hall", "kitchen", AdjacencyKind::Door, Priority::Must});
    return b;
}

} // namespace

class TestBriefEdit : public QObject {
    Q_OBJECT
private slots:
    void freshIds() {
        Brief b = threeRooms();
        QCOMPARE(freshRoomId(b, "Guest room"), std::string("guest-room"));
        QCOMPARE(freshRoomId(b, "Hall"), std::string("hall-2"));
        QCOMPARE(freshRoomId(b, "  ?? "), std::string("room"));
    }

    void addRoomRefusesDuplicatesAndBadAreas() {
        Brief b = threeRooms();
        Room r;
        r.id = "hall";
        r.area = 5;
        QVERIFY(!addRoom(b, r).ok());
        r.id = "porch";
        r.area = 0;
        const EditResult e = addRoom(b, r);
        QVERIFY(!e.ok());
        QVERIFY(QString::fromStdString(e.message).contains("greater than 0"));
        QCOMPARE(b.rooms.size(), std::size_t(3));
    }

    void removeRoomTakesItsAdjacenciesAndPosition() {
        Brief b = threeRooms();
        removeRooms(b, {"kitchen"});
        QCOMPARE(b.rooms.size(), std::size_t(2));
        QVERIFY(b.adjacencies.empty());
        QVERIFY(b.sketchPosition("kitchen") == nullptr);
        QVERIFY(b.sketchPosition("hall") != nullptr);
    }

    void addAdjacencyRefusals() {
        Brief b = threeRooms();
        QVERIFY(!addAdjacency(b, {"hall", "hall"}).ok());
        QVERIFY(!addAdjacency(b, {"kitchen", "hall"}).ok()); // already there, other order
        QVERIFY(!addAdjacency(b, {"hall", "attic"}).ok());
        QVERIFY(addAdjacency(b, {"hall", "study", AdjacencyKind::Wall, Priority::Should}).ok());
        QCOMPARE(adjacencyIndex(b, "study", "hall"), 1);
    }

    void roomFields_data() {
        QTest::addColumn<int>("field");
        QTest::addColumn<QString>("text");
        QTest::addColumn<bool>("accepted");
        QTest::addColumn<QString>("shown"); // the value afterwards, or a word of the message
        QTest::newRow("area") << int(RoomField::Area) << "12.5" << true << "12.5";
        QTest::newRow("area decimal comma and unit") << int(RoomField::Area) << "12,5 m²" << true << "12.5";
        QTest::newRow("area negative") << int(RoomField::Area) << "-3" << false << "greater than 0";
        QTest::newRow("area words") << int(RoomField::Area) << "big" << false << "must be a number";
        QTest::newRow("min width cleared") << int(RoomField::MinWidth) << "" << true << "";
        QTest::newRow("min width") << int(RoomField::MinWidth) << "2.4 m" << true << "2.4";
        QTest::newRow("aspect below 1") << int(RoomField::MaxAspect) << "0.5" << false << "at least 1";
        QTest::newRow("facade letters") << int(RoomField::Facade) << "s, n" << true << "NS";
        QTest::newRow("facade any") << int(RoomField::Facade) << "Any" << true << "any";
        QTest::newRow("facade wrong") << int(RoomField::Facade) << "NX" << false << "N, E, S, W";
    }
    void roomFields() {
        QFETCH(int, field);
        QFETCH(QString, text);
        QFETCH(bool, accepted);
        QFETCH(QString, shown);
        Brief b = threeRooms();
        b.rooms[0].minWidth = 3.0;
        const Brief before = b;
        const EditResult e = setRoomField(b, 0, RoomField(field), text.toStdString());
        QCOMPARE(e.ok(), accepted);
        if (!accepted) {
            QVERIFY2(QString::fromStdString(e.message).contains(shown), e.message.c_str());
            QCOMPARE(serializeProject(b), serializeProject(before)); // refused edits change nothing
            return;
        }
        const Room& r = b.rooms[0];
        QString value;
        switch (RoomField(field)) {
        case RoomField::Area: value = QString::number(r.area); break;
        case RoomField::MinWidth: value = r.minWidth ? QString::number(*r.minWidth) : QString(); break;
        case RoomField::MaxAspect: value = r.maxAspect ? QString::number(*r.maxAspect) : QString(); break;
        case RoomField::Facade: value = QString::fromStdString(facadeText(r.facade)); break;
        default: break;
        }
        QCOMPARE(value, shown);
    }

    void briefFields() {
        Brief b = threeRooms();
        QVERIFY(setBriefField(b, BriefField::FootprintWidth, "12").ok());
        QVERIFY(b.footprint.has_value());
        QCOMPARE(b.footprint->width, 12.0);
        QVERIFY(!setBriefField(b, BriefField::DoorWidth, "0").ok());
        QVERIFY(!setBriefField(b, BriefField::Units, "cubits").ok());
        QVERIFY(setBriefField(b, BriefField::FootprintDepth, "").ok());
        QVERIFY(!b.footprint.has_value());
    }

    void csvSplitting() {
        const auto rows = splitCsv("a;\"b;c\";\"say \"\"hi\"\"\"\r\n\r\n1;2;3\n", ';');
        QCOMPARE(rows.size(), std::size_t(2));
        QCOMPARE(rows[0].cells[1], std::string("b;c"));
        QCOMPARE(rows[0].cells[2], std::string("say \"hi\""));
        QCOMPARE(rows[1].line, 3);
    }

    void csvRoomList() {
        Brief b = threeRooms();
        const std::string text = "Name;Target area;Min width;Facade\n"
                                 "hall;14,5;1.2;S\n"
                                 "\"Guest room\";11;2.6;E\n";
        const CsvImportResult r = importCsv(text, "rooms.csv", b);
        QVERIFY2(r.ok(), r.errors.empty() ? "" : r.errors[0].toString().c_str());
        QCOMPARE(r.layout, CsvLayout::RoomList);
        QCOMPARE(r.brief.rooms.size(), std::size_t(4));
        QCOMPARE(r.brief.rooms[0].area, 14.5); // updated by id
        QCOMPARE(r.brief.rooms[3].id, std::string("guest-room"));
        QVERIFY(r.brief.rooms[3].facade.has(Side::E));
        QVERIFY(r.brief.sketchPosition("guest-room") != nullptr); // placed in the sketch
    }

    void csvSampleMatrix() {
        // The matrix shipped in samples/ into a brief that has none of its rooms.
        const CsvImportResult r = importCsvFile(ABUT_TEST_DATA "/csv/valid/office-matrix.csv", Brief{});
        QVERIFY2(r.ok(), r.errors.empty() ? "" : r.errors[0].toString().c_str());
        QCOMPARE(r.layout, CsvLayout::AdjacencyMatrix);
        QCOMPARE(r.brief.rooms.size(), std::size_t(8));
        QCOMPARE(r.brief.adjacencies.size(), std::size_t(11));
        const int rm = adjacencyIndex(r.brief, "reception", "meeting-room");
        QVERIFY(rm >= 0);
        QCOMPARE(r.brief.adjacencies[rm].kind, AdjacencyKind::Door);
        const int ro = adjacencyIndex(r.brief, "reception", "open-office");
        QCOMPARE(r.brief.adjacencies[ro].priority, Priority::Should);
        const int om = adjacencyIndex(r.brief, "open-office", "meeting-room");
        QCOMPARE(r.brief.adjacencies[om].kind, AdjacencyKind::Wall);
        QCOMPARE(r.brief.rooms[0].area, placeholderArea("m"));
        QVERIFY(!r.notes.empty());
    }

    // Found by fuzz_csv_import: a byte that is not UTF-8 in a header made a
    // room name that could not be written as JSON (the editor aborted on save).
    // Such files come from spreadsheets saved in a Windows code page; they are
    // now read as Latin-1.
    void csvLatin1NamesImported() {
        const CsvImportResult fuzz = importCsvFile(ABUT_TEST_DATA "/csv/valid/fuzz-latin1-header.csv", Brief{});
        QVERIFY(fuzz.ok());
        QVERIFY(parseProject(serializeProject(fuzz.brief), "again").ok());
        const CsvImportResult r = importCsvFile(ABUT_TEST_DATA "/csv/valid/latin1-room-list.csv", Brief{});
        QVERIFY(r.ok());
        QCOMPARE(QString::fromStdString(r.brief.rooms[0].name), QString::fromUtf8("Salle \u00e0 manger"));
        QCOMPARE(QString::fromStdString(r.brief.rooms[0].category), QString::fromUtf8("s\u00e9jour"));
        QVERIFY(QString::fromStdString(r.notes.front()).contains("Latin-1"));
        QVERIFY(parseProject(serializeProject(r.brief), "again").ok());
        // An encoded surrogate is not UTF-8 either.
        const CsvImportResult s = importCsvFile(ABUT_TEST_DATA "/csv/valid/surrogate-name.csv", Brief{});
        QVERIFY(s.ok());
        QVERIFY(parseProject(serializeProject(s.brief), "again").ok());
    }

    void csvInvalid_data() {
        QTest::addColumn<QString>("file");
        QTest::addColumn<QString>("expected");
        QTest::newRow("halves disagree") << "disagreeing-halves.csv" << "disagreeing-halves.csv:3: column 2 (A): the mark \"W\" disagrees with the other half of the matrix (line 2)";
        QTest::newRow("unknown mark") << "unknown-mark.csv" << "unknown-mark.csv:2: column 3 (B): unknown mark \"Q\"";
        QTest::newRow("negative area") << "negative-area.csv" << "negative-area.csv:3: column 2 (area): Target area must be greater than 0";
        QTest::newRow("huge area") << "huge-area.csv" << "huge-area.csv:2: column 2 (area): Target area must be at most 1e+08";
        QTest::newRow("control character in a list") << "control-character-list.csv" << "control-character-list.csv:3: column 1 (name): Name holds a control character";
        QTest::newRow("control character in a matrix") << "control-character-matrix.csv" << "control-character-matrix.csv:1: column 2: the room name holds a control character";
    }
    void csvInvalid() {
        QFETCH(QString, file);
        QFETCH(QString, expected);
        const Brief b = threeRooms();
        const CsvImportResult r = importCsvFile((ABUT_TEST_DATA "/csv/invalid/" + file).toStdString(), b);
        QVERIFY(!r.ok());
        QVERIFY(!r.errors.empty());
        const QString got = QString::fromStdString(r.errors[0].toString());
        QVERIFY2(got.contains(expected), qPrintable(got));
    }

    void placeUnsketched() {
        Brief b = threeRooms();
        Room r;
        r.id = "porch";
        r.area = 4;
        addRoom(b, r);
        placeUnsketchedRooms(b);
        QVERIFY(b.sketchPosition("porch") != nullptr);
        QVERIFY(b.sketchPosition("porch")->y < 0); // below the drawn rooms
    }
};

QTEST_GUILESS_MAIN(TestBriefEdit)
#include "tst_brief_edit.moc"
