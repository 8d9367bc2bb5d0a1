// Largest value of a series ignoring NaN: the MVE is the maximum of a moving-RMS series of the
// reference contractions (common practice, no single source; METHODS.md §3.2).

/**
 * Maximum of the non-NaN values.
 *
 * @param series e.g. a moving-RMS envelope (µV) of the MVC trials
 * @returns the maximum; NaN when no value is finite
 * @example maxValue(Float64Array.of(1, NaN, 3)) // 3
 */
export function maxValue(series: ArrayLike<number>): number {
  let m = -Infinity;
  let any = false;
  for (let i = 0; i < series.length; i++) {
    const v = series[i]!;
    if (v === v) { any = true; if (v > m) m = v; }
  }
  return any ? m : NaN;
}
