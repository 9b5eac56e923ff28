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

// 1-based line of a byte offset.
int lineOfOffset(std::string_view text, std::size_t offset);

} // namespace abut::detail
