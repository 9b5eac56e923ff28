// SPDX-License-Identifier: MIT
#pragma once

#include <cstddef>
#include <optional>
#include <string>

namespace abut {

// Test hook: make the write fail after this many bytes, as a full disk would.
struct WriteFault {
    std::size_t failAfterBytes = 0;
};

struct WriteResult {
    bool ok = true;
    std::string message; // "PATH: why", one line
};

// Replaces `path` with `data` atomically: writes a temporary file in the same
// folder, checks every write, the flush and the close, then renames it over
// `path`. If anything fails the previous file is untouched and the temporary
// file is removed. A symlink is followed and its target replaced; a path that
// is a folder, a pipe or a device is refused (never renamed over). Every
// output of Abut goes through here. Without `fault`, the environment variable
// ABUT_TEST_WRITE_FAULT=N (a test hook) fails every write after N bytes.
//
// The temporary file is ".abut-save-PID-XXXXXX". If SIGTERM, SIGINT or SIGHUP
// stops the program during the write, a handler (installed on the first save,
// where the program has none of its own) removes it; what a harder stop
// leaves behind is removed by the next save into that folder, or by
// removeStaleTemporaries at start.
WriteResult writeFileAtomically(const std::string& path, const std::string& data,
                                std::optional<WriteFault> fault = std::nullopt);

// Removes, from `folder`, Abut's temporary files whose writer is gone (its
// process number no longer runs; without one in the name: ten minutes old).
// Returns how many. O(files in the folder).
int removeStaleTemporaries(const std::string& folder);

// Largest file the readers take (a brief of 10,000 rooms is about 3 MB).
inline constexpr long long maxReadBytes = 64LL * 1024 * 1024;

// Whole file as bytes; nullopt (with a one-line message) when it cannot be
// read, is a folder, or is larger than maxReadBytes.
std::optional<std::string> readFile(const std::string& path, std::string* message);

} // namespace abut
