// The processing stage `convert` can put between reader and writer: the analysis' own filter
// (optional mains notch, Butterworth band-pass, both zero phase) and, optionally, the moving-RMS
// envelope — so a filtered or enveloped recording can be looked at in any EDF viewer.
import { UsageError } from '../errors.js';
import { msg } from '../messages.js';
import { BandFilter } from '../dsp/band-filter.js';
import { RmsEnvelope } from '../dsp/rms-envelope.js';
import type { SignalInfo } from '../io/recording.js';
import type { ConvertStage } from './convert.js';

export interface ProcessingOptions {
  /** Band-pass [low, high], Hz; null = no band-pass (then an envelope is taken of the raw signal). */
  band_hz: [number, number] | null;
  /** Butterworth order. @default 4 */
  order: number;
  /** Mains notch (with its second and third multiple below fs/2), Hz, or null. */
  notch_hz: 50 | 60 | null;
  /** RMS envelope window, s, or null for the filtered signal itself. */
  envelope_s: number | null;
  /** Envelope rate, Hz (with envelope_s). @default 20 */
  rate_hz: number;
}

/** A filter that passes everything (for an envelope without a band-pass). */
const passThrough = { push: (x: Float64Array) => x.slice(), flush: () => new Float64Array(0) };

/**
 * Build the stage for the selected signals.
 * @throws UsageError for cut-offs that do not fit a signal's sampling rate (message from butter)
 */
export function processingStage(o: ProcessingOptions): (selected: SignalInfo[]) => ConvertStage {
  if (o.band_hz === null && o.notch_hz !== null) throw new UsageError(msg.badOption('notch', 'a band-pass as well (--band LOW,HIGH)', String(o.notch_hz)));
  return (selected) => {
    const filters = selected.map((s) => (o.band_hz === null ? passThrough
      : new BandFilter({ fs: s.rate_hz, band_hz: o.band_hz, order: o.order, mains_hz: o.notch_hz, mains_harmonics: 3 })));
    const envs = o.envelope_s === null ? null
      : selected.map((s) => new RmsEnvelope({ fs: s.rate_hz, window_s: o.envelope_s!, rate_hz: o.rate_hz }));
    const step = (j: number, y: Float64Array) => (envs ? envs[j]!.push(y) : y);
    return {
      rates_hz: selected.map((s) => (envs ? o.rate_hz : s.rate_hz)),
      transform: (chunk) => chunk.map((x, j) => step(j, filters[j]!.push(x))),
      flush: () => selected.map((_, j) => {
        const a = step(j, filters[j]!.flush());
        if (!envs) return a;
        const b = envs[j]!.flush();
        const out = new Float64Array(a.length + b.length);
        out.set(a);
        out.set(b, a.length);
        return out;
      }),
      // A band-passed signal swings about zero within the input's range; an envelope is ≥ 0.
      physical_range: selected.map((s) => {
        const m = Math.max(Math.abs(s.physical_min), Math.abs(s.physical_max));
        return envs ? [0, m] : [-m, m];
      }),
    };
  };
}
