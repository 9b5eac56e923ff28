// SPDX-License-Identifier: MIT
// The one ranking of plans, documented for planners (lower is better). The
// plan search's pool and the plan's variants are both ordered by it:
//   1000 per dropped 'must' adjacency (a door without a door-wide wall
//        counts as dropped), so a plan that keeps every 'must' always ranks
//        above one that does not
//   1000 per room not exactly where it is fixed
//   + 1 per requirement missed: a room off its area band, narrower than its
//       minimum width, more elongated than its aspect limit, or missing a
//       facade side it wishes for
//   + worst relative area error + 0.25 × mean relative area error
//   + 0.2 per dropped 'should' adjacency
//   + 0.1 × Σ (aspect − maxAspect) over rooms more elongated than allowed
//   + 0.2 × spare-space share of the footprint
//   + 0.01 × interior wall length / √(footprint area)   (less wall, less cost)
// O(rooms) given the measure.
#pragma once

#include "search/requirements.h"

#include <vector>

namespace abut {

// `rooms`: one rectangle per room of `brief`; `report`: their measure.
double planScore(const Brief& brief, const Footprint& fp, const std::vector<Rect>& rooms,
                 const std::vector<Rect>& spaces, const RequirementReport& report);

} // namespace abut
