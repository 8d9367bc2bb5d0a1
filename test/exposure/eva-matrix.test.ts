import { describe, expect, it } from 'vitest';
import { evaMatrix } from '../../lib/exposure/eva-matrix.js';
import { UsageError } from '../../lib/errors.js';

describe('evaMatrix(envelope, options)', () => {
  it('evaMatrix(10 s worked example) gives cells 30 / 15 / 5 / 50 % (METHODS.md §5, COMPUTED by hand)', () => {
    const rate = 10;
    const env = new Float64Array(100);
    env.fill(2, 0, 30); env.fill(12, 30, 35); env.fill(2, 35, 50); env.fill(0.3, 50, 100);
    const r = evaMatrix(env, { rate_hz: rate, amplitude_edges: [0, 1, 5, 10, 20, 30], duration_edges_s: [0, 1, 3, 7, 15, 31, 63] });
    const cell = (a: number, d: number) => r.percent_time[a]![d]!;
    expect(cell(1, 2)).toBeCloseTo(30, 12); // [1,5) × [3,7) s
    expect(cell(1, 1)).toBeCloseTo(15, 12); // [1,5) × [1,3) s
    expect(cell(3, 0)).toBeCloseTo(5, 12); // [10,20) × [0,1) s
    expect(cell(0, 2)).toBeCloseTo(50, 12); // [0,1) × [3,7) s
    const total = r.percent_time.flat().reduce((s, v) => s + v, 0);
    expect(total).toBeCloseTo(100, 12);
    expect(r.percent_time.flat().filter((v) => v > 0).length).toBe(4);
  });

  it('evaMatrix uses half-open classes: a value equal to an edge goes into the upper class', () => {
    const env = new Float64Array(20).fill(5); // exactly on the 5 %MVE edge
    const r = evaMatrix(env, { rate_hz: 10 });
    expect(r.percent_time[2]![1]).toBeCloseTo(100, 12); // [5,10) %MVE × [1,3) s (one 2 s period)
  });

  it('evaMatrix: NaN breaks periods and is not counted', () => {
    const env = new Float64Array(40).fill(2);
    env[20] = NaN; // periods of 20 and 19 samples (2.0 s and 1.9 s)
    const r = evaMatrix(env, { rate_hz: 10 });
    expect(r.valid_s).toBeCloseTo(3.9, 12);
    expect(r.periods[1]![1]).toBe(2); // two periods in [1,3) s instead of one 4 s period
    expect(r.percent_time[1]![1]).toBeCloseTo(100, 12);
  });

  it('evaMatrix rejects edges that are not strictly increasing (UsageError)', () => {
    expect(() => evaMatrix(new Float64Array(3), { rate_hz: 10, amplitude_edges: [0, 5, 5] })).toThrow(UsageError);
    expect(() => evaMatrix(new Float64Array(3), { rate_hz: 10, duration_edges_s: [] })).toThrow(/duration_edges_s/);
  });
});
