// A device's time-current band as a small standalone SVG: log-log, 1 A–10 kA against
// 0.01 s–10,000 s, a decade grid, the band between the fastest and slowest edges, a marker at the
// fault current with its operating time and a dashed line at the required time. Same input, same
// bytes: every number is written with a fixed number of decimals, nothing depends on the clock.
import { scaleLog } from 'd3-scale';
import { characteristic, operatingTime, type Device, type Edge } from '../calc/devices/index.js';
import { fmt } from '../model/units.js';
import { boundedCache } from './memo.js';

export interface CurveSnippetOptions {
  device: Device;
  faultCurrentA?: number | null;
  requiredS?: number | null;
  title?: string;
  /** a second device (the largest downstream of a feeding circuit), its band drawn hatched, and the current selectivity is judged up to */
  downstream?: { device: Device; label: string; uptoA: number | null };
}

// Drawn to print about 62 mm wide: 10-unit text is then about 6.8 pt, readable on paper.
const WIDTH = 260;
const HEIGHT = 170;
const M = { left: 40, right: 8, top: 8, bottom: 30 };
const FONT = 10;
const PW = WIDTH - M.left - M.right;
const PH = HEIGHT - M.top - M.bottom;
const I_MIN = 1;
const I_MAX = 1e4;
const T_MIN = 0.01;
const T_MAX = 1e4;

const x = scaleLog().domain([I_MIN, I_MAX]).range([0, PW]);
const y = scaleLog().domain([T_MIN, T_MAX]).range([PH, 0]);

/** A coordinate with one decimal, never "-0.0". */
const c = (v: number): string => (Math.abs(v) < 0.05 ? '0.0' : v.toFixed(1));

const escape = (s: string): string =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** Tick label of a decade: 0.01 … 1000, then 10k. */
const decadeLabel = (v: number): string => (v >= 1e4 ? `${fmt(v / 1000)}k` : fmt(v));

/** The edge as (current, time) pairs running to the plot's edges: up at its first current, out along its tail. */
function edgePath(edge: Edge): [number, number][] {
  const pts: [number, number][] = edge.points.map((p) => [p.current_a, p.time_s]);
  const [i0] = pts[0]!;
  const [il, tl] = pts[pts.length - 1]!;
  pts.unshift([i0, T_MAX]);
  if (edge.tail === 'none') pts.push([il, T_MIN]);
  else if (il < I_MAX) pts.push([I_MAX, edge.tail === 'flat' ? tl : tl * (il / I_MAX) ** 2]);
  return pts;
}

const toXY = (pts: [number, number][]): string => pts.map(([i, t]) => `${c(x(i))},${c(y(t))}`).join(' ');

function grid(): string[] {
  const out: string[] = [];
  for (const i of x.ticks(4)) {
    out.push(`<line class="grid" data-current-a="${fmt(i)}" x1="${c(x(i))}" y1="0.0" x2="${c(x(i))}" y2="${c(PH)}"/>`);
    out.push(`<text class="tick" x="${c(x(i))}" y="${c(PH + 11)}" text-anchor="middle">${decadeLabel(i)}</text>`);
  }
  for (const t of y.ticks(6)) {
    out.push(`<line class="grid" data-time-s="${fmt(t)}" x1="0.0" y1="${c(y(t))}" x2="${c(PW)}" y2="${c(y(t))}"/>`);
    out.push(`<text class="tick" x="-3.0" y="${c(y(t) + 3.5)}" text-anchor="end">${decadeLabel(t)}</text>`);
  }
  return out;
}

/**
 * The snippet's stylesheet, scoped to it. A standalone snippet carries it in a <style> of its own;
 * a pack holds it once in its head (themeAssets), because every <style> inside an inline SVG is a
 * stylesheet of the whole page, and thousands of them make Chromium's layout slow and large.
 */
const CURVE_RULES: [selectors: string, declarations: string][] = [
  ['.grid', 'stroke:#ccc;stroke-width:0.5'],
  ['.tick,.axis,.note', 'fill:#222'],
  ['.note', 'paint-order:stroke;stroke:#fff;stroke-width:3px;stroke-linejoin:round'],
  ['.band', 'fill:#9bb7d4;fill-opacity:0.45;stroke:none'],
  ['.slowest', 'fill:none;stroke:#1d3f66;stroke-width:1.5'],
  ['.fastest', 'fill:none;stroke:#1d3f66;stroke-width:0.75'],
  ['.required', 'stroke:#a33;stroke-width:1;stroke-dasharray:4 3'],
  ['.fault', 'stroke:#333;stroke-width:0.75;stroke-dasharray:1 2'],
  ['.marker', 'fill:#a33;stroke:#fff;stroke-width:1'],
  ['.frame', 'fill:none;stroke:#444;stroke-width:0.75'],
  ['.band2', 'stroke:none'],
  ['.slowest2', 'fill:none;stroke:#6a4a00;stroke-width:1.2;stroke-dasharray:5 2'],
  ['.upto', 'stroke:#6a4a00;stroke-width:0.75;stroke-dasharray:1 2'],
];
export const CURVE_CSS = CURVE_RULES.map(([sel, decl]) => `${sel.split(',').map((s) => `svg.ps-curve ${s}`).join(',')}{${decl}}`).join('');

