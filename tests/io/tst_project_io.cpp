// SPDX-License-Identifier: MIT
// Project file reading and writing: every valid file loads, every invalid file
// is refused with its expected message, and load → save → load is stable.
#include "io/atomic_file.h"
#include "brief/footprint_check.h"
#include "detail/json_locate.h"
#include "io/extended_graph_io.h"
#include "io/project_io.h"

#include <QDir>
#include <QFile>
#include <QFileInfo>

#include <sys/stat.h>
#include <unistd.h>

#include <random>
#include <QTemporaryDir>
#include <nlohmann/json.hpp>

#include <QtTest>

using namespace abut;

namespace {

QString dataDir() { return QStringLiteral(ABUT_TEST_DATA "/project"); }

std::string readAll(const QString& path) {
    QFile f(path);
    if (!f.open(QIODevice::ReadOnly)) return {};
    return f.readAll().toStdString();
}

std::string joined(const std::vector<FileError>& errors) {
    std::string s;
    for (const FileError& e : errors) s += e.toString() + "\n";
    return s;
}

} // namespace

class TestProjectIo : public QObject {
    Q_OBJECT
private slots:
    void validFileLoads_data();
    void validFileLoads();
    void invalidFileRefused_data();
    void invalidFileRefused();
    void infeasibleBriefLoadsAndIsReported_data();
    void infeasibleBriefLoadsAndIsReported();
    void sampleLoads_data();
    void sampleLoads();
    void canonicalFileIsByteStable();
    void refusedIdReportedOnce();
    void longErrorListBounded();
    void unknownFieldsSurvive();
    void defaultsApplied();
    void failedSaveKeepsPreviousFile();
    void saveIntoMissingFolderFails();
    void unreadableFileNamed();
    void saveInterruptedAtEveryByte();
    void invalidExtendedGraphRefused_data();
    void invalidExtendedGraphRefused();
    void truncatedFileRefused();
    void corruptedFileRefusedOrIntact();
    void deepNestingRefusedWithoutCrash();
    void roomsNotAListIsOneError();
    void folderGivenAsProjectIsNamed();
    void specialOutputPaths();
    void exactFillIsNotOverTheFootprint();
    void facadeTooShortForItsRooms();
};

void TestProjectIo::validFileLoads_data() {
    QTest::addColumn<QString>("path");
    for (const QFileInfo& fi : QDir(dataDir() + "/valid").entryInfoList({"*.abut.json"}))
        QTest::newRow(qPrintable(fi.fileName())) << fi.absoluteFilePath();
}

void TestProjectIo::validFileLoads() {
    QFETCH(QString, path);
    const LoadResult r = loadProject(path.toStdString());
    QVERIFY2(r.ok(), joined(r.errors).c_str());
    // Save and load again: the brief must survive, and a second save must give
    // the same bytes as the first.
    const std::string once = serializeProject(r.brief);
    const LoadResult again = parseProject(once, "saved");
    QVERIFY2(again.ok(), joined(again.errors).c_str());
    QCOMPARE(serializeProject(again.brief), once);
    QCOMPARE(again.brief.surplus, r.brief.surplus);
}

void TestProjectIo::invalidFileRefused_data() {
    QTest::addColumn<QString>("path");
    QTest::addColumn<QString>("expected");
    const QDir dir(dataDir() + "/invalid");
    const auto files = dir.entryInfoList({"*.abut.json"});
    QVERIFY(files.size() >= 20);
    for (const QFileInfo& fi : files) {
        const QString expectPath = dir.filePath(fi.fileName().replace(".abut.json", ".expect"));
        QTest::newRow(qPrintable(fi.fileName()))
            << fi.absoluteFilePath() << QString::fromStdString(readAll(expectPath)).trimmed();
    }
}

