// Point 5: a separate protective conductor is at least 2.5 mm² copper where mechanically
// protected, 4 mm² where not (IEC 60364-5-54 / BS 7671, 543.1.3). Before, a 1.5 mm² separate cpc passed.
import { describe, expect, it } from 'vitest';
import { cpcSize } from '../../src/calc/checks/cpc-size.js';
import { context } from '../helpers/context.js';

const cpc = (c: Record<string, string>) => cpcSize(context({ cpc_in_cable: 'no', ...c }));

describe('cpc-size (543.1.3)', () => {
  it('fails 1.5 mm² and 2.5 mm² unprotected; passes 4 mm²', () => {
    expect(cpc({ cpc_mm2: '1.5' }).status).toBe('fail');
    expect(cpc({ cpc_mm2: '2.5' })).toMatchObject({ status: 'fail', limit: 4 });
    expect(cpc({ cpc_mm2: '4' }).status).toBe('pass');
  });
  it('passes 2.5 mm² where mechanically protected, naming the clause', () => {
    const r = cpc({ cpc_mm2: '2.5', cpc_protected: 'yes' });
    expect(r).toMatchObject({ status: 'pass', limit: 2.5 });
    expect(r.basis).toMatch(/543\.1\.3/);
  });
  it('is n/a for a cpc that is a core of the cable', () => {
    expect(cpcSize(context({ cpc_mm2: '1.0' })).status).toBe('n/a');
  });
});
