// Run the compiled command line as a user would.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const CLI = fileURLToPath(new URL('../../dist/cli.js', import.meta.url));

export function packsmith(args: string[], env: NodeJS.ProcessEnv = {}) {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd: ROOT, encoding: 'utf8', env: { ...process.env, ...env } });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
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
