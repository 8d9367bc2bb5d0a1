// Defaults of the statistics used to compare conditions across workers.

export const DEFAULTS = {
  /** Bootstrap resamples. @default 10000 (percentile interval; Monte-Carlo error of a 2.5 % quantile ≈ ±0.3 percentage points of coverage) */
  resamples: 10000,
  /** Confidence level of intervals, as a fraction. @default 0.95 */
  level: 0.95,
  /** Seed of the bootstrap generator (SplitMix64), so results are reproducible. @default 1 */
  seed: 1,
  /** Largest number of non-zero differences for the exact signed-rank p-value (no ties). @default 25 */
  signed_rank_exact_max_n: 25,
  /** Largest size of each group for the exact rank-sum p-value (no ties). @default 25 */
  rank_sum_exact_max_n: 25,
  /** Two-sided significance level for planning. @default 0.05 */
  alpha: 0.05,
  /** Power for planning. @default 0.8 */
  power: 0.8,
} as const;
