// Signal-quality screening of one channel, as a ChannelTap of the analysis' single streaming pass
// (lib/study/read-envelopes.ts): raw chunks feed the amplitude checks (clipping, flat line) and a
// windowed spectrum (mains, low-frequency artifact); band-passed chunks feed the lost-signal and
// ECG checks. During the pass only compact per-window statistics are kept (an 8-hour channel:
// 28 800 one-second windows); finish() judges the windows, merges consecutive flagged windows of
// one check into finding spans and lists the spans to exclude from the statistics.
import { secondsToSamples } from '../dsp/seconds-to-samples.js';
import { qualityMsg } from '../messages.js';
import type { ChannelTap } from '../study/read-envelopes.js';
import type { Finding, FindingWhere, Severity } from '../study/results.js';
import { resolveQualitySettings, type QualitySettings } from './defaults.js';
import { estimateHeartRate, HeartRateScratch } from './estimate-heart-rate.js';
import { BAND, SegmentBandPowers } from './segment-band-powers.js';
import { WindowColumns } from './window-columns.js';

/** Codes of the quality findings. */
export type QualityCode = 'clipped' | 'flat-line' | 'signal-lost' | 'mains' | 'motion' | 'ecg' | 'low-snr';

/** A span left out of the statistics, s from the recording start, [start_s, end_s). */
export interface ExcludedSpan {
  start_s: number;
  end_s: number;
  reason: QualityCode;
}

/** The recorder's limits of one signal (from SignalInfo); NaN digital limits: no clipping check. */
export interface SignalLimits {
  physical_min: number;
  physical_max: number;
  digital_min: number;
  digital_max: number;
}

export interface QualityTapOptions {
  /** Sampling rate of the channel, Hz (required). */
  fs: number;
  /** Recorder limits (clipping check); null or NaN digital limits (CSV) skip the check. @default null */
  limits?: SignalLimits | null;
  /** Start of the screened span, s from the recording start (added to every time). @default 0 */
  start_s?: number;
  /** The analysis' noise level for this channel (band-passed RMS of the rest recording), µV; null: estimated. @default null */
  noise_uv?: number | null;
  /** True when the analysis notches the mains frequency (mains findings become 'info'). @default false */
  mains_notched?: boolean;
  /** High-pass edge of the analysis' band-pass, Hz (ECG findings are 'info' from 30 Hz). @default null */
  highpass_hz?: number | null;
  /** Worker, recording and signal named in every finding (signal also in the message). */
  where?: FindingWhere;
  /** Overrides of QUALITY_DEFAULTS. */
  settings?: Partial<QualitySettings>;
}

/** Per-signal summary (inspect, results). Times in s. */
export interface QualitySummary {
  fs: number;
  /** Time screened (samples seen / fs), s. */
  screened_s: number;
  /** Samples at the digital limits; null when the signal has none (CSV). */
  clipped_low: number | null;
  clipped_high: number | null;
  /** Time flagged by each check, s (windows, so rounded up to the window). */
  clipped_s: number;
  flat_s: number;
  lost_s: number;
  mains_s: number;
  motion_s: number;
  ecg_s: number;
  /** Union of the excluded spans, s (0 when settings.exclude is false). */
  excluded_s: number;
  /** Noise floor used by the lost-signal check, µV, and where it came from. */
  noise_floor_uv: number | null;
  noise_floor_source: 'rest' | 'estimated' | null;
  /** Median mains power relative to the EMG band (largest of the mains frequencies), dB. */
  mains_ratio_db: number | null;
  /** Median low-frequency power relative to the EMG band, dB. */
  low_ratio_db: number | null;
  /** Median heart rate over the windows with ECG found, beats/min; null when none. */
  ecg_rate_bpm: number | null;
}

export interface ChannelQuality {
  summary: QualitySummary;
  findings: Finding[];
  /** Spans to exclude (empty when settings.exclude is false), sorted by start. */
  excluded: ExcludedSpan[];
  /** The settings applied. */
  settings: QualitySettings;
}

