// SPDX-License-Identifier: MIT
// The export stage, in process (the Python checks read the files back with
// ezdxf and poppler): the area schedule adds up to the footprint; the DXF is
// a sequence of group-code/value pairs that opens with the R2000 version
// code AC1015 and ends with 0/EOF (both from Autodesk's DXF Reference), with
// one closed LWPOLYLINE per room at least; the SVG is well-formed XML (read
// with Qt's QXmlStreamReader, independent of the writer) with a rect per
// room; the CSV has a header and one row per room. The plan is the family
// house sample's best variant.
#include "export/dxf_writer.h"
#include "export/schedule.h"
#include "export/svg_writer.h"
#include "io/project_io.h"
#include "plan/plan_builder.h"
#include "../support/sample_plan.h"

#include <QXmlStreamReader>
#include <QtTest>

#include <sstream>

using namespace abut;

class TestExport : public QObject {
    Q_OBJECT
    Brief brief_;
    Plan plan_;

private slots:
    void initTestCase() {
        const abut::testing::SamplePlan s = abut::testing::planSample(ABUT_SAMPLES "/family-house.abut.json");
        QVERIFY(s.ok);
        brief_ = s.brief;
        plan_ = s.plan;
    }

    void scheduleAddsUpToTheFootprint() {
        const AreaSchedule s = areaSchedule(brief_, plan_.footprint, plan_.variants.front());
        QCOMPARE(s.rows.size(), brief_.rooms.size());
        double achieved = 0, target = 0;
        for (const ScheduleRow& r : s.rows) {
            achieved += r.achieved;
            target += r.target;
            QVERIFY(std::abs(r.width * r.depth - r.achieved) <= 1e-9 * r.achieved);
        }
        QVERIFY(std::abs(achieved - s.totalAchieved) <= 1e-9 * achieved);
        QVERIFY(std::abs(target - brief_.totalTargetArea()) <= 1e-9 * target);
        QVERIFY(std::abs(s.totalAchieved + s.spareArea - s.footprintArea) <= 1e-9 * s.footprintArea);
        QCOMPARE(s.footprintArea, plan_.footprint.width * plan_.footprint.depth);
    }

    void dxfIsPairsFromVersionToEof() {
        const std::string dxf = planDxf(brief_, plan_.footprint, plan_.variants.front());
        std::vector<std::string> lines;
        std::istringstream in(dxf);
        for (std::string line; std::getline(in, line);) lines.push_back(line);
        QVERIFY(lines.size() % 2 == 0);
        for (std::size_t k = 0; k < lines.size(); k += 2) {
            bool ok = false;
            QString::fromStdString(lines[k]).trimmed().toInt(&ok);
            QVERIFY2(ok, ("group code expected at line " + std::to_string(k + 1) + ": " + lines[k]).c_str());
        }
        const auto at = std::find(lines.begin(), lines.end(), "$ACADVER");
        QVERIFY(at != lines.end() && at + 2 < lines.end());
        QCOMPARE(*(at + 2), std::string("AC1015"));
        QCOMPARE(lines[lines.size() - 2], std::string("0"));
        QCOMPARE(lines.back(), std::string("EOF"));
        QVERIFY(std::count(lines.begin(), lines.end(), "LWPOLYLINE") >= static_cast<long>(brief_.rooms.size()));
    }

    void dxfTextHasNoControlCodes_data() {
        QTest::addColumn<QString>("name");
        QTest::addColumn<QString>("written");
        // Control codes of TEXT (Autodesk, "Control Codes and Special
        // Characters Reference"): %%d is a degree sign, %%% one percent sign;
        // \U+XXXX a character by its code point.
        QTest::newRow("backslash") << "A\\U+0042" << "A\\U+005CU+0042";
        QTest::newRow("degree code") << "50%%d" << "50%%%%d";
        QTest::newRow("lone percent") << "100 %" << "100 %";
        QTest::newRow("three percent") << "%%%" << "%%%%%%%";
        QTest::newRow("percent, control, percent") << "a%\x01%d" << "a%%%%d";
        QTest::newRow("accent") << QString::fromUtf8("Caf\u00e9") << "Caf\\U+00E9";
    }
    void dxfTextHasNoControlCodes() {
        QFETCH(QString, name);
        QFETCH(QString, written);
        QCOMPARE(QString::fromStdString(dxfText(name.toStdString())), written);
    }
    void dxfStringsStayWithinTheLimit() {
        const std::string text = dxfText(std::string(300, 'N'));
        QVERIFY(text.size() <= dxfStringLimit);
        QVERIFY(text.ends_with("\\U+2026")); // cut short with an ellipsis
        std::string many;
        for (int k = 0; k < 100; ++k) many += "\xC3\xA9"; // é, written as 7 characters each
        const std::string e = dxfText(many);
        QVERIFY(e.size() <= dxfStringLimit);
        QCOMPARE(e.size() % 7, std::size_t(0)); // no escape cut in two
        QCOMPARE(dxfText(std::string(255, 'y')).size(), std::size_t(255)); // exactly the limit: kept whole
        const std::string l1 = dxfLayerOf(std::string(400, 'c')), l2 = dxfLayerOf(std::string(399, 'c') + "d");
        QVERIFY(l1.size() <= dxfStringLimit && l2.size() <= dxfStringLimit);
        QVERIFY(l1 != l2);
    }

    void svgIsWellFormed() {
        const std::string svg = planSvg(brief_, plan_.footprint, plan_.variants.front());
        QXmlStreamReader xml(QByteArray::fromStdString(svg));
        int rects = 0;
        QString root;
        while (!xml.atEnd()) {
            if (xml.readNext() == QXmlStreamReader::StartElement) {
                if (root.isEmpty()) root = xml.name().toString();
                rects += xml.name() == QLatin1String("rect");
            }
        }
        QVERIFY2(!xml.hasError(), qPrintable(xml.errorString()));
        QCOMPARE(root, QStringLiteral("svg"));
        QVERIFY(rects >= static_cast<int>(brief_.rooms.size()));
    }

    // A name holding U+FFFF (not a character XML 1.0 allows) still gives
    // well-formed XML, read by QXmlStreamReader (it refused the old output).
    void svgWithNoncharacterIsWellFormed() {
        Brief b = brief_;
        b.rooms.front().name = "Store \xEF\xBF\xBF room";
        const std::string svg = planSvg(b, plan_.footprint, plan_.variants.front());
        QXmlStreamReader xml(QByteArray::fromStdString(svg));
        while (!xml.atEnd()) xml.readNext();
        QVERIFY2(!xml.hasError(), qPrintable(xml.errorString()));
        QVERIFY(svg.find("Store \xEF\xBF\xBD room") != std::string::npos);
    }

    void csvHasARowPerRoom() {
        const std::string csv = scheduleCsv(areaSchedule(brief_, plan_.footprint, plan_.variants.front()));
        const QStringList lines = QString::fromStdString(csv).split(QLatin1Char('\n'), Qt::SkipEmptyParts);
        QVERIFY(lines.size() >= static_cast<int>(brief_.rooms.size()) + 1);
        QVERIFY(lines.front().startsWith(QStringLiteral("room,")));
        for (const Room& r : brief_.rooms) {
            bool found = false;
            for (const QString& l : lines) found = found || l.startsWith(QString::fromStdString(r.id) + QLatin1Char(','));
            QVERIFY2(found, r.id.c_str());
        }
    }
};

QTEST_GUILESS_MAIN(TestExport)
#include "tst_export.moc"
