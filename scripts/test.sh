#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# The README's test command: installs what is missing, builds, runs every
# test, then the sanitizer and fuzzing run (scripts/sanitize.sh).
# ABUT_QUICK=1 skips the sanitizer run for a faster local loop.
set -euo pipefail
cd "$(dirname "$0")/.."
scripts/install-deps.sh
cmake -S . -B build -DCMAKE_BUILD_TYPE=RelWithDebInfo >/dev/null
cmake --build build -j2
(cd build && QT_QPA_PLATFORM=offscreen ctest --output-on-failure "$@")
if [ "${ABUT_QUICK:-0}" != 1 ]; then
  scripts/sanitize.sh
fi
