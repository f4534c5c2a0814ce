#!/usr/bin/env bash
# The browser tests drive Debian's Chromium; the export tests read PDFs with
# poppler-utils (pdfinfo, pdffonts); the integration suite also runs on a
# throwaway PostgreSQL cluster (Debian's postgresql: initdb, pg_ctl). Install
# what is missing (as root, as CI runs); otherwise stop with a message instead
# of skipping tests.
set -euo pipefail
CHROMIUM="${CHROMIUM_PATH:-/usr/bin/chromium}"
missing=()
[ -x "$CHROMIUM" ] || missing+=(chromium)
command -v pdfinfo >/dev/null 2>&1 || missing+=(poppler-utils)
if [ -z "${PG_BIN:-}" ] && ! ls /usr/lib/postgresql/*/bin/initdb >/dev/null 2>&1; then missing+=(postgresql); fi
if [ ${#missing[@]} -eq 0 ]; then
  exit 0
fi
if [ "$(id -u)" -ne 0 ]; then
  echo "Missing for the tests: ${missing[*]}; this user cannot install them." >&2
  echo "Run: sudo apt-get update && sudo apt-get install -y ${missing[*]}   (or set CHROMIUM_PATH)" >&2
  exit 1
fi
echo "Installing Debian packages for the tests: ${missing[*]}…"
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq
apt-get install -y -qq "${missing[@]}" >/dev/null
"$CHROMIUM" --version
pdfinfo -v 2>&1 | head -1
ls /usr/lib/postgresql/*/bin/initdb
