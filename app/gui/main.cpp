// SPDX-License-Identifier: MIT
// abut: the editor. `abut [PROJECT]` opens a brief;
// `abut --screenshot OUT.png [--size WxH] PROJECT` renders the window to a PNG
// and exits (works with QT_QPA_PLATFORM=offscreen).
#include "main_window.h"
#include "sketch_view.h"

#include <QApplication>
#include <QCommandLineParser>
#include <QPixmap>
#include <QElapsedTimer>
#include <QTimer>

#include <iostream>

namespace {

// --size: each side of the window from 200 to 8192 pixels (8192 × 8192 is
// 256 MB of picture).
constexpr int minShotSide = 200, maxShotSide = 8192;

// What the user typed, safe to print: control characters as \xNN.
std::string printable(const QString& s) {
    std::string out;
    for (const char c : s.toStdString()) {
        const auto u = static_cast<unsigned char>(c);
        if (u < 0x20 || u == 0x7f) {
            static const char hex[] = "0123456789ABCDEF";
            out += "\\x";
            out += hex[u >> 4];
            out += hex[u & 15];
        } else {
            out += c;
        }
    }
    return out;
}

} // namespace

int main(int argc, char** argv) {
    QApplication app(argc, argv);
    QApplication::setApplicationName(QStringLiteral("Abut"));
    QApplication::setOrganizationName(QStringLiteral("Abut"));
    QApplication::setApplicationVersion(QStringLiteral(ABUT_VERSION));

    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral("Rectangular floorplans from adjacency briefs"));
    parser.addHelpOption();
    parser.addVersionOption();
    QCommandLineOption shotOpt(QStringLiteral("screenshot"),
                               QStringLiteral("Render the window to FILE.png and exit."),
                               QStringLiteral("FILE"));
    QCommandLineOption sizeOpt(QStringLiteral("size"), QStringLiteral("Window size for --screenshot."),
                               QStringLiteral("WxH"), QStringLiteral("1400x900"));
    QCommandLineOption waitOpt(QStringLiteral("wait"),
                               QStringLiteral("Seconds --screenshot waits at most for the plans to be finished."),
                               QStringLiteral("SEC"), QStringLiteral("60"));
    parser.addOption(shotOpt);
    parser.addOption(sizeOpt);
    parser.addOption(waitOpt);
    parser.addPositionalArgument(QStringLiteral("project"), QStringLiteral("A brief (*.abut.json)."));
    parser.process(app);

    abut::gui::MainWindow window;
    const QStringList files = parser.positionalArguments();
    if (!files.isEmpty()) {
        if (parser.isSet(shotOpt)) {
            QStringList errors;
            if (!window.openProject(files.first(), &errors)) {
                for (const QString& e : errors) std::cerr << e.toStdString() << "\n";
                return 2;
            }
        } else {
            window.openProject(files.first());
        }
    }

    if (parser.isSet(shotOpt)) {
        // A stated limit: 30000 × 30000 took 7 GB of memory.
        const QStringList wh = parser.value(sizeOpt).split(QLatin1Char('x'));
        bool wOk = false, hOk = false;
        const int w = wh.size() == 2 ? wh[0].toInt(&wOk) : 0, h = wh.size() == 2 ? wh[1].toInt(&hOk) : 0;
        if (!wOk || !hOk || w < minShotSide || h < minShotSide || w > maxShotSide || h > maxShotSide) {
            std::cerr << "abut: --size takes WIDTHxHEIGHT in pixels, each from " << minShotSide << " to "
                      << maxShotSide << " (got \"" << printable(parser.value(sizeOpt)) << "\")\n";
            return 2;
        }
        window.resize(w, h);
        window.show();
        // The finished plans, not a computation under way, go in the picture.
        bool waitOk = false;
        const double wait = parser.value(waitOpt).toDouble(&waitOk);
        if (!waitOk || !(wait >= 0) || wait > 86400) {
            std::cerr << "abut: --wait takes a number of seconds from 0 to 86400\n";
            return 2;
        }
        QTimer::singleShot(300, &window, [&] {
            const QString out = parser.value(shotOpt);
            QString why;
            if (!window.screenshot(out, wait, &why)) {
                std::cerr << "abut: " << printable(why) << "; nothing written\n";
                QApplication::exit(2);
                return;
            }
            QApplication::exit(0);
        });
        return app.exec();
    }
    window.show();
    // Work autosaved by a session that ended without closing is offered first.
    QTimer::singleShot(0, &window, [&] { window.offerRecovery(); });
    return app.exec();
}
