import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { wilcoxonSignedRank } from '../../lib/stats/wilcoxon-signed-rank.js';
import { rankSum } from '../../lib/stats/rank-sum.js';
import { normalCdf, normalQuantile, normalSf } from '../../lib/stats/normal-cdf.js';
import { averageRanks } from '../../lib/stats/average-ranks.js';
import { UsageError } from '../../lib/errors.js';

// Expected: test/stats/fixtures/rank_tests.json, made by gen_rank_tests.py with scipy 1.17.1
// (scipy.stats.wilcoxon zero_method='wilcox', correction=True; scipy.stats.mannwhitneyu
// use_continuity=True; method set explicitly to the one shiftload chooses).
const fx = JSON.parse(readFileSync(new URL('./fixtures/rank_tests.json', import.meta.url), 'utf8')) as {
  signed_rank: { name: string; differences: number[]; method: string; statistic: number; t_plus: number; p_value: number }[];
  rank_sum: { name: string; a: number[]; b: number[]; method: string; u_b: number; p_value: number }[];
  normal: { z: number; sf: number; cdf: number }[];
  quantiles: { p: number; z: number }[];
};

const rel = (a: number, b: number, tol: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(tol * Math.max(Math.abs(b), 1e-300));

describe('wilcoxonSignedRank(differences)', () => {
  for (const c of fx.signed_rank) {
    it(`wilcoxonSignedRank(${c.name}) matches scipy.stats.wilcoxon (${c.method}; p rel 1e-10)`, () => {
      const r = wilcoxonSignedRank(c.differences);
      expect(r.method).toBe(c.method);
      expect(r.t_plus).toBe(c.t_plus);
      expect(r.statistic).toBe(c.statistic);
      rel(r.p_value, c.p_value, 1e-10);
    });
  }

  it('wilcoxonSignedRank: for n = 10 the two-sided 5 % critical value of T is 8 (textbook table, from memory)', () => {
    // T = min(T+, T−). Build difference sets of ten distinct magnitudes with T− = 8 and T− = 9.
    const withT = (t: number) => {
      const neg = new Set<number>(t === 8 ? [8] : [9]);
      return Array.from({ length: 10 }, (_, i) => (neg.has(i + 1) ? -(i + 1) : i + 1));
    };
    expect(wilcoxonSignedRank(withT(8)).p_value).toBeLessThanOrEqual(0.05);
    expect(wilcoxonSignedRank(withT(9)).p_value).toBeGreaterThan(0.05);
  });

  it('wilcoxonSignedRank drops zero differences (Wilcoxon convention) and ignores NaN', () => {
    const a = wilcoxonSignedRank([0, 0, 1.5, -2, 3.1, 0.7, NaN]);
    expect(a.n).toBe(4);
    expect(a.zeros).toBe(2);
    expect(a.method).toBe('normal'); // zeros present → normal approximation, as in scipy
    expect(wilcoxonSignedRank([0, 0]).p_value).toBe(1);
    expect(() => wilcoxonSignedRank([NaN])).toThrow(UsageError);
  });

  it('wilcoxonSignedRank: rank-biserial is +1 when all differences are positive and −1 when all negative', () => {
    expect(wilcoxonSignedRank([1, 2, 3]).rank_biserial).toBe(1);
    expect(wilcoxonSignedRank([-1, -2, -3]).rank_biserial).toBe(-1);
  });
});

describe('rankSum(a, b)', () => {
  for (const c of fx.rank_sum) {
    it(`rankSum(${c.name}) matches scipy.stats.mannwhitneyu (${c.method}; p rel 1e-10)`, () => {
      const r = rankSum(c.a, c.b);
      expect(r.method).toBe(c.method);
      expect(r.u_b).toBe(c.u_b);
      rel(r.p_value, c.p_value, 1e-10);
    });
  }

  it('rankSum: for n_a = n_b = 5 the two-sided 5 % critical value of U is 2 (textbook table, from memory)', () => {
    const a = [3, 5, 7, 8, 9];
    const b2 = [1, 2, 2.5, 4, 4.2]; // U_b = 2 (4>3, 4.2>3)
    const b3 = [1, 2, 2.5, 4, 6]; // U_b = 3 (4>3, 6>3, 6>5)
    expect(rankSum(a, b2).u_b).toBe(2);
    expect(rankSum(a, b2).p_value).toBeLessThanOrEqual(0.05);
    expect(rankSum(a, b3).u_b).toBe(3);
    expect(rankSum(a, b3).p_value).toBeGreaterThan(0.05);
  });

  it("rankSum: rank-biserial equals Cliff's delta P(b > a) − P(b < a) counted pair by pair", () => {
    const a = [1, 2, 2, 3, 5, 5];
    const b = [2, 3, 4, 5, 6, 6, 7];
    let gt = 0; let lt = 0;
    for (const x of a) for (const y of b) { if (y > x) gt++; else if (y < x) lt++; }
    expect(rankSum(a, b).rank_biserial).toBeCloseTo((gt - lt) / (a.length * b.length), 12);
  });
});

describe('normal distribution helpers', () => {
  it('normalSf / normalCdf match scipy.stats.norm (rel 1e-12)', () => {
    for (const c of fx.normal) { rel(normalSf(c.z), c.sf, 1e-12); rel(normalCdf(c.z), c.cdf, 1e-12); }
  });
  it('normalQuantile matches scipy.stats.norm.ppf (abs 1e-12); z(0.975) = 1.95996 (textbook)', () => {
    for (const c of fx.quantiles) expect(Math.abs(normalQuantile(c.p) - c.z)).toBeLessThan(1e-12);
    expect(normalQuantile(0.975).toFixed(5)).toBe('1.95996');
  });
  it('averageRanks gives midranks and the tie term Σ(t³ − t)', () => {
    const r = averageRanks([10, 20, 20, 30, 20]);
    expect(Array.from(r.ranks)).toEqual([1, 3, 3, 5, 3]);
    expect(r.tie_sum).toBe(24);
  });
});
