import { describe, expect, it } from 'vitest';
import { segmentMeasures } from '../../lib/exposure/segment-measures.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';

describe('segmentMeasures(envelope, options)', () => {
  it('segmentMeasures(§2.6 worked example) gives P10 = P50 = P90 = 5, 3 gaps, 3.0 gaps/min, 6.33 % rest (METHODS.md §2.6)', () => {
    const env = new Float64Array(600).fill(5);
    let at = 50;
    for (const len of [1, 2, 5, 30]) { env.fill(0.3, at, at + len); at += len + 100; }
    const m = segmentMeasures(env, { rate_hz: 10 });
    expect(m.levels).toEqual({ p10: 5, p50: 5, p90: 5 });
    expect(m.gaps).toBe(3);
    expect(m.gaps_per_min).toBeCloseTo(3, 12);
    expect(m.rest_pct!.toFixed(2)).toBe('6.33');
    expect(m.gap_threshold).toBe(0.5);
    expect(m.sustained_pct).toBe(0); // no active run longer than 240 s in 60 s
  });

  it('segmentMeasures on an 8-h, 20 Hz envelope with designed gaps counts them exactly (known truth)', () => {
    const rate = 20;
    const n = 8 * 3600 * rate; // 576 000 values
    const env = new Float64Array(n);
    const g = new SplitMix64(8);
    for (let i = 0; i < n; i++) env[i] = 4 + Math.abs(g.normal()); // ≥ 4 %MVE: never below 0.5
    // one designed gap of 0.5 s every 60 s, and a 30-min excluded block
    let gaps = 0;
    for (let t = 30; t < 8 * 3600; t += 60) { env.fill(0.1, t * rate, t * rate + 10); gaps++; }
    env.fill(NaN, 3600 * rate, 5400 * rate);
    const excludedGaps = 30; // t = 3630 … 5370 fall in the excluded block
    const m = segmentMeasures(env, { rate_hz: rate });
    expect(m.valid_s).toBeCloseTo(8 * 3600 - 1800, 9);
    expect(m.gaps).toBe(gaps - excludedGaps);
    expect(m.gaps_per_min).toBeCloseTo((gaps - excludedGaps) / ((8 * 3600 - 1800) / 60), 12);
    expect(m.longest_without_gap_s).toBeCloseTo(59.5, 9);
    expect(m.sustained_pct).toBe(0); // activity is broken by a gap every minute
  });
});
