// The filter representation used everywhere in shiftload: second-order sections (scipy's `sos`).
// Transfer-function form (b, a) is numerically fragile from order 4 on; sections are not.
import { concatFloat64 } from './concat-float64.js';

/**
 * Second-order sections: a Float64Array of n × 6 numbers, one row per section,
 * `[b0, b1, b2, a0, a1, a2]` with a0 = 1. The cascade's transfer function is the product of
 * `(b0 + b1 z⁻¹ + b2 z⁻²) / (a0 + a1 z⁻¹ + a2 z⁻²)` over the rows. A first-order section has
 * b2 = a2 = 0. Same layout and meaning as scipy.signal's `sos` arrays (rows flattened).
 */
export type Sos = Float64Array;

/** Number of sections in an Sos array (length / 6). */
export function sosSections(sos: Sos): number {
  return (sos.length / 6) | 0;
}

/** Join several cascades into one (the filters are applied one after the other). */
export function sosConcat(...parts: Sos[]): Sos {
  return concatFloat64(parts);
}
