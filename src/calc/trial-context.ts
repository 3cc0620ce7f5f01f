// A circuit tried at other lengths. The longest run (design/max-length.ts) and what would pass
// (remedy.ts) judge the same circuit at dozens of lengths, and its length changes only R1+R2, the
// design Zs, the voltage drop and the design fault. So what the length does not change is worked
// out once for the circuit, here: the resistances and the drop per metre, the design fault's
// inputs, and the length-free parts of a check (`PREPARED`). A length then costs a few products
// and one small object that reads everything else from the circuit's own context.
import type { CircuitRecord } from '../model/validate.js';
import type { Check, CircuitContext, LengthCheck, VdOrigin } from './types.js';
import { designAt, perMetreDesign, type Design, type PerMetreDesign } from './design/index.js';
import { designFault, faultInputs, type DesignFault, type FaultOptions } from './design/fault.js';
import type { Device } from './devices/index.js';
import { originDrop } from './tree/origin.js';
import { adiabatic, adiabaticAtLengths } from './checks/adiabatic.js';

/** Checks with parts a circuit's length does not change: each maps the circuit to the check with those parts worked once. */
const PREPARED: ReadonlyMap<Check, (base: CircuitContext) => LengthCheck> = new Map([[adiabatic, adiabaticAtLengths]]);

export class TrialContext {
  readonly design: PerMetreDesign;
  readonly fault: { device: Device; options: FaultOptions };
  private readonly prepared = new Map<Check, LengthCheck>();

  /** `base`: the circuit at its own length (its design's length-free parts are kept). */
  constructor(readonly base: CircuitContext) {
    const { circuit, rules, supply } = base;
    this.design = perMetreDesign(circuit, rules, base.design);
    // the required time and max Zs do not depend on the length
    this.fault = faultInputs(circuit, supply, rules, base.derived.required_disconnect_s);
  }

  /** The circuit as it would be with this length. */
  at(lengthM: number): CircuitContext {
    return new AtLength(this, lengthM);
  }

  /**
   * The check to judge this circuit's lengths by: the same rule, its length-free parts worked
   * once. For trials in numbers only: a part kept keeps the words of the trial that worked it.
   */
  check(check: Check): LengthCheck {
    let c = this.prepared.get(check);
    if (!c) {
      c = PREPARED.get(check)?.(this.base) ?? check;
      this.prepared.set(check, c);
    }
    return c;
  }
}

/**
 * One length of a circuit: its own circuit record, design and drop from the origin; the design
 * fault worked out only when a check reads it (of the checks a length is tried for, only the
 * adiabatic check and disconnection do, and a trial often ends before them); the rest is the
 * circuit's own.
 */
class AtLength implements CircuitContext {
  readonly circuit: CircuitRecord;
  readonly design: Design;
  readonly vdOrigin: VdOrigin | null;
  private worked: DesignFault | undefined;

  constructor(private readonly trial: TrialContext, lengthM: number) {
    const { base } = trial;
    this.circuit = { ...base.circuit, length_m: lengthM };
    this.design = designAt(trial.design, lengthM);
    this.vdOrigin = originDrop(this.design.vd, base.site?.source);
  }

  get fault(): DesignFault {
    const { device, options } = this.trial.fault;
    return (this.worked ??= designFault(this.design, device, options));
  }

  get board() { return this.trial.base.board; }
  get supply() { return this.trial.base.supply; }
  get rules() { return this.trial.base.rules; }
  get readings() { return this.trial.base.readings; }
  get derived() { return this.trial.base.derived; }
  get requiredBasis() { return this.trial.base.requiredBasis; }
  get maxZsBasis() { return this.trial.base.maxZsBasis; }
  get maxZsOhm() { return this.trial.base.maxZsOhm; }
  get site() { return this.trial.base.site; }
}
