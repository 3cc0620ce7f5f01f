// partials/board.hbs (with tree.hbs, tree-heads.hbs and tree-cells.hbs) in TypeScript: one board's
// circuit schedule and test results, a row per circuit. Same bytes as the templates.
import type { PackView } from '../view.js';
import { e, indent, num, status, symbol, truthy } from './html.js';

type Board = PackView['boards'][number];
type Tree = NonNullable<Board['tree']>;

/** partials/tree.hbs: where the board is fed from, what it feeds, Zdb and PFC. */
function tree(t: Tree | null): string {
  if (!truthy(t)) return '';
  const tr = t!;
  let feed = truthy(tr.fedBy)
    ? `Fed from <a href="#${e(tr.fedBy!.boardAnchor)}">${e(tr.fedBy!.board)}</a> through circuit <a href="#${e(tr.fedBy!.anchor)}">${e(tr.fedBy!.board)}/${e(tr.fedBy!.ref)}</a>`
    : 'Fed from the origin';
  if (truthy(tr.feeds.length)) {
    feed += '; feeds ';
    tr.feeds.forEach((f, i) => {
      feed += `${i === 0 ? '' : ', '}<a href="#${e(f.anchor)}">${e(f.board)}</a> (circuit ${e(f.ref)})`;
    });
  }
  let vd = '';
  if (truthy(tr.legs.length)) {
    tr.legs.forEach((l, i) => {
      vd += `${i === 0 ? '' : ' + '}${e(l.circuit)} ${num(l.percent)} %`;
    });
    vd += ` = ${num(tr.vd)} %`;
  } else {
    vd = '0 % (fed from the origin)';
  }
  return '<div class="tree">\n'
    + `  <p class="feed">${feed}. <span class="vd-origin">Voltage drop from the origin to this board: ${vd}.</span></p>\n`
    + '  <table class="tree-values">\n'
    + '    <thead><tr><th scope="col"></th><th scope="col" class="n">Derived</th><th scope="col" class="n">Measured</th><th scope="col">How derived</th></tr></thead>\n'
    + '    <tbody>\n'
    + `      <tr><th scope="row">Zdb (Ω)</th><td class="n">${num(tr.zdb.derived)}</td><td class="n">${num(tr.zdb.measured)}</td><td>${e(tr.zdb.basis)}; design checks use ${num(tr.zdb.design)} Ω</td></tr>\n`
    + `      <tr><th scope="row">PFC (kA)</th><td class="n">${num(tr.pfc.derived)}</td><td class="n">${num(tr.pfc.measured)}</td><td>${e(tr.pfc.basis)}</td></tr>\n`
    + '    </tbody>\n'
    + '  </table>\n'
    + '</div>\n';
}

/** partials/tree-heads.hbs */
const TREE_HEADS = '<th scope="col" class="n">VD from origin<br>%</th><th scope="col" class="n">Longest run<br>m</th>\n';

const SCHEDULE_HEAD = '  <h3>Circuit schedule</h3>\n'
  + '  <div class="scroll">\n'
  + '  <table class="schedule">\n'
  + '    <thead>\n'
  + `      <tr><th scope="col">Ref</th><th scope="col">Circuit</th><th scope="col">Device</th><th scope="col" class="n">In<br>A</th><th scope="col" class="n">Ib<br>A</th><th scope="col" class="n">Iz<br>A</th><th scope="col">Cable</th><th scope="col">Method</th><th scope="col" class="n">Length<br>m</th><th scope="col" class="n">Max Zs<br>Ω</th><th scope="col" class="n">Design Zs<br>Ω</th><th scope="col" class="n">Disconn.<br>s</th><th scope="col" class="n">Required<br>s</th><th scope="col" class="n">VD<br>%</th><th scope="col" class="n">Min cpc<br>mm²</th>${TREE_HEADS}<th scope="col">Design</th></tr>\n`
  + '    </thead>\n'
  + '    <tbody>\n';

const RESULTS_HEAD = '    </tbody>\n'
  + '  </table>\n'
  + '  </div>\n';

