// SPDX-License-Identifier: MIT
#pragma once

#include <streambuf>
#include <string>

namespace abut::cli {

// A stream buffer for what abut-cli prints to a terminal: text from the
// input (names, ids, paths) may hold control characters, and a terminal acts
// on them (ESC ] 0 ; … BEL retitles it, ESC [ 2 J clears it). Every C0
// control but the newline and the tab, DEL and the C1 controls (U+0080 to
// U+009F in UTF-8) come out as visible escapes: \x1B, \x7F, \u0085. Other
// bytes pass unchanged. Used on abut-cli's standard error always and on its
// standard output unless that is JSON (which escapes its own strings).
class SafeTextBuf : public std::streambuf {
public:
    explicit SafeTextBuf(std::streambuf* to) : to_(to) {}
    ~SafeTextBuf() override { sync(); }

protected:
    int_type overflow(int_type ch) override {
        if (traits_type::eq_int_type(ch, traits_type::eof())) return traits_type::not_eof(ch);
        put(static_cast<unsigned char>(traits_type::to_char_type(ch)));
        return ch;
    }
    std::streamsize xsputn(const char* s, std::streamsize n) override {
        for (std::streamsize i = 0; i < n; ++i) put(static_cast<unsigned char>(s[i]));
        return n;
    }
    int sync() override {
        if (heldLead_) {
            to_->sputc(static_cast<char>(0xC2));
            heldLead_ = false;
        }
        return to_->pubsync();
    }

private:
    void put(unsigned char c) {
        static const char hex[] = "0123456789ABCDEF";
        if (heldLead_) {
            heldLead_ = false;
            if (c >= 0x80 && c <= 0x9F) { // a C1 control
                to_->sputn("\\u00", 4);
                to_->sputc(hex[c >> 4]);
                to_->sputc(hex[c & 15]);
                return;
            }
            to_->sputc(static_cast<char>(0xC2));
        }
        if (c == 0xC2) {
            heldLead_ = true;
            return;
        }
        if ((c < 0x20 && c != '\n' && c != '\t') || c == 0x7F) {
            to_->sputn("\\x", 2);
            to_->sputc(hex[c >> 4]);
            to_->sputc(hex[c & 15]);
            return;
        }
        to_->sputc(static_cast<char>(c));
    }

    std::streambuf* to_;
    bool heldLead_ = false; // a 0xC2 byte waiting for the next one
};

} // namespace abut::cli
