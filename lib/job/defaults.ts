// Every analysis setting of a job file, its one default, its unit and its meaning. The schema
// (job-schema.ts), the template, the loader and the report's methods section all read from here.
import { FATIGUE_DEFAULTS, type FatigueSettings } from '../exposure/fatigue-settings.js';
import { QUALITY_DEFAULTS, type QualitySettings } from '../quality/defaults.js';

/** Normalization method: what 100 % of the normalized envelope means. */
export type NormalizeMethod = 'mve' | 'rve' | 'task-peak' | 'none';

/** How the gap threshold is expressed (see `gap_threshold_unit`). */
export type GapThresholdUnit = 'auto' | 'mve' | 'as-normalized';

/** Whether muscular rest counts every below-threshold sample or only samples inside gaps. */
export type RestCounts = 'all' | 'gaps-only';

/** Effective analysis settings of a study (every key filled in). */
export interface Settings {
  /**
   * Band-pass edges [low, high] of the Butterworth filter, Hz. The high edge must lie below half
   * the sampling rate of every channel.
   * @default [30, 400]
   */
  band_hz: [number, number];
  /**
   * Butterworth order N as in scipy.signal.butter (a band-pass has 2N poles); applied forward and
   * backward (zero phase), which squares the magnitude response.
   * @default 4
   */
  filter_order: number;
  /**
   * Mains frequency to notch out, Hz, or 'none' for no notch.
   * @default 'none'
   */
  mains_hz: 50 | 60 | 'none';
  /**
   * Number of mains multiples notched (1 = the fundamental only; 3 = 50, 100, 150 Hz). Multiples at
   * or above half the sampling rate are skipped.
   * @default 1
   */
  mains_harmonics: number;
  /**
   * Quality factor of each notch (centre frequency / −3 dB bandwidth), as scipy.signal.iirnotch Q.
   * @default 30
   */
  mains_q: number;
  /**
   * Length of the moving RMS window, s.
   * @default 0.1
   */
  rms_window_s: number;
  /**
   * Rate at which the RMS envelope is evaluated, Hz (one value per 1/rate s).
   * @default 20
   */
  envelope_rate_hz: number;
  /**
   * Normalization: 'mve' (%MVE, maximal reference contraction), 'rve' (%RVE, submaximal reference
   * contraction), 'task-peak' (% of the highest envelope value of that worker's muscle over all
   * their recordings), 'none' (µV).
   * @default 'mve'
   */
  normalize: NormalizeMethod;
  /**
   * Reference window, s. MVE and task peak: the highest moving RMS over windows of this length;
   * RVE: the mean envelope over the whole reference span(s).
   * @default 1
   */
  reference_window_s: number;
  /**
   * Subtract the rest (noise) level in a power sense: sqrt(max(rms² − noise², 0)). Needs a `rest`
   * span for every recording.
   * @default true
   */
  noise_correction: boolean;
  /**
   * Noise window, s: the noise level is the lowest moving RMS over windows of this length within
   * the rest span(s).
   * @default 1
   */
  noise_window_s: number;
  /**
   * Gap / rest threshold, in the unit given by `gap_threshold_unit`.
   * @default 0.5
   */
  gap_threshold_pct: number;
  /**
   * Unit of `gap_threshold_pct`: 'mve' (%MVE; with normalize rve it is converted per worker through
   * that worker's `mve_reference`), 'as-normalized' (the unit of the normalized envelope: %MVE,
   * %RVE, %task-peak or µV), 'auto' ('mve' when normalize is mve, or rve with an mve_reference for
   * every worker; otherwise 'as-normalized', and the report says so).
   * @default 'auto'
   */
  gap_threshold_unit: GapThresholdUnit;
  /**
   * Shortest run below the threshold that counts as an EMG gap, s (inclusive).
   * @default 0.2
   */
  gap_min_s: number;
  /**
   * Longest run that still counts as one gap, s; null for no upper limit.
   * @default null
   */
  gap_max_s: number | null;
  /**
   * Muscular rest counts 'all' time below the threshold, or only time inside gaps ('gaps-only').
   * @default 'all'
   */
  rest_counts: RestCounts;
  /**
   * Sustained activity: uninterrupted time above the gap threshold lasting at least this long, s.
   * @default 240
   */
  sustained_min_s: number;
  /**
   * APDF percentiles reported, % (linear interpolation between order statistics).
   * @default [10, 50, 90]
   */
  percentiles: number[];
  /** Exposure variation analysis classes. */
  eva: {
    /**
     * Amplitude class edges in the normalized unit; classes are [edge_i, edge_i+1), the last open above.
     * @default [0, 1, 5, 10, 20, 30]
     */
    amplitude_edges: number[];
    /**
     * Duration class edges, s; classes are [edge_i, edge_i+1), the last open above.
     * @default [0, 1, 3, 7, 15, 31, 63]
     */
    duration_edges_s: number[];
  };
  /**
   * Step of the decimated envelope traces drawn in the report, s.
   * @default 10
   */
  trace_step_s: number;
  /**
   * Fatigue over the shift: spectral epochs, amplitude and MNF trends per block and task segment,
   * JASA categories (lib/exposure/fatigue-settings.ts has every key's meaning and default).
   */
  fatigue: FatigueSettings;
  /**
   * Signal-quality screening thresholds and `exclude` (lib/quality/defaults.ts, one row per key in
   * QUALITY_SETTINGS_TABLE). As written in a job it may be partial: use resolveQualitySettings().
   * @default QUALITY_DEFAULTS
   */
  quality: QualitySettings;
}

