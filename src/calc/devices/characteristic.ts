// A device's characteristic: its two edges and the standard they come from.
import type { Edge } from './curve.js';

export interface Characteristic {
  /** the slowest permitted operating time at each current: what verification relies on */
  slowest: Edge;
  /** the fastest, where the standard gives one: the other side of the band drawn in a snippet */
  fastest: Edge | null;
  /** the standard (and data) the edges come from */
  source: string;
}
