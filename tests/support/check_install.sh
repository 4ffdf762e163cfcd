#!/usr/bin/env bash
# `cmake --install` puts the desktop entry, icon and workbook file type where a desktop finds
# them, and the file type recognises a workbook by its extension and, under any other name, by
# its content, while a plain SQLite file stays a plain SQLite file (freedesktop.org
# shared-mime-info and Desktop Entry specifications).
# Usage: check_install.sh BUILD_DIR
set -euo pipefail
build="$1"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT

DESTDIR="$work/root" cmake --install "$build" --prefix /usr >/dev/null
share="$work/root/usr/share"
for file in "$work/root/usr/bin/meterwright" "$share/applications/meterwright.desktop" \
    "$share/mime/packages/meterwright-workbook.xml" \
    "$share/icons/hicolor/scalable/apps/meterwright.svg"; do
    [ -e "$file" ] || { echo "not installed: ${file#"$work/root"}"; exit 1; }
done
desktop-file-validate "$share/applications/meterwright.desktop"
update-mime-database "$share/mime" 2>/dev/null

"$build/app/meterwright" demo "$work/lab.meterwright" >/dev/null
cp "$work/lab.meterwright" "$work/renamed.db"
sqlite3 "$work/plain.meterwright-not" "CREATE TABLE t (a)"
type_of() {
    XDG_DATA_HOME="$share" XDG_DATA_DIRS="$share:/usr/share" \
        gio info -a standard::content-type "$1" | sed -n 's/.*content-type: //p'
}
expect() {
    local got
    got="$(type_of "$1")"
    if [ "$got" != "$2" ]; then
        echo "$(basename "$1"): expected $2, got $got"
        exit 1
    fi
    echo "$(basename "$1"): $got"
}
expect "$work/lab.meterwright" application/x-meterwright-workbook
expect "$work/renamed.db" application/x-meterwright-workbook
expect "$work/plain.meterwright-not" application/vnd.sqlite3
