// The device library's smaller promises: rating errors, the I²t for the adiabatic check, the
// fault current from a measured Zs, and its guard against unusable reference data.
import { describe, expect, it } from 'vitest';
import { energyAt, measuredFault, operatingTime, ratingProblem } from '../../src/calc/devices/index.js';
import { checkedEdge } from '../../src/calc/devices/curve.js';

describe('ratings a family does not make', () => {
  it('accepts a rating the family makes', () => {
    expect(ratingProblem('mcb:B', 32)).toBeNull();
    expect(ratingProblem('fuse:bs3036', 30)).toBeNull();
  });
  it('names the ratings made', () => {
    // IEC 60898-1 5.3.2 preferred values (from memory)
    expect(ratingProblem('mcb:C', 7)).toBe('found 7 A; mcb:C (IEC 60898-1) is made in 6, 8, 10, 13, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125 A');
    expect(ratingProblem('fuse:gG', 31.5)).toMatch(/^found 31.5 A; fuse:gG \(IEC 60269-2\) is made in 2, 4, 6,/);
  });
  it('says that twisted elements are not an element of their summed rating', () => {
    // BS 3036 elements 5, 15, 20, 30, 45, 60, 100 A (REFERENCE.md): 25 = 20 + 5, 35 = 15 + 15 + 5
    expect(ratingProblem('fuse:bs3036', 25)).toMatch(/made in 5, 15, 20, 30, 45, 60, 100 A; two or three elements twisted together are not an element of their summed rating/);
    expect(ratingProblem('fuse:bs3036', 35)).toMatch(/twisted/);
    expect(ratingProblem('fuse:bs3036', 7)).not.toMatch(/twisted/);
  });
});

describe('I²t for the adiabatic check', () => {
  it('is I² × t on the slowest edge where the device takes longer than 0.1 s', () => {
    // definition of the let-through energy for a current held for the operating time (IEC 60364-5-54 543.1.2)
    const e = energyAt({ code: 'fuse:bs3036', rating_a: 30 }, 140)!;
    expect(e.i2t_a2s).toBeCloseTo(140 ** 2 * operatingTime({ code: 'fuse:bs3036', rating_a: 30 }, 140).slowest_s!, 6);
    expect(e.basis).toMatch(/slowest operating time/);
  });
  it('takes 0.1 s for a breaker in its instantaneous region and says it credits no current limiting', () => {
    const e = energyAt({ code: 'mcb:B', rating_a: 32 }, 1000)!;
    expect(e.i2t_a2s).toBeCloseTo(1000 ** 2 * 0.1, 6); // IEC 60898-1: trips within 0.1 s at 5 In and above
    expect(e.basis).toMatch(/no current limiting is credited \(assumption/);
  });
  it('holds the I²t of the shortest published time above it, for a fuse, and says so', () => {
    // IEC 60269-1 gate (from memory): a 32 A gG fuse-link melts within 0.1 s at 350 A → 350² × 0.1 A²s
    const e = energyAt({ code: 'fuse:gG', rating_a: 32 }, 3000)!;
    expect(e.i2t_a2s).toBeCloseTo(350 ** 2 * 0.1, 6);
    expect(e.basis).toMatch(/assumption/);
  });
  it('is null where the device is not known to operate', () => {
    expect(energyAt({ code: 'mcb:B', rating_a: 32 }, 40)).toBeNull();
    expect(energyAt({ code: 'fuse:bs88-3', rating_a: 45 }, 1000)).toBeNull();
  });
});

describe('fault current and disconnection time from a measured Zs', () => {
  const b32 = { code: 'mcb:B', rating_a: 32 } as const;
  it('is U0 × Cmin / Zs and the slowest time at it', () => {
    // Ohm's law with the voltage factor: 230 × 0.95 / 0.74 = 295 A ≥ 5 × 32 A → within 0.1 s (IEC 60898-1)
    expect(measuredFault(b32, { kind: 'value', value: 0.74 }, 230, 0.95)).toEqual({ fault_current_a: 295, disconnect_s: 0.1 });
  });
  it('takes no credit for the thermal region between 2.55 In and 5 In', () => {
    // 230 × 0.95 / 2 = 109 A = 3.4 In: IEC 60898-1 Table 7 promises a trip within 60 s at 2.55 In and
    // nothing faster until the instantaneous release at 5 In
    const f = measuredFault(b32, { kind: 'value', value: 2 }, 230, 0.95);
    expect(f.fault_current_a).toBe(109);
    expect(f.disconnect_s).toBe(60);
  });
  it('says null where the device does not operate, and nothing without a plain reading or a characteristic', () => {
    expect(measuredFault(b32, { kind: 'value', value: 5 }, 230, 0.95)).toEqual({ fault_current_a: 43.7, disconnect_s: null });
    expect(measuredFault(b32, { kind: 'at-least', value: 5 }, 230, 0.95)).toEqual({});
    expect(measuredFault(b32, { kind: 'not-tested' }, 230, 0.95)).toEqual({});
    expect(measuredFault(b32, undefined, 230, 0.95)).toEqual({});
    expect(measuredFault({ code: 'fuse:bs88-3', rating_a: 45 }, { kind: 'value', value: 0.5 }, 230, 0.95)).toEqual({ fault_current_a: 437 });
  });
});

describe('reference data that cannot make an edge', () => {
  it('is refused when the time rises with the current', () => {
    const p = (current_a: number, time_s: number) => ({ current_a, time_s, source: 'test' });
    expect(() => checkedEdge({ points: [p(10, 5), p(20, 6)], tail: 'i2t', tailSource: '' }, 'x')).toThrow(/does not follow/);
    expect(() => checkedEdge({ points: [p(20, 5), p(10, 1)], tail: 'i2t', tailSource: '' }, 'x')).toThrow(/does not follow/);
    expect(() => checkedEdge({ points: [p(10, 5), p(20, 1)], tail: 'i2t', tailSource: '' }, 'x')).not.toThrow();
  });
});
