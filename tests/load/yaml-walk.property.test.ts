// readYaml (src/load/yaml.ts) walks the document's nodes once, in the order of yaml's own visit(),
// for the anchors, the aliases and the numbers not written plainly; it used to take two visits.
// Whatever the document, its errors must be those the two visits give (the reference below).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { LineCounter, parseDocument, isAlias, isNode, isScalar, visit } from 'yaml';
import { readYaml } from '../../src/load/yaml.js';
import { PLAIN_NUMBER } from '../../src/load/number.js';
import type { LocatedError } from '../../src/load/raw.js';

/** The errors of a document yaml reads, found by yaml's visit(): anchors first, then aliases and scalars. */
function reference(file: string, text: string): LocatedError[] | null {
  const lineCounter = new LineCounter();
  const doc = parseDocument(text, { lineCounter, prettyErrors: false, uniqueKeys: true });
  if (doc.errors.length > 0) return null; // not the walk's business
  const at = (offset: number) => { const p = lineCounter.linePos(offset); return { file, row: p.line, column: p.col }; };
  const errors: LocatedError[] = [];
  const anchors = new Set<string>();
  let first: { offset: number; name: string } | null = null;
  let unknown: { offset: number; name: string } | null = null;
  visit(doc, { Node(_, node) { if (isNode(node) && !isAlias(node) && node.anchor) anchors.add(node.anchor); } });
  visit(doc, {
    Alias(_, node) {
      const a = { offset: node.range?.[0] ?? 0, name: node.source };
      first ??= a;
      if (!anchors.has(node.source)) unknown ??= a;
    },
    Scalar(_, node) {
      if (!isScalar(node) || !node.range) return;
      const source = text.slice(node.range[0], node.range[1]).trim();
      if ((typeof node.value === 'number' || /^[-+]?\.(inf|nan)$/i.test(source)) && !PLAIN_NUMBER.test(source)) {
        errors.push({ ...at(node.range[0]), message: `found "${source}"; write a number as a plain decimal (e.g. 0.28, 230, 0.0069): no exponent, hexadecimal, infinity or leading "+"` });
      }
    },
  });
  const u = unknown as { offset: number; name: string } | null;
  if (u) errors.push({ ...at(u.offset), message: `cannot read this YAML: the alias *${u.name} names no anchor (&${u.name}) set before it` });
  if (errors.length > 0) return errors;
  try {
    doc.toJS({ maxAliasCount: 100 });
  } catch (e) {
    const f = first as { offset: number; name: string } | null;
    return [{ ...at(f?.offset ?? 0), message: `cannot read this YAML: ${(e as Error).message.split('\n')[0]} (aliases expand to too much; write the values out)` }];
  }
  return [];
}

const value = fc.constantFrom('1', '0.5', '1e3', '0x10', '.inf', '-.Inf', '.nan', '+1', '!!str .inf', '!!float 1', "'1e3'", '"x"', 'text', '~',
  '&a 5', '*a', '&b [1, .5]', '*b', '&m { x: 1e2 }', '*m', '[*a, 0o7]', '{ k: *b }', '[*z]', '&a 2', '[&c 1, *c]', '{ ? 1e1 : 2 }');
const key = fc.constantFrom('a', 'b', 'c', '1e2', '&k d', '0x1', 'e');
const line = fc.tuple(fc.constantFrom('', '  ', '- ', '  - '), key, value).map(([indent, k, v]) => (indent.endsWith('- ') ? `${indent}${v}` : `${indent}${k}: ${v}`));
const doc = fc.array(fc.oneof(line, fc.tuple(key, fc.array(value, { maxLength: 4 })).map(([k, vs]) => `${k}:\n${vs.map((v) => `  - ${v}`).join('\n')}`)), { maxLength: 8 })
  .map((lines) => `${lines.join('\n')}\n`);

describe('the walk over a YAML document', () => {
  it('finds the errors the two visits found, in the same order and places', () => {
    let read = 0;
    let failing = 0;
    fc.assert(fc.property(doc, (text) => {
      const want = reference('project.yaml', text);
      if (want === null) return;
      read += 1;
      const got = readYaml('project.yaml', text).errors;
      if (got.length > 0) failing += 1;
      expect(got).toEqual(want);
    }), { numRuns: 4000 });
    expect(read).toBeGreaterThan(500);
    expect(failing).toBeGreaterThan(200); // many of them with numbers or aliases to report
  });
});
