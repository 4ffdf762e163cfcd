#!/usr/bin/env bash
# Takes a screenshot of the meterwright window on a virtual display, for the README and reviews.
# Usage: bash scripts/screenshot.sh OUT.png [meterwright arguments...]
# Needs a build in build/release (bash scripts/setup.sh) and ImageMagick's `import`.
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
out="$(realpath -m "$1")"
shift
app="$root/build/release/app/meterwright"
command -v import >/dev/null || { echo "screenshot: ImageMagick's import is missing (apt-get install imagemagick)" >&2; exit 2; }
export MW_SCREENSHOT_OUT="$out"
xvfb-run -a -s "-screen 0 1280x800x24" bash -c '
    "$0" "$@" &
    pid=$!
    sleep "${MW_SCREENSHOT_DELAY:-3}"
    import -window root -crop 1180x720+0+0 "$MW_SCREENSHOT_OUT"
    kill "$pid"
' "$app" "$@" 2>/dev/null || true
[ -s "$out" ] || { echo "screenshot: no image was written to $out" >&2; exit 1; }
echo "screenshot: $out"