export interface SnippetForm {
  /** carry the stylesheet inside the SVG (default); false where the page holds CURVE_CSS once */
  style?: boolean;
}

/** A device's key for the caches below: a device is its code and rating. */
const deviceKey = (device: Device): string => `${device.code} ${device.rating_a}`;

/** The shaded area between a device's fastest and slowest edges: the fastest edge, held on to the right of the plot, then the slowest edge back. */
function bandArea(fast: [number, number][], slow: [number, number][]): string {
  const [fl, tl] = fast[fast.length - 1]!;
  return toXY([...fast, ...(fl < I_MAX ? [[I_MAX, tl] as [number, number]] : []), ...[...slow].reverse()]);
}

/**
 * Lines as they follow an earlier line of the snippet, each after its line break: the snippet is
 * these blocks put together (what joining all its lines with "\n" gives), so the grid and a
 * device's band are written once, each one flat string, and copied only when the page is.
 */
const afterBreaks = (lines: readonly string[]): string => ['', ...lines].join('\n');

/** The band's shapes (lines after their breaks) and its sentence, by device (a pack has a handful of devices and hundreds of circuits). */
const bands = boundedCache<{ plot: string; desc: string }>(128);
const band = (device: Device) => bands(deviceKey(device), () => {
  const ch = characteristic(device);
  if (!ch) return { plot: '', desc: `The device library holds no published time-current points for ${device.code} ${fmt(device.rating_a)} A.` };
  const plot: string[] = [];
  const slow = edgePath(ch.slowest);
  let desc: string;
  if (ch.fastest) {
    const fast = edgePath(ch.fastest);
    plot.push(`<polygon class="band" points="${bandArea(fast, slow)}"/>`);
    plot.push(`<polyline class="fastest" points="${toXY(fast)}"/>`);
    desc = `The shaded band lies between the fastest and the slowest operating times of ${ch.source}.`;
  } else {
    desc = `The line is the slowest operating time of ${ch.source}; no fastest edge is published.`;
  }
  plot.push(`<polyline class="slowest" points="${toXY(slow)}"/>`);
  return { plot: afterBreaks(plot), desc };
});

/** A downstream device's band as points (its hatch is named after the snippet's title), by device. */
const downstreamBands = boundedCache<{ area: string | null; slowest: string; source: string } | null>(128);
const downstreamBand = (device: Device) => downstreamBands(deviceKey(device), () => {
  const down = characteristic(device);
  if (!down) return null;
  const slow = edgePath(down.slowest);
  return { area: down.fastest ? bandArea(edgePath(down.fastest), slow) : null, slowest: toXY(slow), source: down.source };
});

/** The fault point's line, marker and label (lines after their breaks) and its sentence, by device and fault current. */
const faultPoints = boundedCache<{ plot: string; over: string; desc: string }>(2048);
const faultPoint = (device: Device, fault: number) => faultPoints(`${deviceKey(device)} ${fault}`, () => {
  const plot: string[] = [];
  const over: string[] = [];
  const t = operatingTime(device, fault).slowest_s;
  const shown = `${fmt(fault)} A`;
  if (fault >= I_MIN && fault <= I_MAX) {
    const xf = x(fault);
    const yf = t === null ? 0 : Math.min(PH, Math.max(0, y(t)));
    plot.push(`<line class="fault" x1="${c(xf)}" y1="${c(PH)}" x2="${c(xf)}" y2="${c(yf)}"/>`);
    if (t !== null) over.push(`<circle class="marker" cx="${c(xf)}" cy="${c(yf)}" r="3.0"/>`);
    const label = t === null ? `${shown}: not known to operate` : `${shown}: ${fmt(t)} s`;
    const anchor = xf > PW / 2 ? 'end' : 'start';
    over.push(`<text class="note" x="${c(xf + (anchor === 'end' ? -5 : 5))}" y="${c(Math.max(10, yf - 5))}" text-anchor="${anchor}">${escape(label)}</text>`);
  }
  const desc = t === null
    ? `At a fault current of ${shown} the device is not known to operate.`
    : `At a fault current of ${shown} the slowest operating time is ${fmt(t)} s.`;
  return { plot: afterBreaks(plot), over: afterBreaks(over), desc };
});

