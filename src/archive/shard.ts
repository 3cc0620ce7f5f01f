// Building an archive on several runners: `build --shard K/N` takes the jobs whose folder name
// hashes to shard K of N (the same split on every machine, whatever order the folders are listed
// in), and `build --site` joins the runners' output folders into one and writes the site there.
import { cpSync, existsSync, readdirSync, readFileSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { sha256 } from './hash.js';
import { outputStats, readStamp, stampBytes, STAMP_FILE } from './fingerprint.js';
import { writeReplacing } from './files.js';
import { claimOut, outDir, OUT_MARK } from './out.js';
import { writeSite, type SiteSource } from './site.js';

export interface Shard { k: number; n: number }

/** "K/N" with 1 ≤ K ≤ N, or a message saying what was expected. */
export function parseShard(text: string): Shard | string {
  const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(text);
  const k = Number(m?.[1]);
  const n = Number(m?.[2]);
  if (!m || n < 1 || k < 1 || k > n) return `--shard "${text}": expected K/N with 1 ≤ K ≤ N, e.g. 1/4`;
  return { k, n };
}

/** The shard (1 … n) of a job folder: by a hash of its name, so a job stays in its shard as others come and go. */
export const shardOf = (jobDir: string, n: number): number => (parseInt(sha256(basename(resolve(jobDir))).slice(0, 12), 16) % n) + 1;

/**
 * Copy the job folders of each shard's output folder into `out` (a job found in two shards is
 * refused), check each draft against its stamp's hashes, note the copies' sizes and times in the
 * stamps, and write the site over every job. Returns the jobs joined, or an error message.
 */
export function joinShards(out: string, shards: string[]): { jobs: string[] } | { error: string } {
  const into = claimOut(out);
  const from = new Map<string, string>();
  for (const shard of shards) {
    if (!existsSync(join(shard, OUT_MARK))) return { error: `${shard}: not a folder packsmith built (no ${OUT_MARK})` };
    for (const e of readdirSync(shard, { withFileTypes: true })) {
      if (!e.isDirectory() || e.name.startsWith('.')) continue;
      const twin = from.get(e.name);
      if (twin !== undefined) return { error: `${e.name} is in two shards, ${twin} and ${shard}; each job is built by one shard` };
      from.set(e.name, shard);
    }
  }
  const sources: SiteSource[] = [];
  for (const [job, shard] of from) {
    const draft = join(shard, job, 'draft');
    const stamp = readStamp(draft);
    if (!stamp) continue; // a job page without a draft: the site is written afresh below
    for (const [name, hash] of Object.entries(stamp.outputs)) {
      const path = join(draft, name);
      if (!existsSync(path) || sha256(readFileSync(path)) !== hash) return { error: `${path}: not the file its ${STAMP_FILE} records; build that shard again` };
    }
    const target = join(outDir(into, job, 'draft'));
    for (const name of Object.keys(stamp.outputs)) cpSync(join(draft, name), join(target, name));
    writeReplacing(join(target, STAMP_FILE), stampBytes({ ...stamp, output_stats: outputStats(target, Object.keys(stamp.outputs)) }));
    if (stamp.archive) sources.push({ job, archive: stamp.archive });
  }
  writeSite(into, sources);
  return { jobs: [...from.keys()].sort() };
}
