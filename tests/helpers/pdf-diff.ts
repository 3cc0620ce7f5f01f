// Where two PDFs that should be byte-identical differ, said in a few lines a person can act on:
// both files are kept (their folder is named), and the first differing line of the first differing
// stream (inflated where it is deflated: page content, object streams, fonts) is shown beside the
// other's. A reproducibility test puts this in its failure message, so a rare difference seen once
// on a loaded machine can still be looked into afterwards.
import { copyFileSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';

/** The PDF's streams in file order (inflated where they inflate), then what lies between them. */
function parts(pdf: Buffer): { streams: string[]; rest: string } {
  const text = pdf.toString('latin1');
  const streams: string[] = [];
  let rest = '';
  let at = 0;
  const open = /stream\r?\n/g;
  for (let m = open.exec(text); m; m = open.exec(text)) {
    const start = m.index + m[0].length;
    const end = text.indexOf('endstream', start);
    if (end < 0) break;
    rest += text.slice(at, m.index);
    const raw = pdf.subarray(start, end);
    let body: string;
    try {
      body = inflateSync(raw).toString('latin1');
    } catch {
      body = raw.toString('latin1');
    }
    streams.push(body);
    at = end + 'endstream'.length;
    open.lastIndex = at;
  }
  return { streams, rest: rest + text.slice(at) };
}

function firstDifference(a: string, b: string): string {
  const la = a.split('\n');
  const lb = b.split('\n');
  const n = Math.max(la.length, lb.length);
  for (let i = 0; i < n; i++) {
    if (la[i] !== lb[i]) return `line ${i + 1}: ${JSON.stringify((la[i] ?? '(none)').slice(0, 160))} against ${JSON.stringify((lb[i] ?? '(none)').slice(0, 160))}`;
  }
  return 'no line differs';
}

/** An empty string where the files are identical, else what differs and where both are kept. */
export function explainPdfDifference(a: string, b: string): string {
  const ba = readFileSync(a);
  const bb = readFileSync(b);
  if (ba.equals(bb)) return '';
  const kept = mkdtempSync(join(tmpdir(), 'packsmith-pdf-difference-'));
  copyFileSync(a, join(kept, 'a.pdf'));
  copyFileSync(b, join(kept, 'b.pdf'));
  const pa = parts(ba);
  const pb = parts(bb);
  const lines = [`${a} (${ba.length} bytes) and ${b} (${bb.length} bytes) differ; both kept in ${kept}`];
  if (pa.streams.length !== pb.streams.length) lines.push(`${pa.streams.length} streams against ${pb.streams.length}`);
  const differing = pa.streams.map((s, i) => i).filter((i) => pa.streams[i] !== pb.streams[i]);
  lines.push(`${differing.length} of ${pa.streams.length} streams differ`);
  const first = differing[0];
  if (first !== undefined) lines.push(`stream ${first + 1}, ${firstDifference(pa.streams[first]!, pb.streams[first] ?? '')}`);
  if (pa.rest !== pb.rest) lines.push(`outside the streams, ${firstDifference(pa.rest, pb.rest)}`);
  return lines.join('\n');
}

/**
 * Text drawn in the page flow at a y that is not a whole CSS pixel, as "y (font size)". Chromium
 * draws the flow under one scale from its device pixels to CSS pixels (the `cm` most text follows)
 * and snaps most baselines to whole pixels; a baseline a fraction of a pixel off is one Chromium
 * has been seen to place differently from one print to the next. Drawings (the curves' SVG) sit
 * under scales of their own and are not counted.
 */
export function offPixelFlowText(pdf: Buffer): string[] {
  const runs: { scale: string; y: string; size: string }[] = [];
  for (const body of parts(pdf).streams) {
    let scale = '';
    let size = '';
    for (const line of body.split('\n')) {
      const cm = /^(\S+) 0 0 \S+ \S+ \S+ cm$/.exec(line);
      if (cm) scale = cm[1]!;
      const tf = /\/\S+ (\S+) Tf/.exec(line);
      if (tf) size = tf[1]!;
      const tm = /^1 0 0 -1 \S+ (\S+) Tm$/.exec(line);
      if (tm) runs.push({ scale, y: tm[1]!, size });
    }
  }
  const count = new Map<string, number>();
  for (const r of runs) count.set(r.scale, (count.get(r.scale) ?? 0) + 1);
  const flow = [...count].sort((a, b) => b[1] - a[1])[0]?.[0];
  return runs.filter((r) => r.scale === flow && !Number.isInteger(Number(r.y))).map((r) => `${r.y} (${r.size} px)`);
}
