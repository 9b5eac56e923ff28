// SPDX-License-Identifier: MIT
#pragma once

#include "plan/plan.h"

#include <QFutureWatcher>
#include <QObject>
#include <QThreadPool>

namespace abut::gui {

// What the worker reports: a sized variant as soon as it is found, or the
// finished (or stopped) plan.
struct PlanUpdate {
    bool final = false;
    PlanVariant variant; // when !final
    Plan plan;           // when final
};

// Computes plans off the UI thread, one computation at a time, on a pool of
// its own with one thread at idle priority (the window comes first). start() while
// a computation runs cancels it and starts the new one as soon as it stops;
// results of a cancelled computation are not reported.
class PlanRunner : public QObject {
    Q_OBJECT
public:
    explicit PlanRunner(QObject* parent = nullptr);
    ~PlanRunner() override;

    void start(const Brief& brief, quint64 revision);
    void cancel();
    // Until the last result has been reported (the future may finish earlier).
    bool busy() const { return running_ || pending_; }
    quint64 revision() const { return revision_; }

signals:
    void progress(int permille, const QString& step);
    void variantFound(const abut::PlanVariant& variant, quint64 revision);
    void finished(const abut::Plan& plan, quint64 revision);
    void stopped(); // cancelled by the planner, nothing newer queued

private:
    void launch();
    void resultsAt(int begin, int end);
    void done();

    QThreadPool pool_;
    QFutureWatcher<PlanUpdate> watcher_;
    Brief brief_;
    quint64 revision_ = 0;
    bool pending_ = false;   // a newer start() waits for the running one to stop
    bool cancelled_ = false; // the running one was cancelled
    bool running_ = false;   // launched, finished() not yet handled
};

} // namespace abut::gui
