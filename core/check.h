// SPDX-License-Identifier: MIT
// What a stage checker says of a result: ok, or what is wrong, in words for
// tests, bug reports and debug builds. Every stage's checker returns this
// (checkExtendedGraph, checkRegularEdgeLabeling, checkRectangularDual,
// checkVariant), so a failure reads the same wherever it is caught.
#pragma once

#include <string>

namespace abut {

struct StageCheck {
    bool ok = true;
    std::string problem; // empty when ok

    static StageCheck failed(std::string problem) { return {false, std::move(problem)}; }
};

} // namespace abut
