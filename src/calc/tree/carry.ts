// Values carried down the tree, board by board from the origin: the earth fault loop impedance at
// the board (Zdb), its prospective fault current and the voltage drop from the origin to it.
// - Zdb: the loop line–earth. At a board fed from the origin, Ze; at a fed board, the Zdb the
//   feeding board is designed with plus the feeding circuit's R1+R2 at its maximum operating
//   temperature (the design temperature for the smallest fault current, IEC 60364-4-41 411.4.4).
// - Prospective fault current: the loop line–neutral. At the origin U0 / Ipf gives the loop;
//   down the tree the feeding circuit's line and neutral (the neutral taken as the line's size) at
//   20 °C are added, 20 °C being the design temperature for the largest fault current (IEC 60909-0).
// - Voltage drop: every feeding circuit's own drop at its design current, added from the origin
//   (IEC 60364-5-52 Annex G measures the limits from the origin of the installation).
// Where a board's value is measured, both are kept: design checks take the larger loop impedance
// (the derived one, unless the measured one is higher), checks of measured results take the
// measured one, and breaking capacity the larger fault current. Pure.
import type { Board, Circuit, Supply } from '../../model/schema.js';
import { fmt } from '../../model/units.js';
import { operatingTemp, resistance } from '../design/conductor.js';
import { r1r2 } from '../design/impedance.js';
import { voltageDrop } from '../design/voltage-drop.js';
import { boardOrder, parseFeed, feedKey, type Feed } from './build.js';

export interface CarriedValue {
  /** carried down from the origin; null where the origin's value or a conductor is not known */
  derived: number | null;
  /** as given for the board in project.yaml */
  measured: number | null;
  /** how the derived value was found */
  basis: string;
}

export interface VdLeg {
  /** the feeding circuit, BOARD/REF */
  circuit: string;
  percent: number;
  basis: string;
}

export interface BoardSource {
  board: string;
  /** the circuit that feeds it; null: fed from the origin */
  feed: Feed | null;
  /** the board that feeds it (null at the origin) */
  upstream: string | null;
  zdb: CarriedValue & {
    /** what design checks use: the larger of derived and measured */
    design: number | null;
    /** what checks of measured results use: the measured value, else the derived one */
    test: number | null;
  };
  /** prospective fault current, kA */
  pfc: CarriedValue & {
    /** the larger of derived and measured: for breaking capacity */
    used: number | null;
  };
  /** voltage drop from the origin to the board, %, and the feeding circuits it adds */
  vd: { percent: number | null; legs: VdLeg[] };
}

const larger = (a: number | null, b: number | null): number | null => (a === null ? b : b === null ? a : Math.max(a, b));

/** The values at every board, from the origin down. `circuits` are the rows of circuits.csv. */
export function carry(boards: readonly Board[], circuits: readonly Circuit[], supply: Supply, u0: number): Map<string, BoardSource> {
  const out = new Map<string, BoardSource>();
  const byKey = new Map(circuits.map((c) => [`${c.board}/${c.ref}`, c]));
  for (const b of boardOrder(boards)) {
    const feed = b.fed_by === undefined ? null : parseFeed(b.fed_by);
    const feeder = feed ? byKey.get(feedKey(feed)) : undefined;
    const up = feed ? out.get(feed.board) : undefined;
    const zMeasured = b.zdb_ohm ?? null;
    const pMeasured = b.pfc_ka ?? null;
    let zDerived: number | null = null;
    let zBasis: string;
    let pDerived: number | null = null;
    let pBasis: string;
    let vd: BoardSource['vd'] = { percent: 0, legs: [] };
    if (!feed || !feeder || !up) {
      zDerived = supply.ze_ohm ?? null;
      zBasis = zDerived === null ? 'no Ze for the supply' : `Ze ${fmt(zDerived)} Ω at the origin`;
      pDerived = supply.pfc_ka ?? null;
      pBasis = pDerived === null ? 'no prospective fault current for the supply' : `${fmt(pDerived)} kA at the origin`;
    } else {
      const key = feedKey(feed);
      const hot = r1r2(feeder.conductor, feeder.live_mm2, feeder.cpc_mm2, feeder.length_m, false, operatingTemp(feeder.insulation));
      if (up.zdb.design !== null && hot) {
        zDerived = up.zdb.design + hot.ohm;
        zBasis = `Zdb ${fmt(up.zdb.design)} Ω at ${feed.board} + ${key} ${hot.basis} = ${fmt(zDerived)} Ω`;
      } else {
        zBasis = up.zdb.design === null ? `no Zdb at ${feed.board}` : `no conductor resistance for ${key} in IEC 60228`;
      }
      const rLine = resistance(feeder.conductor, feeder.live_mm2, 20);
      if (up.pfc.used !== null && rLine !== null && up.pfc.used > 0) {
        const loopUp = u0 / (up.pfc.used * 1000);
        const leg = (2 * rLine * feeder.length_m) / 1000;
        pDerived = u0 / (loopUp + leg) / 1000;
        pBasis = `U0 ${fmt(u0)} V / (${fmt(u0)} V / ${fmt(up.pfc.used)} kA at ${feed.board} = ${fmt(loopUp)} Ω + ${key} line and neutral ${fmt(feeder.length_m)} m × 2 × ${fmt(rLine)} mΩ/m at 20 °C = ${fmt(leg)} Ω) = ${fmt(pDerived)} kA`;
      } else {
        pBasis = up.pfc.used === null ? `no prospective fault current at ${feed.board}` : `no conductor resistance for ${key} in IEC 60228`;
      }
      const own = voltageDrop({
        material: feeder.conductor, live_mm2: feeder.live_mm2, length_m: feeder.length_m, ib_a: feeder.ib_a,
        phases: feeder.phases, ring: false, theta_c: operatingTemp(feeder.insulation), u0_v: u0,
      });
      vd = own && up.vd.percent !== null
        ? { percent: up.vd.percent + own.percent, legs: [...up.vd.legs, { circuit: key, percent: own.percent, basis: own.basis }] }
        : { percent: null, legs: up.vd.legs };
    }
    out.set(b.id, {
      board: b.id,
      feed,
      upstream: feed?.board ?? null,
      zdb: { derived: zDerived, measured: zMeasured, basis: zBasis, design: larger(zDerived, zMeasured), test: zMeasured ?? zDerived },
      pfc: { derived: pDerived, measured: pMeasured, basis: pBasis, used: larger(pDerived, pMeasured) },
      vd,
    });
  }
  return out;
}
