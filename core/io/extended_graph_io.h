// The extended-graph file (*.ext.json, format "abut.extended-graph" version 1):
// vertex names, edges and the four poles. The embedding is not stored; it is
// computed on reading (an irreducible triangulation of a 4-cycle has one
// embedding up to mirroring).
#pragma once

#include "augment/extended_graph.h"

#include <string>

namespace abut {

std::string serializeExtendedGraph(const ExtendedGraph& x);

} // namespace abut
