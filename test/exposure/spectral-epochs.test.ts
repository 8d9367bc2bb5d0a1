import { describe, expect, it } from 'vitest';
import { SpectralEpochs, spectralEpochs } from '../../lib/exposure/spectral-epochs.js';
import { butter } from '../../lib/dsp/butter.js';
import { sosfiltfilt } from '../../lib/dsp/sosfiltfilt.js';
import { linearRegression } from '../../lib/stats/linear-regression.js';
import { welch } from '../../lib/dsp/welch.js';
import { meanFrequency } from '../../lib/dsp/mean-frequency.js';
import { medianFrequency } from '../../lib/dsp/median-frequency.js';
import { Xoshiro128 } from '../../lib/stats/xoshiro128.js';
import { UsageError } from '../../lib/errors.js';
import { designedMnf0, designedMnfSlope, spectralShiftSignal, triangleLines, type ShiftDesign } from './spectral-shift-signal.js';

describe('SpectralEpochs({ fs, epoch_s, band_hz })', () => {
  it('spectralEpochs(sine f0) gives MNF = MDF = f0 within one bin and RMS = A/√2 (METHODS.md §7 check: pure sine)', () => {
    const fs = 1000, f0 = 97.3, A = 40;
    const x = Float64Array.from({ length: 10 * fs }, (_, k) => A * Math.sin((2 * Math.PI * f0 * k) / fs));
    const r = spectralEpochs(x, { fs, band_hz: [20, 450] });
    expect(r.t_s.length).toBe(10);
    expect(r.nfft).toBe(1024);
    const bin = fs / r.nfft;
    for (let i = 0; i < 10; i++) {
      expect(Math.abs(r.mnf_hz[i]! - f0)).toBeLessThanOrEqual(bin);
      expect(Math.abs(r.mdf_hz[i]! - f0)).toBeLessThanOrEqual(bin);
      expect(Math.abs(r.rms_uv[i]! - A / Math.SQRT2)).toBeLessThan(0.01 * A);
      expect(r.t_s[i]).toBeCloseTo(i + 0.5, 12);
    }
  });

  it('spectralEpochs(white noise band-passed 20–450 Hz, fs 1000) has mean MNF ≈ 234 ± 5 Hz (METHODS.md §7 check, COMPUTED) and mean MDF within 4 Hz of the Welch MDF', () => {
    const fs = 1000, rng = new Xoshiro128(7);
    const w = Float64Array.from({ length: 60 * fs }, () => rng.normal());
    const y = sosfiltfilt(butter(4, [20, 450], { btype: 'bandpass', fs }), w);
    const r = spectralEpochs(y, { fs, band_hz: [20, 450] });
    const mean = (a: Float64Array) => a.reduce((s, v) => s + v, 0) / a.length;
    expect(Math.abs(mean(r.mnf_hz) - 234)).toBeLessThanOrEqual(5);
    // The METHODS MDF value (≈ 236) is for the Welch-averaged spectrum; the mean of 60 per-epoch
    // medians is a different estimator (seen 1–3 Hz lower over seeds 1, 2, 3, 7), so it is checked
    // against the Welch MDF (lib/dsp/welch, itself checked against scipy) of the same signal.
    const W = welch(y, { fs, nperseg: 1024 });
    expect(Math.abs(mean(r.mdf_hz) - medianFrequency(W.f_hz, W.psd, { fminHz: 20, fmaxHz: 450 }))).toBeLessThanOrEqual(4);
    expect(Math.abs(mean(r.mnf_hz) - meanFrequency(W.f_hz, W.psd, { fminHz: 20, fmaxHz: 450 }))).toBeLessThanOrEqual(2);
  });

  it('SpectralEpochs.push(chunks) gives exactly the epochs of one push, for any chunk split', () => {
    const fs = 1024, rng = new Xoshiro128(11);
    const x = Float64Array.from({ length: 37 * fs + 123 }, () => rng.normal());
    const whole = spectralEpochs(x, { fs, epoch_s: 0.5, band_hz: [20, 450] });
    for (const seed of [1, 2, 3]) {
      const r = new Xoshiro128(seed);
      const tap = new SpectralEpochs({ fs, epoch_s: 0.5, band_hz: [20, 450] });
      let i = 0;
      while (i < x.length) {
        const m = 1 + Math.floor(r.random() * 3000);
        tap.filtered(x.slice(i, i + m));
        i += m;
      }
      const got = tap.result();
      expect(got.t_s).toEqual(whole.t_s);
      expect(got.rms_uv).toEqual(whole.rms_uv);
      expect(got.mnf_hz).toEqual(whole.mnf_hz);
      expect(got.mdf_hz).toEqual(whole.mdf_hz);
    }
    expect(whole.t_s.length).toBe(74);
  });

  it('SpectralEpochs.restart(offset_s) drops the incomplete epoch and times the next piece from offset_s + start_s', () => {
    const fs = 1000;
    const tap = new SpectralEpochs({ fs, band_hz: [20, 450], start_s: 100 });
    const x = Float64Array.from({ length: 2500 }, (_, k) => Math.sin(k));
    tap.filtered(x); // 2 whole epochs, 500 samples dropped at the restart
    tap.restart(10);
    tap.filtered(x.subarray(0, 1000));
    expect(Array.from(tap.result().t_s)).toEqual([100.5, 101.5, 110.5]);
  });

  it('SpectralEpochs recovers a designed MNF slope of −1.5 Hz/min over 20 min within 2 % (known-truth signal, spectral-shift-signal.ts)', () => {
    const { lines_hz, powers } = triangleLines(60, 180, 5);
    const d: ShiftDesign = { fs: 1000, duration_s: 1200, lines_hz, powers, compression_per_min: 1.5 / 120, a0_uv: 50, a1_uv_per_min: 0, seed: 3 };
    expect(designedMnf0(d)).toBeCloseTo(120, 9);
    const slope = designedMnfSlope(d); // −1.5 Hz/min
    const r = spectralEpochs(spectralShiftSignal(d), { fs: d.fs, band_hz: [30, 400] });
    expect(r.t_s.length).toBe(1200);
    let worst = 0;
    for (let i = 0; i < r.t_s.length; i++) {
      const tMin = r.t_s[i]! / 60;
      worst = Math.max(worst, Math.abs(r.mnf_hz[i]! - (120 + slope * tMin)));
    }
    expect(worst).toBeLessThan(1); // every epoch within 1 Hz of the design
    const fit = linearRegression(Array.from(r.t_s, (t) => t / 60), r.mnf_hz);
    expect(Math.abs(fit.slope - slope)).toBeLessThanOrEqual(0.02 * Math.abs(slope));
  });

  it('new SpectralEpochs throws UsageError for epochs under 16 samples and bands outside 0…fs/2', () => {
    expect(() => new SpectralEpochs({ fs: 1000, epoch_s: 0.01, band_hz: [20, 450] })).toThrow(UsageError);
    expect(() => new SpectralEpochs({ fs: 1000, band_hz: [20, 600] })).toThrow(UsageError);
    expect(() => new SpectralEpochs({ fs: 1000, band_hz: [300, 200] })).toThrow(UsageError);
  });
});
