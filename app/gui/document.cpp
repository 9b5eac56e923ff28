// SPDX-License-Identifier: MIT
#include "document.h"

#include "io/project_io.h"

namespace abut::gui {

namespace {
// One id for all mergeable edits; mergeWith() compares the keys.
constexpr int mergeableId = 1;

bool sameBrief(const Brief& a, const Brief& b) { return serializeProject(a) == serializeProject(b); }
} // namespace

Document::Document(QObject* parent) : QObject(parent) {
    undo_.setUndoLimit(500);
    connect(&undo_, &QUndoStack::cleanChanged, this, [this] { emit modifiedChanged(isModified()); });
}

void Document::setPath(const QString& path) {
    if (path_ == path) return;
    path_ = path;
    emit pathChanged(path_);
}

void Document::edit(const QString& text, const Brief& after, const QString& mergeKey) {
    if (sameBrief(brief_, after)) return;
    undo_.push(new BriefCommand(this, text, brief_, after, mergeKey));
}

void Document::reset(const Brief& brief, const QString& path, bool restored) {
    const bool wasModified = isModified();
    undo_.clear();
    restored_ = restored;
    setPath(path);
    setBrief(brief);
    if (wasModified != isModified()) emit modifiedChanged(isModified());
}

void Document::markSaved(const QString& path) {
    setPath(path);
    const bool was = isModified();
    restored_ = false;
    undo_.setClean();
    if (was != isModified()) emit modifiedChanged(isModified());
}

void Document::setBrief(const Brief& brief) {
    brief_ = brief;
    ++revision_;
    emit briefChanged();
}

BriefCommand::BriefCommand(Document* doc, const QString& text, Brief before, Brief after,
                           const QString& mergeKey)
    : doc_(doc), before_(std::move(before)), after_(std::move(after)), mergeKey_(mergeKey) {
    setText(text);
}

void BriefCommand::undo() { doc_->setBrief(before_); }
void BriefCommand::redo() { doc_->setBrief(after_); }
int BriefCommand::id() const { return mergeKey_.isEmpty() ? -1 : mergeableId; }

bool BriefCommand::mergeWith(const QUndoCommand* other) {
    const auto* o = static_cast<const BriefCommand*>(other);
    if (o->mergeKey_ != mergeKey_) return false;
    after_ = o->after_;
    return true;
}

} // namespace abut::gui
