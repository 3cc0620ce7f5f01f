// Source: physical limits and instrument ranges, each with its reasoning beside it; the test
// voltages are those of IEC 60364-6:2016 Table 6.1 and the nominal output voltages of insulation
// testers in IEC 61557-2 (the open-circuit voltage at most 1.5 × nominal, from memory); the supply
// voltages are the low-voltage nominal voltages of IEC 60038 Table 1 (from memory); the RCD
// ratings are the preferred rated residual operating currents of IEC 61008-1 / IEC 61009-1 (from
// memory).
//
// A measured or supply value outside its range is not a reading anyone could have taken: it is
// an input error (exit 2), never a value the checks may pass. A value inside the range may still
// be queried by a check (e.g. a measured Zs below the Zdb of its board is `attention`).

export interface PlausibleRange {
  /** the value must be greater than this (a physical quantity that cannot be zero) */
  above?: number;
  /** the value must be at least this */
  atLeast?: number;
  /** the value must be at most this */
  atMost: number;
  /** the unit of the bounds, as the field's name says */
  unit: string;
  /** why, in the words of the message */
  why: string;
}

const LOOP = 'a loop through real conductors and the supply transformer has resistance; loop testers resolve 0.01 Ω and read at most 2000 Ω (from memory)';
const CONTINUITY = 'a conductor has resistance, so a continuity reading is above zero (a display of 0.00 is below the instrument\'s resolution: re-test with the leads nulled); continuity testers read at most 2000 Ω (from memory)';
const INSULATION = 'zero is a dead short (a real reading, which fails); installation testers read at most a few hundred GΩ (from memory)';
const FAULT_CURRENT = 'a low-voltage supply delivers some fault current, and no low-voltage switchgear is rated above about 200 kA (from memory)';
const RCD_TIME = 'an RCD cannot trip in no time; testers stop a test well before 5 s and show a non-trip as ">N" (from memory)';

/** Plausible ranges by field name (readings columns, project.yaml supply and boards fields). */
export const PLAUSIBLE: Readonly<Record<string, PlausibleRange>> = {
  // readings/*.csv
  zs_ohm: { atLeast: 0.01, atMost: 2000, unit: 'Ω', why: LOOP },
  r1r2_ohm: { above: 0, atMost: 2000, unit: 'Ω', why: CONTINUITY },
  ring_r1_ohm: { above: 0, atMost: 2000, unit: 'Ω', why: CONTINUITY },
  ring_rn_ohm: { above: 0, atMost: 2000, unit: 'Ω', why: CONTINUITY },
  ring_r2_ohm: { above: 0, atMost: 2000, unit: 'Ω', why: CONTINUITY },
  ir_ll_mohm: { atLeast: 0, atMost: 200_000, unit: 'MΩ', why: INSULATION },
  ir_le_mohm: { atLeast: 0, atMost: 200_000, unit: 'MΩ', why: INSULATION },
  ir_test_v: { atLeast: 50, atMost: 1500, unit: 'V', why: 'an insulation test is made at a nominal 50, 100, 250, 500 or 1000 V d.c. (IEC 61557-2), the output at most 1.5 × nominal' },
  rcd_1x_ms: { above: 0, atMost: 5000, unit: 'ms', why: RCD_TIME },
  rcd_5x_ms: { above: 0, atMost: 5000, unit: 'ms', why: RCD_TIME },
  // project.yaml: supply and boards
  // A lower U0 only makes max Zs smaller (stricter); an extra-low-voltage (SELV/PELV) supply is as low as a few volts.
  u0_v: { atLeast: 6, atMost: 400, unit: 'V', why: 'a supply\'s nominal voltage to earth is at most 400 V in low-voltage systems (IEC 60038 Table 1: 120, 230, 240, 277, 347, 400 V) and at least a few volts in extra-low-voltage ones' },
  ze_ohm: { atLeast: 0.01, atMost: 2000, unit: 'Ω', why: LOOP },
  zdb_ohm: { atLeast: 0.01, atMost: 2000, unit: 'Ω', why: LOOP },
  pfc_ka: { above: 0, atMost: 200, unit: 'kA', why: FAULT_CURRENT },
  pfc_3ph_ka: { above: 0, atMost: 200, unit: 'kA', why: FAULT_CURRENT },
  frequency_hz: { atLeast: 15, atMost: 500, unit: 'Hz', why: 'public supplies run at 50 or 60 Hz (IEC 60038); the low-voltage supplies furthest from these, traction at 16.7 Hz and aircraft at 400 Hz, stay inside 15 to 500 Hz (from memory)' },
  ra_ohm: { above: 0, atMost: 20_000, unit: 'Ω', why: 'an earth electrode has resistance, and above 20 kΩ it is not in contact with the ground (from memory)' },
  // circuits.csv
  rcd_ma: { atLeast: 6, atMost: 30_000, unit: 'mA', why: 'an RCD\'s rated residual operating current is 6, 10, 30, 100, 300 or 500 mA, or 1 A and more up to 30 A (the preferred values of IEC 61008-1 and IEC 61009-1, from memory); a figure below 6 is most likely in amperes: write 300, or "0.3 A", for a 300 mA device' },
};

/** Nominal insulation test voltages (IEC 61557-2; IEC 60364-6 Table 6.1 uses 250, 500, 1000 V). */
export const INSULATION_TEST_NOMINAL_V = [50, 100, 250, 500, 1000] as const;
/** A tester's output may exceed its nominal voltage up to this factor (IEC 61557-2, from memory). */
export const INSULATION_TEST_MAX_FACTOR = 1.5;
