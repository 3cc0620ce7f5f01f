// `packsmith key create FILE`: a new Ed25519 key pair for signing revisions — the private key in
// FILE (mode 600; keep it outside the archive and out of version control), the public key in
// FILE.pub (name it as public_key in packsmith.yaml). Never replaces an existing file.
import { parseArgs } from 'node:util';
import { createKeyFiles } from '../archive/sign.js';

export const KEY_USAGE = 'packsmith key create FILE';

export function keyCommand(args: string[]): 0 | 2 {
  const { positionals } = parseArgs({ args, allowPositionals: true, options: {} });
  if (positionals[0] !== 'create' || positionals.length !== 2) {
    process.stderr.write(`usage: ${KEY_USAGE}\n`);
    return 2;
  }
  const file = positionals[1]!;
  try {
    const k = createKeyFiles(file);
    process.stdout.write(`private key: ${k.privateFile} (keep it secret, outside the archive: issue --key ${k.privateFile}, or PACKSMITH_KEY)\n`);
    process.stdout.write(`public key:  ${k.publicFile} (public_key: in packsmith.yaml, or verify --key ${k.publicFile})\n`);
    process.stdout.write(`fingerprint: ${k.fingerprint}\n`);
    return 0;
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    process.stderr.write(`packsmith key create: ${code === 'EEXIST' ? `${file} or ${file}.pub exists already; a key is never replaced` : `cannot write ${file} (${code ?? (e as Error).message})`}\n`);
    return 2;
  }
}
