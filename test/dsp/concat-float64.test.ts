import { describe, expect, it } from 'vitest';
import { concatFloat64 } from '../../lib/dsp/concat-float64.js';

describe('concatFloat64(parts)', () => {
  it('joins the arrays in order into a new array (inputs unchanged; empty parts and no parts allowed)', () => {
    const a = Float64Array.of(1, 2), b = Float64Array.of(), c = Float64Array.of(NaN, -0);
    const out = concatFloat64([a, b, c]);
    expect(Array.from(out)).toEqual([1, 2, NaN, -0]);
    expect(Object.is(out[3], -0)).toBe(true);
    expect(out).not.toBe(a);
    expect(Array.from(a)).toEqual([1, 2]);
    expect(concatFloat64([]).length).toBe(0);
  });
});
