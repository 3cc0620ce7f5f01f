// packsmith's own version, from package.json (the same file from src/ under vitest and from dist/).
import { readFileSync } from 'node:fs';

export const VERSION: string = (JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version: string }).version;
