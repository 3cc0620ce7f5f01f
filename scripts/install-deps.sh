#!/usr/bin/env bash
# Install what packsmith needs on a fresh Debian/Ubuntu machine: Chromium and the DejaVu fonts
# (core and extra) from the OS packages (only when missing), then the npm packages (which also compiles dist/).
set -euo pipefail
cd "$(dirname "$0")/.."

need=()
if [ -z "${PACKSMITH_CHROME:-}" ] && ! command -v chromium >/dev/null 2>&1 && [ ! -x /usr/bin/chromium ]; then
  need+=(chromium)
fi
# The packs are set in DejaVu only: Sans and Serif (fonts-dejavu-core), Sans Condensed for the wide
# schedule tables and the oblique faces (fonts-dejavu-extra), so output does not depend on the machine.
if ! fc-list 2>/dev/null | grep -qi 'DejaVuSans\.ttf'; then
  need+=(fonts-dejavu-core)
fi
if ! fc-list 2>/dev/null | grep -qi 'DejaVuSansCondensed\.ttf'; then
  need+=(fonts-dejavu-extra)
fi
if [ "${#need[@]}" -gt 0 ]; then
  if ! command -v apt-get >/dev/null 2>&1; then
    echo "packsmith: please install ${need[*]} with your package manager (no apt-get here)" >&2
    exit 1
  fi
  sudo=""
  [ "$(id -u)" -ne 0 ] && sudo="sudo"
  echo "packsmith: installing ${need[*]} from the OS packages" >&2
  $sudo apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq "${need[@]}" fontconfig >/dev/null
fi

npm ci --no-audit --no-fund
