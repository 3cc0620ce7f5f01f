// What a draft was built from (draft/build.json): packsmith's version, the input hash, the
// templates, the revision its changes section compares with, and the hashes of what was written.
// A build whose fingerprint matches, with its files intact, need not run again.
import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { z } from 'zod';
import { sha256 } from './hash.js';
import { parseJson } from './json.js';
import { SummarySchema } from './manifest.js';

export const STAMP_FILE = 'build.json';

const FingerprintSchema = z.object({
  packsmith: z.string(),
  input_hash: z.string(),
  templates_hash: z.string(),
  /** the revision the changes section compares with (null: none issued) */
  base_revision: z.number().nullable(),
  /** whether a PDF was printed */
  pdf: z.boolean(),
});
export type Fingerprint = z.output<typeof FingerprintSchema>;

const StampSchema = z.object({
  format: z.literal('packsmith-build/1'),
  fingerprint: FingerprintSchema,
  /** the job's archive folder (absolute), so the site can link its revisions */
  archive: z.string().optional(),
  title: z.string(),
  /** the client and site address, for the archive site (absent in stamps of older builds) */
  client: z.string().optional(),
  site: z.string().optional(),
  date: z.string(),
  summary: SummarySchema,
  outputs: z.record(z.string(), z.string()),
  /** each output's size and modification time when written: an unchanged draft is known by these, without re-hashing it */
  output_stats: z.record(z.string(), z.tuple([z.number(), z.number()])).optional(),
  /** the job folder (absolute) and its own theme (absolute) and paper, so a build can tell an unchanged job without reading it */
  source: z.object({ dir: z.string(), theme: z.string().nullable(), paper: z.string().nullable() }).optional(),
});
export type Stamp = z.output<typeof StampSchema>;

export function readStamp(draftDir: string): Stamp | null {
  let text: string;
  try {
    text = readFileSync(join(draftDir, STAMP_FILE), 'utf8');
  } catch {
    return null; // none (or unreadable): the draft is built again
  }
  return parseStamp(text);
}

/** A stamp's text read back, or null where it is not one. */
export function parseStamp(text: string): Stamp | null {
  const parsed = parseJson(text);
  const r = parsed.ok ? StampSchema.safeParse(parsed.value) : null;
  return r?.success ? r.data : null;
}

/** What a stamp of each draft folder holds: read once per run (remembered), or as this run wrote it (`wrote`). */
export function stampMemo() {
  const stamps = new Map<string, Stamp | null>();
  return {
    of(draftDir: string): Stamp | null {
      let s = stamps.get(draftDir);
      if (s === undefined) stamps.set(draftDir, (s = readStamp(draftDir)));
      return s;
    },
    /** the stamp removed (null) or its text written */
    wrote(draftDir: string, text: string | null): void {
      stamps.set(draftDir, text === null ? null : parseStamp(text));
    },
  };
}

export const stampBytes = (s: Stamp): string => `${JSON.stringify(s, null, 2)}\n`;

/** The draft in `draftDir` was made from `want` and its files are as written (same size and time as written, or where the stamp has no times, same hash). A PDF-less draft is stale once Chromium can print. */
export function upToDate(draftDir: string, stamp: Stamp | null, want: Fingerprint): boolean {
  if (!stamp) return false;
  const have = stamp.fingerprint;
  const same = have.packsmith === want.packsmith && have.input_hash === want.input_hash && have.templates_hash === want.templates_hash &&
    have.base_revision === want.base_revision && (have.pdf || !want.pdf);
  if (!same) return false;
  return Object.entries(stamp.outputs).every(([name, hash]) => {
    const path = join(draftDir, name);
    let st;
    try {
      st = statSync(path);
    } catch {
      return false; // missing (or unreadable): built again
    }
    const was = stamp.output_stats?.[name];
    if (was) return st.size === was[0] && st.mtimeMs === was[1];
    return sha256(readFileSync(path)) === hash;
  });
}

/** The size and modification time of each output in `draftDir`, for the stamp. */
export function outputStats(draftDir: string, names: string[]): Record<string, [number, number]> {
  return Object.fromEntries(names.map((n) => {
    const st = statSync(join(draftDir, n));
    return [n, [st.size, st.mtimeMs]];
  }));
}
