// Options every reader accepts, with their defaults in one place.

/** Options for openRecording and the format readers. */
export interface OpenOptions {
  /**
   * Bytes read per chunk (whole EDF data records, at least one). Exposed for tests that prove
   * chunk independence. @default 1048576 (1 MiB)
   */
  chunk_bytes?: number;
  /** CSV/TSV without a time column: sampling rate in Hz. Ignored when the file has a time column. */
  rate_hz?: number;
  /** CSV/TSV: physical unit for columns whose header gives none (`name [unit]`). @default 'uV' */
  unit?: string;
}

export const IO_DEFAULTS = {
  /** bytes per read */
  chunk_bytes: 1 << 20,
  /** physical unit of CSV columns without one */
  csv_unit: 'uV',
  /** largest relative deviation of a CSV time step from the median step */
  csv_time_tolerance: 0.01,
  /** time difference (s) below which consecutive EDF+D records count as contiguous */
  contiguity_tolerance_s: 1e-6,
  /** EDF+C: largest accepted deviation (s) of a record's time-keeping TAL from index · duration */
  continuous_tolerance_s: 1e-5,
} as const;
