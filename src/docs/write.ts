// `npm run docs`: write docs/job-folder.md and the editors' JSON Schemas (schema/*.schema.json)
// from the zod schemas. tests/docs fails when the committed files differ from these.
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { generatedFiles } from './files.js';
import { packagePath } from '../paths.js';

for (const [rel, text] of Object.entries(generatedFiles())) {
  const path = packagePath(rel);
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, text);
  process.stdout.write(`wrote ${rel}\n`);
}
