// The progress line of a long build: "packsmith: 12/200 packs (6 %) harbour-lane", rewritten in
// place on a terminal, and silent when the output is not a terminal or the build is small.
export interface ProgressStream {
  isTTY?: boolean;
  columns?: number;
  write(chunk: string): unknown;
}

export interface Progress {
  /** one more item done */
  tick(label?: string): void;
  /** clear the line (the build then prints its results) */
  done(): void;
}

/** Builds of more jobs than this show a progress line. */
export const PROGRESS_ABOVE = 5;

const QUIET: Progress = { tick() {}, done() {} };

export function progressLine(total: number, stream: ProgressStream = process.stderr, what = 'packs'): Progress {
  if (!stream.isTTY || total <= PROGRESS_ABOVE) return QUIET;
  let count = 0;
  let shown = false;
  const width = Math.max(20, (stream.columns ?? 80) - 1);
  return {
    tick(label) {
      count += 1;
      const line = `packsmith: ${count}/${total} ${what} (${Math.floor((100 * count) / total)} %)${label ? ` ${label}` : ''}`;
      stream.write(`\r\x1b[2K${line.slice(0, width)}`);
      shown = true;
    },
    done() {
      if (shown) stream.write('\r\x1b[2K');
      shown = false;
    },
  };
}
