// SPDX-License-Identifier: MIT
#include "detail/json_locate.h"

#include <set>
#include <vector>

namespace abut::detail {

std::string escapePointerToken(const std::string& token) {
    std::string out;
    for (char c : token) {
        if (c == '~') out += "~0";
        else if (c == '/') out += "~1";
        else out += c;
    }
    return out;
}

namespace {

struct Frame {
    bool isArray = false;
    int index = -1;         // arrays: index of the current element
    std::string key;        // objects: key of the current member
    bool expectKey = false; // objects: next string is a key
};

// The string starting at the quote at `i` (escapes \n and \t decoded, any
// other escaped character kept as itself); `i` ends past its closing quote,
// `line` counts the line breaks passed.
std::string readString(std::string_view text, std::size_t& i, int* line) {
    std::string s;
    ++i;
    while (i < text.size() && text[i] != '"') {
        if (text[i] == '\\' && i + 1 < text.size()) {
            const char e = text[i + 1];
            s += (e == 'n' ? '\n' : e == 't' ? '\t' : e);
            i += 2;
            continue;
        }
        if (text[i] == '\n' && line) ++*line;
        s += text[i++];
    }
    ++i;
    return s;
}

std::string pointerOf(const std::vector<Frame>& stack) {
    std::string p;
    for (const Frame& f : stack)
        p += "/" + (f.isArray ? std::to_string(f.index) : escapePointerToken(f.key));
    return p;
}

} // namespace

int lineOfOffset(std::string_view text, std::size_t offset) {
    int line = 1;
    for (std::size_t i = 0; i < offset && i < text.size(); ++i)
        if (text[i] == '\n') ++line;
    return line;
}

int lineOfJsonPointer(std::string_view text, const std::string& pointer) {
    std::vector<Frame> stack;
    int line = 1;
    std::size_t i = 0;
    // A value starts at the current position: does its pointer match?
    auto valueStarts = [&]() {
        if (!stack.empty() && stack.back().isArray) ++stack.back().index;
        return pointerOf(stack) == pointer;
    };
    while (i < text.size()) {
        const char c = text[i];
        if (c == '\n') { ++line; ++i; continue; }
        if (c == ' ' || c == '\t' || c == '\r' || c == ',' || c == ':') { ++i; continue; }
        if (c == '}' || c == ']') {
            if (!stack.empty()) stack.pop_back();
            if (!stack.empty() && !stack.back().isArray) stack.back().expectKey = true;
            ++i;
            continue;
        }
        if (c == '"') {
            const int startLine = line;
            const std::string s = readString(text, i, &line);
            if (!stack.empty() && !stack.back().isArray && stack.back().expectKey) {
                stack.back().key = s;
                stack.back().expectKey = false;
                if (pointerOf(stack) == pointer) return startLine;
                continue;
            }
            if (valueStarts()) return startLine;
            if (!stack.empty() && !stack.back().isArray) stack.back().expectKey = true;
            continue;
        }
        const bool matches = valueStarts();
        if (matches) return line;
        if (c == '{' || c == '[') {
            Frame f;
            f.isArray = (c == '[');
            f.expectKey = !f.isArray;
            stack.push_back(f);
            ++i;
            continue;
        }
        // number, true, false, null
        while (i < text.size() && text[i] != ',' && text[i] != '}' && text[i] != ']' &&
               text[i] != '\n' && text[i] != ' ')
            ++i;
        if (!stack.empty() && !stack.back().isArray) stack.back().expectKey = true;
    }
    return 0;
}

std::size_t nestingTooDeep(std::string_view text, int maxDepth) {
    int depth = 0;
    bool inString = false, escaped = false;
    for (std::size_t i = 0; i < text.size(); ++i) {
        const char c = text[i];
        if (inString) {
            if (escaped) escaped = false;
            else if (c == '\\') escaped = true;
            else if (c == '"') inString = false;
        } else if (c == '"') {
            inString = true;
        } else if (c == '[' || c == '{') {
            if (++depth > maxDepth) return i;
        } else if (c == ']' || c == '}') {
            --depth;
        }
    }
    return std::string_view::npos;
}

DuplicateKey duplicateKeyAt(std::string_view text) {
    struct Object {
        std::set<std::string> keys;
        Frame frame;
    };
    std::vector<Object> stack; // objects and arrays, as frames for the pointer
    auto pointer = [&] {
        std::vector<Frame> frames;
        for (const Object& o : stack) frames.push_back(o.frame);
        if (!frames.empty() && !frames.back().isArray) frames.pop_back(); // the object, not its member
        return pointerOf(frames);
    };
    for (std::size_t i = 0; i < text.size();) {
        const char c = text[i];
        if (c == '{' || c == '[') {
            if (!stack.empty() && stack.back().frame.isArray) ++stack.back().frame.index;
            Object o;
            o.frame.isArray = c == '[';
            o.frame.expectKey = c == '{';
            stack.push_back(std::move(o));
            ++i;
        } else if (c == '}' || c == ']') {
            if (!stack.empty()) stack.pop_back();
            ++i;
        } else if (c == ',') {
            if (!stack.empty() && !stack.back().frame.isArray) stack.back().frame.expectKey = true;
            ++i;
        } else if (c == '"') {
            const std::size_t start = i;
            const std::string s = readString(text, i, nullptr);
            if (!stack.empty() && !stack.back().frame.isArray && stack.back().frame.expectKey) {
                Object& o = stack.back();
                o.frame.expectKey = false;
                o.frame.key = s;
                if (!o.keys.insert(s).second) return DuplicateKey{start, pointer(), s};
            } else if (!stack.empty() && stack.back().frame.isArray) {
                ++stack.back().frame.index;
            }
        } else {
            // Whitespace, ':' and the characters of numbers, true, false, null.
            if (!stack.empty() && stack.back().frame.isArray && c != ' ' && c != '\n' && c != '\t' && c != '\r' &&
                (i == 0 || text[i - 1] == '[' || text[i - 1] == ',' || text[i - 1] == ' ' || text[i - 1] == '\n' ||
                 text[i - 1] == '\t' || text[i - 1] == '\r'))
                ++stack.back().frame.index;
            ++i;
        }
    }
    return {};
}

} // namespace abut::detail
