#!/usr/bin/env bash
# Regenerates the README's screenshots (docs/screenshots/*.png) from a fresh demo workbook: the
# tour program walks the window offscreen as a technician would and saves what each screen shows.
# Usage: bash scripts/screenshots.sh [OUTPUT_FOLDER]
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/setup.sh"

mw_install_packages
mw_build "$MW_ROOT/build/release"
out="${1:-$MW_ROOT/docs/screenshots}"
QT_QPA_PLATFORM=offscreen "$MW_ROOT/build/release/tools/meterwright_tour" "$out"
