// The view model and the built-in templates: contents in order, derived values as calc gives
// them, every reading with its verdict, open items first, user text escaped.
import { describe, expect, it } from 'vitest';
import Handlebars from 'handlebars';
import fc from 'fast-check';
import { loadJob } from '../../src/job.js';
import { buildView, DERIVED_FIELDS, worstStatus } from '../../src/render/view.js';
import { circuitsByBoard, RESULT_COLUMNS } from '../../src/render/sections/schedules.js';
import { renderPack, renderPackFiles } from '../../src/render/pack.js';
import { createEngine } from '../../src/render/engine.js';
import { snippetRequest } from '../../src/render/snippets.js';
import { checkLabel, TEST_CHECKS } from '../../src/render/labels.js';
import type { Assessment } from '../../src/calc/types.js';
import type { Project } from '../../src/model/validate.js';

function job(dir: string) {
  const j = loadJob(dir);
  if (!j.ok) throw new Error(`${dir} invalid: ${j.errors.map((e) => e.message).join('; ')}`);
  return j;
}
const OPTS = { revisionLabel: 'DRAFT', draft: true, date: '2026-03-06' };
const FIXTURE = 'tests/fixtures/pack-job';
const DEMO = 'projects/tannery-row-refit';

describe('the pack view', () => {
  it('lists the sections in the agreed order, the checks in an appendix after the sign-off', () => {
    const { project, assessment } = job(DEMO);
    const html = renderPack(project, assessment, OPTS);
    const ids = ['cover', 'summary', 'supply', 'board-DB1', 'board-DB2', 'notes', 'rules', 'changes', 'safety', 'signoff', 'appendix'];
    const at = ids.map((id) => html.indexOf(`id="${id}"`));
    expect(at.every((i) => i > 0)).toBe(true);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    // per board: the design schedule, then the test results, one row per circuit each
    const db1 = html.slice(at[3], at[4]);
    expect(db1.indexOf('Circuit schedule')).toBeLessThan(db1.indexOf('Test results'));
    expect(db1.match(/<table class="schedule">[\s\S]*?<\/table>/)![0].match(/<tr>/g)).toHaveLength(11 + 1);
    expect(db1.match(/<table class="results">[\s\S]*?<\/table>/)![0].match(/<tr>/g)).toHaveLength(11 + 2);
    // the curves and the checks' working live in the appendix only
    expect(db1).not.toContain('<figure class="snippet">');
    expect(html.slice(at[10]).match(/<figure class="snippet">/g)).toHaveLength(14);
  });

  it('shows the derived values calc gives, and — where it gives none', () => {
    const { project, assessment } = job(FIXTURE);
    const filled: Assessment = structuredClone(assessment);
    Object.assign(filled.circuits[0]!.derived, { iz_a: 19.5, vd_percent: 1.84, zs_design_ohm: 0.88, cpc_min_mm2: null, fault_current_a: null, disconnect_s: null });
    const view = buildView(project, filled, OPTS);
    const c1 = view.boards[0]!.circuits[0]!;
    expect(Object.keys(c1.derived)).toEqual([...DERIVED_FIELDS]);
    expect(c1.derived).toMatchObject({ iz_a: 19.5, vd_percent: 1.84, zs_design_ohm: 0.88, cpc_min_mm2: null, fault_current_a: null });
    const html = renderPack(project, filled, OPTS);
    const row = html.slice(html.indexOf('<table class="schedule">'), html.indexOf('</table>', html.indexOf('<table class="schedule">')));
    const firstRow = row.slice(row.indexOf('<tbody>'), row.indexOf('</tr>', row.indexOf('<tbody>')));
    const cells = [...firstRow.matchAll(/<td[^>]*>(.*?)<\/td>/g)].map((m) => m[1]!.replace(/<[^>]+>/g, ''));
    // Ref, Circuit, Device, In, Ib, Iz, Cable, Method, Length, Max Zs, Design Zs, Disconn., Required, VD, Min cpc, Status
    expect(cells.slice(3, 6)).toEqual(['6', '2', '19.5']);
    expect(cells[10]).toBe('0.88');
    expect(cells[11]).toBe('—');
    expect(cells[12]).toBe('0.4');
    expect(cells[13]).toBe('1.84');
    expect(cells[14]).toBe('—');
  });

  it('gives every reading a cell with the verdict of its check, and a re-tested reading a mark and a footnote', () => {
    const { project, assessment } = job(DEMO);
    const view = buildView(project, assessment, OPTS);
    const db1 = view.boards[0]!;
    const c10 = db1.results.find((c) => c.ref === '10')!;
    const cell = (field: string) => c10.cells[RESULT_COLUMNS.findIndex((c) => c.field === field)]!;
    const zsCheck = assessment.circuits.find((c) => c.board === 'DB1' && c.ref === '10')!.checks.find((k) => k.id === 'zs-measured')!;
    expect(cell('zs_ohm')).toMatchObject({ shown: '1.39', mark: 1 });
    expect(cell('zs_ohm').look!.status).toBe(zsCheck.status);
    expect(c10).toMatchObject({ tested: '2026-11-20', by: 'R. Okafor' });
    // every recorded value of the circuit appears, none invented: no RCD, no ring readings
    expect(c10.cells.filter((c) => c.shown !== '').map((c) => c.shown)).toEqual(['1.07', '>999', '>999', '500', 'ok', '1.39']);
    expect(cell('rcd_1x_ms')).toMatchObject({ shown: '', look: null });
    expect(db1.footnotes).toEqual([{ mark: 1, text: expect.stringMatching(/^DB1 10, re-tested: .* on 2026-11-13: R1\+R2 9\.45 Ω, .*measured Zs 9\.8 Ω\.$/) }]);
    // a needed reading that is missing shows a dash with the check's verdict
    const fixture = job(FIXTURE);
    const fv = buildView(fixture.project, fixture.assessment, OPTS);
    const c2 = fv.boards[0]!.results.find((c) => c.ref === '2')!;
    expect(c2.cells[RESULT_COLUMNS.findIndex((c) => c.field === 'rcd_1x_ms')]).toMatchObject({ look: { status: 'not-verified' } });
    expect(c2.look.status).toBe('not-verified');
  });

  it('lists open items first in the summary, worst first, each with its circuit and reason', () => {
    const { project, assessment } = job(FIXTURE);
    const view = buildView(project, assessment, OPTS);
    const statuses = view.openItems.map((o) => o.look.status);
    expect(statuses[0]).toBe('fail');
    expect(statuses.lastIndexOf('fail')).toBeLessThan(statuses.indexOf('not-verified'));
    expect(statuses.lastIndexOf('not-verified')).toBeLessThan(statuses.indexOf('attention'));
    expect(view.openItems[0]).toMatchObject({ board: 'DB-A', ref: '1', check: 'zs-measured' });
    // within a status, in schedule order; the safety notes name each circuit once, in schedule order
    for (const dir of [FIXTURE, DEMO]) {
      const j = job(dir);
      const v = buildView(j.project, j.assessment, OPTS);
      const checksOf = (c: { board: string; ref: string }) => j.assessment.circuits.find((x) => x.board === c.board && x.ref === c.ref)!.checks;
      const rank = { fail: 0, 'not-verified': 1, attention: 2, pass: 3, 'n/a': 4 };
      const open = j.project.circuits.flatMap((c) => checksOf(c).filter((k) => rank[k.status] < 3).map((k) => ({ at: `${c.board} ${c.ref} ${k.id}`, status: k.status })));
      expect(v.openItems.map((o) => `${o.board} ${o.ref} ${o.check}`)).toEqual(open.sort((x, y) => rank[x.status] - rank[y.status]).map((o) => o.at));
      expect(v.safety.unverified.map((w) => w.ref)).toEqual(j.project.circuits.filter((c) => checksOf(c).some((k) => k.status === 'not-verified')).map((c) => c.ref));
      expect(v.safety.slow.map((w) => w.ref)).toEqual(j.project.circuits.filter((c) => checksOf(c).some((k) => k.status === 'fail' && ['disconnection', 'zs-design', 'zs-measured'].includes(k.id))).map((c) => c.ref));
    }
    expect(view.openItems[0]!.basis).toMatch(/measured Zs 9.9 Ω >/);
    const html = renderPack(project, assessment, OPTS);
    const summary = html.slice(html.indexOf('id="summary"'), html.indexOf('id="supply"'));
    expect(summary.indexOf('Open items')).toBeLessThan(summary.indexOf('Checks by status'));
    // a fail or a missing reading says why in the summary; an item needing attention points to its working in the appendix
    const attention = view.openItems.filter((o) => o.look.status === 'attention');
    expect(attention.length).toBeGreaterThan(0);
    for (const o of view.openItems) expect(o.full, `${o.board} ${o.ref} ${o.check}`).toBe(o.look.status !== 'attention');
    expect(summary).toContain(Handlebars.escapeExpression(view.openItems[0]!.basis));
    expect(summary).not.toContain(Handlebars.escapeExpression(attention[0]!.basis));
    expect(summary).toContain(`<a href="#${attention[0]!.anchor}">working in the appendix</a>`);
    expect(view.attentionLinked).toBe(true);
    expect(summary).toContain('A check that needs attention has its full working under its circuit in the appendix.');
  });

  it('escapes user text everywhere, header and footer included', () => {
    const { project, assessment } = job(FIXTURE);
    const pack = renderPackFiles(project, assessment, OPTS);
    for (const text of [pack.html, pack.header, pack.footer]) {
      expect(text).not.toMatch(/<script>alert|<b>bold|<em>new|<Sons>|<conversion>|<x>/);
    }
    expect(pack.html).toContain('1 Test Row &lt;script&gt;alert(1)&lt;/script&gt;');
    expect(pack.html).toContain('Loft lighting &lt;em&gt;new&lt;/em&gt;');
    expect(pack.header).toContain('Loft &lt;conversion&gt; &amp; &quot;studio&quot;');
    expect(pack.footer).toContain('Ampersand &amp; &lt;Sons&gt; Electrical');
    expect(pack.footer).toMatch(/DRAFT[\s\S]*page <span class="pageNumber"><\/span> of <span class="totalPages"><\/span>/);
  });

  it('names the rule set, each override of the job and each circuit of its own', () => {
    const { project, assessment } = job('projects/marsh-street-surgery');
    const view = buildView(project, assessment, OPTS);
    expect(view.rules.params.find((p) => p.label.startsWith('Factor on max Zs'))).toMatchObject({ value: 0.75, overridden: true });
    expect(view.rules.params.find((p) => p.label === 'Voltage factor Cmin')).toMatchObject({ overridden: false });
    const fixture = job(FIXTURE);
    const fv = buildView(fixture.project, fixture.assessment, OPTS);
    expect(fv.rules.params.find((p) => p.label === 'Voltage factor Cmin')).toMatchObject({ value: 0.95, overridden: true });
    expect(fv.rules.circuitOverrides).toEqual(['DB-A 3: required disconnection time 5 s, set for this circuit']);
  });

  it('names the rule set in the pack and lists each departure in the summary with the circuits it affects (CONTRACT.md, departures)', () => {
    const { project, assessment } = job(FIXTURE);
    const html = renderPack(project, assessment, OPTS);
    expect(html).toMatch(/Rule set <strong>IEC 60364<\/strong> \(iec-60364: IEC 60364-4-41/);
    const summary = html.slice(html.indexOf('id="summary"'), html.indexOf('id="supply"'));
    // DB-A 3's disconnect_s 5 s is longer than Table 41.1's 0.4 s (TN, 230 V, fixed equipment up to 32 A)
    expect(summary).toContain('Departures from the rule set');
    expect(summary).toMatch(/<ul class="departures"><li>[^<]*required disconnection time set for the circuit 5 s[^<]*longer than the rule set(&#x27;|')s 0\.4 s; circuits affected: DB-A\/3<\/li><\/ul>/);
    const marsh = job('projects/marsh-street-surgery');
    const m = renderPack(marsh.project, marsh.assessment, OPTS);
    expect(m).toMatch(/Rule set <strong>BS 7671<\/strong>/);
    expect(m).not.toContain('Departures from the rule set');
  });

  it('shows RA on a TT supply, "not recorded" for a missing value, and the sign-off people given', () => {
    const tt = job('projects/marsh-street-surgery');
    const html = renderPack(tt.project, tt.assessment, OPTS);
    expect(html).toMatch(/RA \(earth electrode\)<\/dt><dd>19 Ω/);
    const fixture = job(FIXTURE);
    const fhtml = renderPack(fixture.project, fixture.assessment, OPTS);
    expect(fhtml).not.toContain('RA (earth electrode)');
    const signoff = fhtml.slice(fhtml.indexOf('id="signoff"'), fhtml.indexOf('id="appendix"'));
    const signer = (role: string) => signoff.slice(signoff.indexOf(`<h3>${role}</h3>`), signoff.indexOf('</div>\n  </div>', signoff.indexOf(`<h3>${role}</h3>`)));
    expect(signer('Designer')).toMatch(/<span class="line">A. Designer &lt;x&gt;<\/span><span class="what">Name<\/span>/);
    expect(signer('Designer')).toMatch(/<span class="line">2026-02-20<\/span><span class="what">Date<\/span>/);
    // a person not named: a blank line to write on, and a line to sign for everyone
    expect(signer('Inspector')).toMatch(/<span class="line"><\/span><span class="what">Name<\/span>/);
    for (const role of ['Designer', 'Installer', 'Inspector']) {
      expect(signer(role)).toMatch(/<p class="declaration">I [a-z]+ /);
      expect(signer(role)).toMatch(/<span class="line"><\/span><span class="what">Signature<\/span>/);
    }
    expect(signoff).toMatch(/This is a draft: it has not been issued/);
  });

  it('prints in the sign-off who issued the revision and why, and the signing key where there is one', () => {
    const { project, assessment } = job(FIXTURE);
    const issued = { by: 'R. Okafor <r>', date: '2026-03-09', reason: 'handover to client' };
    const changes = { since: null, issued, circuitsAdded: [], circuitsRemoved: [], design: [], readings: [], verdicts: [], job: [], lateSessions: [] };
    const html = renderPack(project, assessment, { revisionLabel: 'Revision 1', draft: false, date: '2026-03-09', changes, signingKeyFingerprint: 'SHA256:abc123' });
    const signoff = html.slice(html.indexOf('id="signoff"'), html.indexOf('id="appendix"'));
    expect(signoff).toContain('This revision was issued by <strong>R. Okafor &lt;r&gt;</strong> on 2026-03-09. Reason: handover to client.');
    expect(signoff).toContain('<code>SHA256:abc123</code>');
    const unsigned = renderPack(project, assessment, { revisionLabel: 'Revision 1', draft: false, date: '2026-03-09', changes: { ...changes, issued: { ...issued, reason: null } } });
    expect(unsigned).toContain('Reason: none given.');
    expect(unsigned).not.toContain('fingerprint');
  });

  it('names in the safety notes the circuits whose device would open too slowly, and those not verified', () => {
    const { project, assessment } = job(FIXTURE);
    const view = buildView(project, assessment, OPTS);
    expect(view.safety.slow.map((c) => c.ref)).toEqual(['1']);
    // circuit 2's RCD trip time was not tested (every circuit records its breaking capacity)
    expect(view.safety.unverified.map((c) => c.ref)).toEqual(['2']);
    const html = renderPack(project, assessment, OPTS);
    const safety = html.slice(html.indexOf('id="safety"'), html.indexOf('id="signoff"'));
    expect(safety).toMatch(/Isolate the supply and prove it dead/);
    expect(safety).toMatch(/only competent persons/i);
    expect(safety).toMatch(/does not replace the designer's judgement/);
    expect(safety).toMatch(/DB-A circuit 1 \(Loft lighting &lt;em&gt;new&lt;\/em&gt;\)<\/a>\s*would open more slowly than required/);
  });

  it('says "No earlier revision" without a previous revision, draws a curve per circuit, and says "curve not available" without one', () => {
    const { project, assessment } = job(FIXTURE);
    const view = buildView(project, assessment, OPTS);
    const engine = createEngine();
    const html = engine.render('pack.hbs', view);
    expect(html).toMatch(/Changes since the previous revision<\/h2>\s*<p>No earlier revision.<\/p>/);
    expect(html.match(/<svg [^>]*class="ps-curve"/g)).toHaveLength(3);
    expect(html).not.toContain('curve not available');
    view.appendix[0]!.circuits[0]!.snippetSvg = null as unknown as string;
    expect(engine.render('pack.hbs', view).match(/curve not available/g)).toHaveLength(1);
  });

  it('holds the curves\' stylesheet once in its head, scoped to the curves, and no <style> inside any curve', () => {
    const { project, assessment } = job(DEMO);
    const html = renderPack(project, assessment, OPTS);
    const curves = html.match(/<svg [^>]*class="ps-curve"[\s\S]*?<\/g>\n<\/svg>/g) ?? [];
    expect(curves.length).toBe(assessment.circuits.length);
    expect(curves.filter((svg) => svg.includes('<style'))).toEqual([]);
    const head = html.slice(0, html.indexOf('</head>'));
    expect(html.split('svg.ps-curve .required{').length - 1).toBe(1);
    expect(head).toContain('svg.ps-curve .required{');
    // scoped: a class of the pack's own HTML (a theme's cover band, a note) is not drawn as a curve
    expect(head).not.toMatch(/[}>]\.band\{/);
  });

  it('lists in the appendix every check that applies, in order, the others in one line, and ranks the circuit by all of them', () => {
    for (const dir of [DEMO, FIXTURE]) {
      const { project, assessment } = job(dir);
      const view = buildView(project, assessment, OPTS);
      const circuits = view.appendix.flatMap((b) => b.circuits.map((c) => ({ board: b.id, c })));
      expect(circuits).toHaveLength(assessment.circuits.length);
      for (const { board, c } of circuits) {
        const a = assessment.circuits.find((x) => x.board === board && x.ref === c.ref)!;
        expect(c.checks.map((k) => k.id)).toEqual(a.checks.filter((k) => k.status !== 'n/a').map((k) => k.id));
        const na = a.checks.filter((k) => k.status === 'n/a').map((k) => checkLabel(k.id));
        expect(c.notApplicable).toBe(na.length ? na.join(', ') : null);
        expect(c.look.status).toBe(worstStatus(a.checks.map((k) => k.status)));
        // a passing check without a pair of numbers: its finding, the basis before its first colon
        for (const k of c.checks.filter((k) => !k.full && !/ [≤≥=] |; /.test(k.line))) expect(k.line).not.toContain(': ');
      }
      for (const b of view.boards) {
        for (const r of b.results) {
          const a = assessment.circuits.find((x) => x.board === b.id && x.ref === r.ref)!;
          expect(r.look.status).toBe(worstStatus(a.checks.filter((k) => TEST_CHECKS.has(k.id)).map((k) => k.status)));
        }
        for (const r of b.circuits) {
          const a = assessment.circuits.find((x) => x.board === b.id && x.ref === r.ref)!;
          expect(r.look.status).toBe(worstStatus(a.checks.filter((k) => !TEST_CHECKS.has(k.id)).map((k) => k.status)));
        }
      }
    }
  });

  it('ranks a circuit by its worst check', () => {
    expect(worstStatus(['pass', 'n/a', 'attention'])).toBe('attention');
    expect(worstStatus(['pass', 'not-verified', 'fail'])).toBe('fail');
    expect(worstStatus(['n/a'])).toBe('n/a');
    expect(worstStatus(['pass', 'n/a'])).toBe('pass');
  });
});

describe('the curve snippet request', () => {
  const { project, assessment } = job(FIXTURE);
  const circuit = (ref: string) => project.circuits.find((c) => c.ref === ref)!;
  const derived = (ref: string) => assessment.circuits.find((c) => c.ref === ref)!.derived;
  const readings = (ref: string) => project.readings.get(`DB-A/${ref}`)!;

  it('puts the fault point at the measured Zs: I = U0 × Cmin / Zs', () => {
    const plan = snippetRequest(circuit('1'), derived('1'), readings('1'), assessment.rules);
    // IEC 60364-4-41, 411.4.4 (Zs × Ia ≤ U0) with Cmin 0.95: 230 × 0.95 / 9.9 = 22.07 A
    expect(plan.request.faultCurrentA).toBeCloseTo(22.07, 2);
    expect(plan.request).toMatchObject({ device: { code: 'mcb:B', rating_a: 6 }, requiredS: 0.4 });
    expect(plan.caption).toMatch(/measured Zs 9.9 Ω \(2026-03-06\).*= 22.1 A; required within 0.4 s/);
    expect(snippetRequest(circuit('3'), derived('3'), readings('3'), assessment.rules).request.requiredS).toBe(5);
  });

  it('falls back to the design fault current without a measured Zs, and draws no point for an over-range Zs', () => {
    const none = snippetRequest(circuit('1'), { ...derived('1'), fault_current_a: 410, zs_design_ohm: 0.53 }, {}, assessment.rules);
    expect(none.request.faultCurrentA).toBe(410);
    expect(none.caption).toMatch(/design Zs 0.53 Ω: 410 A/);
    const unknown = snippetRequest(circuit('1'), { required_disconnect_s: 0.4 }, {}, assessment.rules);
    expect(unknown.request.faultCurrentA).toBeNull();
    const over = { zs_ohm: { value: { kind: 'at-least' as const, value: 20 }, date: '2026-03-06', file: 'r.csv', row: 2, earlier: [] } };
    const o = snippetRequest(circuit('1'), { ...derived('1'), fault_current_a: 410 }, over, assessment.rules);
    expect(o.request.faultCurrentA).toBeNull();
    expect(o.caption).toMatch(/over range/);
  });
});

describe('the circuits of each board, grouped in one pass', () => {
  it('are those a filter of every circuit gives, in the order of circuits.csv, and none for a board without circuits', () => {
    const rows = fc.array(fc.constantFrom('DB1', 'DB2', 'DB3'), { maxLength: 40 });
    fc.assert(fc.property(rows, (boards) => {
      const circuits = boards.map((board, i) => ({ board, ref: String(i + 1) })) as unknown as Project['circuits'];
      const on = circuitsByBoard({ circuits });
      return ['DB1', 'DB2', 'DB3', 'DB9'].every((b) => {
        const got = on(b);
        const want = circuits.filter((c) => c.board === b);
        return got.length === want.length && got.every((c, i) => c === want[i]);
      });
    }), { numRuns: 300 });
  });
});