type AmpCol = 'n' | 'hi' | 'lo' | 'shift' | 's1' | 's2' | 'nan' | 'fn' | 'f2';
const AMP_COLS: readonly AmpCol[] = ['n', 'hi', 'lo', 'shift', 's1', 's2', 'nan', 'fn', 'f2'];
type EcgCol = 'rate' | 'r';

/**
 * Quality screening of one channel during the streaming pass. Give it to readEnvelopes as the
 * channel's tap, then call finish() after the pass.
 * Windows are counted from the span start: amplitude windows of settings.window_s, spectral
 * windows of settings.spectral_window_s (Hann segments of nperseg = the power of two nearest
 * fs/2, half overlap, each counted in the window holding its centre), ECG windows of
 * settings.ecg_window_s. Results do not depend on how the samples are chunked.
 * @example
 *   const tap = new QualityTap({ fs: 2000, limits: info.signals[0], where: { signal: 'EMG R' } });
 *   await readEnvelopes({ ..., taps: [tap] });
 *   const q = tap.finish(); // q.findings, q.excluded, q.summary
 */
export class QualityTap implements ChannelTap {
  readonly settings: QualitySettings;
  private readonly fs: number;
  private readonly start_s: number;
  private readonly W1: number;
  private readonly W2: number;
  private readonly WE: number;
  private readonly hiLimit: number;
  private readonly loLimit: number;
  private readonly lsb: number;
  private readonly hasLimits: boolean;
  private readonly amp: WindowColumns<AmpCol>;
  private readonly spec: WindowColumns<string>;
  private readonly ecg: WindowColumns<EcgCol>;
  // raw position (samples from span start, including gaps of EDF+D) and furthest position seen
  private g = 0;
  private gf = 0;
  private gEnd = 0;
  private samples = 0;
  // spectral segments
  private readonly nperseg: number;
  private readonly hop: number;
  private readonly seg: Float64Array;
  private segFill = 0;
  private segStart = 0;
  private specWin = -1;
  private readonly powers: SegmentBandPowers;
  private readonly pout: Float64Array;
  private readonly specNames: string[];
  // ECG bins
  private readonly B: number;
  private readonly nb: number;
  private readonly bins: Float64Array;
  private binAcc = 0;
  private binCnt = 0;
  private binPos = 0;
  private binIdx = 0;
  private binFirst = 0;
  private eWin = 0;
  private ePos = 0;
  private readonly hrScratch = new HeartRateScratch();
  private finished: ChannelQuality | null = null;

  constructor(private readonly options: QualityTapOptions) {
    const s = resolveQualitySettings(options.settings);
    this.settings = s;
    const fs = options.fs;
    this.fs = fs;
    this.start_s = options.start_s ?? 0;
    this.W1 = Math.max(1, secondsToSamples(s.window_s, fs));
    this.W2 = Math.max(1, secondsToSamples(s.spectral_window_s, fs));
    this.WE = Math.max(1, secondsToSamples(s.ecg_window_s, fs));
    const L = options.limits ?? null;
    this.hasLimits = L !== null && Number.isFinite(L.digital_min) && Number.isFinite(L.digital_max) && L.digital_max > L.digital_min;
    if (this.hasLimits) {
      // EDFlib scaling (as the readers): physical = bv · (offset + digital); samples are whole
      // steps of bv, so half a step separates the limit from its neighbour exactly.
      const bv = (L!.physical_max - L!.physical_min) / (L!.digital_max - L!.digital_min);
      const off = L!.physical_max / bv - L!.digital_max;
      const hi = bv * (off + L!.digital_max), lo = bv * (off + L!.digital_min);
      this.lsb = Math.abs(bv);
      this.hiLimit = bv > 0 ? hi - 0.5 * bv : lo + 0.5 * bv;
      this.loLimit = bv > 0 ? lo + 0.5 * bv : hi - 0.5 * bv;
    } else {
      this.lsb = 0;
      this.hiLimit = Infinity;
      this.loLimit = -Infinity;
    }
    this.amp = new WindowColumns(AMP_COLS);
    this.nperseg = 2 ** Math.max(3, Math.round(Math.log2(fs / 2)));
    this.hop = this.nperseg; // no overlap: half the FFTs of a half-overlapped Welch, the check did not need more
    this.seg = new Float64Array(this.nperseg);
    this.powers = new SegmentBandPowers({
      fs, nperseg: this.nperseg, motion_hz: s.motion_hz, band_hz: s.band_hz, mains_hz: s.mains_hz, mains_harmonics: s.mains_harmonics,
    });
    this.pout = new Float64Array(this.powers.width);
    this.specNames = ['segs', 'low', 'band', ...s.mains_hz.map((_, i) => `m${i}`)];
    this.spec = new WindowColumns(this.specNames, 256);
    this.B = Math.max(1, secondsToSamples(s.ecg_bin_s, fs));
    this.nb = Math.floor(this.WE / this.B);
    this.bins = new Float64Array(this.nb);
    this.ecg = new WindowColumns<EcgCol>(['rate', 'r'], 64);
  }