void TestProjectIo::invalidFileRefused() {
    QFETCH(QString, path);
    QFETCH(QString, expected);
    QVERIFY2(!expected.isEmpty(), "every invalid file needs a .expect file beside it");
    const LoadResult r = loadProject(path.toStdString());
    QVERIFY(!r.ok());
    QVERIFY(!r.errors.empty());
    const QString first = QString::fromStdString(r.errors.front().toString());
    // One line, naming the file, containing the expected text.
    QVERIFY2(!first.contains('\n'), qPrintable(first));
    QVERIFY2(first.startsWith(path), qPrintable(first));
    QVERIFY2(first.contains(expected), qPrintable(first + "\n  expected: " + expected));
}

// Targets over the footprint or rooms wider than it: a valid file (the
// planner may be half-way through editing), reported by footprintProblems.
void TestProjectIo::infeasibleBriefLoadsAndIsReported_data() {
    QTest::addColumn<QString>("path");
    QTest::addColumn<QString>("expected");
    const QDir dir(dataDir() + "/infeasible");
    const auto files = dir.entryInfoList({"*.abut.json"});
    QVERIFY(files.size() >= 2);
    for (const QFileInfo& fi : files) {
        const QString expectPath = dir.filePath(fi.fileName().replace(".abut.json", ".expect"));
        QTest::newRow(qPrintable(fi.fileName()))
            << fi.absoluteFilePath() << QString::fromStdString(readAll(expectPath)).trimmed();
    }
}

void TestProjectIo::infeasibleBriefLoadsAndIsReported() {
    QFETCH(QString, path);
    QFETCH(QString, expected);
    const LoadResult r = loadProject(path.toStdString());
    QVERIFY2(r.ok(), joined(r.errors).c_str());
    const std::vector<Diagnostic> problems = footprintProblems(r.brief);
    QVERIFY(!problems.empty());
    QCOMPARE(problems.front().severity, Severity::Error);
    QVERIFY2(QString::fromStdString(problems.front().message).contains(expected),
             problems.front().message.c_str());
}

void TestProjectIo::sampleLoads_data() {
    QTest::addColumn<QString>("path");
    const auto samples = QDir(QStringLiteral(ABUT_SAMPLES)).entryInfoList({"*.abut.json"});
    QVERIFY(samples.size() >= 4);
    for (const QFileInfo& fi : samples)
        QTest::newRow(qPrintable(fi.fileName())) << fi.absoluteFilePath();
}

void TestProjectIo::sampleLoads() {
    QFETCH(QString, path);
    const LoadResult r = loadProject(path.toStdString());
    QVERIFY2(r.ok(), joined(r.errors).c_str());
    QVERIFY(r.brief.rooms.size() >= 4);
    QVERIFY(r.brief.footprint.has_value());
}

void TestProjectIo::canonicalFileIsByteStable() {
    // These files are written in the canonical layout: load → save gives them back.
    for (const char* name : {"minimal.abut.json", "unknown-fields.abut.json"}) {
        const QString path = dataDir() + "/valid/" + name;
        const LoadResult r = loadProject(path.toStdString());
        QVERIFY2(r.ok(), joined(r.errors).c_str());
        QCOMPARE(serializeProject(r.brief), readAll(path));
    }
}

void TestProjectIo::unknownFieldsSurvive() {
    const LoadResult r = loadProject((dataDir() + "/valid/unknown-fields.abut.json").toStdString());
    QVERIFY(r.ok());
    QCOMPARE(r.brief.units, std::string("ft"));
    QCOMPARE(r.brief.rooms[0].unknownFields.json().at("finish").get<std::string>(), std::string("oak floor"));
    QCOMPARE(r.brief.adjacencies[0].unknownFields.json().at("note").get<std::string>(),
             std::string("glazed screen"));
    QCOMPARE(r.brief.unknownFields.json().at("client").at("reference").get<std::string>(), std::string("demo-7"));
    // Cut-outs are read (formats.md), other footprint fields kept.
    QCOMPARE(r.brief.footprint->cutouts.size(), std::size_t(1));
    QVERIFY(r.brief.rooms[0].facade.anySide);
    QVERIFY(r.brief.rooms[1].facade.has(Side::N) && r.brief.rooms[1].facade.has(Side::W));
}

