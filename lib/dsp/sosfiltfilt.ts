// Zero-phase forward–backward filtering of a whole array (scipy.signal.sosfiltfilt, method 'pad').
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { checkSos } from './check-sos.js';
import type { Sos } from './sos.js';
import { sosfiltInPlace, sosfiltReverseInPlace } from './sosfilt-in-place.js';
import { sosfiltZi } from './sosfilt-zi.js';

export interface SosfiltfiltOptions {
  /** Edge extension: 'odd' (point-symmetric about the end samples) or 'none'. @default 'odd' */
  padtype?: 'odd' | 'none';
  /** Extension length in samples. @default scipy's rule, see defaultPadlen */
  padlen?: number;
}

/**
 * scipy's default padlen for sosfiltfilt: 3·(2·n + 1 − min(#sections with b2 = 0, #with a2 = 0)).
 * @example defaultPadlen(butter(4, [20, 450], { btype: 'bandpass', fs: 2000 })) // 27
 */
export function defaultPadlen(sos: Sos): number {
  const n = checkSos(sos);
  let zb = 0, za = 0;
  for (let s = 0; s < n; s++) {
    if (sos[s * 6 + 2] === 0) zb++;
    if (sos[s * 6 + 5] === 0) za++;
  }
  return 3 * (2 * n + 1 - Math.min(zb, za));
}

/**
 * Write the odd extension of x into ext: [2x₀ − x[padlen..1], x, 2x_{N−1} − x[N−2..N−1−padlen]].
 * ext.length must be N + 2·padlen.
 */
export function oddExtend(x: ArrayLike<number>, padlen: number, ext: Float64Array): void {
  const n = x.length;
  const x0 = x[0], xn = x[n - 1];
  for (let i = 0; i < padlen; i++) ext[i] = 2 * x0 - x[padlen - i];
  for (let i = 0; i < n; i++) ext[padlen + i] = x[i];
  for (let i = 0; i < padlen; i++) ext[padlen + n + i] = 2 * xn - x[n - 2 - i];
}

/**
 * Forward–backward (zero-phase) filter of a whole array: the result has zero phase and the
 * squared magnitude response of the cascade (−6.02 dB at a Butterworth cut-off). Initial states
 * are sosfilt_zi scaled by the first sample of each pass, as scipy.
 * @param x input (not modified); must be longer than padlen when padtype is 'odd'
 * @returns new Float64Array, same length as x
 * @throws UsageError when x is not longer than padlen
 * @example sosfiltfilt(butter(4, [20, 450], { btype: 'bandpass', fs: 2000 }), x)
 * Source: SciPy 1.17 sosfiltfilt (Gustafsson F, IEEE Trans Signal Process 1996;44(4):988–992).
 */
export function sosfiltfilt(sos: Sos, x: ArrayLike<number>, options: SosfiltfiltOptions = {}): Float64Array {
  const ns = checkSos(sos);
  const n = x.length;
  const padtype = options.padtype ?? 'odd';
  let edge = 0;
  if (padtype === 'odd') {
    edge = options.padlen ?? defaultPadlen(sos);
    if (!(Number.isInteger(edge) && edge >= 0)) throw new UsageError(dspMsg.padlenValue(edge));
    if (n <= edge) throw new UsageError(dspMsg.padlen(n, edge));
  }
  if (n === 0) return new Float64Array(0);
  const ext = new Float64Array(n + 2 * edge);
  oddExtend(x, edge, ext);
  const zi = sosfiltZi(sos);
  const state = new Float64Array(2 * ns);
  for (let i = 0; i < state.length; i++) state[i] = zi[i] * ext[0];
  sosfiltInPlace(sos, state, ext, 0, ext.length);
  const last = ext[ext.length - 1];
  for (let i = 0; i < state.length; i++) state[i] = zi[i] * last;
  sosfiltReverseInPlace(sos, state, ext, 0, ext.length);
  return ext.slice(edge, edge + n);
}
