// The shape of results.json ("shiftload-results/1"): plain data written by `analyze`, read by
// `report` and `compare`. Field names are part of the public contract; add, never rename.

export type Severity = 'info' | 'warning' | 'error';

export interface FindingWhere {
  worker?: string;
  recording?: string;
  signal?: string;
  segment?: string;
  start_s?: number;
  end_s?: number;
}

/** A data-quality or method finding: never an exception, always reported. */
export interface Finding {
  severity: Severity;
  /** Stable machine code, e.g. "segment-too-short", "clipping", "reference-weak". */
  code: string;
  where: FindingWhere;
  /** Plain words with the measured value and the limit used. */
  message: string;
}

/** Unit of normalized values. */
export type LoadUnit = '%MVE' | '%RVE' | '%task-peak' | 'uV';

/** One worker × condition × muscle × segment summary (also one line of segments.csv). */
export interface ResultRow {
  worker: string;
  condition: string;
  muscle: string;
  signal: string;
  /** Recording file (as written in the job). */
  recording: string;
  /** Task label; "all" for the whole recording. Every segment with this label is joined. */
  segment: string;
  /** First start and last end of the task's segments, s from the recording start. */
  start_s: number;
  end_s: number;
  /** Number of segments (occurrences) joined in this row. */
  segments: number;
  /** Total length of those segments, s. */
  segment_s: number;
  /** Time that entered the statistics, s (segment length less excluded time). */
  valid_s: number;
  unit: LoadUnit;
  /** Reference amplitude (MVE/RVE/task peak) in µV after noise correction; null for 'none'. */
  reference_uv: number | null;
  /** Noise RMS in µV used for the correction; null when not applied. */
  noise_uv: number | null;
  /** Percentiles of the normalized envelope keyed p<q> (p10, p50, p90 by default). */
  [percentile: `p${number}`]: number | null;
  /** Threshold actually applied, in `unit`. */
  gap_threshold: number;
  gaps: number;
  gaps_per_min: number | null;
  rest_pct: number | null;
  longest_without_gap_s: number | null;
  sustained_pct: number | null;
}

export interface EvaMatrix {
  worker: string;
  condition: string;
  muscle: string;
  segment: string;
  unit: LoadUnit;
  /** Amplitude class edges in `unit`; the last class is open above. */
  amplitude_edges: number[];
  /** Duration class edges in s; the last class is open above. */
  duration_edges_s: number[];
  /** percent_time[a][d]: % of valid time in amplitude class a with period duration class d. */
  percent_time: number[][];
}

/** A decimated envelope trace for charts: one point per bin (mean and max of the bin). */
export interface EnvelopeTrace {
  worker: string;
  condition: string;
  muscle: string;
  recording: string;
  unit: LoadUnit;
  /** Seconds per point. */
  step_s: number;
  mean: (number | null)[];
  max: (number | null)[];
  segments: { label: string; start_s: number; end_s: number }[];
}

/** How one channel was normalized: the reference and noise levels actually used. */
export interface ReferenceValue {
  worker: string;
  condition: string;
  muscle: string;
  signal: string;
  recording: string;
  /** Normalization method (mve, rve, task-peak, none). */
  method: string;
  /** Reference amplitude after noise correction, µV; null when missing or not used. */
  reference_uv: number | null;
  noise_uv: number | null;
  /** With RVE and a %MVE gap threshold: the worker's MVE, µV. */
  mve_uv: number | null;
  spans: { file: string; start_s: number; end_s: number; annotation: string | null }[];
}

export interface StudyResults {
  format: 'shiftload-results/1';
  tool: { name: 'shiftload'; version: string };
  title: string;
  /** Reference and noise levels per worker × recording × channel. */
  references?: ReferenceValue[];
  /** Effective settings, every default filled in. */
  settings: Record<string, unknown>;
  inputs: { file: string; sha256: string; duration_s: number }[];
  rows: ResultRow[];
  eva: EvaMatrix[];
  traces: EnvelopeTrace[];
  /** APDF curves: for each row key, the envelope value at every percent 0…100. */
  apdf: { worker: string; condition: string; muscle: string; segment: string; unit: LoadUnit; levels: number[] }[];
  findings: Finding[];
  /** Condition comparisons across workers (lib/study/compare-conditions.ts); absent when not run. */
  comparisons?: Comparison[];
}

/** One worker's values in a condition comparison (null where the worker has no value). */
export interface ComparisonWorker {
  worker: string;
  a: number | null;
  b: number | null;
  /** b − a for paired comparisons; null when unpaired or a value is missing. */
  difference: number | null;
}

