// Wilcoxon signed-rank test for paired differences, two-sided (Wilcoxon 1945, Biometrics
// Bulletin 1(6):80–83). Conventions match scipy.stats.wilcoxon(zero_method='wilcox').

import { UsageError } from '../errors.js';
import { exposureMsg } from '../messages.js';
import { averageRanks } from './average-ranks.js';
import { DEFAULTS } from './defaults.js';
import { normalSf } from './normal-cdf.js';

export interface WilcoxonSignedRankResult {
  /** Number of non-zero differences used. */
  n: number;
  /** Number of zero differences dropped. */
  zeros: number;
  /** Sum of the ranks of the positive differences, T+. */
  t_plus: number;
  /** Sum of the ranks of the negative differences, T−. */
  t_minus: number;
  /** min(T+, T−), the classic tabulated statistic. */
  statistic: number;
  /** Two-sided p-value; 1 when n = 0. */
  p_value: number;
  /** 'exact' (enumeration) or 'normal' (normal approximation with tie and continuity correction). */
  method: 'exact' | 'normal';
  /** z of the normal approximation (null for the exact method). */
  z: number | null;
  /** Matched-pairs rank-biserial correlation (T+ − T−)/(T+ + T−), −1…1; positive = differences tend > 0. */
  rank_biserial: number;
}

/** Number of subsets of {1…n} with each rank sum 0…n(n+1)/2 (the null distribution of T+ × 2ⁿ). */
function signedRankCounts(n: number): Float64Array {
  const max = (n * (n + 1)) / 2;
  const c = new Float64Array(max + 1);
  c[0] = 1;
  let top = 0;
  for (let k = 1; k <= n; k++) {
    top += k;
    for (let s = top; s >= k; s--) c[s] = c[s]! + c[s - k]!;
  }
  return c;
}

/**
 * Two-sided Wilcoxon signed-rank test of paired differences d = b − a.
 *
 * - Zero differences are dropped (Wilcoxon's original convention; scipy zero_method='wilcox').
 * - Ties among |d| get average ranks.
 * - p-value: exact, by enumerating the null distribution of T+ (all 2ⁿ sign patterns), when
 *   n ≤ 25 and there are no ties and no zeros; otherwise the normal approximation with the
 *   tie-corrected variance n(n+1)(2n+1)/24 − Σ(t³−t)/48 and a 0.5 continuity correction.
 *   p = min(1, 2·min(P(T+ ≤ t), P(T+ ≥ t))).
 * - NaN differences are ignored.
 *
 * @param differences paired differences (b − a)
 * @returns statistics, p-value, method and matched-pairs rank-biserial effect size
 * @example wilcoxonSignedRank([1.2, 0.4, 2.2, 0.9, -0.3, 1.5]).p_value // 0.0625 (exact; scipy.stats.wilcoxon agrees)
 */
export function wilcoxonSignedRank(differences: ArrayLike<number>): WilcoxonSignedRankResult {
  const abs: number[] = [];
  const sign: number[] = [];
  let zeros = 0;
  for (let i = 0; i < differences.length; i++) {
    const d = differences[i]!;
    if (d !== d) continue;
    if (d === 0) { zeros++; continue; }
    abs.push(Math.abs(d));
    sign.push(d > 0 ? 1 : -1);
  }
  const n = abs.length;
  if (n === 0) {
    if (zeros === 0) throw new UsageError(exposureMsg.emptySample('wilcoxonSignedRank'));
    return { n: 0, zeros, t_plus: 0, t_minus: 0, statistic: 0, p_value: 1, method: 'exact', z: null, rank_biserial: 0 };
  }
  const { ranks, tie_sum, has_ties } = averageRanks(abs);
  let tPlus = 0;
  let tMinus = 0;
  for (let i = 0; i < n; i++) { if (sign[i]! > 0) tPlus += ranks[i]!; else tMinus += ranks[i]!; }
  const total = (n * (n + 1)) / 2;
  const rb = (tPlus - tMinus) / total;
  if (!has_ties && zeros === 0 && n <= DEFAULTS.signed_rank_exact_max_n) {
    const c = signedRankCounts(n);
    const all = 2 ** n;
    const t = Math.round(tPlus);
    let le = 0;
    for (let s = 0; s <= t; s++) le += c[s]!;
    let ge = 0;
    for (let s = t; s <= total; s++) ge += c[s]!;
    const p = Math.min(1, (2 * Math.min(le, ge)) / all);
    return { n, zeros, t_plus: tPlus, t_minus: tMinus, statistic: Math.min(tPlus, tMinus), p_value: p, method: 'exact', z: null, rank_biserial: rb };
  }
  const mu = total / 2;
  const varT = (n * (n + 1) * (2 * n + 1)) / 24 - tie_sum / 48;
  let d = tPlus - mu;
  if (d !== 0) d -= 0.5 * Math.sign(d);
  const z = varT > 0 ? d / Math.sqrt(varT) : 0;
  const p = Math.min(1, 2 * normalSf(Math.abs(z)));
  return { n, zeros, t_plus: tPlus, t_minus: tMinus, statistic: Math.min(tPlus, tMinus), p_value: p, method: 'normal', z, rank_biserial: rb };
}