  /**
   * Raw chunk (physical values). `first` (index of x[0] among the samples read) is not needed:
   * positions are kept by the tap itself, including the time jumps announced by restart().
   */
  raw(x: Float64Array, first?: number): void {
    void first;
    const n = x.length;
    const W1 = this.W1, hiL = this.hiLimit, loL = this.loLimit;
    let i = 0;
    while (i < n) {
      const g = this.g;
      const w = Math.floor(g / W1);
      const end = Math.min(n, i + (w + 1) * W1 - g);
      this.amp.ensure(w);
      const cn = this.amp.col('n');
      const first = cn[w] === 0;
      let shift = first ? NaN : this.amp.col('shift')[w];
      let hi = 0, lo = 0, nan = 0, s1 = 0, s2 = 0, cnt = 0;
      for (let j = i; j < end; j++) {
        const v = x[j];
        if (v !== v) { nan++; continue; }
        if (shift !== shift) shift = v;
        if (v >= hiL) hi++;
        else if (v <= loL) lo++;
        const d = v - shift;
        s1 += d; s2 += d * d; cnt++;
      }
      this.amp.col('shift')[w] = shift;
      cn[w] += cnt;
      this.amp.col('hi')[w] += hi;
      this.amp.col('lo')[w] += lo;
      this.amp.col('nan')[w] += nan;
      this.amp.col('s1')[w] += s1;
      this.amp.col('s2')[w] += s2;
      this.g += end - i;
      i = end;
    }
    this.samples += n;
    if (this.g > this.gEnd) this.gEnd = this.g;
    this.pushSegments(x);
  }

  /** Band-passed chunk, µV (the analysis' filter output). */
  filtered(y: Float64Array): void {
    const n = y.length, W1 = this.W1;
    let i = 0;
    while (i < n) {
      const g = this.gf;
      const w = Math.floor(g / W1);
      const end = Math.min(n, i + (w + 1) * W1 - g);
      this.amp.ensure(w);
      let s2 = 0, cnt = 0;
      for (let j = i; j < end; j++) {
        const v = y[j];
        if (v === v) { s2 += v * v; cnt++; }
      }
      this.amp.col('fn')[w] += cnt;
      this.amp.col('f2')[w] += s2;
      this.gf += end - i;
      i = end;
    }
    // ECG bins: mean |y| per bin of B samples, nb bins per ECG window; runs up to the next bin
    // or window edge keep the inner loop free of bookkeeping
    const B = this.B, WE = this.WE, nb = this.nb, bins = this.bins;
    let j = 0;
    while (j < n) {
      const stop = Math.min(n, j + (B - this.binPos), j + (WE - this.ePos));
      let acc = 0, cnt = 0;
      for (let k = j; k < stop; k++) {
        const v = y[k];
        if (v === v) { acc += v < 0 ? -v : v; cnt++; }
      }
      this.binAcc += acc;
      this.binCnt += cnt;
      this.binPos += stop - j;
      this.ePos += stop - j;
      j = stop;
      if (this.binPos === B) {
        if (this.binIdx < nb) bins[this.binIdx] = this.binCnt > 0 ? this.binAcc / this.binCnt : NaN;
        this.binIdx++;
        this.binPos = 0; this.binAcc = 0; this.binCnt = 0;
      }
      if (this.ePos === WE) {
        this.closeEcgWindow();
        this.eWin++;
        this.ePos = 0; this.binIdx = 0; this.binFirst = 0; this.binPos = 0; this.binAcc = 0; this.binCnt = 0;
      }
    }
  }

