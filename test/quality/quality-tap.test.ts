// Known-truth tests of the quality screening on simulated trapezius channels (lib/sim synthesizer,
// seeded): each defect is injected at a known time and must be found there, within one window of
// its check; clean channels must give no finding.
import { describe, expect, it } from 'vitest';
import { QUALITY_DEFAULTS } from '../../lib/quality/defaults.js';
import { QualityTap, type ChannelQuality } from '../../lib/quality/quality-tap.js';
import type { Finding } from '../../lib/study/results.js';
import { addHum, runTap, simulate } from './simulated-channel.js';

const W1 = QUALITY_DEFAULTS.window_s;
const W2 = QUALITY_DEFAULTS.spectral_window_s;
const WE = QUALITY_DEFAULTS.ecg_window_s;

function only(q: ChannelQuality, code: string): Finding[] {
  return q.findings.filter((f) => f.code === code);
}

/** The single finding of `code` must cover [t0, t1) to within `tol` s at both ends. */
function expectSpan(q: ChannelQuality, code: string, t0: number, t1: number, tol: number): Finding {
  const f = only(q, code);
  expect(f.map((x) => [x.where.start_s, x.where.end_s])).toHaveLength(1);
  expect(Math.abs(f[0]!.where.start_s! - t0)).toBeLessThanOrEqual(tol);
  expect(Math.abs(f[0]!.where.end_s! - t1)).toBeLessThanOrEqual(tol);
  return f[0]!;
}

describe('QualityTap on clean simulated channels', () => {
  // Band-limited Gaussian noise (20–450 Hz) with a seeded step profile 0.2–40 %MVE, noise 3 µV.
  for (const fs of [1000, 2000]) {
    it(`new QualityTap({ fs: ${fs} }) gives no finding on 6 clean seeds (false positives)`, () => {
      for (const seed of [1, 2, 3, 4, 5, 6]) {
        const q = runTap(simulate({ fs, duration_s: 120, seed }), { fs, where: { signal: 'S' } });
        expect(q.findings.map((f) => f.message), `seed ${seed}`).toEqual([]);
        expect(q.excluded).toEqual([]);
        expect(q.summary.screened_s).toBe(120);
        // margins: the median mains ratio and low-frequency ratio stay far below their limits
        expect(q.summary.mains_ratio_db!).toBeLessThan(10 * Math.log10(QUALITY_DEFAULTS.mains_ratio) - 5);
        expect(q.summary.low_ratio_db!).toBeLessThan(10 * Math.log10(QUALITY_DEFAULTS.motion_ratio) - 15);
      }
    });
  }
});

