// One streaming pass over a span of a recording: each requested channel goes through the same
// filter (optional notch, zero-phase Butterworth band-pass; the channels of one sampling rate as
// one BandFilterBank, so pairs share the SIMD kernel) and one or two moving-RMS envelopes.
// Field data, reference contractions and rest recordings all use this function, so the
// references are processed exactly like the field data (DESIGN.md).
import { BandFilterBank, type BandFilterSettings } from '../dsp/band-filter.js';
import { RmsEnvelope } from '../dsp/rms-envelope.js';
import { secondsToSamples } from '../dsp/seconds-to-samples.js';
import { microvoltsPerUnit } from '../io/microvolts-per-unit.js';
import { openRecording } from '../io/open-recording.js';
import type { OpenOptions } from '../io/open-options.js';
import { GrowableFloat64 } from './growable-float64.js';

/** The filter of the analysis, as settings (the sampling rate comes from each channel). */
export interface FilterSpec {
  band_hz: readonly [number, number];
  order: number;
  mains_hz: 50 | 60 | null;
  mains_harmonics: number;
  mains_q: number;
}

/** A moving-RMS evaluation: window length and rate. */
export interface EnvelopeSpec {
  window_s: number;
  rate_hz: number;
}

/**
 * An observer of one channel during the streaming pass (quality screening, spectral epochs).
 * It sees every raw chunk (physical values, before filtering) and every filtered chunk (after the
 * notch and band-pass, µV) in time order; arrays are only valid during the call.
 */
export interface ChannelTap {
  /** Raw samples; `first` is the index of x[0] within the span read (samples of this channel). */
  raw?(x: Float64Array, first: number): void;
  /** Filtered samples, in order, contiguous within one continuous piece. */
  filtered?(y: Float64Array): void;
  /** A discontinuity (EDF+D): the next piece starts at `offset_s` from the span start. */
  restart?(offset_s: number): void;
}

export interface ReadEnvelopesRequest {
  file: string;
  /** Signal indices (SignalInfo.index) to read, one envelope set per index. */
  signals: number[];
  /** Span, s from the file start; end null = to the end of the file. */
  start_s: number;
  end_s: number | null;
  filter: FilterSpec;
  /** The main envelope (field data). */
  envelope: EnvelopeSpec;
  /** Optional second envelope over the same filtered signal (e.g. a 1-s window for MVE). */
  second?: EnvelopeSpec;
  /** Reader options (chunk size, CSV rate). */
  open?: OpenOptions;
  /** Observers per requested signal (same order as `signals`), e.g. quality screening. */
  taps?: (ChannelTap | null)[];
  /** Called after each chunk with the seconds of the span read so far. */
  onProgress?: (doneS: number) => void;
}

export interface ChannelEnvelopes {
  /** Main envelope, µV; sample k at start_s + k / rate_hz. NaN = no data or NaN input. */
  envelope: Float64Array;
  /** Second envelope, µV (when requested). */
  second: Float64Array | null;
  /** Filter settings resolved for this channel's sampling rate. */
  filter: BandFilterSettings;
  rate_hz: number;
  /** Samples at the digital limits within the span. */
  clipped_low: number;
  clipped_high: number;
  samples: number;
  /** Sampling rate of the signal, Hz. */
  fs: number;
  /** The signal's unit in the file, and the factor applied to reach µV (1 when the unit is unknown). */
  unit: string;
  unit_known: boolean;
}

export interface ReadEnvelopesResult {
  channels: ChannelEnvelopes[];
  /** Span actually read, s from the file start. */
  start_s: number;
  end_s: number;
  /** Number of discontinuities (EDF+D) met; each restarts the filters and leaves NaN between. */
  discontinuities: number;
}

class ChannelState {
  main: RmsEnvelope;
  second: RmsEnvelope | null;
  readonly mainOut: GrowableFloat64;
  readonly secondOut: GrowableFloat64 | null;
  clippedLow = 0;
  clippedHigh = 0;
  samples = 0;
  /** Filter settings resolved for this channel's rate (set by its FilterGroup). */
  settings: BandFilterSettings | null = null;

