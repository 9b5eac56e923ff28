// SPDX-License-Identifier: MIT
#include "plan_runner.h"

#include "plan/plan_builder.h"

#include <QPromise>
#include <QtConcurrent/QtConcurrentRun>

namespace abut::gui {

PlanRunner::PlanRunner(QObject* parent) : QObject(parent) {
    pool_.setMaxThreadCount(1);
    // Below every normal thread (SCHED_IDLE on Linux): the window always gets
    // the processor first, the plans take what is left.
    pool_.setThreadPriority(QThread::IdlePriority);
    connect(&watcher_, &QFutureWatcher<PlanUpdate>::resultsReadyAt, this, &PlanRunner::resultsAt);
    connect(&watcher_, &QFutureWatcher<PlanUpdate>::progressValueChanged, this,
            [this](int v) { emit progress(v, watcher_.progressText()); });
    connect(&watcher_, &QFutureWatcher<PlanUpdate>::finished, this, &PlanRunner::done);
}

PlanRunner::~PlanRunner() {
    watcher_.cancel();
    watcher_.waitForFinished();
}

void PlanRunner::start(const Brief& brief, quint64 revision) {
    brief_ = brief;
    revision_ = revision;
    if (watcher_.isRunning()) {
        pending_ = true;
        cancelled_ = true;
        watcher_.cancel();
        return;
    }
    launch();
}

void PlanRunner::cancel() {
    pending_ = false;
    if (watcher_.isRunning()) {
        cancelled_ = true;
        watcher_.cancel();
    }
}

void PlanRunner::launch() {
    pending_ = false;
    cancelled_ = false;
    running_ = true;
    const Brief brief = brief_;
    watcher_.setFuture(QtConcurrent::run(&pool_, [brief](QPromise<PlanUpdate>& promise) {
        promise.setProgressRange(0, 1000);
        PlanMonitor m;
        m.progress = [&promise](double done, const std::string& step) {
            promise.setProgressValueAndText(static_cast<int>(1000 * done), QString::fromStdString(step));
            return !promise.isCanceled();
        };
        m.found = [&promise](const PlanVariant& v) {
            PlanUpdate u;
            u.variant = v;
            promise.addResult(u);
        };
        PlanUpdate last;
        last.final = true;
        // Lively: every core (at idle priority, inherited by the search's
        // threads), stopped at the first plan that meets the whole brief, and
        // never longer than 20 s; every improvement is shown as it comes.
        PlanOptions options;
        options.timeLimit = 20.0;
        last.plan = buildPlan(brief, options, &m);
        promise.addResult(last);
    }));
}

void PlanRunner::resultsAt(int begin, int end) {
    if (cancelled_) return;
    for (int i = begin; i < end; ++i) {
        const PlanUpdate u = watcher_.resultAt(i);
        if (u.final) emit finished(u.plan, revision_);
        else emit variantFound(u.variant, revision_);
    }
}

void PlanRunner::done() {
    running_ = false;
    if (pending_) {
        launch();
        return;
    }
    if (cancelled_) emit stopped();
}

} // namespace abut::gui
