#!/usr/bin/env bash
# The demo archive: two issued revisions of the demo job as its test sessions came in (Revision 1
# after the first tests, Revision 2 after the re-test) into archive/ (beside projects/, where a
# firm keeps its issued revisions), then drafts of every job and the site into out/.
# The demo's record (archive/tannery-row-refit/ and projects/tannery-row-refit/revisions.yaml) is
# made on each machine (its PDFs come from that machine's Chromium), so .gitignore leaves it out
# and setup never dirties the repository; a firm's own archive/ is kept under version control.
# Issued revisions are never touched again: where archive/ already holds them, they are kept.
set -euo pipefail
cd "$(dirname "$0")/.."
out="${1:-out}"
archive=archive
job=tannery-row-refit
cli="node dist/cli.js"

# An earlier packsmith issued into out/<job>/rev-N/: move those revisions to the archive first.
if compgen -G "$out/*/rev-[0-9]*" >/dev/null; then
  $cli archive move-from "$out" projects || echo "packsmith: some revisions were left in $out (see above)" >&2
fi

if [ ! -d "$archive/$job/rev-2" ]; then
  if [ -d "$archive/$job/rev-1" ]; then
    echo "packsmith: $archive/$job holds Revision 1 but not 2; leaving the archive as it is" >&2
  else
    # Revision 1: the job as it stood after the first tests, in a scratch copy without the re-test.
    scratch=$(mktemp -d)
    trap 'rm -rf "$scratch"' EXIT
    cp -R "projects/$job" "$scratch/$job"
    rm -f "$scratch/$job/readings/2026-11-20-retest.csv" "$scratch/$job/revisions.yaml" "projects/$job/revisions.yaml"
    $cli issue "$scratch/$job" --archive "$archive" --out "$out" --by "R. Okafor" --date 2026-11-16 \
      --reason "Handover after the first tests; circuit 10 to be re-tested" --accept-open-items
    cp "$scratch/$job/revisions.yaml" "projects/$job/revisions.yaml"
    # Revision 2: the job folder itself, re-test included; its revisions.yaml now records both.
    $cli issue "projects/$job" --out "$out" --by "R. Okafor" --date 2026-11-20 \
      --reason "Circuit 10 re-tested after its cpc was remade" --accept-open-items
  fi
fi
$cli build --out "$out"