  /** A discontinuity: the next piece starts at offset_s from the span start. */
  restart(offset_s: number): void {
    const g = secondsToSamples(offset_s, this.fs);
    this.closeEcgWindow();
    this.g = g;
    this.gf = g;
    if (g > this.gEnd) this.gEnd = g;
    this.segFill = 0;
    this.segStart = g;
    this.closeSpectralWindow();
    this.specWin = -1;
    this.eWin = Math.floor(g / this.WE);
    this.ePos = g - this.eWin * this.WE;
    // bins stay aligned to the window start; a partly covered first bin is not used
    this.binIdx = Math.floor(this.ePos / this.B);
    this.binPos = this.ePos % this.B;
    this.binFirst = Math.ceil(this.ePos / this.B);
    this.binAcc = 0;
    this.binCnt = 0;
  }

  private pushSegments(x: Float64Array): void {
    const N = this.nperseg, seg = this.seg, W2 = this.W2;
    let i = 0;
    while (i < x.length) {
      const m = Math.min(N - this.segFill, x.length - i);
      seg.set(x.subarray(i, i + m), this.segFill);
      this.segFill += m;
      i += m;
      if (this.segFill === N) {
        const w = Math.floor((this.segStart + N / 2) / W2);
        if (w !== this.specWin) { this.closeSpectralWindow(); this.specWin = w; }
        this.powers.add(seg);
        seg.copyWithin(0, this.hop, N);
        this.segFill = N - this.hop;
        this.segStart += this.hop;
      }
    }
  }

  /** Store the band powers of the spectral window being averaged, and start afresh. */
  private closeSpectralWindow(): void {
    const p = this.powers, w = this.specWin;
    if (w >= 0 && p.count > 0) {
      const out = this.pout;
      p.compute(out);
      this.spec.ensure(w);
      this.spec.col('segs')[w] += p.count;
      for (let k = 0; k < out.length; k++) this.spec.col(this.specNames[k + 1])[w] += out[k] * p.count;
    }
    p.reset();
  }

  private closeEcgWindow(): void {
    const s = this.settings;
    const used = Math.min(this.binIdx, this.nb) - this.binFirst;
    const binRate = this.fs / this.B;
    const lagMax = Math.ceil((60 / s.ecg_bpm[0]) * binRate);
    if (used < Math.max(2 * lagMax, Math.floor(this.nb / 2))) return;
    const b = this.bins.subarray(this.binFirst, this.binFirst + used);
    for (let k = 0; k < used; k++) if (b[k] !== b[k]) return;
    const hr = estimateHeartRate(b, used, { bin_rate_hz: binRate, bpm: s.ecg_bpm, baseline_s: s.ecg_baseline_s }, this.hrScratch);
    this.ecg.ensure(this.eWin);
    this.ecg.col('rate')[this.eWin] = hr.rate_bpm;
    this.ecg.col('r')[this.eWin] = hr.r;
  }

