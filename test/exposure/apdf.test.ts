import { describe, expect, it } from 'vitest';
import { apdf, apdfCurve } from '../../lib/exposure/apdf.js';

describe('apdf(envelope, { percentiles })', () => {
  it('apdf(constant c) gives p10 = p50 = p90 = c (METHODS.md §1.5)', () => {
    const env = new Float64Array(5000).fill(7.5);
    const r = apdf(env);
    expect(r.levels).toEqual([7.5, 7.5, 7.5]);
    expect(r.byKey).toEqual({ p10: 7.5, p50: 7.5, p90: 7.5 });
  });

  it('apdf(uniform ramp 0→100, 10^5 samples) gives 10 / 50 / 90 (METHODS.md §1.5)', () => {
    const n = 100_001;
    const env = new Float64Array(n);
    for (let i = 0; i < n; i++) env[i] = (100 * i) / (n - 1);
    const r = apdf(env);
    expect(r.levels[0]).toBeCloseTo(10, 9);
    expect(r.levels[1]).toBeCloseTo(50, 9);
    expect(r.levels[2]).toBeCloseTo(90, 9);
  });

  it('apdf(worked example §2.6) gives P10 = P50 = P90 = 5.0 %MVE (METHODS.md §2.6)', () => {
    const env = new Float64Array(600).fill(5);
    let at = 20;
    for (const len of [1, 2, 5, 30]) { env.fill(0.3, at, at + len); at += len + 100; }
    expect(apdf(env).levels).toEqual([5, 5, 5]);
  });

  it('apdf(all NaN) gives null levels and valid_n 0', () => {
    const r = apdf(new Float64Array(10).fill(NaN), { percentiles: [5, 95] });
    expect(r.levels).toEqual([null, null]);
    expect(r.byKey).toEqual({ p5: null, p95: null });
    expect(r.valid_n).toBe(0);
  });
});

describe('apdfCurve(envelope)', () => {
  it('apdfCurve(ramp 0→100) has 101 points equal to the percent (rel 1e-12)', () => {
    const env = new Float64Array(1001);
    for (let i = 0; i < env.length; i++) env[i] = i / 10;
    const c = apdfCurve(env);
    expect(c.length).toBe(101);
    c.forEach((v, p) => expect(Math.abs(v - p)).toBeLessThan(1e-12 * 100));
  });

  it('apdfCurve is non-decreasing and empty for an all-NaN envelope', () => {
    const env = Float64Array.from({ length: 500 }, (_, i) => Math.abs(Math.sin(i * 0.37)) * 40);
    const c = apdfCurve(env);
    for (let p = 1; p <= 100; p++) expect(c[p]!).toBeGreaterThanOrEqual(c[p - 1]!);
    expect(apdfCurve(Float64Array.of(NaN))).toEqual([]);
  });
});
