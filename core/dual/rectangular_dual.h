// SPDX-License-Identifier: MIT
// Rectangular dual from a regular edge labeling.
//
// Method (Kant & He, Theor. Comput. Sci. 172, 1997; He, SIAM J. Comput. 22,
// 1993): the red edges form an st-digraph from S to N, the blue edges one from
// W to E. A blue edge u → v puts u's east side and v's west side on the same
// maximal vertical segment; a red edge u → v puts u's top and v's bottom on
// the same maximal horizontal segment. Joining sides this way (union-find)
// yields the maximal segments — the faces of the two st-digraphs, i.e. the
// vertices of their duals. Each room then asks its east segment to lie at
// least its minimum width east of its west segment (an arc of the dual), and
// the longest-path (topological) numbering of the duals gives coordinates.
// Per-edge minimum contact lengths (a door's width) become arcs between the
// segments that end a shared wall.
//
// Precondition: checkRegularEdgeLabeling(x, rel).ok.
// Running time: O(V + E) (union-find with path halving, Kahn's topological order).
#pragma once

#include "check.h"
#include "augment/extended_graph.h"
#include "label/regular_edge_labeling.h"

#include <array>
#include <string>
#include <vector>

namespace abut {

struct Rect {
    double x0 = 0, y0 = 0, x1 = 0, y1 = 0; // west, south, east, north
    double width() const { return x1 - x0; }
    double depth() const { return y1 - y0; }
    double area() const { return width() * depth(); }
};

// Length of the wall two rectangles share (0 when they only meet at a corner
// or not at all); sides closer than `tolerance` count as one line. O(1).
double sharedWallLength(const Rect& a, const Rect& b, double tolerance = 1e-9);
// Whether their interiors overlap by more than `tolerance` both ways. O(1).
bool interiorsOverlap(const Rect& a, const Rect& b, double tolerance);

// The combinatorial layout: which maximal segment each side of each vertex
// lies on. Poles included (W's east side is segment westSegment, ...).
struct SegmentStructure {
    int verticalCount = 0, horizontalCount = 0;
    std::vector<int> west, east, south, north; // per vertex: segment ids (-1 for a pole's far sides)
    int westSegment = 0, eastSegment = 0, southSegment = 0, northSegment = 0;
    // For each edge u–v of a wall between two non-pole vertices: the segments
    // (of the other direction) where that wall starts and ends.
    struct Wall {
        int u = 0, v = 0;
        bool vertical = false; // blue edge: the wall runs north-south
        int along = 0;          // segment the wall lies on
        int from = 0, to = 0;   // segments that bound it (south/north or west/east)
    };
    std::vector<Wall> walls;
};

SegmentStructure maximalSegments(const ExtendedGraph& x, const RegularEdgeLabeling& rel);

// One-sided layout: every maximal segment is a whole side of some room. Such
// layouts are area-universal: any area targets can be met exactly (Eppstein,
// Mumford, Speckmann & Verbeek 2012). O(V + E).
bool isOneSided(const ExtendedGraph& x, const RegularEdgeLabeling& rel);

// Minimum extents, in plan units: per vertex (rooms and spares; poles ignored;
// empty = 1 each) and per wall (index into SegmentStructure::walls). Every wall
// gets at least `anyWall`: without it two rooms that should meet could touch at
// a corner only, and two that should not could share a wall.
struct DualWeights {
    std::vector<double> minWidth, minDepth;
    std::vector<double> minWall;
    double anyWall = minContactLength;
};

struct DualLayout {
    std::vector<double> xOfVertical, yOfHorizontal; // segment coordinates
    double width = 0, depth = 0;
    std::vector<Rect> rects; // per vertex; poles get empty rects
};

// Longest-path coordinates: every segment as far west / south as the weights allow.
DualLayout longestPathLayout(const ExtendedGraph& x, const SegmentStructure& segs, const DualWeights& w);

// Longest distances from the sources of a DAG given as weighted arcs
// (Kahn's order, no recursion). O(V + E).
std::vector<double> longestPaths(int count, const std::vector<std::pair<std::pair<int, int>, double>>& arcs);

// Checker: the rectangles of rooms and spares tile [0,W]×[0,D] without
// overlap, and two of them share a wall of positive length exactly when the
// extended graph joins them (a vertex touches the outline side X exactly when
// it is adjacent to pole X). O(n log n + contacts) for tilings.
StageCheck checkRectangularDual(const ExtendedGraph& x, const std::vector<Rect>& rects, double width,
                               double depth, double tolerance = 1e-7);

} // namespace abut
