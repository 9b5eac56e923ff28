#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Installs everything Abut needs to build, run and test on Debian 12.
# Used by README.md, .ci/run and developers alike. Idempotent: when every
# package is present it prints nothing and touches no package list.
set -euo pipefail

packages=(
  # build
  build-essential cmake pkg-config git
  # sanitizer build and fuzzing (clang with libFuzzer)
  clang libclang-rt-14-dev
  # libraries
  qt6-base-dev qt6-base-dev-tools qt6-svg-dev libqt6svg6 qt6-qpa-plugins
  libgl-dev libvulkan-dev libxkbcommon-dev
  libboost-graph-dev nlohmann-json3-dev libeigen3-dev
  # fonts so offscreen rendering and PDF sheets have legible text
  fonts-dejavu-core fontconfig
  # headless GUI runs and screenshots
  xvfb xauth imagemagick
  # independent reference checks used by the tests
  python3 python3-networkx python3-shapely python3-ezdxf poppler-utils
)

missing=()
for p in "${packages[@]}"; do
  if ! dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed"; then
    missing+=("$p")
  fi
done
[ ${#missing[@]} -eq 0 ] && exit 0

sudo=""
[ "$(id -u)" -eq 0 ] || sudo="sudo"
echo "install-deps: installing ${missing[*]}" >&2
export DEBIAN_FRONTEND=noninteractive
$sudo apt-get update -qq
$sudo apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
