// Source: the scope of each device standard — IEC 60898-1 (circuit-breakers, rated voltage not
// exceeding 440 V a.c. between phases) and IEC 61009-1 (RCBOs, the same); IEC 60269-2 (fuses for
// authorized persons, up to 1000 V a.c.); BS 88-3 (fuses for household use, 240 V a.c.); BS 3036
// (semi-enclosed fuses, "ratings up to 100 amperes and 240 volts to earth"). All from memory.
import type { DeviceCode } from './device-codes.js';

export interface RatedVoltage {
  max_v: number;
  /** the voltage the rating is compared with: between lines, or to earth (U0) */
  against: 'line' | 'earth';
  source: string;
}

export const DEVICE_RATED_VOLTAGE: Record<DeviceCode, RatedVoltage> = {
  'mcb:B': { max_v: 440, against: 'line', source: 'IEC 60898-1 scope (from memory)' },
  'mcb:C': { max_v: 440, against: 'line', source: 'IEC 60898-1 scope (from memory)' },
  'mcb:D': { max_v: 440, against: 'line', source: 'IEC 60898-1 scope (from memory)' },
  'rcbo:B': { max_v: 440, against: 'line', source: 'IEC 61009-1 scope (from memory)' },
  'rcbo:C': { max_v: 440, against: 'line', source: 'IEC 61009-1 scope (from memory)' },
  'rcbo:D': { max_v: 440, against: 'line', source: 'IEC 61009-1 scope (from memory)' },
  'fuse:gG': { max_v: 1000, against: 'line', source: 'IEC 60269-2 scope (from memory)' },
  'fuse:bs88-3': { max_v: 240, against: 'line', source: 'BS 88-3 rated voltage 240 V a.c. (from memory)' },
  'fuse:bs3036': { max_v: 240, against: 'earth', source: 'BS 3036, 240 V to earth (from memory)' },
};
