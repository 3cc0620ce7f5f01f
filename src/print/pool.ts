// A pool of print pages on one Chromium: as many pages as the machine has cores, each prepared
// once (no JavaScript, requests refused) and reused from pack to pack. `print` queues when every
// page is busy; `room` lets a producer wait instead of queueing the whole build at once.
import { availableParallelism } from 'node:os';
import type { Page } from 'puppeteer-core';
import { preparePage, type PdfOptions, type PrintPage } from './pdf.js';

export interface PrintPool {
  /** how many pages print at once */
  readonly size: number;
  print(htmlPath: string, opts: PdfOptions): Promise<{ pdf: Uint8Array; refused: string[] }>;
  /** resolves when fewer than `limit` prints are queued or running */
  room(limit?: number): Promise<void>;
  /** pages opened so far, and the most that printed at one time */
  stats(): { opened: number; busiest: number; printed: number };
  /** Open a page ahead of the first print, where none is open or opening (its errors are the first print's). */
  warm(): void;
  close(): Promise<void>;
}

export const defaultPoolSize = (): number => Math.max(1, availableParallelism());

/** How many packs a pool of `size` pages holds printing or queued before `room` makes a producer wait. */
export const roomLimit = (size: number = defaultPoolSize()): number => size * 2;

/**
 * A pool on `browser`, which opens each page it prints on: a launched browser (print/browser.ts),
 * whose first page is the tab Chromium opened at start, or any puppeteer browser.
 */
export function createPrintPool(browser: { newPage(): Promise<Page> }, size: number = defaultPoolSize()): PrintPool {
  if (!Number.isInteger(size) || size < 1) throw new Error(`a print pool needs at least one page (asked for ${size})`);
  const idle: PrintPage[] = [];
  const all = new Set<PrintPage>();
  const waiting: { resolve: (p: PrintPage) => void; reject: (e: unknown) => void }[] = [];
  const roomWaiters: { limit: number; resolve: () => void }[] = [];
  let opening = 0;
  let busy = 0;
  let busiest = 0;
  let pending = 0;
  let printed = 0;
  let closed = false;
  let warming = false;

  const open = async (): Promise<PrintPage> => {
    opening += 1;
    try {
      const p = await preparePage(await browser.newPage());
      all.add(p);
      return p;
    } finally {
      opening -= 1;
    }
  };
  const acquire = (): Promise<PrintPage> => {
    const p = idle.pop();
    if (p) return Promise.resolve(p);
    // the page warm() is opening goes to the first print (a single pack opens no second page)
    if (all.size + opening < size && !(warming && waiting.length === 0)) return open();
    return new Promise((resolve, reject) => waiting.push({ resolve, reject }));
  };
  const release = (p: PrintPage) => {
    const next = waiting.shift();
    if (next) next.resolve(p);
    else idle.push(p);
  };
  /** A page that failed is closed and replaced, so one bad pack does not shrink the pool. */
  const discard = async (p: PrintPage) => {
    all.delete(p);
    await p.page.close().catch(() => undefined);
    const next = waiting.shift();
    if (next) open().then(next.resolve, next.reject);
  };
  const settle = () => {
    pending -= 1;
    for (let i = roomWaiters.length - 1; i >= 0; i--) {
      if (pending < roomWaiters[i]!.limit) roomWaiters.splice(i, 1)[0]!.resolve();
    }
  };

  return {
    size,
    async print(htmlPath, opts) {
      pending += 1;
      try {
        const page = await acquire();
        busy += 1;
        busiest = Math.max(busiest, busy);
        try {
          const r = await page.print(htmlPath, opts);
          printed += 1;
          busy -= 1;
          release(page);
          return r;
        } catch (e) {
          busy -= 1;
          await discard(page);
          throw e;
        }
      } finally {
        settle();
      }
    },
    room(limit = roomLimit(size)) {
      if (pending < limit) return Promise.resolve();
      return new Promise((resolve) => roomWaiters.push({ limit, resolve }));
    },
    stats: () => ({ opened: all.size, busiest, printed }),
    warm() {
      if (closed || all.size + opening > 0) return;
      warming = true;
      open().then(
        (p) => {
          warming = false;
          if (closed) void p.page.close().catch(() => undefined);
          else release(p);
        },
        () => {
          warming = false;
          const next = waiting.shift(); // a print waiting for this page opens its own, and meets the error itself
          if (next) open().then(next.resolve, next.reject);
        },
      );
    },
    async close() {
      closed = true;
      await Promise.all([...all].map((p) => p.page.close().catch(() => undefined)));
      all.clear();
      idle.length = 0;
    },
  };
}
