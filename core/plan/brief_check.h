// SPDX-License-Identifier: MIT
// Whether a rectangular plan can keep every 'must' adjacency and facade wish
// of a brief: the one check behind `abut-cli check` and the editor's live
// check.
//
// The graph-first augmentation answers first. Its "no" can be a proof (the
// 'must' graph is not planar, four rooms must all touch) or only a property
// of the embedding and outline it chose; so where it gives something up, a
// short plan search looks for a plan that keeps everything, and when it
// finds one the augmentation's compromise is withdrawn (the plan found is
// the witness). The search only ever turns a "no" into a "yes" with a plan
// in hand; it never claims infeasibility.
#pragma once

#include "augment/augment.h"
#include "brief/brief.h"
#include "brief/footprint_check.h"

namespace abut {

struct BriefCheckOptions {
    // The search runs only when the augmentation gives something up. One
    // thread and a move budget make the answer the same on every run (the
    // CLI's `check` and `extended` agree); the time cap bounds big briefs.
    long long searchMoves = 0;  // per search (0 = 100,000 + 5,000 per room; −1 = no search)
    double searchSeconds = 3.0; // at most
};

struct BriefCheck {
    // Everything the check found, in the order to show it: the footprint's
    // problems (targets over it, rooms wider than it, a facade too short),
    // then the arrangement's notes. Added contacts (costsTheBriefNothing)
    // are among them; the CLI's text and the editor leave them out.
    std::vector<Diagnostic> diagnostics;
    bool fits = true;          // no footprint error: the numbers can be met at all
    AugmentResult arrangement; // the augmentation's, or the searched plan's when it keeps more
    bool searched = false;     // a plan search ran
    bool foundBySearch = false; // it found a plan keeping every 'must' and facade wish
};

BriefCheck checkBrief(const Brief& brief, const BriefCheckOptions& options = {});

} // namespace abut
