#pragma once

#include <ostream>
#include <string>
#include <vector>

namespace abut::cli {

constexpr int exitOk = 0;
constexpr int exitBadInput = 2;
constexpr int exitNoPlan = 3;

int runCheck(const std::vector<std::string>& args, std::ostream& out, std::ostream& err);

} // namespace abut::cli
