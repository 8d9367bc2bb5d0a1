import { describe, expect, it } from 'vitest';
import { normalizeEnvelope } from '../../lib/exposure/normalize-envelope.js';
import { rveOverMve, thresholdToMve, thresholdToRve } from '../../lib/exposure/threshold-to-rve.js';
import { maxValue } from '../../lib/exposure/max-value.js';
import { mean as meanValue } from '../../lib/stats/mean.js';
import { UsageError } from '../../lib/errors.js';

describe('normalizeEnvelope(env, referenceUv) and threshold conversion', () => {
  it('20 µV = 5 %MVE (MVE 400 µV) = 33.3 %RVE (RVE 60 µV); k = 0.15 (METHODS.md §3.5, COMPUTED)', () => {
    const env = Float64Array.of(20, NaN, 400);
    const mve = normalizeEnvelope(env, 400);
    const rve = normalizeEnvelope(env, 60);
    expect(mve[0]).toBeCloseTo(5, 12);
    expect(mve[1]).toBeNaN();
    expect(mve[2]).toBeCloseTo(100, 12);
    expect(rve[0]).toBeCloseTo(33.333333333, 8);
    const k = rveOverMve(60, 400);
    expect(k).toBeCloseTo(0.15, 15);
    expect(thresholdToMve(rve[0]!, k)).toBeCloseTo(5, 12);
    expect(thresholdToRve(5, k)).toBeCloseTo(rve[0]!, 12);
  });

  it('thresholdToRve(0.5, 0.15) = 3.33 %RVE (METHODS.md §2.5, COMPUTED)', () => {
    expect(thresholdToRve(0.5, 0.15).toFixed(2)).toBe('3.33');
    expect(() => thresholdToRve(0.5, 0)).toThrow(UsageError);
  });

  it('normalizeEnvelope rejects a non-positive reference (UsageError naming the value)', () => {
    expect(() => normalizeEnvelope(Float64Array.of(1), 0)).toThrow(/reference amplitude .* got 0/);
    expect(() => normalizeEnvelope(Float64Array.of(1), NaN)).toThrow(UsageError);
  });

  it('maxValue / meanValue ignore NaN and return NaN for no valid value', () => {
    expect(maxValue(Float64Array.of(1, NaN, 3, 2))).toBe(3);
    expect(meanValue(Float64Array.of(1, NaN, 3))).toBe(2);
    expect(maxValue(Float64Array.of(NaN))).toBeNaN();
    expect(meanValue([])).toBeNaN();
  });
});
