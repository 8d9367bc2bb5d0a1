// Zero-phase (forward–backward) filtering of one stream by overlapped blocks, equal to
// whole-signal sosfiltfilt (default odd padding, sosfilt_zi initial states) within 1e-12 of full
// scale: a ZeroPhaseBank of one channel (zero-phase-bank.ts explains the method and its bound).
import { concatFloat64 } from './concat-float64.js';
import { ZeroPhaseBank, type ZeroPhaseBankOptions } from './zero-phase-bank.js';
import type { Sos } from './sos.js';

/** Receiver of filtered samples: a view valid only during the call. */
export type OutputSink = (y: Float64Array) => void;

export type ZeroPhaseFilterOptions = Omit<ZeroPhaseBankOptions, 'simd'>;

/**
 * Streaming zero-phase filter. push(chunk) returns the outputs that are now final (they lag the
 * input by up to blockSize + overlap samples); flush() returns the rest. Total output length =
 * total input length. A stream shorter than padlen + 1 samples is padded with padlen = N − 1
 * (scipy would refuse it).
 * @example const zp = new ZeroPhaseFilter(butter(4, [20, 450], { btype: 'bandpass', fs: 2000 }));
 *          for (const c of chunks) use(zp.push(c)); use(zp.flush());
 * Source: forward–backward filtering as SciPy 1.17 sosfiltfilt (Gustafsson 1996 initial states).
 */
export class ZeroPhaseFilter {
  private readonly bank: ZeroPhaseBank;
  private sink: OutputSink | null = null;
  private readonly toSink = (_c: number, y: Float64Array): void => this.sink!(y);

  constructor(sos: Sos, options: ZeroPhaseFilterOptions = {}) {
    this.bank = new ZeroPhaseBank(sos, 1, options);
  }

  /** The cascade (a copy of the one given). */
  get sos(): Sos { return this.bank.sos; }
  /** Overlap L in samples (see zeroPhaseOverlap). */
  get overlap(): number { return this.bank.overlap; }
  /** Outputs finished per backward run. */
  get blockSize(): number { return this.bank.blockSize; }
  /** Odd-extension length at each end, samples. */
  get padlen(): number { return this.bank.padlen; }

  /** Feed the next chunk (not modified); returns the outputs that are final now. */
  push(x: ArrayLike<number>): Float64Array {
    this.bank.pushTo([x], null);
    return this.bank.take(0);
  }

  /**
   * Feed the next chunk (not modified) and hand each run of outputs that becomes final to `sink`,
   * in order, as a view of an internal buffer that is valid only during the call (the sink may
   * write into it). With a null sink the outputs are queued for push()/flush() to return.
   */
  pushTo(x: ArrayLike<number>, sink: OutputSink | null): void {
    this.sink = sink;
    this.bank.pushTo([x], sink ? this.toSink : null);
    this.sink = null;
  }

  /** End of stream: the remaining outputs (backward pass from the true end, as sosfiltfilt). */
  flush(): Float64Array {
    this.bank.flushTo(null);
    return this.bank.take(0);
  }

  /** End of stream: hand the remaining outputs to `sink` (as pushTo). */
  flushTo(sink: OutputSink | null): void {
    this.sink = sink;
    this.bank.flushTo(sink ? this.toSink : null);
    this.sink = null;
  }
}

/** Batch form of ZeroPhaseFilter (for tests and short signals; sosfiltfilt is the reference). */
export function zeroPhaseFilter(sos: Sos, x: ArrayLike<number>, options: ZeroPhaseFilterOptions = {}): Float64Array {
  const zp = new ZeroPhaseFilter(sos, options);
  return concatFloat64([zp.push(x), zp.flush()]);
}
