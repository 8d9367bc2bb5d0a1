// Moving RMS envelope of a stream (square → moving mean → square root), evaluated at a lower rate.
//
// Timing convention (the one every envelope in shiftload follows):
//   envelope sample k belongs to time t_k = k / rate_hz s from the stream start;
//   its centre sample is c_k = secondsToSamples(t_k, fs);
//   its window covers samples [c_k − ⌊W/2⌋, c_k − ⌊W/2⌋ + W), W = secondsToSamples(window_s, fs),
//   clipped to the data at both ends and divided by the number of samples inside
//   (numpy's "same" alignment with a shrinking divisor: moving_rms.json `centered_same_shrinking`).
//   For N input samples there are as many envelope samples as there are k with c_k < N.
// NaN: an envelope sample whose window contains a NaN input is NaN (NaN marks invalid time).
// Sums: a running sum of squares, re-summed directly from the buffered squares whenever the
// window has moved by W samples since the last direct sum, so rounding error never builds up
// over a long recording (each value is within a few W·ε of the direct sum, even on a large offset).
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { checkSamplingRate } from './butter.js';
import { secondsToSamples } from './seconds-to-samples.js';

export interface RmsEnvelopeOptions {
  /** Sampling rate of the input, Hz. */
  fs: number;
  /** RMS window length, s (rounded to samples by secondsToSamples; ≥ 1 sample). */
  window_s: number;
  /** Envelope rate, Hz (one envelope sample every 1/rate_hz s; 0 < rate_hz ≤ fs). */
  rate_hz: number;
}

/** Centre sample c_k of envelope sample k. */
export function envelopeCentre(k: number, fs: number, rateHz: number): number {
  return secondsToSamples(k / rateHz, fs);
}

/**
 * Number of envelope samples for n input samples: the count of k with c_k < n.
 * @example envelopeSampleCount(2000, 1000, 20) // 40 (t = 0, 0.05, …, 1.95 s)
 */
export function envelopeSampleCount(n: number, fs: number, rateHz: number): number {
  if (n <= 0) return 0;
  let k = Math.max(0, Math.ceil((n * rateHz) / fs) - 2);
  while (k > 0 && envelopeCentre(k - 1, fs, rateHz) >= n) k--;
  while (envelopeCentre(k, fs, rateHz) < n) k++;
  return k;
}

function nextPow2(v: number): number {
  let p = 1;
  while (p < v) p *= 2;
  return p;
}

/**
 * Streaming moving-RMS envelope. push(chunk) returns the envelope samples whose windows are
 * complete; flush() returns the rest (windows clipped at the end). Any chunk split gives the
 * same output as rmsEnvelope() on the whole signal.
 * @example const env = new RmsEnvelope({ fs: 2000, window_s: 0.1, rate_hz: 20 });
 *          for (const c of chunks) keep(env.push(c)); keep(env.flush());
 */
export class RmsEnvelope {
  readonly fs: number;
  readonly rateHz: number;
  /** Window length in samples. */
  readonly window: number;
  private readonly half: number;
  private readonly sq: Float64Array;
  private readonly nan: Uint8Array;
  private readonly mask: number;
  private readonly maxHop: number;
  private n = 0;
  private k = 0;
  private nextEnd: number;
  private ws = 0;
  private we = 0;
  private sum = 0;
  private nanCount = 0;
  private lastExact = -Infinity;
  private flushed = false;

  /** @throws UsageError for fs ≤ 0, a window under one sample, or rate_hz outside (0, fs] */
  constructor(options: RmsEnvelopeOptions) {
    const { fs, window_s, rate_hz } = options;
    checkSamplingRate(fs);
    if (!(rate_hz > 0 && rate_hz <= fs)) throw new UsageError(dspMsg.envelopeRate(fs, rate_hz));
    const w = Number.isFinite(window_s) ? secondsToSamples(window_s, fs) : 0;
    if (!(w >= 1)) throw new UsageError(dspMsg.rmsWindow(window_s, fs));
    this.fs = fs;
    this.rateHz = rate_hz;
    this.window = w;
    this.half = Math.floor(w / 2);
    this.maxHop = Math.ceil(fs / rate_hz) + 1;
    const cap = nextPow2(w + this.maxHop + 2);
    this.sq = new Float64Array(cap);
    this.nan = new Uint8Array(cap);
    this.mask = cap - 1;
    this.nextEnd = envelopeCentre(0, fs, rate_hz) - this.half + w;
  }

