// The serve walk-through, as a user would do it, in Chromium: `npx packsmith serve` started in this
// folder, its printed address opened at desktop width (1280 px), the draft of a demo job open on
// the circuit to re-test; at phone width (390 px) the form of that job, a re-test typed and saved.
// Timed from the click on "Save session": the phone showing the saved draft with the new reading
// and its verdict, and the desktop's open draft showing it too (updated in place, not reloaded).
// Three re-tests in a row; screenshots of the first.
//
//   npx tsc -p tsconfig.build.json && node scripts/walkthrough.mjs [--shots DIR] [--job NAME] [--circuit BOARD/REF]
//
// It writes readings/<today>-*.csv files into the job (as the form does): run it in a scratch
// clone, or remove them afterwards.
import { spawn } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import puppeteer from 'puppeteer-core';
import { CHROMIUM_FLAGS, findChromium } from '../dist/print/browser.js';

const { values } = parseArgs({
  options: {
    shots: { type: 'string', default: 'walkthrough-shots' },
    job: { type: 'string', default: 'heronsgate-pottery' },
    circuit: { type: 'string', default: 'DB1/1' },
  },
});
const shots = resolve(values.shots);
mkdirSync(shots, { recursive: true });
const job = values.job;
const [board, ref] = values.circuit.split('/');
const anchor = ['circuit', board, ref].map((p) => p.replace(/[^A-Za-z0-9_-]+/g, '-')).join('-');
const chromium = findChromium() ?? '/usr/bin/chromium';
const DESKTOP = { width: 1280, height: 900, deviceScaleFactor: 1 };
const PHONE = { width: 390, height: 844, deviceScaleFactor: 2, isMobile: true, hasTouch: true };
/** the re-tests: measured Zs, R1+R2 and the RCD's time at 1 × IΔn (where the circuit has an RCD) */
const RETESTS = [
  { zs: '0.97', r1r2: '0.74', rcd: '19' },
  { zs: '0.95', r1r2: '0.72', rcd: '18' },
  { zs: '0.99', r1r2: '0.76', rcd: '20' },
];

const say = (s) => process.stdout.write(`${s}\n`);
const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

// `npx packsmith serve` as a user starts it (projects/ of this folder, the default port taken if free, else any)
const server = spawn('npx', ['packsmith', 'serve', '--port', '0'], { stdio: ['ignore', 'pipe', 'pipe'] });
const base = await new Promise((ok, fail) => {
  let text = '';
  server.stdout.on('data', (d) => {
    text += d.toString();
    const m = /at (http:\/\/\S+\/)/.exec(text);
    if (m) { say(`serve printed: ${text.trim()}`); ok(m[1]); }
  });
  server.on('exit', (code) => fail(new Error(`packsmith serve ended (${code})`)));
});
let serverLog = '';
server.stderr.on('data', (d) => { serverLog += d.toString(); });

const browser = await puppeteer.launch({ executablePath: chromium, headless: true, args: CHROMIUM_FLAGS });
const refused = [];
const watchPolicy = (p) => p.on('console', (m) => { if (/Content Security Policy/i.test(m.text())) refused.push(m.text()); });
const shot = (p, name, full = false) => p.screenshot({ path: join(shots, `${name}.png`), fullPage: full });
const zsLine = (p) => p.evaluate((id) => [...(document.getElementById(id)?.querySelectorAll('li') ?? [])].map((li) => li.textContent.trim()).find((t) => t.startsWith('Measured Zs') || /measured Zs/.test(t)) ?? null, anchor);
const results = [];