/** The one default of every setting. Frozen: copy before changing. */
export const DEFAULTS: Readonly<Settings> = deepFreeze({
  band_hz: [30, 400],
  filter_order: 4,
  mains_hz: 'none',
  mains_harmonics: 1,
  mains_q: 30,
  rms_window_s: 0.1,
  envelope_rate_hz: 20,
  normalize: 'mve',
  reference_window_s: 1,
  noise_correction: true,
  noise_window_s: 1,
  gap_threshold_pct: 0.5,
  gap_threshold_unit: 'auto',
  gap_min_s: 0.2,
  gap_max_s: null,
  rest_counts: 'all',
  sustained_min_s: 240,
  percentiles: [10, 50, 90],
  eva: { amplitude_edges: [0, 1, 5, 10, 20, 30], duration_edges_s: [0, 1, 3, 7, 15, 31, 63] },
  trace_step_s: 10,
  fatigue: { ...FATIGUE_DEFAULTS },
  quality: QUALITY_DEFAULTS,
} as Settings);

function deepFreeze<T>(o: T): T {
  if (o !== null && typeof o === 'object') {
    for (const v of Object.values(o)) deepFreeze(v);
    Object.freeze(o);
  }
  return o;
}

/** One row of the settings table printed in the report's methods section and in the schema. */
export interface SettingDescription {
  /** Key path in the job file's `settings`, e.g. "eva.amplitude_edges". */
  key: string;
  /** The default value. */
  value: unknown;
  /** Unit ("Hz", "s", "%", "" for none). */
  unit: string;
  /** One or two sentences: what the setting does. */
  meaning: string;
  /** Where the default comes from. */
  source: string;
}

/**
 * Every setting with its default, unit, meaning and the source of the default. The order is the
 * order of the processing chain.
 */
