// SPDX-License-Identifier: MIT
// Importing a room list or an adjacency matrix from CSV into a brief, as
// planners keep them in spreadsheets. The two layouts are told apart by the
// header row; both are documented in the README ("Importing from a
// spreadsheet"):
//
// Room list — a header row naming the columns (any order, case and spaces
// ignored): `name` and `area` required; `id`, `category`, `min width`,
// `max aspect`, `facade` optional. One room per row. A room whose name or id
// is already in the brief is updated, others are added.
//
// Adjacency matrix — the first row and the first column hold room names
// (the top-left cell is ignored); a cell marks the pair of its row and
// column: `D` door/must, `d` door/should, `W` wall/must, `w` wall/should,
// `1` or `x` door/must; empty, `0`, `-` or `.` mean no adjacency. Either
// half of the matrix may be filled, or both when they agree. Names not in
// the brief become new rooms with a placeholder area, reported in `notes`.
//
// Cells are separated by commas, semicolons or tabs (whichever the header
// row uses) and may be quoted as in RFC 4180. Input is validated: any problem
// refuses the whole import with one located message per problem
// ("rooms.csv:4: column 2 (area): …") and the brief stays as it was.
// Running time O(text + cells + rooms·adjacencies).
#pragma once

#include "brief/brief.h"
#include "io/project_io.h"

#include <string>
#include <vector>

namespace abut {

enum class CsvLayout { RoomList, AdjacencyMatrix, Unknown };

struct CsvImportResult {
    LoadStatus status = LoadStatus::Ok; // Invalid or Unreadable on failure
    CsvLayout layout = CsvLayout::Unknown;
    Brief brief;                    // the merged brief, when ok()
    std::vector<FileError> errors;  // located problems
    std::vector<std::string> notes; // what the import did, for the status bar
    bool ok() const { return status == LoadStatus::Ok; }
};

// Placeholder target area of rooms a matrix introduces: 10 m² or 100 ft²
// (a small room, to be edited; not a standard).
double placeholderArea(const std::string& units);

CsvImportResult importCsv(const std::string& text, const std::string& fileName, const Brief& into);
CsvImportResult importCsvFile(const std::string& path, const Brief& into);

// Splits CSV text into rows of cells (RFC 4180 quoting; `separator` one of
// , ; or tab). Exposed for tests. Each row keeps its 1-based line number.
struct CsvRow {
    int line = 0;
    std::vector<std::string> cells;
};
std::vector<CsvRow> splitCsv(const std::string& text, char separator);

} // namespace abut
