// Mean of a series ignoring NaN: the RVE is the mean RMS over the stable part of the submaximal
// reference contraction (FROM MEMORY, METHODS.md §3.3).

/**
 * Mean of the non-NaN values.
 *
 * @param series e.g. a moving-RMS envelope (µV) over the stable part of an RVE hold
 * @returns the mean; NaN when no value is finite
 * @example meanValue(Float64Array.of(1, NaN, 3)) // 2
 */
export function meanValue(series: ArrayLike<number>): number {
  let s = 0;
  let n = 0;
  for (let i = 0; i < series.length; i++) {
    const v = series[i]!;
    if (v === v) { s += v; n++; }
  }
  return n > 0 ? s / n : NaN;
}
