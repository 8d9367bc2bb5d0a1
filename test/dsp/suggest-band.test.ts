import { describe, expect, it } from 'vitest';
import { butter } from '../../lib/dsp/butter.js';
import { sosfilt } from '../../lib/dsp/sosfilt.js';
import { suggestBand } from '../../lib/dsp/suggest-band.js';
import { welch } from '../../lib/dsp/welch.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';

// Known-truth simulation: EMG-like noise in a known band, plus a white noise floor, hum and drift.
function simulate(fs: number, band: [number, number], opts: { hum?: number; humHz?: number; drift?: number; seed: number }): Float64Array {
  const n = 60 * fs;
  const rng = new SplitMix64(opts.seed);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) w[i] = rng.normal();
  const emg = sosfilt(butter(4, band, { btype: 'bandpass', fs }), w);
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = i / fs;
    x[i] = 50 * emg[i] + 2 * rng.normal() + (opts.hum ?? 0) * Math.sin(2 * Math.PI * (opts.humHz ?? 50) * t + 0.3)
      + (opts.drift ?? 0) * Math.sin(2 * Math.PI * 1.3 * t) + 100;
  }
  return x;
}

describe('suggestBand(f, psd, options)', () => {
  it('finds a known 40–250 Hz band within 10 % and detects a 50 Hz hum (fs 1000)', () => {
    const fs = 1000;
    const w = welch(simulate(fs, [40, 250], { hum: 30, seed: 1 }), { fs, nperseg: 1024 });
    const s = suggestBand(w.f_hz, w.psd);
    expect(s.band_hz[0]).toBeGreaterThan(36);
    expect(s.band_hz[0]).toBeLessThan(44);
    expect(s.band_hz[1]).toBeGreaterThan(225);
    expect(s.band_hz[1]).toBeLessThan(275);
    expect(s.notch_hz).toBe(50);
    expect(s.mains_ratio).toBeGreaterThan(5);
    expect(s.reasons.join(' ')).toContain('Mains hum at 50 Hz');
  });
  it('finds a 60 Hz hum and a 25–400 Hz band at 2 kHz; no notch when there is no hum', () => {
    const fs = 2000;
    const w = welch(simulate(fs, [25, 400], { hum: 20, humHz: 60, seed: 2 }), { fs, nperseg: 2048 });
    const s = suggestBand(w.f_hz, w.psd);
    expect(s.notch_hz).toBe(60);
    expect(Math.abs(s.band_hz[0] - 25)).toBeLessThan(2.5);
    expect(Math.abs(s.band_hz[1] - 400)).toBeLessThan(40);
    const quiet = welch(simulate(fs, [25, 400], { seed: 3 }), { fs, nperseg: 2048 });
    const q = suggestBand(quiet.f_hz, quiet.psd);
    expect(q.notch_hz).toBeNull();
    expect(q.mains_ratio).toBeLessThan(2);
    expect(q.reasons[0]).toContain('No mains hum');
  });
  it('reports a large low-frequency share and keeps the low cut-off at 20 Hz or above', () => {
    const fs = 1000;
    const w = welch(simulate(fs, [15, 300], { drift: 400, seed: 4 }), { fs, nperseg: 1024 });
    const s = suggestBand(w.f_hz, w.psd);
    expect(s.low_frequency_ratio).toBeGreaterThan(0.1);
    expect(s.band_hz[0]).toBeGreaterThanOrEqual(20);
    expect(s.reasons.some((r) => r.includes('below 20 Hz') && r.includes('movement artifact'))).toBe(true);
  });
  it('uses a rest PSD as the noise floor when given', () => {
    const fs = 1000;
    const w = welch(simulate(fs, [40, 250], { seed: 5 }), { fs, nperseg: 1024 });
    const rng = new SplitMix64(6);
    const rest = welch(Float64Array.from({ length: 60 * fs }, () => 2 * rng.normal()), { fs, nperseg: 1024 });
    const s = suggestBand(w.f_hz, w.psd, { restPsd: rest.psd });
    expect(Number.isNaN(s.noise_floor)).toBe(true);
    expect(Math.abs(s.band_hz[0] - 40)).toBeLessThan(4);
    expect(Math.abs(s.band_hz[1] - 250)).toBeLessThan(25);
    expect(s.reasons.join(' ')).toContain('rest-recording spectrum');
  });
});
