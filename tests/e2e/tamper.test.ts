// Tampering with an issued record: each way of altering, removing, rolling back, replacing or
// hiding a revision, and every edit of revisions.yaml, is a finding of verify. Where the one who
// tampers also rewrites the other side of the record (the manifest hashes and revisions.yaml), only
// the firm's signature can tell, so those cases are checked with the firm's public key.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { chmodSync, cpSync, existsSync, mkdirSync, readFileSync, renameSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse, stringify } from 'yaml';
import { run } from '../helpers/cli.js';
import { copyFixture, edit, removeTree, scratch, sha } from '../helpers/archive.js';
import { audit } from '../../src/archive/audit.js';
import { loadPublicKey } from '../../src/archive/sign.js';

vi.setConfig({ testTimeout: 180_000 }); // a few cases run the command line, which prints nothing but starts slowly on a busy machine
const JOB = 'archive-job';
const made: string[] = [];
afterAll(() => made.forEach(removeTree));
const place = (label: string) => { const d = scratch(label); made.push(d); return d; };

/** base: Revision 1 and 2 signed with the firm key; alt: the same Revision 1, then a Revision 2 of other inputs, unsigned. */
let base = '';
let alt = '';
let keys = '';
const issue = (root: string, date: string, ...more: string[]) =>
  run(['issue', join(root, 'projects', JOB), '--by', 'T. Marwood', '--date', date, '--accept-open-items', '--out', join(root, 'out'), ...more]);

beforeAll(async () => {
  keys = place('keys');
  expect((await run(['key', 'create', join(keys, 'firm.key')])).code).toBe(0);
  base = place('tamper-base');
  copyFixture(JOB, base);
  expect((await issue(base, '2026-10-10', '--key', join(keys, 'firm.key'))).code).toBe(0);
  alt = place('tamper-alt');
  cpSync(base, alt, { recursive: true });
  edit(join(base, 'projects', JOB), 'readings/2026-10-09.csv', 'ok,1.08,', 'ok,1.12,');
  expect((await issue(base, '2026-10-12', '--key', join(keys, 'firm.key'))).code).toBe(0);
  edit(join(alt, 'projects', JOB), 'readings/2026-10-09.csv', 'ok,1.08,', 'ok,0.98,');
  expect((await issue(alt, '2026-10-12')).code).toBe(0); // the one who tampers has no firm key
}, 240_000);

/** A fresh copy of the base record to tamper with. */
function copy(): { root: string; rev: (n: number, f?: string) => string; record: string } {
  const root = place('tamper');
  cpSync(base, root, { recursive: true });
  return {
    root,
    rev: (n, f) => join(root, 'archive', JOB, `rev-${n}`, ...(f ? [f] : [])),
    record: join(root, 'projects', JOB, 'revisions.yaml'),
  };
}

const check = (root: string, withKey = false) => {
  const k = withKey ? loadPublicKey(join(keys, 'firm.key.pub')) : null;
  if (k && !k.ok) throw new Error(k.why);
  return audit({ archive: join(root, 'archive'), jobDirs: [join(root, 'projects', JOB)], complete: true, withRecords: true }, k?.ok ? k.key : null);
};
const found = (root: string, withKey = false) => check(root, withKey).findings.map((f) => `${f.path.slice(root.length + 1)}: ${f.problem}`);

function writable(path: string, change: () => void): void {
  const dir = join(path, '..');
  chmodSync(dir, 0o755);
  if (existsSync(path)) chmodSync(path, 0o644);
  change();
  if (existsSync(path)) chmodSync(path, 0o444);
  chmodSync(dir, 0o555);
}

/** Rewrite a manifest as someone with write access would; returns its new SHA-256. */
function rewriteManifest(path: string, change: (m: Record<string, any>) => void): string {
  writable(path, () => {
    const m = JSON.parse(readFileSync(path, 'utf8')) as Record<string, any>;
    change(m);
    writeFileSync(path, `${JSON.stringify(m, null, 2)}\n`);
  });
  return sha(path);
}

