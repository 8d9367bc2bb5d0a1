// The per-channel filter stage of the analysis: optional mains notch (and harmonics), then a
// Butterworth band-pass, both zero-phase by overlapped blocks. Outputs the filtered signal
// (used by EnvelopePipeline and by `convert --band`).
//
// No separate offset removal is needed: the band-pass has a zero at DC (b0 + b1 + b2 = 0 in its
// high-pass sections), so any constant or slowly drifting offset is rejected with the rest of the
// low-frequency content; subtracting a mean first would change nothing but rounding.
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { butter } from './butter.js';
import { concatFloat64 } from './concat-float64.js';
import { mainsNotch } from './mains-notch.js';
import { sosConcat, type Sos } from './sos.js';
import { ZeroPhaseBank, type BankSink } from './zero-phase-bank.js';
import type { OutputSink } from './zero-phase-filter.js';

/** Filter settings shared by BandFilter and EnvelopePipeline. */
export interface BandFilterOptions {
  /** Sampling rate, Hz (required). */
  fs: number;
  /** Band-pass cut-offs [low, high], Hz (high < fs/2). @default [20, 450] */
  band_hz?: readonly [number, number];
  /** Butterworth order of the band-pass prototype (the band-pass has 2·order poles). @default 4 */
  order?: number;
  /** Mains frequency to notch, Hz, or null for no notch. @default null */
  mains_hz?: 50 | 60 | null;
  /** Multiples k·mains_hz (k = 1…mains_harmonics, below fs/2) that are notched. @default 3 */
  mains_harmonics?: number;
  /** Quality factor of each notch (−3 dB width = frequency/Q). @default 30 */
  mains_q?: number;
}

/** Defaults of the filter stage (units in the option docs above). */
export const BAND_FILTER_DEFAULTS = {
  /** Hz; 20–450 Hz, common surface-EMG band (De Luca et al. 2010, J Biomech 43:1573, METHODS.md §8.4). */
  band_hz: [20, 450] as readonly [number, number],
  /** Butterworth order; 4th order is common practice (Drake & Callaghan 2006, METHODS.md §8.3). */
  order: 4,
  /** Hz or null; off unless asked for, since a notch also removes EMG power at the mains frequency. */
  mains_hz: null as 50 | 60 | null,
  /** count of mains multiples notched. */
  mains_harmonics: 3,
  /** notch quality factor. */
  mains_q: 30,
};

/** The resolved settings of a filter stage (for methods text and results). */
export interface BandFilterSettings {
  fs: number;
  band_hz: [number, number];
  order: number;
  mains_hz: 50 | 60 | null;
  mains_harmonics: number;
  mains_q: number;
  /** Frequencies actually notched, Hz. */
  notch_hz: number[];
  /** Overlap of the block zero-phase filter, samples. */
  overlap_samples: number;
  /** Odd-extension length at the recording's start and end, samples. */
  padlen_samples: number;
}

/** Build the SOS cascade (notches first, then band-pass) for resolved options. */
export function bandFilterSos(options: BandFilterOptions): { sos: Sos; notchHz: number[] } {
  const o = resolve(options);
  const bp = butter(o.order, o.band_hz, { btype: 'bandpass', fs: o.fs });
  if (o.mains_hz === null) return { sos: bp, notchHz: [] };
  if (o.mains_hz !== 50 && o.mains_hz !== 60) throw new UsageError(dspMsg.mainsHz(o.mains_hz));
  const notch = mainsNotch(o.mains_hz, o.fs, { harmonics: o.mains_harmonics, Q: o.mains_q });
  const notchHz = Array.from({ length: notch.length / 6 }, (_, k) => (k + 1) * (o.mains_hz as number));
  return { sos: sosConcat(notch, bp), notchHz };
}

/** Options with every default filled in. */
function resolve(o: BandFilterOptions): Required<BandFilterOptions> {
  const d = BAND_FILTER_DEFAULTS;
  return {
    fs: o.fs, band_hz: o.band_hz ?? d.band_hz, order: o.order ?? d.order,
    mains_hz: o.mains_hz === undefined ? d.mains_hz : o.mains_hz,
    mains_harmonics: o.mains_harmonics ?? d.mains_harmonics, mains_q: o.mains_q ?? d.mains_q,
  };
}

