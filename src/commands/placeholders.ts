// The values `packsmith new` leaves to fill in: marked FILL IN, found again by `check`, which keeps
// a job that still has one from passing (exit 1, each listed), since a placeholder such as the
// earthing system's is a guess.
export const FILL_IN = 'FILL IN';

/** `project.yaml:row:column: ...` for each value still marked FILL IN (comments aside). */
export function placeholders(text: string | undefined, file = 'project.yaml'): string[] {
  if (text === undefined) return [];
  return text.split(/\r?\n/).flatMap((line, i) => {
    const at = line.indexOf(FILL_IN);
    if (at < 0 || line.trimStart().startsWith('#')) return [];
    const comment = line.indexOf('#');
    const inComment = comment >= 0 && comment < at;
    return [`${file}:${i + 1}:${(inComment ? comment : at) + 1}: still marked ${FILL_IN}: ${line.trim()}`];
  });
}
