// An `issue` killed outright (SIGKILL, as a power cut or an impatient kill -9 would) at every named
// step and at spread-out moments: afterwards verify passes, no partial revision is visible, the
// earlier revision is byte-for-byte as it was, and the next issue cleans up and carries on.
import { beforeAll, afterAll, describe, expect, it } from 'vitest';
import { cpSync, existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'yaml';
import { packsmith, startPacksmith } from '../helpers/cli.js';
import { copyFixture, edit, folderHashes, removeTree, scratch } from '../helpers/archive.js';
import { ISSUE_STEPS } from '../../src/archive/steps.js';
import { verifyArchive } from '../../src/archive/verify.js';
import { revisionNumbers } from '../../src/archive/revisions.js';
import { isWorkingName } from '../../src/archive/files.js';

const JOB = 'archive-job';
const made: string[] = [];
afterAll(() => made.forEach(removeTree));

/** A small seeded generator, so the spread of kill moments is the same on every run. */
function seeded(seed: number): () => number {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Kills at moments spread over one run's length, besides one at every named step. */
const SPREAD = 8;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const issueArgs = (root: string) => ['issue', join(root, JOB), '--by', 'T. Marwood', '--date', '2026-10-12', '--accept-open-items', '--out', join(root, 'out')];

describe('an issue killed part-way', () => {
  // The starting point of every case: Revision 1 issued, then one reading changed, so that the
  // interrupted run is issuing Revision 2 beside a revision that must not be touched.
  const base = scratch('interrupt-base');
  made.push(base);
  let rev1: Record<string, string>;
  let fullRunMs = 0;
  const cases: { name: string; stopAt?: string; slot?: number }[] = [
    ...ISSUE_STEPS.map((s) => ({ name: `at step ${s}`, stopAt: s })),
    ...Array.from({ length: SPREAD }, (_, i) => ({ name: `after ${i + 1}/${SPREAD} of a run`, slot: i })),
  ];
  const folders = new Map<string, string>();
  const killed: string[] = [];

  beforeAll(() => {
    copyFixture(JOB, base);
    expect(packsmith(['issue', join(base, JOB), '--by', 'T. Marwood', '--date', '2026-10-10', '--accept-open-items', '--out', join(base, 'out')]).code).toBe(0);
    edit(join(base, JOB), 'readings/2026-10-09.csv', 'ok,1.08,', 'ok,1.12,');
    rev1 = folderHashes(join(base, 'out', JOB, 'rev-1'));
    // one uninterrupted run, to know how long a run takes (the kill moments are spread over it)
    const rehearsal = scratch('interrupt-full');
    made.push(rehearsal);
    cpSync(base, rehearsal, { recursive: true });
    const t0 = performance.now();
    expect(packsmith(issueArgs(rehearsal)).code).toBe(0);
    fullRunMs = performance.now() - t0;
  });

  /** One case in a fresh copy of the starting point; true when the run was killed (not finished first). */
  async function attempt(root: string, c: (typeof cases)[number], delayMs: number): Promise<boolean> {
    removeTree(root);
    cpSync(base, root, { recursive: true });
    const run = startPacksmith(issueArgs(root), c.stopAt ? { PACKSMITH_STOP_AT: c.stopAt } : {});
    if (c.stopAt) await run.said(`stopped at ${c.stopAt}`);
    else await sleep(delayMs);
    run.child.kill('SIGKILL');
    return (await run.exit).signal === 'SIGKILL';
  }

  it.each(cases)('$name: verify passes and no partial revision is visible', async (c) => {
    const root = scratch('interrupt');
    made.push(root);
    folders.set(c.name, root);
    // a moment within the run; when this run was quicker than the timed one and finished first, try earlier
    let delay = c.stopAt ? 0 : fullRunMs * ((c.slot! + seeded(6 + c.slot!)()) / SPREAD);
    for (let tries = 0; tries < 4; tries++, delay /= 2) {
      if (await attempt(root, c, delay)) {
        killed.push(c.name);
        break;
      }
    }

    const out = join(root, 'out');
    expect(verifyArchive(out).findings).toEqual([]);
    const jobOut = join(out, JOB);
    const numbers = revisionNumbers(jobOut);
    expect([[1], [1, 2]]).toContainEqual(numbers);
    expect(folderHashes(join(jobOut, 'rev-1'))).toEqual(rev1);
    const visible = readdirSync(jobOut).filter((n) => !n.startsWith('.'));
    expect(visible.every((n) => ['rev-1', 'rev-2', 'index.html'].includes(n))).toBe(true);
    expect(readdirSync(jobOut).filter((n) => n.startsWith('.')).every(isWorkingName)).toBe(true);
    const record = parse(readFileSync(join(root, JOB, 'revisions.yaml'), 'utf8')) as { revisions: { revision: number }[] };
    expect(numbers).toEqual(expect.arrayContaining(record.revisions.map((e) => e.revision)));
    if (c.stopAt && ISSUE_STEPS.indexOf(c.stopAt as never) < ISSUE_STEPS.indexOf('committed')) expect(numbers).toEqual([1]);
    if (c.stopAt && ISSUE_STEPS.indexOf(c.stopAt as never) >= ISSUE_STEPS.indexOf('committed')) expect(numbers).toEqual([1, 2]);
  });

  it(`killed every run: ${cases.length} points`, () => {
    expect(killed).toEqual(cases.map((c) => c.name));
    expect(killed.length).toBeGreaterThanOrEqual(20);
  });

  it('the next issue clears what a run killed before renaming left, and issues Revision 2', () => {
    const root = folders.get('at step sealed')!;
    expect(readdirSync(join(root, 'out', JOB)).some(isWorkingName)).toBe(true);
    const r = packsmith(issueArgs(root));
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('issued Revision 2');
    expect(readdirSync(join(root, 'out', JOB)).some(isWorkingName)).toBe(false);
    expect(verifyArchive(join(root, 'out')).findings).toEqual([]);
  });

  it('the next issue records a revision that a run killed before recording it left out of revisions.yaml', () => {
    const root = folders.get('at step committed')!;
    const recorded = () => (parse(readFileSync(join(root, JOB, 'revisions.yaml'), 'utf8')) as { revisions: { revision: number }[] }).revisions.map((e) => e.revision);
    expect(recorded()).toEqual([1]);
    const r = packsmith(issueArgs(root));
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/revision 2 restored from its manifest/);
    expect(r.stderr).toMatch(/nothing changed since Revision 2/);
    expect(recorded()).toEqual([1, 2]);
    expect(existsSync(join(root, 'out', JOB, 'rev-3'))).toBe(false);
  });
});
