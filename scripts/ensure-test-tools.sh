#!/usr/bin/env bash
# Installs what the browser tests need from Debian when it is missing: Chromium (driven by
# playwright-core; a browser download is never used) and poppler-utils (pdftotext, to read the
# printed runtime card). Quick when both are present.
set -euo pipefail

missing=()
[ -x /usr/bin/chromium ] || missing+=(chromium)
command -v pdftotext >/dev/null 2>&1 || missing+=(poppler-utils)
[ ${#missing[@]} -eq 0 ] && exit 0

echo "Installing from Debian: ${missing[*]}"
if [ "$(id -u)" -eq 0 ]; then
  apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}"
elif command -v sudo >/dev/null 2>&1; then
  sudo apt-get update -qq
  sudo DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}"
else
  echo "Please install as root: apt-get install -y ${missing[*]}" >&2
  exit 1
fi
