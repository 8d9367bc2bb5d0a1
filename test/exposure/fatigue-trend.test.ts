import { describe, expect, it } from 'vitest';
import { fatigueTrend, type EpochValues } from '../../lib/exposure/fatigue-trend.js';
import { jasaCategory } from '../../lib/exposure/jasa.js';
import { Xoshiro128 } from '../../lib/stats/xoshiro128.js';

/** 1-s epochs over `minutes`, amplitude a0 + a1·t and MNF f0 + f1·t (t in min), plus seeded Gaussian noise. */
function series(minutes: number, a0: number, a1: number, f0: number, f1: number, sdA = 0, sdF = 0, seed = 1): EpochValues {
  const n = minutes * 60, rng = new Xoshiro128(seed);
  const t_s = new Float64Array(n), amplitude = new Float64Array(n), mnf_hz = new Float64Array(n), mdf_hz = new Float64Array(n);
  const active = new Uint8Array(n).fill(1);
  for (let i = 0; i < n; i++) {
    t_s[i] = i + 0.5;
    const m = t_s[i]! / 60;
    amplitude[i] = a0 + a1 * m + sdA * rng.normal();
    mnf_hz[i] = f0 + f1 * m + sdF * rng.normal();
    mdf_hz[i] = mnf_hz[i]! - 3;
  }
  return { t_s, amplitude, mnf_hz, mdf_hz, active };
}

describe('jasaCategory(amplitude, spectrum)', () => {
  it('jasaCategory maps the four sign pairs to the METHODS.md §6 quadrants (Luttmann et al. 2000; mapping from memory)', () => {
    const up = { low: 0.1, high: 0.3 }, down = { low: -0.3, high: -0.1 };
    expect(jasaCategory(up, down)).toBe('fatigue');
    expect(jasaCategory(down, up)).toBe('recovery');
    expect(jasaCategory(up, up)).toBe('force-increase');
    expect(jasaCategory(down, down)).toBe('force-decrease');
  });
  it('jasaCategory gives no-clear-change when either interval includes 0, insufficient-data for NaN', () => {
    expect(jasaCategory({ low: -0.1, high: 0.3 }, { low: -0.3, high: -0.1 })).toBe('no-clear-change');
    expect(jasaCategory({ low: 0.1, high: 0.3 }, { low: -0.3, high: 0 })).toBe('no-clear-change');
    expect(jasaCategory({ low: NaN, high: NaN }, { low: -0.3, high: -0.1 })).toBe('insufficient-data');
  });
});

describe('fatigueTrend(epochs, start_s, end_s, { min_epochs })', () => {
  it('fatigueTrend(amplitude 5 + 0.5·t %MVE, MNF 80 − 0.8·t Hz, 10 min) → slopes +0.5 %MVE/min, −0.8 Hz/min, fatigue (METHODS.md §6 check, COMPUTED)', () => {
    const tr = fatigueTrend(series(10, 5, 0.5, 80, -0.8), 0, 600);
    expect(tr.epochs).toBe(600);
    expect(tr.amplitude_slope_per_min).toBeCloseTo(0.5, 10);
    expect(tr.mnf_slope_hz_per_min).toBeCloseTo(-0.8, 10);
    expect(tr.mnf_mean_hz).toBeCloseTo(76, 10);
    expect(tr.category).toBe('fatigue');
  });

  it('fatigueTrend(worked check plus noise: SD 1 %MVE, SD 8 Hz per epoch) keeps fatigue with intervals covering +0.5 and −0.8', () => {
    for (const seed of [1, 2, 3]) {
      const tr = fatigueTrend(series(10, 5, 0.5, 80, -0.8, 1, 8, seed), 0, 600);
      expect(tr.category).toBe('fatigue');
      expect(tr.amplitude_ci_low).toBeLessThan(tr.amplitude_slope_per_min);
      expect(Math.abs(tr.amplitude_slope_per_min - 0.5)).toBeLessThan(0.1);
      expect(Math.abs(tr.mnf_slope_hz_per_min + 0.8)).toBeLessThan(0.5);
    }
  });

  it('fatigueTrend gives force-increase, force-decrease and recovery for the other sign pairs', () => {
    expect(fatigueTrend(series(10, 5, 0.5, 80, 0.8, 1, 8), 0, 600).category).toBe('force-increase');
    expect(fatigueTrend(series(10, 10, -0.5, 80, -0.8, 1, 8), 0, 600).category).toBe('force-decrease');
    expect(fatigueTrend(series(10, 10, -0.5, 80, 0.8, 1, 8), 0, 600).category).toBe('recovery');
  });

  it('fatigueTrend on stationary epoch series: false-positive rate of a JASA category ≤ 1 % over 1000 blocks (expected 0.05² = 0.25 % for independent trends)', () => {
    let fp = 0, ampOnly = 0, mnfOnly = 0;
    const blocks = 1000;
    for (let s = 0; s < blocks; s++) {
      const tr = fatigueTrend(series(10, 10, 0, 100, 0, 2, 10, 1000 + s), 0, 600);
      if (tr.category !== 'no-clear-change') fp++;
      if (tr.amplitude_ci_low > 0 || tr.amplitude_ci_high < 0) ampOnly++;
      if (tr.mnf_ci_low > 0 || tr.mnf_ci_high < 0) mnfOnly++;
    }
    // Each single interval excludes 0 in about 5 % of blocks (the 95 % level).
    expect(ampOnly / blocks).toBeGreaterThan(0.02);
    expect(ampOnly / blocks).toBeLessThan(0.08);
    expect(mnfOnly / blocks).toBeGreaterThan(0.02);
    expect(mnfOnly / blocks).toBeLessThan(0.08);
    expect(fp / blocks).toBeLessThanOrEqual(0.01);
  });

  it('fatigueTrend uses only active epochs centred in [start_s, end_s) and says insufficient-data below min_epochs', () => {
    const v = series(10, 5, 0.5, 80, -0.8);
    const act = v.active as Uint8Array;
    for (let i = 0; i < act.length; i++) if (i % 2 === 1) act[i] = 0;
    const tr = fatigueTrend(v, 60, 180);
    expect(tr.epochs_total).toBe(120);
    expect(tr.epochs).toBe(60);
    expect(tr.category).toBe('fatigue');
    expect(fatigueTrend(v, 60, 180, { min_epochs: 61 }).category).toBe('insufficient-data');
    expect(fatigueTrend(v, 700, 800).epochs).toBe(0);
    expect(fatigueTrend(v, 700, 800).category).toBe('insufficient-data');
  });
});
