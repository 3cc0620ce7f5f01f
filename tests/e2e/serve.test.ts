// `packsmith serve` in a real browser: the command line started as a user would, Chromium opens
// the printed address, sees the draft follow a readings file edited on disk, records test sessions
// through the form at desktop and phone width (typed, saved, then found on disk and in the draft),
// and a page of another site cannot post to it nor reach it under another name.
// SERVE_SHOTS=DIR keeps the screenshots taken on the way.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, request, type Server } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import puppeteer, { type Browser, type Page } from 'puppeteer-core';
import { startPacksmith, type Running } from '../helpers/cli.js';
import { copyFixture, edit, scratch } from '../helpers/archive.js';
import { CHROMIUM_FLAGS, findChromium } from '../../src/print/browser.js';

const shots = process.env.SERVE_SHOTS ?? mkdtempSync(join(tmpdir(), 'packsmith-serve-shots-'));
const DESKTOP = { width: 1280, height: 900, deviceScaleFactor: 1 };
const PHONE = { width: 390, height: 844, deviceScaleFactor: 2, isMobile: true, hasTouch: true };

/** pack-job with a fourth circuit, a ring, so the form has ring fields to show (and to leave out). */
function jobWithRing(parent: string): string {
  const job = copyFixture('pack-job', parent);
  const lines = readFileSync(join(job, 'circuits.csv'), 'utf8').trimEnd().split('\n');
  const header = `${lines[0]},ring`.split(',');
  // the ring row written by column name, so it has exactly the header's cells
  const ringRow: Record<string, string> = { board: 'DB-A', ref: '4', description: 'Kitchen sockets (ring)', kind: 'power', ib_a: '20', device: 'mcb:B', rating_a: '32', live_mm2: '2.5', cpc_mm2: '1.5', length_m: '40', method: 'C', ring: 'yes', breaking_ka: '6' };
  const out = [header.join(','), ...lines.slice(1).map((l) => `${l},no`), header.map((h) => ringRow[h] ?? '').join(',')];
  writeFileSync(join(job, 'circuits.csv'), `${out.join('\n')}\n`);
  return job;
}

const sessions = (job: string) => readdirSync(join(job, 'readings')).sort();

