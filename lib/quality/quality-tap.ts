// Signal-quality screening of one channel, as a ChannelTap of the analysis' single streaming pass
// (lib/study/read-envelopes.ts): raw chunks feed the amplitude checks (clipping, flat line) and a
// windowed spectrum (mains, low-frequency artifact); band-passed chunks feed the lost-signal and
// ECG checks. During the pass only compact per-window statistics are kept (an 8-hour channel:
// 28 800 one-second windows); windows() hands them over as plain data and judgeScreening (or
// finish(), which calls it) turns them into findings and excluded spans.
import { secondsToSamples } from '../dsp/seconds-to-samples.js';
import type { ChannelTap } from '../study/read-envelopes.js';
import type { FindingWhere } from '../study/results.js';
import { resolveQualitySettings, type QualitySettings } from './defaults.js';
import { estimateHeartRate, HeartRateScratch } from './estimate-heart-rate.js';
import { judgeScreening } from './judge-screening.js';
import type { ChannelQuality, ScreeningWindows } from './screening-types.js';
import { BAND, SegmentBandPowers } from './segment-band-powers.js';
import { WindowColumns } from './window-columns.js';

export type { ChannelQuality, ExcludedSpan, QualityCode, QualitySummary, ScreeningWindows } from './screening-types.js';
export { unionLength } from './judge-screening.js';

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

type AmpCol = 'n' | 'hi' | 'lo' | 'shift' | 's1' | 's2' | 'nan' | 'fn' | 'f2';
const AMP_COLS: readonly AmpCol[] = ['n', 'hi', 'lo', 'shift', 's1', 's2', 'nan', 'fn', 'f2'];
type EcgCol = 'rate' | 'r';

