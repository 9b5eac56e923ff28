// SPDX-License-Identifier: MIT
#include "palette.h"

#include <array>

namespace abut::gui {

QColor categoryColor(const QString& category) {
    static const std::array<QColor, 8> tones{
        QColor(0xE8, 0xC5, 0x7A), // sand       — living
        QColor(0x8F, 0xB8, 0xDE), // sky        — sleeping
        QColor(0xC9, 0xA3, 0xC8), // heather    — service
        QColor(0x9F, 0xCF, 0xA8), // sage       — work
        QColor(0xF2, 0xA6, 0x8C), // clay       — care
        QColor(0xD6, 0xD6, 0xD6), // concrete   — circulation
        QColor(0xB5, 0xA2, 0x86), // oak        — storage
        QColor(0x7F, 0xC4, 0xC4), // lagoon     — other
    };
    static const std::array<const char*, 7> known{"living", "sleeping", "service", "work",
                                                   "care", "circulation", "storage"};
    const QString c = category.toLower();
    for (std::size_t i = 0; i < known.size(); ++i)
        if (c == QLatin1String(known[i])) return tones[i];
    if (c.isEmpty()) return tones[7];
    return tones[qHash(c) % tones.size()];
}

} // namespace abut::gui
