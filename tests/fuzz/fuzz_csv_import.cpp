// SPDX-License-Identifier: MIT
// libFuzzer target: the CSV importer (room list or adjacency matrix). Any
// input is refused with located messages, or yields a brief that saves and
// loads back unchanged.
#include "brief/brief_edit.h"
#include "io/csv_import.h"
#include "io/project_io.h"

#include <cstdint>
#include <cstdlib>
#include <string>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string text(reinterpret_cast<const char*>(data), size);
    abut::Brief start;
    abut::Room hall;
    hall.id = "hall";
    hall.name = "Hall";
    hall.area = 10;
    abut::addRoom(start, hall);
    const abut::CsvImportResult r = abut::importCsv(text, "fuzz.csv", start);
    if (!r.ok()) {
        if (r.errors.empty()) std::abort();
        return 0;
    }
    const std::string once = abut::serializeProject(r.brief);
    const abut::LoadResult again = abut::parseProject(once, "again.abut.json");
    if (!again.ok() || abut::serializeProject(again.brief) != once) std::abort();
    return 0;
}
