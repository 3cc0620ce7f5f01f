// The server over HTTP, in this process: its pages' policy, the guard in front of every route,
// the archive files, a reload pushed when a job's file changes, and the token beyond loopback.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { request } from 'node:http';
import { join } from 'node:path';
import { copyFixture, edit, scratch } from '../helpers/archive.js';
import { serve, type Serving } from '../../src/serve/server.js';
import { packsmith } from '../helpers/cli.js';
import { LiveJobs } from '../../src/serve/jobs.js';

interface Reply { status: number; headers: Record<string, string | string[] | undefined>; body: string }

function call(port: number, path: string, opts: { method?: string; headers?: Record<string, string>; body?: string } = {}): Promise<Reply> {
  return new Promise((resolve, reject) => {
    const r = request({ host: '127.0.0.1', port, path, method: opts.method ?? 'GET', headers: { host: `127.0.0.1:${port}`, ...opts.headers } }, (res) => {
      let body = '';
      res.on('data', (d: Buffer) => { body += d.toString(); });
      res.on('end', () => resolve({ status: res.statusCode!, headers: res.headers, body }));
    });
    r.on('error', reject);
    r.end(opts.body);
  });
}

describe('packsmith serve over HTTP', () => {
  const root = scratch('serve');
  const projects = join(root, 'projects');
  const out = join(root, 'out');
  let s: Serving;
  let job: string;

  beforeAll(async () => {
    job = copyFixture('pack-job', root); // into root/projects/
    mkdirSync(join(out, 'pack-job'), { recursive: true });
    writeFileSync(join(out, 'index.html'), '<!doctype html><style>p{}</style><p>site</p>');
    writeFileSync(join(root, 'secret.txt'), 'outside');
    symlinkSync(join(root, 'secret.txt'), join(out, 'pack-job', 'leak.txt'));
    s = await serve({ folder: projects, out, host: '127.0.0.1', port: 0, log: () => {} });
  });
  afterAll(async () => { await s?.close(); });

  it('serves the index and each draft under a policy that allows only its own nonce\'d scripts and styles', async () => {
    const index = await call(s.port, '/');
    expect(index.status).toBe(200);
    expect(index.body).toContain('/job/pack-job/record');
    const draft = await call(s.port, '/job/pack-job/');
    expect(draft.status).toBe(200);
    const policy = String(draft.headers['content-security-policy']);
    const nonce = /'nonce-([^']+)'/.exec(policy)![1]!;
    expect(policy).not.toContain('unsafe-inline');
    expect(policy).toContain("default-src 'none'");
    expect(policy).toContain("frame-ancestors 'none'");
    // every script and style of the page carries the nonce
    expect(draft.body.match(/<(script|style)(?![^>]*nonce="[^"]+")[\s>]/g)).toBeNull();
    expect(draft.body).toContain(`nonce="${nonce}"`);
    expect(draft.headers['x-content-type-options']).toBe('nosniff');
  });

  it('refuses a foreign Host, a cross-origin post, and paths out of the archive', async () => {
    expect((await call(s.port, '/', { headers: { host: `evil.example:${s.port}` } })).status).toBe(421);
    const post = await call(s.port, '/job/pack-job/record', {
      method: 'POST', headers: { origin: 'http://evil.example', 'content-type': 'application/x-www-form-urlencoded' }, body: 'date=2026-03-20&v%7CDB-A%2F1%7Czs_ohm=0.7',
    });
    expect(post.status).toBe(403);
    expect((await call(s.port, '/site/index.html')).status).toBe(200);
    for (const p of ['/site/../package.json', '/site/%2e%2e/secret.txt', '/site/pack-job/leak.txt', '/site/..%2f..%2fsecret.txt']) {
      expect((await call(s.port, p)).status, p).toBe(404);
    }
    expect((await call(s.port, '/job/pack-job/', { method: 'DELETE' })).status).toBe(405);
  });

  it('pushes a reload to the draft\'s listeners when one of its files is saved, and shows the new value', async () => {
    const events = await new Promise<{ next: () => Promise<string>; close: () => void }>((resolve) => {
      const r = request({ host: '127.0.0.1', port: s.port, path: '/events?job=pack-job', headers: { host: `127.0.0.1:${s.port}` } }, (res) => {
        let text = '';
        const waiting: ((t: string) => void)[] = [];
        // each whole reload event to the next waiter, in order: one that arrived before anyone
        // waited for it (the version told on connecting) is kept until asked for
        const deliver = () => {
          while (waiting.length) {
            const at = text.indexOf('event: reload');
            const end = at < 0 ? -1 : text.indexOf('\n\n', at);
            if (end < 0) return;
            waiting.shift()!(text.slice(at, end));
            text = text.slice(end + 2);
          }
        };
        res.on('data', (d: Buffer) => { text += d.toString(); deliver(); });
        resolve({ next: () => new Promise((ok) => { waiting.push(ok); deliver(); }), close: () => r.destroy() });
      });
      r.end();
    });
    const before = s.jobs.get('pack-job')!.version;
    const told = async (): Promise<{ job: string; version: number }> => JSON.parse(/data: (.*)/.exec(await events.next())![1]!);
    expect(await told()).toEqual({ job: 'pack-job', version: before }); // on connecting: the version now
    const reload = told();
    edit(job, 'readings/2026-03-06.csv', 'DB-A,1,0.9,>999,>999,500,ok,9.9', 'DB-A,1,0.9,>999,>999,500,ok,0.73');
    expect(await reload).toEqual({ job: 'pack-job', version: before + 1 });
    events.close();
    expect((await call(s.port, '/job/pack-job/')).body).toContain('measured Zs 0.73 Ω');
  });

  it('tells an open draft which elements to swap for the new version, behind the same guard', async () => {
    const draft = await call(s.port, '/job/pack-job/');
    expect(draft.body).toContain('data-patch="1"');
    const v = s.jobs.get('pack-job')!.version;
    const none = await call(s.port, `/job/pack-job/patch?from=${v}`);
    expect(none.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(none.headers['x-content-type-options']).toBe('nosniff');
    expect(JSON.parse(none.body)).toEqual({ version: v, replace: [], line: expect.stringMatching(new RegExp(`^Draft ${v}, `)) });
    edit(job, 'readings/2026-03-06.csv', 'DB-A,1,0.9,>999,>999,500,ok,0.73', 'DB-A,1,0.9,>999,>999,500,ok,0.74');
    // asked before the watcher reports the save, the job is rendered first (it is stale)
    const patch = JSON.parse((await call(s.port, `/job/pack-job/patch?from=${v}`)).body) as { version: number; replace: { id: string; html: string }[] };
    expect(patch.version).toBe(v + 1);
    expect(patch.replace.find((r) => r.id === 'circuit-DB-A-1')?.html).toContain('measured Zs 0.74 Ω');
    expect(JSON.parse((await call(s.port, '/job/pack-job/patch?from=x')).body)).toEqual({ reload: true });
    expect((await call(s.port, `/job/pack-job/patch?from=${v}`, { headers: { host: `evil.example:${s.port}` } })).status).toBe(421);
    expect((await call(s.port, `/job/pack-job/patch?from=${v}`, { headers: { origin: 'http://evil.example' } })).status).toBe(403);
  });

  it('shows a job\'s errors, located, instead of its pack', async () => {
    edit(job, 'readings/2026-03-06.csv', 'DB-A,3,0.2,1.5', 'DB-A,3,0,2,1.5');
    for (let i = 0; i < 600 && !s.jobs.get('pack-job')!.errors.length; i++) await new Promise((r) => setTimeout(r, 50));
    const page = await call(s.port, '/job/pack-job/');
    expect(page.body).toMatch(/readings\/2026-03-06\.csv:\d+:\d+: /);
    expect(page.body).toContain('class="src"');
    expect((await call(s.port, '/job/pack-job/record')).status).toBe(409);
  });
});

describe('packsmith serve beyond loopback', () => {
  it('asks for the token it makes', async () => {
    const projects = join(copyFixture('pack-job', scratch('serve-token')), '..');
    const s = await serve({ folder: projects, out: join(projects, 'out'), host: '0.0.0.0', port: 0, log: () => {} });
    try {
      expect(s.token).toMatch(/^[A-Za-z0-9_-]{32}$/);
      expect(s.url).toContain(`?token=${s.token}`);
      expect((await call(s.port, '/')).status).toBe(401);
      expect((await call(s.port, '/job/pack-job/patch?from=1')).status).toBe(401);
      const first = await call(s.port, `/?token=${s.token}`);
      expect(first.status).toBe(303);
      const cookie = String(first.headers['set-cookie']).split(';')[0]!;
      expect((await call(s.port, '/', { headers: { cookie } })).status).toBe(200);
    } finally {
      await s.close();
    }
  });
});

describe('packsmith serve after an issue', () => {
  it("compares the draft with the job's latest revision, read from the job's archive (not from out/)", async () => {
    const root = scratch('serve-issued');
    const job = copyFixture('pack-job', root);
    const issued = packsmith(['issue', job, '--by', 'T. Marwood', '--date', '2026-10-12', '--accept-open-items', '--out', join(root, 'out')]);
    expect(issued.code).toBe(0);
    edit(job, 'readings/2026-03-06.csv', 'DB-A,1,0.9,>999,>999,500,ok,9.9', 'DB-A,1,0.9,>999,>999,500,ok,0.73');
    const s = await serve({ folder: join(root, 'projects'), out: join(root, 'other-out'), host: '127.0.0.1', port: 0, log: () => {} });
    try {
      const page = (await call(s.port, '/job/pack-job/')).body;
      expect(page).toMatch(/Revision 1/);
    } finally {
      await s.close();
    }
  });
});

describe('a page asked for is current, even where the watcher missed a save', () => {
  it('knows a job is stale from its files alone, and not once it is rendered again', () => {
    const root = scratch('serve-stale');
    copyFixture('pack-job', root);
    const jobs = new LiveJobs({ root: join(root, 'projects'), out: join(root, 'out'), log: () => {} });
    jobs.rescan();
    expect(jobs.render('pack-job')).toBe(true);
    expect(jobs.stale('pack-job')).toBe(false);
    edit(join(root, 'projects', 'pack-job'), 'readings/2026-03-06.csv', 'DB-A,1,0.9,>999,>999,500,ok,9.9', 'DB-A,1,0.9,>999,>999,500,ok,0.73');
    expect(jobs.stale('pack-job')).toBe(true);
    const version = jobs.get('pack-job')!.version;
    expect(jobs.render('pack-job')).toBe(true);
    expect(jobs.get('pack-job')!.version).toBe(version + 1);
    expect(jobs.stale('pack-job')).toBe(false);
    // asked again with nothing changed (as every page asked for asks), it renders nothing new
    expect(jobs.render('pack-job')).toBe(false);
    expect(jobs.get('pack-job')!.version).toBe(version + 1);
  });
});
