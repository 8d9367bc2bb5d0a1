// The trend of one time window (a block or a task segment): least-squares slopes of amplitude and
// MNF against time over the window's active epochs, their confidence intervals, and the JASA category.
import { linearRegression } from '../stats/linear-regression.js';
import { jasaCategory, type JasaCategory } from './jasa.js';

/** Epoch values of one channel, time-ordered (all arrays the same length). */
export interface EpochValues {
  /** Epoch centre, s from the recording start (ascending). */
  t_s: ArrayLike<number>;
  /** Amplitude in the normalized unit (or µV); NaN when unknown. */
  amplitude: ArrayLike<number>;
  /** Mean power frequency, Hz. */
  mnf_hz: ArrayLike<number>;
  /** Median frequency, Hz. */
  mdf_hz: ArrayLike<number>;
  /** 1 for an active epoch (enters the trends), 0 otherwise. */
  active: ArrayLike<number>;
}

export interface FatigueTrendOptions {
  /** Fewest active epochs with a finite MNF for a trend. @default 30 */
  min_epochs?: number;
  /** Confidence level of the slope intervals. @default 0.95 */
  confidence?: number;
}

export interface FatigueTrend {
  /** Active epochs whose centre lies in [start_s, end_s) with a finite MNF. */
  epochs: number;
  /** All epochs whose centre lies in the window. */
  epochs_total: number;
  amplitude_mean: number;
  /** Amplitude slope, amplitude unit per minute, with its interval. NaN when not computable. */
  amplitude_slope_per_min: number;
  amplitude_ci_low: number;
  amplitude_ci_high: number;
  mnf_mean_hz: number;
  mnf_slope_hz_per_min: number;
  mnf_ci_low: number;
  mnf_ci_high: number;
  mdf_mean_hz: number;
  mdf_slope_hz_per_min: number;
  category: JasaCategory;
}

/** First index i with t[i] ≥ v (t ascending). */
function lowerBound(t: ArrayLike<number>, v: number): number {
  let lo = 0, hi = t.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (t[mid]! < v) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * Trends of amplitude and MNF over the epochs centred in [start_s, end_s): ordinary least squares
 * against time in minutes, intervals slope ± t_{(1+conf)/2, n−2}·SE (linearRegression), JASA
 * category from the two intervals (jasaCategory). Fewer than min_epochs usable epochs →
 * 'insufficient-data' (slopes still given when n ≥ 3). The amplitude uses the same epochs as MNF
 * (active, finite MNF); a NaN amplitude (no reference) leaves its trend NaN and the category
 * 'insufficient-data'.
 * @example fatigueTrend(epochs, 0, 600).category // 'fatigue' for amplitude 5 + 0.5·t, MNF 80 − 0.8·t
 * Source: METHODS.md §6 (trend computation, FROM MEMORY, design); Luttmann et al. 2000 (JASA).
 */
export function fatigueTrend(v: EpochValues, start_s: number, end_s: number, options: FatigueTrendOptions = {}): FatigueTrend {
  const minEpochs = options.min_epochs ?? 30;
  const i0 = lowerBound(v.t_s, start_s), i1 = lowerBound(v.t_s, end_s);
  const m = Math.max(0, i1 - i0);
  const t = new Float64Array(m), a = new Float64Array(m), f = new Float64Array(m), d = new Float64Array(m);
  let n = 0, na = 0;
  for (let i = i0; i < i1; i++) {
    const mnf = v.mnf_hz[i]!;
    if (v.active[i] !== 1 || !Number.isFinite(mnf)) continue;
    t[n] = v.t_s[i]! / 60;
    a[n] = v.amplitude[i]!;
    if (Number.isFinite(a[n]!)) na++;
    f[n] = mnf;
    d[n] = v.mdf_hz[i]!;
    n++;
  }
  const tt = t.subarray(0, n);
  const conf = { confidence: options.confidence ?? 0.95 };
  const ra = linearRegression(tt, a.subarray(0, n), conf);
  const rf = linearRegression(tt, f.subarray(0, n), conf);
  const rd = linearRegression(tt, d.subarray(0, n), conf);
  const enough = n >= minEpochs && na === n;
  return {
    epochs: n,
    epochs_total: m,
    amplitude_mean: ra.mean_y,
    amplitude_slope_per_min: ra.slope,
    amplitude_ci_low: ra.slope_ci_low,
    amplitude_ci_high: ra.slope_ci_high,
    mnf_mean_hz: rf.mean_y,
    mnf_slope_hz_per_min: rf.slope,
    mnf_ci_low: rf.slope_ci_low,
    mnf_ci_high: rf.slope_ci_high,
    mdf_mean_hz: rd.mean_y,
    mdf_slope_hz_per_min: rd.slope,
    category: enough
      ? jasaCategory({ low: ra.slope_ci_low, high: ra.slope_ci_high }, { low: rf.slope_ci_low, high: rf.slope_ci_high })
      : 'insufficient-data',
  };
}
