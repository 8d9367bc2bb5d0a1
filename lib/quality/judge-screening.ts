// Judging the screening windows of one channel: each check's limit applied per window, flagged
// windows merged into finding spans (per check, consecutive windows with the same verdict), spans
// judged unusable listed for exclusion. Separate from the streaming tap so the judgment can be made
// after the pass, on another thread, once the rest recording's noise level is known.
import { qualityMsg } from '../messages.js';
import type { Finding, FindingWhere, Severity } from '../study/results.js';
import { resolveQualitySettings, type QualitySettings } from './defaults.js';
import type { ChannelQuality, ExcludedSpan, QualityCode, ScreeningWindows } from './screening-types.js';

/** What the judgment needs besides the windows. */
export interface JudgeOptions {
  /** The analysis' noise level for this channel (band-passed RMS of the rest recording), µV; null: estimated from the windows. @default null */
  noise_uv?: number | null;
  /** True when the analysis notches the mains frequency (mains findings become 'info'). @default false */
  mains_notched?: boolean;
  /** High-pass edge of the analysis' band-pass, Hz (ECG findings are 'info' from 30 Hz). @default null */
  highpass_hz?: number | null;
  /** Worker, recording and signal named in every finding (signal also in the message). */
  where?: FindingWhere;
  /** Overrides of QUALITY_DEFAULTS (the same as during the pass). */
  settings?: Partial<QualitySettings> | null;
}

/**
 * Judge the windows of one channel (from QualityTap.windows()).
 * Rules (limits in QUALITY_DEFAULTS / settings): a window is clipped when it holds at least
 * clip_min_samples samples at the digital limits (excluded from clip_exclude_share of its samples);
 * flat when its raw standard deviation is below max(flat_std_uv, half a digital step) (excluded);
 * lost when its band RMS is below lost_fraction × the noise floor (excluded); mains when the hum
 * power above the local background reaches mains_ratio of the EMG-band power; motion when the
 * power below motion_hz reaches motion_ratio of the EMG-band power and motion_relative times the
 * recording's median low-frequency power (excluded from motion_exclude_ratio); ECG when the
 * autocorrelation at the heart period reaches ecg_min_r. Exclusion only with settings.exclude.
 * @param w0 the windows (plain data)
 * @param options noise level, filter facts, where, settings
 * @returns findings (at most max_spans per check, then one summing finding), excluded spans, summary
 * @example judgeScreening(tap.windows(), { noise_uv: 2.1, where: { worker: 'W1', signal: 'EMG R' } })
 */
