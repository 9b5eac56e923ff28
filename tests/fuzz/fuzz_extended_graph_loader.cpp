// SPDX-License-Identifier: MIT
// libFuzzer target: the extended-graph loader. Any input is refused with a
// message or yields a graph that passes checkExtendedGraph and has a regular
// edge labeling that passes its checker.
#include "augment/extended_graph.h"
#include "io/extended_graph_io.h"
#include "label/regular_edge_labeling.h"

#include <cstdint>
#include <cstdlib>
#include <string>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string text(reinterpret_cast<const char*>(data), size);
    const abut::ExtendedGraphLoad r = abut::parseExtendedGraph(text, "fuzz.ext.json");
    if (!r.ok) {
        if (r.error.empty()) std::abort();
        return 0;
    }
    if (!abut::checkExtendedGraph(r.graph).ok) std::abort();
    const abut::LabelingResult l = abut::computeRegularEdgeLabeling(r.graph);
    if (!abut::checkRegularEdgeLabeling(r.graph, l.labeling).ok) std::abort();
    return 0;
}
