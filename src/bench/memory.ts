// Peak resident memory of a process tree (Linux /proc), sampled while a stage runs.
import { existsSync, readdirSync, readFileSync } from 'node:fs';

function rssKb(pid: number): number {
  try {
    const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return m ? Number(m[1]) : 0;
  } catch {
    return 0;
  }
}

/**
 * Proportional set size: each page shared between processes counted once, split among them.
 * Chromium's renderers and zygotes share about 80 MB each of fonts and code, which a sum of RSS
 * counts again for each.
 */
function pssKb(pid: number): number {
  try {
    const m = /^Pss:\s+(\d+) kB/m.exec(readFileSync(`/proc/${pid}/smaps_rollup`, 'utf8'));
    return m ? Number(m[1]) : 0;
  } catch {
    return 0;
  }
}

function children(pid: number): number[] {
  const tasks = `/proc/${pid}/task`;
  if (!existsSync(tasks)) return [];
  const out: number[] = [];
  for (const t of readdirSync(tasks)) {
    try {
      out.push(...readFileSync(`${tasks}/${t}/children`, 'utf8').trim().split(/\s+/).filter(Boolean).map(Number));
    } catch { /* the task ended */ }
  }
  return out;
}

/** What a process of the tree is: the root (node), Chromium's browser process, or the --type of a Chromium child. */
function kindOf(pid: number, root: number): string {
  if (pid === root) return 'node';
  let cmd = '';
  try {
    cmd = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
  } catch { /* ended */ }
  const type = /--type=([a-z-]+)/.exec(cmd)?.[1];
  if (!type) return 'browser';
  return type === 'utility' ? /--utility-sub-type=[\w.]*?(\w+)\x00/.exec(cmd)?.[1] ?? 'utility' : type;
}

/** The resident memory of a process tree, kB, by kind of process (and its proportional size, `pss`). */
export function treeRssByKind(root: number, pss?: { kb: number }): Map<string, number> {
  const out = new Map<string, number>();
  const stack = [root];
  const seen = new Set<number>();
  while (stack.length) {
    const pid = stack.pop()!;
    if (seen.has(pid)) continue;
    seen.add(pid);
    const kind = kindOf(pid, root);
    out.set(kind, (out.get(kind) ?? 0) + rssKb(pid));
    if (pss) pss.kb += pssKb(pid);
    stack.push(...children(pid));
  }
  return out;
}

export function treeRssKb(root: number): number {
  let total = 0;
  for (const kb of treeRssByKind(root).values()) total += kb;
  return total;
}

/**
 * Sample a process tree's RSS every `ms` until stopped; returns the peak in MB (0 where /proc is
 * absent). `atPeak` has the tree's processes by kind at that peak, MB; `peakPssMb` the peak of
 * the tree's proportional set size (shared pages counted once).
 */
export function sampleTree(pid: () => number | undefined, ms = 200): { stop(): number; atPeak(): Record<string, number>; peakPssMb(): number } {
  let peak = 0;
  let peakPss = 0;
  let atPeak = new Map<string, number>();
  const take = () => {
    const p = pid();
    if (p === undefined) return;
    const pss = { kb: 0 };
    const kinds = treeRssByKind(p, pss);
    const total = [...kinds.values()].reduce((a, b) => a + b, 0);
    if (total > peak) [peak, atPeak] = [total, kinds];
    peakPss = Math.max(peakPss, pss.kb);
  };
  take();
  const timer = setInterval(take, ms);
  return {
    stop() {
      take();
      clearInterval(timer);
      return peak / 1024;
    },
    peakPssMb: () => peakPss / 1024,
    atPeak: () => Object.fromEntries([...atPeak].sort((a, b) => b[1] - a[1]).map(([k, kb]) => [k, Math.round(kb / 1024)])),
  };
}