void TestProjectIo::defaultsApplied() {
    // Defaults from the format contract: kind door, priority must, units m, door 0.9.
    const LoadResult r = loadProject((dataDir() + "/valid/defaults.abut.json").toStdString());
    QVERIFY(r.ok());
    QCOMPARE(r.brief.units, std::string("m"));
    QCOMPARE(r.brief.doorWidth, 0.9);
    QCOMPARE(r.brief.adjacencies[0].kind, AdjacencyKind::Door);
    QCOMPARE(r.brief.adjacencies[0].priority, Priority::Must);
    QVERIFY(!r.brief.footprint);
    const Footprint fp = r.brief.effectiveFootprint();
    QVERIFY(qAbs(fp.width * fp.depth - 15.5) < 1e-9);
}

void TestProjectIo::failedSaveKeepsPreviousFile() {
    QTemporaryDir dir;
    const std::string path = dir.filePath("brief.abut.json").toStdString();
    const std::string previous = "previous contents\n";
    QVERIFY(writeFileAtomically(path, previous).ok);
    const std::string replacement(4096, 'x');
    for (std::size_t failAt : {std::size_t(0), std::size_t(1), std::size_t(2000), std::size_t(4095)}) {
        const WriteResult w = writeFileAtomically(path, replacement, WriteFault{failAt});
        QVERIFY(!w.ok);
        QVERIFY(QString::fromStdString(w.message).contains("previous file is unchanged"));
        QCOMPARE(readAll(QString::fromStdString(path)), previous);
    }
    // No temporary files are left behind.
    QCOMPARE(QDir(dir.path()).entryList(QDir::Files | QDir::Hidden).size(), 1);
    QVERIFY(writeFileAtomically(path, replacement).ok);
    QCOMPARE(readAll(QString::fromStdString(path)), replacement);
}

void TestProjectIo::saveIntoMissingFolderFails() {
    Brief b;
    const SaveResult s = saveProject(b, "/nonexistent-folder-for-abut/x.abut.json");
    QVERIFY(!s.ok);
    QVERIFY(QString::fromStdString(s.message).startsWith("/nonexistent-folder-for-abut/x.abut.json"));
}

void TestProjectIo::unreadableFileNamed() {
    const LoadResult r = loadProject("/no/such/brief.abut.json");
    QCOMPARE(r.status, LoadStatus::Unreadable);
    QVERIFY(QString::fromStdString(r.errors.front().toString()).startsWith("/no/such/brief.abut.json: cannot open"));
}

// Extended-graph files that must be refused with a located message; the
// first was found by fuzz_extended_graph_loader (a "format" that is a number
// threw out of the loader instead of being refused).
void TestProjectIo::invalidExtendedGraphRefused_data() {
    QTest::addColumn<QString>("path");
    QTest::addColumn<QString>("expected");
    const QDir dir(QStringLiteral(ABUT_TEST_DATA "/extended-invalid"));
    const auto files = dir.entryInfoList({"*.ext.json"});
    QVERIFY(!files.isEmpty());
    for (const QFileInfo& fi : files)
        QTest::newRow(qPrintable(fi.fileName()))
            << fi.absoluteFilePath()
            << QString::fromStdString(readAll(dir.filePath(fi.fileName().replace(".ext.json", ".expect")))).trimmed();
}

void TestProjectIo::invalidExtendedGraphRefused() {
    QFETCH(QString, path);
    QFETCH(QString, expected);
    const ExtendedGraphLoad r = loadExtendedGraph(path.toStdString());
    QVERIFY(!r.ok);
    QVERIFY2(QString::fromStdString(r.error).startsWith(path), r.error.c_str());
    QVERIFY2(QString::fromStdString(r.error).contains(expected), r.error.c_str());
}

