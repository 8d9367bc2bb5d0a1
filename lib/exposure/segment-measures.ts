// All per-segment exposure measures of one normalized envelope slice in one call, with the
// field names of ResultRow (lib/study/results.ts). Composes the single measures only.

import { apdf } from './apdf.js';
import { DEFAULTS } from './defaults.js';
import { restGaps } from './rest-gaps.js';
import { sustainedActivity } from './sustained-activity.js';

export interface SegmentMeasuresOptions {
  /** Envelope rate in Hz (required). */
  rate_hz: number;
  /** sortedValid(envelope) when the caller already has it, or rankedValid(envelope, levels including these). @default computed */
  sorted?: Float64Array;
  /** APDF levels in %. @default [10, 50, 90] */
  percentiles?: readonly number[];
  /** Gap/rest threshold in the envelope's unit (convert with thresholdToRve for %RVE). @default 0.5 */
  gap_threshold?: number;
  /** @default 0.2 s */
  min_gap_s?: number;
  /** @default null (no upper bound) */
  max_gap_s?: number | null;
  /** @default 'all' */
  rest_counts?: 'all' | 'gaps-only';
  /** Sustained-activity threshold in the envelope's unit. @default 0.5 */
  sustained_threshold?: number;
  /** @default 240 s */
  sustained_min_s?: number;
}

/** The measure fields of a ResultRow. */
export interface SegmentMeasures {
  valid_s: number;
  levels: Record<`p${number}`, number | null>;
  gap_threshold: number;
  gaps: number;
  gaps_per_min: number | null;
  rest_pct: number | null;
  longest_without_gap_s: number | null;
  sustained_pct: number | null;
}

/**
 * APDF levels, EMG gaps, muscular rest, longest time without a gap and sustained activity of one
 * envelope slice (see apdf, restGaps, sustainedActivity for the rules and citations).
 *
 * @param envelope normalized envelope slice of one segment (NaN = excluded time)
 * @param options rate_hz required; every other option defaults to DEFAULTS
 * @throws UsageError for out-of-range parameters
 * @example const m = segmentMeasures(env.subarray(i0, i1), { rate_hz: 20 }); row = { ...ids, ...m.levels, ...rest }
 */
export function segmentMeasures(envelope: ArrayLike<number>, options: SegmentMeasuresOptions): SegmentMeasures {
  const gap_threshold = options.gap_threshold ?? DEFAULTS.gap_threshold;
  const a = apdf(envelope, { percentiles: options.percentiles ?? DEFAULTS.percentiles, sorted: options.sorted });
  const g = restGaps(envelope, {
    rate_hz: options.rate_hz, threshold: gap_threshold, min_gap_s: options.min_gap_s ?? DEFAULTS.min_gap_s,
    max_gap_s: options.max_gap_s === undefined ? DEFAULTS.max_gap_s : options.max_gap_s,
    rest_counts: options.rest_counts ?? DEFAULTS.rest_counts,
  });
  const s = sustainedActivity(envelope, {
    rate_hz: options.rate_hz, threshold: options.sustained_threshold ?? DEFAULTS.sustained_threshold,
    min_duration_s: options.sustained_min_s ?? DEFAULTS.sustained_min_s,
  });
  return {
    valid_s: g.valid_s,
    levels: a.byKey,
    gap_threshold,
    gaps: g.gaps,
    gaps_per_min: g.gaps_per_min,
    rest_pct: g.rest_pct,
    longest_without_gap_s: g.longest_without_gap_s,
    sustained_pct: s.sustained_pct,
  };
}
