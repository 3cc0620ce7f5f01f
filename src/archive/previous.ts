// The changes section of a pack: the latest issued revision's data.json, read back and checked
// against its manifest, compared with the data being rendered now.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Changes } from '../render/view.js';
import { parseData, type PackData, type RevisionInfo } from './data.js';
import { diffData, firstIssue } from './diff.js';
import { sha256 } from './hash.js';
import type { IssuedRevision } from './verify.js';

export function revisionData(rev: IssuedRevision): { ok: true; data: PackData & { revision: RevisionInfo } } | { ok: false; why: string } {
  const name = `rev-${rev.number}/data.json`;
  let bytes: Buffer;
  try {
    bytes = readFileSync(join(rev.dir, 'data.json'));
  } catch {
    return { ok: false, why: `${name} is missing` };
  }
  if (sha256(bytes) !== rev.manifest.outputs['data.json']) return { ok: false, why: `${name} does not match its manifest` };
  const parsed = parseData(bytes.toString('utf8'));
  if (!parsed.ok) return { ok: false, why: `${name}: ${parsed.why}` };
  if (!parsed.data.revision) return { ok: false, why: `${name} names no revision` };
  return { ok: true, data: parsed.data as PackData & { revision: RevisionInfo } };
}

/**
 * Changes since `latest` (null when none was issued: a first issue, or a draft with nothing to
 * compare). `next` is the data.json text being written: compared as the next revision will read it
 * back, and read only where there is a revision to compare it with (a large job's is hundreds of
 * megabytes).
 */
export function changesSince(latest: IssuedRevision | null, next: string, issued: Changes['issued']): { ok: true; changes: Changes | null } | { ok: false; why: string } {
  if (!latest) return { ok: true, changes: issued ? firstIssue(issued) : null };
  const prev = revisionData(latest);
  if (!prev.ok) return prev;
  return { ok: true, changes: diffData(prev.data, JSON.parse(next) as PackData, issued) };
}
