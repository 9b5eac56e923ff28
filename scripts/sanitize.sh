#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Core and its tests built with clang under AddressSanitizer and
# UndefinedBehaviorSanitizer, then the libFuzzer targets for a short,
# time-boxed run each (ABUT_FUZZ_SECONDS, default 60). Any sanitizer report
# fails the run. Part of scripts/test.sh; runs alone too.
set -euo pipefail
cd "$(dirname "$0")/.."
scripts/install-deps.sh
cmake -S . -B build-sanitize -DCMAKE_CXX_COMPILER=clang++ -DCMAKE_BUILD_TYPE=RelWithDebInfo \
  -DABUT_BUILD_APP=OFF -DABUT_SANITIZE=ON -DABUT_FUZZ=ON \
  -DABUT_FUZZ_SECONDS="${ABUT_FUZZ_SECONDS:-60}" >/dev/null
cmake --build build-sanitize -j2
cd build-sanitize
export ASAN_OPTIONS=halt_on_error=1:detect_leaks=1:abort_on_error=0
export UBSAN_OPTIONS=halt_on_error=1:print_stacktrace=1
# The 10,000-brief property run takes about 6 minutes natively and some ten
# times longer under the sanitizers: here 400 briefs in batches of 50.
export ABUT_PROPERTY_BRIEFS="${ABUT_PROPERTY_BRIEFS:-400}"
export ABUT_PROPERTY_BATCH="${ABUT_PROPERTY_BATCH:-50}"
QT_QPA_PLATFORM=offscreen ctest --output-on-failure -L 'core|fuzz' "$@"
