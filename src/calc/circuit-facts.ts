// Facts about a circuit that circuits.csv gives with a default depending on other fields
// (CONTRACT.md): `sockets` is yes for kind power, else no, where the column is empty.
import type { Circuit } from '../model/schema.js';

export const hasSockets = (c: Pick<Circuit, 'kind' | 'sockets'>): boolean => c.sockets ?? c.kind === 'power';

/** The circuit's nominal voltage: U0 single-phase, the line voltage √3 U0 three-phase. */
export const circuitVoltage = (phases: number, u0: number): number => (phases === 3 ? Math.round(u0 * Math.sqrt(3)) : u0);
