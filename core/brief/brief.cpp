// SPDX-License-Identifier: MIT
#include "brief/brief.h"

#include <nlohmann/json.hpp>

#include <cmath>

namespace abut {

UnknownFields::UnknownFields(OrderedJson fields)
    : fields_(fields.is_object() && !fields.empty() ? std::make_shared<const OrderedJson>(std::move(fields)) : nullptr) {}

const OrderedJson& UnknownFields::json() const {
    static const OrderedJson none = OrderedJson::object();
    return fields_ ? *fields_ : none;
}

bool UnknownFields::empty() const { return !fields_ || fields_->empty(); }

char sideLetter(Side s) { return "NESW"[static_cast<int>(s)]; }

std::optional<Side> sideFromLetter(const std::string& s) {
    if (s == "N") return Side::N;
    if (s == "E") return Side::E;
    if (s == "S") return Side::S;
    if (s == "W") return Side::W;
    return std::nullopt;
}

int Brief::roomIndex(const std::string& id) const {
    for (std::size_t i = 0; i < rooms.size(); ++i)
        if (rooms[i].id == id) return static_cast<int>(i);
    return -1;
}

double Brief::totalTargetArea() const {
    double sum = 0.0;
    for (const Room& r : rooms) sum += r.area;
    return sum;
}

Footprint Brief::effectiveFootprint() const {
    if (footprint) return *footprint;
    // No footprint given: a rectangle of the total target area with the
    // proportion 4:3, a common plan proportion (common practice, no source).
    const double area = totalTargetArea();
    const double width = std::sqrt(area * 4.0 / 3.0);
    return {width, width > 0 ? area / width : 0.0};
}

const SketchPoint* Brief::sketchPosition(const std::string& id) const {
    for (const auto& [key, p] : sketch)
        if (key == id) return &p;
    return nullptr;
}

const char* toString(AdjacencyKind k) { return k == AdjacencyKind::Door ? "door" : "wall"; }
const char* toString(Priority p) { return p == Priority::Must ? "must" : "should"; }

std::size_t controlCharacterAt(const std::string& text) {
    for (std::size_t i = 0; i < text.size(); ++i) {
        const unsigned char c = static_cast<unsigned char>(text[i]);
        if (c < 0x20 || c == 0x7F) return i;
    }
    return std::string::npos;
}

Brief plannedBrief(const Brief& brief) {
    Brief out = brief;
    if (brief.surplus != Surplus::Spread || !brief.footprint) return out;
    const double total = brief.totalTargetArea();
    const double area = brief.footprint->width * brief.footprint->depth;
    if (total <= 0 || total >= area) return out;
    for (Room& r : out.rooms) r.area *= area / total;
    return out;
}

} // namespace abut
