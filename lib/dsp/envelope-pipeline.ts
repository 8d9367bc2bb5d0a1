// The per-channel chain used by the analysis: [mains notch] → Butterworth band-pass (both
// zero-phase by overlapped blocks) → square → moving mean → square root = RMS envelope at the
// envelope rate. An orchestrator only: the stages are BandFilter and RmsEnvelope.
import { BAND_FILTER_DEFAULTS, BandFilter, type BandFilterOptions, type BandFilterSettings } from './band-filter.js';
import { RmsEnvelope } from './rms-envelope.js';

export interface EnvelopePipelineOptions extends BandFilterOptions {
  /** RMS window length, s (centred on each envelope sample, see rms-envelope.ts). @default 0.1 */
  rms_window_s?: number;
  /** Envelope rate, Hz (one value every 1/rate_hz s, the first at t = 0). @default 20 */
  rate_hz?: number;
}

/**
 * Defaults of the envelope pipeline, in one place (printed in the report's methods section).
 * band_hz [Hz], order [–], mains_hz [Hz | null], mains_harmonics [count], mains_q [–],
 * rms_window_s [s], rate_hz [Hz].
 */
export const DEFAULTS = {
  ...BAND_FILTER_DEFAULTS,
  /** s; 0.1 s, a short window usual for gap analysis (METHODS.md §8.5). */
  rms_window_s: 0.1,
  /** Hz; 20 envelope values per second (DESIGN.md data flow: 0.1 s window at 20 Hz). */
  rate_hz: 20,
};

/** Resolved settings of an envelope pipeline. */
export interface EnvelopeSettings extends BandFilterSettings {
  rms_window_s: number;
  rms_window_samples: number;
  rate_hz: number;
}

/**
 * Streaming RMS envelope of one channel. push(chunk) returns envelope samples (input unit, µV)
 * that are final; flush() returns the rest. Envelope sample k belongs to t = k/rate_hz s from the
 * stream start; the count for N input samples is envelopeSampleCount(N, fs, rate_hz). A window
 * containing a NaN input gives NaN. Any chunk split gives the same envelope.
 * @example
 *   const p = new EnvelopePipeline({ fs: 2000, band_hz: [20, 450], mains_hz: 50 });
 *   for await (const c of chunks) keep(p.push(c)); keep(p.flush());
 */
export class EnvelopePipeline {
  readonly settings: EnvelopeSettings;
  private readonly filter: BandFilter;
  private readonly env: RmsEnvelope;

  /** @throws UsageError for invalid filter or envelope settings */
  constructor(options: EnvelopePipelineOptions) {
    const windowS = options.rms_window_s ?? DEFAULTS.rms_window_s;
    const rate = options.rate_hz ?? DEFAULTS.rate_hz;
    this.filter = new BandFilter(options);
    this.env = new RmsEnvelope({ fs: options.fs, window_s: windowS, rate_hz: rate });
    this.settings = { ...this.filter.settings, rms_window_s: windowS, rms_window_samples: this.env.window, rate_hz: rate };
  }

  /** Feed raw samples (µV, not modified). Returns envelope samples now final. */
  push(x: ArrayLike<number>): Float64Array {
    return this.env.push(this.filter.push(x));
  }

  /** End of stream: the remaining envelope samples. */
  flush(): Float64Array {
    const a = this.env.push(this.filter.flush());
    const b = this.env.flush();
    if (a.length === 0) return b;
    const out = new Float64Array(a.length + b.length);
    out.set(a);
    out.set(b, a.length);
    return out;
  }
}

/** Batch form: envelope of a whole array (tests, short reference recordings). */
export function envelopeOf(x: ArrayLike<number>, options: EnvelopePipelineOptions): Float64Array {
  const p = new EnvelopePipeline(options);
  const a = p.push(x), b = p.flush();
  const out = new Float64Array(a.length + b.length);
  out.set(a);
  out.set(b, a.length);
  return out;
}
