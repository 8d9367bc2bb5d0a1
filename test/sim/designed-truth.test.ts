import { describe, expect, it } from 'vitest';
import { summarizeDesigned } from '../../lib/sim/designed-truth.js';
import { designEnvelope } from '../../lib/sim/design-envelope.js';
import { SIM_DEFAULTS } from '../../lib/sim/simulation-spec.js';
import { Xoshiro128 } from '../../lib/stats/xoshiro128.js';

const settings = { percentiles: [10, 50, 90], gap_threshold_pct: 0.5, gap_min_s: 0.2 };

/** Independent percentile for the test: R-7 written with 1-based positions (Hyndman & Fan 1996). */
function r7(values: number[], p: number): number {
  const v = [...values].sort((a, b) => a - b);
  const pos = 1 + (v.length - 1) * (p / 100);
  const j = Math.floor(pos);
  return j >= v.length ? v[v.length - 1] : v[j - 1] + (pos - j) * (v[j] - v[j - 1]);
}

describe('summarizeDesigned(values, start, end, rate_hz, settings)', () => {
  it('reproduces the METHODS.md §2.6 worked example (3 gaps/min, 6.33 % rest, P10 = P50 = P90 = 5 %MVE)', () => {
    // expected: shared/METHODS.md §2.6 (COMPUTED worked example): 10 Hz, 60 s at 5 %MVE, runs of
    // 1, 2, 5, 30 samples at 0.3 %MVE; threshold 0.5, D_min 0.2 s inclusive
    const rate = 10;
    const v = new Float64Array(600).fill(5);
    let k = 20;
    for (const len of [1, 2, 5, 30]) { v.fill(0.3, k, k + len); k += len + 100; }
    const s = summarizeDesigned(v, 0, 600, rate, settings);
    expect(s.gaps).toBe(3);
    expect(s.gaps_per_min).toBeCloseTo(3.0, 12);
    expect(s.rest_pct).toBeCloseTo((100 * 3.8) / 60, 10);
    expect(s.percentiles_pct).toEqual({ p10: 5, p50: 5, p90: 5 });
  });

  it('percentiles of a designed envelope equal an independent R-7 computation', () => {
    const design = { ...SIM_DEFAULTS.task, level_pct: 15, spread_pct: 6, gaps_per_min: 4 };
    const env = designEnvelope([{ label: 'x', start_s: 0, end_s: 300, design }], 300, 20, new Xoshiro128(77));
    const s = summarizeDesigned(env.values, 200, 4000, 20, settings);
    const part = Array.from(env.values.subarray(200, 4000));
    for (const p of [10, 50, 90]) expect(s.percentiles_pct[`p${p}`]).toBeCloseTo(r7(part, p), 12);
  });

  it('counts exactly the designed gaps of a designed envelope and their time as rest', () => {
    const design = { ...SIM_DEFAULTS.task, level_pct: 10, spread_pct: 3, gaps_per_min: 5 };
    const env = designEnvelope([{ label: 'x', start_s: 0, end_s: 240, design }], 240, 20, new Xoshiro128(8));
    const s = summarizeDesigned(env.values, 0, 4800, 20, settings);
    expect(s.gaps).toBe(env.gaps[0].length);
    const gapTime = env.gaps[0].reduce((a, g) => a + g.end_s - g.start_s, 0);
    expect(s.rest_pct).toBeCloseTo((100 * gapTime) / 240, 9);
  });

  it('longest time without a gap is the longest stretch between gaps or edges', () => {
    const v = new Float64Array(200).fill(5);
    v.fill(0, 50, 60);  // gap 1 s at 10 Hz
    v.fill(0, 150, 155); // gap 0.5 s
    const s = summarizeDesigned(v, 0, 200, 10, settings);
    expect(s.longest_without_gap_s).toBeCloseTo(9.0, 12); // samples 60..149
  });
});
