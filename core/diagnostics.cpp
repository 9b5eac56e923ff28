// SPDX-License-Identifier: MIT
#include "diagnostics.h"

namespace abut {

const char* toString(Severity s) {
    switch (s) {
    case Severity::Info: return "info";
    case Severity::Warning: return "warning";
    case Severity::Error: return "error";
    }
    return "?";
}

const char* toString(DiagnosticCode c) {
    switch (c) {
    case DiagnosticCode::Note: return "note";
    case DiagnosticCode::Feasible: return "feasible";
    case DiagnosticCode::NonPlanar: return "non-planar";
    case DiagnosticCode::DroppedAdjacency: return "dropped-adjacency";
    case DiagnosticCode::AddedContact: return "added-contact";
    case DiagnosticCode::SpareSpace: return "spare-space";
    case DiagnosticCode::CoverApproximate: return "cover-approximate";
    case DiagnosticCode::FacadeConflict: return "facade-conflict";
    case DiagnosticCode::FacadeUnmet: return "facade-unmet";
    case DiagnosticCode::FacadeTooShort: return "facade-too-short";
    case DiagnosticCode::FixedOffTarget: return "fixed-off-target";
    case DiagnosticCode::OverFootprint: return "over-footprint";
    case DiagnosticCode::WiderThanFootprint: return "wider-than-footprint";
    case DiagnosticCode::NoRectangleFits: return "no-rectangle-fits";
    case DiagnosticCode::ThinPart: return "thin-part";
    case DiagnosticCode::ShortDoorWall: return "short-door-wall";
    case DiagnosticCode::SketchCrossing: return "sketch-crossing";
    case DiagnosticCode::Unmet: return "unmet";
    case DiagnosticCode::Relaxation: return "relaxation";
    }
    return "note";
}

} // namespace abut
