// SPDX-License-Identifier: MIT
#include "brief/requirement_kind.h"

namespace abut {

const char* toString(RequirementKind k) {
    switch (k) {
    case RequirementKind::Area: return "area";
    case RequirementKind::MinWidth: return "minWidth";
    case RequirementKind::MaxAspect: return "maxAspect";
    case RequirementKind::Door: return "door";
    case RequirementKind::Adjacency: return "adjacency";
    case RequirementKind::Facade: return "facade";
    case RequirementKind::Fixed: return "fixed";
    case RequirementKind::Grid: return "grid";
    }
    return "?";
}

} // namespace abut
