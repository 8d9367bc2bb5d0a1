// Thresholds of the signal-quality screening (lib/quality), each with its unit and where it comes
// from. The job file's `quality:` block overrides any of them; the report prints them.
// Most limits are tool choices (no published limit exists for these screening rules); they were
// set so that clean simulated sEMG (band-limited Gaussian noise with a realistic amplitude
// profile) gives no finding, see test/quality/quality-tap.test.ts.

/** Every setting of the quality screening. */
export interface QualitySettings {
  /**
   * Run the screening (a tap in the analysis' single pass; its spectra cost about a third of the
   * analysis time). false: no quality findings, nothing excluded, clipping still counted.
   * @default true
   */
  enabled: boolean;
  /**
   * Leave spans judged unusable (flat line, lost signal, heavy clipping, severe low-frequency
   * artifact) out of the statistics (their envelope becomes NaN). false keeps every sample and
   * only reports findings.
   * @default true
   */
  exclude: boolean;
  /** Window of the amplitude checks (clipping, flat line, lost signal), s. @default 1 */
  window_s: number;
  /** Window of the spectral checks (mains, low-frequency artifact), s. @default 2 */
  spectral_window_s: number;
  /** Window of the ECG check (heart rate by autocorrelation), s. @default 10 */
  ecg_window_s: number;
  /** A window with at least this many samples at the digital limits is reported. @default 1 */
  clip_min_samples: number;
  /** Share of a window's samples at the digital limits from which the window is excluded, 0–1. @default 0.02 */
  clip_exclude_share: number;
  /** A window whose raw standard deviation is below this (or half a digital step), µV, is a flat line. @default 0.1 */
  flat_std_uv: number;
  /**
   * Lost signal: band-passed RMS of a window below this fraction of the noise floor (the rest
   * recording's noise level when given, else the 5th percentile of the window RMS values).
   * @default 0.2
   */
  lost_fraction: number;
  /** Mains frequencies checked, Hz. @default [50, 60] */
  mains_hz: number[];
  /** Number of mains multiples checked (1 = fundamental only), up to the band's high edge. @default 5 */
  mains_harmonics: number;
  /** Mains power above the local spectral background, as a fraction of the EMG-band power, from which a window is reported. @default 0.1 (−10 dB) */
  mains_ratio: number;
  /** EMG band against which the spectral ratios are taken, Hz (high edge capped at 0.9·fs/2). @default [20, 450] */
  band_hz: [number, number];
  /** Low-frequency (motion, baseline wander) power is the power below this frequency, Hz. @default 20 */
  motion_hz: number;
  /** Low-frequency power over EMG-band power from which a window is reported (when also well above the recording's usual level). @default 1 (0 dB) */
  motion_ratio: number;
  /** Low-frequency power over EMG-band power from which a window is excluded. @default 10 (+10 dB) */
  motion_exclude_ratio: number;
  /** A motion window must also hold this many times the recording's median low-frequency power (persistent ECG waves or drift are not motion). @default 10 */
  motion_relative: number;
  /** Heart rates searched, beats/min. @default [40, 180] */
  ecg_bpm: [number, number];
  /** Autocorrelation at the heart period from which ECG is reported, 0–1. @default 0.3 */
  ecg_min_r: number;
  /** Bin length of the spike-enhanced signal (mean rectified value per bin), s. @default 0.02 */
  ecg_bin_s: number;
  /** Running-mean baseline the binned signal is divided by (relative excess), s. @default 0.5 */
  ecg_baseline_s: number;
  /** Task-to-noise ratio (noise removed, power ratio in dB) below which a low SNR is reported. @default 6 */
  snr_min_db: number;
  /** Findings per check and channel; further spans are summed into one closing finding. @default 20 */
  max_spans: number;
}

/** The one default of every quality setting (frozen; copy before changing). */
export const QUALITY_DEFAULTS: Readonly<QualitySettings> = Object.freeze({
  enabled: true,
  exclude: true,
  window_s: 1,
  spectral_window_s: 2,
  ecg_window_s: 10,
  clip_min_samples: 1,
  clip_exclude_share: 0.01,
  flat_std_uv: 0.1,
  lost_fraction: 0.2,
  mains_hz: Object.freeze([50, 60]) as unknown as number[],
  mains_harmonics: 5,
  mains_ratio: 0.1,
  band_hz: Object.freeze([20, 450]) as unknown as [number, number],
  motion_hz: 20,
  motion_ratio: 1,
  motion_exclude_ratio: 10,
  motion_relative: 10,
  ecg_bpm: Object.freeze([40, 180]) as unknown as [number, number],
  ecg_min_r: 0.5,
  ecg_bin_s: 0.02,
  ecg_baseline_s: 0.5,
  snr_min_db: 6,
  max_spans: 20,
});

/** One row of the quality settings table (report methods section, schema, README). */
export interface QualitySettingDescription {
  key: keyof QualitySettings;
  unit: string;
  meaning: string;
  source: string;
}