export function judgeScreening(w0: ScreeningWindows, options: JudgeOptions = {}): ChannelQuality {
    const s = resolveQualitySettings(options.settings ?? undefined), fs = w0.fs;
    const where = options.where ?? {};
    const signal = where.signal ?? 'signal';
    const findings: Finding[] = [];
    const excluded: ExcludedSpan[] = [];
    const t = (pos: number) => w0.start_s + Math.min(pos, w0.end_samples) / fs;

    /** Turn flagged windows (flag 1 = reported, 2 = reported and excluded) into findings. */
    const emit = (code: QualityCode, flags: Uint8Array, W: number, severity: (excl: boolean) => Severity,
      text: (w0: number, w1: number, t0: number, t1: number, excl: boolean) => string, excludes: boolean): number => {
      let shown = 0, moreSpans = 0, moreS = 0, total = 0;
      let w = 0;
      while (w < flags.length) {
        const f = flags[w];
        if (f === 0) { w++; continue; }
        let e = w + 1;
        while (e < flags.length && flags[e] === f) e++;
        const t0 = t(w * W), t1 = t(e * W);
        total += t1 - t0;
        const excl = f === 2 && excludes && s.exclude;
        if (excl) excluded.push({ start_s: t0, end_s: t1, reason: code });
        if (shown < s.max_spans) {
          findings.push({ severity: severity(excl), code, where: { ...where, start_s: t0, end_s: t1 }, message: text(w, e, t0, t1, excl) });
          shown++;
        } else { moreSpans++; moreS += t1 - t0; }
        w = e;
      }
      if (moreSpans > 0) findings.push({ severity: 'info', code, where: { ...where }, message: qualityMsg.moreSpans(signal, code, moreSpans, moreS) });
      return total;
    };

    // ---- amplitude windows: clipping, flat line, lost signal
    const { n: cn, hi: chi, lo: clo, s1, s2, fn, f2 } = w0.amp;
    const nA = cn.length;
    const std = new Float64Array(nA), frms = new Float64Array(nA);
    for (let w = 0; w < nA; w++) {
      const n = cn[w];
      std[w] = n >= 2 ? Math.sqrt(Math.max(0, (s2[w] - (s1[w] * s1[w]) / n) / (n - 1))) : NaN;
      frms[w] = fn[w] > 0 ? Math.sqrt(f2[w] / fn[w]) : NaN;
    }
    let clippedLow = 0, clippedHigh = 0;
    const clipFlags = new Uint8Array(nA);
    if (w0.has_limits) {
      for (let w = 0; w < nA; w++) {
        clippedLow += clo[w]; clippedHigh += chi[w];
        const c = chi[w] + clo[w];
        if (c >= s.clip_min_samples && c > 0) clipFlags[w] = c >= s.clip_exclude_share * cn[w] ? 2 : 1;
      }
    }
    const flatLimit = Math.max(s.flat_std_uv, 0.5 * w0.lsb);
    const flatFlags = new Uint8Array(nA);
    for (let w = 0; w < nA; w++) if (std[w] < flatLimit) flatFlags[w] = 2;
    // noise floor: the rest recording's level, else the 5th percentile of the windows' band RMS
    let floor: number | null = null, floorSource: 'rest' | 'estimated' | null = null;
    if (options.noise_uv !== undefined && options.noise_uv !== null && options.noise_uv > 0) {
      floor = options.noise_uv; floorSource = 'rest';
    } else {
      const v = sortedFinite(frms, (w) => flatFlags[w] === 0 && cn[w] >= 0.5 * w0.amp_window);
      if (v.length > 0) { const q = quantileSorted(v, 0.05); if (q > 0) { floor = q; floorSource = 'estimated'; } }
    }
    const lostFlags = new Uint8Array(nA);
    if (floor !== null) {
      for (let w = 0; w < nA; w++) if (flatFlags[w] === 0 && frms[w] < s.lost_fraction * floor) lostFlags[w] = 2;
    }
    const W1 = w0.amp_window;
    const clipped_s = emit('clipped', clipFlags, W1, () => 'warning', (w0, w1, t0, t1, excl) => {
      let c = 0, n = 0;
      for (let w = w0; w < w1; w++) { c += chi[w] + clo[w]; n += cn[w]; }
      return qualityMsg.clipped(signal, t0, t1, c, n, excl, s.clip_exclude_share);
    }, true);
    const flat_s = emit('flat-line', flatFlags, W1, () => 'warning', (w0, w1, t0, t1) => {
      let m = 0;
      for (let w = w0; w < w1; w++) if (std[w] > m) m = std[w];
      return qualityMsg.flatLine(signal, t0, t1, m, flatLimit);
    }, true);
    const lost_s = emit('signal-lost', lostFlags, W1, () => 'warning', (w0, w1, t0, t1) => {
      let m = 0;
      for (let w = w0; w < w1; w++) if (frms[w] > m) m = frms[w];
      return qualityMsg.signalLost(signal, t0, t1, m, floor!, s.lost_fraction, floorSource!);
    }, true);

    // ---- spectral windows: mains, low-frequency artifact
    const { segs, low, band, mains } = w0.spec;
    const nS = segs.length;
    const emg = new Float64Array(nS), lowPer = new Float64Array(nS), mainsRatio = new Float64Array(nS), mainsWhich = new Int32Array(nS);
    for (let w = 0; w < nS; w++) {
      if (segs[w] === 0) { emg[w] = NaN; lowPer[w] = NaN; mainsRatio[w] = NaN; continue; }
      emg[w] = Math.max(band[w], 1e-300);
      lowPer[w] = low[w] / segs[w];
      let best = 0, which = 0;
      for (let i = 0; i < mains.length; i++) if (mains[i][w] / segs[w] > best) { best = mains[i][w] / segs[w]; which = i; }
      mainsRatio[w] = best;
      mainsWhich[w] = which;
    }
    const lowSorted = sortedFinite(lowPer, () => true);
    const lowMedian = lowSorted.length > 0 ? quantileSorted(lowSorted, 0.5) : NaN;
    const mainsFlags = new Uint8Array(nS), motionFlags = new Uint8Array(nS);
    for (let w = 0; w < nS; w++) {
      if (segs[w] === 0) continue;
      if (mainsRatio[w] >= s.mains_ratio) mainsFlags[w] = 1;
      const ratio = low[w] / emg[w];
      const rel = lowPer[w] / lowMedian;
      if (ratio >= s.motion_ratio && rel >= s.motion_relative) motionFlags[w] = ratio >= s.motion_exclude_ratio ? 2 : 1;
    }
    const W2 = w0.spectral_window;
    const notched = options.mains_notched === true;
    const mains_s = emit('mains', mainsFlags, W2, () => (notched ? 'info' : 'warning'), (w0, w1, t0, t1) => {
      let m = 0, which = 0;
      for (let w = w0; w < w1; w++) if (mainsRatio[w] > m) { m = mainsRatio[w]; which = mainsWhich[w]; }
      return qualityMsg.mains(signal, t0, t1, s.mains_hz[which], m, s.mains_ratio, notched);
    }, false);
    const motion_s = emit('motion', motionFlags, W2, () => 'warning', (w0, w1, t0, t1, excl) => {
      let m = 0, rel = 0;
      for (let w = w0; w < w1; w++) { const r = low[w] / emg[w]; if (r > m) { m = r; rel = lowPer[w] / lowMedian; } }
      return qualityMsg.motion(signal, t0, t1, m, s.motion_ratio, rel, excl, s.motion_exclude_ratio);
    }, true);

    // ---- ECG windows
    const { rate, r: rr } = w0.ecg;
    const nE = rate.length;
    const ecgFlags = new Uint8Array(nE);
    for (let w = 0; w < nE; w++) if (rr[w] >= s.ecg_min_r && rate[w] === rate[w]) ecgFlags[w] = 1;
    const hp = options.highpass_hz ?? null;
    const ecg_s = emit('ecg', ecgFlags, w0.ecg_window, () => (hp !== null && hp >= 30 ? 'info' : 'warning'), (w0, w1, t0, t1) => {
      const rates = sortedFinite(rate, (w) => w >= w0 && w < w1 && ecgFlags[w] === 1);
      let rmin = Infinity;
      for (let w = w0; w < w1; w++) if (rr[w] < rmin) rmin = rr[w];
      return qualityMsg.ecg(signal, t0, t1, quantileSorted(rates, 0.5), rmin, s.ecg_min_r, hp);
    }, false);
    const ecgRates = sortedFinite(rate, (w) => ecgFlags[w] === 1);

    excluded.sort((a, b) => a.start_s - b.start_s || a.end_s - b.end_s);
    const mainsSorted = sortedFinite(mainsRatio, () => true);
    const lowRatios = new Float64Array(nS);
    for (let w = 0; w < nS; w++) lowRatios[w] = segs[w] > 0 ? low[w] / emg[w] : NaN;
    const lowRatioSorted = sortedFinite(lowRatios, () => true);
    const db = (v: number[]) => (v.length === 0 ? null : 10 * Math.log10(Math.max(quantileSorted(v, 0.5), 1e-30)));
    return {
      summary: {
        fs,
        screened_s: w0.samples / fs,
        clipped_low: w0.has_limits ? clippedLow : null,
        clipped_high: w0.has_limits ? clippedHigh : null,
        clipped_s, flat_s, lost_s, mains_s, motion_s, ecg_s,
        excluded_s: unionLength(excluded),
        noise_floor_uv: floor,
        noise_floor_source: floorSource,
        mains_ratio_db: db(mainsSorted),
        low_ratio_db: db(lowRatioSorted),
        ecg_rate_bpm: ecgRates.length > 0 ? quantileSorted(ecgRates, 0.5) : null,
      },
      findings,
      excluded,
      settings: s,
    };
}

/** Finite values of a[w] for which keep(w) holds, sorted ascending. */
function sortedFinite(a: Float64Array, keep: (w: number) => boolean): number[] {
  const v: number[] = [];
  for (let w = 0; w < a.length; w++) if (Number.isFinite(a[w]) && keep(w)) v.push(a[w]);
  return v.sort((x, y) => x - y);
}

/** Linear-interpolation quantile (numpy default) of sorted values. */
function quantileSorted(v: number[], q: number): number {
  if (v.length === 0) return NaN;
  const h = (v.length - 1) * q;
  const lo = Math.floor(h);
  return lo + 1 < v.length ? v[lo] + (h - lo) * (v[lo + 1] - v[lo]) : v[lo];
}

/** Total length of the union of spans, s. */
export function unionLength(spans: readonly { start_s: number; end_s: number }[]): number {
  const v = [...spans].sort((a, b) => a.start_s - b.start_s);
  let total = 0, s = -Infinity, e = -Infinity;
  for (const x of v) {
    if (x.start_s > e) { if (e > s) total += e - s; s = x.start_s; e = x.end_s; } else if (x.end_s > e) e = x.end_s;
  }
  if (e > s) total += e - s;
  return total;
}
