// Source: packsmith CONTRACT.md — the device codes of circuits.csv and the standard each names.
// mcb: IEC 60898-1; rcbo: IEC 61009-1; fuse:gG: IEC 60269-2 (BS 88-2); fuse:bs88-3: BS 88-3;
// fuse:bs3036: BS 3036 semi-enclosed rewireable.

export const DEVICE_CODES = [
  'mcb:B', 'mcb:C', 'mcb:D',
  'rcbo:B', 'rcbo:C', 'rcbo:D',
  'fuse:gG', 'fuse:bs88-3', 'fuse:bs3036',
] as const;

export type DeviceCode = (typeof DEVICE_CODES)[number];

export const DEVICE_STANDARD: Record<DeviceCode, string> = {
  'mcb:B': 'IEC 60898-1', 'mcb:C': 'IEC 60898-1', 'mcb:D': 'IEC 60898-1',
  'rcbo:B': 'IEC 61009-1', 'rcbo:C': 'IEC 61009-1', 'rcbo:D': 'IEC 61009-1',
  'fuse:gG': 'IEC 60269-2', 'fuse:bs88-3': 'BS 88-3', 'fuse:bs3036': 'BS 3036',
};
