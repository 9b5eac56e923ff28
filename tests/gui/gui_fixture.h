// SPDX-License-Identifier: MIT
// What the editor's GUI tests share: a window set up for a test (recovery
// files in a temporary folder, no autosave timer, its questions answered
// "discard"), opened on a sample, and waiting for its plans.
#pragma once

#include "main_window.h"

#include <QMessageBox>
#include <QString>
#include <QtTest>

#include <memory>

namespace abut::gui::testing {

// Recovery files in `folder`, no autosave timer, plans `planDelayMs` after an edit.
inline MainWindowOptions testOptions(const QString& folder, int planDelayMs) {
    MainWindowOptions o;
    o.recoveryFolder = folder;
    o.autosaveSeconds = 0;
    o.planDelayMs = planDelayMs;
    return o;
}

// Unsaved changes are dropped without asking (when the window closes or opens another file).
inline void dropChangesSilently(MainWindow& w) {
    w.ask = [](auto&&...) { return QMessageBox::Discard; };
}

// A window on screen (offscreen), 1400 × 900, with `sample` (a name in
// samples/, without ".abut.json") open; null when that fails.
inline std::unique_ptr<MainWindow> windowOn(const MainWindowOptions& o, const char* sample) {
    auto w = std::make_unique<MainWindow>(o);
    dropChangesSilently(*w);
    w->resize(1400, 900);
    w->show();
    if (!QTest::qWaitForWindowExposed(w.get())) return nullptr;
    if (!w->openProject(QStringLiteral(ABUT_SAMPLES "/") + QLatin1String(sample) + QStringLiteral(".abut.json")))
        return nullptr;
    return w;
}

// Until the plans are done and one is on show (fails the test after `ms`).
inline void waitForPlans(MainWindow& w, int ms = 60000) {
    QTRY_VERIFY_WITH_TIMEOUT(!w.planning() && w.hasCurrentVariant(), ms);
}

} // namespace abut::gui::testing
