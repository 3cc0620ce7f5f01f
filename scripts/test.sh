#!/usr/bin/env bash
# The README's second command: type-check (the tests too), compile the CLI the end-to-end tests
# run, then run every test. The two compilations run side by side (two cores, one each).
set -euo pipefail
cd "$(dirname "$0")/.."
npx tsc -p tsconfig.json --noEmit &
typecheck=$!
npx tsc -p tsconfig.build.json
wait "$typecheck"
npx vitest run
