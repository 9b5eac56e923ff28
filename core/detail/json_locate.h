// SPDX-License-Identifier: MIT
#pragma once

#include <string>
#include <string_view>

namespace abut::detail {

// 1-based line of the value addressed by a JSON Pointer (RFC 6901) in `text`,
// or 0 when the text does not contain it. Precondition: `text` is valid JSON.
// O(size of text); iterative, so deep nesting cannot exhaust the stack.
int lineOfJsonPointer(std::string_view text, const std::string& pointer);

// Offset of the first '[' or '{' that opens nesting deeper than `maxDepth`
// (outside strings), or npos. O(size of text), no allocation: run before
// parsing so that deep input is refused before it costs stack or memory.
std::size_t nestingTooDeep(std::string_view text, int maxDepth);

// Deepest nesting Abut's readers accept (project files need about five).
inline constexpr int maxJsonDepth = 100;

// A key that appears twice in one object, which JSON parsers read
// differently (nlohmann keeps the last, silently): where the second one
// starts, the pointer of the object holding it and the key.
struct DuplicateKey {
    std::size_t offset = std::string_view::npos; // npos: none
    std::string object;
    std::string key;
};

// The first duplicate key in `text`. Precondition: `text` is valid JSON.
// O(size of text · log keys per object).
DuplicateKey duplicateKeyAt(std::string_view text);

// `token` escaped for a JSON Pointer (RFC 6901): '~' as ~0, '/' as ~1.
std::string escapePointerToken(const std::string& token);

// 1-based line of a byte offset.
int lineOfOffset(std::string_view text, std::size_t offset);

} // namespace abut::detail
