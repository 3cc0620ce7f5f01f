#!/usr/bin/env bash
# The README's first command: install everything, then build the demo packs into out/.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/install-deps.sh
bash scripts/demo-archive.sh
echo "packsmith: open out/index.html"
