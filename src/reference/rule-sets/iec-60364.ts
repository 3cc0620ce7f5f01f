// Source: IEC 60364-4-41:2017, 411.3.2.2 (Table 41.1 applies to final circuits up to 63 A with
// socket-outlets and up to 32 A supplying only fixed equipment), 411.3.3 (additional protection
// by a 30 mA RCD for socket-outlets up to 32 A and mobile equipment up to 32 A used outdoors);
// IEC 60909-0 Table 1 (Cmin 0.95 for LV fault currents); IEC 60364-5-52 Table G.52.1 (voltage drop
// 3 % lighting, 5 % other uses). The measured-Zs factor 0.8 and the R1+R2 tolerance are common
// practice (packsmith REFERENCE.md). The exemption for socket-outlets used under the supervision
// of skilled or instructed persons outside dwellings is the 411.3.3 exception, from memory.
import type { RuleSet } from './types.js';

export const IEC_60364: RuleSet = {
  id: 'iec-60364',
  name: 'IEC 60364',
  source: 'IEC 60364-4-41:2017, IEC 60364-5-52 Annex G, IEC 60364-5-54, IEC 60364-6, IEC 60909-0',
  cmin: 0.95,
  measured_zs_factor: 0.8,
  vd_lighting_percent: 3,
  vd_other_percent: 5,
  final_socket_limit_a: 63,
  final_fixed_limit_a: 32,
  r1r2_tolerance_percent: 25,
  r1r2_tolerance_ohm: 0.05,
  final_circuit_clause: 'IEC 60364-4-41, 411.3.2.2',
  additional_protection: {
    sockets_upto_a: 32,
    outdoor_upto_a: 32,
    luminaires_in_dwellings: false,
    concealed_cables: false,
    max_ma: 30,
    socket_exemption_outside_dwellings: true,
    clauses: {
      sockets: 'IEC 60364-4-41, 411.3.3',
      outdoor: 'IEC 60364-4-41, 411.3.3',
      luminaires: 'IEC 60364-4-41, 411.3.3',
      concealed: 'IEC 60364-5-52, 522.6',
      exemption: 'IEC 60364-4-41, 411.3.3 exception (from memory)',
    },
  },
};