export const SETTINGS_TABLE: readonly SettingDescription[] = Object.freeze([
  { key: 'band_hz', value: DEFAULTS.band_hz, unit: 'Hz', meaning: 'Band-pass edges [low, high] of the Butterworth filter; the high edge must be below half of every channel\'s sampling rate.', source: '30 Hz high-pass against ECG (Drake & Callaghan 2006)' },
  { key: 'filter_order', value: DEFAULTS.filter_order, unit: '', meaning: 'Butterworth order N as in scipy.signal.butter (a band-pass has 2N poles), applied forward and backward (zero phase).', source: 'common practice, no single source' },
  { key: 'mains_hz', value: DEFAULTS.mains_hz, unit: 'Hz', meaning: 'Mains frequency notched out (50 or 60), or none.', source: 'off unless the recording needs it' },
  { key: 'mains_harmonics', value: DEFAULTS.mains_harmonics, unit: '', meaning: 'Number of mains multiples notched (1 = fundamental only); multiples at or above half the sampling rate are skipped.', source: 'common practice, no single source' },
  { key: 'mains_q', value: DEFAULTS.mains_q, unit: '', meaning: 'Quality factor of each notch (centre / −3 dB bandwidth), as scipy.signal.iirnotch Q.', source: 'common practice, no single source' },
  { key: 'rms_window_s', value: DEFAULTS.rms_window_s, unit: 's', meaning: 'Length of the moving RMS window.', source: '0.1 s epochs (Östensvik et al. 2009 group); Veiersted et al. 2013 compared 0.13–6.38 s' },
  { key: 'envelope_rate_hz', value: DEFAULTS.envelope_rate_hz, unit: 'Hz', meaning: 'Rate at which the RMS envelope is evaluated.', source: 'tool choice (two values per RMS window)' },
  { key: 'normalize', value: DEFAULTS.normalize, unit: '', meaning: 'Normalization: mve (%MVE), rve (%RVE), task-peak (% of the worker\'s highest envelope of that muscle), none (µV).', source: 'Mathiassen et al. 1995; Besomi et al. 2020' },
  { key: 'reference_window_s', value: DEFAULTS.reference_window_s, unit: 's', meaning: 'MVE and task peak: the highest moving RMS over windows of this length in the reference span(s); RVE: the mean envelope over the span(s).', source: 'common practice, no single source' },
  { key: 'noise_correction', value: DEFAULTS.noise_correction, unit: '', meaning: 'Subtract the rest (noise) level in a power sense: sqrt(max(rms² − noise², 0)), for field data and references alike.', source: 'IEEE TNSRE 27(12):2328–2335, 2019' },
  { key: 'noise_window_s', value: DEFAULTS.noise_window_s, unit: 's', meaning: 'The noise level is the lowest moving RMS over windows of this length in the rest span(s).', source: 'common practice, no single source' },
  { key: 'gap_threshold_pct', value: DEFAULTS.gap_threshold_pct, unit: '%', meaning: 'Gap and rest threshold, in the unit set by gap_threshold_unit.', source: 'Hansson et al. 2000 (≈0.5 %MVE for muscular rest)' },
  { key: 'gap_threshold_unit', value: DEFAULTS.gap_threshold_unit, unit: '', meaning: 'mve: threshold in %MVE (converted per worker through mve_reference when normalizing to RVE); as-normalized: in the envelope\'s own unit; auto: mve when possible, else as-normalized.', source: 'METHODS §2.5 (conversion k = RVE/MVE)' },
  { key: 'gap_min_s', value: DEFAULTS.gap_min_s, unit: 's', meaning: 'Shortest run below the threshold that counts as an EMG gap (inclusive).', source: 'Veiersted et al. 1990' },
  { key: 'gap_max_s', value: DEFAULTS.gap_max_s, unit: 's', meaning: 'Longest run that still counts as one gap; null for no upper limit.', source: 'no upper limit in later work (from memory)' },
  { key: 'rest_counts', value: DEFAULTS.rest_counts, unit: '', meaning: 'Muscular rest counts all time below the threshold, or only time inside gaps (gaps-only).', source: 'Nordander et al. 2000 (time fraction below a threshold)' },
  { key: 'sustained_min_s', value: DEFAULTS.sustained_min_s, unit: 's', meaning: 'Sustained activity: uninterrupted time above the gap threshold lasting at least this long.', source: 'Hanvold et al. 2013 (> 4 min)' },
  { key: 'percentiles', value: DEFAULTS.percentiles, unit: '%', meaning: 'APDF percentiles reported (static, median, peak load by default); linear interpolation between order statistics.', source: 'Jonsson 1982; Hansson et al. 2009' },
  { key: 'eva.amplitude_edges', value: DEFAULTS.eva.amplitude_edges, unit: 'normalized unit', meaning: 'EVA amplitude class edges; classes [a, b), the last open above.', source: 'illustrative (from memory), Mathiassen & Winkel 1991' },
  { key: 'eva.duration_edges_s', value: DEFAULTS.eva.duration_edges_s, unit: 's', meaning: 'EVA duration class edges; classes [a, b), the last open above.', source: 'illustrative (from memory), Mathiassen & Winkel 1991' },
  { key: 'trace_step_s', value: DEFAULTS.trace_step_s, unit: 's', meaning: 'Step of the decimated envelope traces drawn in the report.', source: 'tool choice' },
  { key: 'fatigue.enabled', value: DEFAULTS.fatigue.enabled, unit: '', meaning: 'Compute spectral epochs, amplitude and mean-frequency trends and JASA categories over the shift.', source: 'Luttmann et al. 2000 (JASA)' },
  { key: 'fatigue.epoch_s', value: DEFAULTS.fatigue.epoch_s, unit: 's', meaning: 'Epoch length for RMS, mean and median power frequency (one Hann-windowed FFT per epoch).', source: '0.5–1 s quasi-stationary epochs (CEDE glossary, McManus et al. 2021)' },
  { key: 'fatigue.block_s', value: DEFAULTS.fatigue.block_s, unit: 's', meaning: 'Length of the time blocks whose trends are fitted (the last block may be shorter); task segments get their own trends too.', source: 'tool choice' },
  { key: 'fatigue.active_threshold_pct', value: DEFAULTS.fatigue.active_threshold_pct, unit: 'normalized unit', meaning: 'Only epochs at or above this noise-corrected amplitude enter the trends (the spectrum of rest is noise); not applied without a reference.', source: 'tool choice' },
  { key: 'fatigue.active_noise_factor', value: DEFAULTS.fatigue.active_noise_factor, unit: '', meaning: 'Only epochs whose RMS is at least this many times the noise RMS enter the trends (when a noise level is known).', source: 'tool choice' },
  { key: 'fatigue.band_hz', value: DEFAULTS.fatigue.band_hz, unit: 'Hz', meaning: 'Band [low, high] of the mean and median frequency; null = the band-pass of the analysis.', source: 'tool choice' },
  { key: 'fatigue.min_epochs', value: DEFAULTS.fatigue.min_epochs, unit: '', meaning: 'Fewest active epochs for a trend; blocks with fewer are reported as insufficient data.', source: 'tool choice' },
  { key: 'fatigue.series_step_s', value: DEFAULTS.fatigue.series_step_s, unit: 's', meaning: 'Step of the mean-frequency-over-time series drawn in the report (median of the active epochs per step).', source: 'tool choice' },
  { key: 'quality', value: DEFAULTS.quality, unit: '', meaning: 'Signal-quality screening: thresholds of each check and exclude (leave unusable spans out of the statistics); every key is listed with its unit and source in QUALITY_SETTINGS_TABLE (lib/quality/defaults.ts).', source: 'tool choices, see lib/quality/defaults.ts' },
]);
