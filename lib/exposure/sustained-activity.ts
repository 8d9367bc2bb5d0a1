// Sustained low-level muscle activity: time in uninterrupted runs at or above a threshold that
// last longer than a minimum duration (Hanvold et al. 2013: > 0.5 %EMGmax for > 4 min), with
// optional SULMA-style counts per duration interval (Östensvik et al. 2009; edges configurable).

import { checkEdges, checkFinite, checkNonNegative, checkRate } from './check-parameters.js';
import { DEFAULTS } from './defaults.js';

export interface SustainedActivityOptions {
  /** Envelope rate in Hz (required). */
  rate_hz: number;
  /** Activity threshold in the envelope's unit; active when value ≥ threshold. @default 0.5 (%MVE) */
  threshold?: number;
  /** Runs must last longer than this, s (> min + 1e-9). @default 240 (Hanvold 2013) */
  min_duration_s?: number;
  /**
   * Optional duration interval edges in s for counting active runs (SULMA-style); intervals are
   * [lo, hi), the last open above; runs shorter than the first edge are not counted.
   * The published SULMA edges were not found (METHODS.md §2.3), so there is no default.
   * @default null (no interval counts)
   */
  interval_edges_s?: readonly number[] | null;
}

export interface SustainedActivityResult {
  valid_s: number;
  /** Time in runs ≥ threshold lasting longer than min_duration_s, s. */
  sustained_s: number;
  /** sustained_s as % of valid time; null when valid_s = 0. */
  sustained_pct: number | null;
  /** Number of such sustained runs. */
  sustained_runs: number;
  /** Longest uninterrupted active run, s. */
  longest_active_s: number;
  /** Per interval of interval_edges_s: number of active runs and their time in s (null when no edges). */
  intervals: { lo_s: number; hi_s: number | null; count: number; time_s: number }[] | null;
}

/**
 * Percentage of valid time spent in sustained activity (and optional run counts per interval).
 *
 * A run is an uninterrupted sequence of valid samples with value ≥ threshold; NaN ends a run and
 * is not valid time; runs at the slice ends are truncated there. Duration = samples / rate_hz.
 *
 * Citations: Hanvold TN et al. 2013, Scand J Work Environ Health 39(4):390–400 (FOUND);
 * Östensvik T, Veiersted KB, Nilsen P 2009, J Electromyogr Kinesiol 19(2):283–294 (FOUND).
 *
 * @param envelope normalized envelope; NaN = invalid
 * @throws UsageError for a bad rate, duration or interval edges
 * @example sustainedActivity(env, { rate_hz: 20, threshold: 0.5, min_duration_s: 240 }).sustained_pct
 */
export function sustainedActivity(envelope: ArrayLike<number>, options: SustainedActivityOptions): SustainedActivityResult {
  const rate = options.rate_hz;
  checkRate(rate);
  const threshold = options.threshold ?? DEFAULTS.sustained_threshold;
  checkFinite('threshold', threshold);
  const minDur = options.min_duration_s ?? DEFAULTS.sustained_min_s;
  checkNonNegative('min_duration_s', minDur);
  const edges = options.interval_edges_s ?? null;
  if (edges !== null) checkEdges('interval_edges_s', edges);
  const tol = DEFAULTS.duration_tolerance_s;
  const counts = edges === null ? null : new Float64Array(edges.length);
  const times = edges === null ? null : new Float64Array(edges.length);

  const n = envelope.length;
  let valid = 0;
  let run = 0;
  let sustained = 0;
  let runs = 0;
  let longest = 0;
  for (let i = 0; i <= n; i++) {
    const v = i < n ? envelope[i]! : NaN;
    if (v === v) valid++;
    if (v >= threshold) { run++; continue; }
    if (run > 0) {
      const dur = run / rate;
      if (dur > minDur + tol) { sustained += run; runs++; }
      if (run > longest) longest = run;
      if (edges !== null) {
        let k = -1;
        while (k + 1 < edges.length && dur >= edges[k + 1]! - tol) k++;
        if (k >= 0) { counts![k] = counts![k]! + 1; times![k] = times![k]! + dur; }
      }
      run = 0;
    }
  }
  const valid_s = valid / rate;
  return {
    valid_s,
    sustained_s: sustained / rate,
    sustained_pct: valid > 0 ? (100 * sustained) / valid : null,
    sustained_runs: runs,
    longest_active_s: longest / rate,
    intervals: edges === null ? null : edges.map((lo, k) => ({
      lo_s: lo,
      hi_s: k + 1 < edges.length ? edges[k + 1]! : null,
      count: counts![k]!,
      time_s: times![k]!,
    })),
  };
}
