// SPDX-License-Identifier: MIT
#pragma once

namespace abut {

// Shown in the README, the About box and on every PDF sheet.
inline constexpr const char* safetyCaution =
    "Layouts are schematic planning aids, not construction documents. Minimum sizes, egress, "
    "fire separation, daylight and accessibility are set by local building codes; check them "
    "with the authority having jurisdiction and a licensed professional.";

} // namespace abut
