// A build looks first at the jobs whose files were modified since their drafts (so a re-tested
// job's pack prints while the others are hashed), yet reports every job in the order given, and
// a second job folder of the same name is the one refused, whichever is looked at first.
import { afterAll, describe, expect, it } from 'vitest';
import { mkdirSync, utimesSync } from 'node:fs';
import { join } from 'node:path';
import { build } from '../../src/build.js';
import { blankPrinter } from '../../src/bench/scale.js';
import { copyFixture, edit, removeTree, scratch } from '../helpers/archive.js';

const root = scratch('build-order');
afterAll(() => removeTree(root));
const a = copyFixture('archive-job', root);
const f = copyFixture('failing-job', root);
const p = copyFixture('pack-job', root);
const twinParent = join(root, 'elsewhere');
mkdirSync(twinParent);
const twin = copyFixture('failing-job', twinParent);
const out = join(root, 'out');
const quiet = { isTTY: false, write: () => true };

describe('the order a build looks at its jobs in', () => {
  it('prints the changed job, and reports jobs, skipped and refused, in the order given', async () => {
    const printed: string[] = [];
    const printer = async () => {
      const blank = await blankPrinter();
      return { ...blank, print: (html: string, opts: Parameters<typeof blank.print>[1]) => (printed.push(html), blank.print(html, opts)) };
    };
    const once = async () => build({ jobs: [a, f, p, twin], out, printer: await printer(), progress: quiet, log: () => {} });
    const first = await once();
    expect(first.built.map((b) => b.job)).toEqual(['archive-job', 'failing-job', 'pack-job']);
    expect(first.invalid.map((i) => i.errors[0]!.file)).toEqual([twin]);
    edit(p, 'project.yaml', 'title: ', 'title: Re-tested ');
    printed.length = 0;
    const second = await once();
    expect(second.built.map((b) => b.job)).toEqual(['pack-job']);
    expect(printed).toEqual([join(out, 'pack-job', 'draft', 'pack.html')]);
    expect(second.skipped.map((s) => s.job)).toEqual(['archive-job', 'failing-job']);
    expect(second.invalid.map((i) => i.errors[0]!.file)).toEqual([twin]);
    edit(twin, 'project.yaml', 'title: ', 'title: Twin ');
    const later = new Date(Date.now() + 60_000);
    utimesSync(join(p, 'project.yaml'), later, later); // modified, the same bytes: looked at first, and skipped
    const third = await once(); // the twin, modified, is looked at before its namesake: still the one refused
    expect(third.invalid.map((i) => i.errors[0]!.file)).toEqual([twin]);
    expect(third.skipped.map((s) => s.job)).toEqual(['archive-job', 'failing-job', 'pack-job']);
  });
});
