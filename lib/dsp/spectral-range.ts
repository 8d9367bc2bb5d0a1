// Bin selection shared by meanFrequency and medianFrequency: bins with fminHz ≤ f ≤ fmaxHz.
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';

export interface SpectralRangeOptions {
  /** Lowest bin frequency included, Hz (inclusive). @default 0 */
  fminHz?: number;
  /** Highest bin frequency included, Hz (inclusive). @default Infinity */
  fmaxHz?: number;
}

/** [first, end) bin indices of f (ascending) within [fminHz, fmaxHz]. */
export function spectralRange(f: ArrayLike<number>, p: ArrayLike<number>, o: SpectralRangeOptions): [number, number] {
  if (f.length !== p.length) throw new UsageError(dspMsg.spectrumLength(f.length, p.length));
  const lo = o.fminHz ?? 0, hi = o.fmaxHz ?? Infinity;
  if (!(lo < hi)) throw new UsageError(dspMsg.frequencyRange(lo, hi));
  let a = 0;
  while (a < f.length && f[a] < lo) a++;
  let b = a;
  while (b < f.length && f[b] <= hi) b++;
  return [a, b];
}
