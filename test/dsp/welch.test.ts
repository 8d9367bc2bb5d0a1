import { describe, expect, it } from 'vitest';
import { meanFrequency } from '../../lib/dsp/mean-frequency.js';
import { medianFrequency } from '../../lib/dsp/median-frequency.js';
import { WelchAccumulator, welch } from '../../lib/dsp/welch.js';
import { loadDspFixture, randomSplits } from './load-fixture.js';

interface Features { mnf_hz: number; mdf_hz_bin: number; mdf_hz_interp: number; n_bins: number; first_bin_hz: number; last_bin_hz: number }
interface WelchFixture { fs: number; x: number[]; welch_settings: { nperseg: number; noverlap: number; n_segments: number };
  f_hz: number[]; psd: number[]; spectral_features_full_range: Features; spectral_features_20_450_hz: Features }
// expected: shared/fixtures/dsp/welch_psd.json, scipy 1.17.1 welch (hann, constant detrend, density, mean)
const fx = loadDspFixture<WelchFixture>('welch_psd.json');
const opts = { fs: fx.fs, nperseg: fx.welch_settings.nperseg, noverlap: fx.welch_settings.noverlap };

describe('welch(x, { fs, nperseg, noverlap })', () => {
  it('equals scipy.signal.welch within 1e-10 of max(Pxx); same bins and segment count', () => {
    const r = welch(fx.x, opts);
    expect(r.segments).toBe(fx.welch_settings.n_segments);
    expect(Array.from(r.f_hz)).toEqual(fx.f_hz);
    const max = Math.max(...fx.psd);
    fx.psd.forEach((v, k) => expect(Math.abs(r.psd[k] - v)).toBeLessThanOrEqual(1e-10 * max));
  });
  it('WelchAccumulator.push over random chunk splits gives the identical PSD', () => {
    const whole = welch(fx.x, opts);
    for (const seed of [31, 32, 33]) {
      const acc = new WelchAccumulator(opts);
      let at = 0;
      for (const len of randomSplits(fx.x.length, seed, 1500)) { acc.push(fx.x.slice(at, at + len)); at += len; }
      expect(Array.from(acc.result().psd)).toEqual(Array.from(whole.psd));
    }
  });
  it('a pure sine at bin k: PSD peaks at k; integral of PSD ≈ A²/2 (Parseval, Hann window)', () => {
    const fs = 1024, n = 8192, A = 3, k0 = 100;
    const x = Float64Array.from({ length: n }, (_, i) => A * Math.sin((2 * Math.PI * k0 * i) / 256 + 0.4));
    const r = welch(x, { fs, nperseg: 256 });
    let arg = 0;
    for (let k = 0; k < r.psd.length; k++) if (r.psd[k] > r.psd[arg]) arg = k;
    expect(arg).toBe(k0);
    let power = 0;
    for (const v of r.psd) power += v * (fs / 256);
    // textbook: mean power of A·sin is A²/2 (METHODS.md §10); by Parseval, density scaling (÷ fs·Σw²)
    // makes Σ PSD·Δf equal the mean square of the signal (the Hann window spreads the line over 3 bins)
    expect(power).toBeCloseTo((A * A) / 2, 6);
  });
  it('fewer samples than nperseg gives 0 segments and a NaN PSD', () => {
    const r = welch(new Float64Array(100), { fs: 1000, nperseg: 256 });
    expect(r.segments).toBe(0);
    expect(r.psd.every(Number.isNaN)).toBe(true);
  });
  it('rejects nperseg that is not a power of two and noverlap ≥ nperseg', () => {
    expect(() => welch([1, 2], { fs: 1000, nperseg: 1000 })).toThrow('nperseg must be a power of two from 8 to 1048576 samples, got 1000');
    expect(() => welch([1, 2], { fs: 1000, nperseg: 256, noverlap: 256 })).toThrow('noverlap must be a whole number from 0 to nperseg − 1 (nperseg=256 → 255), got 256');
  });
});

describe('meanFrequency / medianFrequency against welch_psd.json', () => {
  // expected: shared/fixtures/dsp/welch_psd.json spectral_features_* (numpy cumsum); MNF, mdf_interp abs ≤ 1e-9 Hz, mdf_bin exact
  const cases: [string, Features, { fminHz?: number; fmaxHz?: number }][] = [
    ['full range', fx.spectral_features_full_range, {}],
    ['20–450 Hz', fx.spectral_features_20_450_hz, { fminHz: 20, fmaxHz: 450 }],
  ];
  for (const [name, ref, range] of cases) {
    it(`${name}: MNF, MDF (bin) and MDF (interp) equal the fixture`, () => {
      expect(Math.abs(meanFrequency(fx.f_hz, fx.psd, range) - ref.mnf_hz)).toBeLessThanOrEqual(1e-9);
      expect(medianFrequency(fx.f_hz, fx.psd, { ...range, convention: 'bin' })).toBe(ref.mdf_hz_bin);
      expect(Math.abs(medianFrequency(fx.f_hz, fx.psd, { ...range, convention: 'interp' }) - ref.mdf_hz_interp)).toBeLessThanOrEqual(1e-9);
    });
  }
  it('check values of METHODS.md §7: flat 20…220 Hz → MNF = MDF = 120 Hz; lines 1 @ 50, 3 @ 150 → MNF 125, MDF 150', () => {
    // METHODS.md §7 check values (COMPUTED there)
    const f = Array.from({ length: 201 }, (_, i) => 20 + i), p = f.map(() => 1);
    expect(meanFrequency(f, p)).toBeCloseTo(120, 12);
    expect(medianFrequency(f, p, { convention: 'bin' })).toBe(120);
    expect(meanFrequency([50, 150], [1, 3])).toBe(125);
    expect(medianFrequency([50, 150], [1, 3], { convention: 'bin' })).toBe(150);
  });
});

describe("WelchAccumulator({ nan: 'skip' })", () => {
  it('leaves out segments holding a NaN and counts them; the rest average as without them', () => {
    const x = Float64Array.from(fx.x);
    x[100] = NaN; // inside segment 0 only (segments of 1024 starting every 512)
    const r = welch(x, { ...opts, nan: 'skip' });
    expect(r.segments).toBe(fx.welch_settings.n_segments - 1);
    expect(r.skipped_segments).toBe(1);
    const ref = welch(fx.x.slice(512), opts);
    r.psd.forEach((v, k) => expect(v).toBeCloseTo(ref.psd[k], 14));
    expect(welch(x, opts).psd.every(Number.isNaN)).toBe(true);
  });
});
