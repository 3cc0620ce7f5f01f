// `packsmith device <code> <rating> [--at AMPS] [--within SECONDS] [--u0 V] [--cmin C] [--json]`:
// a device's characteristic looked up on site — the operating times at a current, and Ia and
// max Zs = U0 × Cmin / Ia for each required time (CONTRACT.md).
import { parseArgs } from 'node:util';
import { DEVICE_CODES, type DeviceCode } from '../reference/device-codes.js';
import { parseCell, significant, type Quantity } from '../model/units.js';
import { DEFAULT_RULES } from '../calc/rules.js';
import { characteristic, deviceFamily, maxZs, operatingTime, ratingProblem, type Device } from '../calc/devices/index.js';

const DEFAULT_WITHIN_S = [0.4, 5];
const DEFAULT_U0_V = 230;

class InputError extends Error {}

/** One option's value through the job files' unit parser ("32", "1.2 kA", "400 ms"). */
function quantity(text: string, q: Quantity, what: string): number {
  const r = parseCell(text, q);
  if (!r.ok) throw new InputError(`${what}: ${r.message}`);
  if (r.reading.kind !== 'value' || !(r.reading.value > 0)) throw new InputError(`${what}: found "${text}"; expected a value greater than zero`);
  return r.reading.value;
}

const sig = (n: number | null): number | null => (n === null ? null : significant(n));

interface DeviceReport {
  device: DeviceCode;
  rating_a: number;
  standard: string;
  breaking_ka: number;
  u0_v: number;
  cmin: number;
  characterised: boolean;
  at?: { current_a: number; slowest_s: number | null; fastest_s: number | null };
  within: { time_s: number; ia_a: number | null; max_zs_ohm: number | null }[];
}

function report(args: string[]): { r: DeviceReport; json: boolean } {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: {
      at: { type: 'string' },
      within: { type: 'string', multiple: true },
      u0: { type: 'string' },
      cmin: { type: 'string' },
      json: { type: 'boolean' },
    },
  });
  if (positionals.length !== 2) throw new InputError('needs a device code and a rating, e.g. packsmith device mcb:B 32');
  const code = DEVICE_CODES.find((c) => c.toLowerCase() === positionals[0]!.toLowerCase());
  if (!code) throw new InputError(`found device code "${positionals[0]}"; expected one of ${DEVICE_CODES.join(', ')}`);
  const rating = quantity(positionals[1]!, 'ampere', 'rating');
  const problem = ratingProblem(code, rating);
  if (problem) throw new InputError(`rating: ${problem}`);
  const u0 = values.u0 === undefined ? DEFAULT_U0_V : quantity(values.u0, 'volt', '--u0');
  const cmin = values.cmin === undefined ? DEFAULT_RULES.cmin : Number(values.cmin);
  if (!(cmin > 0 && cmin <= 1.1)) throw new InputError(`--cmin: found "${values.cmin}"; expected the voltage factor, e.g. 0.95`);
  const times = values.within?.map((w) => quantity(w, 'second', '--within')) ?? DEFAULT_WITHIN_S;

  const device: Device = { code, rating_a: rating };
  const family = deviceFamily(code);
  const r: DeviceReport = {
    device: code, rating_a: rating, standard: family.standard, breaking_ka: family.breaking_ka, u0_v: u0, cmin,
    characterised: characteristic(device) !== null,
    within: times.map((t) => {
      const mz = maxZs(device, t, u0, cmin);
      return { time_s: t, ia_a: sig(mz?.ia_a ?? null), max_zs_ohm: sig(mz?.max_zs_ohm ?? null) };
    }),
  };
  if (values.at !== undefined) {
    const current = quantity(values.at, 'ampere', '--at');
    const t = operatingTime(device, current);
    r.at = { current_a: current, slowest_s: sig(t.slowest_s), fastest_s: sig(t.fastest_s) };
  }
  return { r, json: values.json === true };
}

function text(r: DeviceReport): string {
  const lines = [`${r.device} ${r.rating_a} A (${r.standard}), usual breaking capacity ${r.breaking_ka} kA`];
  if (!r.characterised) lines.push('  the device library holds no published time-current points for this rating: nothing can be looked up');
  if (r.at) {
    const { current_a, slowest_s, fastest_s } = r.at;
    lines.push(slowest_s === null
      ? `  at ${current_a} A: not known to operate`
      : `  at ${current_a} A: operates within ${slowest_s} s${fastest_s === null ? '' : `, not before ${fastest_s} s`}`);
  }
  for (const w of r.within) {
    lines.push(w.ia_a === null
      ? `  within ${w.time_s} s: no current is known to operate it`
      : `  within ${w.time_s} s: Ia ${w.ia_a} A, max Zs ${w.max_zs_ohm} Ω (U0 ${r.u0_v} V × Cmin ${r.cmin} / Ia)`);
  }
  return `${lines.join('\n')}\n`;
}

/** Run the command; returns the exit code: 0, or 2 for a bad code, rating or option. */
export function deviceCommand(args: string[]): 0 | 2 {
  let out: ReturnType<typeof report>;
  try {
    out = report(args);
  } catch (err) {
    if (err instanceof InputError || (err instanceof Error && 'code' in err && String(err.code).startsWith('ERR_PARSE_ARGS'))) {
      process.stderr.write(`packsmith device: ${err.message}\n`);
      return 2;
    }
    throw err;
  }
  const { r, json } = out;
  if (json) {
    const { device, rating_a, at, within, ...rest } = r;
    process.stdout.write(`${JSON.stringify({ device, rating_a, ...(at ? { at } : {}), within, ...rest }, null, 2)}\n`);
  } else {
    process.stdout.write(text(r));
  }
  return 0;
}
