// SPDX-License-Identifier: MIT
// libFuzzer target: the project-file loader. Any input must either be
// refused with at least one located message, or load into a brief whose
// canonical text loads again to the same text (the round trip the editor
// relies on to lose nothing).
#include "io/project_io.h"

#include <cstdint>
#include <cstdlib>
#include <string>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string text(reinterpret_cast<const char*>(data), size);
    const abut::LoadResult r = abut::parseProject(text, "fuzz.abut.json");
    if (!r.ok()) {
        if (r.errors.empty()) std::abort(); // refused without saying why
        return 0;
    }
    const std::string once = abut::serializeProject(r.brief);
    const abut::LoadResult again = abut::parseProject(once, "again.abut.json");
    if (!again.ok() || abut::serializeProject(again.brief) != once) std::abort();
    return 0;
}
