// The sign-off: per role what the person confirms, their name (a blank line where none is given),
// the date and a line to sign; and who issued this revision, when and why.
import type { Project } from '../../model/validate.js';
import type { Changes } from './changes.js';

/** What each person confirms by signing. */
export const DECLARATIONS = {
  Designer: 'I designed the circuits in this pack. To the best of my knowledge their design meets the rule set stated in this pack, apart from the open items and departures it lists.',
  Installer: 'I installed or altered the circuits in this pack as designed, apart from the open items and departures it lists, and I have told the designer of every change made on site.',
  Inspector: 'I inspected and tested the circuits in this pack. The readings in it are the ones taken, on the dates shown, and every result that did not pass is listed as an open item.',
} as const;

export interface SignoffOptions {
  issued: Changes['issued'];
  draft: boolean;
  /** the fingerprint of the key that signed this revision's manifest; null when unsigned */
  signingKeyFingerprint: string | null;
}

export function signoffView(project: Project, opts: SignoffOptions) {
  const people = project.file.signoff;
  const role = (name: keyof typeof DECLARATIONS, s: { name: string; date?: string | undefined } | undefined) =>
    ({ role: name, declaration: DECLARATIONS[name], name: s?.name ?? null, date: s?.date ?? null });
  return {
    roles: [role('Designer', people.designer), role('Installer', people.installer), role('Inspector', people.inspector)],
    issued: opts.issued ?? null,
    draft: opts.draft,
    signingKeyFingerprint: opts.signingKeyFingerprint,
  };
}
