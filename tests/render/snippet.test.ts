// The curve snippet: a standalone, valid, deterministic SVG with the marker where the physics puts it.
import { describe, expect, it } from 'vitest';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { curveSnippet } from '../../src/render/snippet.js';

type Node = Record<string, unknown>;
const parse = (svg: string): Node =>
  new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', isArray: (name) => ['line', 'text', 'polyline', 'polygon', 'circle'].includes(name) })
    .parse(svg).svg as Node;
const group = (svg: string) => parse(svg).g as Node;
const lines = (g: Node) => g.line as Record<string, string>[];
const decadeX = (g: Node, amps: number) => Number(lines(g).find((l) => l['data-current-a'] === String(amps))!.x1);
const decadeY = (g: Node, seconds: number) => Number(lines(g).find((l) => l['data-time-s'] === String(seconds))!.y1);

const b32 = { device: { code: 'mcb:B', rating_a: 32 }, faultCurrentA: 317, requiredS: 0.4 } as const;

describe('curveSnippet', () => {
  const svg = curveSnippet(b32);

  it('is well-formed SVG with a text alternative', () => {
    expect(XMLValidator.validate(svg)).toBe(true);
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    const root = parse(svg);
    expect(root.title).toBe('mcb:B 32 A: time-current characteristic');
    expect(String(root.desc)).toMatch(/band lies between the fastest and the slowest operating times of IEC 60898-1, type B/);
    expect(String(root.desc)).toMatch(/317 A the slowest operating time is 0.1 s/);
    expect(String(root.desc)).toMatch(/required disconnection time, 0.4 s/);
  });

  it('has a decade grid over 1 A–10 kA and 0.01 s–10,000 s, with labelled axes', () => {
    const g = group(svg);
    expect(lines(g).filter((l) => l['data-current-a']).map((l) => l['data-current-a'])).toEqual(['1', '10', '100', '1000', '10000']);
    expect(lines(g).filter((l) => l['data-time-s']).map((l) => l['data-time-s'])).toEqual(['0.01', '0.1', '1', '10', '100', '1000', '10000']);
    const texts = (g.text as (string | Node)[]).map((t) => (typeof t === 'string' ? t : String(t['#text'])));
    expect(texts).toContain('prospective fault current (A)');
    expect(texts).toContain('operating time (s)');
    expect(texts).toContain('10k');
  });

  it('puts the marker at 317 A between the 100 A and 1000 A decades, on 0.1 s', () => {
    // IEC 60898-1: 317 A ≥ 5 × 32 A, so a type B trips within 0.1 s
    const g = group(svg);
    const marker = (g.circle as Record<string, string>[])[0]!;
    const cx = Number(marker.cx);
    expect(cx).toBeGreaterThan(decadeX(g, 100));
    expect(cx).toBeLessThan(decadeX(g, 1000));
    // log scale: 317 A sits log10(3.17) = 0.50 of the way through its decade
    expect((cx - decadeX(g, 100)) / (decadeX(g, 1000) - decadeX(g, 100))).toBeCloseTo(Math.log10(3.17), 2);
    expect(Number(marker.cy)).toBeCloseTo(decadeY(g, 0.1), 0);
  });

  it('puts a fuse marker below the 0.1 s decade where the fuse is faster', () => {
    // gG 32 A melts within 0.1 s at 350 A (IEC 60269-1 gate), so at 1000 A it is faster than 0.1 s
    const g = group(curveSnippet({ device: { code: 'fuse:gG', rating_a: 32 }, faultCurrentA: 1000 }));
    const cy = Number((g.circle as Record<string, string>[])[0]!.cy);
    expect(cy).toBeGreaterThan(decadeY(g, 0.1));
    expect(cy).toBeLessThan(decadeY(g, 0.01));
  });

  it('draws the required time as a dashed line between the 0.1 s and 1 s decades', () => {
    const g = group(svg);
    const plot = g.svg as Node;
    const required = lines(plot).find((l) => l.class === 'required')!;
    expect(Number(required.y1)).toBeGreaterThan(decadeY(g, 1));
    expect(Number(required.y1)).toBeLessThan(decadeY(g, 0.1));
    expect(svg).toMatch(/\.required\{[^}]*stroke-dasharray/);
  });

  it('shades a band only where the standard gives both edges', () => {
    expect((group(svg).svg as Node).polygon).toHaveLength(1);
    const fuse = curveSnippet({ device: { code: 'fuse:bs3036', rating_a: 30 }, faultCurrentA: 140 });
    expect((group(fuse).svg as Node).polygon).toBeUndefined();
    expect(String(parse(fuse).desc)).toMatch(/no fastest edge is published/);
  });

  it('gives identical bytes on a second render, and other bytes for other input', () => {
    expect(curveSnippet(b32)).toBe(svg);
    expect(curveSnippet({ ...b32, faultCurrentA: 318 })).not.toBe(svg);
  });

  it('escapes the title and says when the device does not operate or is unknown', () => {
    const odd = curveSnippet({ device: { code: 'mcb:B', rating_a: 32 }, faultCurrentA: 40, title: 'DB1 <3> & co' });
    expect(XMLValidator.validate(odd)).toBe(true);
    expect(odd).toContain('<title>DB1 &lt;3&gt; &amp; co</title>');
    expect(parse(odd).title).toBe('DB1 <3> & co');
    expect(String(parse(odd).desc)).toMatch(/40 A the device is not known to operate/);
    const unknown = curveSnippet({ device: { code: 'fuse:bs88-3', rating_a: 45 } });
    expect(XMLValidator.validate(unknown)).toBe(true);
    expect(String(parse(unknown).desc)).toMatch(/no published time-current points/);
  });

  it('writes one element a line in a fixed order, whatever it draws', () => {
    // the snippet is put together from blocks of lines written once (the grid, a device's band):
    // every combination of what it draws keeps one element a line, in the order of the drawing
    const devices = [{ code: 'mcb:B', rating_a: 32 }, { code: 'fuse:bs3036', rating_a: 30 }, { code: 'fuse:bs88-3', rating_a: 45 }] as const;
    const order = ['svg', 'title', 'desc', 'style', 'defs', 'g', 'grid', 'plot', 'band', 'fastest', 'slowest', 'band2', 'slowest2', 'upto', 'required', 'fault',
      '/svg', 'frame', 'note', 'marker', 'axis', '/g', '/svg'];
    const kind = (line: string): string => {
      const m = /^<(\/?[a-z]+)(?: class="([a-z0-9]+)")?/.exec(line)!;
      if (m[1] === 'line' || m[1] === 'text' || m[1] === 'polygon' || m[1] === 'polyline' || m[1] === 'rect' || m[1] === 'circle') return m[2] === 'tick' ? 'grid' : m[2]!;
      return m[1] === 'svg' && m[2] === 'plot' ? 'plot' : m[1]!;
    };
    // a line is one element: empty, with text, or the opening or closing of a group
    const ONE_ELEMENT = /^(?:<([a-z]+)[^<>]*\/>|<([a-z]+)[^<>]*>[^<>]*<\/\2>|<\/?(?:svg|g)(?: [^<>]*)?>)$/;
    let seen = 0;
    for (const device of devices) {
      for (const faultCurrentA of [undefined, null, 0, 0.5, 40, 317, 5000, 20000]) {
        for (const requiredS of [undefined, 0.4, 5, 0.001]) {
          for (const downstream of [undefined, { device: devices[0]!, label: 'DB2/1 mcb:B 32 A', uptoA: 900 }, { device: devices[1]!, label: 'x', uptoA: null }, { device: devices[2]!, label: 'y', uptoA: 2e4 }]) {
            for (const style of [true, false]) {
              const out = curveSnippet({ device, faultCurrentA, requiredS, downstream, title: 'DB1 1: "a" & <b>' }, { style });
              expect(XMLValidator.validate(out)).toBe(true);
              const lines = out.split('\n');
              for (const line of lines) expect(ONE_ELEMENT.test(line) || line.startsWith('<defs>'), line).toBe(true);
              const kinds = lines.map(kind);
              // each line one element, in the drawing's order (notes come after the frame, before the marker or after it)
              let at = 0;
              for (const k of kinds.filter((k) => k !== 'note' && k !== 'marker')) {
                const next = order.indexOf(k, at);
                expect(next, `${k} in ${kinds.join(' ')}`).toBeGreaterThanOrEqual(at);
                at = k === '/svg' && next === order.indexOf('/svg') ? next + 1 : next;
              }
              expect(kinds.includes('style')).toBe(style);
              expect(kinds.includes('defs')).toBe(downstream !== undefined);
              seen++;
            }
          }
        }
      }
    }
    expect(seen).toBe(768);
  });
});