/**
 * Streaming zero-phase notch + band-pass of several channels in lockstep (same settings, chunks
 * of equal length): each channel as BandFilter, with the filter passes of channel pairs done
 * together (ZeroPhaseBank). pushTo(chunks, sink) hands sink(channel, view) the samples now final.
 * @throws UsageError for invalid cut-offs, order or mains settings (messages from butter/iirnotch)
 * @example const bank = new BandFilterBank({ fs: 2000 }, 4); bank.pushTo(chunks, (c, y) => use(c, y)); bank.flushTo((c, y) => use(c, y));
 */
export class BandFilterBank {
  readonly settings: BandFilterSettings;
  readonly channels: number;
  private readonly zp: ZeroPhaseBank;
  // per channel: last valid input, outputs handed over, pending NaN runs [start, end) (oldest first)
  private readonly last: Float64Array;
  private readonly nOut: Float64Array;
  private readonly runs: number[][];
  private nIn = 0;
  private sink: BankSink | null = null;
  private readonly cleanedChunks: ArrayLike<number>[];

  constructor(options: BandFilterOptions, channels: number, bankOptions: { simd?: boolean } = {}) {
    const o = resolve(options);
    const { sos, notchHz } = bandFilterSos(o);
    this.zp = new ZeroPhaseBank(sos, channels, { simd: bankOptions.simd });
    this.channels = channels;
    this.last = new Float64Array(channels);
    this.nOut = new Float64Array(channels);
    this.runs = Array.from({ length: channels }, () => []);
    this.cleanedChunks = new Array(channels);
    this.settings = {
      fs: o.fs, band_hz: [o.band_hz[0], o.band_hz[1]], order: o.order, mains_hz: o.mains_hz,
      mains_harmonics: o.mains_harmonics, mains_q: o.mains_q, notch_hz: notchHz,
      overlap_samples: this.zp.overlap, padlen_samples: this.zp.padlen,
    };
  }

  /**
   * Feed the next chunk of every channel (not modified; equal lengths) and hand the filtered
   * samples now final to `sink`, in order per channel, as views valid only during the call.
   * @param nanFree the caller guarantees no NaN in the chunks (skips the scan for them)
   */
  pushTo(xs: readonly ArrayLike<number>[], sink: BankSink, nanFree = false): void {
    const n = xs.length > 0 ? xs[0]!.length : 0;
    for (let c = 0; c < this.channels; c++) this.cleanedChunks[c] = this.cleaned(c, xs[c]!, nanFree);
    this.nIn += n;
    this.sink = sink;
    this.zp.pushTo(this.cleanedChunks, this.restoring);
    this.sink = null;
    this.cleanedChunks.fill(EMPTY);
  }

  /** End of stream: hand the remaining filtered samples to `sink` (as pushTo). */
  flushTo(sink: BankSink): void {
    this.sink = sink;
    this.zp.flushTo(this.restoring);
    this.sink = null;
  }

  /** Channel c's chunk with NaN replaced by the last valid value (the chunk itself when it has none). */
  private cleaned(c: number, x: ArrayLike<number>, nanFree: boolean): ArrayLike<number> {
    // fast path: no NaN in the chunk, filter it as it is (ZeroPhaseBank never mutates its input)
    if (nanFree || !mayHoldNaN(x)) {
      if (x.length > 0) this.last[c] = x[x.length - 1]!;
      return x;
    }
    const clean = new Float64Array(x.length);
    let last = this.last[c]!;
    const runs = this.runs[c]!;
    const base = this.nIn;
    for (let i = 0; i < x.length; i++) {
      const v = x[i]!;
      if (v === v) { clean[i] = v; last = v; continue; }
      clean[i] = last;
      const at = base + i;
      if (runs.length > 0 && runs[runs.length - 1] === at) runs[runs.length - 1] = at + 1;
      else runs.push(at, at + 1);
    }
    this.last[c] = last;
    return clean;
  }

