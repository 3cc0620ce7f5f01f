#!/usr/bin/env bash
# The README's second command: type-check (the tests too), compile the CLI the end-to-end tests
# run and bundle it (scripts/bundle.mjs), then run every test. The two compilations run side by side (two cores, one each).
set -euo pipefail
cd "$(dirname "$0")/.."
npx tsc -p tsconfig.json --noEmit &
typecheck=$!
npx tsc -p tsconfig.build.json
node scripts/bundle.mjs
wait "$typecheck"
npx vitest run
