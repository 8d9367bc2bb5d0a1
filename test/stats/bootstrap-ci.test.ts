import { describe, expect, it } from 'vitest';
import { bootstrapCi, bootstrapDifferenceCi } from '../../lib/stats/bootstrap-ci.js';
import { median } from '../../lib/stats/median.js';
import { mean } from '../../lib/stats/mean.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';
import { UsageError } from '../../lib/errors.js';

describe('bootstrapCi(values, statistic, options)', () => {
  it('bootstrapCi is deterministic for a seed and differs between seeds', () => {
    const x = [1.2, -0.4, 2.2, 0.9, -0.3, 1.5, 0.1, 3.0];
    const a = bootstrapCi(x, median, { seed: 11, resamples: 2000 });
    const b = bootstrapCi(x, median, { seed: 11, resamples: 2000 });
    const c = bootstrapCi(x, mean, { seed: 12, resamples: 2000 });
    const d = bootstrapCi(x, mean, { seed: 13, resamples: 2000 });
    expect(a).toEqual(b);
    expect([c.low, c.high]).not.toEqual([d.low, d.high]);
    expect(a.estimate).toBe(median(x));
    expect(a.low).toBeLessThanOrEqual(a.estimate);
    expect(a.high).toBeGreaterThanOrEqual(a.estimate);
    expect(a.method).toMatch(/2000 resamples/);
  });

  it('bootstrapCi(constant sample) gives a zero-width interval at the constant', () => {
    const r = bootstrapCi(new Float64Array(7).fill(2.5), median, { resamples: 500 });
    expect([r.low, r.high]).toEqual([2.5, 2.5]);
  });

  it('bootstrapCi of the median covers the true median in 0.90–0.99 of 200 simulated studies (known truth)', () => {
    // Paired differences ~ N(1, 2²), n = 12 workers; true median difference = 1.
    const g = new SplitMix64(2026);
    let covered = 0;
    const studies = 200;
    for (let s = 0; s < studies; s++) {
      const d = new Float64Array(12);
      for (let i = 0; i < d.length; i++) d[i] = 1 + 2 * g.normal();
      const ci = bootstrapCi(d, median, { resamples: 1000, seed: s + 1 });
      if (ci.low <= 1 && 1 <= ci.high) covered++;
    }
    const coverage = covered / studies;
    expect(coverage).toBeGreaterThanOrEqual(0.9);
    expect(coverage).toBeLessThanOrEqual(0.99);
  });

  it('bootstrapCi of the mean approaches the normal-theory interval mean ± 1.96·SD/√n for large n', () => {
    const g = new SplitMix64(5);
    const x = new Float64Array(400);
    for (let i = 0; i < x.length; i++) x[i] = 10 + 3 * g.normal();
    const m = mean(x);
    let s2 = 0;
    for (const v of x) s2 += (v - m) ** 2;
    const se = Math.sqrt(s2 / x.length) / Math.sqrt(x.length);
    const r = bootstrapCi(x, mean, { resamples: 4000, seed: 9 });
    expect(Math.abs(r.low - (m - 1.96 * se))).toBeLessThan(0.1 * 1.96 * se);
    expect(Math.abs(r.high - (m + 1.96 * se))).toBeLessThan(0.1 * 1.96 * se);
  });

  it('bootstrapCi rejects empty samples and bad options (UsageError)', () => {
    expect(() => bootstrapCi([NaN], median)).toThrow(UsageError);
    expect(() => bootstrapCi([1, 2], median, { level: 1 })).toThrow(/level/);
    expect(() => bootstrapCi([1, 2], median, { resamples: 0 })).toThrow(/resamples/);
  });
});

describe('bootstrapDifferenceCi(a, b, statistic, options)', () => {
  it('bootstrapDifferenceCi of medians covers the true shift in 0.90–0.99 of 200 simulated studies (known truth)', () => {
    const g = new SplitMix64(77);
    let covered = 0;
    const studies = 200;
    for (let s = 0; s < studies; s++) {
      const a = new Float64Array(12);
      const b = new Float64Array(14);
      for (let i = 0; i < a.length; i++) a[i] = 10 + 3 * g.normal();
      for (let i = 0; i < b.length; i++) b[i] = 8 + 3 * g.normal();
      const ci = bootstrapDifferenceCi(a, b, median, { resamples: 1000, seed: s + 1 });
      if (ci.low <= -2 && -2 <= ci.high) covered++;
    }
    const coverage = covered / studies;
    expect(coverage).toBeGreaterThanOrEqual(0.9);
    expect(coverage).toBeLessThanOrEqual(0.99);
  });

  it('bootstrapDifferenceCi estimate is statistic(b) − statistic(a)', () => {
    const r = bootstrapDifferenceCi([1, 2, 3], [5, 6, 7, 8], median, { resamples: 200 });
    expect(r.estimate).toBe(6.5 - 2);
    expect(r.low).toBeLessThanOrEqual(r.high);
  });
});
