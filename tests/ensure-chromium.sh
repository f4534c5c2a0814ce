#!/usr/bin/env bash
# The browser tests drive Debian's Chromium. Install it when missing (as root,
# as CI runs); otherwise stop with a message instead of skipping the tests.
set -euo pipefail
CHROMIUM="${CHROMIUM_PATH:-/usr/bin/chromium}"
if [ -x "$CHROMIUM" ]; then
  exit 0
fi
if [ "$(id -u)" -ne 0 ]; then
  echo "Chromium is missing at $CHROMIUM and this user cannot install it." >&2
  echo "Run: sudo apt-get update && sudo apt-get install -y chromium   (or set CHROMIUM_PATH)" >&2
  exit 1
fi
echo "Installing Debian's chromium for the browser tests…"
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq
apt-get install -y -qq chromium >/dev/null
"$CHROMIUM" --version
