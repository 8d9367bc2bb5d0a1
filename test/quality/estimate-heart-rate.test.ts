import { describe, expect, it } from 'vitest';
import { estimateHeartRate } from '../../lib/quality/estimate-heart-rate.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';

/** Binned rectified signal at 100 Hz: |noise| level 1 with a 3-bin spike every `period_s`. */
function spikes(period_s: number, n: number, seed: number, level = (m: number) => 1): Float64Array {
  const rng = new SplitMix64(seed);
  const b = new Float64Array(n);
  for (let m = 0; m < n; m++) b[m] = level(m) * (1 + 0.25 * rng.normal());
  for (let t = 0.3; t * 100 < n - 3; t += period_s) {
    const m = Math.round(t * 100);
    b[m] += 3 * level(m); b[m + 1] += 2 * level(m); b[m - 1] += 1 * level(m);
  }
  return b;
}
const opts = { bin_rate_hz: 100, bpm: [40, 180] as [number, number], baseline_s: 0.5 };

describe('estimateHeartRate(bins, n, options)', () => {
  for (const bpm of [42, 60, 75, 100, 150, 178]) {
    it(`spikes every 60/${bpm} s → rate within 2 %, r well above 0.3`, () => {
      const r = estimateHeartRate(spikes(60 / bpm, 1000, bpm), 1000, opts);
      expect(Math.abs(r.rate_bpm / bpm - 1)).toBeLessThan(0.02);
      expect(r.r).toBeGreaterThan(0.5);
    });
  }
  it('spikes over a level that changes 100-fold (rest/work steps) are still found', () => {
    const level = (m: number) => (Math.floor(m / 230) % 2 === 0 ? 1 : 100);
    const r = estimateHeartRate(spikes(0.8, 1000, 7, level), 1000, opts);
    expect(Math.abs(r.rate_bpm / 75 - 1)).toBeLessThan(0.02);
  });
  it('noise with level steps and no spikes gives r below 0.3', () => {
    const rng = new SplitMix64(5);
    const b = new Float64Array(1000);
    for (let m = 0; m < 1000; m++) b[m] = (Math.floor(m / 170) % 2 === 0 ? 2 : 60) * Math.abs(1 + 0.3 * rng.normal());
    expect(estimateHeartRate(b, 1000, opts).r).toBeLessThan(0.3);
  });
  it('too few bins for the longest period → NaN', () => {
    const r = estimateHeartRate(new Float64Array(200).fill(1), 200, opts);
    expect(r.rate_bpm).toBeNaN();
  });
});
