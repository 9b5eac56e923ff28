// SPDX-License-Identifier: MIT
// What a stage tells the planner: a message in a planner's words plus the ids
// of the rooms and adjacencies involved, so the editor can highlight them.
#pragma once

#include <string>
#include <vector>

namespace abut {

enum class Severity { Info, Warning, Error };

struct Diagnostic {
    Severity severity = Severity::Info;
    std::string code;             // stable, machine-readable: "dropped-adjacency", ...
    std::string message;          // one sentence or two, room names not ids
    std::vector<int> rooms;       // indices into Brief::rooms
    std::vector<int> adjacencies; // indices into Brief::adjacencies
};

const char* toString(Severity s);

} // namespace abut