describe('QualityTap finds injected defects where they are', () => {
  const fs = 1000;

  it('flat line (electrode drop-out 40.3–50.6 s) → flat-line finding and excluded span within one window', () => {
    const x = simulate({ fs, duration_s: 120, seed: 11, artifacts: { dropout: [{ start_s: 40.3, duration_s: 10.3 }] } });
    const q = runTap(x, { fs, where: { worker: 'W1', recording: 'r.edf', signal: 'EMG R' } });
    const f = expectSpan(q, 'flat-line', 40.3, 50.6, W1);
    expect(f.where).toMatchObject({ worker: 'W1', recording: 'r.edf', signal: 'EMG R' });
    expect(f.message).toContain(`limit ${QUALITY_DEFAULTS.flat_std_uv}`);
    expect(q.excluded).toHaveLength(1);
    expect(q.excluded[0]!.reason).toBe('flat-line');
    // the windows wholly inside the drop-out are flat; edge windows keep their EMG
    expect(q.excluded[0]!.start_s).toBe(41);
    expect(q.excluded[0]!.end_s).toBe(50);
    expect(q.summary.excluded_s).toBe(9);
  });

  it('lost signal (band RMS 0.3 µV for 90–100 s against a 3 µV noise floor) → signal-lost, excluded', () => {
    const x = simulate({ fs, duration_s: 120, seed: 12 });
    const y = simulate({ fs, duration_s: 120, seed: 99, level_pct: 0, noise_uv: 0.3 });
    x.set(y.subarray(90 * fs, 100 * fs), 90 * fs);
    const q = runTap(x, { fs, noise_uv: 3, where: { signal: 'S' } });
    const f = expectSpan(q, 'signal-lost', 90, 100, W1);
    expect(f.message).toContain('rest recording');
    expect(only(q, 'flat-line')).toEqual([]);
    expect(q.excluded.map((e) => e.reason)).toEqual(['signal-lost']);
    expect(q.summary.noise_floor_source).toBe('rest');
  });

  it('lost signal without a rest level: the floor is estimated from the recording (3-s loss found)', () => {
    const x = simulate({ fs, duration_s: 120, seed: 13 });
    const y = simulate({ fs, duration_s: 120, seed: 98, level_pct: 0, noise_uv: 0.2 });
    x.set(y.subarray(70 * fs, 73 * fs), 70 * fs);
    const q = runTap(x, { fs, where: { signal: 'S' } });
    expectSpan(q, 'signal-lost', 70, 73, W1);
    expect(q.summary.noise_floor_source).toBe('estimated');
  });

  for (const [hz, rate] of [[50, 1000], [60, 2000]] as const) {
    it(`mains hum ${hz} Hz (20 µV peak, 30.7–70.2 s, fs ${rate}) → mains finding within one spectral window`, () => {
      const x = simulate({ fs: rate, duration_s: 120, seed: 14, level_pct: 2 });
      addHum(x, rate, hz, 20, 30.7, 70.2);
      const q = runTap(x, { fs: rate, where: { signal: 'S' } });
      const f = expectSpan(q, 'mains', 30.7, 70.2, W2);
      expect(f.message).toContain(`at ${hz} Hz`);
      expect(f.severity).toBe('warning');
      expect(q.excluded).toEqual([]); // hum is reported, not excluded
      const notched = runTap(x, { fs: rate, mains_notched: true, where: { signal: 'S' } });
      expect(only(notched, 'mains')[0]!.severity).toBe('info');
    });
  }

  it('motion bursts (3 Hz, 600 µV at 60.5–63.5 s; 5 Hz, 40 µV at 90.5–93.5 s) → motion findings in place', () => {
    const x = simulate({
      fs, duration_s: 120, seed: 15, level_pct: 3,
      artifacts: { motion: [{ start_s: 60.5, duration_s: 3, amplitude_uv: 600, freq_hz: 3 }, { start_s: 90.5, duration_s: 3, amplitude_uv: 40, freq_hz: 5 }] },
    });
    const q = runTap(x, { fs, where: { signal: 'S' } });
    const f = only(q, 'motion');
    expect(f).toHaveLength(2);
    expect(Math.abs(f[0]!.where.start_s! - 60.5)).toBeLessThanOrEqual(W2);
    expect(Math.abs(f[0]!.where.end_s! - 63.5)).toBeLessThanOrEqual(W2);
    expect(Math.abs(f[1]!.where.start_s! - 90.5)).toBeLessThanOrEqual(W2);
    expect(Math.abs(f[1]!.where.end_s! - 93.5)).toBeLessThanOrEqual(W2);
    // the large burst is severe (excluded), the small one only reported
    expect(f[0]!.message).toContain('excluded');
    expect(f[1]!.message).not.toContain('excluded');
    expect(q.excluded.map((e) => e.reason)).toEqual(['motion']);
    expect(q.excluded[0]!.start_s).toBe(f[0]!.where.start_s);
  });

  it('exclude: false keeps every span (findings only)', () => {
    const x = simulate({ fs, duration_s: 60, seed: 16, artifacts: { dropout: [{ start_s: 20, duration_s: 5 }] } });
    const q = runTap(x, { fs, settings: { exclude: false }, where: { signal: 'S' } });
    expect(only(q, 'flat-line')).toHaveLength(1);
    expect(q.excluded).toEqual([]);
    expect(q.summary.excluded_s).toBe(0);
  });

  it('clipping: counts equal the samples at the digital limits; heavy clipping excluded', () => {
    // quantize to a 16-bit EDF grid of ±1000 µV (EDFlib scaling) and clip a loud burst at 80.2–81.4 s
    const pmin = -1000, pmax = 1000, dmin = -32768, dmax = 32767;
    const bv = (pmax - pmin) / (dmax - dmin), off = pmax / bv - dmax;
    const x = simulate({ fs, duration_s: 120, seed: 17, level_pct: 5 });
    for (let i = Math.round(80.2 * fs); i < Math.round(81.4 * fs); i++) x[i] *= 40;
    let hi = 0, lo = 0;
    for (let i = 0; i < x.length; i++) {
      let d = Math.round(x[i] / bv - off);
      if (d >= dmax) { d = dmax; hi++; } else if (d <= dmin) { d = dmin; lo++; }
      x[i] = bv * (off + d);
    }
    expect(hi + lo).toBeGreaterThan(10);
    const q = runTap(x, { fs, limits: { physical_min: pmin, physical_max: pmax, digital_min: dmin, digital_max: dmax }, where: { signal: 'S' } });
    expect(q.summary.clipped_high).toBe(hi);
    expect(q.summary.clipped_low).toBe(lo);
    const f = only(q, 'clipped');
    expect(f.length).toBeGreaterThanOrEqual(1);
    expect(f[0]!.where.start_s).toBeGreaterThanOrEqual(80);
    expect(f[f.length - 1]!.where.end_s).toBeLessThanOrEqual(82);
    expect(f.map((x) => x.message).join(' ')).toContain(`${hi + lo} of`);
    expect(q.excluded.some((e) => e.reason === 'clipped')).toBe(true);
  });

  it('a CSV-like signal without digital limits skips the clipping check (counts null)', () => {
    const x = simulate({ fs, duration_s: 30, seed: 18 });
    const q = runTap(x, { fs, limits: { physical_min: -1, physical_max: 1, digital_min: NaN, digital_max: NaN } });
    expect(q.summary.clipped_high).toBeNull();
    expect(only(q, 'clipped')).toEqual([]);
  });
});

