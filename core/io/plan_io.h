// SPDX-License-Identifier: MIT
// The plan file (*.plan.json, format "abut.plan" version 1): sized variants,
// best first, each with its room rectangles, spare spaces and dropped
// adjacencies, as laid down in the project's file-format contract.
#pragma once

#include "plan/plan.h"

#include <string>

namespace abut {

std::string serializePlan(const Brief& brief, const Plan& plan);

} // namespace abut