  /** Envelope samples produced so far (the index of the next one). */
  get produced(): number {
    return this.k;
  }

  /** Feed input samples (any unit; the envelope has the same unit). Returns completed envelope samples. */
  push(x: ArrayLike<number>): Float64Array {
    const out = new Float64Array(Math.ceil(x.length / Math.max(1, this.maxHop - 2)) + 2);
    let m = 0;
    const sq = this.sq, nan = this.nan, mask = this.mask;
    let n = this.n;
    let nextEnd = this.nextEnd;
    for (let i = 0; i < x.length; i++) {
      const v = x[i];
      const j = n & mask;
      if (v === v) { sq[j] = v * v; nan[j] = 0; } else { sq[j] = 0; nan[j] = 1; }
      n++;
      if (n === nextEnd) {
        this.n = n;
        out[m++] = this.emit(n);
        nextEnd = this.nextEnd;
      }
    }
    this.n = n;
    return out.subarray(0, m).slice();
  }

  /** End of stream: the remaining envelope samples (windows clipped to the data). */
  flush(): Float64Array {
    if (this.flushed) return new Float64Array(0);
    this.flushed = true;
    const total = envelopeSampleCount(this.n, this.fs, this.rateHz);
    const out = new Float64Array(Math.max(0, total - this.k));
    let m = 0;
    while (this.k < total) out[m++] = this.emit(this.n);
    return out;
  }

  /** Compute envelope sample k over [max(0, s_k), min(limit, e_k)) and advance k. */
  private emit(limit: number): number {
    const s = envelopeCentre(this.k, this.fs, this.rateHz) - this.half;
    const a = Math.max(0, s), b = Math.min(limit, s + this.window);
    const sq = this.sq, nan = this.nan, mask = this.mask;
    if (a >= this.we || a - this.lastExact >= this.window) {
      let sum = 0, bad = 0;
      for (let i = a; i < b; i++) { sum += sq[i & mask]; bad += nan[i & mask]; }
      this.sum = sum; this.nanCount = bad; this.lastExact = a;
    } else {
      let sum = this.sum, bad = this.nanCount;
      for (let i = this.we; i < b; i++) { sum += sq[i & mask]; bad += nan[i & mask]; }
      for (let i = this.ws; i < a; i++) { sum -= sq[i & mask]; bad -= nan[i & mask]; }
      this.sum = sum; this.nanCount = bad;
    }
    this.ws = a; this.we = b;
    this.k++;
    this.nextEnd = envelopeCentre(this.k, this.fs, this.rateHz) - this.half + this.window;
    if (this.nanCount > 0) return NaN;
    const mean = this.sum / (b - a);
    return mean > 0 ? Math.sqrt(mean) : 0;
  }
}

/**
 * Moving-RMS envelope of a whole array (batch form of RmsEnvelope; same timing convention).
 * @returns envelope samples at rate_hz, envelopeSampleCount(x.length, fs, rate_hz) of them
 * @example rmsEnvelope(x, { fs: 1000, window_s: 0.1, rate_hz: 20 })
 * Common practice (RMS amplitude over a sliding window), no single source; see METHODS.md §8.5.
 */
export function rmsEnvelope(x: ArrayLike<number>, options: RmsEnvelopeOptions): Float64Array {
  const env = new RmsEnvelope(options);
  const a = env.push(x);
  const b = env.flush();
  const out = new Float64Array(a.length + b.length);
  out.set(a);
  out.set(b, a.length);
  return out;
}
