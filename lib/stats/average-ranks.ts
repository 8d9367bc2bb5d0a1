// Ranks 1…n with ties given the average of the ranks they span (midranks), plus the tie term
// Σ(t³ − t) used by the normal approximations of rank tests.

export interface AverageRanks {
  /** ranks[i] = rank of values[i], 1-based, ties averaged. */
  ranks: Float64Array;
  /** Σ (t³ − t) over groups of t tied values (0 without ties). */
  tie_sum: number;
  /** True when at least two values are equal. */
  has_ties: boolean;
}

/**
 * Midranks of the values (ascending), like scipy.stats.rankdata(method='average').
 *
 * @param values finite values
 * @example averageRanks([10, 20, 20, 30]).ranks // [1, 2.5, 2.5, 4]
 */
export function averageRanks(values: ArrayLike<number>): AverageRanks {
  const n = values.length;
  const idx = Array.from({ length: n }, (_, i) => i).sort((a, b) => values[a]! - values[b]! || a - b);
  const ranks = new Float64Array(n);
  let tie_sum = 0;
  let i = 0;
  while (i < n) {
    let j = i;
    while (j + 1 < n && values[idx[j + 1]!]! === values[idx[i]!]!) j++;
    const r = (i + j + 2) / 2;
    for (let k = i; k <= j; k++) ranks[idx[k]!] = r;
    const t = j - i + 1;
    if (t > 1) tie_sum += t * t * t - t;
    i = j + 1;
  }
  return { ranks, tie_sum, has_ties: tie_sum > 0 };
}