/** Unit, meaning and source of every quality setting (defaults from QUALITY_DEFAULTS). */
export const QUALITY_SETTINGS_TABLE: readonly QualitySettingDescription[] = Object.freeze([
  { key: 'enabled', unit: '', meaning: 'Run the signal-quality screening; false skips every check below (clipping is still counted) and excludes nothing.', source: 'tool choice' },
  { key: 'exclude', unit: '', meaning: 'Leave unusable spans (flat line, lost signal, heavy clipping, severe low-frequency artifact) out of the statistics; false only reports them.', source: 'tool choice, no source' },
  { key: 'window_s', unit: 's', meaning: 'Window of the clipping, flat-line and lost-signal checks.', source: 'tool choice, no source' },
  { key: 'spectral_window_s', unit: 's', meaning: 'Window of the mains and low-frequency checks (Welch spectrum, Hann segments of about 0.5 s, no overlap, band-normalized before averaging).', source: 'tool choice, no source' },
  { key: 'ecg_window_s', unit: 's', meaning: 'Window of the ECG check (heart rate by autocorrelation of the spike-enhanced band-passed signal).', source: 'tool choice, no source' },
  { key: 'clip_min_samples', unit: 'samples', meaning: 'A window with at least this many samples at the digital limits is reported.', source: 'tool choice, no source' },
  { key: 'clip_exclude_share', unit: 'fraction', meaning: 'Share of a window at the digital limits from which the window is excluded.', source: 'tool choice, no source' },
  { key: 'flat_std_uv', unit: 'µV', meaning: 'Raw standard deviation below which a window is a flat line (or half a digital step, whichever is larger).', source: 'tool choice, no source (amplifier noise of surface EMG is well above 0.1 µV RMS: common practice, no single source)' },
  { key: 'lost_fraction', unit: 'fraction', meaning: 'Band-passed RMS below this fraction of the noise floor means the signal was lost (electrode off, cable loose).', source: 'tool choice, no source' },
  { key: 'mains_hz', unit: 'Hz', meaning: 'Mains frequencies checked.', source: 'mains frequencies in use (50 Hz Europe, 60 Hz Americas)' },
  { key: 'mains_harmonics', unit: '', meaning: 'Number of mains multiples checked (1 = fundamental only).', source: 'tool choice, no source' },
  { key: 'mains_ratio', unit: 'fraction', meaning: 'Mains power above the local spectral background over EMG-band power, from which a window is reported.', source: 'tool choice, no source' },
  { key: 'band_hz', unit: 'Hz', meaning: 'EMG band of the spectral ratios.', source: '20–450 Hz (De Luca et al. 2010, J Biomech 43:1573)' },
  { key: 'motion_hz', unit: 'Hz', meaning: 'Low-frequency artifact power is the power below this frequency.', source: 'De Luca et al. 2010 (movement artifact mostly below 20 Hz)' },
  { key: 'motion_ratio', unit: 'fraction', meaning: 'Low-frequency power over EMG-band power from which a window is reported.', source: 'tool choice, no source' },
  { key: 'motion_exclude_ratio', unit: 'fraction', meaning: 'Low-frequency power over EMG-band power from which a window is excluded.', source: 'tool choice, no source' },
  { key: 'motion_relative', unit: 'fraction', meaning: 'A low-frequency window must also hold this many times the recording\'s median low-frequency power.', source: 'tool choice, no source' },
  { key: 'ecg_bpm', unit: 'beats/min', meaning: 'Heart rates searched.', source: 'resting to heavy-work heart rates (textbook physiology, from memory)' },
  { key: 'ecg_min_r', unit: '', meaning: 'Autocorrelation at the heart period from which ECG contamination is reported.', source: "tool choice, no source: 0.3 gave false alarms on simulated working muscles with changing load" },
  { key: 'ecg_bin_s', unit: 's', meaning: 'Bin of the spike-enhanced signal (mean rectified band-passed value).', source: 'tool choice (a QRS complex lasts about 0.1 s, textbook physiology)' },
  { key: 'ecg_baseline_s', unit: 's', meaning: 'Running-mean baseline; the autocorrelation uses the relative excess over it (removes slow changes of muscle activity).', source: 'tool choice, no source' },
  { key: 'snr_min_db', unit: 'dB', meaning: 'Task-to-noise power ratio (noise removed) below which a low SNR is reported.', source: 'tool choice, no source' },
  { key: 'max_spans', unit: '', meaning: 'Findings per check and channel; further spans are summed into one closing finding.', source: 'tool choice' },
]);

/**
 * Effective quality settings: the defaults with the given overrides (shallow; arrays replaced whole).
 * @example resolveQualitySettings({ exclude: false }).window_s // 1
 */
export function resolveQualitySettings(overrides: Partial<QualitySettings> | null = {}): QualitySettings {
  const s = { ...QUALITY_DEFAULTS, ...(overrides ?? {}) };
  return { ...s, mains_hz: [...s.mains_hz], band_hz: [s.band_hz[0], s.band_hz[1]], ecg_bpm: [s.ecg_bpm[0], s.ecg_bpm[1]] };
}
