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
// folder, flushes it to disk, then renames it over `path`. If anything fails
// the previous file is untouched and the temporary file is removed.
WriteResult writeFileAtomically(const std::string& path, const std::string& data,
                                std::optional<WriteFault> fault = std::nullopt);

// Whole file as bytes; nullopt (with a one-line message) when it cannot be read.
std::optional<std::string> readFile(const std::string& path, std::string* message);

} // namespace abut
