// Heart rate of ECG contamination in band-passed EMG: the rectified signal is binned (mean |y| per
// bin), and only its relative excess over a running mean is kept (spike enhancement: QRS
// complexes stand out, slow changes of muscle activity do not), then the normalized
// autocorrelation is searched over the lags of the heart-rate range. A clear peak at lag L means
// periodic spikes every L bins. Method: autocorrelation pitch estimation (textbook signal
// processing, e.g. Rabiner 1977, IEEE Trans ASSP 25(1):24–33; from memory), tool's own assembly.

export interface HeartRateOptions {
  /** Bin rate of `bins`, Hz. */
  bin_rate_hz: number;
  /** Heart rates searched, beats/min. */
  bpm: readonly [number, number];
  /** Running-mean baseline length, s. */
  baseline_s: number;
}

export interface HeartRate {
  /** Estimated rate, beats/min (NaN when the window is too short or silent). */
  rate_bpm: number;
  /** Normalized autocorrelation at the heart period, −1…1 (NaN as above). */
  r: number;
}

/**
 * Reusable scratch buffers, so the per-window call allocates nothing once sized.
 * One instance per caller; not shared between threads.
 */
export class HeartRateScratch {
  d = new Float64Array(0);
  r = new Float64Array(0);
  private cum = new Float64Array(0);
  /** A buffer of at least n values for the prefix sums. */
  prefix(n: number): Float64Array {
    if (this.cum.length < n) this.cum = new Float64Array(n);
    return this.cum;
  }
  ensure(n: number, lags: number): void {
    if (this.d.length < n) this.d = new Float64Array(n);
    if (this.r.length < lags) this.r = new Float64Array(lags);
  }
}

/**
 * Estimate the heart rate from the first n values of `bins` (mean rectified band-passed signal
 * per bin). Returns the rate at the highest normalized autocorrelation within the lag range;
 * a peak at a whole fraction (1/2, 1/3) of that lag with at least 80 % of its height wins
 * (so a multiple of the true period is not reported); the lag is refined by a parabola.
 * @param bins binned signal (not modified)
 * @param n number of bins to use (≥ 2 × the longest lag)
 * @param options bin rate, heart-rate range, baseline length
 * @param scratch reusable buffers (optional)
 * @returns { rate_bpm, r }; NaN values when n is too short or the signal has no variation
 * @example estimateHeartRate(bins, 1000, { bin_rate_hz: 100, bpm: [40, 180], baseline_s: 0.5 })
 */
export function estimateHeartRate(bins: Float64Array, n: number, options: HeartRateOptions, scratch = new HeartRateScratch()): HeartRate {
  const rate = options.bin_rate_hz;
  const lagMin = Math.max(2, Math.floor((60 / options.bpm[1]) * rate));
  const lagMax = Math.ceil((60 / options.bpm[0]) * rate);
  const half = Math.max(1, Math.round((options.baseline_s * rate) / 2));
  if (n < 2 * lagMax || n < 2 * half + 1) return { rate_bpm: NaN, r: NaN };
  scratch.ensure(n, lagMax + 2);
  const d = scratch.d, r = scratch.r;

  // Spike enhancement: relative excess over a running mean (window 2·half+1, shrinking at the
  // ends; prefix sums, so O(1) per bin). Amplitude-modulated noise has the same relative spread at
  // every level, so changes of muscle activity do not leak into the autocorrelation.
  const cs = scratch.prefix(n + 1);
  cs[0] = 0;
  for (let m = 0; m < n; m++) cs[m + 1] = cs[m] + bins[m];
  for (let m = 0; m < n; m++) {
    const a = m - half < 0 ? 0 : m - half, b = m + half + 1 > n ? n : m + half + 1;
    const base = (cs[b] - cs[a]) / (b - a);
    const e = base > 0 ? (bins[m] - base) / base : 0;
    d[m] = e > 0 ? e : 0;
  }
  let mean = 0;
  for (let m = 0; m < n; m++) mean += d[m];
  mean /= n;
  for (let m = 0; m < n; m++) d[m] -= mean;

  // Normalized autocorrelation (Pearson form over the overlapping parts). The two energies of
  // the overlap come from prefix sums of d² (cs is free again), so each lag is one product sum.
  let best = -Infinity, bestLag = -1;
  const hi = Math.min(lagMax + 1, n - 1);
  cs[0] = 0;
  for (let m = 0; m < n; m++) cs[m + 1] = cs[m] + d[m] * d[m];
  for (let L = lagMin - 1; L <= hi; L++) {
    let s0 = 0, s1 = 0, m = 0;
    for (; m + 1 + L < n; m += 2) { s0 += d[m] * d[m + L]; s1 += d[m + 1] * d[m + 1 + L]; }
    if (m + L < n) s0 += d[m] * d[m + L];
    const sxy = s0 + s1, sxx = cs[n - L], syy = cs[n] - cs[L];
    const v = sxx > 0 && syy > 0 ? sxy / Math.sqrt(sxx * syy) : 0;
    r[L] = v;
    if (L >= lagMin && L <= lagMax && v > best) { best = v; bestLag = L; }
  }
  if (bestLag < 0 || !(best > -Infinity)) return { rate_bpm: NaN, r: NaN };
  // Prefer a sub-multiple of the best lag when it is nearly as high (period doubling guard).
  for (const k of [3, 2]) {
    const c = Math.round(bestLag / k);
    if (c < lagMin) continue;
    let lc = c;
    for (let L = Math.max(lagMin, c - 2); L <= Math.min(lagMax, c + 2); L++) if (r[L] > r[lc]) lc = L;
    if (r[lc] >= 0.8 * best && r[lc] >= r[lc - 1] && r[lc] >= r[lc + 1]) { bestLag = lc; best = r[lc]; break; }
  }
  // Parabolic refinement of the peak position.
  const y0 = r[bestLag - 1], y1 = r[bestLag], y2 = r[bestLag + 1];
  const den = y0 - 2 * y1 + y2;
  const shift = den < 0 ? Math.max(-0.5, Math.min(0.5, (0.5 * (y0 - y2)) / den)) : 0;
  const lag = bestLag + shift;
  return { rate_bpm: (60 * rate) / lag, r: best };
}
