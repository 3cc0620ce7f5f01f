// Same inputs, same bytes: a job built several times gives the same PDF, whichever pack a print
// page printed before it. (Chromium names the elements of a tagged PDF after a DOM node counter
// of its renderer, which runs on from pack to pack on a reused page; src/print/structure-ids.ts
// renumbers them.)
import { afterAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { build } from '../../src/build.js';
import { removeTree, scratch, sha } from '../helpers/archive.js';
import { ROOT } from '../helpers/cli.js';
import { explainPdfDifference } from '../helpers/pdf-diff.js';

const made: string[] = [];
afterAll(() => made.forEach(removeTree));
const JOB = join(ROOT, 'tests/fixtures/pack-job');
const OTHER = join(ROOT, 'tests/fixtures/archive-job');

describe('a pack printed again', () => {
  it('has the same bytes when built alone, after another pack on the same page, and with the pages shared', async () => {
    const hashes: string[] = [];
    const files: string[] = [];
    const runs: { jobs: string[]; poolSize: number }[] = [
      { jobs: [JOB], poolSize: 1 },
      { jobs: [OTHER, JOB], poolSize: 1 }, // the page prints the other pack first
      { jobs: [OTHER, OTHER.replace('archive-job', 'failing-job'), JOB], poolSize: 2 },
    ];
    for (const r of runs) {
      const out = scratch('reproducible');
      made.push(out);
      await build({ jobs: r.jobs, out, force: true, poolSize: r.poolSize, archive: join(out, 'no-archive'), log: () => {} });
      const pdf = join(out, 'pack-job/draft/pack.pdf');
      hashes.push(sha(pdf));
      files.push(pdf);
    }
    expect(new Set(hashes).size, files.slice(1).map((f) => explainPdfDifference(files[0]!, f)).filter(Boolean).join('\n')).toBe(1);
  }, 180_000);
});
