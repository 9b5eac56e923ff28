// SPDX-License-Identifier: MIT
// The extended-graph file (*.ext.json, format "abut.extended-graph" version 1):
// vertex names, edges and the four poles. The embedding is not stored; it is
// computed on reading (an irreducible triangulation of a 4-cycle has one
// embedding up to mirroring).
#pragma once

#include "augment/extended_graph.h"

#include <string>

namespace abut {

std::string serializeExtendedGraph(const ExtendedGraph& x);

struct ExtendedGraphLoad {
    bool ok = false;
    std::string error; // one line: FILE[:LINE]: /pointer: what is wrong
    ExtendedGraph graph;
};

// Reads and validates an extended-graph file; the embedding is computed
// (Boyer–Myrvold on the graph plus a vertex joined to the four poles, which
// makes it 3-connected and so uniquely embeddable up to mirroring) and
// oriented so that N, E, S, W run clockwise. The result must pass
// checkExtendedGraph, or the file is refused with the reason.
ExtendedGraphLoad parseExtendedGraph(const std::string& text, const std::string& fileName);
ExtendedGraphLoad loadExtendedGraph(const std::string& path);

} // namespace abut
