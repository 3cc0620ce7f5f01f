// A build split over two runners: `build --shard 1/2` and `--shard 2/2` build disjoint halves of
// the jobs and no site; `build --site` joins their output folders; the joined folder's drafts and
// site are byte for byte those of one build of every job (build.json differs only in the times of
// its files, which are the copies').
import { afterAll, describe, expect, it, vi } from 'vitest';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { run } from '../helpers/cli.js';
import { copyFixture, removeTree, scratch, sha } from '../helpers/archive.js';
import { shardOf } from '../../src/archive/shard.js';

vi.setConfig({ testTimeout: 240_000 }); // three builds print
const root = scratch('shard');
afterAll(() => removeTree(root));
const JOBS = ['archive-job', 'failing-job', 'pack-job'];
const jobs = JOBS.map((j) => copyFixture(j, root));
const at = (name: string) => join(root, name);
const built = (out: string) => readdirSync(out).filter((n) => !n.startsWith('.') && n !== 'index.html').sort();

describe('build --shard K/N and build --site', () => {
  it('splits the jobs by their folder name into two non-empty halves, the same on every call', () => {
    const halves = [1, 2].map((k) => JOBS.filter((_, i) => shardOf(jobs[i]!, 2) === k));
    expect(halves.every((h) => h.length > 0)).toBe(true);
    expect(halves.flat().sort()).toEqual([...JOBS].sort());
    expect(JOBS.map((_, i) => shardOf(jobs[i]!, 2))).toEqual(JOBS.map((_, i) => shardOf(jobs[i]!, 2)));
    expect(JOBS.every((_, i) => shardOf(jobs[i]!, 1) === 1)).toBe(true);
  });

  it('gives, joined, the drafts and site of one build of every job', async () => {
    expect((await run(['build', ...jobs, '--out', at('single')])).code).toBe(0);
    for (const k of [1, 2]) {
      const r = await run(['build', ...jobs, '--out', at(`shard-${k}`), '--shard', `${k}/2`]);
      expect(r.code).toBe(0);
      expect(existsSync(join(at(`shard-${k}`), 'index.html'))).toBe(false); // the site is written once, by the join
    }
    const one = built(at('shard-1'));
    const two = built(at('shard-2'));
    expect(one.filter((j) => two.includes(j))).toEqual([]);
    expect([...one, ...two].sort()).toEqual([...JOBS].sort());

    const joined = await run(['build', '--site', '--out', at('joined'), at('shard-1'), at('shard-2')]);
    expect(joined.stderr).toBe('');
    expect(joined.code).toBe(0);
    expect(built(at('joined'))).toEqual(built(at('single')));
    const same = ['index.html', ...JOBS.flatMap((j) => [`${j}/index.html`, `${j}/draft/pack.html`, `${j}/draft/pack.pdf`])];
    for (const f of same) expect(sha(join(at('joined'), f)), f).toBe(sha(join(at('single'), f)));
    for (const j of JOBS) {
      const stamp = (out: string) => { const s = JSON.parse(readFileSync(join(out, j, 'draft/build.json'), 'utf8')) as Record<string, unknown>; delete s.output_stats; return s; };
      expect(stamp(at('joined'))).toEqual(stamp(at('single')));
    }
    // the joined folder is a build like any other: building every job into it again changes nothing
    const again = await run(['build', ...jobs, '--out', at('joined')]);
    expect([...again.stdout.matchAll(/^([\w-]+): unchanged/gm)].map((m) => m[1]).sort()).toEqual([...JOBS].sort());
  });

  it('refuses a job found in two shards, and a --shard that is not K/N', async () => {
    const twice = await run(['build', '--site', '--out', at('twice'), at('shard-1'), at('shard-1')]);
    expect(twice.code).toBe(2);
    expect(twice.stderr).toMatch(/is in two shards/);
    for (const bad of ['3/2', '0/2', 'half']) {
      const r = await run(['build', ...jobs, '--out', at('bad'), '--shard', bad]);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(/expected K\/N with 1 ≤ K ≤ N/);
    }
  });
});
