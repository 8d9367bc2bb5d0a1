// Percentiles of an envelope with numpy's default convention ('linear', Hyndman & Fan 1996
// definition 7), ignoring NaN. One sort of a copy serves any number of probability levels.

import { UsageError } from '../errors.js';
import { exposureMsg } from '../messages.js';

/** Ascending copy of the finite (non-NaN) values; the input is not changed. */
export function sortedValid(values: ArrayLike<number>): Float64Array {
  let n = 0;
  for (let i = 0; i < values.length; i++) if (!Number.isNaN(values[i]!)) n++;
  const out = new Float64Array(n);
  let j = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (!Number.isNaN(v)) out[j++] = v;
  }
  return out.sort();
}

/**
 * Like sortedValid, but exact only where percentiles at `qs` read it: a Float64Array of the
 * count of non-NaN values whose entries at the ranks used by percentileSorted(·, q) for each q
 * (⌊h⌋ and ⌊h⌋ + 1, h = q/100·(n − 1)) are the true order statistics; every other entry is
 * unspecified. Linear time instead of a sort: values are counted into value-ordered buckets, and
 * only the buckets holding a needed rank are gathered and sorted. (An 8-hour envelope has over
 * half a million values per channel and row; its APDF needs about 200 ranks.)
 * @param qs probability levels in percent the result will be read at (0…100)
 * @example percentileSorted(rankedValid(env, [10, 50, 90]), 90) === percentileSorted(sortedValid(env), 90)
 */
export function rankedValid(values: ArrayLike<number>, qs: readonly number[]): Float64Array {
  let n = 0, min = Infinity, max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (v !== v) continue;
    n++;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const span = max - min;
  if (n <= 4096 || !(span > 0 && Number.isFinite(span))) return sortedValid(values);
  const B = Math.min(1 << 16, n >> 2);
  const scale = B / span;
  const bucketOf = (v: number) => Math.min(B - 1, Math.floor((v - min) * scale)); // monotone in v
  const start = new Int32Array(B + 1);
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (v === v) start[Math.min(B - 1, Math.floor((v - min) * scale)) + 1]!++;
  }
  for (let b = 0; b < B; b++) start[b + 1]! += start[b]!;
  // buckets holding a needed rank
  const needed = new Uint8Array(B);
  const findBucket = (r: number) => {
    let lo = 0, hi = B - 1; // start[lo] ≤ r < start[hi + 1]
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (start[mid]! <= r) lo = mid; else hi = mid - 1;
    }
    return lo;
  };
  for (const q of qs) {
    checkQ(q);
    const lo = Math.floor((q / 100) * (n - 1));
    needed[findBucket(Math.min(lo, n - 1))] = 1;
    needed[findBucket(Math.min(lo + 1, n - 1))] = 1;
  }
  const out = new Float64Array(n);
  const cursor = start.slice(0, B);
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (v !== v) continue;
    const b = bucketOf(v);
    if (needed[b] === 1) out[cursor[b]!++] = v;
  }
  for (let b = 0; b < B; b++) if (needed[b] === 1 && start[b + 1]! - start[b]! > 1) out.subarray(start[b]!, start[b + 1]!).sort();
  return out;
}

function checkQ(q: number): void {
  if (!(q >= 0 && q <= 100)) throw new UsageError(exposureMsg.percentileOutOfRange(q));
}

/**
 * Percentile of values that are already sorted ascending and free of NaN (type 7).
 *
 * h = (q/100)·(n − 1); result = v[⌊h⌋] + (h − ⌊h⌋)·(v[⌊h⌋+1] − v[⌊h⌋]), with numpy's two-sided
 * linear interpolation so results agree with numpy.percentile to the last bits.
 *
 * @param sorted ascending values without NaN
 * @param q probability level in percent, 0…100
 * @returns the percentile, NaN when `sorted` is empty
 * @throws UsageError when q is outside 0…100
 * @example percentileSorted(Float64Array.of(1, 2, 3, 4), 50) // 2.5
 */
export function percentileSorted(sorted: ArrayLike<number>, q: number): number {
  checkQ(q);
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (q / 100) * (n - 1);
  const lo = Math.floor(h);
  if (lo >= n - 1) return sorted[n - 1]!;
  const t = h - lo;
  const a = sorted[lo]!;
  const b = sorted[lo + 1]!;
  // numpy's _lerp: a + (b − a)·t, evaluated from the nearer end when t ≥ 0.5.
  const d = b - a;
  return t >= 0.5 ? b - d * (1 - t) : a + d * t;
}

/**
 * Several percentiles of the non-NaN values, sorting one copy once.
 *
 * Convention: numpy.percentile default 'linear' (Hyndman & Fan 1996, definition 7).
 * Hyndman RJ, Fan Y. 1996. Sample quantiles in statistical packages. Am Stat 50(4):361–365.
 *
 * @param values envelope values (e.g. %MVE); NaN = invalid time, ignored
 * @param qs probability levels in percent, each 0…100
 * @returns one value per q; NaN for every q when no value is finite
 * @throws UsageError when a q is outside 0…100
 * @example percentiles([1,2,3,4,5,6,7,8,9,10], [10, 50, 90]) // [1.9, 5.5, 9.1]
 */
export function percentiles(values: ArrayLike<number>, qs: readonly number[]): number[] {
  for (const q of qs) checkQ(q);
  const s = sortedValid(values);
  return qs.map((q) => percentileSorted(s, q));
}

/**
 * One percentile of the non-NaN values (numpy default 'linear', type 7).
 *
 * @param values envelope values; NaN ignored
 * @param q probability level in percent, 0…100
 * @returns the percentile, NaN when no value is finite
 * @throws UsageError when q is outside 0…100
 * @example percentile([1,2,3,4,5,6,7,8,9,10], 90) // 9.1
 */
export function percentile(values: ArrayLike<number>, q: number): number {
  return percentiles(values, [q])[0]!;
}
