// Source: BS 7671:2018 — 411.3.2.2 (Table 41.1 up to 63 A with socket-outlets, 32 A fixed
// equipment, as IEC 60364-4-41), 411.3.3 (30 mA RCD for socket-outlets up to 32 A and mobile
// equipment outdoors; omitted only other than in dwellings where a documented risk assessment
// finds it unnecessary), 411.3.4 (luminaires in dwellings), 522.6.202 / 522.6.203 (cables
// concealed less than 50 mm in walls or partitions), as quoted in packsmith REFERENCE.md. Every
// value this set does not give is IEC 60364's (rule-sets/iec-60364.ts).
import type { RuleSetData } from './types.js';

export const BS_7671: RuleSetData = {
  id: 'bs-7671',
  name: 'BS 7671',
  source: 'BS 7671:2018 (411.3.2.2, 411.3.3, 411.3.4, 522.6.202/203, 433.1.204, 543.1.3, 643.3), IEC 60364 elsewhere',
  final_circuit_clause: 'BS 7671, 411.3.2.2',
  additional_protection: {
    luminaires_in_dwellings: true,
    concealed_cables: true,
    socket_exemption_outside_dwellings: true,
    clauses: {
      sockets: 'BS 7671, 411.3.3',
      outdoor: 'BS 7671, 411.3.3',
      luminaires: 'BS 7671, 411.3.4',
      concealed: 'BS 7671, 522.6.202/203',
      exemption: 'BS 7671, 411.3.3 (documented risk assessment, other than in dwellings)',
    },
  },
};