  /**
   * End of the pass: judge every window, merge flagged windows into findings, list excluded spans.
   * Idempotent (a second call returns the same object).
   */
  finish(): ChannelQuality {
    if (this.finished) return this.finished;
    if (this.ePos > 0) this.closeEcgWindow();
    this.closeSpectralWindow();
    const s = this.settings, fs = this.fs;
    const where = this.options.where ?? {};
    const signal = where.signal ?? 'signal';
    const findings: Finding[] = [];
    const excluded: ExcludedSpan[] = [];
    const t = (pos: number) => this.start_s + Math.min(pos, this.gEnd) / fs;

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
    const A = this.amp, nA = A.length;
    const cn = A.col('n'), chi = A.col('hi'), clo = A.col('lo'), s1 = A.col('s1'), s2 = A.col('s2'), fn = A.col('fn'), f2 = A.col('f2');
    const std = new Float64Array(nA), frms = new Float64Array(nA);
    for (let w = 0; w < nA; w++) {
      const n = cn[w];
      std[w] = n >= 2 ? Math.sqrt(Math.max(0, (s2[w] - (s1[w] * s1[w]) / n) / (n - 1))) : NaN;
      frms[w] = fn[w] > 0 ? Math.sqrt(f2[w] / fn[w]) : NaN;
    }
    let clippedLow = 0, clippedHigh = 0;
    const clipFlags = new Uint8Array(nA);
    if (this.hasLimits) {
      for (let w = 0; w < nA; w++) {
        clippedLow += clo[w]; clippedHigh += chi[w];
        const c = chi[w] + clo[w];
        if (c >= s.clip_min_samples && c > 0) clipFlags[w] = c >= s.clip_exclude_share * cn[w] ? 2 : 1;
      }
    }
    const flatLimit = Math.max(s.flat_std_uv, 0.5 * this.lsb);
    const flatFlags = new Uint8Array(nA);
    for (let w = 0; w < nA; w++) if (std[w] < flatLimit) flatFlags[w] = 2;
    // noise floor: the rest recording's level, else the 5th percentile of the windows' band RMS
    let floor: number | null = null, floorSource: 'rest' | 'estimated' | null = null;
    if (this.options.noise_uv !== undefined && this.options.noise_uv !== null && this.options.noise_uv > 0) {
      floor = this.options.noise_uv; floorSource = 'rest';
    } else {
      const v = sortedFinite(frms, (w) => flatFlags[w] === 0 && cn[w] >= 0.5 * this.W1);
      if (v.length > 0) { const q = quantileSorted(v, 0.05); if (q > 0) { floor = q; floorSource = 'estimated'; } }
    }
    const lostFlags = new Uint8Array(nA);
    if (floor !== null) {
      for (let w = 0; w < nA; w++) if (flatFlags[w] === 0 && frms[w] < s.lost_fraction * floor) lostFlags[w] = 2;
    }
    const W1 = this.W1;
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
    const S = this.spec, nS = S.length;
    const segs = S.col('segs'), low = S.col('low'), band = S.col('band');
    const mains = s.mains_hz.map((_, i) => S.col(`m${i}`));
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
    const W2 = this.W2;
    const notched = this.options.mains_notched === true;
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
    const E = this.ecg, nE = E.length;
    const rate = E.col('rate'), rr = E.col('r');
    const ecgFlags = new Uint8Array(nE);
    for (let w = 0; w < nE; w++) if (rr[w] >= s.ecg_min_r && rate[w] === rate[w]) ecgFlags[w] = 1;
    const hp = this.options.highpass_hz ?? null;
    const ecg_s = emit('ecg', ecgFlags, this.WE, () => (hp !== null && hp >= 30 ? 'info' : 'warning'), (w0, w1, t0, t1) => {
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
    this.finished = {
      summary: {
        fs,
        screened_s: this.samples / fs,
        clipped_low: this.hasLimits ? clippedLow : null,
        clipped_high: this.hasLimits ? clippedHigh : null,
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
    return this.finished;
  }
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