// A project save that fails after any number of bytes (a full disk, a pulled
// cable) leaves the previous file exactly as it was.
void TestProjectIo::saveInterruptedAtEveryByte() {
    QTemporaryDir dir;
    const std::string path = dir.filePath("house.abut.json").toStdString();
    const LoadResult house = loadProject(ABUT_SAMPLES "/family-house.abut.json");
    QVERIFY(house.ok());
    const std::string previous = serializeProject(house.brief);
    QVERIFY(saveProject(house.brief, path).ok);
    Brief changed = house.brief;
    changed.rooms[0].area += 1;
    const std::string next = serializeProject(changed);
    for (std::size_t failAt = 0; failAt < next.size(); ++failAt) {
        const WriteResult w = writeFileAtomically(path, next, WriteFault{failAt});
        QVERIFY(!w.ok);
        if (readAll(QString::fromStdString(path)) != previous) QFAIL(qPrintable(QString("changed after a failure at byte %1").arg(failAt)));
    }
    QCOMPARE(QDir(dir.path()).entryList(QDir::Files | QDir::Hidden).size(), 1);
}

// Every truncation of every sample is refused with one located line naming
// the file, never loaded half-way and never a crash.
void TestProjectIo::truncatedFileRefused() {
    int refused = 0;
    for (const QFileInfo& fi : QDir(QStringLiteral(ABUT_SAMPLES)).entryInfoList({"*.abut.json"})) {
        const std::string text = readAll(fi.absoluteFilePath());
        // The last bytes are whitespace after the closing brace: cutting there still parses.
        const std::size_t end = text.find_last_of('}');
        for (std::size_t n = 0; n < end; ++n) {
            const LoadResult r = parseProject(text.substr(0, n), "cut.abut.json");
            QVERIFY2(!r.ok(), qPrintable(QString("%1 cut at %2 loaded").arg(fi.fileName()).arg(n)));
            QVERIFY(!r.errors.empty());
            const std::string line = r.errors.front().toString();
            QVERIFY2(line.rfind("cut.abut.json", 0) == 0 && line.find('\n') == std::string::npos, line.c_str());
            ++refused;
        }
    }
    QVERIFY(refused > 25000);
}

// Single bytes overwritten at random (seeded): the file is refused with a
// message, or it loads and saves back to text that loads to the same brief.
void TestProjectIo::corruptedFileRefusedOrIntact() {
    const std::string text = readAll(QStringLiteral(ABUT_SAMPLES "/clinic.abut.json"));
    std::mt19937 rng(404);
    int loaded = 0, refused = 0;
    for (int k = 0; k < 3000; ++k) {
        std::string bad = text;
        const std::size_t at = std::uniform_int_distribution<std::size_t>(0, bad.size() - 1)(rng);
        bad[at] = static_cast<char>(std::uniform_int_distribution<int>(0, 255)(rng));
        const LoadResult r = parseProject(bad, "bad.abut.json");
        if (!r.ok()) {
            QVERIFY(!r.errors.empty());
            ++refused;
            continue;
        }
        const std::string once = serializeProject(r.brief);
        const LoadResult again = parseProject(once, "again");
        QVERIFY(again.ok());
        QCOMPARE(serializeProject(again.brief), once);
        ++loaded;
    }
    QVERIFY(refused > 0 && loaded > 0); // both outcomes occur: the test sees both paths
}

// Nesting far deeper than any project (the recursive copy of unknown fields
// overflowed the stack at about 60,000 levels): refused before parsing, with
// the line named, and a 50 MB file of '[' costs no more than reading it.
void TestProjectIo::deepNestingRefusedWithoutCrash() {
    for (int depth : {101, 100000}) {
        const std::string text = "{\"format\": \"abut.project\", \"version\": 1, \"rooms\": [],\n\"x\": " +
                                 std::string(depth, '[') + std::string(depth, ']') + "}";
        const LoadResult r = parseProject(text, "deep.abut.json");
        QVERIFY(!r.ok());
        QCOMPARE(r.errors.size(), std::size_t(1));
        QCOMPARE(r.errors.front().line, 2);
        QVERIFY(QString::fromStdString(r.errors.front().message).contains("nested more than 100 levels"));
    }
    // 100 levels in an unknown field are kept and written back.
    const std::string ok = "{\"format\": \"abut.project\", \"version\": 1, \"rooms\": [], \"x\": " +
                           std::string(99, '[') + std::string(99, ']') + "}";
    QVERIFY(parseProject(ok, "ok.abut.json").ok());
    const std::string brackets(50u * 1024 * 1024, '[');
    QVERIFY(!parseProject(brackets, "brackets.abut.json").ok());
    // Brackets inside strings do not count.
    const std::string quoted = "{\"format\": \"abut.project\", \"version\": 1, \"rooms\": [], \"x\": \"" +
                               std::string(1000, '[') + "\"}";
    QVERIFY(parseProject(quoted, "quoted.abut.json").ok());
    QCOMPARE(detail::nestingTooDeep("[\"\\\"[[[\"]", 1), std::string_view::npos);
}

