// "Look at the spectrum, then choose the cut-offs", made automatic and explainable: from a PSD,
// suggest band-pass cut-offs, whether a mains notch is needed, and say why in plain words.
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';

export interface SuggestBandOptions {
  /** Mains frequency to look for, Hz; null looks for both 50 and 60 Hz. @default null */
  mainsHz?: 50 | 60 | null;
  /** PSD of a rest recording on the same bins; if given it is the noise floor. @default none */
  restPsd?: ArrayLike<number>;
  /** Cumulative-power share that marks the start of the central band. @default 0.01 */
  lowQuantile?: number;
  /** Cumulative-power share that marks the end of the central band. @default 0.99 */
  highQuantile?: number;
  /** Top fraction of the spectrum (below fs/2) whose median is the noise floor when no rest PSD is given. @default 0.1 */
  floorFraction?: number;
  /** A mains line counts as present when it is this many times its neighbours' median. @default 5 */
  mainsThreshold?: number;
  /** Frequency below which power is counted as low-frequency (movement, drift), Hz. @default 20 */
  lowFrequencyHz?: number;
  /** A low-frequency share above this is worth a remark and keeps the low cut-off ≥ lowFrequencyHz. @default 0.1 */
  lowFrequencyWarn?: number;
}

/** Defaults of suggestBand (shares are fractions 0…1; frequencies Hz). */
export const SUGGEST_BAND_DEFAULTS = {
  lowQuantile: 0.01, highQuantile: 0.99, floorFraction: 0.1, mainsThreshold: 5, lowFrequencyHz: 20, lowFrequencyWarn: 0.1,
};

export interface BandSuggestion {
  /** Suggested band-pass cut-offs [low, high], Hz (whole Hz, high below fs/2). */
  band_hz: [number, number];
  /** Suggested notch frequency, Hz, or null when no mains line stands out. */
  notch_hz: number | null;
  /** Mains line at the fundamental vs. the median of its neighbours (50 or 60 Hz, the larger). */
  mains_ratio: number;
  /** Share of the power (DC bin excluded, mains lines removed) below lowFrequencyHz. */
  low_frequency_ratio: number;
  /** Harmonics (Hz) of the detected mains that also stand out. */
  mains_harmonics_hz: number[];
  /** Noise floor subtracted (PSD units), the median of the top of the spectrum; NaN when a rest PSD was used. */
  noise_floor: number;
  /** Plain-language reasons with the numbers behind each suggestion. */
  reasons: string[];
}