try {
  // the desktop: the index, then the job's draft, open on the circuit to re-test
  const desk = await browser.newPage();
  watchPolicy(desk);
  await desk.setViewport(DESKTOP);
  await desk.goto(base, { waitUntil: 'load' });
  await shot(desk, '1-index-desktop');
  await Promise.all([desk.waitForNavigation({ waitUntil: 'load' }), desk.click(`a[href="/job/${encodeURIComponent(job)}/"]`)]);
  await desk.evaluate((id) => { document.getElementById(id).scrollIntoView(); window.scrollBy(0, -60); window.walkthroughMark = 1; }, anchor);
  say(`before, the desktop's check: ${(await zsLine(desk))?.replace(/\s+/g, ' ')}`);
  await shot(desk, '2-draft-before-desktop');

  // the phone: the session form of the job
  const phone = await browser.newPage();
  watchPolicy(phone);
  await phone.setViewport(PHONE);
  for (const [i, t] of RETESTS.entries()) {
    await phone.goto(`${base}job/${encodeURIComponent(job)}/record`, { waitUntil: 'load' });
    const field = (name) => `[name="v|${board}/${ref}|${name}"]`;
    await phone.type('[name="tested_by"]', 'R. Okafor');
    await phone.type('[name="label"]', `retest`);
    await phone.focus(field('zs_ohm'));
    await phone.evaluate((sel) => document.querySelector(sel).scrollIntoView({ block: 'center' }), field('zs_ohm'));
    await phone.type(field('r1r2_ohm'), t.r1r2);
    await phone.type(field('zs_ohm'), t.zs);
    if (await phone.$(field('rcd_1x_ms'))) await phone.type(field('rcd_1x_ms'), t.rcd);
    if (i === 0) await shot(phone, '3-form-typed-phone');

    const shown = (p) => p.waitForFunction((id, zs) => document.getElementById(id)?.textContent.includes(`measured Zs ${zs} Ω`), { polling: 'mutation', timeout: 30_000 }, anchor, t.zs);
    // where the time goes: the form's answer (saved, checked, rendered), the desktop's patch asked for and received
    const marks = {};
    const mark = (name) => { marks[name] ??= Math.round(performance.now() - t0); };
    const onPhone = (r) => { if (r.request().method() === 'POST') mark('phonePostAnswered'); };
    const onDeskAsk = (r) => { if (r.url().includes('/patch?')) mark('deskPatchAsked'); };
    const onDesk = (r) => { if (r.url().includes('/patch?')) mark('deskPatchReceived'); };
    phone.on('response', onPhone);
    desk.on('request', onDeskAsk);
    desk.on('response', onDesk);
    const t0 = performance.now();
    const [phoneMs, deskMs] = await Promise.all([
      (async () => {
        await Promise.all([phone.waitForNavigation({ waitUntil: 'domcontentloaded' }), phone.click('button[type=submit]')]);
        await shown(phone);
        return performance.now() - t0;
      })(),
      (async () => { await shown(desk); return performance.now() - t0; })(),
    ]);
    phone.off('response', onPhone);
    desk.off('request', onDeskAsk);
    desk.off('response', onDesk);
    const inPlace = await desk.evaluate(() => window.walkthroughMark === 1);
    const verdict = (await zsLine(desk))?.replace(/\s+/g, ' ');
    const saved = new URL(phone.url()).searchParams.get('saved');
    results.push({ retest: i + 1, zs: t.zs, saved, phoneMs: Math.round(phoneMs), desktopMs: Math.round(deskMs), desktopInPlace: inPlace, marks, verdict });
    say(`re-test ${i + 1}: saved ${saved}; the phone shows it ${Math.round(phoneMs)} ms after the click, the open desktop draft ${Math.round(deskMs)} ms (${inPlace ? 'updated in place' : 'LOADED AGAIN'}); ms from the click: ${JSON.stringify(marks)}\n  the desktop's check: ${verdict}`);
    if (i === 0) {
      await phone.evaluate((id) => { document.getElementById(id).scrollIntoView(); window.scrollBy(0, -40); }, anchor);
      await shot(phone, '4-draft-after-save-phone');
      await phone.evaluate(() => window.scrollTo(0, 0));
      await shot(phone, '5-draft-top-after-save-phone');
      await shot(desk, '6-draft-updated-in-place-desktop');
    }
  }
  say(`median: phone ${median(results.map((r) => r.phoneMs))} ms, desktop in place ${median(results.map((r) => r.desktopMs))} ms`);
  say(`refused by the pages' policy: ${refused.length === 0 ? 'nothing' : refused.join(' | ')}`);
  writeFileSync(join(shots, 'walkthrough.json'), `${JSON.stringify({ base, job, circuit: values.circuit, results, refused }, null, 2)}\n`);
} finally {
  await browser.close();
  server.kill('SIGTERM');
  if (serverLog.trim()) say(`server log:\n${serverLog.trim()}`);
}
