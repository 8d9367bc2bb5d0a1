import { describe, expect, it } from 'vitest';
import { RecordingSynthesizer } from '../../lib/sim/recording-synthesizer.js';
import { whiteShaper } from '../../lib/sim/noise-shaper.js';
import { makeDesign, stepEnvelope, tonePower } from './make-design.js';

function all(d: ReturnType<typeof makeDesign>, chunk = 997): Float64Array {
  const syn = new RecordingSynthesizer(d, whiteShaper);
  const x = new Float64Array(syn.totalSamples);
  while (syn.remaining > 0) { const i0 = syn.position; const n = Math.min(chunk, syn.remaining); x.set(syn.next(n)[0], i0); }
  return x;
}

function rms(x: Float64Array, a: number, b: number): number {
  let s = 0;
  for (let i = a; i < b; i++) s += x[i] * x[i];
  return Math.sqrt(s / (b - a));
}

describe('RecordingSynthesizer(design, shaper)', () => {
  const fs = 1000;
  const env = stepEnvelope(20, [[20, 5], [20, 30], [20, 100], [20, 0]]);
  const design = makeDesign({ fs, duration_s: 80, envelope: env, rate_hz: 20, mve_uv: 400, noise_uv: 3 });

  it('RMS over 1 s windows follows sqrt((a·MVE/100)² + noise²) within 10 % per window and 1 % on average', () => {
    // known truth by construction; per-window sampling error of a 1000-sample RMS ≈ 1/√2000 = 2.2 %
    const x = all(design);
    let sumRatio = 0, count = 0;
    for (let w = 0; w < 80; w++) {
      if (w % 20 === 0 || w % 20 === 19) continue; // skip windows touching a step
      const a = (env[w * 20 + 10] * 400) / 100;
      const want = Math.hypot(a, 3);
      const got = rms(x, w * fs, (w + 1) * fs);
      expect(Math.abs(got / want - 1)).toBeLessThan(0.1);
      sumRatio += got / want; count++;
    }
    expect(Math.abs(sumRatio / count - 1)).toBeLessThan(0.01);
  });

  it('any chunk split gives the same samples', () => {
    const a = all(design, 80_000);
    const b = all(design, 3);
    const c = all(design, 4099);
    expect(b).toEqual(a);
    expect(c).toEqual(a);
  });

  it('the same seed gives identical samples, another seed different ones', () => {
    const other = makeDesign({ fs, duration_s: 80, envelope: env, rate_hz: 20, mve_uv: 400, noise_uv: 3, seed: 12n });
    expect(all(design)).toEqual(all(design, 5000));
    expect(all(other)[0]).not.toBe(all(design)[0]);
  });

  it('drop-out spans are flat at 0 µV (zero variance) and nothing else is', () => {
    const d = makeDesign({ fs, duration_s: 80, envelope: env, rate_hz: 20, noise_uv: 3, artifacts: { dropout: [{ start_s: 25.5, duration_s: 3 }] } });
    const x = all(d);
    for (let i = 25_500; i < 28_500; i++) expect(x[i]).toBe(0);
    expect(x[25_499]).not.toBe(0);
    expect(x[28_500]).not.toBe(0);
  });

  it('clip_uv limits samples to ±range, and clipped samples occur only where the envelope is high', () => {
    // range = 6 σ of the 30 %MVE span (σ = 120 µV): P(|z| > 6) ≈ 2e-9, so the 5 % and 30 % spans
    // never clip; in the 100 %MVE span (40–60 s, σ = 400 µV) the range is 1.8 σ
    const range = 6 * 0.3 * 400;
    const d = makeDesign({ fs, duration_s: 80, envelope: env, rate_hz: 20, noise_uv: 3, range_uv: range });
    const x = all(d);
    let inside = 0;
    for (let i = 0; i < x.length; i++) {
      expect(Math.abs(x[i])).toBeLessThanOrEqual(range);
      if (Math.abs(x[i]) === range) {
        expect(i / fs).toBeGreaterThanOrEqual(39.95);
        expect(i / fs).toBeLessThan(60.05);
        inside++;
      }
    }
    // P(|z| > 1.8) = 0.0719 for the 20 s at 100 %MVE (normal table); ±5 standard errors
    expect(inside / 20_000).toBeGreaterThan(0.0719 - 5 * Math.sqrt(0.0719 * 0.9281 / 20_000));
    expect(inside / 20_000).toBeLessThan(0.0719 + 5 * Math.sqrt(0.0719 * 0.9281 / 20_000));
  });

  it('mains hum adds power at its frequency: the 50 Hz bin rises to amplitude²/2', () => {
    const quiet = makeDesign({ fs, duration_s: 20, envelope: stepEnvelope(20, [[20, 1]]), rate_hz: 20, noise_uv: 2 });
    const hum = makeDesign({ fs, duration_s: 20, envelope: stepEnvelope(20, [[20, 1]]), rate_hz: 20, noise_uv: 2, artifacts: { hum: { amplitude_uv: 20, freq_hz: 50 } } });
    const q = all(quiet), h = all(hum);
    // sinusoid of amplitude A has power A²/2 = 200 µV² at its frequency (textbook)
    expect(Math.abs(tonePower(h, fs, 50) - 200)).toBeLessThan(10);
    expect(tonePower(q, fs, 50)).toBeLessThan(1);
    expect(tonePower(h, fs, 47)).toBeLessThan(1);
  });

  it('a motion burst adds low-frequency power inside its span only', () => {
    const e = stepEnvelope(20, [[30, 2]]);
    const d = makeDesign({ fs, duration_s: 30, envelope: e, rate_hz: 20, noise_uv: 2, artifacts: { motion: [{ start_s: 10, duration_s: 4, amplitude_uv: 300, freq_hz: 2 }] } });
    const x = all(d);
    expect(tonePower(x, fs, 2, 10_000, 14_000)).toBeGreaterThan(1000);
    expect(tonePower(x, fs, 2, 0, 10_000)).toBeLessThan(5);
    expect(tonePower(x, fs, 2, 14_000, 30_000)).toBeLessThan(5);
  });

  it('ECG-like spikes appear at the heart rate: one large peak per beat', () => {
    const e = stepEnvelope(20, [[60, 0.5]]);
    const d = makeDesign({ fs, duration_s: 60, envelope: e, rate_hz: 20, noise_uv: 2, artifacts: { ecg: { amplitude_uv: 80, rate_bpm: 72 } } });
    const x = all(d);
    let peaks = 0;
    for (let i = 1; i < x.length - 1; i++) {
      if (x[i] > 50 && x[i] >= x[i - 1] && x[i] > x[i + 1]) { peaks++; i += 200; }
    }
    // 72 beats/min × 1 min, ±3 % jitter → 70–74 peaks
    expect(peaks).toBeGreaterThanOrEqual(70);
    expect(peaks).toBeLessThanOrEqual(74);
  });

  it('white amplifier noise adds in power: RMS² = a² + noise² + amplifier²', () => {
    const e = stepEnvelope(20, [[60, 2]]);
    const d = makeDesign({ fs, duration_s: 60, envelope: e, rate_hz: 20, mve_uv: 400, noise_uv: 3, artifacts: { amplifier_uv: 5 } });
    const x = all(d);
    const want = Math.sqrt(8 * 8 + 3 * 3 + 5 * 5);
    expect(Math.abs(rms(x, 0, x.length) / want - 1)).toBeLessThan(0.02);
  });
});