describe('packsmith serve in Chromium', () => {
  const root = scratch('serve-e2e');
  const projects = join(root, 'projects');
  let job: string;
  let server: Running;
  let base: string;
  let browser: Browser;
  let page: Page;
  let evil: Server;
  const profile = mkdtempSync(join(tmpdir(), 'packsmith-serve-chromium-'));

  beforeAll(async () => {
    job = jobWithRing(root); // copyFixture puts it in root/projects/
    server = startPacksmith(['serve', projects, '--port', '0', '--out', join(root, 'out')]);
    base = await new Promise<string>((resolve, reject) => {
      let text = '';
      server.child.stdout!.on('data', (d: Buffer) => {
        text += d.toString();
        const m = /at (http:\/\/127\.0\.0\.1:\d+\/)/.exec(text);
        if (m) resolve(m[1]!);
      });
      void server.exit.then((e) => reject(new Error(`serve ended: ${e.stderr}`)));
    });
    const chromium = findChromium();
    if (!chromium) throw new Error('no Chromium: run scripts/install-deps.sh (or set PACKSMITH_CHROME)');
    // evil.test resolves to this machine, as a rebinding attacker's name would
    browser = await puppeteer.launch({ executablePath: chromium, headless: true, pipe: true, args: [...CHROMIUM_FLAGS, `--user-data-dir=${profile}`, '--host-resolver-rules=MAP evil.test 127.0.0.1'] });
    page = await browser.newPage();
    page.setDefaultTimeout(20_000);
  });
  afterAll(async () => {
    await browser?.close();
    rmSync(profile, { recursive: true, force: true });
    evil?.close();
    server?.child.kill('SIGTERM');
    await server?.exit;
  });

  const text = (p: Page) => p.evaluate(() => document.body.innerText);
  const shot = (p: Page, name: string) => p.screenshot({ path: join(shots, `${name}.png`) as `${string}.png`, fullPage: false });

  it('opens the printed address: the index lists the job, its draft is the pack', async () => {
    await page.setViewport(DESKTOP);
    await page.goto(base, { waitUntil: 'load' });
    expect(await text(page)).toContain('pack-job');
    await shot(page, '1-index-desktop');
    await Promise.all([page.waitForNavigation(), page.click('a[href="/job/pack-job/"]')]);
    expect(await page.$('section.cover')).not.toBeNull();
    expect(await text(page)).toContain('measured Zs 9.9 Ω');
  });

  it('follows a readings file edited on disk: the open draft updates in place, where it is scrolled, to exactly the page loaded afresh', async () => {
    const refused: string[] = []; // the browser reports each thing the page's policy refuses on the console
    page.on('console', (m) => { if (/Content Security Policy/i.test(m.text())) refused.push(m.text()); });
    const circuit = 'circuit-DB-A-1';
    const topOf = () => page.evaluate((id) => document.getElementById(id)!.getBoundingClientRect().top, circuit);
    await page.evaluate((id) => { document.getElementById(id)!.scrollIntoView(); (window as { kept?: number }).kept = 1; }, circuit);
    const top = await topOf();
    edit(job, 'readings/2026-03-06.csv', 'DB-A,1,0.9,>999,>999,500,ok,9.9', 'DB-A,1,0.9,>999,>999,500,ok,0.73');
    await page.waitForFunction((id) => document.getElementById(id)?.textContent?.includes('measured Zs 0.73 Ω'), {}, circuit);
    expect(await page.evaluate(() => (window as { kept?: number }).kept)).toBe(1); // not loaded again
    expect(Math.abs((await topOf()) - top)).toBeLessThan(2); // the circuit stays where it was in the window
    expect(await page.$eval('#ps-draft', (el) => el.textContent)).toMatch(/^Draft \d+, rendered in \d+ ms$/);
    await shot(page, '2-draft-after-edit-desktop');

    // the same document as the draft loaded afresh (leaving out the served page's own bar, script and styles)
    const fresh = await browser.newPage();
    await fresh.setViewport(DESKTOP);
    await fresh.goto(page.url(), { waitUntil: 'load' });
    const body = (p: Page) => p.evaluate(() => {
      const b = document.body.cloneNode(true) as HTMLElement;
      b.querySelectorAll('script, style, nav.ps-serve').forEach((e) => e.remove());
      return b.innerHTML;
    });
    expect(await body(page)).toBe(await body(fresh));
    await fresh.close();
    expect(refused).toEqual([]);
  });

  it('records a session at desktop width: only the readings that apply, an invalid cell shown at its field, then saved', async () => {
    await page.goto(`${base}job/pack-job/record`, { waitUntil: 'load' });
    const fieldsOf = (ref: string) => page.$$eval(`input[name^="v|DB-A/${ref}|"], select[name^="v|DB-A/${ref}|"]`, (els) => els.map((e) => e.getAttribute('name')!.split('|')[2]));
    expect(await fieldsOf('4')).toEqual(expect.arrayContaining(['ring_r1_ohm', 'ring_rn_ohm', 'ring_r2_ohm']));
    expect(await fieldsOf('4')).not.toContain('rcd_1x_ms');
    expect(await fieldsOf('2')).toEqual(expect.arrayContaining(['rcd_1x_ms', 'rcd_5x_ms', 'rcd_button']));
    expect(await fieldsOf('2')).not.toContain('ring_r1_ohm');
    expect(await fieldsOf('1')).not.toContain('ring_r1_ohm');
    expect(await fieldsOf('1')).not.toContain('rcd_1x_ms');

    await page.type('input[name="tested_by"]', 'R. Okafor');
    await page.type('input[name="v|DB-A/1|zs_ohm"]', '0,71'); // a decimal comma: refused, as check refuses it
    await page.type('input[name="v|DB-A/4|ring_r1_ohm"]', '0.52');
    await Promise.all([page.waitForNavigation(), page.click('button[type=submit]')]);
    const err = await page.$eval('input[name="v|DB-A/1|zs_ohm"]', (el) => ({
      invalid: el.getAttribute('aria-invalid'), next: el.parentElement!.querySelector('.err')?.textContent ?? '', value: (el as HTMLInputElement).value,
    }));
    expect(err.invalid).toBe('true');
    expect(err.next).toMatch(/^zs_ohm: .*decimal/i);
    expect(err.value).toBe('0,71');
    expect(sessions(job)).toEqual(['2026-03-06.csv']);
    await shot(page, '3-form-error-desktop');

    await page.$eval('input[name="v|DB-A/1|zs_ohm"]', (el) => { (el as HTMLInputElement).value = ''; });
    await page.type('input[name="v|DB-A/1|zs_ohm"]', '0.71');
    await Promise.all([page.waitForNavigation(), page.click('button[type=submit]')]);
    expect(page.url()).toContain('/job/pack-job/?saved=');
    const saved = sessions(job).filter((n) => n !== '2026-03-06.csv');
    expect(saved).toHaveLength(1);
    const csv = readFileSync(join(job, 'readings', saved[0]!), 'utf8');
    expect(csv).toContain('"DB-A","1"');
    expect(csv).toContain('"0.71"');
    expect(csv).toContain('"0.52"');
    // the draft shows the re-test with its verdict: 0.71 Ω within 0.8 × 7.28 Ω for a B6 breaker
    expect(await text(page)).toContain('measured Zs 0.71 Ω ≤ 0.8 × max Zs 7.28 Ω');
    await shot(page, '4-draft-after-session-desktop');
  });

  it('records a second session the same day at 390 px from the keyboard, in its own file, kept in the browser until saved', async () => {
    await page.setViewport(PHONE);
    await page.goto(`${base}job/pack-job/record`, { waitUntil: 'load' });
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await shot(page, '5-form-phone');

    await page.focus('input[name="v|DB-A/2|r1r2_ohm"]');
    await page.keyboard.type('0.31');
    await page.keyboard.press('Enter'); // Enter goes on to the next field
    expect(await page.evaluate(() => document.activeElement?.getAttribute('name'))).toBe('v|DB-A/2|ir_test_v');
    await page.keyboard.type('500');
    await page.focus('input[name="v|DB-A/2|rcd_1x_ms"]');
    await page.keyboard.type('24');

    // a reload keeps what was typed (in this browser only)
    await page.reload({ waitUntil: 'load' });
    expect(await page.$eval('input[name="v|DB-A/2|rcd_1x_ms"]', (el) => (el as HTMLInputElement).value)).toBe('24');
    expect(await page.$eval('#restored', (el) => (el as HTMLElement).hidden)).toBe(false);
    await shot(page, '6-form-restored-phone');

    await page.focus('input[name="v|DB-A/2|rcd_5x_ms"]');
    await page.keyboard.type('11');
    const navigated = page.waitForNavigation();
    await page.keyboard.down('Control');
    await page.keyboard.press('Enter'); // Ctrl+Enter saves
    await page.keyboard.up('Control');
    await navigated;
    const saved = sessions(job).filter((n) => n !== '2026-03-06.csv');
    expect(saved).toHaveLength(2);
    const second = readFileSync(join(job, 'readings', saved.find((n) => n.includes('-session-'))!), 'utf8');
    expect(second).toContain('"24"');
    expect(await text(page)).toMatch(/24 ms/);
    expect(await page.evaluate(() => localStorage.length)).toBe(0);
    await shot(page, '7-draft-after-session-phone');
    await page.setViewport(DESKTOP);
  });

  it('refuses a form posted from a page of another site, and writes nothing', async () => {
    const target = `${base}job/pack-job/record`;
    evil = createServer((_req, res) => {
      res.writeHead(200, { 'Content-Type': 'text/html' });
      res.end(`<form method="post" action="${target}"><input name="date" value="2026-03-21"><input name="v|DB-A/1|zs_ohm" value="0.1"></form><script>document.forms[0].submit()</script>`);
    });
    await new Promise<void>((ok) => evil.listen(0, '127.0.0.1', () => ok()));
    const before = sessions(job);
    const answer = page.waitForResponse((r) => r.url() === target);
    await page.goto(`http://127.0.0.1:${(evil.address() as { port: number }).port}/`);
    expect((await answer).status()).toBe(403);
    expect(sessions(job)).toEqual(before);
  });

  it('does not answer under another name (DNS rebinding)', async () => {
    const port = new URL(base).port;
    const r = await page.goto(`http://evil.test:${port}/`);
    expect(r?.status()).toBe(421);
    const status = await new Promise<number>((resolve, reject) => {
      request({ host: '127.0.0.1', port: Number(port), path: '/job/pack-job/', headers: { host: `attacker.example:${port}` } }, (res) => { res.resume(); resolve(res.statusCode!); })
        .on('error', reject).end();
    });
    expect(status).toBe(421);
  });
});
