// Zero-phase (forward–backward) filtering of one or more streams in lockstep (the channels of a
// recording: same filter, same chunk lengths) by overlapped blocks, each equal to whole-signal
// sosfiltfilt (default odd padding, sosfilt_zi initial states) within 1e-12 of full scale.
//
// How: the forward pass is causal, so it runs on the stream exactly (after the odd extension of
// the first padlen+1 samples, started from sosfilt_zi·ext[0] as scipy). Its output waits in a
// buffer of B + L samples. When the buffer is full, the backward pass runs over it from its end,
// started in the steady state of the last forward value (sosfilt_zi·u), and only the first B
// outputs are kept: each of them is at least L samples before the start of that backward run, and
// L (zeroPhaseOverlap) makes the effect of the unknown true state there < 1e-12·max|x| (proof in
// zero-phase-overlap.ts). The last L samples stay in the buffer for the next block. At the end
// (flush) the odd extension of the last samples is fed and the backward pass starts at the true end,
// exactly as scipy; so the first and last outputs are exact and the middle ones are within the bound.
// Memory: two Float64Arrays of B + L samples per filter, whatever the stream length.
// Work: the backward pass runs (B + L)/B times per sample (≈ 1.02 for a 20–450 Hz band-pass at
// 2 kHz with B = 64k; ≈ 1.125 with a 50 Hz notch, whose slow poles need L ≈ 11.6k, so B = 8·L).
// Channels: every channel runs the same control flow (blocks, padding, edges), so the filter
// passes of two channels are done together by the two-lane SIMD kernel (sos-pair-kernel.ts,
// bit-identical to the scalar one); a last odd channel, or an engine without WebAssembly SIMD,
// uses the scalar kernel.
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { checkSos } from './check-sos.js';
import { concatFloat64 } from './concat-float64.js';
import type { Sos } from './sos.js';
import { sosPairKernel, type SosPairKernel } from './sos-pair-kernel.js';
import { sosfiltInPlace, sosfiltReverseInPlace } from './sosfilt-in-place.js';
import { sosfiltZi } from './sosfilt-zi.js';
import { defaultPadlen } from './sosfiltfilt.js';
import { zeroPhaseOverlap } from './zero-phase-overlap.js';

/** Receiver of one channel's filtered samples: a view valid only during the call. */
export type BankSink = (channel: number, y: Float64Array) => void;

export interface ZeroPhaseBankOptions {
  /** Edge extension at the true start and end: 'odd' (scipy's default) or 'none'. @default 'odd' */
  padtype?: 'odd' | 'none';
  /** Outputs finished per backward run, samples (at least 8·overlap is used). @default 65536 */
  blockSize?: number;
  /** Bound on the block error as a fraction of full scale (chooses the overlap). @default 1e-12 */
  tolerance?: number;
  /** Use the two-channel SIMD kernel where available (false: scalar only, for tests). @default true */
  simd?: boolean;
}

/**
 * Streaming zero-phase filter of `channels` streams in lockstep: pushTo(chunks, sink) takes one
 * chunk per channel (all of the same length) and hands each channel's outputs that are now final
 * to sink(channel, view) (they lag the input by up to blockSize + overlap samples); flushTo()
 * hands over the rest. Per channel, the outputs equal ZeroPhaseFilter's (which is a bank of one).
 * @example const bank = new ZeroPhaseBank(butter(4, [20, 450], { btype: 'bandpass', fs: 2000 }), 4);
 *          for (const chunks of stream) bank.pushTo(chunks, (c, y) => use(c, y)); bank.flushTo((c, y) => use(c, y));
 * Source: forward–backward filtering as SciPy 1.17 sosfiltfilt (Gustafsson 1996 initial states).
 */
export class ZeroPhaseBank {
  readonly sos: Sos;
  readonly channels: number;
  /** Overlap L in samples (see zeroPhaseOverlap). */
  readonly overlap: number;
  /** Outputs finished per backward run. */
  readonly blockSize: number;
  /** Odd-extension length at each end, samples. */
  readonly padlen: number;
  private pad: number;
  private readonly zi: Float64Array;
  private readonly kernel: SosPairKernel | null;
  // per channel
  private readonly fstate: Float64Array[];
  private readonly bstate: Float64Array[];
  private readonly buf: Float64Array[];
  private readonly scratch: Float64Array[];
  private readonly head: Float64Array[];
  private readonly recent: Float64Array[];
  private readonly out: Float64Array[][];
  // shared by all channels (lockstep)
  private bufStart = 0;
  private bufLen = 0;
  private headCount = 0;
  private started = false;
  private recentPos = 0;
  private nIn = 0;
  private nFed = 0;
  private sink: BankSink | null = null;
  private flushed = false;

