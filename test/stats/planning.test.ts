import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { detectableDifference, workersNeeded } from '../../lib/stats/detectable-difference.js';
import { hodgesLehmann, hodgesLehmannShift } from '../../lib/stats/hodges-lehmann.js';
import { median } from '../../lib/stats/median.js';
import { mean } from '../../lib/stats/mean.js';
import { UsageError } from '../../lib/errors.js';

// z quantiles: test/stats/fixtures/rank_tests.json (scipy.stats.norm.ppf, scipy 1.17.1).
const fx = JSON.parse(readFileSync(new URL('./fixtures/rank_tests.json', import.meta.url), 'utf8')) as { quantiles: { p: number; z: number }[] };
const z = (p: number) => fx.quantiles.find((q) => q.p === p)!.z;

describe('workersNeeded(difference, sd, options) and detectableDifference(spread, options)', () => {
  it('workersNeeded(1, 1) = 8 since (z0.975 + z0.80)² = 7.85 (sample-size tables, from memory; z from scipy)', () => {
    const r = workersNeeded(1, 1);
    expect(r.n_exact).toBeCloseTo((z(0.975) + z(0.8)) ** 2, 10);
    expect(r.n_exact.toFixed(2)).toBe('7.85');
    expect(r.n).toBe(8);
    expect(r.method).toMatch(/normal approximation/);
    expect(workersNeeded(-2, 3, { power: 0.9 }).n_exact).toBeCloseTo(((z(0.975) + z(0.9)) * 1.5) ** 2, 10);
  });

  it('detectableDifference inverts workersNeeded: δ(n = n_exact) = the difference', () => {
    const need = workersNeeded(0.8, 2);
    const n = need.n;
    const d = detectableDifference(2, { n });
    expect(d.difference).toBeCloseTo(((z(0.975) + z(0.8)) * 2) / Math.sqrt(n), 10);
    expect(d.difference).toBeLessThanOrEqual(0.8); // rounding n up can only shrink δ
  });

  it('detectableDifference(per-worker differences) uses their sample SD (n − 1)', () => {
    const diffs = [1, 2, 3, 4, 5]; // SD = √2.5
    expect(detectableDifference(diffs, { n: 10 }).sd).toBeCloseTo(Math.sqrt(2.5), 12);
    expect(() => detectableDifference([1], { n: 10 })).toThrow(UsageError);
    expect(() => detectableDifference(1, { n: 1 })).toThrow(/n must be/);
    expect(() => workersNeeded(0, 1)).toThrow(/difference/);
  });
});

describe('median, mean, hodgesLehmann', () => {
  it('median / mean ignore NaN', () => {
    expect(median([3, 1, NaN, 2, 10])).toBe(2.5);
    expect(mean([1, 2, NaN, 6])).toBe(3);
    expect(median([])).toBeNaN();
  });
  it('hodgesLehmann([1, 2, 9]) = 3.5 (median of Walsh averages 1, 1.5, 2, 5, 5.5, 9; Hodges & Lehmann 1963)', () => {
    expect(hodgesLehmann([1, 2, 9])).toBe(3.5);
    expect(hodgesLehmannShift([1, 2], [4, 6])).toBe(3.5);
  });
});
