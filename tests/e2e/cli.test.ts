// The command line as people expect it: --help for every command, --version, "did you mean",
// plain messages for a missing folder. Usage errors exit 2.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { packsmith, ROOT } from '../helpers/cli.js';

const version = (JSON.parse(readFileSync(`${ROOT}package.json`, 'utf8')) as { version: string }).version;

describe('packsmith command line', () => {
  it('prints its version', () => {
    const r = packsmith(['--version']);
    expect(r.code).toBe(0);
    expect(r.stdout.trim()).toBe(version);
  });

  it('lists every command in --help', () => {
    const r = packsmith(['--help']);
    expect(r.code).toBe(0);
    for (const c of ['new', 'check', 'build', 'device', 'issue', 'verify']) expect(r.stdout).toMatch(new RegExp(`\\n  ${c} `));
    expect(r.stdout).toContain('docs/job-folder.md');
  });

  it.each([
    ['new', '--from'], ['check', '--json'], ['build', '--force'], ['device', '--within'], ['issue', '--accept-open-items'], ['verify', '[DIR]'],
  ])('gives help for %s (naming %s)', (command, option) => {
    const r = packsmith([command, '--help']);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain(`Usage: packsmith ${command}`);
    expect(r.stdout).toContain(option);
  });

  it('suggests the command meant', () => {
    const r = packsmith(['chek', 'projects/tannery-row-refit']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain("unknown command 'chek'");
    expect(r.stderr).toContain('Did you mean check?');
  });

  it('suggests the option meant', () => {
    const r = packsmith(['check', 'projects/tannery-row-refit', '--jsn']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('Did you mean --json?');
  });

  it('says plainly that a job folder is not there', () => {
    for (const args of [['check', 'nope'], ['build', 'nope', '--out', 'out-never'], ['issue', 'nope', '--by', 'A. Tester']]) {
      const r = packsmith(args);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(/^packsmith: no job folder "nope" \(looked for .*nope\)/);
      expect(r.stderr).not.toMatch(/nope:1:1/);
    }
  });

  it('refuses a missing argument with the usage', () => {
    const r = packsmith(['check']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain("missing required argument 'job-folder'");
  });
});
