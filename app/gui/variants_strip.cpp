// SPDX-License-Identifier: MIT
#include "variants_strip.h"

#include "plan/variant_key.h"
#include "sheet.h"

#include <QCheckBox>
#include <QComboBox>
#include <QHBoxLayout>
#include <QLabel>
#include <QListWidget>
#include <QPainter>
#include <QProgressBar>
#include <QPushButton>
#include <QVBoxLayout>

namespace abut::gui {

namespace {
constexpr int thumbW = 150, thumbH = 100;
const char* sideNames[] = {"N", "E", "S", "W"};
} // namespace

VariantsStrip::VariantsStrip(QWidget* parent) : QWidget(parent) {
    auto* layout = new QVBoxLayout(this);
    layout->setContentsMargins(4, 2, 4, 2);
    auto* bar = new QHBoxLayout;
    count_ = new QLabel(tr("Variants"), this);
    progress_ = new QProgressBar(this);
    progress_->setRange(0, 1000);
    progress_->setMaximumWidth(160);
    progress_->setTextVisible(true);
    progress_->setFormat(tr("%p %"));
    cancel_ = new QPushButton(tr("Cancel"), this);
    cancel_->setToolTip(tr("Stop computing variants; those found so far stay"));
    pin_ = new QPushButton(tr("Pin"), this);
    pin_->setToolTip(tr("Keep the selected variant as a favourite (saved with the brief)"));
    pin_->setCheckable(true);
    hide_ = new QPushButton(tr("Hide"), this);
    hide_->setToolTip(tr("Set the selected variant aside (saved with the brief)"));
    showHidden_ = new QCheckBox(tr("Show hidden"), this);
    filterRoom_ = new QComboBox(this);
    filterRoom_->setToolTip(tr("Only variants in which this room reaches the chosen side"));
    filterSide_ = new QComboBox(this);
    for (const char* s : sideNames) filterSide_->addItem(QString::fromLatin1(s));
    bar->addWidget(count_);
    bar->addWidget(progress_);
    bar->addWidget(cancel_);
    bar->addSpacing(12);
    bar->addWidget(pin_);
    bar->addWidget(hide_);
    bar->addWidget(showHidden_);
    bar->addSpacing(12);
    bar->addWidget(new QLabel(tr("Only where"), this));
    bar->addWidget(filterRoom_);
    bar->addWidget(new QLabel(tr("reaches"), this));
    bar->addWidget(filterSide_);
    bar->addStretch(1);
    layout->addLayout(bar);

    list_ = new QListWidget(this);
    list_->setObjectName(QStringLiteral("variants"));
    list_->setViewMode(QListView::IconMode);
    list_->setFlow(QListView::LeftToRight);
    list_->setWrapping(false);
    list_->setIconSize(QSize(thumbW, thumbH));
    list_->setMovement(QListView::Static);
    list_->setSpacing(4);
    list_->setFixedHeight(thumbH + 64);
    list_->setHorizontalScrollBarPolicy(Qt::ScrollBarAsNeeded);
    layout->addWidget(list_);

    connect(cancel_, &QPushButton::clicked, this, &VariantsStrip::cancelRequested);
    connect(list_, &QListWidget::currentItemChanged, this, [this](QListWidgetItem* item) {
        if (filling_ || !item) return;
        pin_->setChecked(item->data(Qt::UserRole + 1).toBool());
        emit variantChosen(item->data(Qt::UserRole).toString());
    });
    connect(pin_, &QPushButton::clicked, this, [this](bool on) {
        if (!currentKey().isEmpty()) emit pinRequested(currentKey(), on);
    });
    connect(hide_, &QPushButton::clicked, this, [this] {
        if (currentKey().isEmpty()) return;
        const bool hidden = std::count(brief_.hiddenVariants.begin(), brief_.hiddenVariants.end(), currentKey().toStdString());
        emit hideRequested(currentKey(), !hidden);
    });
    connect(showHidden_, &QCheckBox::toggled, this, &VariantsStrip::refill);
    connect(filterRoom_, &QComboBox::currentIndexChanged, this, &VariantsStrip::refill);
    connect(filterSide_, &QComboBox::currentIndexChanged, this, &VariantsStrip::refill);
    setProgress(0, QString(), false);
}

void VariantsStrip::setVariants(const Brief& brief, const Footprint& footprint, const std::vector<PlanVariant>& variants) {
    const QString keepRoom = filterRoom_->currentData().toString();
    brief_ = brief;
    footprint_ = footprint;
    variants_ = variants;
    keys_.clear();
    for (const PlanVariant& v : variants_) keys_.push_back(QString::fromStdString(variantKey(brief_, v)));
    filling_ = true;
    filterRoom_->clear();
    filterRoom_->addItem(tr("(any room)"), QString());
    for (const Room& r : brief_.rooms)
        filterRoom_->addItem(QString::fromStdString(r.displayName()), QString::fromStdString(r.id));
    filterRoom_->setCurrentIndex(std::max(0, filterRoom_->findData(keepRoom)));
    filling_ = false;
    refill();
}

void VariantsStrip::setFilter(const QString& roomId, int side) {
    filling_ = true;
    filterRoom_->setCurrentIndex(std::max(0, filterRoom_->findData(roomId)));
    filterSide_->setCurrentIndex(std::clamp(side, 0, 3));
    filling_ = false;
    refill();
}

bool VariantsStrip::passesFilter(const PlanVariant& v) const {
    const QString id = filterRoom_->currentData().toString();
    if (id.isEmpty()) return true;
    const int room = brief_.roomIndex(id.toStdString());
    if (room < 0 || room >= int(v.rooms.size())) return true;
    const Rect& r = v.rooms[room];
    const double tol = 1e-6 * std::max(footprint_.width, footprint_.depth);
    switch (filterSide_->currentIndex()) {
    case 0: return r.y1 >= footprint_.depth - tol;
    case 1: return r.x1 >= footprint_.width - tol;
    case 2: return r.y0 <= tol;
    default: return r.x0 <= tol;
    }
}

QPixmap VariantsStrip::thumbnail(const QString& key, const PlanVariant& v) {
    // Cached by arrangement and sizes: re-ranking or a re-sent variant costs nothing.
    const QString cacheKey = key + QString::number(v.metrics.worstAreaError, 'g', 10) + QString::number(v.rooms.size());
    auto it = thumbs_.find(cacheKey);
    if (it != thumbs_.end()) return *it;
    QPixmap pm(thumbW, thumbH);
    pm.fill(Qt::white);
    QPainter p(&pm);
    render::paintPlan(p, QRectF(3, 3, thumbW - 6, thumbH - 6), brief_, footprint_, v);
    p.end();
    if (thumbs_.size() > 400) thumbs_.clear();
    thumbs_.insert(cacheKey, pm);
    return pm;
}

void VariantsStrip::refill() {
    if (filling_) return;
    const QString current = currentKey();
    filling_ = true;
    list_->clear();
    auto listed = [](const std::vector<std::string>& l, const QString& k) {
        return std::count(l.begin(), l.end(), k.toStdString()) > 0;
    };
    std::vector<std::size_t> order(variants_.size());
    for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
    std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
        return listed(brief_.pinnedVariants, keys_[a]) > listed(brief_.pinnedVariants, keys_[b]);
    });
    int shown = 0, hiddenCount = 0;
    for (std::size_t i : order) {
        const PlanVariant& v = variants_[i];
        const bool pinned = listed(brief_.pinnedVariants, keys_[i]);
        const bool hidden = listed(brief_.hiddenVariants, keys_[i]);
        hiddenCount += hidden;
        if ((hidden && !showHidden_->isChecked()) || !passesFilter(v)) continue;
        const QString head = (pinned ? QStringLiteral("\u2605 ") : QString()) + tr("#%1").arg(v.rank) +
                             (hidden ? tr(" (hidden)") : QString());
        const QString figures = tr("worst %1 % · score %2").arg(100 * v.metrics.worstAreaError, 0, 'f', 1).arg(v.score, 0, 'f', 2);
        auto* item = new QListWidgetItem(QIcon(thumbnail(keys_[i], v)), head + QLatin1Char('\n') + figures, list_);
        item->setData(Qt::UserRole, keys_[i]);
        item->setData(Qt::UserRole + 1, pinned);
        item->setToolTip(tr("Variant %1%2\nworst area deviation %3 %, mean %4 %\n%5 adjacency(ies) not realised, "
                            "%6 facade wish(es) unmet\nspare space %7 %8")
                             .arg(v.rank)
                             .arg(pinned ? tr(" — pinned") : QString())
                             .arg(100 * v.metrics.worstAreaError, 0, 'f', 1)
                             .arg(100 * v.metrics.meanAreaError, 0, 'f', 1)
                             .arg(v.dropped.size())
                             .arg(v.unmetFacade.size())
                             .arg(v.metrics.spareArea, 0, 'f', 1)
                             .arg(QString::fromStdString(brief_.units) + QChar(0x00B2)));
        if (keys_[i] == current) list_->setCurrentItem(item);
        ++shown;
    }
    count_->setText(tr("Variants: %1 shown of %2%3")
                        .arg(shown)
                        .arg(variants_.size())
                        .arg(hiddenCount ? tr(", %1 hidden").arg(hiddenCount) : QString()));
    if (QListWidgetItem* item = list_->currentItem()) pin_->setChecked(item->data(Qt::UserRole + 1).toBool());
    filling_ = false;
}

void VariantsStrip::setProgress(int permille, const QString& step, bool running) {
    progress_->setVisible(running);
    cancel_->setVisible(running);
    progress_->setValue(permille);
    progress_->setToolTip(step);
}

void VariantsStrip::selectKey(const QString& key) {
    filling_ = true;
    for (int i = 0; i < list_->count(); ++i)
        if (list_->item(i)->data(Qt::UserRole).toString() == key) {
            list_->setCurrentRow(i);
            pin_->setChecked(list_->item(i)->data(Qt::UserRole + 1).toBool());
        }
    filling_ = false;
}

QString VariantsStrip::currentKey() const {
    const QListWidgetItem* item = list_->currentItem();
    return item ? item->data(Qt::UserRole).toString() : QString();
}

QStringList VariantsStrip::shownKeys() const {
    QStringList out;
    for (int i = 0; i < list_->count(); ++i) out << list_->item(i)->data(Qt::UserRole).toString();
    return out;
}

bool VariantsStrip::progressShown() const { return progress_ && progress_->isVisible(); }

} // namespace abut::gui
