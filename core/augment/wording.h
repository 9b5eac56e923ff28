// SPDX-License-Identifier: MIT
// The augmentation's words: every message it gives the planner, in one
// place, so the voice stays the same (room names not ids, the reason first,
// then what was given up and how to keep it). Plain strings, English; the
// editor shows them as they are.
#pragma once

#include "brief/brief.h"

#include <string>
#include <vector>

namespace abut::wording {

// "Kitchen–Hall (door, must)".
std::string adjacency(const Brief& brief, int adj);
// "Kitchen, Hall and Study".
std::string roomList(const Brief& brief, const std::vector<int>& rooms);

std::string nonPlanar(const Brief& brief, const std::vector<int>& witnessAdjacencies, bool k5);
std::string droppedForCrossings(const Brief& brief, int adj);
// Four rooms that must all touch (`fourth` ≥ 0), or three around others.
std::string droppedForSeparatingTriangle(const Brief& brief, const std::vector<int>& triangle, int fourth, int adj);
std::string droppedForOutline(const Brief& brief, int adj);
std::string droppedForEnclosure(const Brief& brief, int adj);
std::string addedContact(const Brief& brief, int u, int v, const std::string& why);
std::string spareSpaces(int count);
std::string coverApproximate();
std::string facadeConflict(const Brief& brief, const std::vector<int>& sided, const std::vector<int>& ignored);
std::string facadeUnmet(const Brief& brief, int room);
std::string summaryFeasible(int shouldsDropped);
std::string summaryCompromised(int mustsDropped, int facadesUnmet);
std::string summaryInternal(const std::string& problem);
std::string summaryEmpty();

} // namespace abut::wording
