// Percentile with linear interpolation between order statistics (numpy.percentile's default,
// Hyndman & Fan 1996 type 7). Local to lib/sim so the designed truth does not depend on the
// analysis code it is used to check; lib/exposure has the analysis' own implementation.

/**
 * The p-th percentile (0–100) of `values[start..end)`, numpy "linear" convention.
 * Does not modify `values` (sorts a copy). Returns NaN for an empty range.
 * @example linearPercentile(Float64Array.of(1, 2, 3, 4), 50) // 2.5
 */
export function linearPercentile(values: Float64Array, p: number, start = 0, end = values.length): number {
  const n = end - start;
  if (n <= 0) return NaN;
  const s = values.slice(start, end).sort();
  const h = ((n - 1) * p) / 100;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  return s[lo] + (h - lo) * (s[hi] - s[lo]);
}
