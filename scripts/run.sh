#!/usr/bin/env bash
# Installs what is missing, builds a Release build and opens Meterwright on the demo workbook.
# Usage: bash scripts/run.sh        (needs a display; else: xvfb-run -a bash scripts/run.sh)
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/setup.sh"

mw_install_packages
mw_build "$MW_ROOT/build/release"

app="$MW_ROOT/build/release/app/meterwright"
if [ -z "${DISPLAY:-}" ] && [ -z "${WAYLAND_DISPLAY:-}" ] && [ -z "${QT_QPA_PLATFORM:-}" ]; then
    echo "run: built $app, but there is no display (DISPLAY and WAYLAND_DISPLAY are unset)." >&2
    echo "run: to open the window on a virtual display: xvfb-run -a bash scripts/run.sh" >&2
    exit 2
fi

# The demo workbook is written once; later runs open it as it was left.
demo="$MW_ROOT/build/demo.meterwright"
if [ ! -f "$demo" ]; then
    "$app" demo "$demo"
fi
exec "$app" "$demo"
