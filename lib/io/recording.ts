// The contract every recording reader (EDF family, CSV) fulfils: header information up front,
// then samples streamed in time-aligned chunks with bounded memory. Consumers (inspect, convert,
// analyze, spectrum, quality) depend only on this file.

/** One data signal (the EDF+ annotation signal is never listed here). */
export interface SignalInfo {
  /** 0-based index among the data signals (annotation signals excluded). */
  index: number;
  label: string;
  /** Physical unit as written in the file, e.g. "uV". */
  unit: string;
  /** Sampling rate in Hz (EDF: samples per record / record duration). */
  rate_hz: number;
  physical_min: number;
  physical_max: number;
  /** Digital limits (EDF/BDF); for CSV, NaN. */
  digital_min: number;
  digital_max: number;
  prefilter: string;
  transducer: string;
  /** Total number of samples of this signal in the file. */
  samples: number;
  /**
   * CSV/TSV only: number of empty cells in this column, read as NaN (a data-quality finding for
   * callers). Absent for EDF/BDF, which cannot hold missing values.
   */
  nan_count?: number;
}

/** An EDF+ annotation (TAL) or a CSV/segment-file event. Times in s from the recording start. */
export interface Annotation {
  onset_s: number;
  /** null when the TAL has no duration. */
  duration_s: number | null;
  text: string;
}

export type RecordingFormat = 'EDF' | 'EDF+C' | 'EDF+D' | 'BDF' | 'BDF+C' | 'BDF+D' | 'CSV';

export interface RecordingInfo {
  /** The path as given by the user (used in every message). */
  file: string;
  format: RecordingFormat;
  /** Start date-time from the header as 'YYYY-MM-DDTHH:MM:SS' (local time, no zone), or null. */
  start: string | null;
  /**
   * EDF+/BDF+: seconds (0 ≤ x < 1) by which the first data record starts after `start` (from its
   * time-keeping TAL). All times in this interface are relative to that first record. Absent: 0.
   */
  start_subsecond_s?: number;
  /** Total duration in s (records × record duration; CSV: samples / rate). */
  duration_s: number;
  /**
   * EDF+D only: end of the last data record in s from the start, by the records' own time-keeping
   * (larger than duration_s when the file has gaps). Absent for continuous files (= duration_s).
   */
  end_s?: number;
  signals: SignalInfo[];
  annotations: Annotation[];
  /** EDF/BDF record duration in s; null for CSV. */
  record_duration_s: number | null;
}

export interface ReadOptions {
  /** Indices (SignalInfo.index) of the signals to read, in the order wanted. */
  signals: number[];
  /** Start of the span to read, s from the recording start (default 0). */
  start_s?: number;
  /** End of the span (exclusive), s (default: end of recording). */
  end_s?: number;
  /**
   * EDF/BDF: deliver the stored digital integers instead of physical values (tests, format
   * tools). Ignored by the CSV reader. @default false
   */
  digital?: boolean;
}

/**
 * A piece of the recording: for each requested signal, the physical values covering the same
 * time span [start_s, start_s + duration). Arrays belong to the reader and are valid only until
 * the next chunk is requested; copy what you keep.
 */
export interface SignalChunk {
  /** Time of the first sample of each array, s from the recording start. */
  start_s: number;
  /** True when this chunk does not follow the previous one without a time gap (EDF+D). */
  gap_before: boolean;
  /** Physical values, one array per requested signal (in ReadOptions.signals order). */
  data: Float64Array[];
  /** Samples at the digital minimum, per requested signal, in this chunk (CSV: 0). */
  clipped_low: Int32Array;
  /** Samples at the digital maximum, per requested signal, in this chunk (CSV: 0). */
  clipped_high: Int32Array;
  /**
   * True when the reader guarantees that no value is NaN (EDF/BDF: integers times a finite
   * scale), so consumers may skip their NaN checks. Absent or false: NaN may occur.
   */
  nan_free?: boolean;
}

export interface Recording {
  readonly info: RecordingInfo;
  /** Stream the requested signals in time-aligned chunks. */
  read(options: ReadOptions): AsyncIterable<SignalChunk>;
  close(): Promise<void>;
}