/** The snippet's first line, the same in every snippet. */
const OPEN = `<svg xmlns="http://www.w3.org/2000/svg" class="ps-curve" role="img" width="${WIDTH}" height="${HEIGHT}" viewBox="0 0 ${WIDTH} ${HEIGHT}" font-family="DejaVu Sans Condensed, DejaVu Sans, sans-serif" font-size="${FONT}">`;
/** From the plot's group, with the decade grid, to the opening of the plot area: the same in every snippet. */
const PLOT_OPEN = afterBreaks([
  `<g transform="translate(${M.left},${M.top})">`,
  ...grid(),
  `<svg class="plot" x="0" y="0" width="${PW}" height="${PH}" viewBox="0 0 ${PW} ${PH}" overflow="hidden">`,
]);
const PLOT_CLOSE = afterBreaks(['</svg>', `<rect class="frame" x="0" y="0" width="${PW}" height="${PH}"/>`]);
const AXES = afterBreaks([
  `<text class="axis" x="${c(PW / 2)}" y="${c(PH + 24)}" text-anchor="middle">prospective fault current (A)</text>`,
  `<text class="axis" transform="translate(-29,${c(PH / 2)}) rotate(-90)" text-anchor="middle">operating time (s)</text>`,
  '</g>',
  '</svg>',
]);

export function curveSnippet(opts: CurveSnippetOptions, form: SnippetForm = {}): string {
  const { device } = opts;
  const name = `${device.code} ${fmt(device.rating_a)} A`;
  const title = opts.title ?? `${name}: time-current characteristic`;
  const own = band(device);
  // the sentences joined by spaces; the plot's and the overlay's lines each after its line break
  let desc = own.desc;
  let plot = own.plot;
  let over = '';

  let defs = '';
  if (opts.downstream) {
    const hatch = `ps-hatch-${title.replace(/[^A-Za-z0-9]+/g, '-')}`;
    defs = `\n<defs><pattern id="${escape(hatch)}" patternUnits="userSpaceOnUse" width="5" height="5" patternTransform="rotate(45)"><line x1="0" y1="0" x2="0" y2="5" stroke="#b08a2e" stroke-width="1.4"/></pattern></defs>`;
    const down = downstreamBand(opts.downstream.device);
    if (down) {
      if (down.area !== null) plot += `\n<polygon class="band2" fill="url(#${hatch})" points="${down.area}"/>`;
      plot += `\n<polyline class="slowest2" points="${down.slowest}"/>`;
      desc += ` The hatched band is ${opts.downstream.label} (${down.source}), the largest device on the board this circuit feeds.`;
      const upto = opts.downstream.uptoA;
      if (upto !== null && upto >= I_MIN && upto <= I_MAX) {
        plot += `\n<line class="upto" x1="${c(x(upto))}" y1="0.0" x2="${c(x(upto))}" y2="${c(PH)}"/>`;
        over += `\n<text class="note" x="${c(x(upto) - 3)}" y="${c(PH - 4)}" text-anchor="end">${escape(`${fmt(upto)} A at the fed board`)}</text>`;
        desc += ` The dotted line is the prospective fault current at that board, ${fmt(upto)} A: selectivity is judged up to it.`;
      }
    }
  }

  const required = opts.requiredS ?? null;
  if (required !== null && required >= T_MIN && required <= T_MAX) {
    const yr = c(y(required));
    plot += `\n<line class="required" x1="0.0" y1="${yr}" x2="${c(PW)}" y2="${yr}"/>`;
    over += `\n<text class="note" x="${c(PW - 2)}" y="${c(y(required) - 3)}" text-anchor="end">${fmt(required)} s required</text>`;
    desc += ` The dashed line is the required disconnection time, ${fmt(required)} s.`;
  }

  const fault = opts.faultCurrentA ?? null;
  if (fault !== null && fault > 0) {
    const f = faultPoint(device, fault);
    plot += f.plot;
    over += f.over;
    desc += ` ${f.desc}`;
  }

  return `${OPEN}\n<title>${escape(title)}</title>\n<desc>${escape(desc)}</desc>${form.style === false ? '' : `\n<style>${CURVE_CSS}</style>`}${defs}`
    + `${PLOT_OPEN}${plot}${PLOT_CLOSE}${over}${AXES}`;
}
