// SPDX-License-Identifier: MIT
#include "recovery.h"

#include "io/atomic_file.h"

#include "io/project_io.h"

#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QLockFile>
#include <QStandardPaths>
#include <QUuid>

#include <algorithm>

namespace abut::gui {

Recovery::Recovery(const QString& folder)
    : folder_(folder.isEmpty() ? defaultFolder() : folder),
      session_(QUuid::createUuid().toString(QUuid::WithoutBraces)) {
    QDir().mkpath(folder_);
    removeStaleTemporaries(folder_.toStdString()); // a save stopped hard last time
    lock_ = std::make_unique<QLockFile>(path(QStringLiteral(".lock")));
    // Held for the whole session: never stale by age, only when its process is gone.
    lock_->setStaleLockTime(0);
    lock_->tryLock(100);
}

Recovery::~Recovery() {
    if (!abandoned_) discard();
}

QString Recovery::defaultFolder() {
    const QString env = qEnvironmentVariable("ABUT_RECOVERY_DIR");
    if (!env.isEmpty()) return env;
    return QStandardPaths::writableLocation(QStandardPaths::AppDataLocation) + QStringLiteral("/recovery");
}

QString Recovery::path(const QString& suffix) const { return folder_ + QLatin1Char('/') + session_ + suffix; }
QString Recovery::file() const { return path(QStringLiteral(".abut.json")); }

bool Recovery::autosave(const Brief& brief, const QString& originalPath, QString* message) {
    if (abandoned_) return false;
    const SaveResult r = saveProject(brief, file().toStdString());
    if (!r.ok) {
        if (message) *message = QString::fromStdString(r.message);
        return false;
    }
    const WriteResult o = writeFileAtomically(path(QStringLiteral(".origin")).toStdString(), originalPath.toStdString());
    if (!o.ok) {
        if (message) *message = QString::fromStdString(o.message);
        return false;
    }
    return true;
}

void Recovery::discard() {
    QFile::remove(file());
    QFile::remove(path(QStringLiteral(".origin")));
}

void Recovery::abandonForTests() {
    abandoned_ = true;
    lock_->unlock();
}

QList<Recovery::Orphan> Recovery::orphans() const {
    QList<Orphan> out;
    const QDir dir(folder_);
    for (const QFileInfo& f : dir.entryInfoList({QStringLiteral("*.abut.json")}, QDir::Files)) {
        const QString session = f.fileName().chopped(int(qstrlen(".abut.json")));
        if (session == session_) continue;
        QLockFile other(folder_ + QLatin1Char('/') + session + QStringLiteral(".lock"));
        other.setStaleLockTime(0);
        if (!other.tryLock(0)) continue; // that session is still running
        other.unlock();
        Orphan o;
        o.file = f.absoluteFilePath();
        o.saved = f.lastModified();
        QFile origin(folder_ + QLatin1Char('/') + session + QStringLiteral(".origin"));
        if (origin.open(QIODevice::ReadOnly)) o.originalPath = QString::fromUtf8(origin.readAll());
        out.append(o);
    }
    std::sort(out.begin(), out.end(), [](const Orphan& a, const Orphan& b) { return a.saved > b.saved; });
    return out;
}

void Recovery::removeOrphan(const Orphan& orphan) {
    QFile::remove(orphan.file);
    QString base = orphan.file;
    base.chop(int(qstrlen(".abut.json")));
    QFile::remove(base + QStringLiteral(".origin"));
    QFile::remove(base + QStringLiteral(".lock"));
}

} // namespace abut::gui
