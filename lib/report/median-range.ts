// Median with range across workers: the summary the report prints for a group.

export interface MedianRange { median: number; min: number; max: number; n: number }

/**
 * Median (mean of the two middle values for even n, which equals the type-7 percentile at 50 %),
 * minimum and maximum of the finite values; null when there are none.
 * @example medianRange([3, 1, 2]) // { median: 2, min: 1, max: 3, n: 3 }
 */
export function medianRange(values: readonly (number | null | undefined)[]): MedianRange | null {
  const v = values.filter((x): x is number => typeof x === 'number' && Number.isFinite(x)).sort((a, b) => a - b);
  if (v.length === 0) return null;
  const m = v.length >> 1;
  const median = v.length % 2 ? v[m] : (v[m - 1] + v[m]) / 2;
  return { median, min: v[0], max: v[v.length - 1], n: v.length };
}
