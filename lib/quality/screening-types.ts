// Plain-data types of the quality screening: the per-window statistics a tap gathers (they cross
// worker threads as transferable typed arrays) and the judged result of one channel.
import type { Finding } from '../study/results.js';
import type { QualitySettings } from './defaults.js';

/** Codes of the quality findings. */
export type QualityCode = 'clipped' | 'flat-line' | 'signal-lost' | 'mains' | 'motion' | 'ecg' | 'low-snr';

/** A span left out of the statistics, s from the recording start, [start_s, end_s). */
export interface ExcludedSpan {
  start_s: number;
  end_s: number;
  reason: QualityCode;
}

/** Per-signal summary (inspect, results). Times in s. */
export interface QualitySummary {
  fs: number;
  /** Time screened (samples seen / fs), s. */
  screened_s: number;
  /** Samples at the digital limits; null when the signal has none (CSV). */
  clipped_low: number | null;
  clipped_high: number | null;
  /** Time flagged by each check, s (windows, so rounded up to the window). */
  clipped_s: number;
  flat_s: number;
  lost_s: number;
  mains_s: number;
  motion_s: number;
  ecg_s: number;
  /** Union of the excluded spans, s (0 when settings.exclude is false). */
  excluded_s: number;
  /** Noise floor used by the lost-signal check, µV, and where it came from. */
  noise_floor_uv: number | null;
  noise_floor_source: 'rest' | 'estimated' | null;
  /** Median mains power relative to the EMG band (largest of the mains frequencies), dB. */
  mains_ratio_db: number | null;
  /** Median low-frequency power relative to the EMG band, dB. */
  low_ratio_db: number | null;
  /** Median heart rate over the windows with ECG found, beats/min; null when none. */
  ecg_rate_bpm: number | null;
}

export interface ChannelQuality {
  summary: QualitySummary;
  findings: Finding[];
  /** Spans to exclude (empty when settings.exclude is false), sorted by start. */
  excluded: ExcludedSpan[];
  /** The settings applied. */
  settings: QualitySettings;
}

/**
 * Per-window statistics of one channel after the pass (QualityTap.windows()). Window w of a kind
 * covers samples [w·window, (w+1)·window) counted from the span start (time jumps of EDF+D
 * included); typed arrays hold one value per window.
 */
export interface ScreeningWindows {
  fs: number;
  /** Start of the screened span, s from the recording start. */
  start_s: number;
  /** Samples seen. */
  samples: number;
  /** Position after the last sample (samples from the span start, gaps included). */
  end_samples: number;
  /** Window lengths in samples: amplitude, spectral, ECG. */
  amp_window: number;
  spectral_window: number;
  ecg_window: number;
  /** Whether the signal has digital limits (clipping counted), and its digital step, µV. */
  has_limits: boolean;
  lsb: number;
  /** Amplitude windows: raw count, samples at the upper/lower limit, shifted sum and sum of squares; band-passed count and sum of squares. */
  amp: { n: Float64Array; hi: Float64Array; lo: Float64Array; s1: Float64Array; s2: Float64Array; fn: Float64Array; f2: Float64Array };
  /** Spectral windows: segments, low-frequency and EMG-band power (sums over segments), mains ratio per mains frequency (sum over segments). */
  spec: { segs: Float64Array; low: Float64Array; band: Float64Array; mains: Float64Array[] };
  /** ECG windows: heart rate, beats/min, and autocorrelation at the heart period (NaN: not evaluated). */
  ecg: { rate: Float64Array; r: Float64Array };
}

/** The ArrayBuffers of screening windows, to transfer (not copy) them between threads. */
export function screeningBuffers(list: readonly ScreeningWindows[] | null | undefined): ArrayBuffer[] {
  const out: ArrayBuffer[] = [];
  for (const w of list ?? []) {
    for (const a of [...Object.values(w.amp), w.spec.segs, w.spec.low, w.spec.band, ...w.spec.mains, w.ecg.rate, w.ecg.r]) out.push(a.buffer as ArrayBuffer);
  }
  return out;
}
