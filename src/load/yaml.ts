// YAML files into plain data, keeping the line and column of every value.
// Numbers follow the one grammar of every cell (model/units.ts): plain decimals only, so a YAML
// number such as 1e-3, 0x10 or .inf is an error at its place, not a value nobody wrote plainly.
// Aliases are resolved under a cap, and every failure (an unknown alias, too many aliases) is
// located like any other error.
import { LineCounter, parseDocument, isMap, isSeq, isNode, isPair, isScalar, isAlias, type Node } from 'yaml';
import type { LocatedError, RawYaml, SourcePosition } from './raw.js';
import { PLAIN_NUMBER } from './number.js';

/** Aliases a job file may expand: enough for shared blocks, far too few for an alias bomb. */
const MAX_ALIASES = 100;

export function readYaml(file: string, text: string): { doc: RawYaml | null; errors: LocatedError[] } {
  const lineCounter = new LineCounter();
  const doc = parseDocument(text, { lineCounter, prettyErrors: false, uniqueKeys: true });
  const at = (offset: number): SourcePosition => {
    const p = lineCounter.linePos(offset);
    return { file, row: p.line, column: p.col };
  };
  if (doc.errors.length > 0) {
    const tabs = tabIndented(text);
    if (tabs.length > 0) {
      // one cause, one message: the YAML parser would report every tab-indented line and what follows
      const lines = tabs.length > 5 ? `${tabs.slice(0, 5).join(', ')} and ${tabs.length - 5} more` : tabs.join(', ');
      return { doc: null, errors: [{ file, row: tabs[0]!, column: 1, message: `indented with a tab (line${tabs.length > 1 ? 's' : ''} ${lines}); YAML is indented with spaces: replace each tab with two spaces, or set your editor to insert spaces` }] };
    }
  }
  const errors: LocatedError[] = doc.errors.map((e) => ({ ...at(e.pos[0]), message: `cannot read this YAML: ${e.message.split('\n')[0]}` }));
  if (errors.length > 0) return { doc: null, errors };

  // One walk over the nodes, in the order yaml's visit() takes them (a pair's key, then its value):
  // the anchors set anywhere, the aliases in order, and every number not written plainly.
  const anchors = new Set<string>();
  const aliases: { offset: number; name: string }[] = [];
  const walk = (node: unknown): void => {
    if (isAlias(node)) {
      aliases.push({ offset: node.range?.[0] ?? 0, name: node.source });
    } else if (isScalar(node)) {
      if (node.anchor) anchors.add(node.anchor);
      if (!node.range) return;
      const source = text.slice(node.range[0], node.range[1]).trim();
      if ((typeof node.value === 'number' || /^[-+]?\.(inf|nan)$/i.test(source)) && !PLAIN_NUMBER.test(source)) {
        errors.push({ ...at(node.range[0]), message: `found "${source}"; write a number as a plain decimal (e.g. 0.28, 230, 0.0069): no exponent, hexadecimal, infinity or leading "+"` });
      }
    } else if (isMap(node) || isSeq(node)) {
      if (node.anchor) anchors.add(node.anchor);
      for (const item of node.items) walk(item);
    } else if (isPair(node)) {
      walk(node.key);
      walk(node.value);
    }
  };
  walk(doc.contents);
  const firstAlias = aliases[0] ?? null;
  const alias = aliases.find((a) => !anchors.has(a.name));
  if (alias) errors.push({ ...at(alias.offset), message: `cannot read this YAML: the alias *${alias.name} names no anchor (&${alias.name}) set before it` });
  if (errors.length > 0) return { doc: null, errors };

  let data: unknown;
  try {
    data = doc.toJS({ maxAliasCount: MAX_ALIASES });
  } catch (e) {
    return { doc: null, errors: [{ ...at(firstAlias?.offset ?? 0), message: `cannot read this YAML: ${(e as Error).message.split('\n')[0]} (aliases expand to too much; write the values out)` }] };
  }

  const positionOf = (path: readonly PropertyKey[]): SourcePosition => {
    // Walk as deep as the path exists; report the deepest node found (a missing key points at its parent).
    let node: unknown = doc.contents;
    let found: Node | null = isNode(node) ? node : null;
    for (const key of path) {
      if (isMap(node)) {
        const pair = node.items.find((p) => isNode(p.key) && (p.key as { value?: unknown }).value === key);
        if (!pair) break;
        node = pair.value ?? pair.key;
        if (isNode(node)) found = node;
        else if (isNode(pair.key)) found = pair.key;
      } else if (isSeq(node) && typeof key === 'number') {
        node = node.items[key];
        if (isNode(node)) found = node;
        else break;
      } else break;
    }
    return at(found?.range?.[0] ?? 0);
  };
  return { doc: { file, data: data ?? {}, positionOf }, errors };
}

/** Lines (1-based) whose indentation holds a tab. */
function tabIndented(text: string): number[] {
  return text.split(/\r?\n/).flatMap((line, i) => (/^[ ]*\t/.test(line) ? [i + 1] : []));
}
