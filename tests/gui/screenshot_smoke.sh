#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# The editor opens every sample offscreen and renders a non-empty window image;
# a bad file makes the screenshot mode exit 2 instead of drawing nothing.
set -u
app=$1; top=$2; out=$(mktemp -d)
fail=0
for f in "$top"/samples/*.abut.json; do
  png="$out/$(basename "$f" .abut.json).png"
  QT_QPA_PLATFORM=offscreen timeout 60 "$app" --screenshot "$png" --size 1200x800 "$f" 2>/dev/null
  rc=$?
  if [ $rc -ne 0 ] || [ ! -s "$png" ]; then echo "FAIL $f: exit $rc"; fail=1; continue; fi
  # PNG signature and a width of 1200 in the IHDR chunk.
  w=$(od -An -tu1 -j16 -N4 "$png" | awk '{print $1*16777216+$2*65536+$3*256+$4}')
  [ "$w" = 1200 ] || { echo "FAIL $f: width $w"; fail=1; }
done
QT_QPA_PLATFORM=offscreen timeout 60 "$app" --screenshot "$out/bad.png" \
  "$top/tests/data/project/invalid/negative-area.abut.json" >/dev/null 2>&1
[ $? -eq 2 ] || { echo "FAIL: a bad file should make --screenshot exit 2"; fail=1; }
rm -rf "$out"
[ $fail -eq 0 ] && echo "screenshot_smoke: all passed"
exit $fail
