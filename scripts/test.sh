#!/usr/bin/env bash
# The README's second command: type-check, compile the CLI the end-to-end tests run, run every test.
set -euo pipefail
cd "$(dirname "$0")/.."
npx tsc -p tsconfig.json --noEmit
npx tsc -p tsconfig.build.json
npx vitest run