describe('QualityTap ECG check (heart rate by autocorrelation)', () => {
  // Simulated trapezius at rest level (0.2 %MVE of 400 µV over a 3 µV noise floor) with QRS-like
  // complexes of 150 µV R amplitude at a known rate (±3 % beat-to-beat jitter, lib/sim).
  for (const bpm of [45, 60, 72, 110, 160]) {
    it(`ECG at ${bpm} beats/min after the 30 Hz high-pass: rate found within 5 %`, () => {
      const fs = 1000;
      const x = simulate({ fs, duration_s: 60, seed: 20 + bpm, level_pct: 0.2, artifacts: { ecg: { amplitude_uv: 150, rate_bpm: bpm } } });
      const q = runTap(x, { fs, highpass_hz: 30, where: { signal: 'S' } });
      expect(q.summary.ecg_rate_bpm).not.toBeNull();
      expect(Math.abs(q.summary.ecg_rate_bpm! / bpm - 1)).toBeLessThan(0.05);
      const f = only(q, 'ecg');
      expect(f.length).toBeGreaterThanOrEqual(1);
      expect(q.summary.ecg_s).toBeGreaterThanOrEqual(60 - 2 * WE); // most windows
      expect(f[0]!.severity).toBe('info');
      expect(q.excluded).toEqual([]);
    });
  }

  it('ECG over a working trapezius (seeded 0.2–40 %MVE profile, 72 beats/min): rate within 5 % where found', () => {
    const fs = 2000;
    const x = simulate({ fs, duration_s: 120, seed: 3, artifacts: { ecg: { amplitude_uv: 150, rate_bpm: 72 } } });
    const q = runTap(x, { fs, where: { signal: 'S' } });
    expect(q.summary.ecg_rate_bpm).not.toBeNull();
    expect(Math.abs(q.summary.ecg_rate_bpm! / 72 - 1)).toBeLessThan(0.05);
    expect(only(q, 'ecg')[0]!.severity).toBe('warning'); // no high-pass given
  });
});

describe('QualityTap streaming', () => {
  it('raw/filtered chunk sizes do not change the findings or summary', () => {
    const fs = 1000;
    const x = simulate({ fs, duration_s: 90, seed: 21, artifacts: { dropout: [{ start_s: 30.5, duration_s: 4 }], motion: [{ start_s: 60, duration_s: 2, amplitude_uv: 500, freq_hz: 4 }], ecg: { amplitude_uv: 150, rate_bpm: 80 } } });
    const a = runTap(x, { fs, where: { signal: 'S' } }, 4096);
    const b = runTap(x, { fs, where: { signal: 'S' } }, 777);
    const c = runTap(x, { fs, where: { signal: 'S' } }, 90_000);
    for (const o of [b, c]) {
      expect(o.findings.map((f) => [f.code, f.where.start_s, f.where.end_s])).toEqual(a.findings.map((f) => [f.code, f.where.start_s, f.where.end_s]));
      expect(o.excluded).toEqual(a.excluded);
      expect(o.summary.ecg_rate_bpm!).toBeCloseTo(a.summary.ecg_rate_bpm!, 9);
      expect(o.summary.noise_floor_uv!).toBeCloseTo(a.summary.noise_floor_uv!, 9);
    }
  });

  it('restart(offset_s) (EDF+D) places later findings at recording time, start_s shifts all times', () => {
    const fs = 1000;
    const x = simulate({ fs, duration_s: 60, seed: 22, artifacts: { dropout: [{ start_s: 45, duration_s: 5 }] } });
    const tap = new QualityTap({ fs, start_s: 100, where: { signal: 'S' } });
    // piece 1: samples 0–30 s; piece 2 (samples 30–60 s) recorded from 40 s on
    for (let i = 0; i < 30 * fs; i += 1000) { const c = x.subarray(i, i + 1000); tap.raw(c); tap.filtered(c); }
    tap.restart(40);
    for (let i = 30 * fs; i < 60 * fs; i += 1000) { const c = x.subarray(i, i + 1000); tap.raw(c); tap.filtered(c); }
    const q = tap.finish();
    const f = only(q, 'flat-line');
    expect(f).toHaveLength(1);
    // drop-out at 45–50 s of the samples = 55–60 s after the restart, + start_s 100
    expect(f[0]!.where.start_s).toBe(155);
    expect(f[0]!.where.end_s).toBe(160);
    expect(q.summary.screened_s).toBe(60);
  });

  it('max_spans caps the findings of one check and sums the rest', () => {
    const fs = 1000;
    const drops = Array.from({ length: 8 }, (_, k) => ({ start_s: 5 + 6 * k, duration_s: 2 }));
    const x = simulate({ fs, duration_s: 60, seed: 23, artifacts: { dropout: drops } });
    const q = runTap(x, { fs, settings: { max_spans: 3 }, where: { signal: 'S' } });
    const f = only(q, 'flat-line');
    expect(f).toHaveLength(4);
    expect(f[3]!.message).toContain('5 further span(s)');
    expect(q.excluded).toHaveLength(8); // exclusion is not capped
  });
});
