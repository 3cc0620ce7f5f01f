// Files served from the archive folder: only what is inside it, whatever the path says.
import { describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileInside } from '../../src/serve/files.js';

const base = mkdtempSync(join(tmpdir(), 'packsmith-files-'));
const root = join(base, 'out');
mkdirSync(join(root, 'job', 'draft'), { recursive: true });
writeFileSync(join(root, 'index.html'), 'site');
writeFileSync(join(root, 'job', 'draft', 'pack.html'), 'pack');
writeFileSync(join(root, 'job', '.build-123-abcdef01'), 'working');
writeFileSync(join(base, 'secret.txt'), 'outside');
symlinkSync(join(base, 'secret.txt'), join(root, 'link.txt'));
symlinkSync(base, join(root, 'up'));
symlinkSync(join(root, 'job', 'draft', 'pack.html'), join(root, 'inner.html'));

describe('fileInside', () => {
  it('finds files and a folder\'s index.html', () => {
    expect(fileInside(root, 'job/draft/pack.html')).toBe(join(root, 'job/draft/pack.html'));
    expect(fileInside(root, '')).toBe(join(root, 'index.html'));
    expect(fileInside(root, 'inner.html')).toBe(join(root, 'job/draft/pack.html')); // a link that stays inside
  });
  it('never leaves the folder: "..", encoded "..", backslashes, NUL, symbolic links out', () => {
    for (const p of ['../secret.txt', 'job/../../secret.txt', '%2e%2e/secret.txt', '%2E%2E%2Fsecret.txt', 'job/..%5c..%5csecret.txt', '..%2fsecret.txt',
      'link.txt', 'up/secret.txt', 'job/%00pack.html', '%', 'job/.build-123-abcdef01', 'missing.html', 'job/draft']) {
      expect(fileInside(root, p), p).toBeNull();
    }
  });
  it('gives nothing when the folder itself is missing', () => {
    expect(fileInside(join(base, 'nowhere'), 'index.html')).toBeNull();
  });
});
