// The loaded, validated and resolved study: what the analysis runs on. Every path is absolute,
// every time span is resolved to seconds, every setting is filled in.
import type { Settings } from './defaults.js';
import type { LoadUnit } from '../study/results.js';

/** A resolved stretch of a recording, s from that file's start (start_s < end_s ≤ duration). */
export interface StudySpan {
  /** Absolute path of the file holding the span. */
  file: string;
  /** The path as written in the job file (for messages and the report). */
  fileAsWritten: string;
  /** Sampling rate to pass to openRecording for a CSV file without a time column; null otherwise. */
  rate_hz: number | null;
  start_s: number;
  end_s: number;
  /** The annotation text the span came from, or null when given by times. */
  annotation: string | null;
  /**
   * For a span attached to a recording: the index (SignalInfo.index) in this span's file of each of
   * the recording's channels, in channel order (reference files may order signals differently).
   */
  signalIndices: number[];
}

/** A task segment of a recording, s from the recording start. Sorted by start, never overlapping. */
export interface StudySegment {
  label: string;
  start_s: number;
  end_s: number;
  /** Where the segment was defined. */
  source: 'job' | 'annotation' | 'csv';
}

export interface StudyChannel {
  /** Signal label as in the recording header. */
  signal: string;
  /** 0-based index among the recording's data signals (SignalInfo.index). */
  signalIndex: number;
  /** Muscle name (defaults to the signal label); channels are paired across workers by it. */
  muscle: string;
  /** Sampling rate of the signal in the field recording, Hz. */
  rate_hz: number;
}

export interface StudyRecording {
  /** Unique in the study: `<worker id>/<file as written>`. */
  id: string;
  /** Absolute path. */
  file: string;
  fileAsWritten: string;
  /** Sampling rate to pass to openRecording for a CSV file without a time column; null otherwise. */
  rate_hz: number | null;
  condition: string;
  notes: string | null;
  /** Recording length from its header, s. */
  duration_s: number;
  channels: StudyChannel[];
  segments: StudySegment[];
  /**
   * Reference contraction spans (recording override, else the worker's). Empty when normalize is
   * task-peak or none. The same signal labels are read from these files.
   */
  reference: StudySpan[];
  /** Rest (noise) spans; empty when noise_correction is false and none were given. */
  rest: StudySpan[];
  /** MVE spans for converting a %MVE gap threshold under normalize rve; empty otherwise. */
  mveReference: StudySpan[];
}

export interface StudyWorker {
  id: string;
  notes: string | null;
  recordings: StudyRecording[];
}

/** How the gap threshold is applied, resolved from settings and the references present. */
export interface GapThreshold {
  /** The number written in settings.gap_threshold_pct. */
  value: number;
  /** Unit of `value`: '%MVE' when converted or normalizing to MVE, else the envelope's unit. */
  unit: LoadUnit;
  /**
   * True when `value` is %MVE but the envelope is %RVE: the analysis converts it per worker with
   * k = RVE / MVE from that worker's mveReference (threshold_%RVE = value / k).
   */
  convertPerWorker: boolean;
  /** One sentence for the report saying how the threshold was applied. */
  note: string;
}

export interface Study {
  format: 'shiftload-job/1';
  title: string;
  site: string | null;
  date: string | null;
  analyst: string | null;
  notes: string | null;
  /** Absolute path of the job file. */
  jobFile: string;
  /** Folder that relative paths in the job file are resolved against (the job file's folder). */
  baseDir: string;
  /** Effective settings: every default filled in. */
  settings: Settings;
  /** Unit of the normalized envelope. */
  unit: LoadUnit;
  gapThreshold: GapThreshold;
  workers: StudyWorker[];
}
