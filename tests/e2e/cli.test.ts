// The command line as people expect it: --help for every command, --version, "did you mean",
// plain messages for a missing folder. Usage errors exit 2.
import { describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
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

  it('stops quietly when its reader stops early (check … | head), keeping the command\'s exit code', async () => {
    // more JSON than a pipe holds (some 320 kB), so the reader closes it with much still to write
    const args = [`${ROOT}dist/cli.js`, 'check', 'tests/fixtures/long-board', '--json'];
    const whole = packsmith(args.slice(1));
    expect(whole.stdout.length).toBeGreaterThan(200_000);
    const child = spawn(process.execPath, args, { cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (d: Buffer) => { stderr += d.toString(); });
    child.stdout.once('data', () => child.stdout.destroy());
    const code = await new Promise<number | null>((resolve) => child.on('close', resolve));
    expect(stderr).toBe(whole.stderr);
    expect(code).toBe(whole.code);
  });
});

