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

export function treeRssKb(root: number): number {
  let total = 0;
  const stack = [root];
  const seen = new Set<number>();
  while (stack.length) {
    const pid = stack.pop()!;
    if (seen.has(pid)) continue;
    seen.add(pid);
    total += rssKb(pid);
    stack.push(...children(pid));
  }
  return total;
}

/** Sample a process tree's RSS every `ms` until stopped; returns the peak in MB (0 where /proc is absent). */
export function sampleTree(pid: () => number | undefined, ms = 200): { stop(): number } {
  let peak = 0;
  const take = () => {
    const p = pid();
    if (p !== undefined) peak = Math.max(peak, treeRssKb(p));
  };
  take();
  const timer = setInterval(take, ms);
  return {
    stop() {
      take();
      clearInterval(timer);
      return peak / 1024;
    },
  };
}
