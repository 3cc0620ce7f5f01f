// YAML files into plain data, keeping the line and column of every value.
import { LineCounter, parseDocument, isMap, isSeq, isNode, type Node } from 'yaml';
import type { LocatedError, RawYaml, SourcePosition } from './raw.js';

export function readYaml(file: string, text: string): { doc: RawYaml | null; errors: LocatedError[] } {
  const lineCounter = new LineCounter();
  const doc = parseDocument(text, { lineCounter, prettyErrors: false, uniqueKeys: true });
  const tabs = tabIndented(text);
  if (doc.errors.length > 0 && tabs.length > 0) {
    // one cause, one message: the YAML parser would report every tab-indented line and what follows
    const lines = tabs.length > 5 ? `${tabs.slice(0, 5).join(', ')} and ${tabs.length - 5} more` : tabs.join(', ');
    return { doc: null, errors: [{ file, row: tabs[0]!, column: 1, message: `indented with a tab (line${tabs.length > 1 ? 's' : ''} ${lines}); YAML is indented with spaces: replace each tab with two spaces, or set your editor to insert spaces` }] };
  }
  const errors: LocatedError[] = doc.errors.map((e) => {
    const at = lineCounter.linePos(e.pos[0]);
    return { file, row: at.line, column: at.col, message: `cannot read this YAML: ${e.message.split('\n')[0]}` };
  });
  if (errors.length > 0) return { doc: null, errors };

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
    const offset = found?.range?.[0] ?? 0;
    const at = lineCounter.linePos(offset);
    return { file, row: at.line, column: at.col };
  };
  return { doc: { file, data: doc.toJS() ?? {}, positionOf }, errors };
}

/** Lines (1-based) whose indentation holds a tab. */
function tabIndented(text: string): number[] {
  return text.split(/\r?\n/).flatMap((line, i) => (/^[ ]*\t/.test(line) ? [i + 1] : []));
}
