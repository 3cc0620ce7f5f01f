// Watching the served files with chokidar (inotify on Linux, one watch per folder): it reports
// files an editor replaces by rename (write a temporary file, rename it over the old one) as a
// change, and picks up folders created after the start, which node's own recursive fs.watch on
// Node 20 has not always done reliably.
import { basename } from 'node:path';
import { watch, type FSWatcher } from 'chokidar';

export interface Watcher {
  add(paths: string[]): void;
  close(): Promise<void>;
}

/** Hidden files (editors' swap files, packsmith's own working files) and build output are ignored. */
const ignored = (path: string): boolean => {
  const name = basename(path);
  return (name.startsWith('.') && name !== '.') || name === 'node_modules' || name.endsWith('~');
};

/** Watch `paths` (folders and files; depth 0 for `shallow` folders) and call `changed` with each path that changes. */
export async function watchPaths(paths: string[], shallow: string[], changed: (path: string) => void): Promise<Watcher> {
  const watchers: FSWatcher[] = [];
  const start = (p: string[], depth?: number) => {
    const w = watch(p, { ignoreInitial: true, ignored, ...(depth === undefined ? {} : { depth }) });
    w.on('all', (_event, path) => changed(path));
    w.on('error', () => { /* a folder that vanished: its job is re-read (and reported) by the rescan */ });
    watchers.push(w);
    return new Promise<void>((resolve) => w.once('ready', () => resolve()));
  };
  await Promise.all([start(paths), ...(shallow.length ? [start(shallow, 0)] : [])]);
  const seen = new Set([...paths, ...shallow]);
  return {
    add: (more) => {
      const fresh = more.filter((p) => !seen.has(p));
      fresh.forEach((p) => seen.add(p));
      if (fresh.length) watchers[0]!.add(fresh);
    },
    close: async () => { await Promise.all(watchers.map((w) => w.close())); },
  };
}