/** One segment × muscle × measure comparison of condition b against condition a across workers. */
export interface Comparison {
  segment: string;
  muscle: string;
  /** Measure key of ResultRow: p10, p50, p90, gaps_per_min, rest_pct, … */
  measure: string;
  /** Unit of the measure and of the differences: %MVE/%RVE/… for percentiles, 'gaps/min', '% time', 's'. */
  unit: string;
  /** Normalization unit of the rows compared (comparisons never mix them). */
  normalization: LoadUnit;
  condition_a: string;
  condition_b: string;
  /** True when workers were matched by id (only workers with both conditions are used). */
  paired: boolean;
  /** Number of pairs (paired) or n_a + n_b (unpaired). */
  n: number;
  n_a: number;
  n_b: number;
  per_worker: ComparisonWorker[];
  /** Paired only: workers left out because they lack one of the two conditions. */
  excluded_workers: string[];
  median_a: number | null;
  median_b: number | null;
  /** Paired: median of b − a; unpaired: median(b) − median(a). */
  median_difference: number | null;
  /** Paired: mean of b − a; unpaired: mean(b) − mean(a). */
  mean_difference: number | null;
  /** Bootstrap percentile interval of median_difference; null when descriptive_only. */
  ci_low: number | null;
  ci_high: number | null;
  /** Confidence level as a fraction, e.g. 0.95. */
  ci_level: number;
  /** How the interval was made (resamples, seed); null when descriptive_only. */
  ci_method: string | null;
  /** Two-sided p-value; null when descriptive_only. */
  p_value: number | null;
  /** Test name with its p-value method, or 'none (descriptive only)'. */
  test: string;
  /** Matched-pairs rank-biserial r (paired) or Cliff's delta (unpaired), −1…1; positive = higher in b. */
  effect_size: number | null;
  effect_size_name: string;
  /** Paired only: number of workers with b < a, b > a, b = a. */
  lower_in: number | null;
  higher_in: number | null;
  unchanged_in: number | null;
  /** True when fewer than 5 workers per condition (pairs < 5, or n_a or n_b < 5). */
  descriptive_only: boolean;
  /** One plain-language sentence that never overclaims. */
  statement: string;
  /** Planning aid (paired comparisons with ≥ 2 differences); see lib/study/plan-comparisons.ts. */
  planning?: ComparisonPlanning;
}

/** What this design could detect, and the workers needed for a named difference. */
export interface ComparisonPlanning {
  /** Sample SD of the per-worker differences, in the comparison's unit. */
  sd_of_differences: number;
  n: number;
  /** Smallest mean difference detectable with n workers at alpha and power. */
  detectable_difference: number;
  alpha: number;
  power: number;
  /** The difference the user asked about (--detect), or null. */
  detect: number | null;
  /** Workers needed to detect it, or null. */
  workers_needed: number | null;
  method: string;
}

// ---------------------------------------------------------------------------------------------
// Optional fields read by the report (added by the report helper; all optional, all additive).
// ---------------------------------------------------------------------------------------------

/** Who/where/when, for the report's title block. Every field optional. */
export interface StudyInfo {
  /** Workplace or site name as the study team wants it printed. */
  site?: string;
  /** First and last measurement day, ISO dates (YYYY-MM-DD). */
  start_date?: string;
  end_date?: string;
  /** Organisation or team responsible for the measurements (PDF author). */
  organisation?: string;
  /** One or two sentences on what was studied. */
  description?: string;
  /** Task segment labels in the order the report should list them (otherwise first appearance). */
  segment_order?: string[];
}

/** A mean power spectrum of one worker × condition × muscle (for the band-suggestion chart). */
export interface SpectrumResult {
  worker: string;
  condition: string;
  muscle: string;
  /** Frequency of each bin, Hz. */
  freq_hz: number[];
  /** Power spectral density at each bin, µV²/Hz. */
  psd: number[];
  /** The band the analysis suggests for the band-pass filter, Hz. */
  suggested_band_hz?: [number, number];
  // Written by analyze (lib/study/recording-spectrum.ts); all optional for older results.
  /** Recording file (as written in the job) and signal label of the channel. */
  recording?: string;
  signal?: string;
  /** Width of the frequency bins, Hz (bin j centred on j·bin_hz). */
  bin_hz?: number;
  /** Epochs averaged (all whole epochs of the raw signal; rest included, NaN epochs left out). */
  epochs?: number;
  /** Epoch length, s (each epoch: mean removed, Hann window, one FFT). */
  epoch_s?: number;
  /** Suggested mains notch, Hz, or null when no mains line stands out. */
  suggested_notch_hz?: number | null;
  /** Plain-language reasons for the suggestion, with the numbers behind them (lib/dsp/suggest-band.ts). */
  suggestion_reasons?: string[];
  /** Mean and median power frequency of this spectrum over `mnf_band_hz`, Hz (null when no power). */
  mnf_hz?: number | null;
  mdf_hz?: number | null;
  mnf_band_hz?: [number, number];
}

