// The simulation spec (format `shiftload-simulation/1`): what `shiftload simulate` reads. A study
// of invented workers, each with muscles (channels), reference and rest recordings and one field
// recording per condition made of task segments whose load is designed per task. Types plus the
// one DEFAULTS object; loading and validation live in load-simulation-spec.ts.

/** How a task's load envelope is designed (all levels in %MVE of the worker's muscle). */
export interface TaskDesign {
  /** Mean of the step levels, %MVE. */
  level_pct: number;
  /** Standard deviation of the step levels around the mean, %MVE. @default 0 */
  spread_pct: number;
  /** Step durations are uniform in [min, max], s. @default [2, 8] */
  step_s: [number, number];
  /** Raised-cosine transition from one step level to the next, s. @default 0.5 */
  ramp_s: number;
  /** Step levels are clamped to [floor_pct, cap_pct] (floor well above the gap threshold). @default 1.5 */
  floor_pct: number;
  /** @default 100 */
  cap_pct: number;
  /** Designed rest gaps per minute of segment. @default 0 */
  gaps_per_min: number;
  /** Gap durations uniform in [min, max], s (min above the analysis' gap minimum). @default [0.5, 1.5] */
  gap_s: [number, number];
  /** Envelope level inside a gap, %MVE (below the gap threshold). @default 0.1 */
  gap_level_pct: number;
  /** Least time between two gaps and between a gap and a segment edge, s. @default 3 */
  gap_separation_s: number;
}

/** One task in a condition's work cycle. */
export interface CycleStep { task: string; duration_s: number }

export interface ArtifactSpec {
  /** Mains hum: sinusoid of this peak amplitude (µV) and frequency (Hz) over the whole recording. */
  hum?: { amplitude_uv: number; freq_hz: number };
  /** ECG-like QRS complexes: R-peak amplitude (µV) at a heart rate (beats/min), ±3 % beat jitter. */
  ecg?: { amplitude_uv: number; rate_bpm: number };
  /** Low-frequency motion bursts: Hann-windowed sinusoid of peak amplitude (µV) and frequency (Hz). */
  motion?: { start_s: number; duration_s: number; amplitude_uv: number; freq_hz: number }[];
  /** Electrode drop-out: flat line at 0 µV over each span. */
  dropout?: { start_s: number; duration_s: number }[];
  /** White amplifier noise added after band-limiting, µV RMS (not part of the designed noise). */
  amplifier_uv?: number;
  /** Physical range ±clip_uv: samples beyond it are clipped to the limit (as a logger would). */
  clip_uv?: number;
}

export interface MuscleSpec {
  /** Channel id used in the spec (e.g. "trap"). */
  id: string;
  /** Signal label written in the recording. */
  signal: string;
  /** Muscle description written into the job file. */
  muscle: string;
}

export interface WorkerMuscleSpec {
  /** The worker's designed MVE (RMS at 100 %MVE), µV. */
  mve_uv: number;
  /** The designed noise floor (band-limited like the EMG), µV RMS. */
  noise_uv: number;
  /** Multiplies every task's level and spread. @default 1 */
  load: number;
  /** Multiplies every task's gaps per minute. @default 1 */
  rest: number;
}

export interface WorkerSpec {
  id: string;
  muscles: Record<string, WorkerMuscleSpec>;
  /** Per-condition extra factors for this worker: { condition: { muscle: { load, rest } } }. */
  conditions: Record<string, Record<string, { load: number; rest: number }>>;
  /** Artifacts: { condition or "reference"/"rest": { muscle: ArtifactSpec } }. */
  artifacts: Record<string, Record<string, ArtifactSpec>>;
}

export interface ConditionSpec {
  id: string;
  /** The work cycle, repeated until the recording's duration is filled. */
  cycle: CycleStep[];
  /** Task designs: { task: { muscle: TaskDesign } }. */
  tasks: Record<string, Record<string, TaskDesign>>;
}

export interface VariantSpec {
  /** Field recording duration, whole s. */
  duration_s: number;
  /** Cycle step durations are multiplied by this. @default 1 */
  cycle_scale: number;
}

export interface ReferenceSpec {
  /** Number of MVC trials. @default 3 */
  trials: number;
  /** Quiet time before the first trial, s. @default 5 */
  lead_s: number;
  /** Linear ramp from rest to the hold level, s. @default 2 */
  ramp_s: number;
  /** Hold at hold_pct, s. @default 5 */
  hold_s: number;
  /** Linear release to rest, s. @default 1 */
  release_s: number;
  /** Rest between trials (and after the last), s. @default 15 */
  between_s: number;
  /** Hold level, %MVE. @default 100 */
  hold_pct: number;
}

export interface SimulationSpec {
  format: 'shiftload-simulation/1';
  title: string;
  site: string;
  seed: number;
  sampling_rate_hz: number;
  /** Grid of the designed envelope, Hz (truth percentiles are taken on this grid). @default 20 */
  design_rate_hz: number;
  /** Band of the EMG-like noise (Butterworth band-pass), Hz. @default [20, 450] */
  noise_band_hz: [number, number];
  /** @default 4 */
  noise_order: number;
  /** Recording start 'YYYY-MM-DDTHH:MM:SS'. */
  start: string;
  /** Output format of the recordings. @default 'edf' */
  output_format: 'edf' | 'csv';
  muscles: MuscleSpec[];
  reference: ReferenceSpec;
  /** Duration of the rest (noise) recording, whole s. @default 60 */
  rest_duration_s: number;
  conditions: ConditionSpec[];
  variants: Record<string, VariantSpec>;
  workers: WorkerSpec[];
  /** The job file to write beside the recordings: title, site and settings are copied as they are. */
  job: { settings: Record<string, unknown> };
}

/** Defaults of the simulation spec (units as in the field docs). */
export const SIM_DEFAULTS = {
  design_rate_hz: 20,
  noise_band_hz: [20, 450] as [number, number],
  noise_order: 4,
  start: '2026-01-01T08:00:00',
  output_format: 'edf' as const,
  rest_duration_s: 60,
  task: {
    spread_pct: 0,
    step_s: [2, 8] as [number, number],
    ramp_s: 0.5,
    floor_pct: 1.5,
    cap_pct: 100,
    gaps_per_min: 0,
    gap_s: [0.5, 1.5] as [number, number],
    gap_level_pct: 0.1,
    gap_separation_s: 3,
  },
  reference: { trials: 3, lead_s: 5, ramp_s: 2, hold_s: 5, release_s: 1, between_s: 15, hold_pct: 100 },
  variant: { cycle_scale: 1 },
  worker_muscle: { load: 1, rest: 1 },
  /** Gap threshold and minimum used for the designed rest figures when the job settings lack them. */
  gap_threshold_pct: 0.5,
  gap_min_s: 0.2,
  /** Percentiles reported in truth.json when the job settings lack them. */
  percentiles: [10, 50, 90],
  /** Default physical range: this many times the largest designed RMS, rounded up to 100 µV. */
  range_factor: 8,
  /** Band-limited noise is pre-run through the filter this long before the first sample, s. */
  warmup_s: 2,
};
