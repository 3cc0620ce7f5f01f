// Basis lines, and trials that need none. The longest run tries a circuit at dozens of lengths and
// looks only at each check's status; the words of each trial (many formatted numbers) would be
// thrown away unread. So a line that costs something to form is given as a function, and formed
// at once, except while `numbersOnly` runs: there it is left unformed.

/** A basis line, or the function that forms it. */
export type Words = string | (() => string);

/** What a basis line reads where it was left unformed: never in a result anyone is shown. */
export const UNFORMED = '(not worked out: a trial in numbers only)';

let wordless = 0;

/**
 * Runs `work` with every basis line given as a function left unformed. For trials whose statuses,
 * values and limits alone are read: the checks judge by numbers, never by their words.
 */
export function numbersOnly<T>(work: () => T): T {
  wordless += 1;
  try {
    return work();
  } finally {
    wordless -= 1;
  }
}

/** The words as a string: formed now, unless within `numbersOnly`. */
export const said = (words: Words): string => (typeof words === 'string' ? words : wordless > 0 ? UNFORMED : words());

/** `target` with `key` holding the words (see `said`). */
export function withWords<T extends object, K extends string>(target: T, key: K, words: Words): T & { [k in K]: string } {
  (target as Record<string, unknown>)[key] = said(words);
  return target as T & { [k in K]: string };
}

/** `fields` with a `basis` line (see `said`). */
export const withBasis = <T extends object>(fields: T, basis: Words): T & { basis: string } => withWords(fields, 'basis', basis);
