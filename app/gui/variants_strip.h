// SPDX-License-Identifier: MIT
#pragma once

#include "brief/brief.h"
#include "plan/plan.h"

#include <QHash>
#include <QPixmap>
#include <QWidget>

class QCheckBox;
class QComboBox;
class QLabel;
class QListWidget;
class QProgressBar;
class QPushButton;

namespace abut::gui {

// Small drawings of the ranked variants with their score and key figures.
// Pinned variants come first and carry a star; hidden ones are left out
// unless "Show hidden" is on; a filter keeps only variants in which a chosen
// room reaches a chosen facade side. Shows the progress of the background
// computation with a Cancel button.
class VariantsStrip : public QWidget {
    Q_OBJECT
public:
    explicit VariantsStrip(QWidget* parent = nullptr);

    // The brief (names, pins, hidden) and the variants, best first.
    void setVariants(const Brief& brief, const Footprint& footprint, const std::vector<PlanVariant>& variants);
    void setProgress(int permille, const QString& step, bool running);
    bool progressShown() const;
    void selectKey(const QString& key);

    QString currentKey() const;
    QListWidget* list() const { return list_; }
    QStringList shownKeys() const;
    QPushButton* cancelButton() const { return cancel_; }
    void setFilter(const QString& roomId, int side); // side: 0..3 = N, E, S, W; -1 = none

signals:
    void variantChosen(const QString& key);
    void pinRequested(const QString& key, bool pin);
    void hideRequested(const QString& key, bool hide);
    void cancelRequested();

private:
    void refill();
    bool passesFilter(const PlanVariant& v) const;
    QPixmap thumbnail(const QString& key, const PlanVariant& v);

    Brief brief_;
    Footprint footprint_;
    std::vector<PlanVariant> variants_;
    std::vector<QString> keys_;
    QHash<QString, QPixmap> thumbs_;
    QListWidget* list_ = nullptr;
    QProgressBar* progress_ = nullptr;
    QPushButton* cancel_ = nullptr;
    QPushButton* pin_ = nullptr;
    QPushButton* hide_ = nullptr;
    QCheckBox* showHidden_ = nullptr;
    QComboBox* filterRoom_ = nullptr;
    QComboBox* filterSide_ = nullptr;
    QLabel* count_ = nullptr;
    bool filling_ = false;
};

} // namespace abut::gui
