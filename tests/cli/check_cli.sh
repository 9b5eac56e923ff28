#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# abut-cli check: every sample is read (exit 0 or 3), every invalid project is
# refused with exit 2 and a one-line message naming the file; a brief that
# cannot fit its footprint loads but is reported (exit 3, the reason in the
# output); nothing crashes.
set -u
cli=$1; top=$2
fail=0
for f in "$top"/samples/*.abut.json; do
  "$cli" check "$f" >/dev/null 2>/tmp/abut-check-err.$$; rc=$?
  if [ $rc -ne 0 ] && [ $rc -ne 3 ]; then echo "FAIL sample $f: exit $rc"; cat /tmp/abut-check-err.$$; fail=1; fi
  "$cli" check "$f" --json | /usr/bin/python3 -c 'import json,sys; json.load(sys.stdin)' \
    || { echo "FAIL sample $f: --json is not JSON"; fail=1; }
done
for f in "$top"/tests/data/project/invalid/*.abut.json; do
  err=$("$cli" check "$f" 2>&1 >/dev/null); rc=$?
  if [ $rc -ne 2 ]; then echo "FAIL invalid $f: exit $rc, expected 2"; fail=1; fi
  case "$err" in "$f"*) ;; *) echo "FAIL invalid $f: message does not start with the file name: $err"; fail=1;; esac
done
for f in "$top"/tests/data/project/infeasible/*.abut.json; do
  out=$("$cli" check "$f" 2>&1); rc=$?
  if [ $rc -ne 3 ]; then echo "FAIL infeasible $f: exit $rc, expected 3"; fail=1; fi
  expected=$(cat "${f%.abut.json}.expect")
  case "$out" in *"$expected"*) ;; *) echo "FAIL infeasible $f: output lacks: $expected"; fail=1;; esac
done
"$cli" check /no/such/file.abut.json 2>/dev/null; [ $? -eq 2 ] || { echo "FAIL missing file: expected exit 2"; fail=1; }
"$cli" check 2>/dev/null; [ $? -eq 2 ] || { echo "FAIL no argument: expected exit 2"; fail=1; }
"$cli" frobnicate 2>/dev/null; [ $? -eq 2 ] || { echo "FAIL unknown command: expected exit 2"; fail=1; }
rm -f /tmp/abut-check-err.$$
[ $fail -eq 0 ] && echo "check_cli: all passed"
exit $fail
