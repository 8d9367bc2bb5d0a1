import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { linearRegression } from '../../lib/stats/linear-regression.js';
import { incompleteBeta, lnGamma, studentTCdf, studentTQuantile } from '../../lib/stats/student-t-quantile.js';

// Expected: test/stats/fixtures/linear_regression.json and t_quantiles.json, made by
// gen_linear_regression.py with scipy 1.17.1 (stats.linregress, stats.t.ppf, stats.t.cdf).
const reg = JSON.parse(readFileSync(new URL('./fixtures/linear_regression.json', import.meta.url), 'utf8')) as {
  cases: { name: string; x: number[]; y: number[]; confidence: number; slope: number; intercept: number; r: number; stderr: number; t: number; ci_low: number; ci_high: number }[];
};
const tq = JSON.parse(readFileSync(new URL('./fixtures/t_quantiles.json', import.meta.url), 'utf8')) as {
  quantiles: { p: number; df: number; ppf: number; cdf_at_ppf: number }[];
};

const close = (a: number, b: number, rel: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(rel * Math.max(Math.abs(b), 1e-12));

describe('studentTQuantile(p, df)', () => {
  it('studentTQuantile(p, df) equals scipy.stats.t.ppf to 1e-10 relative for df 1…28798', () => {
    for (const q of tq.quantiles) close(studentTQuantile(q.p, q.df), q.ppf, 1e-10);
  });
  it('studentTCdf(t.ppf(p, df), df) returns p to 1e-11 (ln Γ differences at large df limit this)', () => {
    for (const q of tq.quantiles) expect(Math.abs(studentTCdf(q.ppf, q.df) - q.cdf_at_ppf)).toBeLessThan(1e-11);
  });
  it('studentTQuantile(0.975, 1) equals tan(0.475π) (Cauchy; textbook closed form)', () => {
    close(studentTQuantile(0.975, 1), Math.tan(0.475 * Math.PI), 1e-12);
  });
  it('studentTQuantile(p, df) returns NaN outside the domain and ±Infinity at 0 and 1', () => {
    expect(studentTQuantile(1.2, 5)).toBeNaN();
    expect(studentTQuantile(0.5, 0)).toBeNaN();
    expect(studentTQuantile(0, 5)).toBe(-Infinity);
    expect(studentTQuantile(1, 5)).toBe(Infinity);
  });
  it('lnGamma and incompleteBeta meet textbook values (Γ(5) = 24, I_½(2,2) = ½, I_x(1,1) = x)', () => {
    close(lnGamma(5), Math.log(24), 1e-13);
    close(lnGamma(0.5), 0.5 * Math.log(Math.PI), 1e-13);
    close(incompleteBeta(0.5, 2, 2), 0.5, 1e-13);
    close(incompleteBeta(0.3, 1, 1), 0.3, 1e-13);
  });
});

describe('linearRegression(x, y, { confidence })', () => {
  for (const c of reg.cases) {
    it(`linearRegression(${c.name}) equals scipy.stats.linregress slope, intercept, r, stderr and slope ± t.ppf·stderr`, () => {
      const r = linearRegression(c.x, c.y, { confidence: c.confidence });
      expect(r.n).toBe(c.x.length);
      close(r.slope, c.slope, 1e-9);
      close(r.intercept, c.intercept, 1e-9);
      close(r.r, c.r, 1e-9);
      close(r.slope_stderr, c.stderr, 1e-8);
      close(r.t, c.t, 1e-10);
      close(r.slope_ci_low, c.ci_low, 1e-8);
      close(r.slope_ci_high, c.ci_high, 1e-8);
    });
  }
  it('linearRegression(x, y) skips pairs with NaN and gives NaN intervals below 3 pairs', () => {
    const r = linearRegression([0, 1, NaN, 2, 3], [1, 3, 4, 5, NaN]);
    expect(r.n).toBe(3);
    close(r.slope, 2, 1e-12);
    const two = linearRegression([0, 1], [0, 2]);
    expect(two.slope).toBe(2);
    expect(two.slope_ci_low).toBeNaN();
  });
  it('linearRegression(x, y) on an exact line has a zero-width interval', () => {
    const r = linearRegression([0, 1, 2, 3, 4], [10, 9.2, 8.4, 7.6, 6.8]);
    close(r.slope, -0.8, 1e-12);
    expect(r.slope_ci_high - r.slope_ci_low).toBeLessThan(1e-9);
  });
  it('linearRegression(x, y) throws RangeError for unequal lengths', () => {
    expect(() => linearRegression([1, 2], [1])).toThrow(RangeError);
  });
});
