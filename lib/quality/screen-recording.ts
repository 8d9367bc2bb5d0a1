// Quality screening of a whole recording on its own (for `shiftload inspect --quality`): one
// streaming pass over every signal, each through a band-pass like the analysis' default and a
// QualityTap. The analysis itself does not call this: it runs the taps inside its own pass.
import { BandFilter } from '../dsp/band-filter.js';
import { openRecording } from '../io/open-recording.js';
import type { OpenOptions } from '../io/open-options.js';
import { DEFAULTS as JOB_DEFAULTS } from '../job/defaults.js';
import type { Finding } from '../study/results.js';
import type { QualitySettings } from './defaults.js';
import { QualityTap, type ExcludedSpan, type QualitySummary } from './quality-tap.js';

export interface ScreenRecordingOptions {
  /** Reader options (CSV rate, chunk size). */
  open?: OpenOptions;
  /** Overrides of the quality thresholds. */
  settings?: Partial<QualitySettings>;
  /** Band-pass applied before the lost-signal and ECG checks, Hz; the high edge is capped at 0.9·fs/2 per signal. @default job default band_hz ([30, 400]) */
  band_hz?: readonly [number, number];
  /** Butterworth order of that band-pass. @default job default filter_order (4) */
  order?: number;
  /** Signal indices to screen. @default every signal */
  signals?: number[];
}

export interface SignalQuality extends QualitySummary {
  index: number;
  label: string;
  /** Band-pass used for this signal, Hz. */
  band_hz: [number, number];
  /** Spans that the analysis would exclude. */
  excluded: ExcludedSpan[];
  /** Number of findings for this signal. */
  findings: number;
}

export interface RecordingQuality {
  file: string;
  duration_s: number;
  signals: SignalQuality[];
  findings: Finding[];
}

/**
 * Screen every (or the chosen) signal of a recording in one streaming pass.
 * @param file recording path (EDF/EDF+/BDF/BDF+/CSV/TSV)
 * @param options reader options, thresholds, band-pass
 * @returns per-signal summaries and all findings (where.recording = file, where.signal = label)
 * @throws InputError from the readers; UsageError for a band that does not fit a signal
 * @example const q = await screenRecording('shift.edf'); q.signals[0].clipped_high
 */
export async function screenRecording(file: string, options: ScreenRecordingOptions = {}): Promise<RecordingQuality> {
  const rec = await openRecording(file, options.open);
  try {
    const info = rec.info;
    const idx = options.signals ?? info.signals.map((s) => s.index);
    const band = options.band_hz ?? JOB_DEFAULTS.band_hz;
    const order = options.order ?? JOB_DEFAULTS.filter_order;
    const chans = idx.map((i) => {
      const sig = info.signals[i]!;
      const fs = sig.rate_hz;
      const b: [number, number] = [band[0], Math.min(band[1], 0.9 * (fs / 2))];
      const newFilter = () => new BandFilter({ fs, band_hz: b, order, mains_hz: null });
      const tap = new QualityTap({
        fs, limits: sig, highpass_hz: b[0], settings: options.settings,
        where: { recording: file, signal: sig.label },
      });
      return { sig, band: b, newFilter, filter: newFilter(), tap };
    });
    let first = true;
    if (chans.length > 0) {
      for await (const chunk of rec.read({ signals: idx })) {
        if (chunk.gap_before && !first) {
          for (const c of chans) {
            const y = c.filter.flush();
            if (y.length > 0) c.tap.filtered(y);
            c.tap.restart(chunk.start_s);
            c.filter = c.newFilter();
          }
        }
        first = false;
        for (let j = 0; j < chans.length; j++) {
          const c = chans[j]!;
          const x = chunk.data[j]!;
          c.tap.raw(x);
          const y = c.filter.push(x);
          if (y.length > 0) c.tap.filtered(y);
        }
      }
      for (const c of chans) {
        const y = c.filter.flush();
        if (y.length > 0) c.tap.filtered(y);
      }
    }
    const findings: Finding[] = [];
    const signals = chans.map((c) => {
      const q = c.tap.finish();
      findings.push(...q.findings);
      return { index: c.sig.index, label: c.sig.label, band_hz: c.band, ...q.summary, excluded: q.excluded, findings: q.findings.length };
    });
    return { file, duration_s: info.duration_s, signals, findings };
  } finally {
    await rec.close();
  }
}
