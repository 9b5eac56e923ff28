// SPDX-License-Identifier: MIT
#pragma once

#include <QColor>
#include <QString>

namespace abut::gui {

// Fill colour for a room category. The palette is our own: eight soft tones
// chosen to stay distinguishable for the common colour-vision deficiencies
// (hues spread in lightness as well as hue). Unknown categories hash into it.
QColor categoryColor(const QString& category);

} // namespace abut::gui
