import { describe, expect, it } from 'vitest';
import { restGaps } from '../../lib/exposure/rest-gaps.js';
import { UsageError } from '../../lib/errors.js';

/** METHODS.md §2.6: 60 s at 10 Hz, baseline 5 %MVE, runs of 0.3 %MVE lasting 1, 2, 5, 30 samples. */
function workedExample(): Float64Array {
  const env = new Float64Array(600).fill(5);
  let at = 50;
  for (const len of [1, 2, 5, 30]) { env.fill(0.3, at, at + len); at += len + 100; }
  return env;
}

describe('restGaps(envelope, options)', () => {
  it('restGaps(§2.6 example) finds 3 gaps = 3.0 gaps/min and 6.33 % rest (METHODS.md §2.6, COMPUTED)', () => {
    const env = workedExample();
    const before = Float64Array.from(env);
    const r = restGaps(env, { rate_hz: 10, threshold: 0.5, min_gap_s: 0.2 });
    expect(env).toEqual(before); // input not changed
    expect(r.valid_s).toBeCloseTo(60, 12);
    expect(r.gaps).toBe(3);
    expect(r.gaps_per_min).toBeCloseTo(3.0, 12);
    expect(r.rest_pct).toBeCloseTo((100 * 3.8) / 60, 10); // 6.33 %
    expect(r.rest_pct!.toFixed(2)).toBe('6.33');
    expect(r.gap_s).toBeCloseTo(3.7, 12);
  });

  it("restGaps(§2.6 example, rest_counts 'gaps-only') gives 6.17 % rest (METHODS.md §2.6)", () => {
    const r = restGaps(workedExample(), { rate_hz: 10, threshold: 0.5, min_gap_s: 0.2, rest_counts: 'gaps-only' });
    expect(r.rest_pct!.toFixed(2)).toBe('6.17');
  });

  it('restGaps counts a run of exactly min_gap_s as a gap (inclusive rule; the exclusive rule would give 2 gaps/min, METHODS.md §2.6)', () => {
    const r = restGaps(workedExample(), { rate_hz: 10, threshold: 0.5, min_gap_s: 0.2 });
    expect(r.gaps).toBe(3);
    // A threshold just above 0.2 s excludes the 2-sample run: the exclusive-rule result.
    expect(restGaps(workedExample(), { rate_hz: 10, threshold: 0.5, min_gap_s: 0.2000001 }).gaps_per_min).toBeCloseTo(2, 12);
  });

  it('restGaps tolerates float error in samples / rate_hz (duration ≥ min − 1e-9)', () => {
    // 0.3 / 0.1 = 2.9999999999999996 samples of "min"; 3 samples at 10 Hz = 0.3 s must be a gap.
    const env = new Float64Array(100).fill(5);
    env.fill(0, 10, 13);
    expect(restGaps(env, { rate_hz: 10, threshold: 0.5, min_gap_s: 0.1 * 3 }).gaps).toBe(1);
  });

  it('restGaps: a chunk of NaN reduces valid_s exactly and breaks runs', () => {
    const env = new Float64Array(workedExample());
    env.fill(NaN, 300, 420); // 12 s excluded, splitting nothing else
    const r = restGaps(env, { rate_hz: 10, threshold: 0.5, min_gap_s: 0.2 });
    expect(r.valid_s).toBeCloseTo(48, 12);
    expect(r.excluded_s).toBeCloseTo(12, 12);
    // A 4-sample run cut in two 2-sample halves by one NaN sample: two gaps of 0.2 s, not one of 0.4 s.
    const cut = new Float64Array(50).fill(5);
    cut.fill(0, 10, 15);
    cut[12] = NaN;
    const c = restGaps(cut, { rate_hz: 10, threshold: 0.5, min_gap_s: 0.2 });
    expect(c.gaps).toBe(2);
    expect(c.valid_s).toBeCloseTo(4.9, 12);
    expect(restGaps(cut, { rate_hz: 10, threshold: 0.5, min_gap_s: 0.3 }).gaps).toBe(0);
  });

  it('restGaps: designed gaps are counted exactly, with max_gap_s as an optional upper bound', () => {
    const rate = 20;
    const env = new Float64Array(rate * 600).fill(8); // 10 min
    const lengths = [0.25, 0.5, 1, 2, 3, 10]; // s
    let at = 100;
    for (const s of lengths) { env.fill(0.1, at, at + s * rate); at += s * rate + 400; }
    const all = restGaps(env, { rate_hz: rate });
    expect(all.gaps).toBe(6);
    expect(all.gaps_per_min).toBeCloseTo(0.6, 12);
    const bounded = restGaps(env, { rate_hz: rate, max_gap_s: 2 });
    expect(bounded.gaps).toBe(4); // 0.25, 0.5, 1 and 2 s (inclusive)
    expect(bounded.rest_s).toBeCloseTo(all.rest_s, 12); // the bound limits gap counting, not rest
  });

  it('restGaps: longest_without_gap_s spans start→first gap, between gaps and last gap→end; NaN ends a stretch', () => {
    const env = new Float64Array(1000).fill(5); // 10 Hz, 100 s
    env.fill(0, 200, 210); // gap at 20–21 s
    env.fill(0, 700, 705); // gap at 70–70.5 s
    let r = restGaps(env, { rate_hz: 10 });
    expect(r.longest_without_gap_s).toBeCloseTo(49, 12); // 21 → 70 s
    env.fill(NaN, 400, 401); // splits the 49 s stretch into 21–40 s (19 s) and 40.1–70 s (29.9 s)
    r = restGaps(env, { rate_hz: 10 });
    expect(r.longest_without_gap_s).toBeCloseTo(29.9, 12); // longer than 70.5 → 100 s (29.5 s)
    // short runs (not gaps) do not end a stretch
    const e2 = new Float64Array(100).fill(5);
    e2[50] = 0;
    expect(restGaps(e2, { rate_hz: 10 }).longest_without_gap_s).toBeCloseTo(10, 12);
  });

  it('restGaps: runs touching the slice ends are truncated at the boundary', () => {
    const env = new Float64Array(100).fill(5);
    env.fill(0, 0, 3); // 0.3 s at the start
    env.fill(0, 99, 100); // 0.1 s at the end
    const r = restGaps(env, { rate_hz: 10, min_gap_s: 0.2 });
    expect(r.gaps).toBe(1);
    expect(restGaps(env.subarray(1), { rate_hz: 10, min_gap_s: 0.2 }).gaps).toBe(1); // 0.2 s left
    expect(restGaps(env.subarray(2), { rate_hz: 10, min_gap_s: 0.2 }).gaps).toBe(0); // 0.1 s left
  });

  it('restGaps(all NaN) gives valid_s 0 and null rates; a bad rate throws UsageError', () => {
    const r = restGaps(new Float64Array(5).fill(NaN), { rate_hz: 10 });
    expect(r.valid_s).toBe(0);
    expect(r.gaps_per_min).toBeNull();
    expect(r.rest_pct).toBeNull();
    expect(r.longest_without_gap_s).toBeNull();
    expect(() => restGaps(new Float64Array(5), { rate_hz: 0 })).toThrow(UsageError);
    expect(() => restGaps(new Float64Array(5), { rate_hz: 10, min_gap_s: -1 })).toThrow(/min_gap_s/);
  });

  it('restGaps gives the same rates at 10 Hz and 20 Hz for the same signal (sampling-rate invariance)', () => {
    const mk = (rate: number) => {
      const env = new Float64Array(rate * 120).fill(4);
      for (const [t0, d] of [[5, 0.5], [30, 2], [61, 0.2], [90, 7]] as const) env.fill(0.2, t0 * rate, (t0 + d) * rate);
      return restGaps(env, { rate_hz: rate });
    };
    const a = mk(10);
    const b = mk(20);
    expect(a.gaps).toBe(b.gaps);
    expect(a.rest_pct).toBeCloseTo(b.rest_pct!, 12);
    expect(a.longest_without_gap_s).toBeCloseTo(b.longest_without_gap_s!, 12);
  });
});
