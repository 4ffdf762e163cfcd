#!/usr/bin/env bash
# Installs what is missing, checks formatting, builds, and runs the whole test suite with ctest:
# the engine and workbook tests once more under AddressSanitizer + UBSan, then every test on the
# Release build. Ends with ctest's summary line.
# Usage: bash scripts/test.sh
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/setup.sh"
cd "$MW_ROOT"

mw_install_packages

echo "test: checking formatting (clang-format 14, .clang-format)"
mapfile -t sources < <(git ls-files -- 'app/*.cpp' 'app/*.h' 'core/*.cpp' 'core/*.h' \
    'storage/*.cpp' 'storage/*.h' 'tests/*.cpp' 'tests/*.h' 'bench/*.cpp' 'bench/*.h' \
    'tools/*.cpp' 'tools/*.h')
if [ "${#sources[@]}" -gt 0 ]; then
    clang-format --dry-run -Werror "${sources[@]}"
fi

echo "test: engine and workbook tests under AddressSanitizer + UndefinedBehaviorSanitizer"
mw_build "$MW_ROOT/build/sanitize" -DCMAKE_BUILD_TYPE=Debug -DMW_SANITIZE=ON \
    -DMW_BUILD_APP=OFF -DMW_BUILD_BENCH=OFF
ASAN_OPTIONS=detect_leaks=1 UBSAN_OPTIONS=print_stacktrace=1 \
    ctest --test-dir "$MW_ROOT/build/sanitize" --output-on-failure --no-tests=error -j2

echo "test: full suite on the Release build"
mw_build "$MW_ROOT/build/release"
ctest --test-dir "$MW_ROOT/build/release" --output-on-failure --no-tests=error -j2
