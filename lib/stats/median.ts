// Median of a sample, NaN ignored (the 50th percentile, same convention as everywhere).

import { percentileSorted, sortedValid } from '../exposure/percentile.js';

/**
 * Median of the non-NaN values (mean of the two middle values for even n).
 *
 * @param values sample
 * @returns the median; NaN when no value is finite
 * @example median([3, 1, 2, 10]) // 2.5
 */
export function median(values: ArrayLike<number>): number {
  return percentileSorted(sortedValid(values), 50);
}
