// SPDX-License-Identifier: MIT
#include "export/svg_writer.h"

#include "export/schedule.h"

#include <algorithm>
#include <cstdio>

namespace abut {

namespace {

std::string escaped(const std::string& s) {
    std::string out;
    for (std::size_t i = 0; i < s.size(); ++i) {
        const char c = s[i];
        // U+FFFE and U+FFFF (EF BF BE/BF in UTF-8) are not characters XML 1.0
        // allows: a name holding one made the SVG not well-formed. U+FFFD instead.
        if (static_cast<unsigned char>(c) == 0xEF && i + 2 < s.size() && static_cast<unsigned char>(s[i + 1]) == 0xBF &&
            (static_cast<unsigned char>(s[i + 2]) == 0xBE || static_cast<unsigned char>(s[i + 2]) == 0xBF)) {
            out += "\xEF\xBF\xBD";
            i += 2;
            continue;
        }
        switch (c) {
        case '&': out += "&amp;"; break;
        case '<': out += "&lt;"; break;
        case '>': out += "&gt;"; break;
        case '"': out += "&quot;"; break;
        case '\'': out += "&apos;"; break;
        default:
            // Control characters are not allowed in XML 1.0 (the loaders refuse them too).
            if (static_cast<unsigned char>(c) >= 0x20 && c != 0x7F) out += c;
        }
    }
    return out;
}

std::string fmt(double v) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.2f", v);
    return buf;
}

} // namespace

std::string planSvg(const Brief& brief, const Footprint& fp, const PlanVariant& v, double ppu) {
    const double margin = 20;
    const double W = fp.width * ppu + 2 * margin, H = fp.depth * ppu + 2 * margin;
    auto X = [&](double x) { return margin + x * ppu; };
    auto Y = [&](double y) { return margin + (fp.depth - y) * ppu; }; // north up
    std::string out = "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
                      "<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" width=\"" + fmt(W) +
                      "\" height=\"" + fmt(H) + "\" viewBox=\"0 0 " + fmt(W) + " " + fmt(H) + "\">\n";
    out += "  <title>Plan</title>\n";
    out += "  <style>.room{fill:#f4efe4;stroke:#222;stroke-width:1.5}.spare{fill:#ddd;stroke:#666;"
           "stroke-width:1;stroke-dasharray:4 3}.outline{fill:none;stroke:#000;stroke-width:3}"
           "text{font-family:sans-serif;fill:#111;text-anchor:middle}</style>\n";
    const std::string unit = areaUnit(brief.units);
    const std::size_t rooms = std::min(v.rooms.size(), brief.rooms.size());
    for (std::size_t i = 0; i < rooms; ++i) {
        if (brief.rooms[i].cutout) continue;
        const Rect& r = v.rooms[i];
        out += "  <rect class=\"room\" id=\"" + escaped(brief.rooms[i].id) + "\" x=\"" + fmt(X(r.x0)) + "\" y=\"" +
               fmt(Y(r.y1)) + "\" width=\"" + fmt(r.width() * ppu) + "\" height=\"" + fmt(r.depth() * ppu) + "\"/>\n";
    }
    for (const Rect& r : v.spaces)
        out += "  <rect class=\"spare\" x=\"" + fmt(X(r.x0)) + "\" y=\"" + fmt(Y(r.y1)) + "\" width=\"" +
               fmt(r.width() * ppu) + "\" height=\"" + fmt(r.depth() * ppu) + "\"/>\n";
    // The building's outline (round the outside and each courtyard).
    for (const OutlineLoop& loop : footprintOutline(fp)) {
        std::string points;
        for (const auto& [x, y] : loop) points += (points.empty() ? "" : " ") + fmt(X(x)) + "," + fmt(Y(y));
        out += "  <polygon class=\"outline\" points=\"" + points + "\"/>\n";
    }
    for (std::size_t i = 0; i < rooms; ++i) {
        if (brief.rooms[i].cutout) continue;
        const Rect& r = v.rooms[i];
        const double size = std::clamp(std::min(r.width(), r.depth()) * ppu / 6.0, 7.0, 16.0);
        const double cx = X((r.x0 + r.x1) / 2), cy = Y((r.y0 + r.y1) / 2);
        out += "  <text x=\"" + fmt(cx) + "\" y=\"" + fmt(cy - 0.2 * size) + "\" font-size=\"" + fmt(size) + "\">" +
               escaped(brief.rooms[i].displayName()) + "</text>\n";
        out += "  <text x=\"" + fmt(cx) + "\" y=\"" + fmt(cy + 1.0 * size) + "\" font-size=\"" + fmt(size * 0.85) +
               "\">" + fmt(r.area()).substr(0, fmt(r.area()).size() - 1) + " " + unit + "</text>\n";
    }
    out += "</svg>\n";
    return out;
}

} // namespace abut