// "rooms" that is not a list: one error, not one per adjacency and sketch
// entry that names a room.
void TestProjectIo::roomsNotAListIsOneError() {
    const LoadResult r = loadProject((dataDir() + "/invalid/rooms-object.abut.json").toStdString());
    QVERIFY(!r.ok());
    QCOMPARE(r.errors.size(), std::size_t(1));
}

void TestProjectIo::folderGivenAsProjectIsNamed() {
    QTemporaryDir dir;
    const LoadResult r = loadProject(dir.path().toStdString());
    QCOMPARE(r.status, LoadStatus::Unreadable);
    QVERIFY2(QString::fromStdString(r.errors.front().toString()).contains("is a folder"),
             r.errors.front().toString().c_str());
}

// A symlink is followed (its target replaced, the link kept); a pipe or a
// folder is refused and left as it is. (Never tested on a device under /dev:
// a faulty build run as root would replace the device node.)
void TestProjectIo::specialOutputPaths() {
    QTemporaryDir dir;
    const QString target = dir.filePath("target.json"), link = dir.filePath("link.json");
    QVERIFY(writeFileAtomically(target.toStdString(), "old").ok);
    QVERIFY(QFile::link(QStringLiteral("target.json"), link)); // relative, as users make them
    QVERIFY(writeFileAtomically(link.toStdString(), "new").ok);
    QVERIFY(QFileInfo(link).isSymLink());
    QCOMPARE(readAll(target), std::string("new"));
    // A dangling link: its target is created.
    const QString dangling = dir.filePath("dangling.json");
    QVERIFY(QFile::link(QStringLiteral("made.json"), dangling));
    QVERIFY(writeFileAtomically(dangling.toStdString(), "made").ok);
    QVERIFY(QFileInfo(dangling).isSymLink());
    QCOMPARE(readAll(dir.filePath("made.json")), std::string("made"));
    // A pipe.
    const QString fifo = dir.filePath("pipe");
    QCOMPARE(::mkfifo(fifo.toLocal8Bit().constData(), 0600), 0);
    const WriteResult w = writeFileAtomically(fifo.toStdString(), "x");
    QVERIFY(!w.ok);
    QVERIFY2(QString::fromStdString(w.message).contains("not a regular file (a pipe)"), w.message.c_str());
    struct stat st {};
    QCOMPARE(::lstat(fifo.toLocal8Bit().constData(), &st), 0);
    QVERIFY(S_ISFIFO(st.st_mode));
    // A folder.
    QVERIFY(QDir(dir.path()).mkdir("sub"));
    QVERIFY(!writeFileAtomically(dir.filePath("sub").toStdString(), "x").ok);
    QVERIFY(QFileInfo(dir.filePath("sub")).isDir());
    // Nothing else was left behind (the temporary files are gone).
    QCOMPARE(QDir(dir.path()).entryList(QDir::Files | QDir::Hidden | QDir::System).size(), 5);
}

// Targets that add up to the footprint's area up to rounding (read off a
// tiling, rounded to 6 decimals) are not over the footprint.
void TestProjectIo::exactFillIsNotOverTheFootprint() {
    Brief b;
    b.footprint = Footprint{10.3, 11.103};
    const double total = 10.3 * 11.103;
    for (int i = 0; i < 7; ++i) {
        Room r;
        r.id = "r" + std::to_string(i);
        r.area = i < 6 ? 16.0 : total - 96.0;
        b.rooms.push_back(r);
    }
    b.rooms.back().area = std::nextafter(b.rooms.back().area, 1e9); // one ulp over
    QVERIFY(footprintProblems(b).empty());
    b.rooms.back().area += 1e-6 * total;
    QVERIFY(!footprintProblems(b).empty());
}