  constructor(sos: Sos, channels: number, options: ZeroPhaseBankOptions = {}) {
    checkSos(sos);
    if (!(Number.isInteger(channels) && channels >= 1)) throw new RangeError(`ZeroPhaseBank: channels must be a positive integer, got ${channels}`);
    this.sos = Float64Array.from(sos);
    this.channels = channels;
    this.zi = sosfiltZi(sos);
    this.padlen = (options.padtype ?? 'odd') === 'odd' ? defaultPadlen(sos) : 0;
    this.pad = this.padlen;
    this.overlap = Math.max(zeroPhaseOverlap(sos, options.tolerance ?? 1e-12), this.padlen + 1);
    const b = options.blockSize ?? 65536;
    if (!(Number.isInteger(b) && b >= 1)) throw new UsageError(dspMsg.blockSize(b));
    this.blockSize = Math.max(b, 8 * this.overlap);
    const per = (n: number) => Array.from({ length: channels }, () => new Float64Array(n));
    this.fstate = per(this.zi.length);
    this.bstate = per(this.zi.length);
    this.head = per(this.padlen + 1);
    this.recent = per(this.padlen + 1);
    this.out = Array.from({ length: channels }, () => []);
    // block buffers: in the SIMD kernel's memory for the channels it filters in pairs
    const len = this.blockSize + this.overlap, paired = channels - (channels % 2);
    this.kernel = paired > 0 && options.simd !== false ? sosPairKernel(this.sos, 2 * paired * len) : null;
    const k = this.kernel;
    const block = (c: number) => (k !== null && c < paired ? k.array(len) : new Float64Array(len));
    this.buf = Array.from({ length: channels }, (_, c) => block(c));
    this.scratch = Array.from({ length: channels }, (_, c) => block(c));
  }

  /** True when pairs of channels run through the SIMD kernel. */
  get simd(): boolean {
    return this.kernel !== null;
  }

  /**
   * Feed the next chunk of every channel (not modified; equal lengths) and hand each run of
   * outputs that becomes final to `sink` as a view of an internal buffer, valid only during the
   * call (the sink may write into it). With a null sink the outputs are queued for take().
   */
  pushTo(xs: readonly ArrayLike<number>[], sink: BankSink | null): void {
    if (this.flushed) throw new UsageError(dspMsg.pushAfterFlush());
    if (xs.length !== this.channels) throw new RangeError(`ZeroPhaseBank: ${xs.length} chunks for ${this.channels} channels`);
    const n = xs[0]!.length;
    for (let c = 1; c < xs.length; c++) if (xs[c]!.length !== n) throw new RangeError('ZeroPhaseBank: chunks of unequal length');
    this.sink = sink;
    // keep the last padlen + 1 raw samples for the odd extension at the end
    const rl = this.recent[0]!.length;
    const from = Math.max(0, n - rl);
    for (let c = 0; c < this.channels; c++) {
      const x = xs[c]!, r = this.recent[c]!;
      let pos = this.recentPos;
      for (let i = from; i < n; i++) {
        r[pos] = x[i]!;
        pos = pos + 1 === rl ? 0 : pos + 1;
      }
    }
    this.recentPos = (this.recentPos + (n - from)) % rl;
    this.nIn += n;
    let i = 0;
    if (!this.started) {
      const take = Math.min(n, this.head[0]!.length - this.headCount);
      for (let c = 0; c < this.channels; c++) for (let j = 0; j < take; j++) this.head[c]![this.headCount + j] = xs[c]![j]!;
      this.headCount += take;
      i = take;
      if (this.headCount === this.head[0]!.length) this.start();
    }
    if (i < n) this.feed(xs, i, n, true);
    this.sink = null;
  }

  /** End of stream: hand the remaining outputs to `sink` (backward pass from the true end, as sosfiltfilt). */
  flushTo(sink: BankSink | null): void {
    if (this.flushed) return;
    this.flushed = true;
    const N = this.nIn;
    if (N === 0) return;
    this.sink = sink;
    if (!this.started) {
      this.pad = Math.min(this.padlen, N - 1);
      this.start();
    }
    const pad = this.pad, rl = this.recent[0]!.length;
    if (pad > 0) {
      const tails = this.recent.map((r) => {
        const xAt = (j: number) => r[(((this.recentPos - (N - j)) % rl) + rl) % rl]!; // x[j] for j ≥ N − rl
        const tail = new Float64Array(pad);
        const xl = xAt(N - 1);
        for (let j = 0; j < pad; j++) tail[j] = 2 * xl - xAt(N - 2 - j);
        return tail;
      });
      this.feed(tails, 0, pad, false);
    }
    this.backward(this.bufLen);
    this.emit(this.bufStart, this.bufLen);
    this.bufLen = 0;
    this.sink = null;
  }

