// A fully designed recording: everything the synthesizer needs to produce its samples and the
// truth computation needs to state what was designed. Plain data, made by planStudy().
import type { ArtifactSpec } from './simulation-spec.js';
import type { PlannedSegment, DesignedGap } from './design-envelope.js';

export interface ChannelDesign {
  /** Spec muscle id (e.g. "trap"). */
  muscle_id: string;
  /** Signal label in the file. */
  signal: string;
  /** Muscle description (job file). */
  muscle: string;
  /** Designed MVE, µV RMS. */
  mve_uv: number;
  /** Designed band-limited noise floor, µV RMS. */
  noise_uv: number;
  /** Designed envelope, %MVE, on the grid k / design_rate_hz. */
  envelope: Float64Array;
  /** Gaps placed per segment (field recordings). */
  gaps: DesignedGap[][];
  artifacts: ArtifactSpec;
  /** Physical range written to the file: ±physical_range_uv. */
  physical_range_uv: number;
  /** Seed of this channel's sample streams. */
  seed: bigint;
}

export interface RecordingDesign {
  /** File name without folder, e.g. "w1-bench-fixed.edf". */
  file: string;
  kind: 'field' | 'reference' | 'rest';
  worker: string;
  /** Condition id (field recordings), else null. */
  condition: string | null;
  sampling_rate_hz: number;
  design_rate_hz: number;
  duration_s: number;
  start: string;
  channels: ChannelDesign[];
  /** Task segments (field recordings; shared by all channels). */
  segments: PlannedSegment[];
  annotations: { onset_s: number; duration_s: number | null; text: string }[];
}
