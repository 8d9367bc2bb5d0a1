// Reduce an envelope to a chart trace: one point per bin of `step_s` seconds, the bin's mean and
// maximum (NaN-free values only; a bin with no valid value is null).

export interface DecimatedTrace {
  step_s: number;
  mean: (number | null)[];
  max: (number | null)[];
}

/**
 * Choose a bin width giving at most `maxPoints` points: the smallest of 1, 2, 5, 10, 15, 30, 60,
 * 120, 300, 600 s that fits (the chart axis then reads in round numbers).
 */
export function traceStep(duration_s: number, maxPoints = 1500): number {
  for (const s of [1, 2, 5, 10, 15, 30, 60, 120, 300, 600]) if (duration_s / s <= maxPoints) return s;
  return Math.ceil(duration_s / maxPoints / 600) * 600;
}

/**
 * Bin an envelope sampled at `rate_hz` into `step_s` bins.
 * @example decimateTrace(env, 20, 10) // 10-s bins of a 20 Hz envelope
 */
export function decimateTrace(envelope: Float64Array, rate_hz: number, step_s: number): DecimatedTrace {
  const perBin = Math.max(1, Math.round(step_s * rate_hz));
  const bins = Math.ceil(envelope.length / perBin);
  const mean: (number | null)[] = new Array(bins);
  const max: (number | null)[] = new Array(bins);
  for (let b = 0; b < bins; b++) {
    const lo = b * perBin;
    const hi = Math.min(envelope.length, lo + perBin);
    let s = 0;
    let m = -Infinity;
    let n = 0;
    for (let i = lo; i < hi; i++) {
      const v = envelope[i];
      if (v === v) { s += v; n++; if (v > m) m = v; }
    }
    mean[b] = n > 0 ? s / n : null;
    max[b] = n > 0 ? m : null;
  }
  return { step_s: perBin / rate_hz, mean, max };
}
