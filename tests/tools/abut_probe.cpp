// Test helper: answers questions about graphs read from standard input, so
// that Python checks can compare Abut's core with independent libraries.
//   abut_probe planar   < {"graphs": [{"n": 5, "edges": [[0, 1], ...]}, ...]}
//                       > [true, false, ...]
#include "embed/planar_embedding.h"

#include <nlohmann/json.hpp>

#include <iostream>
#include <string>

int main(int argc, char** argv) {
    const std::string mode = argc > 1 ? argv[1] : "";
    if (mode != "planar") {
        std::cerr << "usage: abut_probe planar < graphs.json\n";
        return 2;
    }
    const nlohmann::json in = nlohmann::json::parse(std::cin);
    nlohmann::json out = nlohmann::json::array();
    for (const auto& g : in.at("graphs")) {
        std::vector<std::pair<int, int>> edges;
        for (const auto& e : g.at("edges")) edges.emplace_back(e[0].get<int>(), e[1].get<int>());
        out.push_back(abut::embedPlanar(g.at("n").get<int>(), edges).status ==
                      abut::EmbeddingStatus::Planar);
    }
    std::cout << out.dump() << "\n";
    return 0;
}