  private scratch = new Float64Array(0);

  /** @param span_s length of the span read, s: the envelopes are sized for it up front */
  constructor(readonly fs: number, private readonly req: ReadEnvelopesRequest, private readonly tap: ChannelTap | null, readonly toMicrovolts: number, span_s: number) {
    this.mainOut = new GrowableFloat64(secondsToSamples(span_s, req.envelope.rate_hz) + 1);
    this.secondOut = req.second ? new GrowableFloat64(secondsToSamples(span_s, req.second.rate_hz) + 1) : null;
    this.main = new RmsEnvelope({ fs, window_s: req.envelope.window_s, rate_hz: req.envelope.rate_hz });
    this.second = req.second ? new RmsEnvelope({ fs, window_s: req.second.window_s, rate_hz: req.second.rate_hz }) : null;
  }

  /** The chunk in µV, after the raw tap has seen it (a view valid until the next chunk). */
  prepare(x: Float64Array): Float64Array {
    if (this.toMicrovolts !== 1) {
      // Everything downstream (envelopes, taps, thresholds) works in µV.
      if (this.scratch.length < x.length) this.scratch = new Float64Array(x.length);
      const y = this.scratch.subarray(0, x.length);
      const k = this.toMicrovolts;
      for (let i = 0; i < x.length; i++) y[i] = x[i]! * k;
      x = y;
    }
    if (this.tap?.raw) this.tap.raw(x, this.samples);
    this.samples += x.length;
    return x;
  }

  /** Filtered samples (a view into the filter's buffer, valid during the call) to the tap and envelopes. */
  filtered(y: Float64Array): void {
    if (this.tap?.filtered && y.length > 0) this.tap.filtered(y);
    this.mainOut.append(this.main.pushView(y));
    if (this.second) this.secondOut!.append(this.second.pushView(y));
  }

  /** End of the current continuous piece (after the filter's last samples). */
  endPiece(): void {
    this.mainOut.append(this.main.flush());
    if (this.second) this.secondOut!.append(this.second.flush());
  }

  /** Start a new piece whose first sample lies at `offset_s` from the span start: pad NaN up to it. */
  restartAt(offset_s: number): void {
    const r = this.req;
    this.mainOut.fill(NaN, secondsToSamples(offset_s, r.envelope.rate_hz) - this.mainOut.length);
    if (r.second) this.secondOut!.fill(NaN, secondsToSamples(offset_s, r.second.rate_hz) - this.secondOut!.length);
    this.tap?.restart?.(offset_s);
    this.main = new RmsEnvelope({ fs: this.fs, window_s: r.envelope.window_s, rate_hz: r.envelope.rate_hz });
    this.second = r.second ? new RmsEnvelope({ fs: this.fs, window_s: r.second.window_s, rate_hz: r.second.rate_hz }) : null;
  }
}

/**
 * The channels of one sampling rate, filtered together (BandFilterBank: channel pairs share the
 * SIMD filter kernel). Channels of one rate get chunks of equal length from the readers.
 */
class FilterGroup {
  private bank: BandFilterBank;
  private readonly chunks: Float64Array[];
  private readonly toChannel = (c: number, y: Float64Array): void => this.members[c]!.filtered(y);

  constructor(private readonly filter: FilterSpec, readonly fs: number, readonly members: ChannelState[], readonly indices: number[]) {
    this.bank = this.newBank();
    this.chunks = members.map(() => EMPTY);
    for (const m of members) m.settings = this.bank.settings;
  }

  private newBank(): BandFilterBank {
    const f = this.filter;
    return new BandFilterBank({ fs: this.fs, band_hz: f.band_hz, order: f.order, mains_hz: f.mains_hz, mains_harmonics: f.mains_harmonics, mains_q: f.mains_q }, this.members.length);
  }

  /** This group's samples of a chunk (all channels of the read, in request order); nanFree: the reader guarantees no NaN. */
  push(data: Float64Array[], nanFree: boolean): void {
    for (let j = 0; j < this.members.length; j++) this.chunks[j] = this.members[j]!.prepare(data[this.indices[j]!]!);
    this.bank.pushTo(this.chunks, this.toChannel, nanFree);
    this.chunks.fill(EMPTY);
  }

