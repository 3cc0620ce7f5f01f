// The firm's signature on a revision: an Ed25519 key pair (node:crypto) made by `packsmith key
// create` and kept outside the archive. `issue` signs the bytes of manifest.json (which names the
// previous manifest's SHA-256, so a signature covers the whole chain before it) into manifest.sig;
// `verify` checks it against the firm's public key. The fingerprint (SHA-256 of the public key)
// is printed on the pack's sign-off page, so a reader can match the key that signed it.
import { createHash, createPrivateKey, createPublicKey, generateKeyPairSync, sign, verify, type KeyObject } from 'node:crypto';
import { closeSync, existsSync, fsyncSync, openSync, readFileSync, writeSync } from 'node:fs';
import { z } from 'zod';
import { parseJson } from './json.js';

export const SIGNATURE_FILE = 'manifest.sig';
export const SIGNATURE_FORMAT = 'packsmith-signature/1';

const SignatureSchema = z.object({
  format: z.literal(SIGNATURE_FORMAT),
  algorithm: z.literal('ed25519'),
  /** fingerprint of the public key that checks it */
  key: z.string(),
  /** base64 of the Ed25519 signature of manifest.json's bytes */
  signature: z.string().regex(/^[A-Za-z0-9+/]+=*$/),
});
export type Signature = z.output<typeof SignatureSchema>;

/** "SHA256:" and the hex SHA-256 of the public key's DER (SubjectPublicKeyInfo) bytes. */
export function fingerprint(key: KeyObject): string {
  const pub = key.type === 'private' ? createPublicKey(key) : key;
  return `SHA256:${createHash('sha256').update(pub.export({ type: 'spki', format: 'der' })).digest('hex')}`;
}

function writeOnce(path: string, text: string, mode: number): void {
  const fd = openSync(path, 'wx', mode);
  try {
    writeSync(fd, text);
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
}

/** Write a new private key to `file` (mode 600) and its public key to `file`.pub; never replaces a key. */
export function createKeyFiles(file: string): { privateFile: string; publicFile: string; fingerprint: string } {
  const publicFile = `${file}.pub`;
  for (const f of [file, publicFile]) if (existsSync(f)) throw Object.assign(new Error(`${f} exists`), { code: 'EEXIST' });
  const { privateKey, publicKey } = generateKeyPairSync('ed25519');
  writeOnce(file, privateKey.export({ type: 'pkcs8', format: 'pem' }).toString(), 0o600);
  writeOnce(publicFile, publicKey.export({ type: 'spki', format: 'pem' }).toString(), 0o644);
  return { privateFile: file, publicFile, fingerprint: fingerprint(publicKey) };
}

type Loaded = { ok: true; key: KeyObject } | { ok: false; why: string };

function loadKey(file: string, kind: 'private' | 'public'): Loaded {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    return { ok: false, why: `cannot read ${file} (${(e as NodeJS.ErrnoException).code ?? 'error'})` };
  }
  try {
    const key = kind === 'private' ? createPrivateKey(text) : createPublicKey(text);
    if (key.asymmetricKeyType !== 'ed25519') return { ok: false, why: `${file} holds a ${key.asymmetricKeyType ?? 'non-asymmetric'} key; expected an Ed25519 key made by packsmith key create` };
    if (kind === 'public' && text.includes('PRIVATE KEY')) return { ok: false, why: `${file} is a private key; verify takes the public key (${file}.pub)` };
    return { ok: true, key };
  } catch {
    return { ok: false, why: `${file} is not a ${kind} key in PEM form; expected a file made by packsmith key create` };
  }
}

export const loadPrivateKey = (file: string): Loaded => loadKey(file, 'private');
export const loadPublicKey = (file: string): Loaded => loadKey(file, 'public');

export function signatureBytes(manifest: Uint8Array | string, privateKey: KeyObject): string {
  const sig: Signature = {
    format: SIGNATURE_FORMAT,
    algorithm: 'ed25519',
    key: fingerprint(privateKey),
    signature: sign(null, Buffer.from(manifest), privateKey).toString('base64'),
  };
  return `${JSON.stringify(sig, null, 2)}\n`;
}

export type SignatureCheck =
  | { status: 'valid'; key: string }
  | { status: 'other-key'; key: string }
  | { status: 'invalid'; why: string }
  /** signed, but no public key was given to check it with */
  | { status: 'unchecked'; key: string };

/** Check manifest.sig's text against the manifest's bytes and the firm's public key (null: none given). */
export function checkSignature(manifest: Uint8Array, sigText: string, publicKey: KeyObject | null): SignatureCheck {
  const parsed = parseJson(sigText);
  if (!parsed.ok) return { status: 'invalid', why: `unreadable: ${parsed.why}` };
  const r = SignatureSchema.safeParse(parsed.value);
  if (!r.success) return { status: 'invalid', why: `unreadable: ${r.error.issues[0]!.path.join('.') || 'signature'}: ${r.error.issues[0]!.message}` };
  if (!publicKey) return { status: 'unchecked', key: r.data.key };
  const want = fingerprint(publicKey);
  if (r.data.key !== want) return { status: 'other-key', key: r.data.key };
  const ok = verify(null, Buffer.from(manifest), publicKey, Buffer.from(r.data.signature, 'base64'));
  return ok ? { status: 'valid', key: want } : { status: 'invalid', why: `does not match manifest.json: the manifest was changed after it was signed, or the signature was` };
}
