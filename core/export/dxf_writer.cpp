// SPDX-License-Identifier: MIT
#include "export/dxf_writer.h"

#include <algorithm>
#include <cctype>
#include <cstdint>
#include <cstdio>
#include <set>
#include <sstream>
#include <vector>

namespace abut {

std::string dxfLayerOf(const std::string& category) {
    std::string out = "ROOM-";
    for (unsigned char c : category.empty() ? std::string("GENERAL") : category)
        out += std::isalnum(c) ? static_cast<char>(std::toupper(c)) : (c == '-' || c == '_' ? static_cast<char>(c) : '_');
    if (out.size() <= dxfStringLimit) return out;
    // Cut to the limit; the rest kept apart by a hash of the whole name
    // (FNV-1a, 32 bits), so two long categories stay on two layers.
    std::uint32_t h = 2166136261u;
    for (unsigned char c : category) h = (h ^ c) * 16777619u;
    char tail[16];
    std::snprintf(tail, sizeof tail, "-%08X", static_cast<unsigned>(h));
    return out.substr(0, dxfStringLimit - 9) + tail;
}

// One character of TEXT: printable ASCII as it is, but a backslash as
// \U+005C (so that "\U+0042" in a name is not read as "B") and a percent
// sign that would begin a control code ("%%d" is a degree sign) as "%%%",
// the reference's single percent sign (Autodesk, "Control Codes and Special
// Characters Reference"); other characters as \U+XXXX (four hex digits, so
// readers decode only the Basic Multilingual Plane; beyond it U+FFFD, the
// visible replacement character); control characters left out.
namespace {
std::string textPiece(char32_t cp, bool percentFollows) {
    if (cp == '\\') return "\\U+005C";
    if (cp == '%') return percentFollows ? "%%%" : "%";
    if (cp < 0x80) return std::string(1, static_cast<char>(cp));
    char buf[16];
    std::snprintf(buf, sizeof buf, "\\U+%04X", static_cast<unsigned>(cp > 0xFFFF ? 0xFFFD : cp));
    return buf;
}
} // namespace

std::string dxfText(const std::string& utf8) {
    std::vector<char32_t> cps;
    for (std::size_t i = 0; i < utf8.size();) {
        const unsigned char c = utf8[i];
        char32_t cp = c;
        int len = 1;
        if (c >= 0xF0) { cp = c & 0x07; len = 4; }
        else if (c >= 0xE0) { cp = c & 0x0F; len = 3; }
        else if (c >= 0xC0) { cp = c & 0x1F; len = 2; }
        for (int k = 1; k < len && i + k < utf8.size(); ++k) cp = (cp << 6) | (utf8[i + k] & 0x3F);
        i += len;
        // Control characters out first, so that "%", a control, "%" is not written as "%%".
        if (cp >= 0x20 && cp != 0x7F) cps.push_back(cp);
    }
    std::string out;
    const std::string ellipsis = "\\U+2026";
    for (std::size_t k = 0; k < cps.size(); ++k) {
        const std::string piece = textPiece(cps[k], k + 1 < cps.size() && cps[k + 1] == '%');
        // Never past the limit, never cutting an escape in two: the last
        // place that still holds an ellipsis says the name goes on.
        const bool last = k + 1 == cps.size();
        if (out.size() + piece.size() + (last ? 0 : ellipsis.size()) > dxfStringLimit) {
            if (!last || out.size() + piece.size() > dxfStringLimit) return out + ellipsis;
        }
        out += piece;
    }
    return out;
}

namespace {

class Dxf {
public:
    void pair(int code, const std::string& value) { out_ << code << "\n" << value << "\n"; }
    void pair(int code, int value) { pair(code, std::to_string(value)); }
    void real(int code, double value) {
        char buf[64];
        std::snprintf(buf, sizeof buf, "%.6f", value);
        pair(code, buf);
    }
    std::string handle() {
        char buf[16];
        std::snprintf(buf, sizeof buf, "%X", next_++);
        return buf;
    }
    int peekSeed() const { return next_; }
    std::string text() const { return out_.str(); }

private:
    std::ostringstream out_;
    int next_ = 0x20;
};

// Handles are fixed where tables point at each other.
namespace handle {
const std::string hBlockRecordTable = "1", hModel = "2", hPaper = "3", hLayerTable = "4", hLtypeTable = "5",
    hStyleTable = "6", hAppidTable = "7", hVportTable = "8", hViewTable = "9", hUcsTable = "A",
    hDimstyleTable = "B", hRootDict = "C", hGroupDict = "D", hByBlock = "E", hByLayer = "F",
    hContinuous = "10", hStandardStyle = "11", hAcadAppid = "12", hActiveVport = "13",
    hStandardDimstyle = "14", hModelBlock = "15", hModelEnd = "16", hPaperBlock = "17",
    hPaperEnd = "18";
} // namespace handle

using namespace handle;

// The entities (into their own buffer, `e`, so that `d`'s handle seed is
// known afterwards): the outline, each room's rectangle (and its inner wall
// line), its name and area, the spare spaces.
void writeEntities(Dxf& d, Dxf& e, const Brief& brief, const Footprint& fp, const PlanVariant& v,
                   const DxfOptions& options) {
    const double textHeight = options.textHeight > 0 ? options.textHeight
                                                      : std::max(0.12, std::min(fp.width, fp.depth) / 60.0);
    auto loop = [&](const OutlineLoop& corners, const std::string& layer) {
        e.pair(0, "LWPOLYLINE");
        e.pair(5, d.handle());
        e.pair(330, hModel);
        e.pair(100, "AcDbEntity");
        e.pair(8, layer);
        e.pair(100, "AcDbPolyline");
        e.pair(90, static_cast<int>(corners.size()));
        e.pair(70, 1); // closed
        for (const auto& [x, y] : corners) {
            e.real(10, x);
            e.real(20, y);
        }
    };
    auto poly = [&](const Rect& r, const std::string& layer) {
        loop({{r.x0, r.y0}, {r.x1, r.y0}, {r.x1, r.y1}, {r.x0, r.y1}}, layer);
    };
    auto text = [&](double x, double y, double h, const std::string& s) {
        e.pair(0, "TEXT");
        e.pair(5, d.handle());
        e.pair(330, hModel);
        e.pair(100, "AcDbEntity");
        e.pair(8, "LABELS");
        e.pair(100, "AcDbText");
        e.real(10, x);
        e.real(20, y);
        e.real(30, 0.0);
        e.real(40, h);
        e.pair(1, dxfText(s));
        e.pair(72, 1); // centred
        e.real(11, x);
        e.real(21, y);
        e.real(31, 0.0);
        e.pair(100, "AcDbText");
        e.pair(73, 2); // middle
    };
    // The building's outline: one closed polyline round the outside, one
    // round each courtyard.
    for (const OutlineLoop& l : footprintOutline(fp)) loop(l, "OUTLINE");
    const std::string unit = brief.units == "ft" ? "ft2" : "m2";
    for (std::size_t i = 0; i < v.rooms.size() && i < brief.rooms.size(); ++i) {
        if (brief.rooms[i].cutout) continue;
        const Rect& r = v.rooms[i];
        poly(r, dxfLayerOf(brief.rooms[i].category));
        if (options.wallThickness > 0) {
            const double t = options.wallThickness / 2;
            if (r.width() > 2 * t && r.depth() > 2 * t) poly(Rect{r.x0 + t, r.y0 + t, r.x1 - t, r.y1 - t}, "WALLS");
        }
        const double h = std::min(textHeight, 0.18 * std::min(r.width(), r.depth()));
        char area[64];
        std::snprintf(area, sizeof area, "%.1f %s", r.area(), unit.c_str());
        const double cx = (r.x0 + r.x1) / 2, cy = (r.y0 + r.y1) / 2;
        text(cx, cy + 0.7 * h, h, brief.rooms[i].displayName());
        text(cx, cy - 0.7 * h, h * 0.8, area);
    }
    for (const Rect& s : v.spaces) poly(s, "SPARE");

}

void writeHeader(Dxf& d, const Brief& brief, const Footprint& fp) {
    d.pair(0, "SECTION");
    d.pair(2, "HEADER");
    d.pair(9, "$ACADVER");
    d.pair(1, "AC1015");
    d.pair(9, "$DWGCODEPAGE");
    d.pair(3, "ANSI_1252");
    d.pair(9, "$INSBASE");
    d.real(10, 0);
    d.real(20, 0);
    d.real(30, 0);
    d.pair(9, "$EXTMIN");
    d.real(10, 0);
    d.real(20, 0);
    d.real(30, 0);
    d.pair(9, "$EXTMAX");
    d.real(10, fp.width);
    d.real(20, fp.depth);
    d.real(30, 0);
    d.pair(9, "$INSUNITS");
    d.pair(70, brief.units == "ft" ? 2 : 6);
    d.pair(9, "$MEASUREMENT");
    d.pair(70, brief.units == "ft" ? 0 : 1);
    d.pair(9, "$HANDSEED");
    d.pair(5, "FFFFF");
    d.pair(0, "ENDSEC");

}

void tableStart(Dxf& d, const std::string& name, const std::string& h, int count) {
    d.pair(0, "TABLE");
    d.pair(2, name);
    d.pair(5, h);
    d.pair(330, "0");
    d.pair(100, "AcDbSymbolTable");
    d.pair(70, count);
}

void tableEntry(Dxf& d, const std::string& type, const std::string& h, const std::string& owner, const std::string& sub) {
    d.pair(0, type);
    d.pair(5, h);
    d.pair(330, owner);
    d.pair(100, "AcDbSymbolTableRecord");
    d.pair(100, sub);
}

// The view a reader opens on: the whole footprint.
void writeViewport(Dxf& d, const Footprint& fp) {
    tableStart(d, "VPORT", hVportTable, 1);
    tableEntry(d, "VPORT", hActiveVport, hVportTable, "AcDbViewportTableRecord");
    d.pair(2, "*ACTIVE");
    d.pair(70, 0);
    d.real(10, 0); d.real(20, 0); d.real(11, 1); d.real(21, 1);
    d.real(12, fp.width / 2); d.real(22, fp.depth / 2);
    d.real(13, 0); d.real(23, 0); d.real(14, 1); d.real(24, 1); d.real(15, 0); d.real(25, 0);
    d.real(16, 0); d.real(26, 0); d.real(36, 1); d.real(17, 0); d.real(27, 0); d.real(37, 0);
    d.real(40, std::max(fp.width, fp.depth) * 1.2); d.real(41, 1.5); d.real(42, 50);
    d.real(43, 0); d.real(44, 0); d.real(50, 0); d.real(51, 0);
    d.pair(71, 0); d.pair(72, 100); d.pair(73, 1); d.pair(74, 3); d.pair(75, 0); d.pair(76, 0);
    d.pair(77, 0); d.pair(78, 0); d.pair(281, 0); d.pair(65, 1);
    d.real(110, 0); d.real(120, 0); d.real(130, 0); d.real(111, 1); d.real(121, 0); d.real(131, 0);
    d.real(112, 0); d.real(122, 1); d.real(132, 0); d.pair(79, 0); d.real(146, 0);
    d.pair(0, "ENDTAB");
}

// One layer per category, OUTLINE, SPARE, LABELS (and WALLS).
void writeLayers(Dxf& d, const std::set<std::string>& layers) {
    tableStart(d, "LAYER", hLayerTable, static_cast<int>(layers.size()));
    int colour = 1;
    for (const std::string& name : layers) {
        tableEntry(d, "LAYER", d.handle(), hLayerTable, "AcDbLayerTableRecord");
        d.pair(2, name);
        d.pair(70, 0);
        d.pair(62, name == "0" ? 7 : name == "OUTLINE" ? 7 : name == "LABELS" ? 7 : name == "SPARE" ? 8 : (colour++ % 6) + 1);
        d.pair(6, "Continuous");
        d.pair(370, -3);
        d.pair(390, "0");
    }
    d.pair(0, "ENDTAB");
}

void writeTables(Dxf& d, const Footprint& fp, const std::set<std::string>& layers) {
    d.pair(0, "SECTION");
    d.pair(2, "TABLES");
    writeViewport(d, fp);
    tableStart(d, "LTYPE", hLtypeTable, 3);
    for (const auto& [h, name] : {std::pair{hByBlock, "ByBlock"}, {hByLayer, "ByLayer"}, {hContinuous, "Continuous"}}) {
        tableEntry(d, "LTYPE", h, hLtypeTable, "AcDbLinetypeTableRecord");
        d.pair(2, name);
        d.pair(70, 0);
        d.pair(3, name == std::string("Continuous") ? "Solid line" : "");
        d.pair(72, 65);
        d.pair(73, 0);
        d.real(40, 0);
    }
    d.pair(0, "ENDTAB");
    writeLayers(d, layers);
    tableStart(d, "STYLE", hStyleTable, 1);
    tableEntry(d, "STYLE", hStandardStyle, hStyleTable, "AcDbTextStyleTableRecord");
    d.pair(2, "Standard");
    d.pair(70, 0);
    d.real(40, 0);
    d.real(41, 1);
    d.real(50, 0);
    d.pair(71, 0);
    d.real(42, 2.5);
    d.pair(3, "txt");
    d.pair(4, "");
    d.pair(0, "ENDTAB");
    tableStart(d, "VIEW", hViewTable, 0);
    d.pair(0, "ENDTAB");
    tableStart(d, "UCS", hUcsTable, 0);
    d.pair(0, "ENDTAB");
    tableStart(d, "APPID", hAppidTable, 1);
    tableEntry(d, "APPID", hAcadAppid, hAppidTable, "AcDbRegAppTableRecord");
    d.pair(2, "ACAD");
    d.pair(70, 0);
    d.pair(0, "ENDTAB");
    d.pair(0, "TABLE");
    d.pair(2, "DIMSTYLE");
    d.pair(5, hDimstyleTable);
    d.pair(330, "0");
    d.pair(100, "AcDbSymbolTable");
    d.pair(70, 1);
    d.pair(100, "AcDbDimStyleTable");
    d.pair(0, "DIMSTYLE");
    d.pair(105, hStandardDimstyle);
    d.pair(330, hDimstyleTable);
    d.pair(100, "AcDbSymbolTableRecord");
    d.pair(100, "AcDbDimStyleTableRecord");
    d.pair(2, "Standard");
    d.pair(70, 0);
    d.pair(340, hStandardStyle);
    d.pair(0, "ENDTAB");
    tableStart(d, "BLOCK_RECORD", hBlockRecordTable, 2);
    for (const auto& [h, name] : {std::pair{hModel, "*Model_Space"}, {hPaper, "*Paper_Space"}}) {
        tableEntry(d, "BLOCK_RECORD", h, hBlockRecordTable, "AcDbBlockTableRecord");
        d.pair(2, name);
        d.pair(340, "0");
        d.pair(70, 0);
        d.pair(280, 1);
        d.pair(281, 0);
    }
    d.pair(0, "ENDTAB");
    d.pair(0, "ENDSEC");

}

void writeBlocks(Dxf& d) {
    d.pair(0, "SECTION");
    d.pair(2, "BLOCKS");
    for (const auto& [hb, he, owner, name] :
         {std::tuple{hModelBlock, hModelEnd, hModel, "*Model_Space"}, {hPaperBlock, hPaperEnd, hPaper, "*Paper_Space"}}) {
        d.pair(0, "BLOCK");
        d.pair(5, hb);
        d.pair(330, owner);
        d.pair(100, "AcDbEntity");
        d.pair(8, "0");
        d.pair(100, "AcDbBlockBegin");
        d.pair(2, name);
        d.pair(70, 0);
        d.real(10, 0);
        d.real(20, 0);
        d.real(30, 0);
        d.pair(3, name);
        d.pair(1, "");
        d.pair(0, "ENDBLK");
        d.pair(5, he);
        d.pair(330, owner);
        d.pair(100, "AcDbEntity");
        d.pair(8, "0");
        d.pair(100, "AcDbBlockEnd");
    }
    d.pair(0, "ENDSEC");

}

// OBJECTS: the root dictionary and the group dictionary, then the end.
std::string objectsSection() {
    Dxf o;
    o.pair(0, "SECTION");
    o.pair(2, "OBJECTS");
    o.pair(0, "DICTIONARY");
    o.pair(5, hRootDict);
    o.pair(330, "0");
    o.pair(100, "AcDbDictionary");
    o.pair(281, 1);
    o.pair(3, "ACAD_GROUP");
    o.pair(350, hGroupDict);
    o.pair(0, "DICTIONARY");
    o.pair(5, hGroupDict);
    o.pair(330, hRootDict);
    o.pair(100, "AcDbDictionary");
    o.pair(281, 1);
    o.pair(0, "ENDSEC");
    o.pair(0, "EOF");
    return o.text();
}

} // namespace

std::string planDxf(const Brief& brief, const Footprint& fp, const PlanVariant& v, const DxfOptions& options) {
    Dxf d;
    std::set<std::string> layers{"0", "OUTLINE", "SPARE", "LABELS"};
    for (const Room& r : brief.rooms) layers.insert(dxfLayerOf(r.category));
    if (options.wallThickness > 0) layers.insert("WALLS");

    Dxf e;
    writeEntities(d, e, brief, fp, v, options);
    writeHeader(d, brief, fp);
    writeTables(d, fp, layers);
    writeBlocks(d);
    return d.text() + "0\nSECTION\n2\nENTITIES\n" + e.text() + "0\nENDSEC\n" + objectsSection();
}

} // namespace abut
