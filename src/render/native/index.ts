// The hottest partials (a row per circuit) written in TypeScript as well as in templates/partials:
// Handlebars spends most of a pack's render on them. The engine uses these only where the theme
// replaces neither pack.hbs (which calls them) nor any partial named here; otherwise the templates.
// tests/render/native.test.ts renders packs both ways and requires the same bytes, so a change to
// one copy that is not made to the other fails there.
import { appendix } from './appendix.js';
import { board } from './board.js';
import { summary } from './summary.js';

/** partial name → its TypeScript copy, given the object the template would get as its context */
export const NATIVE_PARTIALS: ReadonlyMap<string, (context: never) => string> = new Map<string, (context: never) => string>([
  ['board', board],
  ['appendix', appendix],
  ['summary', summary],
]);

/** The files a theme must leave alone for the native partials to be used: these and the partials they call. */
export const NATIVE_FILES: readonly string[] = [
  'pack.hbs',
  ...['board', 'tree', 'tree-heads', 'tree-cells', 'appendix', 'summary', 'status', 'symbol'].map((p) => `partials/${p}.hbs`),
];
