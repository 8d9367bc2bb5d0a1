import { describe, expect, it } from 'vitest';
import { sustainedActivity } from '../../lib/exposure/sustained-activity.js';
import { DEFAULTS } from '../../lib/exposure/defaults.js';

describe('sustainedActivity(envelope, options)', () => {
  it('sustainedActivity counts only runs ≥ threshold lasting longer than 240 s (Hanvold 2013 definition, METHODS.md §2.3)', () => {
    const rate = 2;
    const env = new Float64Array(rate * 3600).fill(0.2); // 1 h below threshold
    env.fill(3, 0, 300 * rate); // 300 s active → sustained
    env.fill(3, 1000 * rate, 1240 * rate); // exactly 240 s → not "longer than"
    env.fill(0.5, 2000 * rate, 2500 * rate); // 500 s at exactly the threshold → active (≥)
    const r = sustainedActivity(env, { rate_hz: rate });
    expect(DEFAULTS.sustained_min_s).toBe(240);
    expect(r.sustained_runs).toBe(2);
    expect(r.sustained_s).toBeCloseTo(800, 12);
    expect(r.sustained_pct).toBeCloseTo((100 * 800) / 3600, 12);
    expect(r.longest_active_s).toBeCloseTo(500, 12);
  });

  it('sustainedActivity: NaN breaks a run and is not valid time', () => {
    const rate = 1;
    const env = new Float64Array(1000).fill(2);
    env[400] = NaN; // 400 s + 599 s runs
    const r = sustainedActivity(env, { rate_hz: rate, threshold: 0.5, min_duration_s: 450 });
    expect(r.valid_s).toBe(999);
    expect(r.sustained_runs).toBe(1);
    expect(r.sustained_s).toBe(599);
  });

  it('sustainedActivity(…, interval_edges_s) counts active runs per [lo, hi) interval, last open', () => {
    const rate = 10;
    const env = new Float64Array(rate * 200).fill(0);
    let at = 5;
    for (const d of [0.5, 2, 2, 5, 30, 61]) { env.fill(1, at * rate, (at + d) * rate); at += d + 1; }
    const r = sustainedActivity(env, { rate_hz: rate, min_duration_s: 60, interval_edges_s: [1, 5, 60] });
    expect(r.intervals!.map((x) => x.count)).toEqual([2, 2, 1]); // 0.5 s run is below the first edge
    expect(r.intervals![1]!.time_s).toBeCloseTo(35, 12);
    expect(r.intervals![2]!.hi_s).toBeNull();
    expect(r.sustained_runs).toBe(1);
  });
});
