// EMG gaps and muscular rest of a normalized envelope slice (Veiersted et al. 1990, gap concept;
// Nordander et al. 2000 and Hansson et al. 2000, muscular rest and gap frequency).

import { checkFinite, checkNonNegative, checkRate } from './check-parameters.js';
import { DEFAULTS } from './defaults.js';

export interface RestGapsOptions {
  /** Envelope rate in Hz (required; no default). */
  rate_hz: number;
  /** Threshold in the envelope's unit; a sample is "below" when value < threshold. @default 0.5 (%MVE) */
  threshold?: number;
  /** Minimum gap duration in s, inclusive (≥ min − 1e-9 s). @default 0.2 */
  min_gap_s?: number;
  /** Maximum gap duration in s, inclusive; null = no upper bound. @default null */
  max_gap_s?: number | null;
  /** Rest = all below-threshold time ('all') or only runs ≥ min_gap_s ('gaps-only'). @default 'all' */
  rest_counts?: 'all' | 'gaps-only';
}

export interface RestGapsResult {
  /** Valid (non-NaN) time, s. */
  valid_s: number;
  /** Excluded (NaN) time, s. */
  excluded_s: number;
  /** Number of EMG gaps. */
  gaps: number;
  /** Gaps per minute of valid time; null when valid_s = 0. */
  gaps_per_min: number | null;
  /** Total duration of the gaps, s. */
  gap_s: number;
  /** Mean gap duration, s; null when there is no gap. */
  mean_gap_s: number | null;
  /** All valid time below the threshold, s (runs of any length). */
  below_s: number;
  /** Time counted as muscular rest under `rest_counts`, s. */
  rest_s: number;
  /** Muscular rest, % of valid time; null when valid_s = 0. */
  rest_pct: number | null;
  /** Longest stretch of valid time without a gap, s; null when valid_s = 0. */
  longest_without_gap_s: number | null;
}

/**
 * EMG gaps, gap frequency, muscular rest and the longest time without a gap.
 *
 * - A gap is an uninterrupted run of samples with value < threshold whose duration
 *   (samples / rate_hz) is ≥ min_gap_s − 1e-9 (and ≤ max_gap_s + 1e-9 when max_gap_s is set).
 * - NaN is invalid time: not counted in valid_s and it breaks every run.
 * - Runs touching the slice start or end are truncated there and counted as they lie inside the
 *   slice (a gap cut by a segment boundary may fall below min_gap_s in both segments).
 * - Muscular rest: 'all' counts every below-threshold sample; 'gaps-only' counts runs lasting
 *   ≥ min_gap_s (the max_gap_s bound only limits gap counting, not rest).
 * - Longest without a gap: the longest run of valid samples not inside a gap; a stretch ends at
 *   the start of a gap, at a NaN sample (we do not know what happened in excluded time, so
 *   excluded time never lengthens a stretch) and at the slice ends. Runs longer than max_gap_s
 *   are not gaps and therefore belong to a stretch.
 *
 * Citations: Veiersted KB, Westgaard RH, Andersen P 1990, Int Arch Occup Environ Health 62:31–41
 * (gaps of 0.2–2 s); Nordander C et al. 2000, Ergonomics 43:1904–1919 (muscular rest).
 *
 * @param envelope normalized envelope (e.g. %MVE); NaN = invalid
 * @param options see RestGapsOptions; rate_hz required
 * @throws UsageError for a non-positive rate or negative durations
 * @example restGaps(env, { rate_hz: 10, threshold: 0.5, min_gap_s: 0.2 }).gaps_per_min
 */
export function restGaps(envelope: ArrayLike<number>, options: RestGapsOptions): RestGapsResult {
  const rate = options.rate_hz;
  checkRate(rate);
  const threshold = options.threshold ?? DEFAULTS.gap_threshold;
  checkFinite('threshold', threshold);
  const minGap = options.min_gap_s ?? DEFAULTS.min_gap_s;
  checkNonNegative('min_gap_s', minGap);
  const maxGap = options.max_gap_s === undefined ? DEFAULTS.max_gap_s : options.max_gap_s;
  if (maxGap !== null) checkNonNegative('max_gap_s', maxGap);
  const restCounts = options.rest_counts ?? DEFAULTS.rest_counts;
  const tol = DEFAULTS.duration_tolerance_s;
  const minLo = minGap - tol;
  const maxHi = maxGap === null ? Infinity : maxGap + tol;

  const n = envelope.length;
  let valid = 0;
  let below = 0;
  let longRuns = 0; // samples in runs ≥ min (for rest 'gaps-only')
  let gaps = 0;
  let gapSamples = 0;
  let run = 0; // current below-threshold run, samples
  let stretch = 0; // current stretch without a gap, samples (excluding the pending run)
  let longest = 0;

  for (let i = 0; i <= n; i++) {
    const v = i < n ? envelope[i]! : NaN;
    const isNaN = v !== v;
    if (!isNaN && v < threshold) {
      run++;
      valid++;
      continue;
    }
    if (run > 0) {
      // close the pending below-threshold run
      below += run;
      const dur = run / rate;
      if (dur >= minLo) {
        longRuns += run;
        if (dur <= maxHi) {
          gaps++;
          gapSamples += run;
          if (stretch > longest) longest = stretch;
          stretch = 0;
        } else {
          stretch += run;
        }
      } else {
        stretch += run;
      }
      run = 0;
    }
    if (isNaN) {
      if (stretch > longest) longest = stretch;
      stretch = 0;
    } else {
      valid++;
      stretch++;
    }
  }

  const valid_s = valid / rate;
  const rest = restCounts === 'all' ? below : longRuns;
  return {
    valid_s,
    excluded_s: (n - valid) / rate,
    gaps,
    gaps_per_min: valid > 0 ? gaps / (valid_s / 60) : null,
    gap_s: gapSamples / rate,
    mean_gap_s: gaps > 0 ? gapSamples / rate / gaps : null,
    below_s: below / rate,
    rest_s: rest / rate,
    rest_pct: valid > 0 ? (100 * rest) / valid : null,
    longest_without_gap_s: valid > 0 ? longest / rate : null,
  };
}
