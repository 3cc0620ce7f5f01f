// Polarity: every single-pole device in the line conductor, as recorded by the tester
// (IEC 60364-6, 6.4.3.6; BS 7671 643.6 — clause numbers from memory).
import type { Check } from '../types.js';
import { notVerified, reasonFor, result } from './result.js';

export const polarity: Check = ({ readings }) => {
  const m = readings.polarity;
  if (!m) return notVerified('polarity', 'no polarity result recorded in any test session');
  switch (m.value) {
    case 'ok': return result('polarity', 'pass', `polarity confirmed correct on ${m.date}: single-pole devices in the line conductor (IEC 60364-6, 6.4.3.6)`, { date: m.date });
    case 'fail': return result('polarity', 'fail', `polarity found incorrect on ${m.date}`, { date: m.date });
    case 'n/a': {
      const reason = reasonFor(readings.notes, m);
      return reason !== undefined
        ? result('polarity', 'n/a', `polarity marked n/a on ${m.date}: ${reason}`, { date: m.date })
        : result('polarity', 'not-verified', `polarity marked n/a on ${m.date} with no reason in that session's notes`, { date: m.date });
    }
    default: return result('polarity', 'not-verified', `polarity marked not tested on ${m.date}`, { date: m.date });
  }
};
