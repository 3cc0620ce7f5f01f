// docs/job-folder.md and schema/*.schema.json are generated from the zod schemas (npm run docs);
// these fail when the committed files drift from the schemas, or a field has no description.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { generatedFiles } from '../../src/docs/files.js';
import { circuitsJsonSchema, fieldPaths, firmJsonSchema, projectJsonSchema, readingsJsonSchema } from '../../src/docs/json-schema.js';
import { CIRCUIT_COLUMNS, READING_COLUMNS } from '../../src/model/schema.js';

const root = fileURLToPath(new URL('../../', import.meta.url));

describe('generated reference and JSON Schemas', () => {
  it.each(Object.entries(generatedFiles()))('%s is as the schemas give it (run npm run docs after a schema change)', (rel, text) => {
    expect(readFileSync(`${root}${rel}`, 'utf8')).toBe(text);
  });

  it('describes every field and column (add a line to src/docs/descriptions.ts)', () => {
    const schemas = { project: projectJsonSchema(), firm: firmJsonSchema(), circuits: circuitsJsonSchema(), readings: readingsJsonSchema() };
    const undescribed = Object.entries(schemas).flatMap(([name, s]) => fieldPaths(s, name).filter((p) => {
      let node: Record<string, unknown> = s;
      for (const part of p.slice(name.length + 1).split('.')) {
        const [key, list] = [part.replace('[]', ''), part.endsWith('[]')];
        node = (node.properties as Record<string, Record<string, unknown>>)[key]!;
        if (list) node = node.items as Record<string, unknown>;
      }
      return typeof node.description !== 'string';
    }));
    expect(undescribed).toEqual([]);
    expect(generatedFiles()['docs/job-folder.md']).not.toContain('(not yet described)');
  });

  it('lists every circuits and readings column of the schemas', () => {
    const md = generatedFiles()['docs/job-folder.md'];
    for (const c of [...CIRCUIT_COLUMNS, ...READING_COLUMNS]) expect(md).toContain(`| \`${c}\` |`);
    expect(fieldPaths(circuitsJsonSchema(), 'c').length).toBe(CIRCUIT_COLUMNS.length);
    expect(fieldPaths(readingsJsonSchema(), 'r').length).toBe(READING_COLUMNS.length);
    expect(fieldPaths(firmJsonSchema(), 'firm')).toContain('firm.archive');
  });

  it('points users to docs/job-folder.md, never to a file they do not have', () => {
    const readme = readFileSync(`${root}README.md`, 'utf8');
    expect(readme).toContain('docs/job-folder.md');
    expect(readme).not.toMatch(/CONTRACT\.md/);
  });
});