/** Edit a file of a revision and put its new hash into the manifest. */
function rewriteOutput(c: ReturnType<typeof copy>, n: number, file: string, change: (b: Buffer) => Buffer): string {
  const path = c.rev(n, file);
  writable(path, () => writeFileSync(path, change(readFileSync(path))));
  return rewriteManifest(c.rev(n, 'manifest.json'), (m) => { m.outputs[file] = sha(path); });
}

function rewriteRecord(path: string, change: (entries: Record<string, any>[]) => Record<string, any>[]): void {
  const doc = parse(readFileSync(path, 'utf8')) as { revisions: Record<string, any>[] };
  writeFileSync(path, stringify({ revisions: change(doc.revisions) }));
}
const recordSha = (entries: Record<string, any>[], n: number, manifestSha: string) => entries.map((e) => (e.revision === n ? { ...e, manifest_sha256: manifestSha } : e));
const flipByte = (b: Buffer) => { const c = Buffer.from(b); const at = c.length >> 1; c[at] = c[at]! ^ 1; return c; };

describe('verify: the untouched record', () => {
  it('checks out, with and without the firm key, and names the signer', async () => {
    const c = copy();
    expect(found(c.root)).toEqual([]);
    const a = check(c.root, true);
    expect(a.findings).toEqual([]);
    expect(a.signers).toEqual([expect.objectContaining({ firms: ['Brackwater Electrical Co-op'], revisions: 2 })]);
    expect(a.unsigned).toEqual([]);
    const v = await run(['verify', join(c.root, 'projects'), '--key', join(keys, 'firm.key.pub')]);
    expect(v.code).toBe(0);
    expect(v.stdout).toMatch(/signed: 2 revisions by Brackwater Electrical Co-op with the key SHA256:[0-9a-f]{64}/);
  });
});

