#!/usr/bin/env bash
# The browser tests drive Debian's chromium; make sure it is there before the test run starts.
set -euo pipefail
if [ -x /usr/bin/chromium ]; then exit 0; fi
if [ "$(id -u)" = "0" ] && command -v apt-get >/dev/null 2>&1; then
  echo "chromium is missing: installing Debian's chromium with apt-get (once)"
  apt-get update
  DEBIAN_FRONTEND=noninteractive apt-get install -y chromium
  exit 0
fi
echo "The browser tests need Debian's chromium at /usr/bin/chromium. Install it with:" >&2
echo "  sudo apt-get update && sudo apt-get install -y chromium" >&2
exit 1
