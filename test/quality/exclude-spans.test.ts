import { describe, expect, it } from 'vitest';
import { excludeSpans } from '../../lib/quality/exclude-spans.js';

describe('excludeSpans(envelope, rate_hz, spans)', () => {
  it('excludeSpans([1..8], 2 Hz, [[1, 2.5)]) sets NaN at samples whose time k/rate lies in the span', () => {
    const env = Float64Array.from([1, 2, 3, 4, 5, 6, 7, 8]);
    const out = excludeSpans(env, 2, [{ start_s: 1, end_s: 2.5 }]);
    // times 0, 0.5, 1, 1.5, 2, 2.5, … → samples 2, 3, 4 excluded; 2.5 is the exclusive end
    expect(Array.from(out)).toEqual([1, 2, NaN, NaN, NaN, 6, 7, 8]);
    expect(Array.from(env)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]); // input untouched
  });
  it('excludeSpans handles overlapping, unordered and out-of-range spans', () => {
    const env = new Float64Array(10).fill(1);
    const out = excludeSpans(env, 1, [{ start_s: 7, end_s: 20 }, { start_s: -3, end_s: 1 }, { start_s: 2, end_s: 4 }, { start_s: 3, end_s: 5 }]);
    expect(Array.from(out, (v) => (Number.isNaN(v) ? 0 : 1))).toEqual([0, 1, 0, 0, 0, 1, 1, 0, 0, 0]);
  });
  it('excludeSpans(env, rate, spans, pad_s) widens each span on both sides', () => {
    const out = excludeSpans(new Float64Array(10).fill(1), 10, [{ start_s: 0.4, end_s: 0.5 }], 0.1);
    expect(Array.from(out, (v) => (Number.isNaN(v) ? 0 : 1))).toEqual([1, 1, 1, 0, 0, 0, 1, 1, 1, 1]);
  });
  it('excludeSpans with no span (or none covering a sample) returns the envelope itself, unchanged', () => {
    const env = Float64Array.from([1, NaN, 3]);
    expect(excludeSpans(env, 20, [])).toBe(env);
    expect(excludeSpans(env, 20, [{ start_s: 5, end_s: 6 }])).toBe(env);
    expect(Array.from(env)).toEqual([1, NaN, 3]);
  });

  it('excludeSpans with a covering span returns a copy and leaves the input unchanged', () => {
    const env = Float64Array.from([1, 2, 3]);
    const out = excludeSpans(env, 1, [{ start_s: 1, end_s: 2 }]);
    expect(out).not.toBe(env);
    expect(Array.from(out)).toEqual([1, NaN, 3]);
    expect(Array.from(env)).toEqual([1, 2, 3]);
  });
});
