#!/usr/bin/env bash
# The demo archive: two issued revisions of the demo job as its test sessions came in (Revision 1
# after the first tests, Revision 2 after the re-test), then drafts of every job and the site.
# Issued revisions are never touched again: where out/ already holds them, they are kept.
set -euo pipefail
cd "$(dirname "$0")/.."
out="${1:-out}"
job=tannery-row-refit
cli="node dist/cli.js"

if [ ! -d "$out/$job/rev-2" ]; then
  if [ -d "$out/$job/rev-1" ]; then
    echo "packsmith: $out/$job holds Revision 1 but not 2; leaving the archive as it is" >&2
  else
    # The job as it stood on each test date, in a scratch copy (the job folder itself stays as committed).
    scratch=$(mktemp -d)
    trap 'rm -rf "$scratch"' EXIT
    cp -R "projects/$job" "$scratch/$job"
    rm -f "$scratch/$job/readings/2026-11-20-retest.csv" "$scratch/$job/revisions.yaml"
    $cli issue "$scratch/$job" --out "$out" --by "R. Okafor" --date 2026-11-16 \
      --reason "Handover after the first tests; circuit 10 to be re-tested" --accept-open-items
    cp "projects/$job/readings/2026-11-20-retest.csv" "$scratch/$job/readings/"
    $cli issue "$scratch/$job" --out "$out" --by "R. Okafor" --date 2026-11-20 \
      --reason "Circuit 10 re-tested after its cpc was remade" --accept-open-items
  fi
fi
$cli build --out "$out"
