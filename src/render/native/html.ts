// What the native partials share: Handlebars' own escaping and truth, the `num` helper, the
// indentation Handlebars gives a partial standing on a line of its own, and the status and symbol
// partials. Each function gives, byte for byte, what the template of the same name gives
// (tests/render/native.test.ts renders both ways).
import Handlebars from 'handlebars';
import { fmt } from '../../model/units.js';
import type { Look } from '../status.js';

/** `{{value}}`: Handlebars' escaping itself (null and undefined give nothing, false gives "false"). */
export const e = Handlebars.Utils.escapeExpression as (value: unknown) => string;

/** `{{#if value}}`: false for null, undefined, false, 0, "" and an empty array. */
export const truthy = (value: unknown): boolean => Boolean(value) && !(Array.isArray(value) && value.length === 0);

/** `{{num value}}` (engine.ts): three significant figures, a dash where there is no number. */
export const num = (n: unknown): string => (typeof n === 'number' ? e(fmt(n, 3)) : '—');

/** `{{> partial}}` alone on an indented line: every line of its output indented, but a last empty one. */
export function indent(text: string, pad: string): string {
  const lines = text.split('\n');
  for (let i = 0, l = lines.length; i < l; i++) {
    if (!lines[i] && i + 1 === l) break;
    lines[i] = pad + lines[i];
  }
  return lines.join('\n');
}

/** partials/status.hbs with look=look */
export const status = (look: Look): string =>
  `<span class="status ${e(look.css)}"><span class="sym sh-${e(look.shape)}" aria-hidden="true">${e(look.symbol)}</span> ${e(look.word)}</span>\n`;

/** partials/symbol.hbs with look=look */
export const symbol = (look: Look): string =>
  `<span class="status ${e(look.css)}" title="${e(look.word)}"><span class="sym sh-${e(look.shape)}" aria-label="${e(look.word)}">${e(look.symbol)}</span></span>\n`;