function median(v: number[]): number {
  if (v.length === 0) return NaN;
  const s = v.slice().sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

const fmt = (v: number, d = 0) => v.toFixed(d);
const pct = (v: number) => `${(100 * v).toFixed(v < 0.1 ? 1 : 0)} %`;

/** Peak at fHz (max over bins within ±1 bin) vs. median of bins 3–10 Hz away on both sides. */
function lineRatio(f: ArrayLike<number>, p: ArrayLike<number>, fHz: number): { ratio: number; bins: number[]; neighbour: number } {
  const df = f[1] - f[0];
  const bins: number[] = [];
  const around: number[] = [];
  for (let k = 1; k < f.length; k++) {
    const d = Math.abs(f[k] - fHz);
    if (d <= Math.max(df, 0.5)) bins.push(k);
    else if (d >= Math.max(3, 2 * df) && d <= Math.max(10, 6 * df)) around.push(p[k]);
  }
  if (bins.length === 0 || around.length === 0) return { ratio: NaN, bins, neighbour: NaN };
  let peak = 0;
  for (const k of bins) peak = Math.max(peak, p[k]);
  const neighbour = median(around);
  return { ratio: neighbour > 0 ? peak / neighbour : Infinity, bins, neighbour };
}

/** Frequency where the cumulative sum of p over bins 1… reaches q·total (interpolated). */
function cumulativeAt(f: ArrayLike<number>, p: Float64Array, total: number, q: number): number {
  let c = 0;
  for (let k = 1; k < p.length; k++) {
    const prev = c;
    c += p[k];
    if (c >= q * total) return k === 1 ? f[1] : f[k - 1] + ((q * total - prev) / (c - prev)) * (f[k] - f[k - 1]);
  }
  return f[p.length - 1];
}

/**
 * Suggest band-pass cut-offs and a mains notch from a PSD (e.g. welch()).
 *
 * 1. Mains: at 50 and 60 Hz (or the given mainsHz) the peak (±1 bin) is compared with the median
 *    of the bins 3–10 Hz away; a ratio ≥ mainsThreshold suggests a notch; harmonics are checked the
 *    same way. Mains lines are then replaced by their neighbours' median for the next steps.
 * 2. Noise floor: the rest PSD if given, otherwise the median PSD of the top floorFraction of the
 *    spectrum below fs/2; subtracted bin by bin (negative values → 0).
 * 3. Band: the frequencies where the cumulative floor-free power (DC bin excluded) reaches
 *    lowQuantile and highQuantile (interpolated between bins) mark the central power; the median
 *    PSD there is the band's level. Each edge is then moved to where the 5-bin smoothed spectrum
 *    crosses half that level (−3 dB, the Butterworth cut-off definition). Rounded to whole Hz and
 *    kept inside (0, fs/2).
 * 4. Low-frequency share: power below lowFrequencyHz over all power (DC bin excluded, mains
 *    removed); above lowFrequencyWarn the low cut-off is kept at lowFrequencyHz or above.
 * @param f bin frequencies, Hz (ascending, equally spaced from 0, up to fs/2)
 * @param psd PSD at those bins
 * @returns suggestion with reasons
 * @throws UsageError when f and psd differ in length or hold fewer than 8 bins
 * @example suggestBand(w.f_hz, w.psd, { mainsHz: 50 })
 * Common practice (inspect the spectrum before choosing cut-offs), no single source; the rule
 * above is our own and is stated in every suggestion's reasons.
 */
export function suggestBand(f: ArrayLike<number>, psd: ArrayLike<number>, options: SuggestBandOptions = {}): BandSuggestion {
  if (f.length !== psd.length) throw new UsageError(dspMsg.spectrumLength(f.length, psd.length));
  if (f.length < 8) throw new UsageError(dspMsg.spectrumBins(f.length));
  const d = SUGGEST_BAND_DEFAULTS;
  const o = {
    lowQuantile: options.lowQuantile ?? d.lowQuantile, highQuantile: options.highQuantile ?? d.highQuantile,
    floorFraction: options.floorFraction ?? d.floorFraction, mainsThreshold: options.mainsThreshold ?? d.mainsThreshold,
    lowFrequencyHz: options.lowFrequencyHz ?? d.lowFrequencyHz, lowFrequencyWarn: options.lowFrequencyWarn ?? d.lowFrequencyWarn,
  };
  const rest = options.restPsd;
  if (rest && rest.length !== psd.length) throw new UsageError(dspMsg.spectrumLength(rest.length, psd.length));
  const n = f.length;
  const nyq = f[n - 1];
  const df = f[1] - f[0];
  const reasons: string[] = [];
  const p = Float64Array.from(psd);

  // 1. mains
  const candidates = options.mainsHz ? [options.mainsHz] : [50, 60];
  let best = { hz: candidates[0], ratio: NaN };
  for (const m of candidates) {
    const r = lineRatio(f, p, m).ratio;
    if (!(best.ratio >= r)) best = { hz: m, ratio: r };
  }
  const mainsRatio = best.ratio;
  const detected = mainsRatio >= o.mainsThreshold;
  const harmonics: number[] = [];
  for (let h = 1; h * best.hz < nyq - 10; h++) {
    const lr = lineRatio(f, p, h * best.hz);
    if (!(lr.ratio >= o.mainsThreshold)) continue;
    if (h > 1) harmonics.push(h * best.hz);
    for (const k of lr.bins) p[k] = lr.neighbour; // take the line out before estimating the band
  }
  if (detected) {
    reasons.push(`Mains hum at ${best.hz} Hz: the spectrum there is ${fmt(mainsRatio, 1)} times its neighbours (${fmt(10 * Math.log10(mainsRatio), 1)} dB; threshold ${o.mainsThreshold}), so a ${best.hz} Hz notch is suggested` +
      (harmonics.length ? `; harmonics at ${harmonics.join(', ')} Hz also stand out.` : '.'));
  } else {
    reasons.push(`No mains hum: at ${candidates.join(' and ')} Hz the spectrum is at most ${Number.isFinite(mainsRatio) ? fmt(mainsRatio, 1) : 'n/a'} times its neighbours (threshold ${o.mainsThreshold}), so no notch is needed.`);
  }

  // 2. noise floor
  const clean = new Float64Array(n);
  let floor = NaN;
  if (rest) {
    for (let k = 0; k < n; k++) clean[k] = Math.max(p[k] - rest[k], 0);
  } else {
    const top: number[] = [];
    for (let k = 1; k < n; k++) if (f[k] >= nyq * (1 - o.floorFraction) && f[k] < nyq) top.push(p[k]);
    floor = median(top);
    for (let k = 0; k < n; k++) clean[k] = Math.max(p[k] - floor, 0);
  }

  // 3. band
  let total = 0;
  for (let k = 1; k < n; k++) total += clean[k];
  let lo = NaN, hi = NaN;
  if (total > 0) {
    const qlo = cumulativeAt(f, clean, total, o.lowQuantile), qhi = cumulativeAt(f, clean, total, o.highQuantile);
    const sm = new Float64Array(n);
    for (let k = 1; k < n; k++) {
      let s = 0, m = 0;
      for (let j = Math.max(1, k - 2); j <= Math.min(n - 1, k + 2); j++) { s += clean[j]; m++; }
      sm[k] = s / m;
    }
    const inside: number[] = [];
    for (let k = 1; k < n; k++) if (f[k] >= qlo && f[k] <= qhi) inside.push(clean[k]);
    const half = median(inside) / 2;
    const kOf = (hz: number) => Math.min(n - 1, Math.max(1, Math.round(hz / df)));
    const cross = (k0: number, k1: number) => f[k0] + ((half - sm[k0]) / (sm[k1] - sm[k0])) * (f[k1] - f[k0]);
    let k = kOf(qlo);
    if (sm[k] >= half) { while (k > 1 && sm[k - 1] >= half) k--; lo = k > 1 ? cross(k - 1, k) : f[1]; }
    else { while (k < n - 1 && sm[k] < half) k++; lo = k > 1 ? cross(k - 1, k) : f[1]; }
    k = kOf(qhi);
    if (sm[k] >= half) { while (k < n - 1 && sm[k + 1] >= half) k++; hi = k < n - 1 ? cross(k, k + 1) : f[n - 1]; }
    else { while (k > 1 && sm[k] < half) k--; hi = k < n - 1 ? cross(k, k + 1) : f[n - 1]; }
  }
  const maxHi = Math.ceil(nyq - Math.max(1, df));
  let loR = Math.max(1, Math.round(lo));
  let hiR = Math.min(Math.round(hi), maxHi);
  if (!(hiR > loR)) { loR = Math.max(1, Math.round(f[1])); hiR = maxHi; }
  // 4. low-frequency share (mains removed, DC bin excluded)
  let all = 0, low = 0;
  for (let k = 1; k < n; k++) { all += p[k]; if (f[k] < o.lowFrequencyHz) low += p[k]; }
  const lfr = all > 0 ? low / all : NaN;
  const raised = lfr > o.lowFrequencyWarn && loR < o.lowFrequencyHz;
  const found = loR;
  if (lfr > o.lowFrequencyWarn) loR = Math.max(loR, o.lowFrequencyHz);

  const floorText = rest ? 'the rest-recording spectrum' : `a noise floor of ${floor.toPrecision(3)} (median of ${fmt(nyq * (1 - o.floorFraction))}–${fmt(nyq)} Hz)`;
  if (total > 0) {
    reasons.push(`After subtracting ${floorText}, the spectrum stays above half (−3 dB) of its typical level between ${found} and ${hiR} Hz (typical level: the median where the central ${pct(o.highQuantile - o.lowQuantile)} of the EMG power lies), so a ${loR}–${hiR} Hz band-pass is suggested` +
      (raised ? ` (low cut-off raised from ${found} to ${o.lowFrequencyHz} Hz, see below).` : '.'));
  } else {
    reasons.push(`No power above ${floorText}; the band ${loR}–${hiR} Hz is only a placeholder.`);
  }
  if (lfr > o.lowFrequencyWarn) {
    reasons.push(`${pct(lfr)} of the power lies below ${o.lowFrequencyHz} Hz (more than ${pct(o.lowFrequencyWarn)}): movement artifact or baseline drift is likely; keep the low cut-off at ${o.lowFrequencyHz} Hz or above.`);
  } else if (Number.isFinite(lfr)) {
    reasons.push(`${pct(lfr)} of the power lies below ${o.lowFrequencyHz} Hz: little movement artifact or drift.`);
  }
  return {
    band_hz: [loR, hiR], notch_hz: detected ? best.hz : null, mains_ratio: mainsRatio,
    low_frequency_ratio: lfr, mains_harmonics_hz: harmonics, noise_floor: floor, reasons,
  };
}