// Sixteen rooms of 2.7 m minimum width that wish the north facade alone need
// 16 × 2.7 = 43.2 m of it; a 40 m facade is 3.2 m short. Rooms that may take
// another side too do not count. (Arithmetic; the widths are common practice
// for small offices, no source.)
void TestProjectIo::facadeTooShortForItsRooms() {
    Brief b;
    b.footprint = Footprint{40, 18};
    for (int i = 0; i < 18; ++i) {
        Room r;
        r.id = "o" + std::to_string(i);
        r.area = 14;
        r.minWidth = 2.7;
        r.facade.add(i < 16 ? Side::N : Side::S);
        b.rooms.push_back(r);
    }
    auto shortFacade = [](const Brief& brief) {
        std::vector<Diagnostic> out;
        for (const Diagnostic& d : footprintProblems(brief))
            if (d.code == DiagnosticCode::FacadeTooShort) out.push_back(d);
        return out;
    };
    std::vector<Diagnostic> d = shortFacade(b);
    QCOMPARE(d.size(), std::size_t(1));
    QCOMPARE(d[0].severity, Severity::Warning);
    QCOMPARE(d[0].rooms.size(), std::size_t(16));
    const QString m = QString::fromStdString(d[0].message);
    QVERIFY2(m.contains("16 rooms that wish the north facade alone need 43.2 m") && m.contains("the facade is 40 m") &&
                 m.contains("lengthen it by 3.2 m"),
             qPrintable(m));
    b.rooms[15].facade.add(Side::E); // may take the east side too: 15 × 2.7 = 40.5 m
    d = shortFacade(b);
    QCOMPARE(d.size(), std::size_t(1));
    QVERIFY(QString::fromStdString(d[0].message).contains("lengthen it by 0.5 m"));
    b.rooms[14].facade.add(Side::E); // 14 × 2.7 = 37.8 m: fits
    QVERIFY(shortFacade(b).empty());
}

// A room id refused as written is reported there, not again by each
// adjacency naming it (it gave five lines for one cause).
void TestProjectIo::refusedIdReportedOnce() {
    std::string text = R"({"format": "abut.project", "version": 1, "units": "m", "rooms": [{"id": "a\u0007", "area": 9}, )"
                       R"({"id": "b", "area": 9}], "adjacencies": [)";
    for (int i = 0; i < 5; ++i) text += std::string(i ? ", " : "") + R"({"rooms": ["b", "a\u0007"], "kind": ")" + (i % 2 ? "door" : "wall") + "\"}";
    text += "]}";
    const LoadResult r = parseProject(text, "once.abut.json");
    QVERIFY(!r.ok());
    QCOMPARE(r.errors.size(), std::size_t(1));
    QVERIFY(r.errors.front().toString().find("/rooms/0/id") != std::string::npos);
}

// 20,000 unknown rooms named: fifty problems with their lines, then a count
// (finding every line read the file 20,000 times: 82 s).
void TestProjectIo::longErrorListBounded() {
    std::string text = R"({"format": "abut.project", "version": 1, "units": "m", "rooms": [{"id": "a", "area": 9}], "adjacencies": [)";
    for (int i = 0; i < 20000; ++i) text += std::string(i ? ",\n" : "\n") + R"({"rooms": ["a", "x)" + std::to_string(i) + "\"]}";
    text += "]}";
    const LoadResult r = parseProject(text, "many.abut.json");
    QVERIFY(!r.ok());
    QCOMPARE(r.errors.size(), std::size_t(51));
    QCOMPARE(r.errors[49].line, 51);
    QVERIFY2(r.errors.back().message == "and 19950 more problems like these", r.errors.back().message.c_str());
}


QTEST_GUILESS_MAIN(TestProjectIo)
#include "tst_project_io.moc"
