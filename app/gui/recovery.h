// SPDX-License-Identifier: MIT
#pragma once

#include "brief/brief.h"

#include <QDateTime>
#include <QList>
#include <QString>

#include <memory>

class QLockFile;

namespace abut::gui {

// Autosave and recovery. Each editor session owns one recovery file in the
// recovery folder, `<session>.abut.json` (the brief, in the project format),
// with `<session>.origin` (the path of the file being edited, if any) and a
// lock `<session>.lock` held while the session runs. A recovery file whose
// lock nobody holds any more — the session ended without closing, e.g. a
// crash or power cut — is offered for recovery at the next start. Closing
// normally or saving removes the session's files.
class Recovery {
public:
    // `folder` empty: $ABUT_RECOVERY_DIR, else <app data>/recovery.
    explicit Recovery(const QString& folder = {});
    ~Recovery();
    static QString defaultFolder();

    // Writes the brief atomically; false (and `message`) on failure.
    bool autosave(const Brief& brief, const QString& originalPath, QString* message = nullptr);
    // Removes this session's recovery file (after a save or a clean close).
    void discard();
    QString file() const;
    QString folder() const { return folder_; }

    struct Orphan {
        QString file;         // the autosaved brief
        QString originalPath; // what the session was editing ("" for an untitled brief)
        QDateTime saved;
    };
    // Recovery files of sessions that ended without closing, newest first.
    QList<Orphan> orphans() const;
    static void removeOrphan(const Orphan& orphan);

    // What a crash leaves behind: the recovery file stays, the lock goes.
    // For tests; the session autosaves no more afterwards.
    void abandonForTests();

private:
    QString path(const QString& suffix) const;
    QString folder_, session_;
    std::unique_ptr<QLockFile> lock_;
    bool abandoned_ = false;
};

} // namespace abut::gui
