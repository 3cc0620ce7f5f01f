// `node dist/bench/preview.js [--saves N]`: the preview refresh alone (a generated 40-circuit job
// served and open in Chromium, one reading saved N times), without the rest of `npm run bench`.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { findChromium } from '../print/browser.js';
import { generateArchive } from './generate.js';
import { describeTimes, previewRefresh } from './serve.js';

const { values } = parseArgs({ options: { saves: { type: 'string', default: '15' } } });

async function main(): Promise<void> {
  const chromium = findChromium();
  if (!chromium) throw new Error('the preview bench needs Chromium: run scripts/install-deps.sh or set PACKSMITH_CHROME');
  const root = mkdtempSync(join(tmpdir(), 'packsmith-bench-preview-'));
  try {
    const archive = generateArchive(join(root, 'projects'), 1, 17, { circuits: [40, 40] });
    const t = await previewRefresh(archive.jobs, chromium, Number(values.saves));
    process.stdout.write(`preview refresh, ${t.circuits} circuits, ${t.saveToPage.length} saves: save → page ${describeTimes(t.saveToPage)}; of which watch ${describeTimes(t.watch)}, load-check-render ${describeTimes(t.render)}, render end → page painted ${describeTimes(t.browser)}; pages loaded again: ${t.reloads}\n`);
    process.stdout.write(`  save → page, each: ${t.saveToPage.map((x) => x.toFixed(0)).join(' ')}\n`);
    process.stdout.write(`  render, each: ${t.render.map((x) => x.toFixed(0)).join(' ')}\n`);
    process.stdout.write(`  watch, each: ${t.watch.map((x) => x.toFixed(0)).join(' ')}\n`);
    process.stdout.write(`  render end → page, each: ${t.browser.map((x) => x.toFixed(0)).join(' ')}\n`);
  } finally {
    rmSync(root, { recursive: true, force: true });
  }
}

main().catch((e: unknown) => {
  process.stderr.write(`${e instanceof Error ? e.stack : String(e)}\n`);
  process.exit(1);
});
