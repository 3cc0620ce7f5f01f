// What the native partials share: Handlebars' own escaping and truth, the `num` helper, the
// indentation Handlebars gives a partial standing on a line of its own, and the status and symbol
// partials. Each function gives, byte for byte, what the template of the same name gives
// (tests/render/native.test.ts renders both ways).
import Handlebars from 'handlebars';
import { fmt } from '../../model/units.js';
import { look, SEVERITY, type Look } from '../status.js';

/** `{{value}}`: Handlebars' escaping itself (null and undefined give nothing, false gives "false"). */
export const e = Handlebars.Utils.escapeExpression as (value: unknown) => string;

/** `{{#if value}}`: false for null, undefined, false, 0, "" and an empty array. */
export const truthy = (value: unknown): boolean => Boolean(value) && !(Array.isArray(value) && value.length === 0);

/** `{{num value}}` (engine.ts): three significant figures, a dash where there is no number (a number's digits need no escaping). */
export const num = (n: unknown): string => (typeof n === 'number' ? fmt(n, 3) : '—');

/** `{{> partial}}` alone on an indented line: every line of its output indented, but a last empty one. */
export function indent(text: string, pad: string): string {
  const lines = text.split('\n');
  for (let i = 0, l = lines.length; i < l; i++) {
    if (!lines[i] && i + 1 === l) break;
    lines[i] = pad + lines[i];
  }
  return lines.join('\n');
}

// joined rather than concatenated: one flat string, which a page holding it hundreds of times copies in one piece
const statusOf = (look: Look): string =>
  ['<span class="status ', e(look.css), '"><span class="sym sh-', e(look.shape), '" aria-hidden="true">', e(look.symbol), '</span> ', e(look.word), '</span>\n'].join('');
const symbolOf = (look: Look): string =>
  ['<span class="status ', e(look.css), '" title="', e(look.word), '"><span class="sym sh-', e(look.shape), '" aria-label="', e(look.word), '">', e(look.symbol), '</span></span>\n'].join('');

/**
 * Both partials for each status as status.ts shows it, written once: a pack shows a status in
 * hundreds of cells. A look that differs from these in any field is written out as it is.
 */
const WRITTEN = new Map(SEVERITY.map((s) => {
  const l = look(s);
  return [s, { look: l, status: statusOf(l), symbol: symbolOf(l) }] as const;
}));
const written = (l: Look) => {
  const w = WRITTEN.get(l.status);
  return w !== undefined && l.css === w.look.css && l.shape === w.look.shape && l.symbol === w.look.symbol && l.word === w.look.word ? w : undefined;
};

/** partials/status.hbs with look=look */
export const status = (l: Look): string => written(l)?.status ?? statusOf(l);

/** partials/symbol.hbs with look=look */
export const symbol = (l: Look): string => written(l)?.symbol ?? symbolOf(l);
