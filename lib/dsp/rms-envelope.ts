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
// Sums: squares are summed per piece between consecutive window boundaries (starts and ends),
// which is the only per-sample work; a window's sum is the sum of its pieces, kept as a running
// sum over pieces and re-summed directly whenever the window has moved by W samples, so rounding
// error never builds up over a long recording (each value is within a few W·ε of the direct sum).
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { checkSamplingRate } from './butter.js';
import { concatFloat64 } from './concat-float64.js';
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
  // Closed pieces: start sample and sum of squares, in a ring (from wFirst, the oldest still needed, to tail).
  private readonly segPos: Float64Array;
  private readonly segSum: Float64Array;
  private readonly mask: number;
  private tail = 0;
  /** The open piece: its start and its sums of squares so far (even and odd samples apart). */
  private segStart = 0;
  private acc0 = 0;
  private acc1 = 0;
  /** Samples pushed; the next boundary (a window start or end), > n. */
  private n = 0;
  private nextBoundary = 0;
  /** Next envelope sample (its window ends next) and next window start not yet passed. */
  private k = 0;
  private js = 0;
  /** Running window sum over pieces [wFirst, wEnd) of the ring; start of the last direct sum. */
  private wFirst = 0;
  private wEnd = 0;
  private wSum = 0;
  private lastExact = -Infinity;
  /** Index of the last NaN input sample (−1: none yet); it adds nothing to the sums. */
  private lastNan = -1;
  private out = new Float64Array(64);
  private readonly maxHop: number;
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
    // pieces alive at once: those of one window (≤ 2 boundaries per envelope step within W
    // samples, and at most W) plus the open one and slack
    const hopMin = Math.max(1, Math.floor(fs / rate_hz) - 1);
    const cap = nextPow2(Math.min(w, 2 * Math.ceil(w / hopMin)) + 8);
    this.segPos = new Float64Array(cap);
    this.segSum = new Float64Array(cap);
    this.mask = cap - 1;
    while (this.startOf(this.js) <= 0) this.js++;
    this.nextBoundary = Math.min(this.startOf(this.js), this.endOf(0));
  }

  /** Envelope samples produced so far (the index of the next one). */
  get produced(): number {
    return this.k;
  }

  /** First sample of window j, clipped at 0. */
  private startOf(j: number): number {
    return Math.max(0, envelopeCentre(j, this.fs, this.rateHz) - this.half);
  }

  /** One past the last sample of window j (unclipped). */
  private endOf(j: number): number {
    return envelopeCentre(j, this.fs, this.rateHz) - this.half + this.window;
  }

  /** Feed input samples (any unit; the envelope has the same unit). Returns completed envelope samples. */
  push(x: ArrayLike<number>): Float64Array {
    return this.pushView(x).slice();
  }

  /**
   * As push, but the completed envelope samples are returned as a view of an internal buffer that
   * the next pushView/push overwrites (the streaming pass copies them out at once: no allocation).
   */
  pushView(x: ArrayLike<number>): Float64Array {
    const need = Math.ceil(x.length / Math.max(1, this.maxHop - 2)) + 2;
    if (this.out.length < need) this.out = new Float64Array(need);
    const len = x.length;
    let m = 0, i = 0;
    while (i < len) {
      // sum squares up to the next window start or end: the only inner loop per sample
      const base = this.n - i;
      const stop = Math.min(len, i + (this.nextBoundary - this.n));
      // two sums, of the even and of the odd samples (by index in the stream, so the result does
      // not depend on how the stream is cut): two independent additions per step instead of a
      // chain of one. A NaN makes a sum NaN: then the run is summed again, skipping it.
      const a0 = this.acc0, a1 = this.acc1, from = i;
      let e = a0, o = a1;
      if (((base + i) & 1) === 1 && i < stop) { const v = x[i]; o += v * v; i++; }
      for (; i + 1 < stop; i += 2) { const v = x[i], w = x[i + 1]; e += v * v; o += w * w; }
      if (i < stop) { const v = x[i]; e += v * v; i++; }
      if (e !== e || o !== o) {
        e = a0; o = a1;
        let lastNan = this.lastNan;
        for (i = from; i < stop; i++) {
          const v = x[i];
          if (v !== v) { lastNan = base + i; continue; }
          if (((base + i) & 1) === 0) e += v * v; else o += v * v;
        }
        this.lastNan = lastNan;
      }
      this.acc0 = e;
      this.acc1 = o;
      this.n = base + i;
      if (this.n === this.nextBoundary) {
        if (this.boundary()) this.out[m++] = this.emit();
      }
    }
    return this.out.subarray(0, m);
  }

  /** End of stream: the remaining envelope samples (windows clipped to the data). */
  flush(): Float64Array {
    if (this.flushed) return new Float64Array(0);
    this.flushed = true;
    const total = envelopeSampleCount(this.n, this.fs, this.rateHz);
    const out = new Float64Array(Math.max(0, total - this.k));
    if (this.n > this.segStart) this.closePiece();
    let m = 0;
    while (this.k < total) out[m++] = this.emit();
    return out;
  }

  /** Close the open piece at n (n is a boundary); true when window k ends here. */
  private boundary(): boolean {
    const n = this.n;
    this.closePiece();
    while (this.startOf(this.js) <= n) this.js++;
    const ends = this.endOf(this.k) === n;
    this.nextBoundary = Math.min(this.startOf(this.js), this.endOf(ends ? this.k + 1 : this.k));
    return ends;
  }

  private closePiece(): void {
    if (this.tail - this.wFirst > this.mask) throw new Error('RmsEnvelope: piece ring too small'); // sized in the constructor; never expected
    const t = this.tail & this.mask;
    this.segPos[t] = this.segStart;
    this.segSum[t] = this.acc0 + this.acc1;
    this.tail++;
    this.segStart = this.n;
    this.acc0 = 0;
    this.acc1 = 0;
  }

  /**
   * Envelope sample k over [max(0, s_k), n) — its window end, or the end of the data at flush —
   * and advance k. The window sum runs over pieces (add those closed since, drop those before the
   * start), summed afresh whenever the window has moved by W samples since the last direct sum,
   * so rounding error never builds up over a long recording.
   */
  private emit(): number {
    const a = this.startOf(this.k), b = this.n;
    const pos = this.segPos, sums = this.segSum, mask = this.mask;
    let first = this.wFirst;
    while (first < this.tail && pos[first & mask] < a) first++;
    let sum: number;
    if (a - this.lastExact >= this.window || first >= this.wEnd) {
      sum = 0;
      for (let p = first; p < this.tail; p++) sum += sums[p & mask];
      this.lastExact = a;
    } else {
      sum = this.wSum;
      for (let p = this.wFirst; p < first; p++) sum -= sums[p & mask];
      for (let p = this.wEnd; p < this.tail; p++) sum += sums[p & mask];
    }
    this.wFirst = first;
    this.wEnd = this.tail;
    this.wSum = sum;
    // later windows start no earlier: pieces before `first` are not needed again (the ring reuses them)
    this.k++;
    if (this.lastNan >= a) return NaN;
    const mean = sum / (b - a);
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
  return concatFloat64([env.pushView(x), env.flush()]);
}