  /** The queued outputs of one channel (null-sink use), joined; the queue is emptied. */
  take(c: number): Float64Array {
    const out = this.out[c]!;
    this.out[c] = [];
    return out.length === 1 ? out[0]! : concatFloat64(out);
  }

  /** Odd extension of the head and the first samples into the forward pass. */
  private start(): void {
    this.started = true;
    const pad = this.pad;
    const exts = this.head.map((h, c) => {
      const ext = new Float64Array(pad);
      const x0 = h[0]!;
      for (let i = 0; i < pad; i++) ext[i] = 2 * x0 - h[pad - i]!;
      const e0 = pad > 0 ? ext[0]! : x0;
      const f = this.fstate[c]!;
      for (let s = 0; s < f.length; s++) f[s] = this.zi[s]! * e0;
      return ext;
    });
    this.feed(exts, 0, pad, false);
    this.feed(this.head, 0, this.headCount, true);
  }

  /** Forward-filter every channel's src[from..to) into its buffer, running backward blocks when full. */
  private feed(srcs: readonly ArrayLike<number>[], from: number, to: number, real: boolean): void {
    const cap = this.buf[0]!.length;
    let i = from;
    while (i < to) {
      const m = Math.min(cap - this.bufLen, to - i);
      this.forward(srcs, i, this.bufLen, m);
      this.bufLen += m;
      i += m;
      if (real) this.nFed += m;
      if (this.bufLen === cap) this.block();
    }
  }

  /** Forward pass of src[i..i+m) into buf[b0..b0+m) for every channel (pairs through the kernel). */
  private forward(srcs: readonly ArrayLike<number>[], i: number, b0: number, m: number): void {
    const C = this.channels;
    let c = 0;
    if (this.kernel !== null) {
      for (; c + 2 <= C; c += 2) {
        const a = srcs[c]!, b = srcs[c + 1]!;
        const fa = this.fstate[c]!, fb = this.fstate[c + 1]!, ba = this.buf[c]!, bb = this.buf[c + 1]!;
        if (a instanceof Float64Array && b instanceof Float64Array) this.kernel.run(fa, ba, fb, bb, b0, b0 + m, false, a, b, i);
        else {
          for (let j = 0; j < m; j++) { ba[b0 + j] = a[i + j]!; bb[b0 + j] = b[i + j]!; }
          this.kernel.run(fa, ba, fb, bb, b0, b0 + m, false);
        }
      }
    }
    for (; c < C; c++) {
      const src = srcs[c]!;
      if (src instanceof Float64Array) sosfiltInPlace(this.sos, this.fstate[c]!, this.buf[c]!, b0, b0 + m, src, i);
      else {
        const buf = this.buf[c]!;
        for (let j = 0; j < m; j++) buf[b0 + j] = src[i + j]!;
        sosfiltInPlace(this.sos, this.fstate[c]!, buf, b0, b0 + m);
      }
    }
  }

  /** Backward pass over buf[0..len) of every channel into scratch, from the steady state of its last value. */
  private backward(len: number): void {
    const C = this.channels;
    for (let c = 0; c < C; c++) {
      const last = this.buf[c]![len - 1]!, bs = this.bstate[c]!;
      for (let s = 0; s < bs.length; s++) bs[s] = this.zi[s]! * last;
    }
    let c = 0;
    if (this.kernel !== null) {
      for (; c + 2 <= C; c += 2) {
        this.kernel.run(this.bstate[c]!, this.scratch[c]!, this.bstate[c + 1]!, this.scratch[c + 1]!, 0, len, true, this.buf[c]!, this.buf[c + 1]!, 0);
      }
    }
    for (; c < C; c++) sosfiltReverseInPlace(this.sos, this.bstate[c]!, this.scratch[c]!, 0, len, this.buf[c]!, 0);
  }

  /** Backward pass over the full buffers; keep all but the last `overlap` outputs. */
  private block(): void {
    const len = this.bufLen, keep = len - this.overlap;
    this.backward(len);
    this.emit(this.bufStart, keep);
    for (const b of this.buf) b.copyWithin(0, keep, len);
    this.bufStart += keep;
    this.bufLen = this.overlap;
  }

  /** Hand over scratch[0..count) of each channel (extended positions bufStart…) clipped to the real samples. */
  private emit(extStart: number, count: number): void {
    const lo = Math.max(extStart, this.pad), hi = Math.min(extStart + count, this.pad + this.nFed);
    if (hi <= lo) return;
    for (let c = 0; c < this.channels; c++) {
      const sc = this.scratch[c]!;
      if (this.sink !== null) this.sink(c, sc.subarray(lo - extStart, hi - extStart));
      else this.out[c]!.push(sc.slice(lo - extStart, hi - extStart));
    }
  }
}
