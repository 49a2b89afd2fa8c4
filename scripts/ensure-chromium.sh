#!/usr/bin/env bash
# Browser tests drive Debian's chromium through playwright-core; never a downloaded browser.
set -euo pipefail
if [ -x "${CHROMIUM_PATH:-/usr/bin/chromium}" ]; then exit 0; fi
if [ "$(id -u)" = "0" ]; then
  echo "[turnstone] Installing Debian's chromium for browser tests"
  DEBIAN_FRONTEND=noninteractive apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
else
  echo "[turnstone] Chromium is missing: install it with: sudo apt-get install chromium" >&2
  exit 1
fi