  /** Put NaN back where the input had it, then pass the run on. */
  private readonly restoring: BankSink = (c, y) => {
    this.restoreNaN(c, y);
    this.sink!(c, y);
  };

  private restoreNaN(c: number, y: Float64Array): void {
    const start = this.nOut[c]!, end = start + y.length;
    const runs = this.runs[c]!;
    let r = 0;
    while (r < runs.length && runs[r]! < end) {
      const a = Math.max(runs[r]!, start), b = Math.min(runs[r + 1]!, end);
      for (let i = a; i < b; i++) y[i - start] = NaN;
      if (runs[r + 1]! <= end) r += 2;
      else break;
    }
    if (r > 0) runs.splice(0, r);
    this.nOut[c] = end;
  }
}

const EMPTY = new Float64Array(0);

/**
 * Streaming zero-phase notch + band-pass of one channel. push(chunk) returns filtered samples that
 * are final (lagging the input by up to one block); flush() returns the rest; total output length
 * equals total input length, in the input's unit (µV).
 *
 * NaN input (invalid time) does not poison the IIR state: it is replaced by the last valid value
 * (0 before any) for filtering, and the output is NaN at exactly the same samples. Filter ringing
 * from the replaced stretch can reach a few tens of ms beyond the gap on either side.
 * @throws UsageError for invalid cut-offs, order or mains settings (messages from butter/iirnotch)
 * @example const bf = new BandFilter({ fs: 2000, mains_hz: 50 }); out(bf.push(chunk)); out(bf.flush());
 */
export class BandFilter {
  private readonly bank: BandFilterBank;
  private sink: OutputSink | null = null;
  private readonly toSink = (_c: number, y: Float64Array): void => this.sink!(y);
  private readonly one: ArrayLike<number>[] = [EMPTY];

  constructor(options: BandFilterOptions) {
    this.bank = new BandFilterBank(options, 1);
  }

  get settings(): BandFilterSettings {
    return this.bank.settings;
  }

  /** Feed the next chunk (not modified). Returns the filtered samples now final. */
  push(x: ArrayLike<number>): Float64Array {
    const parts: Float64Array[] = [];
    this.pushTo(x, (y) => parts.push(y.slice()));
    return joinParts(parts);
  }

  /**
   * Feed the next chunk (not modified) and hand the filtered samples now final to `sink`, in
   * order, as views valid only during the call (no copies: the streaming analysis' path).
   */
  pushTo(x: ArrayLike<number>, sink: OutputSink): void {
    this.sink = sink;
    this.one[0] = x;
    this.bank.pushTo(this.one, this.toSink);
    this.one[0] = EMPTY;
    this.sink = null;
  }

  /** End of stream: the remaining filtered samples. */
  flush(): Float64Array {
    const parts: Float64Array[] = [];
    this.flushTo((y) => parts.push(y.slice()));
    return joinParts(parts);
  }

  /** End of stream: hand the remaining filtered samples to `sink` (as pushTo). */
  flushTo(sink: OutputSink): void {
    this.sink = sink;
    this.bank.flushTo(this.toSink);
    this.sink = null;
  }
}

/**
 * False when x certainly holds no NaN: a NaN anywhere makes the sum NaN (four partial sums keep
 * the additions independent, so the scan runs at memory speed). True also for ±Infinity
 * pairs, which the exact check that follows then tells apart.
 */
function mayHoldNaN(x: ArrayLike<number>): boolean {
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0, i = 0;
  const n = x.length;
  for (; i + 4 <= n; i += 4) { s0 += x[i]; s1 += x[i + 1]; s2 += x[i + 2]; s3 += x[i + 3]; }
  for (; i < n; i++) s0 += x[i];
  const s = s0 + s1 + s2 + s3;
  if (s === s) return false;
  for (let j = 0; j < n; j++) if (x[j] !== x[j]) return true;
  return false;
}

function joinParts(parts: Float64Array[]): Float64Array {
  return parts.length === 1 ? parts[0]! : concatFloat64(parts);
}
