// The job folders of a folder (e.g. projects/): its sub-folders that hold a project.yaml, by name.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

export function jobFolders(holder: string): string[] {
  if (!existsSync(holder) || !statSync(holder).isDirectory()) return [];
  return readdirSync(holder)
    .map((n) => join(holder, n))
    .filter((p) => statSync(p).isDirectory() && existsSync(join(p, 'project.yaml')))
    .sort();
}
