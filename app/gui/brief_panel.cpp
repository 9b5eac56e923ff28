// SPDX-License-Identifier: MIT
#include "brief_panel.h"

#include "brief/brief_edit.h"
#include "document.h"

#include <QComboBox>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QLineEdit>
#include <QTabWidget>
#include <QTableWidget>
#include <QToolTip>
#include <QVBoxLayout>

namespace abut::gui {

namespace {

QString number(double v) { return QString::number(v, 'g', 6); }

QString roomFieldName(int column) {
    switch (column) {
    case BriefPanel::Name: return QObject::tr("name");
    case BriefPanel::Category: return QObject::tr("category");
    case BriefPanel::Area: return QObject::tr("target area");
    case BriefPanel::MinWidth: return QObject::tr("min width");
    case BriefPanel::MaxAspect: return QObject::tr("max aspect");
    default: return QObject::tr("facade");
    }
}

} // namespace

BriefPanel::BriefPanel(Document* doc, QWidget* parent) : QWidget(parent), doc_(doc) {
    auto* layout = new QVBoxLayout(this);
    layout->setContentsMargins(4, 4, 4, 4);

    auto* site = new QHBoxLayout;
    width_ = new QLineEdit(this);
    depth_ = new QLineEdit(this);
    door_ = new QLineEdit(this);
    units_ = new QComboBox(this);
    units_->addItem(tr("metres"), QStringLiteral("m"));
    units_->addItem(tr("feet"), QStringLiteral("ft"));
    for (QLineEdit* e : {width_, depth_, door_}) e->setMaximumWidth(80);
    width_->setObjectName(QStringLiteral("footprintWidth"));
    depth_->setObjectName(QStringLiteral("footprintDepth"));
    width_->setPlaceholderText(tr("auto"));
    depth_->setPlaceholderText(tr("auto"));
    width_->setToolTip(tr("Footprint width, west to east. Leave empty to use a rectangle of the total target area."));
    depth_->setToolTip(tr("Footprint depth, south to north. Leave empty to use a rectangle of the total target area."));
    door_->setToolTip(tr("Length of shared wall a door adjacency needs"));
    site->addWidget(new QLabel(tr("Footprint"), this));
    site->addWidget(width_);
    site->addWidget(new QLabel(QStringLiteral("\u00D7"), this));
    site->addWidget(depth_);
    site->addSpacing(12);
    site->addWidget(new QLabel(tr("Units"), this));
    site->addWidget(units_);
    site->addSpacing(12);
    site->addWidget(new QLabel(tr("Door wall"), this));
    site->addWidget(door_);
    site->addSpacing(12);
    cutouts_ = new QLineEdit(this);
    cutouts_->setObjectName(QStringLiteral("footprintCutouts"));
    cutouts_->setPlaceholderText(tr("none"));
    cutouts_->setMaximumWidth(170);
    cutouts_->setToolTip(tr("Parts of the footprint that are not building (an L, a U, a courtyard): four numbers "
                            "each — x and y of the south-west corner, width, depth — cut-outs separated by \";\", "
                            "e.g. \"12 9 12 9\". A wall on a cut-out is an outside wall."));
    site->addWidget(new QLabel(tr("Cut-outs"), this));
    site->addWidget(cutouts_);
    site->addSpacing(12);
    totals_ = new QLabel(this);
    totals_->setObjectName(QStringLiteral("totals"));
    site->addWidget(totals_, 1);
    layout->addLayout(site);

    rooms_ = new QTableWidget(this);
    rooms_->setObjectName(QStringLiteral("roomTable"));
    rooms_->setColumnCount(ColumnCount);
    rooms_->verticalHeader()->hide();
    rooms_->setSelectionBehavior(QAbstractItemView::SelectRows);
    rooms_->setEditTriggers(QAbstractItemView::DoubleClicked | QAbstractItemView::EditKeyPressed |
                            QAbstractItemView::AnyKeyPressed);
    rooms_->horizontalHeader()->setSectionResizeMode(QHeaderView::Interactive);
    rooms_->horizontalHeader()->setStretchLastSection(true);
    rooms_->setToolTip(tr("Type to change a value; numbers may use a decimal comma. "
                          "Facade: sides N, E, S, W (e.g. \"NE\"), \"any\", or empty."));

    adjacencies_ = new QTableWidget(this);
    adjacencies_->setObjectName(QStringLiteral("adjacencyTable"));
    adjacencies_->setColumnCount(4);
    adjacencies_->setHorizontalHeaderLabels({tr("Room"), tr("Room"), tr("Kind"), tr("Priority")});
    adjacencies_->verticalHeader()->hide();
    adjacencies_->setSelectionBehavior(QAbstractItemView::SelectRows);
    adjacencies_->setEditTriggers(QAbstractItemView::NoEditTriggers);
    adjacencies_->horizontalHeader()->setStretchLastSection(true);

    tabs_ = new QTabWidget(this);
    tabs_->addTab(rooms_, tr("Rooms"));
    tabs_->addTab(adjacencies_, tr("Adjacencies"));
    layout->addWidget(tabs_, 1);

    connect(rooms_, &QTableWidget::itemChanged, this, &BriefPanel::roomEdited);
    rooms_->setMouseTracking(true);
    connect(rooms_, &QTableWidget::cellEntered, this, [this](int row, int) {
        if (QTableWidgetItem* item = rooms_->item(row, Name)) emit roomHovered(item->data(Qt::UserRole).toString());
    });
    connect(width_, &QLineEdit::editingFinished, this, [this] { briefFieldEdited(int(BriefField::FootprintWidth), width_); });
    connect(depth_, &QLineEdit::editingFinished, this, [this] { briefFieldEdited(int(BriefField::FootprintDepth), depth_); });
    connect(door_, &QLineEdit::editingFinished, this, [this] { briefFieldEdited(int(BriefField::DoorWidth), door_); });
    connect(cutouts_, &QLineEdit::editingFinished, this, [this] { briefFieldEdited(int(BriefField::Cutouts), cutouts_); });
    connect(units_, &QComboBox::activated, this, [this] {
        if (filling_ || !doc_) return;
        Brief b = doc_->brief();
        if (setBriefField(b, BriefField::Units, units_->currentData().toString().toStdString()).ok())
            doc_->edit(tr("Change units"), b);
    });
    connect(rooms_, &QTableWidget::itemSelectionChanged, this, [this] {
        if (!filling_) emitSelection();
    });
    connect(adjacencies_, &QTableWidget::itemSelectionChanged, this, [this] {
        if (!filling_) emitSelection();
    });
    connect(doc_, &Document::briefChanged, this, &BriefPanel::refill);
    refill();
}

void BriefPanel::refill() {
    if (!doc_) return;
    filling_ = true;
    const Brief& b = doc_->brief();
    const QString u = QString::fromStdString(b.units);
    const QString u2 = u + QChar(0x00B2);
    rooms_->setHorizontalHeaderLabels({tr("Room"), tr("Category"), tr("Target area (%1)").arg(u2),
                                       tr("Min width (%1)").arg(u), tr("Max aspect"), tr("Facade")});
    const int current = rooms_->currentRow(), currentColumn = rooms_->currentColumn();
    rooms_->setRowCount(int(b.rooms.size()));
    for (int i = 0; i < rooms_->rowCount(); ++i) {
        const Room& r = b.rooms[i];
        const QStringList cells{QString::fromStdString(r.displayName()),
                                QString::fromStdString(r.category),
                                number(r.area),
                                r.minWidth ? number(*r.minWidth) : QString(),
                                r.maxAspect ? number(*r.maxAspect) : QString(),
                                QString::fromStdString(facadeText(r.facade))};
        for (int c = 0; c < ColumnCount; ++c) {
            QTableWidgetItem* item = rooms_->item(i, c);
            if (!item) {
                item = new QTableWidgetItem;
                rooms_->setItem(i, c, item);
            }
            item->setText(cells[c]);
            if (c >= Area && c <= MaxAspect) item->setTextAlignment(Qt::AlignRight | Qt::AlignVCenter);
        }
        rooms_->item(i, Name)->setData(Qt::UserRole, QString::fromStdString(r.id));
        rooms_->item(i, Name)->setToolTip(tr("id: %1").arg(QString::fromStdString(r.id)));
    }
    if (current >= 0 && current < rooms_->rowCount()) rooms_->setCurrentCell(current, currentColumn);
    rooms_->resizeColumnsToContents();

    adjacencies_->setRowCount(int(b.adjacencies.size()));
    for (int i = 0; i < adjacencies_->rowCount(); ++i) {
        const Adjacency& a = b.adjacencies[i];
        auto name = [&](const std::string& id) {
            const int k = b.roomIndex(id);
            return QString::fromStdString(k >= 0 ? b.rooms[k].displayName() : id);
        };
        adjacencies_->setItem(i, 0, new QTableWidgetItem(name(a.a)));
        adjacencies_->setItem(i, 1, new QTableWidgetItem(name(a.b)));
        for (int c : {2, 3}) {
            auto* combo = qobject_cast<QComboBox*>(adjacencies_->cellWidget(i, c));
            if (!combo) {
                combo = new QComboBox(adjacencies_);
                if (c == 2) combo->addItems({tr("door"), tr("wall")});
                else combo->addItems({tr("must"), tr("should")});
                combo->setFrame(false);
                adjacencies_->setCellWidget(i, c, combo);
                connect(combo, &QComboBox::activated, this, [this, combo, c](int choice) {
                    if (!doc_) return;
                    // Find the row of this combo now: rows shift as adjacencies come and go.
                    for (int row = 0; row < adjacencies_->rowCount(); ++row) {
                        if (adjacencies_->cellWidget(row, c) != combo) continue;
                        Brief nb = doc_->brief();
                        Adjacency& adj = nb.adjacencies[row];
                        if (c == 2) adj.kind = choice == 0 ? AdjacencyKind::Door : AdjacencyKind::Wall;
                        else adj.priority = choice == 0 ? Priority::Must : Priority::Should;
                        doc_->edit(c == 2 ? tr("Change adjacency kind") : tr("Change adjacency priority"), nb);
                        return;
                    }
                });
            }
            combo->setCurrentIndex(c == 2 ? (a.kind == AdjacencyKind::Door ? 0 : 1)
                                          : (a.priority == Priority::Must ? 0 : 1));
        }
    }
    adjacencies_->resizeColumnsToContents();
    tabs_->setTabText(0, tr("Rooms (%1)").arg(b.rooms.size()));
    tabs_->setTabText(1, tr("Adjacencies (%1)").arg(b.adjacencies.size()));

    width_->setText(b.footprint ? number(b.footprint->width) : QString());
    depth_->setText(b.footprint ? number(b.footprint->depth) : QString());
    door_->setText(number(b.doorWidth));
    cutouts_->setText(b.footprint ? QString::fromStdString(cutoutsText(b.footprint->cutouts)) : QString());
    units_->setCurrentIndex(b.units == "ft" ? 1 : 0);

    const Footprint f = b.effectiveFootprint();
    const double target = b.totalTargetArea(), site = f.netArea();
    QString balance;
    if (b.footprint && site > 0) {
        const double diff = site - target;
        balance = std::abs(diff) < 1e-9 * std::max(1.0, site)
                      ? tr("targets fill the footprint exactly")
                      : diff > 0 ? tr("%1 %2 left for spare space").arg(diff, 0, 'f', 1).arg(u2)
                                 : tr("targets exceed the footprint by %1 %2").arg(-diff, 0, 'f', 1).arg(u2);
    } else {
        balance = tr("no footprint: plans use %1 × %2 %3").arg(f.width, 0, 'f', 1).arg(f.depth, 0, 'f', 1).arg(u);
    }
    totals_->setText(tr("Targets %1 %2 · footprint %3 %2 · %4")
                         .arg(target, 0, 'f', 1)
                         .arg(u2)
                         .arg(site, 0, 'f', 1)
                         .arg(balance));
    filling_ = false;
}

void BriefPanel::roomEdited(QTableWidgetItem* item) {
    if (filling_ || !doc_) return;
    const int row = item->row(), column = item->column();
    Brief b = doc_->brief();
    if (row < 0 || row >= int(b.rooms.size())) return;
    const EditResult r = setRoomField(b, row, RoomField(column), item->text().toStdString());
    if (!r.ok()) {
        const QPoint at = rooms_->viewport()->mapToGlobal(rooms_->visualItemRect(item).bottomLeft());
        refill(); // put the value back
        refuse(QString::fromStdString(r.message), at);
        return;
    }
    const QString name = QString::fromStdString(doc_->brief().rooms[row].displayName());
    doc_->edit(tr("Change %1 of %2").arg(roomFieldName(column), name), b);
    refill(); // same brief (e.g. "12.0" for 12): show it as stored
}

void BriefPanel::briefFieldEdited(int field, QLineEdit* edit) {
    if (filling_ || !doc_) return;
    Brief b = doc_->brief();
    const EditResult r = setBriefField(b, BriefField(field), edit->text().toStdString());
    if (!r.ok()) {
        const QPoint at = edit->mapToGlobal(edit->rect().bottomLeft());
        refill();
        refuse(QString::fromStdString(r.message), at);
        return;
    }
    doc_->edit(field == int(BriefField::DoorWidth) ? tr("Change door wall length")
               : field == int(BriefField::Cutouts) ? tr("Change cut-outs")
                                                   : tr("Change footprint"),
               b);
    refill();
}

void BriefPanel::refuse(const QString& why, const QPoint& globalAt) {
    QToolTip::showText(globalAt, why, this);
    emit message(why);
}

void BriefPanel::selectItems(const QStringList& rooms, const QList<int>& adjacencies) {
    filling_ = true;
    rooms_->clearSelection();
    rooms_->setSelectionMode(QAbstractItemView::MultiSelection);
    for (int i = 0; i < rooms_->rowCount(); ++i)
        if (rooms.contains(rooms_->item(i, Name)->data(Qt::UserRole).toString())) rooms_->selectRow(i);
    rooms_->setSelectionMode(QAbstractItemView::ExtendedSelection);
    adjacencies_->clearSelection();
    adjacencies_->setSelectionMode(QAbstractItemView::MultiSelection);
    for (int i : adjacencies)
        if (i >= 0 && i < adjacencies_->rowCount()) adjacencies_->selectRow(i);
    adjacencies_->setSelectionMode(QAbstractItemView::ExtendedSelection);
    filling_ = false;
}

void BriefPanel::editRoomName(const QString& id) {
    tabs_->setCurrentWidget(rooms_);
    for (int i = 0; i < rooms_->rowCount(); ++i)
        if (rooms_->item(i, Name)->data(Qt::UserRole).toString() == id) {
            rooms_->setCurrentCell(i, Name);
            rooms_->scrollToItem(rooms_->item(i, Name));
            rooms_->editItem(rooms_->item(i, Name));
            return;
        }
}

void BriefPanel::setHoverRoom(const QString& id) {
    if (hoverRoom_ == id) return;
    hoverRoom_ = id;
    const bool was = filling_;
    filling_ = true; // fonts are not edits
    for (int i = 0; i < rooms_->rowCount(); ++i) {
        const bool on = rooms_->item(i, Name)->data(Qt::UserRole).toString() == id;
        for (int c = 0; c < ColumnCount; ++c) {
            QTableWidgetItem* item = rooms_->item(i, c);
            QFont f = item->font();
            if (f.bold() != on) {
                f.setBold(on);
                item->setFont(f);
            }
        }
    }
    filling_ = was;
}

void BriefPanel::emitSelection() {
    QStringList rooms;
    QList<int> adjacencies;
    for (const QModelIndex& i : rooms_->selectionModel()->selectedRows())
        rooms << rooms_->item(i.row(), Name)->data(Qt::UserRole).toString();
    for (const QModelIndex& i : adjacencies_->selectionModel()->selectedRows()) adjacencies << i.row();
    emit selectionChangedByUser(rooms, adjacencies);
}

} // namespace abut::gui
