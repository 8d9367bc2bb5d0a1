import { describe, expect, it } from 'vitest';
import { BandFilter, bandFilterSos } from '../../lib/dsp/band-filter.js';
import { butter } from '../../lib/dsp/butter.js';
import { DEFAULTS, EnvelopePipeline, envelopeOf } from '../../lib/dsp/envelope-pipeline.js';
import { envelopeSampleCount, rmsEnvelope } from '../../lib/dsp/rms-envelope.js';
import { sosfiltfilt } from '../../lib/dsp/sosfiltfilt.js';
import { sosfreqz } from '../../lib/dsp/sosfreqz.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';
import { maxAbs, maxAbsDiff, randomSplits } from './load-fixture.js';

function noise(n: number, seed: number, sigma = 1, dc = 0): Float64Array {
  const rng = new SplitMix64(seed);
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = dc + sigma * rng.normal();
  return x;
}

describe('EnvelopePipeline({ fs, band_hz, order, mains_hz, rms_window_s, rate_hz })', () => {
  const fs = 2000;
  const x = noise(3 * 60 * fs, 1, 40, 500);
  for (let i = 0; i < x.length; i++) x[i] += 30 * Math.sin(2 * Math.PI * 50 * i / fs) * (1 + (i % 200000 > 100000 ? 3 : 0));
  const opts = { fs, mains_hz: 50 as const, rms_window_s: 0.25, rate_hz: 10 };

  it('equals rmsEnvelope(sosfiltfilt(notch+band-pass, x)) within 1e-9 of full scale', () => {
    const { sos } = bandFilterSos(opts);
    const ref = rmsEnvelope(sosfiltfilt(sos, x), { fs, window_s: 0.25, rate_hz: 10 });
    const env = envelopeOf(x, opts);
    expect(env.length).toBe(envelopeSampleCount(x.length, fs, 10));
    expect(maxAbsDiff(env, ref)).toBeLessThanOrEqual(1e-9 * maxAbs(x));
  });
  it('push over random chunk splits gives exactly the batch envelope', () => {
    const whole = Array.from(envelopeOf(x, opts));
    for (const seed of [21, 22]) {
      const p = new EnvelopePipeline(opts);
      const got: number[] = [];
      let at = 0;
      for (const len of randomSplits(x.length, seed, 30000)) { got.push(...p.push(x.subarray(at, at + len))); at += len; }
      got.push(...p.flush());
      expect(got).toEqual(whole);
    }
  });
  it('white Gaussian noise σ gives the RMS predicted by the filter (σ²·2/fs·∫|H|⁴ df, zero-phase gain |H|²)', () => {
    // known truth: Parseval for white noise through the forward–backward filter
    const sigma = 10;
    const y = envelopeOf(noise(60 * fs, 5, sigma, 1000), { fs, rms_window_s: 60, rate_hz: 1 / 60 });
    const sos = butter(DEFAULTS.order, DEFAULTS.band_hz, { btype: 'bandpass', fs });
    const freqs = Array.from({ length: 20000 }, (_, i) => ((i + 0.5) / 20000) * (fs / 2));
    const h = sosfreqz(sos, freqs, fs);
    let int = 0;
    for (const v of h) int += v ** 4 / 20000;
    expect(y[0]).toBeGreaterThan(0.98 * sigma * Math.sqrt(int));
    expect(y[0]).toBeLessThan(1.02 * sigma * Math.sqrt(int));
  });
  it('NaN input marks the envelope NaN where its window touches the NaN run, finite elsewhere', () => {
    const z = noise(20 * fs, 3, 50);
    for (let i = 10 * fs; i < 10 * fs + 300; i++) z[i] = NaN;
    const env = envelopeOf(z, { fs, rms_window_s: 0.1, rate_hz: 20 });
    env.forEach((v, k) => {
      const c = k * 100; // centre sample; window [c − 100, c + 100)
      const touches = c + 100 > 10 * fs && c - 100 < 10 * fs + 300;
      if (touches) expect(v).toBeNaN();
      else expect(Number.isFinite(v)).toBe(true);
    });
  });
  it('DEFAULTS: 20–450 Hz, order 4, no notch, 0.1 s window at 20 Hz; settings report overlap and notches', () => {
    expect(DEFAULTS).toMatchObject({ band_hz: [20, 450], order: 4, mains_hz: null, rms_window_s: 0.1, rate_hz: 20 });
    const p = new EnvelopePipeline({ fs: 2000, mains_hz: 60, mains_harmonics: 20 });
    expect(p.settings.notch_hz).toEqual(Array.from({ length: 16 }, (_, k) => 60 * (k + 1)));
    expect(p.settings.rms_window_samples).toBe(200);
    expect(p.settings.overlap_samples).toBeGreaterThan(p.settings.padlen_samples);
  });
  it('band_hz above fs/2 is a usage error naming the value', () => {
    expect(() => new EnvelopePipeline({ fs: 800 })).toThrow('high cut-off must be below fs/2 (fs=800 Hz → 400 Hz), got 450');
  });
});

describe('BandFilter({ fs, band_hz, mains_hz })', () => {
  it('outputs the filtered signal, same length as the input, equal to sosfiltfilt', () => {
    const fs = 1000;
    const x = noise(30000, 8, 20, -200);
    const bf = new BandFilter({ fs, band_hz: [30, 300] });
    const parts = [bf.push(x.subarray(0, 12345)), bf.push(x.subarray(12345)), bf.flush()];
    const y = Float64Array.from(parts.flatMap((p) => Array.from(p)));
    expect(y.length).toBe(x.length);
    expect(maxAbsDiff(y, sosfiltfilt(butter(4, [30, 300], { btype: 'bandpass', fs }), x))).toBeLessThan(1e-9 * maxAbs(x));
  });
});

describe('textbook checks of the moving mean', () => {
  it('mean of |N(0, σ²)| is σ·√(2/π) (via rmsEnvelope of √|x|, squared)', () => {
    // METHODS.md §10: mean of |N(0, σ²)| = σ√(2/π) (from memory, textbook); 2·10⁶ seeded normals, ±1 %
    const sigma = 3, n = 2_000_000;
    const x = noise(n, 99, sigma);
    const r = new Float64Array(n);
    for (let i = 0; i < n; i++) r[i] = Math.sqrt(Math.abs(x[i]));
    // one envelope sample at t = 0 whose centred window (2n samples) covers the whole signal
    const full = rmsEnvelope(r, { fs: 1000, window_s: (2 * n) / 1000, rate_hz: 1000 / (2 * n) })[0];
    expect(full ** 2).toBeGreaterThan(0.99 * sigma * Math.sqrt(2 / Math.PI));
    expect(full ** 2).toBeLessThan(1.01 * sigma * Math.sqrt(2 / Math.PI));
  });
});
