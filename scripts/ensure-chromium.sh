#!/usr/bin/env bash
# Browser tests drive Debian's chromium (/usr/bin/chromium) with playwright-core; no browser download.
# Installs it on a fresh Debian machine when missing (needs root, as on this project's machines).
set -euo pipefail
if [ -x /usr/bin/chromium ]; then exit 0; fi
echo "Installing Debian's chromium for the browser tests..." >&2
if [ "$(id -u)" -ne 0 ]; then
  echo "chromium is missing and this is not root: run 'apt-get install -y chromium' as root." >&2
  exit 1
fi
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq >&2
apt-get install -y -qq chromium >&2
