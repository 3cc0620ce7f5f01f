#!/usr/bin/env bash
# The README's second command: compile the CLI the end-to-end tests run and bundle it (npm run
# build: about 3 s, no type check), then run every test while everything, the tests too, is
# type-checked beside them. Either failing fails the command; the type check's errors come last.
set -euo pipefail
cd "$(dirname "$0")/.."
npm run --silent build
types=$(mktemp)
trap 'rm -f "$types"' EXIT
npx tsc -p tsconfig.json --noEmit >"$types" 2>&1 &
typecheck=$!
status=0
npx vitest run || status=$?
if ! wait "$typecheck"; then
  cat "$types"
  echo "packsmith: the type check failed (npx tsc -p tsconfig.json --noEmit)" >&2
  status=1
fi
exit "$status"
