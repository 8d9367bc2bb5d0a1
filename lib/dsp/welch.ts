// Welch power spectral density (scipy.signal.welch with window='hann', detrend='constant',
// scaling='density', return_onesided=True, average='mean', nfft = nperseg), for streams.
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { checkSamplingRate } from './butter.js';
import { cachedFft } from './cached-fft.js';

export interface WelchOptions {
  /** Sampling rate, Hz. */
  fs: number;
  /** Segment length, samples (a power of two, 8…2^20; nfft = nperseg). @default 256 (scipy) */
  nperseg?: number;
  /** Samples shared by consecutive segments (0…nperseg−1). @default floor(nperseg/2) (scipy) */
  noverlap?: number;
  /** Segments holding a NaN: 'propagate' (PSD becomes NaN, as scipy) or 'skip' (left out, counted). @default 'propagate' */
  nan?: 'propagate' | 'skip';
}

/** Defaults as scipy.signal.welch. */
export const WELCH_DEFAULTS = { nperseg: 256 };

export interface WelchResult {
  /** Bin frequencies k·fs/nperseg, Hz, k = 0…nperseg/2. */
  f_hz: Float64Array;
  /** One-sided PSD, (input unit)²/Hz; NaN when no whole segment was seen. */
  psd: Float64Array;
  /** Number of segments averaged. */
  segments: number;
  /** Segments left out because they held a NaN (option nan: 'skip'). */
  skipped_segments: number;
  fs: number;
  nperseg: number;
  noverlap: number;
}

/**
 * Streaming Welch PSD accumulator: push chunks, read result(). Segments start at 0, hop,
 * 2·hop, … (hop = nperseg − noverlap) from the first sample pushed, straddle chunk boundaries, and
 * trailing samples that do not fill a segment are ignored; so any chunk split gives the same PSD
 * as welch() on the whole signal. Each segment: minus its mean, times the periodic Hann window
 * 0.5 − 0.5·cos(2πn/nperseg), |rfft|² / (fs·Σw²), bins 1…nperseg/2−1 doubled; segments averaged.
 * NaN in a segment makes the PSD NaN (scipy's behaviour), or with nan: 'skip' the segment is left out.
 * @throws UsageError for nperseg not a power of two in 8…2^20 or noverlap out of range
 * @example const w = new WelchAccumulator({ fs: 1000, nperseg: 1024, noverlap: 512 }); w.push(x); w.result();
 * Source: Welch PD (1967) IEEE Trans Audio Electroacoust 15(2):70–73; conventions of SciPy 1.17 welch.
 */
export class WelchAccumulator {
  readonly fs: number;
  readonly nperseg: number;
  readonly noverlap: number;
  private readonly window: Float64Array;
  private readonly scale: number;
  private readonly seg: Float64Array;
  private readonly work: Float64Array;
  private readonly spec: Float64Array;
  private readonly sum: Float64Array;
  private readonly skipNaN: boolean;
  private fill = 0;
  private count = 0;
  private skipped = 0;

  constructor(options: WelchOptions) {
    checkSamplingRate(options.fs);
    const n = options.nperseg ?? WELCH_DEFAULTS.nperseg;
    if (!(Number.isInteger(n) && n >= 8 && n <= 1 << 20 && (n & (n - 1)) === 0)) throw new UsageError(dspMsg.nperseg(n));
    const nov = options.noverlap ?? Math.floor(n / 2);
    if (!(Number.isInteger(nov) && nov >= 0 && nov < n)) throw new UsageError(dspMsg.noverlap(n, nov));
    this.fs = options.fs;
    this.nperseg = n;
    this.noverlap = nov;
    this.skipNaN = options.nan === 'skip';
    this.window = new Float64Array(n);
    let s2 = 0;
    for (let i = 0; i < n; i++) {
      const w = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / n);
      this.window[i] = w;
      s2 += w * w;
    }
    this.scale = 1 / (this.fs * s2);
    this.seg = new Float64Array(n);
    this.work = new Float64Array(n);
    this.spec = new Float64Array(2 * n);
    this.sum = new Float64Array(n / 2 + 1);
  }

  /** Number of whole segments averaged so far. */
  get segments(): number {
    return this.count;
  }

  /** Feed the next chunk (not modified). */
  push(x: ArrayLike<number>): void {
    const n = this.nperseg, seg = this.seg;
    let i = 0;
    while (i < x.length) {
      const m = Math.min(n - this.fill, x.length - i);
      for (let j = 0; j < m; j++) seg[this.fill + j] = x[i + j];
      this.fill += m;
      i += m;
      if (this.fill === n) {
        this.segment();
        seg.copyWithin(0, n - this.noverlap, n);
        this.fill = this.noverlap;
      }
    }
  }

  private segment(): void {
    const n = this.nperseg, seg = this.seg, work = this.work, win = this.window, spec = this.spec, sum = this.sum;
    let mean = 0;
    for (let i = 0; i < n; i++) mean += seg[i];
    if (mean !== mean && this.skipNaN) { this.skipped++; return; }
    mean /= n;
    for (let i = 0; i < n; i++) work[i] = (seg[i] - mean) * win[i];
    cachedFft(n).realTransform(spec, work);
    const half = n / 2;
    for (let k = 0; k <= half; k++) {
      const re = spec[2 * k], im = spec[2 * k + 1];
      const p = (re * re + im * im) * this.scale;
      sum[k] += k === 0 || k === half ? p : 2 * p;
    }
    this.count++;
  }

  /** The PSD of the segments seen so far (new arrays). */
  result(): WelchResult {
    const half = this.nperseg / 2;
    const f = new Float64Array(half + 1);
    const psd = new Float64Array(half + 1);
    for (let k = 0; k <= half; k++) {
      f[k] = (k * this.fs) / this.nperseg;
      psd[k] = this.count > 0 ? this.sum[k] / this.count : NaN;
    }
    return { f_hz: f, psd, segments: this.count, skipped_segments: this.skipped, fs: this.fs, nperseg: this.nperseg, noverlap: this.noverlap };
  }
}

/**
 * Welch PSD of a whole array (batch form of WelchAccumulator).
 * @example welch(x, { fs: 1000, nperseg: 1024, noverlap: 512 }) // → { f_hz, psd, segments, … }
 */
export function welch(x: ArrayLike<number>, options: WelchOptions): WelchResult {
  const w = new WelchAccumulator(options);
  w.push(x);
  return w.result();
}
