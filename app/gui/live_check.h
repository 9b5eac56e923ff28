// SPDX-License-Identifier: MIT
#pragma once

#include "diagnostics.h"
#include "sketch_view.h"

#include <vector>

namespace abut::gui {

// What the editor shows while the planner sketches: crossings of the
// drawing and the augmentation's findings (Kuratowski witness of a
// non-planar brief, separating triangles, facade conflicts), in brief
// indices. Pure function of the brief; runs on a worker thread.
struct LiveCheck {
    quint64 revision = 0;
    SketchMarks marks;
    std::vector<Diagnostic> diagnostics; // what the list shows, worst first
};

LiveCheck runLiveCheck(const Brief& brief, quint64 revision);

} // namespace abut::gui
