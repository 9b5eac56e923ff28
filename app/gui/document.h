// SPDX-License-Identifier: MIT
#pragma once

#include "brief/brief.h"

#include <QObject>
#include <QString>
#include <QUndoCommand>
#include <QUndoStack>

namespace abut::gui {

// The open project: core's brief, the file it came from and the undo stack.
// Every change goes through edit() as one undoable command, so the views
// (sketch, brief table) only ever redraw from the brief. The brief itself is
// edited with core's brief/brief_edit.h functions on a copy.
class Document : public QObject {
    Q_OBJECT
public:
    explicit Document(QObject* parent = nullptr);

    const Brief& brief() const { return brief_; }
    QUndoStack* undoStack() { return &undo_; }
    const QString& path() const { return path_; }
    void setPath(const QString& path);
    bool isModified() const { return restored_ || !undo_.isClean(); }
    // Number of changes since the document was opened; autosave compares it.
    quint64 revision() const { return revision_; }

    // Replaces the brief as one undoable step named `text`. Edits with the
    // same non-empty `mergeKey` in a row merge into one step (nudging rooms
    // with the keyboard). Nothing happens when `after` equals the brief.
    void edit(const QString& text, const Brief& after, const QString& mergeKey = {});

    // Opens a brief: the undo history starts afresh. `restored` marks a brief
    // recovered from an autosave: modified although nothing was undone.
    void reset(const Brief& brief, const QString& path, bool restored = false);
    void markSaved(const QString& path);

signals:
    void briefChanged();
    void modifiedChanged(bool modified);
    void pathChanged(const QString& path);

private:
    friend class BriefCommand;
    void setBrief(const Brief& brief);

    Brief brief_;
    QString path_;
    QUndoStack undo_;
    bool restored_ = false;
    quint64 revision_ = 0;
};

// One user action: the brief before and after. Snapshots make undo exact
// whatever the edit touched (a room with its adjacencies and position, an
// import of a whole matrix); briefs are small, so the copies are cheap.
class BriefCommand : public QUndoCommand {
public:
    BriefCommand(Document* doc, const QString& text, Brief before, Brief after, const QString& mergeKey);
    void undo() override;
    void redo() override;
    int id() const override;
    bool mergeWith(const QUndoCommand* other) override;

private:
    Document* doc_;
    Brief before_, after_;
    QString mergeKey_;
};

} // namespace abut::gui
