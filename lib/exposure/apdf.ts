// APDF load levels of a normalized envelope: the percentiles of the envelope over valid time
// (Jonsson 1982, FROM MEMORY; 10/50/90th percentiles FOUND in Hansson 2009/2010, Nordander 2004).

import { DEFAULTS } from './defaults.js';
import { percentileSorted, sortedValid } from './percentile.js';

export interface ApdfOptions {
  /** Probability levels in percent. @default [10, 50, 90] (DEFAULTS.percentiles) */
  percentiles?: readonly number[];
  /** sortedValid(envelope) when the caller already has it, or rankedValid(envelope, levels including these). @default computed */
  sorted?: Float64Array;
}

export interface ApdfResult {
  /** The probability levels, in %. */
  q: number[];
  /** Load level per q, in the unit of the envelope; null when no valid sample. */
  levels: (number | null)[];
  /** The same levels keyed p<q> (p10, p50, p90), as in ResultRow. */
  byKey: Record<`p${number}`, number | null>;
  /** Number of valid (non-NaN) samples used. */
  valid_n: number;
}

/**
 * APDF load levels (static / median / peak = P10 / P50 / P90 by default) of an envelope slice.
 *
 * Every envelope sample weighs the same (uniform sampling), NaN samples are excluded; percentile
 * convention numpy 'linear' (type 7), see `percentiles`.
 *
 * @param envelope normalized envelope (e.g. %MVE) at a uniform rate; NaN = invalid
 * @param options.percentiles levels in % (@default [10, 50, 90])
 * @throws UsageError when a level is outside 0…100
 * @example apdf(Float64Array.of(1,2,3,4,5,6,7,8,9,10)).levels // [1.9, 5.5, 9.1]
 */
export function apdf(envelope: ArrayLike<number>, options: ApdfOptions = {}): ApdfResult {
  const q = [...(options.percentiles ?? DEFAULTS.percentiles)];
  const s = options.sorted ?? sortedValid(envelope);
  const levels = q.map((p) => {
    const v = percentileSorted(s, p);
    return Number.isNaN(v) ? null : v;
  });
  const byKey: Record<`p${number}`, number | null> = {};
  q.forEach((p, i) => { byKey[`p${p}`] = levels[i]!; });
  return { q, levels, byKey, valid_n: s.length };
}

/**
 * The APDF curve for charts: the envelope value at every percent 0, 1, …, 100.
 *
 * @param envelope normalized envelope; NaN ignored
 * @returns 101 values (index = percent); empty array when no valid sample
 * @example apdfCurve(Float64Array.of(0, 100))[25] // 25
 */
export function apdfCurve(envelope: ArrayLike<number>): number[] {
  return apdfCurveSorted(sortedValid(envelope));
}

/** The levels of the APDF curve, % (0, 1, …, 100). */
export const APDF_CURVE_LEVELS: readonly number[] = Object.freeze(Array.from({ length: 101 }, (_, p) => p));

/**
 * apdfCurve of values already sorted ascending and free of NaN (sortedValid's output, or
 * rankedValid's for APDF_CURVE_LEVELS).
 * @example apdfCurveSorted(sortedValid(env))
 */
export function apdfCurveSorted(s: Float64Array): number[] {
  if (s.length === 0) return [];
  const out: number[] = new Array(101);
  for (let p = 0; p <= 100; p++) out[p] = percentileSorted(s, APDF_CURVE_LEVELS[p]!);
  return out;
}