export interface StudyResults {
  /** Study title block (site, dates, organisation). */
  study?: StudyInfo;
  /** When the analysis was run, ISO date-time; the report uses it as its creation date. */
  created?: string;
  /** Mean spectra per worker × condition × muscle; the report draws them when present. */
  spectra?: SpectrumResult[];
}

// ---------------------------------------------------------------------------------------------
// Fatigue over the shift: spectral trends and JASA (added by the fatigue helper; all additive).
// ---------------------------------------------------------------------------------------------

/** JASA category of a block (lib/exposure/jasa.ts), or why there is none. */
export type FatigueCategory = 'force-increase' | 'force-decrease' | 'fatigue' | 'recovery' | 'no-clear-change' | 'insufficient-data';

/**
 * Trends of amplitude and mean power frequency (MNF) in one time block or task segment of one
 * worker × recording × muscle, and their JASA category (lib/exposure/fatigue-blocks.ts).
 * Numbers are null where they could not be computed (too few active epochs, no reference).
 */
export interface FatigueBlock {
  worker: string;
  condition: string;
  muscle: string;
  signal: string;
  recording: string;
  /** Task segment label for a segment block; null for a time block. */
  segment: string | null;
  /** Window, s from the recording start (epochs whose centre lies in [start_s, end_s)). */
  start_s: number;
  end_s: number;
  /** Active epochs used for the trends. */
  epochs: number;
  /** All whole epochs in the window. */
  epochs_total: number;
  /** Unit of the amplitude values (the study's load unit). */
  amplitude_unit: LoadUnit;
  /** Unit of the amplitude slope, e.g. "%MVE/min". */
  amplitude_slope_unit: string;
  amplitude_mean: number | null;
  amplitude_slope_per_min: number | null;
  amplitude_ci_low: number | null;
  amplitude_ci_high: number | null;
  mnf_mean_hz: number | null;
  mnf_slope_hz_per_min: number | null;
  mnf_ci_low: number | null;
  mnf_ci_high: number | null;
  /** Median frequency: mean and slope (no interval; MNF decides the category). */
  mdf_mean_hz: number | null;
  mdf_slope_hz_per_min: number | null;
  category: FatigueCategory;
  /** Confidence level of the intervals, as a fraction (0.95). */
  ci_level: number;
  /** The rule that made an epoch active, in words with the numbers used. */
  active_rule: string;
}

/**
 * MNF and amplitude over a whole recording of one channel, for the report chart: medians of the
 * active epochs per step (null where a step has fewer than 5 active epochs). Point k covers
 * [k·step_s, (k+1)·step_s) s from the recording start.
 */
export interface FatigueSeries {
  worker: string;
  condition: string;
  muscle: string;
  signal: string;
  recording: string;
  step_s: number;
  amplitude_unit: LoadUnit;
  mnf_hz: (number | null)[];
  mdf_hz: (number | null)[];
  amplitude: (number | null)[];
  active_epochs: number[];
  segments: { label: string; start_s: number; end_s: number }[];
}

/** How the spectral epochs were made (one per study; printed in the methods section). */
export interface FatigueMethod {
  epoch_s: number;
  block_s: number;
  band_hz: [number, number];
  active_threshold_pct: number;
  active_noise_factor: number;
  min_epochs: number;
  ci_level: number;
  /** Plain-words description of epochs, spectra and trend fitting. */
  description: string;
}

export interface StudyResults {
  /** Trend blocks per worker × recording × muscle (time blocks and task segments); absent when not run. */
  fatigue?: FatigueBlock[];
  /** MNF-over-time series per recording × muscle for the report chart. */
  fatigue_series?: FatigueSeries[];
  /** Settings and wording of the fatigue analysis. */
  fatigue_method?: FatigueMethod;
}

// ---------------------------------------------------------------------------------------------
// Optional field added by the quality screening (lib/quality); additive.
// ---------------------------------------------------------------------------------------------

/** Signal-quality accounting of one worker × recording × channel (times in s). */
export interface QualityRow {
  worker: string;
  condition: string;
  muscle: string;
  signal: string;
  recording: string;
  /** Time screened, s. */
  screened_s: number;
  /** Time left out of the statistics by the screening (union of excluded spans), s. */
  excluded_s: number;
  /** Time flagged by each check, s. */
  clipped_s: number;
  flat_s: number;
  lost_s: number;
  mains_s: number;
  motion_s: number;
  ecg_s: number;
  /** Samples at the digital limits; null without digital limits (CSV). */
  clipped_samples: number | null;
  /** Median heart rate where ECG was found, beats/min. */
  ecg_rate_bpm: number | null;
  /** Task-to-noise ratio, dB (null without a noise level). */
  snr_db: number | null;
  /** Excluded spans with their reasons, s from the recording start. */
  excluded: { start_s: number; end_s: number; reason: string }[];
}

export interface StudyResults {
  /** Signal-quality accounting per recording channel; absent when screening was not run. */
  quality?: QualityRow[];
}
