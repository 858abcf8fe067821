#!/usr/bin/env bash
# Browser tests drive Debian's chromium; they never download a browser of their own.
set -eu
browser="${CHROMIUM_PATH:-/usr/bin/chromium}"
[ -x "$browser" ] && exit 0
if [ "$(id -u)" = "0" ] && command -v apt-get >/dev/null 2>&1; then
  echo "Installing Debian's chromium for the browser tests…"
  apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  exit 0
fi
echo "The browser tests need Debian's chromium at $browser: run 'sudo apt-get install chromium' (or set CHROMIUM_PATH)." >&2
exit 1