describe('verify: the 16 ways the record was rewritten without a finding before', () => {
  it('1. the latest manifest\'s issuer changed', async () => {
    const c = copy();
    rewriteManifest(c.rev(2, 'manifest.json'), (m) => { m.revision.by = 'A. Nother'; });
    expect(found(c.root)).toEqual(expect.arrayContaining([expect.stringMatching(/revisions\.yaml: revision 2: by is "T\. Marwood", rev-2 says "A\. Nother"/)]));
  });

  it('2. the latest manifest\'s date changed', async () => {
    const c = copy();
    rewriteManifest(c.rev(2, 'manifest.json'), (m) => { m.revision.date = '2026-10-20'; });
    expect(found(c.root)).toEqual(expect.arrayContaining([expect.stringMatching(/revision 2: date is "2026-10-12", rev-2 says "2026-10-20"/)]));
  });

  it('3. the latest manifest\'s summary with its fails set to 0', async () => {
    const c = copy();
    rewriteManifest(c.rev(2, 'manifest.json'), (m) => { m.summary.fail = 0; m.summary.pass += 1; });
    expect(found(c.root)).toEqual(expect.arrayContaining([expect.stringMatching(/revision 2: manifest_sha256 is .*its manifest was replaced or altered/)]));
  });

  it.each(['pack.pdf', 'pack.html', 'data.json'])('4–6. the latest %s edited together with its hash in the manifest', async (file) => {
    const c = copy();
    rewriteOutput(c, 2, file, flipByte);
    expect(found(c.root)).toEqual([expect.stringMatching(/revisions\.yaml: revision 2: manifest_sha256 is/)]);
  });

  it('7. a rewritten chain: Revision 1\'s PDF, its manifest and Revision 2\'s link to it', async () => {
    const c = copy();
    const m1 = rewriteOutput(c, 1, 'pack.pdf', flipByte);
    rewriteManifest(c.rev(2, 'manifest.json'), (m) => { m.previous.manifest_sha256 = m1; });
    const f = found(c.root);
    expect(f).toEqual(expect.arrayContaining([expect.stringMatching(/revision 1: manifest_sha256/), expect.stringMatching(/revision 2: manifest_sha256/)]));
  });

  it('8. the latest revision deleted (a rollback)', async () => {
    const c = copy();
    chmodSync(c.rev(2), 0o755);
    rmSync(c.rev(2), { recursive: true });
    expect(found(c.root)).toEqual([expect.stringMatching(/revisions\.yaml: records revision 2, which .*archive\/archive-job does not hold: removed or rolled back/)]);
  });

  it('9. the latest revision replaced by a revision of other inputs', async () => {
    const c = copy();
    chmodSync(c.rev(2), 0o755);
    rmSync(c.rev(2), { recursive: true });
    cpSync(join(alt, 'archive', JOB, 'rev-2'), c.rev(2), { recursive: true });
    expect(found(c.root)).toEqual(expect.arrayContaining([expect.stringMatching(/revision 2: input_hash is/), expect.stringMatching(/revision 2: manifest_sha256 is/)]));
  });

  it('10. the job\'s archive hidden behind a dot-name', async () => {
    const c = copy();
    renameSync(join(c.root, 'archive', JOB), join(c.root, 'archive', `.${JOB}`));
    const f = found(c.root);
    expect(f).toEqual(expect.arrayContaining([
      expect.stringMatching(/^archive\/\.archive-job: hidden/),
      expect.stringMatching(/revisions\.yaml: records revision 1, which .*archive\/archive-job does not hold/),
    ]));
  });

  it('11. the job\'s whole archive folder deleted', async () => {
    const c = copy();
    for (const n of [1, 2]) chmodSync(c.rev(n), 0o755);
    rmSync(join(c.root, 'archive', JOB), { recursive: true });
    expect(found(c.root)).toHaveLength(2); // revisions 1 and 2 recorded, neither there
    const v = await run(['verify', join(c.root, 'projects')]);
    expect(v.code).toBe(1);
    expect(v.stdout).toMatch(/FAILED: 0 revisions of 0 jobs .* 2 findings/);
  });

  it('12. revisions.yaml: the latest entry removed', async () => {
    const c = copy();
    rewriteRecord(c.record, (e) => e.filter((x) => x.revision !== 2));
    expect(found(c.root)).toEqual([expect.stringMatching(/archive\/archive-job\/rev-2: not recorded in .*revisions\.yaml/)]);
  });

  it.each([
    ['by', 'A. Nother'], ['date', '2026-10-11'], ['input_hash', 'f'.repeat(64)], ['reason', 'Tidied'], ['accepted_open_items', true], ['packsmith', '9.9.9'],
  ] as const)('13–16. revisions.yaml: %s edited', (field, value) => {
    const c = copy();
    rewriteRecord(c.record, (e) => e.map((x) => (x.revision === 1 ? { ...x, [field]: value } : x)));
    expect(found(c.root)).toEqual([expect.stringMatching(new RegExp(`revisions\\.yaml: revision 1: ${field} is`))]);
  });

  it('revisions.yaml: a revision added that the archive does not hold, and the file made unreadable', async () => {
    const c = copy();
    rewriteRecord(c.record, (e) => [...e, { ...e[1], revision: 3 }]);
    expect(found(c.root)).toEqual([expect.stringMatching(/records revision 3, which .* does not hold/)]);
    writeFileSync(c.record, 'revisions: [');
    expect(found(c.root)).toEqual([expect.stringMatching(/revisions\.yaml: unreadable/)]);
  });
});

