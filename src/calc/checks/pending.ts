// Checks whose assessment is not in packsmith yet. They say so and stay not-verified: never a pass.
import type { Check, CheckId } from '../types.js';
import { notVerified } from './result.js';

export const pending = (id: CheckId, what: string): Check => () =>
  notVerified(id, `${what}: not yet assessed by packsmith; verify by hand`);
