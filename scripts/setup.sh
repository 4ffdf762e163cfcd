#!/usr/bin/env bash
# Installs what Meterwright needs on Debian 12 (only what is missing) and builds it.
# Sourced by run.sh and test.sh; usable alone: bash scripts/setup.sh [BUILD_DIR]
set -euo pipefail

MW_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"

# Build tools, Qt 6 (Widgets, Charts, SQL with the SQLite driver, Svg, PrintSupport), Catch2 for
# the tests, ngspice and Boost.Math as independent references for the engine's tests, Xvfb for
# running the window without a desktop, fonts for rendering records offscreen, poppler's
# pdftotext and pdftoppm for the tests that read the records back.
MW_PACKAGES=(
    build-essential cmake pkg-config git
    qt6-base-dev qt6-base-dev-tools qt6-charts-dev qt6-svg-dev libqt6opengl6-dev
    libqt6sql6-sqlite qt6-qpa-plugins libsqlite3-dev sqlite3 libsodium-dev
    catch2 libboost-math-dev ngspice
    xvfb xauth fonts-dejavu-core clang-format poppler-utils
    desktop-file-utils shared-mime-info libglib2.0-bin
)

mw_install_packages() {
    local missing=()
    local package
    for package in "${MW_PACKAGES[@]}"; do
        if ! dpkg-query -W -f='${Status}' "$package" 2>/dev/null | grep -q "install ok installed"; then
            missing+=("$package")
        fi
    done
    if [ "${#missing[@]}" -eq 0 ]; then
        echo "setup: all ${#MW_PACKAGES[@]} packages already installed"
        return 0
    fi
    echo "setup: installing ${missing[*]}"
    local sudo=""
    if [ "$(id -u)" -ne 0 ]; then
        if ! command -v sudo >/dev/null 2>&1; then
            echo "setup: not root and sudo is missing; install as root: apt-get install ${missing[*]}" >&2
            return 1
        fi
        sudo="sudo"
    fi
    $sudo env DEBIAN_FRONTEND=noninteractive apt-get update -qq
    $sudo env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends \
        "${missing[@]}"
}

# mw_build DIR [cmake options...]: configure (once) and build with two jobs.
mw_build() {
    local dir="$1"
    shift
    cmake -S "$MW_ROOT" -B "$dir" -DCMAKE_BUILD_TYPE=Release "$@" >/dev/null
    cmake --build "$dir" -j2
}

if [ "${BASH_SOURCE[0]}" = "$0" ]; then
    mw_install_packages
    mw_build "${1:-$MW_ROOT/build/release}"
fi
