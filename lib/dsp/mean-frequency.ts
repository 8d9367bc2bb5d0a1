// Mean (power) frequency of a spectrum, MNF.
import { spectralRange, type SpectralRangeOptions } from './spectral-range.js';

/**
 * MNF = Σ f_k·P_k / Σ P_k over the bins with fminHz ≤ f_k ≤ fmaxHz.
 * @param f bin frequencies, Hz (ascending)
 * @param p power spectral density at those bins
 * @returns Hz; NaN when the range holds no power
 * @example meanFrequency([50, 150], [1, 3]) // 125
 * Source: Phinyomark A et al. (2012), The usefulness of mean and median frequencies in
 * electromyography analysis, InTech (METHODS.md §7).
 */
export function meanFrequency(f: ArrayLike<number>, p: ArrayLike<number>, options: SpectralRangeOptions = {}): number {
  const [a, b] = spectralRange(f, p, options);
  let num = 0, den = 0;
  for (let k = a; k < b; k++) { num += f[k] * p[k]; den += p[k]; }
  return den > 0 ? num / den : NaN;
}
