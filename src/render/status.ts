// How a status looks, and the worst of a group of statuses.
import type { Assessment, Status } from '../calc/types.js';
import { STATUS_WORDS } from './labels.js';

/**
 * Each status has a word, a symbol and a shape as well as a colour (pack.css): nothing is lost in
 * black and white or to a colour-blind reader. `shape` names the outline drawn round the symbol (pack.css `.sh-*`).
 */
export const STATUS_LOOK: Record<Status, { word: string; symbol: string; shape: string; css: string }> = {
  pass: { word: STATUS_WORDS.pass, symbol: '✓', shape: 'circle', css: 'st-pass' },
  fail: { word: STATUS_WORDS.fail, symbol: '✗', shape: 'square', css: 'st-fail' },
  attention: { word: STATUS_WORDS.attention, symbol: '!', shape: 'triangle', css: 'st-attention' },
  'not-verified': { word: STATUS_WORDS['not-verified'], symbol: '?', shape: 'dashed', css: 'st-open' },
  'n/a': { word: STATUS_WORDS['n/a'], symbol: '–', shape: 'none', css: 'st-na' },
};

/** From worst to best: what a group of checks is, at its worst. */
export const SEVERITY: Status[] = ['fail', 'not-verified', 'attention', 'pass', 'n/a'];

/** The statuses a reader must act on. */
export const OPEN: Status[] = ['fail', 'not-verified', 'attention'];

export function worstStatus(statuses: Iterable<Status>): Status {
  let worst = SEVERITY.length - 1;
  for (const s of statuses) worst = Math.min(worst, SEVERITY.indexOf(s));
  return SEVERITY[worst]!;
}

export function overallStatus(a: Pick<Assessment, 'summary'>): Status {
  if (a.summary.fail > 0) return 'fail';
  if (a.summary['not-verified'] > 0) return 'not-verified';
  if (a.summary.attention > 0) return 'attention';
  return 'pass';
}

export const look = (s: Status) => {
  const l = STATUS_LOOK[s];
  return { status: s, word: l.word, symbol: l.symbol, shape: l.shape, css: l.css };
};
export type Look = ReturnType<typeof look>;