const RESULTS_TABLE = '  <h3>Test results</h3>\n'
  + '  <div class="scroll">\n'
  + '  <table class="results">\n'
  + '    <thead>\n'
  + '      <tr><th scope="col" rowspan="2">Ref</th><th scope="col" rowspan="2">Circuit</th><th scope="col" class="n">R1+R2</th><th scope="colgroup" colspan="3" class="group">Ring, end to end</th><th scope="colgroup" colspan="3" class="group">Insulation</th><th scope="col" rowspan="2">Polarity</th><th scope="col" class="n">Zs</th><th scope="colgroup" colspan="3" class="group">RCD trip time</th><th scope="col" rowspan="2">Tested</th><th scope="col" rowspan="2">Tests</th></tr>\n'
  + '      <tr><th scope="col" class="n">Ω</th><th scope="col" class="n">r1 Ω</th><th scope="col" class="n">rn Ω</th><th scope="col" class="n">r2 Ω</th><th scope="col" class="n">L–L MΩ</th><th scope="col" class="n">L–E MΩ</th><th scope="col" class="n">at V</th><th scope="col" class="n">Ω</th><th scope="col" class="n">IΔn ms</th><th scope="col" class="n">5 IΔn ms</th><th scope="col">button</th></tr>\n'
  + '    </thead>\n'
  + '    <tbody>\n';

/** One row of the circuit schedule (tree-cells.hbs inside). */
function designRow(c: Board['circuits'][number]): string {
  const d = c.derived;
  return `      <tr><td><a href="#${e(c.anchor)}">${e(c.ref)}</a></td><td>${e(c.description)}${truthy(c.ring) ? ' (ring)' : ''}${truthy(c.rcd) ? `<br><span class="sub">RCD ${e(c.rcd)}</span>` : ''}</td>`
    + `<td>${e(c.device)}</td><td class="n">${num(c.rating_a)}</td><td class="n">${num(c.ib_a)}</td><td class="n">${num(d.iz_a)}</td><td>${e(c.cable)}</td><td>${e(c.method)}</td>`
    + `<td class="n">${num(c.length_m)}</td><td class="n">${num(d.max_zs_ohm)}</td><td class="n">${num(d.zs_design_ohm)}</td><td class="n">${num(d.disconnect_s)}</td>`
    + `<td class="n">${num(d.required_disconnect_s)}</td><td class="n">${num(d.vd_percent)}</td><td class="n">${num(d.cpc_min_mm2)}</td>`
    + `<td class="n">${num(d.vd_origin_percent)}</td><td class="n">${truthy(c.noRun) ? 'none' : num(d.max_length_m)}</td>\n`
    + `<td>${status(c.look)}</td></tr>\n`;
}

/** One row of the test results. */
function resultRow(r: Board['results'][number]): string {
  let row = `      <tr><td><a href="#${e(r.anchor)}">${e(r.ref)}</a></td><td>${e(r.description)}</td>`;
  for (const cell of r.cells) {
    row += `<td class="cell">${truthy(cell.shown) ? e(cell.shown) : ''}${truthy(cell.mark) ? `<sup class="mark">${e(cell.mark)}</sup>` : ''}${truthy(cell.look) ? ` ${symbol(cell.look!)}` : ''}</td>`;
  }
  const when = truthy(r.tested) ? `${e(r.tested)}${truthy(r.by) ? ` <span class="sub">${e(r.by)}</span>` : ''}` : 'none';
  return `${row}<td class="when">${when}</td><td>${status(r.look)}</td></tr>\n`;
}

/** partials/board.hbs for one board. */
export function board(b: Board): string {
  let out = `<section class="board" id="${e(b.anchor)}">\n  <h2>Board ${e(b.id)}${truthy(b.location) ? ` — ${e(b.location)}` : ''}</h2>\n`;
  out += indent(tree(b.tree), '  ');
  out += SCHEDULE_HEAD;
  for (const c of b.circuits) out += designRow(c);
  out += RESULTS_HEAD;
  out += `  <p class="key">${truthy(b.noRun.length)
    ? '— : not known for this circuit; longest run none: no run of any length passes (the appendix says why of both).'
    : '— : not known for this circuit (its checks in the appendix say why).'} Design: the worst of the circuit's design checks.</p>\n`;
  out += RESULTS_TABLE;
  for (const r of b.results) out += resultRow(r);
  out += RESULTS_HEAD;
  const notes = truthy(b.footnotes.length);
  out += `  <p class="key">Each reading with the verdict of the check that judges it; a blank cell: not recorded and not needed; — : not recorded but needed. Tests: the worst of the circuit's test checks.${notes ? ' A number marks a re-tested reading:' : ''}</p>\n`;
  if (notes) out += `  <ol class="footnotes">${b.footnotes.map((f) => `<li value="${e(f.mark)}">${e(f.text)}</li>`).join('')}</ol>\n`;
  return `${out}</section>\n`;
}
