// Causal filtering of a whole array through second-order sections (scipy.signal.sosfilt).
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { checkSos } from './check-sos.js';
import type { Sos } from './sos.js';
import { sosfiltInPlace } from './sosfilt-in-place.js';

/**
 * Filter `x` through the cascade (transposed direct form II per section, as scipy).
 * @param sos second-order sections
 * @param x input samples (not modified)
 * @param zi initial state, 2 values per section (default zeros); not modified
 * @returns new Float64Array y, same length as x
 * @throws UsageError when sos or zi have the wrong shape
 * @example sosfilt(butter(4, 10, { fs: 1000 }), x)
 * Source: SciPy 1.17 sosfilt.
 */
export function sosfilt(sos: Sos, x: ArrayLike<number>, zi?: ArrayLike<number>): Float64Array {
  const n = checkSos(sos);
  const state = new Float64Array(2 * n);
  if (zi) {
    if (zi.length !== 2 * n) throw new UsageError(dspMsg.ziLength(2 * n, zi.length));
    state.set(zi);
  }
  const y = Float64Array.from(x);
  sosfiltInPlace(sos, state, y, 0, y.length);
  return y;
}