describe('verify: what only the firm\'s signature can tell (both sides of the record rewritten)', () => {
  it('the latest manifest changed and revisions.yaml changed to match', async () => {
    const c = copy();
    const s = rewriteManifest(c.rev(2, 'manifest.json'), (m) => { m.revision.by = 'A. Nother'; m.summary.fail = 0; });
    rewriteRecord(c.record, (e) => recordSha(e, 2, s).map((x) => (x.revision === 2 ? { ...x, by: 'A. Nother' } : x)));
    expect(found(c.root)).toEqual([]);
    expect(found(c.root, true)).toEqual([expect.stringMatching(/rev-2\/manifest\.sig: does not match manifest\.json/)]);
  });

  it('a file edited with its hash, and the chain and revisions.yaml rewritten to match', async () => {
    const c = copy();
    const m1 = rewriteOutput(c, 1, 'pack.pdf', flipByte);
    const m2 = rewriteManifest(c.rev(2, 'manifest.json'), (m) => { m.previous.manifest_sha256 = m1; });
    rewriteRecord(c.record, (e) => recordSha(recordSha(e, 1, m1), 2, m2));
    expect(found(c.root)).toEqual([]);
    expect(found(c.root, true)).toEqual(expect.arrayContaining([expect.stringMatching(/rev-1\/manifest\.sig: does not match/), expect.stringMatching(/rev-2\/manifest\.sig: does not match/)]));
  });

  it('the latest revision replaced by one of other inputs, with its revisions.yaml', async () => {
    const c = copy();
    chmodSync(c.rev(2), 0o755);
    rmSync(c.rev(2), { recursive: true });
    cpSync(join(alt, 'archive', JOB, 'rev-2'), c.rev(2), { recursive: true });
    cpSync(join(alt, 'projects', JOB), join(c.root, 'projects', JOB), { recursive: true });
    expect(found(c.root)).toEqual([]);
    expect(found(c.root, true)).toEqual([expect.stringMatching(/rev-2\/manifest\.sig: missing: the latest revision is unsigned/)]);
    const v = await run(['verify', join(c.root, 'projects'), '--key', join(keys, 'firm.key.pub')]);
    expect(v.code).toBe(1);
  });

  it('a signature made with another key, and the signature file removed from the latest revision', async () => {
    const c = copy();
    const sig = JSON.parse(readFileSync(c.rev(2, 'manifest.sig'), 'utf8')) as Record<string, string>;
    writable(c.rev(2, 'manifest.sig'), () => writeFileSync(c.rev(2, 'manifest.sig'), JSON.stringify({ ...sig, key: 'SHA256:' + 'a'.repeat(64) })));
    expect(found(c.root, true)).toEqual([expect.stringMatching(/rev-2\/manifest\.sig: signed with the key SHA256:a{64}, not the firm's key/)]);
    writable(c.rev(2, 'manifest.sig'), () => rmSync(c.rev(2, 'manifest.sig')));
    expect(found(c.root, true)).toEqual([expect.stringMatching(/rev-2\/manifest\.sig: missing/)]);
    expect(check(c.root).unsigned).toEqual(['archive-job/rev-2']);
  });
});

describe('verify: nothing hidden from the walk', () => {
  it('finds a symbolic link in place of a revision, a hidden file in a revision and a stray file in the archive', async () => {
    const c = copy();
    const elsewhere = place('elsewhere');
    cpSync(c.rev(2), join(elsewhere, 'rev-2'), { recursive: true });
    chmodSync(c.rev(2), 0o755);
    rmSync(c.rev(2), { recursive: true });
    symlinkSync(join(elsewhere, 'rev-2'), c.rev(2));
    writable(c.rev(1, '.note'), () => writeFileSync(c.rev(1, '.note'), 'x'));
    mkdirSync(join(c.root, 'archive', '.hidden'));
    const f = found(c.root);
    expect(f).toEqual(expect.arrayContaining([
      expect.stringMatching(/^archive\/\.hidden: hidden/),
      expect.stringMatching(/archive-job\/rev-1\/\.note: extra/),
      expect.stringMatching(/archive-job\/rev-2: a symbolic link/),
    ]));
  });
});
