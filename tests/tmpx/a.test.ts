import { it } from 'vitest';
import { projectJsonSchema, circuitsJsonSchema } from '../../src/docs/json-schema.js';
it('x', () => {
  const p = projectJsonSchema() as any;
  console.log(JSON.stringify(p.properties.supply.properties.u0_v), JSON.stringify(p.properties.supply.properties.phases));
  console.log(JSON.stringify((circuitsJsonSchema() as any).properties.cpc_in_cable), JSON.stringify((circuitsJsonSchema() as any).properties.grouped), JSON.stringify((circuitsJsonSchema() as any).required));
});
