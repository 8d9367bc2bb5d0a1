// Defaults of every exposure measure in one place, with units; the report prints them in its
// methods section. Thresholds are in the normalized unit of the envelope (%MVE unless stated).

/** Default settings of the exposure measures (lib/exposure). */
export const DEFAULTS = {
  /**
   * Amplitude threshold for EMG gaps and muscular rest, in %MVE.
   * @default 0.5
   * Hansson et al. 2000 (JEK 10:103–115): ≈0.5 %MVE optimal for muscular rest, ≈0.3 %MVE for gap
   * frequency; Veiersted et al. 2013: 0.5 %EMGmax preferable. FOUND (METHODS.md §2.2).
   */
  gap_threshold: 0.5,
  /**
   * Minimum duration of an EMG gap, in s (inclusive: a run of exactly 0.2 s is a gap).
   * @default 0.2
   * Veiersted et al. 1990 (gaps 0.2–2 s). FOUND.
   */
  min_gap_s: 0.2,
  /**
   * Optional maximum duration of an EMG gap, in s; null = no upper bound (later practice).
   * @default null
   */
  max_gap_s: null as number | null,
  /**
   * Which below-threshold time counts as muscular rest: 'all' (every sample below the threshold)
   * or 'gaps-only' (only runs lasting ≥ min_gap_s). Studies differ (FROM MEMORY).
   * @default 'all'
   */
  rest_counts: 'all' as 'all' | 'gaps-only',
  /**
   * Threshold for sustained activity, in %MVE.
   * @default 0.5
   * Hanvold et al. 2013 (> 0.5 %EMGmax). FOUND.
   */
  sustained_threshold: 0.5,
  /**
   * Minimum duration of sustained activity, in s (runs must last longer than this).
   * @default 240
   * Hanvold et al. 2013 (> 4 min). FOUND.
   */
  sustained_min_s: 240,
  /**
   * APDF percentiles (probability levels in %): static, median, peak load.
   * @default [10, 50, 90]
   * Jonsson 1982 (FROM MEMORY); 10/50/90th percentiles FOUND in Hansson 2009/2010, Nordander 2004.
   */
  percentiles: [10, 50, 90] as readonly number[],
  /**
   * EVA amplitude class edges, in %MVE; classes are [lo, hi), the last one open above.
   * @default [0, 1, 5, 10, 20, 30]
   * Illustrative, FROM MEMORY (Mathiassen & Winkel 1991 give the method, not these edges).
   */
  eva_amplitude_edges: [0, 1, 5, 10, 20, 30] as readonly number[],
  /**
   * EVA duration class edges, in s; classes are [lo, hi), the last one open above.
   * @default [0, 1, 3, 7, 15, 31, 63]
   * Illustrative, FROM MEMORY.
   */
  eva_duration_edges_s: [0, 1, 3, 7, 15, 31, 63] as readonly number[],
  /**
   * Tolerance in s when comparing a run's duration with a duration limit, so that float error in
   * samples / rate_hz does not move a run across the limit.
   * @default 1e-9
   */
  duration_tolerance_s: 1e-9,
} as const;
