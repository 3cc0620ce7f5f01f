// Run the compiled command line as a user would: in a process of its own (`packsmith`,
// `startPacksmith`), or in this test's process (`run`) where the test is about what a command
// does, not about the process (its signals, its exit, what a kill leaves).
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll } from 'vitest';

export const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const CLI = fileURLToPath(new URL('../../dist/cli.js', import.meta.url));

export function packsmith(args: string[], env: NodeJS.ProcessEnv = {}) {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd: ROOT, encoding: 'utf8', env: { ...process.env, ...env } });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

type Ran = { code: number | null; stdout: string; stderr: string };
const dist = (file: string) => new URL(`../../dist/${file}`, import.meta.url).href;
let shared: Promise<{ close(): Promise<void> }> | null = null;
afterAll(async () => { if (shared) await (await shared).close(); });

/**
 * The compiled command line (dist/program.js, what dist/cli.js runs) in this process: the same
 * exit code, stdout and stderr as `packsmith`, with `env` set for the run. The printing commands
 * of one test file share one Chromium (each still opens and closes its own pages).
 */
export async function run(args: string[], env: NodeJS.ProcessEnv = {}): Promise<Ran> {
  shared ??= import(dist('produce.js')).then((m: { shareOneBrowser(): { close(): Promise<void> } }) => m.shareOneBrowser());
  await shared;
  const { runCli } = (await import(dist('program.js'))) as { runCli(argv: string[]): Promise<number> };
  const saved = Object.fromEntries(Object.keys(env).map((k) => [k, process.env[k]]));
  const out = { stdout: '', stderr: '' };
  const writes = { stdout: process.stdout.write, stderr: process.stderr.write };
  const capture = (to: 'stdout' | 'stderr') => ((chunk: string | Uint8Array) => { out[to] += chunk.toString(); return true; }) as typeof process.stdout.write;
  Object.assign(process.env, env);
  process.stdout.write = capture('stdout');
  process.stderr.write = capture('stderr');
  try {
    return { code: await runCli(args), ...out };
  } finally {
    Object.assign(process.stdout, { write: writes.stdout });
    Object.assign(process.stderr, { write: writes.stderr });
    for (const [k, v] of Object.entries(saved)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  }
}

export interface Running {
  child: ChildProcess;
  /** resolves when stderr has said `text` */
  said(text: string): Promise<void>;
  /** resolves once the child has really stopped itself (after saying "stopped at ...") */
  stopped(): Promise<void>;
  exit: Promise<{ code: number | null; signal: NodeJS.Signals | null; stdout: string; stderr: string }>;
}

/** Start the CLI without waiting for it (for the interruption and concurrency tests). */
export function startPacksmith(args: string[], env: NodeJS.ProcessEnv = {}): Running {
  const child = spawn(process.execPath, [CLI, ...args], { cwd: ROOT, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  let stdout = '';
  let stderr = '';
  const waiting: { text: string; resolve: () => void }[] = [];
  child.stdout!.on('data', (d: Buffer) => { stdout += d.toString(); });
  child.stderr!.on('data', (d: Buffer) => {
    stderr += d.toString();
    for (const w of waiting.filter((x) => stderr.includes(x.text))) {
      waiting.splice(waiting.indexOf(w), 1);
      w.resolve();
    }
  });
  const exit = new Promise<{ code: number | null; signal: NodeJS.Signals | null; stdout: string; stderr: string }>((resolve) => {
    child.on('close', (code, signal) => resolve({ code, signal, stdout, stderr }));
  });
  return {
    child,
    exit,
    stopped: async () => {
      // The child says where it stops, then stops itself: wait for the stop itself (state T in
      // /proc), or a SIGCONT sent in between would be lost and the child would stay stopped.
      for (;;) {
        const stat = readFileSync(`/proc/${child.pid}/stat`, 'utf8');
        if (stat.slice(stat.lastIndexOf(')') + 2).startsWith('T')) return;
        await new Promise((r) => setTimeout(r, 20));
      }
    },
    said: (text) => new Promise<void>((resolve, reject) => {
      if (stderr.includes(text)) return resolve();
      waiting.push({ text, resolve });
      void exit.then((e) => reject(new Error(`packsmith ended (${e.code ?? e.signal}) before saying "${text}": ${e.stderr}`)));
    }),
  };
}

/**
 * `--archive` for builds of the demo jobs: a folder that is never there, so a draft never depends
 * on whether `npm run setup` issued the demo's revisions into archive/.
 */
export const NO_ARCHIVE = ['--archive', fileURLToPath(new URL('../fixtures/no-archive', import.meta.url))];
