// Median frequency of a spectrum, MDF, with an explicit convention.
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { spectralRange, type SpectralRangeOptions } from './spectral-range.js';

export interface MedianFrequencyOptions extends SpectralRangeOptions {
  /**
   * 'bin': f_k of the first bin whose cumulative power C_k reaches half of the total;
   * 'interp': linear interpolation of C between f_{k−1} and f_k for that k (f_k itself if k is
   * the first bin). @default 'interp'
   */
  convention?: 'bin' | 'interp';
}

/**
 * MDF: the frequency that splits the power in the range [fminHz, fmaxHz] in two halves.
 * @returns Hz; NaN when the range holds no power
 * @example medianFrequency([50, 150], [1, 3], { convention: 'bin' }) // 150
 * Source: Phinyomark A et al. (2012) (METHODS.md §7); conventions as shared/fixtures/dsp/welch_psd.json.
 */
export function medianFrequency(f: ArrayLike<number>, p: ArrayLike<number>, options: MedianFrequencyOptions = {}): number {
  const convention = options.convention ?? 'interp';
  if (convention !== 'bin' && convention !== 'interp') throw new UsageError(dspMsg.medianConvention(String(convention)));
  const [a, b] = spectralRange(f, p, options);
  let total = 0;
  for (let k = a; k < b; k++) total += p[k];
  if (!(total > 0)) return NaN;
  const half = 0.5 * total;
  let c = 0;
  for (let k = a; k < b; k++) {
    const prev = c;
    c += p[k];
    if (c >= half) {
      if (convention === 'bin' || k === a) return f[k];
      return f[k - 1] + ((half - prev) / (c - prev)) * (f[k] - f[k - 1]);
    }
  }
  return f[b - 1];
}
