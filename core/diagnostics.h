// SPDX-License-Identifier: MIT
// What a stage tells the planner: a message in a planner's words plus the ids
// of the rooms and adjacencies involved, so the editor can highlight them.
#pragma once

#include <string>
#include <vector>

namespace abut {

enum class Severity { Info, Warning, Error };

// What a diagnostic is about: stable, and written as its string (toString,
// e.g. "dropped-adjacency") where a file or `check --json` shows it.
enum class DiagnosticCode {
    Note,               // a remark with no code of its own
    Feasible,           // the brief can be planned as it is
    NonPlanar,          // adjacencies that cross: a Kuratowski witness
    DroppedAdjacency,   // an adjacency given up (and why)
    AddedContact,       // an extra wall added to complete the graph (costs the brief nothing)
    SpareSpace,         // spare spaces the plan needs
    CoverApproximate,   // separating triangles broken by an approximate cover
    FacadeConflict,     // facade wishes that cannot all be met
    FacadeUnmet,        // a room that misses the facade it wishes for
    FacadeTooShort,     // rooms that wish one facade need more of it than it is long
    FixedOffTarget,     // a room fixed in place at an area off its target band
    OverFootprint,      // targets add up to more than the footprint
    WiderThanFootprint, // a room's minimum width exceeds the footprint
    NoRectangleFits,    // a room larger than any rectangle beside the cut-outs and fixed rooms
    ThinPart,           // a part of the footprint narrower than the shortest wall: no room can take it
    ShortDoorWall,      // door adjacencies with less than a door's width of wall
    SketchCrossing,     // adjacency lines that cross in the sketch
    Unmet,              // a requirement the plan on show does not meet
    Relaxation,         // a change to the brief that would meet one
};

struct Diagnostic {
    Severity severity = Severity::Info;
    DiagnosticCode code = DiagnosticCode::Note;
    std::string message;          // one sentence or two, room names not ids
    std::vector<int> rooms;       // indices into Brief::rooms
    std::vector<int> adjacencies; // indices into Brief::adjacencies
};

// Notes kept for the record that ask nothing of the planner (an added
// contact is an extra wall the brief did not ask for): the CLI's text and
// the editor leave them out.
inline bool costsTheBriefNothing(const Diagnostic& d) { return d.code == DiagnosticCode::AddedContact; }

const char* toString(Severity s);
const char* toString(DiagnosticCode c);

} // namespace abut
