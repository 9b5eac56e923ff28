// SPDX-License-Identifier: MIT
// A sample brief and its plan, as several tests start from one: loaded from
// samples/, planned on one thread within 20 s, without relaxations.
#pragma once

#include "io/project_io.h"
#include "plan/plan_builder.h"

#include <string>

namespace abut::testing {

struct SamplePlan {
    bool ok = false;
    Brief brief;
    Plan plan;
};

inline SamplePlan planSample(const std::string& path) {
    SamplePlan out;
    const LoadResult loaded = loadProject(path);
    if (!loaded.ok()) return out;
    out.brief = loaded.brief;
    PlanOptions o;
    o.threads = 1;
    o.timeLimit = 20;
    o.relaxations = false;
    out.plan = buildPlan(out.brief, o);
    out.ok = !out.plan.variants.empty();
    return out;
}

} // namespace abut::testing
