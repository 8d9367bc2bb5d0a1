import FFT from 'fft.js';
import { describe, expect, it } from 'vitest';
import { butter } from '../../lib/dsp/butter.js';
import { sosfreqz } from '../../lib/dsp/sosfreqz.js';
import { butterShaper } from '../../lib/sim/butter-shaper.js';
import { noiseGain } from '../../lib/sim/noise-shaper.js';
import { RecordingSynthesizer } from '../../lib/sim/recording-synthesizer.js';
import { makeDesign, stepEnvelope } from './make-design.js';

const fs = 1000;
const band: [number, number] = [20, 450];

/** Averaged Hann-window periodogram (Welch, no overlap), one-sided, bins of fs/nfft. */
function periodogram(x: Float64Array, nfft: number): Float64Array {
  const f = new FFT(nfft);
  const buf = new Array<number>(nfft).fill(0);
  const out = f.createComplexArray() as number[];
  const p = new Float64Array(nfft / 2 + 1);
  const win = Array.from({ length: nfft }, (_, i) => 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / nfft));
  let segs = 0;
  for (let s = 0; s + nfft <= x.length; s += nfft) {
    for (let i = 0; i < nfft; i++) buf[i] = x[s + i] * win[i];
    f.realTransform(out, buf);
    for (let k = 0; k <= nfft / 2; k++) p[k] += out[2 * k] ** 2 + out[2 * k + 1] ** 2;
    segs++;
  }
  for (let k = 0; k < p.length; k++) p[k] /= segs;
  return p;
}

function generate(seconds: number, noise_uv: number, mve_uv = 400, level = 0): Float64Array {
  const d = makeDesign({ fs, duration_s: seconds, envelope: stepEnvelope(20, [[seconds, level]]), rate_hz: 20, mve_uv, noise_uv });
  const syn = new RecordingSynthesizer(d, butterShaper(band, 4, fs));
  const x = new Float64Array(syn.totalSamples);
  while (syn.remaining > 0) { const i0 = syn.position; x.set(syn.next(Math.min(10_000, syn.remaining))[0], i0); }
  return x;
}

describe('butterShaper(band_hz, order, fs)', () => {
  it('noiseGain() equals the RMS gain measured on long white noise (Parseval)', () => {
    // textbook: output variance of unit white noise through h = Σ h[k]²
    const g = noiseGain(butterShaper(band, 4, fs), 5 * fs);
    const x = generate(120, 1, 1, 0); // amplitude 1 µV → unit-RMS shaped noise
    let s = 0;
    for (const v of x) s += v * v;
    // 120 000 samples, ≈ 2·430·120 degrees of freedom → standard error of the RMS ≈ 0.2 %
    expect(Math.abs(Math.sqrt(s / x.length) - 1)).toBeLessThan(0.01);
    expect(g).toBeGreaterThan(0.8);
    expect(g).toBeLessThan(1);
  });

  it('the generated noise has the band-pass spectrum: little power below and above the band, MNF as |H|² predicts', () => {
    const x = generate(120, 5);
    const nfft = 1024;
    const p = periodogram(x, nfft);
    const df = fs / nfft;
    let total = 0, low = 0, high = 0, m1 = 0;
    for (let k = 1; k < p.length; k++) {
      const f = k * df;
      total += p[k]; m1 += f * p[k];
      if (f < 10) low += p[k];
      if (f > 490) high += p[k];
    }
    // |H|² of the same Butterworth design (lib/dsp sosfreqz, checked against scipy.signal.sosfreqz by dsp's tests)
    const sos = butter(4, band, { btype: 'bandpass', fs });
    const freqs = Array.from({ length: p.length - 1 }, (_, i) => (i + 1) * df);
    const h = sosfreqz(sos, freqs, fs);
    let hs = 0, hm = 0;
    freqs.forEach((f, i) => { hs += h[i] ** 2; hm += f * h[i] ** 2; });
    expect(low / total).toBeLessThan(0.005);
    expect(high / total).toBeLessThan(0.01);
    // mean frequency within 5 Hz (METHODS.md §5 check values use ±5 Hz for random seeds)
    expect(Math.abs(m1 / total - hm / hs)).toBeLessThan(5);
    // passband flat: mean power 100–200 Hz vs 300–400 Hz within 10 %
    const mean = (a: number, b: number) => { let s = 0, n = 0; for (let k = Math.ceil(a / df); k <= b / df; k++) { s += p[k]; n++; } return s / n; };
    expect(Math.abs(mean(100, 200) / mean(300, 400) - 1)).toBeLessThan(0.1);
  });
});