/**
 * Quality screening of one channel during the streaming pass. Give it to readEnvelopes as the
 * channel's tap, then call finish() (or windows() + judgeScreening) after the pass.
 * Windows are counted from the span start: amplitude windows of settings.window_s, spectral
 * windows of settings.spectral_window_s (Hann segments of nperseg = the power of two nearest
 * fs/2, without overlap, each counted in the window holding its centre), ECG windows of
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
    // every window this chunk touches made writable at once, and the columns fetched once per
    // chunk (a lookup by name per window was a tenth of the tap's time)
    if (n > 0) this.amp.ensure(Math.floor((this.g + n - 1) / W1));
    const cn = this.amp.col('n'), cShift = this.amp.col('shift'), cHi = this.amp.col('hi'), cLo = this.amp.col('lo');
    const cNan = this.amp.col('nan'), cS1 = this.amp.col('s1'), cS2 = this.amp.col('s2');
    let i = 0;
    while (i < n) {
      const g = this.g;
      const w = Math.floor(g / W1);
      const end = Math.min(n, i + (w + 1) * W1 - g);
      let shift = cn[w] === 0 ? NaN : cShift[w]!;
      let hi = 0, lo = 0, nan = 0, s1 = 0, s2 = 0, cnt = 0;
      let j = i;
      if (shift !== shift) { // the window's first valid sample sets its shift (sums stay well conditioned)
        while (j < end && x[j] !== x[j]) { nan++; j++; }
        if (j < end) shift = x[j]!;
      }
      // sums in two lanes (alternate samples) assuming no NaN; a NaN shows in the sums, and then
      // the run is counted again sample by sample
      const from = j;
      let s1b = 0, s2b = 0;
      for (; j + 1 < end; j += 2) {
        const v = x[j]!, u = x[j + 1]!;
        if (v >= hiL) hi++;
        else if (v <= loL) lo++;
        if (u >= hiL) hi++;
        else if (u <= loL) lo++;
        const d = v - shift, e = u - shift;
        s1 += d; s2 += d * d; s1b += e; s2b += e * e;
      }
      if (j < end) {
        const v = x[j]!;
        if (v >= hiL) hi++;
        else if (v <= loL) lo++;
        const d = v - shift;
        s1 += d; s2 += d * d;
        j++;
      }
      s1 += s1b; s2 += s2b; cnt = end - from;
      if (s1 !== s1 || s2 !== s2) {
        hi = 0; lo = 0; s1 = 0; s2 = 0; cnt = 0;
        for (j = from; j < end; j++) {
          const v = x[j]!;
          if (v !== v) { nan++; continue; }
          if (v >= hiL) hi++;
          else if (v <= loL) lo++;
          const d = v - shift;
          s1 += d; s2 += d * d; cnt++;
        }
      }
      cShift[w] = shift;
      cn[w] += cnt;
      cHi[w] += hi;
      cLo[w] += lo;
      cNan[w] += nan;
      cS1[w] += s1;
      cS2[w] += s2;
      this.g += end - i;
      i = end;
    }
    this.samples += n;
    if (this.g > this.gEnd) this.gEnd = this.g;
    this.pushSegments(x);
  }

  /** Band-passed chunk, µV (the analysis' filter output). */
  filtered(y: Float64Array): void {
    // One pass: runs end at the next amplitude-window, ECG-bin or ECG-window edge, so the inner
    // loop only sums (power per amplitude window; mean |y| per ECG bin of B samples, nb bins per
    // ECG window) and the bookkeeping happens once per run.
    const n = y.length, W1 = this.W1, B = this.B, WE = this.WE, nb = this.nb, bins = this.bins;
    if (n > 0) this.amp.ensure(Math.floor((this.gf + n - 1) / W1));
    const cFn = this.amp.col('fn'), cF2 = this.amp.col('f2');
    let i = 0;
    while (i < n) {
      const g = this.gf;
      const w = Math.floor(g / W1);
      const stop = Math.min(n, i + (w + 1) * W1 - g, i + (B - this.binPos), i + (WE - this.ePos));
      let s2 = 0, acc = 0, cnt = 0;
      for (let j = i; j < stop; j++) {
        const v = y[j]!;
        if (v === v) { s2 += v * v; acc += v < 0 ? -v : v; cnt++; }
      }
      cFn[w] += cnt;
      cF2[w] += s2;
      const m = stop - i;
      this.gf += m;
      this.binAcc += acc;
      this.binCnt += cnt;
      this.binPos += m;
      this.ePos += m;
      i = stop;
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
   * The per-window statistics gathered so far, as plain data (typed arrays cut to length: views
   * of the tap's own columns, which are handed over, not copied):
   * what judgeScreening needs. Closes the windows still open; call once, after the pass.
   */
  windows(): ScreeningWindows {
    if (this.ePos > 0) this.closeEcgWindow();
    this.ePos = 0;
    this.closeSpectralWindow();
    const cut = <K extends string>(t: WindowColumns<K>, k: K) => t.col(k).subarray(0, t.length);
    return {
      fs: this.fs, start_s: this.start_s, samples: this.samples, end_samples: this.gEnd,
      amp_window: this.W1, spectral_window: this.W2, ecg_window: this.WE,
      has_limits: this.hasLimits, lsb: this.lsb,
      amp: { n: cut(this.amp, 'n'), hi: cut(this.amp, 'hi'), lo: cut(this.amp, 'lo'), s1: cut(this.amp, 's1'), s2: cut(this.amp, 's2'), fn: cut(this.amp, 'fn'), f2: cut(this.amp, 'f2') },
      spec: { segs: cut(this.spec, 'segs'), low: cut(this.spec, 'low'), band: cut(this.spec, 'band'), mains: this.settings.mains_hz.map((_, i) => cut(this.spec, `m${i}`)) },
      ecg: { rate: cut(this.ecg, 'rate'), r: cut(this.ecg, 'r') },
    };
  }

  /**
   * End of the pass: judge every window (judgeScreening with this tap's options), merge flagged
   * windows into findings, list excluded spans. Idempotent.
   */
  finish(): ChannelQuality {
    if (!this.finished) this.finished = judgeScreening(this.windows(), this.options);
    return this.finished;
  }
}
