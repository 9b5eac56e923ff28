// SPDX-License-Identifier: MIT
#pragma once

#include <QPointer>
#include <QWidget>

class QComboBox;
class QLabel;
class QLineEdit;
class QTabWidget;
class QTableWidget;
class QTableWidgetItem;

namespace abut::gui {

class Document;

// The brief as tables: rooms (name, category, target area, min width, max
// aspect, facade), adjacencies (the two rooms, kind, priority), the
// footprint, units and door wall length, and the totals. Every accepted
// edit is one undoable command; a value core refuses is put back at once and
// the reason shown beside the cell.
class BriefPanel : public QWidget {
    Q_OBJECT
public:
    explicit BriefPanel(Document* doc, QWidget* parent = nullptr);

    QTableWidget* roomTable() const { return rooms_; }
    QTableWidget* adjacencyTable() const { return adjacencies_; }
    QLineEdit* footprintWidth() const { return width_; }
    QLabel* totals() const { return totals_; }

    // Programmatic selection (from the sketch); no signal back.
    void selectItems(const QStringList& rooms, const QList<int>& adjacencies);
    void editRoomName(const QString& id);
    // A room pointed at elsewhere (plan, sketch): its row drawn bold.
    void setHoverRoom(const QString& id);

    enum RoomColumn { Name, Category, Area, MinWidth, MaxAspect, Facade, ColumnCount };

signals:
    void selectionChangedByUser(const QStringList& rooms, const QList<int>& adjacencies);
    void message(const QString& text);
    void roomHovered(const QString& id);

private:
    void refill();
    void roomEdited(QTableWidgetItem* item);
    void briefFieldEdited(int field, QLineEdit* edit);
    void refuse(const QString& why, const QPoint& globalAt);
    void emitSelection();

    QPointer<Document> doc_;
    QTabWidget* tabs_ = nullptr;
    QTableWidget* rooms_ = nullptr;
    QTableWidget* adjacencies_ = nullptr;
    QLineEdit* width_ = nullptr;
    QLineEdit* depth_ = nullptr;
    QLineEdit* door_ = nullptr;
    QLineEdit* cutouts_ = nullptr; // footprint.cutouts, typed
    QComboBox* units_ = nullptr;
    QLabel* totals_ = nullptr;
    bool filling_ = false;
    QString hoverRoom_;
};

} // namespace abut::gui
