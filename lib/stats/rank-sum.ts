// Wilcoxon rank-sum / Mann–Whitney U test for two independent samples, two-sided (Wilcoxon 1945;
// Mann & Whitney 1947, Ann Math Stat 18(1):50–60). Conventions match scipy.stats.mannwhitneyu.

import { UsageError } from '../errors.js';
import { exposureMsg } from '../messages.js';
import { averageRanks } from './average-ranks.js';
import { DEFAULTS } from './defaults.js';
import { normalSf } from './normal-cdf.js';

export interface RankSumResult {
  n_a: number;
  n_b: number;
  /** U of sample b: number of pairs (a, b) with b > a, ties counting ½. */
  u_b: number;
  /** U of sample a = n_a·n_b − u_b. */
  u_a: number;
  /** Rank sum of sample b (ranks in the pooled sample, ties averaged). */
  rank_sum_b: number;
  /** Two-sided p-value. */
  p_value: number;
  method: 'exact' | 'normal';
  z: number | null;
  /**
   * Rank-biserial correlation = Cliff's delta = P(b > a) − P(b < a) = 2·u_b/(n_a·n_b) − 1, −1…1;
   * positive = b tends to be larger.
   */
  rank_biserial: number;
}

/** Counts of U for sizes m, n without ties: cnt[u] = number of size-m subsets of {1…m+n} with rank sum u + m(m+1)/2. */
function rankSumCounts(m: number, n: number): Float64Array {
  const N = m + n;
  const maxU = m * n;
  // ways[k][s] over items added so far; s is the sum minus k(k+1)/2 (i.e. U), bounded by k·(items − k).
  let ways: Float64Array[] = Array.from({ length: m + 1 }, () => new Float64Array(maxU + 1));
  ways[0]![0] = 1;
  for (let item = 1; item <= N; item++) {
    const next = ways.map((w) => Float64Array.from(w));
    for (let k = 1; k <= Math.min(item, m); k++) {
      // adding `item` as the k-th chosen element increases U by (item − k)
      const shift = item - k;
      const src = ways[k - 1]!;
      const dst = next[k]!;
      for (let u = 0; u + shift <= maxU; u++) if (src[u]! !== 0) dst[u + shift] = dst[u + shift]! + src[u]!;
    }
    ways = next;
  }
  return ways[m]!;
}

/**
 * Two-sided Wilcoxon rank-sum (Mann–Whitney U) test of samples a and b.
 *
 * - p-value: exact (enumeration of all rank assignments) when both samples have ≤ 25 values and
 *   there are no ties; otherwise the normal approximation with tie-corrected variance
 *   n_a·n_b/12·((N+1) − Σ(t³−t)/(N(N−1))) and a 0.5 continuity correction.
 *   p = min(1, 2·min(P(U ≤ u), P(U ≥ u))).
 * - NaN values are ignored.
 *
 * @param a sample of condition a
 * @param b sample of condition b
 * @throws UsageError when a sample has no finite value
 * @example rankSum([1, 2, 3], [4, 5, 6]).p_value // 0.1 (exact)
 */
export function rankSum(a: ArrayLike<number>, b: ArrayLike<number>): RankSumResult {
  const xa: number[] = [];
  const xb: number[] = [];
  for (let i = 0; i < a.length; i++) if (a[i]! === a[i]!) xa.push(a[i]!);
  for (let i = 0; i < b.length; i++) if (b[i]! === b[i]!) xb.push(b[i]!);
  const na = xa.length;
  const nb = xb.length;
  if (na === 0) throw new UsageError(exposureMsg.emptySample('rankSum sample a'));
  if (nb === 0) throw new UsageError(exposureMsg.emptySample('rankSum sample b'));
  const N = na + nb;
  const { ranks, tie_sum, has_ties } = averageRanks([...xa, ...xb]);
  let rb = 0;
  for (let i = na; i < N; i++) rb += ranks[i]!;
  const uB = rb - (nb * (nb + 1)) / 2;
  const uA = na * nb - uB;
  const delta = (2 * uB) / (na * nb) - 1;
  if (!has_ties && na <= DEFAULTS.rank_sum_exact_max_n && nb <= DEFAULTS.rank_sum_exact_max_n) {
    const c = rankSumCounts(nb, na); // distribution of U of sample b
    const u = Math.round(uB);
    let le = 0;
    let ge = 0;
    let all = 0;
    for (let k = 0; k < c.length; k++) { all += c[k]!; if (k <= u) le += c[k]!; if (k >= u) ge += c[k]!; }
    const p = Math.min(1, (2 * Math.min(le, ge)) / all);
    return { n_a: na, n_b: nb, u_b: uB, u_a: uA, rank_sum_b: rb, p_value: p, method: 'exact', z: null, rank_biserial: delta };
  }
  const mu = (na * nb) / 2;
  const varU = ((na * nb) / 12) * (N + 1 - tie_sum / (N * (N - 1)));
  let d = uB - mu;
  if (d !== 0) d -= 0.5 * Math.sign(d);
  const z = varU > 0 ? d / Math.sqrt(varU) : 0;
  const p = Math.min(1, 2 * normalSf(Math.abs(z)));
  return { n_a: na, n_b: nb, u_b: uB, u_a: uA, rank_sum_b: rb, p_value: p, method: 'normal', z, rank_biserial: delta };
}
