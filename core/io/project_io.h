// SPDX-License-Identifier: MIT
// Reading and writing the project file (*.abut.json), format version 1 as
// laid down in the project's file-format contract. Every problem is reported
// as one line naming the file, the line, the JSON Pointer of the field and
// what is wrong. Unknown fields are kept and written back.
#pragma once

#include "brief/brief.h"

#include <optional>
#include <string>
#include <vector>

namespace abut {

constexpr int projectFormatVersion = 1;

struct FileError {
    std::string file;
    int line = 0;        // 1-based, 0 when unknown
    std::string pointer; // JSON Pointer of the field, "" for the whole file
    std::string message;

    // "FILE:LINE: /rooms/2/area: area must be a positive number, got -3"
    std::string toString() const;
};

enum class LoadStatus { Ok, Unreadable, NotJson, Invalid, NewerVersion };

struct LoadResult {
    LoadStatus status = LoadStatus::Ok;
    Brief brief;                   // meaningful only when ok()
    std::vector<FileError> errors; // all problems found, in file order
    bool ok() const { return status == LoadStatus::Ok; }
};

// Parses and validates a project. `fileName` is used in messages only.
// O(size of text + rooms + adjacencies).
LoadResult parseProject(const std::string& text, const std::string& fileName);
LoadResult loadProject(const std::string& path);

// Canonical text of a brief: known fields in the documented order, then the
// unknown ones in the order they were read. Ends with a newline.
std::string serializeProject(const Brief& brief);

struct SaveResult {
    bool ok = true;
    std::string message;
};
// Atomic: a failed save leaves the previous file as it was.
SaveResult saveProject(const Brief& brief, const std::string& path);

} // namespace abut