  /** End the current continuous piece. */
  flush(): void {
    this.bank.flushTo(this.toChannel);
    for (const m of this.members) m.endPiece();
  }

  /** Flush, then start a new piece at `offset_s` from the span start (EDF+D). */
  restartAt(offset_s: number): void {
    this.flush();
    for (const m of this.members) m.restartAt(offset_s);
    this.bank = this.newBank();
  }
}

const EMPTY = new Float64Array(0);

/**
 * Read a span of a recording and return, per requested signal, its RMS envelope(s) in µV.
 * Envelope sample k lies at start_s + k / rate_hz; the whole span is covered (for EDF+D the time
 * between records is NaN and the filters restart after each discontinuity).
 * @throws InputError for unreadable files (from the readers); UsageError for filter settings
 *   that do not fit a channel's sampling rate
 */
export async function readEnvelopes(req: ReadEnvelopesRequest): Promise<ReadEnvelopesResult> {
  const rec = await openRecording(req.file, req.open);
  try {
    const info = rec.info;
    const start_s = Math.max(0, req.start_s);
    const fileEnd = info.end_s ?? info.duration_s; // EDF+D: clock time of the last record's end
    const end_s = req.end_s === null ? fileEnd : Math.min(fileEnd, req.end_s);
    const states = req.signals.map((i, c) => new ChannelState(info.signals[i]!.rate_hz, req, req.taps?.[c] ?? null, microvoltsPerUnit(info.signals[i]!.unit) ?? 1, end_s - start_s));
    // channels grouped by sampling rate, each group filtered together
    const groups: FilterGroup[] = [];
    for (const fs of [...new Set(states.map((st) => st.fs))]) {
      const idx = states.map((st, c) => (st.fs === fs ? c : -1)).filter((c) => c >= 0);
      groups.push(new FilterGroup(req.filter, fs, idx.map((c) => states[c]!), idx));
    }
    let discontinuities = 0;
    let first = true;
    for await (const chunk of rec.read({ signals: req.signals, start_s, end_s })) {
      if (chunk.gap_before && !first) {
        discontinuities++;
        for (const g of groups) g.restartAt(chunk.start_s - start_s);
      }
      first = false;
      for (const g of groups) g.push(chunk.data, chunk.nan_free === true);
      for (let c = 0; c < states.length; c++) {
        const s = states[c]!;
        s.clippedLow += chunk.clipped_low[c]!;
        s.clippedHigh += chunk.clipped_high[c]!;
      }
      if (req.onProgress) {
        const fs0 = states[0]!.fs;
        req.onProgress(chunk.start_s - start_s + chunk.data[0]!.length / fs0);
      }
    }
    for (const g of groups) g.flush();
    // Pad to the full span so sample k always means start_s + k / rate.
    const nMain = secondsToSamples(end_s - start_s, req.envelope.rate_hz);
    const channels = states.map((s, c) => {
      if (s.mainOut.length < nMain) s.mainOut.fill(NaN, nMain - s.mainOut.length);
      const env = s.mainOut.take().subarray(0, Math.max(nMain, 0));
      let second: Float64Array | null = null;
      if (req.second) {
        const n2 = secondsToSamples(end_s - start_s, req.second.rate_hz);
        if (s.secondOut!.length < n2) s.secondOut!.fill(NaN, n2 - s.secondOut!.length);
        second = s.secondOut!.take().subarray(0, n2);
      }
      return {
        envelope: env, second, filter: s.settings!, rate_hz: req.envelope.rate_hz,
        clipped_low: s.clippedLow, clipped_high: s.clippedHigh, samples: s.samples, fs: s.fs,
        unit: info.signals[req.signals[c]!]!.unit, unit_known: microvoltsPerUnit(info.signals[req.signals[c]!]!.unit) !== null,
      };
    });
    return { channels, start_s, end_s, discontinuities };
  } finally {
    await rec.close();
  }
}
