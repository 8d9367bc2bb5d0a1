// Arithmetic mean of a sample, NaN ignored.

/**
 * Mean of the non-NaN values.
 *
 * @param values sample
 * @returns the mean; NaN when no value is finite
 * @example mean([1, 2, 6]) // 3
 */
export function mean(values: ArrayLike<number>): number {
  let s = 0;
  let n = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (v === v) { s += v; n++; }
  }
  return n > 0 ? s / n : NaN;
}
