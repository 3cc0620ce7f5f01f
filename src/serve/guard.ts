// Who may talk to the server. A request must name this server in its Host header (a page of
// another site that re-points its own name at 127.0.0.1 — DNS rebinding — names that site), must
// not come from a page of another origin when it changes anything (a cross-site form post), and,
// when the server listens beyond the loopback interface, must carry the token printed at start.
import { timingSafeEqual } from 'node:crypto';
import { isIP } from 'node:net';
import type { IncomingMessage } from 'node:http';

export interface GuardOptions {
  /** the address the server listens on, as given to --host */
  host: string;
  /** the port it listens on (known once listening) */
  port: () => number;
  /** required beyond the loopback interface; null on loopback */
  token: string | null;
}

export type Verdict = { ok: true; setCookie?: string; redirect?: string } | { ok: false; status: number; message: string };

/** 127.0.0.0/8, ::1 and localhost: reachable from this machine only. */
export function isLoopback(host: string): boolean {
  const h = host.replace(/^\[|\]$/g, '').toLowerCase();
  return h === 'localhost' || h === '::1' || /^127(\.\d{1,3}){3}$/.test(h);
}

/** The host name and port of a Host header, or null when it is not one. */
export function parseHost(header: string | undefined): { name: string; port: number | null } | null {
  if (!header) return null;
  const m = /^(\[[0-9a-fA-F:.]+\]|[A-Za-z0-9.-]+)(?::(\d{1,5}))?$/.exec(header.trim());
  if (!m) return null;
  return { name: m[1]!.toLowerCase(), port: m[2] === undefined ? null : Number(m[2]) };
}

const cookieName = (port: number) => `packsmith-${port}`;

function sameSecret(given: string, token: string): boolean {
  const a = Buffer.from(given);
  const b = Buffer.from(token);
  return a.length === b.length && timingSafeEqual(a, b);
}

function cookieValue(req: IncomingMessage, name: string): string | null {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const [k, ...v] = part.trim().split('=');
    if (k === name) return v.join('=');
  }
  return null;
}

export function guard(req: IncomingMessage, opts: GuardOptions): Verdict {
  const port = opts.port();
  const host = parseHost(req.headers.host);
  if (!host) return { ok: false, status: 400, message: 'the request names no host' };
  const bare = host.name.replace(/^\[|\]$/g, '');
  const known = opts.token === null
    ? isLoopback(host.name) // listening on loopback: only this machine's own names
    : isLoopback(host.name) || isIP(bare) !== 0 || host.name === opts.host.toLowerCase();
  if (!known || (host.port ?? 80) !== port) {
    return { ok: false, status: 421, message: `this server does not answer to the name "${req.headers.host}"` };
  }
  const origin = req.headers.origin;
  const site = req.headers['sec-fetch-site'];
  const changes = req.method !== 'GET' && req.method !== 'HEAD';
  if (origin !== undefined && origin !== `http://${req.headers.host}`) {
    return { ok: false, status: 403, message: `a page of another site (${origin}) may not use this server` };
  }
  if (changes && origin === undefined && site !== undefined && site !== 'same-origin' && site !== 'none') {
    return { ok: false, status: 403, message: 'a page of another site may not change anything here' };
  }
  if (opts.token === null) return { ok: true };

  const url = new URL(req.url ?? '/', 'http://x');
  const given = url.searchParams.get('token');
  if (given !== null && sameSecret(given, opts.token)) {
    url.searchParams.delete('token');
    return {
      ok: true,
      setCookie: `${cookieName(port)}=${opts.token}; HttpOnly; SameSite=Strict; Path=/`,
      redirect: `${url.pathname}${url.search}`,
    };
  }
  const cookie = cookieValue(req, cookieName(port));
  const bearer = /^Bearer (.+)$/.exec(req.headers.authorization ?? '')?.[1];
  if ((cookie !== null && sameSecret(cookie, opts.token)) || (bearer !== undefined && sameSecret(bearer, opts.token))) return { ok: true };
  return { ok: false, status: 401, message: 'this server needs the token it printed when it started: open the address it printed' };
}
