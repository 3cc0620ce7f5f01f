// Server-sent events: open pages listen on /events and reload when their job was re-rendered.
import type { ServerResponse } from 'node:http';

export interface Listener {
  res: ServerResponse;
  /** the job whose page is open; null for the index (told of every job) */
  job: string | null;
}

export class Events {
  private readonly listeners = new Set<Listener>();
  private readonly beat: NodeJS.Timeout;

  constructor() {
    // a comment now and then keeps proxies and idle timers from closing the stream
    this.beat = setInterval(() => { for (const l of this.listeners) l.res.write(': still here\n\n'); }, 15_000);
    this.beat.unref();
  }

  /** `version`: the job's version now, told at once (a page that shows another reloads). */
  listen(res: ServerResponse, job: string | null, headers: Record<string, string>, version?: number): void {
    res.writeHead(200, { ...headers, 'Content-Type': 'text/event-stream; charset=utf-8', 'Cache-Control': 'no-store', Connection: 'keep-alive' });
    res.write('retry: 500\n\n');
    if (job !== null && version !== undefined) res.write(`event: reload\ndata: ${JSON.stringify({ job, version })}\n\n`);
    const l = { res, job };
    this.listeners.add(l);
    res.on('close', () => this.listeners.delete(l));
  }

  /** Tell the pages of `job` (and the index) that it changed. */
  reload(job: string, version: number): void {
    for (const l of this.listeners) {
      if (l.job === null || l.job === job) l.res.write(`event: reload\ndata: ${JSON.stringify({ job, version })}\n\n`);
    }
  }

  close(): void {
    clearInterval(this.beat);
    for (const l of this.listeners) l.res.end();
    this.listeners.clear();
  }
}
