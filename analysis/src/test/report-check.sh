#!/usr/bin/env bash
# Opens a tufa report in headless Chromium and fails on a console error or an image that did not load.
# Usage: analysis/src/test/report-check.sh DIR [UNIT]   (DIR holds report/index.html, as written by
# `tufa analyze --out DIR`; UNIT is a folder under DIR/report/units, default the first)
# Checks report/index.html and one unit page: each is loaded twice, once dumping the DOM (each page's inline
# script writes the count of broken images into <html data-broken-images="N"> on load) and once taking a
# screenshot (DIR/report-check/*.png, 1400x2000) with console messages logged to stderr.
# Exit 0 all good, 1 a check failed, 2 usage or no browser.
set -euo pipefail

dir="${1:?usage: $0 DIR}"
report="$dir/report"
browser="${CHROMIUM:-/usr/bin/chromium}"
[ -x "$browser" ] || { echo "report-check: no chromium at $browser (apt-get install chromium)" >&2; exit 2; }
[ -f "$report/index.html" ] || { echo "report-check: $report/index.html not found" >&2; exit 2; }

# The unit page: DIR/report/units/UNIT/index.html when a second argument names UNIT, else the first in name order
# (sed reads all input, so no SIGPIPE under pipefail as with head).
if [ -n "${2:-}" ]; then
  unit_page="$report/units/$2/index.html"
  [ -f "$unit_page" ] || unit_page=""
else
  unit_page="$(find "$report/units" -mindepth 2 -maxdepth 2 -name index.html 2>/dev/null | sort | sed -n 1p)"
fi
[ -n "$unit_page" ] || { echo "report-check: no unit page under $report/units" >&2; exit 1; }

shots="$dir/report-check"
mkdir -p "$shots"
profile="$(mktemp -d)"
trap 'rm -rf "$profile"' EXIT
flags=(--headless --no-sandbox --disable-gpu --disable-quic --no-first-run --disable-background-networking
       --disable-component-update --disable-sync --user-data-dir="$profile" --virtual-time-budget=5000)

status=0
check() {
  local page="$1" name="$2" url dom log
  url="file://$(cd "$(dirname "$page")" && pwd)/$(basename "$page")"
  dom="$shots/$name.dom.html"
  log="$shots/$name.console.log"
  "$browser" "${flags[@]}" --dump-dom "$url" >"$dom" 2>/dev/null || true
  "$browser" "${flags[@]}" --enable-logging=stderr --v=0 --window-size=1400,2000 \
      --screenshot="$shots/$name.png" "$url" >/dev/null 2>"$log" || true
  local broken
  broken="$( (grep -o 'data-broken-images="[^"]*"' "$dom" || true) | sed -n '1s/.*="\(.*\)"/\1/p')"
  local images
  images="$( (grep -o '<img ' "$dom" || true) | wc -l)"
  if [ "$broken" != "0" ]; then
    echo "report-check: $name: broken images: '${broken:-no answer from the page script}' of $images" >&2
    status=1
  fi
  # Chromium prints page console messages as "CONSOLE(...)" / ":INFO:CONSOLE" lines; a failed file load shows
  # as "Failed to load resource" or "ERR_FILE_NOT_FOUND".
  (grep -E 'CONSOLE|Failed to load resource|ERR_FILE_NOT_FOUND|Uncaught' "$log" || true) >"$shots/$name.errors.log"
  if [ -s "$shots/$name.errors.log" ]; then
    echo "report-check: $name: console messages:" >&2
    cat "$shots/$name.errors.log" >&2
    status=1
  fi
  if [ ! -s "$shots/$name.png" ]; then
    echo "report-check: $name: no screenshot taken" >&2
    status=1
  fi
  echo "report-check: $name: $images image(s), broken ${broken:-?}, screenshot $shots/$name.png"
}

check "$report/index.html" fleet
check "$unit_page" unit
exit "$status"
