#!/usr/bin/env bash
# Builds the Release tree and runs the benchmarks. They print figures and ratios against a floor
# measured in the same run; they are not pass/fail tests.
# Usage: bash scripts/bench.sh [--keep FILE]   (--keep reuses/keeps the million-reading workbook)
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/setup.sh"

mw_install_packages
mw_build "$MW_ROOT/build/release"

echo "== rectifier model (target: 11-point plan and multiplier solve under 1 ms each)"
"$MW_ROOT/build/release/bench/rectifier_bench"
echo
echo "== the bench screen (target: a typed value saved, evaluated and shown within 16 ms)"
QT_QPA_PLATFORM=offscreen "$MW_ROOT/build/release/bench/app_typing_bench"
echo
echo "== calibration records as PDF on the demo workbook (targets: one record < 300 ms,"
echo "   100 records < 20 s)"
"$MW_ROOT/build/release/bench/record_bench"
echo
echo "== workbook of about 1,000,000 readings (targets: history < 5 ms, due list < 20 ms,"
echo "   saving 40 readings < 20 ms, open with quick_check < 500 ms); building it takes minutes"
"$MW_ROOT/build/release/bench/storage_workbook_bench" "$@"
echo
echo "== start-up to first paint (target: <= 1.5 x a minimal window with one chart, not growing"
echo "   with the workbook); the large workbook is the one --keep kept, when given"
large=()
if [ "${1:-}" = "--keep" ] && [ -n "${2:-}" ]; then
    large=(--large "$2")
fi
QT_QPA_PLATFORM=offscreen "$MW_ROOT/build/release/bench/app_startup_bench" "${large[@]}"
echo
echo "== one instrument's history opened, buildHistory included (target: under 100 ms and flat"
echo "   from 10,000 to 1,000,000 readings); the large workbook is the one --keep kept, when given"
QT_QPA_PLATFORM=offscreen "$MW_ROOT/build/release/bench/storage_history_bench" "${large[@]}"
