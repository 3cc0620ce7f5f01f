// The generated files, by their path in the repository.
import { firmJsonSchema, projectJsonSchema } from './json-schema.js';
import { jobFolderMarkdown } from './job-folder.js';

const json = (v: unknown): string => `${JSON.stringify(v, null, 2)}\n`;

export const generatedFiles = (): Record<string, string> => ({
  'docs/job-folder.md': jobFolderMarkdown(),
  'schema/project.schema.json': json(projectJsonSchema()),
  'schema/firm.schema.json': json(firmJsonSchema()),
});
