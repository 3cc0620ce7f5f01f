// The archive's guarantees without a browser: revisions are renamed into place whole, sealed
// read-only, never replaced; verify finds every missing, altered and extra file.
import { afterEach, describe, expect, it } from 'vitest';
import { chmodSync, existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { openStaging } from '../../src/archive/freeze.js';
import { manifestBytes, type Manifest } from '../../src/archive/manifest.js';
import { verifyArchive } from '../../src/archive/verify.js';
import { clearStale, writeNew } from '../../src/archive/files.js';
import { sha256 } from '../../src/archive/hash.js';
import { folderHashes, mode, removeTree, scratch } from '../helpers/archive.js';

const JOB = 'some-job';
let out = '';
afterEach(() => removeTree(out));

/** A revision of invented bytes, written the way issue writes one. */
function revision(n: number, body = `revision ${n}`): 'committed' | 'taken' {
  const jobOut = join(out, JOB);
  const files: Record<string, string> = { 'pack.html': `<p>${body}</p>\n`, 'pack.pdf': `%PDF-1.7 ${body}\n`, 'data.json': `{"body":"${body}"}\n` };
  const below = [...Array(n - 1).keys()].map((i) => i + 1).filter((k) => existsSync(join(jobOut, `rev-${k}`))).at(-1);
  const manifest: Manifest = {
    format: 'packsmith-manifest/1', packsmith: '0.0.0-test', job: JOB, title: 'A job', firm: 'A firm',
    revision: { number: n, date: '2026-10-10', by: 'T. Marwood', reason: null, accepted_open_items: false },
    rules: { set: 'iec-60364', overrides: [] },
    summary: { pass: 1, fail: 0, attention: 0, 'not-verified': 0, 'n/a': 0 },
    previous: below ? { revision: below, manifest_sha256: sha256(readFileSync(join(jobOut, `rev-${below}`, 'manifest.json'))) } : null,
    input_hash: sha256(body), inputs: { 'project.yaml': sha256(body) }, templates_hash: sha256('templates'),
    outputs: Object.fromEntries(Object.entries(files).map(([f, b]) => [f, sha256(b)])),
  };
  const staging = openStaging(jobOut);
  for (const [f, b] of Object.entries(files)) staging.add(f, b);
  staging.add('manifest.json', manifestBytes(manifest));
  staging.seal();
  return staging.commit(n);
}

/** Change a sealed file the way someone with the rights could. */
function tamper(path: string, change: (b: Buffer) => Buffer): void {
  chmodSync(path, 0o644);
  writeFileSync(path, change(readFileSync(path)));
  chmodSync(path, 0o444);
}

const problems = () => verifyArchive(out).findings.map((f) => `${f.path}: ${f.problem.split(':')[0]}`);

describe('writing a revision', () => {
  it('renames a complete, read-only folder into place and leaves nothing else', () => {
    out = scratch('freeze');
    expect(revision(1)).toBe('committed');
    const dir = join(out, JOB, 'rev-1');
    expect(readdirSync(join(out, JOB))).toEqual(['rev-1']);
    expect(readdirSync(dir).sort()).toEqual(['data.json', 'manifest.json', 'pack.html', 'pack.pdf']);
    expect(mode(dir)).toBe(0o555);
    for (const f of readdirSync(dir)) expect(mode(join(dir, f))).toBe(0o444);
    expect(verifyArchive(out).findings).toEqual([]);
  });

  it('never replaces an issued revision: a second commit of the same number is told it is taken', () => {
    out = scratch('freeze');
    revision(1);
    const before = folderHashes(join(out, JOB, 'rev-1'));
    expect(revision(1, 'other bytes')).toBe('taken');
    expect(folderHashes(join(out, JOB, 'rev-1'))).toEqual(before);
    expect(readdirSync(join(out, JOB))).toEqual(['rev-1']); // the loser's working folder is gone
  });

  it('creates files only where none exists', () => {
    out = scratch('freeze');
    writeNew(join(out, 'a'), 'one');
    expect(() => writeNew(join(out, 'a'), 'two')).toThrow(/EEXIST/);
    expect(readFileSync(join(out, 'a'), 'utf8')).toBe('one');
  });

  it('removes working folders of ended runs only', () => {
    out = scratch('freeze');
    const ended = spawnSync(process.execPath, ['-e', '0']).pid!;
    mkdirSync(join(out, `.incoming-${ended}-0badf00d`));
    mkdirSync(join(out, `.incoming-${process.pid}-0badf00d`)); // this process: alive
    expect(clearStale(out)).toEqual([`.incoming-${ended}-0badf00d`]);
    expect(existsSync(join(out, `.incoming-${process.pid}-0badf00d`))).toBe(true);
  });
});

describe('verify', () => {
  it('passes an intact archive and ignores working folders of interrupted runs', () => {
    out = scratch('verify');
    revision(1);
    revision(2);
    mkdirSync(join(out, JOB, '.incoming-999999-0badf00d'));
    expect(verifyArchive(out).findings).toEqual([]);
    expect(verifyArchive(out).jobs[0]!.revisions.map((r) => r.number)).toEqual([1, 2]);
  });

  it('names an altered, a missing and an extra file', () => {
    out = scratch('verify');
    revision(1);
    const dir = join(out, JOB, 'rev-1');
    tamper(join(dir, 'pack.pdf'), (b) => { b[3] = b[3]! ^ 1; return b; });
    chmodSync(dir, 0o755);
    writeFileSync(join(dir, 'notes.txt'), 'added later');
    spawnSync('rm', [join(dir, 'data.json')]);
    expect(problems()).toEqual([
      `${JOB}/rev-1/pack.pdf: altered`,
      `${JOB}/rev-1/data.json: missing`,
      `${JOB}/rev-1/notes.txt: extra`,
    ]);
  });

  it('finds a gap in the numbering and an earlier manifest that was rewritten', () => {
    out = scratch('verify');
    revision(1);
    revision(2);
    revision(4);
    tamper(join(out, JOB, 'rev-1', 'manifest.json'), (b) => Buffer.from(b.toString().replace('T. Marwood', 'Someone Else')));
    expect(problems()).toEqual([
      `${JOB}/rev-3: missing`,
      `${JOB}/rev-1/manifest.json: altered`,
      `${JOB}/rev-4/manifest.json: does not name revision 3 as its previous one`,
    ]);
  });

  it('reports an unreadable manifest', () => {
    out = scratch('verify');
    revision(1);
    tamper(join(out, JOB, 'rev-1', 'manifest.json'), () => Buffer.from('{"format":'));
    expect(problems()).toEqual([`${JOB}/rev-1/manifest.json: unreadable`]);
  });
});
