import { describe, expect, it } from 'vitest';
import { cachedFft } from '../../lib/dsp/cached-fft.js';
import { PairedPowerSpectra } from '../../lib/dsp/paired-power-spectra.js';
import { powerSpectrumPair } from '../../lib/dsp/power-spectrum-pair.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';

function noise(seed: number, n: number): Float64Array {
  const r = new SplitMix64(seed);
  return Float64Array.from({ length: n }, () => r.normal() * 10 + 3);
}

/** |X_k|² by the DFT's definition, X_k = Σ x_m e^{−2πikm/n} (textbook; O(n²)). */
function dftPower(x: Float64Array): Float64Array {
  const n = x.length, out = new Float64Array(n / 2 + 1);
  for (let k = 0; k <= n / 2; k++) {
    let re = 0, im = 0;
    for (let m = 0; m < n; m++) { const a = (-2 * Math.PI * k * m) / n; re += x[m]! * Math.cos(a); im += x[m]! * Math.sin(a); }
    out[k] = re * re + im * im;
  }
  return out;
}

function worstRel(a: Float64Array, b: Float64Array): number {
  let mx = 0, d = 0;
  for (let i = 0; i < b.length; i++) mx = Math.max(mx, Math.abs(b[i]!));
  for (let i = 0; i < b.length; i++) d = Math.max(d, Math.abs(a[i]! - b[i]!));
  return d / mx;
}

describe('powerSpectrumPair(n)', () => {
  it('gives both signals\' |X_k|², k = 0…n/2, as the DFT\'s definition (n = 8…512, within 1e-12 of the largest)', () => {
    for (const n of [8, 16, 64, 512]) {
      const k = powerSpectrumPair(n);
      if (k === null) return; // no WebAssembly SIMD: PairedPowerSpectra falls back to fft.js
      const a = noise(n, n), b = noise(n + 1, n);
      k.inA.set(a); k.inB.set(b); k.run();
      expect(worstRel(k.powA, dftPower(a))).toBeLessThan(1e-12);
      expect(worstRel(k.powB, dftPower(b))).toBeLessThan(1e-12);
    }
  });

  it('agrees with fft.js realTransform at the analysis sizes (1024, 2048) within 1e-13 of the largest value', () => {
    for (const n of [1024, 2048]) {
      const k = powerSpectrumPair(n);
      if (k === null) return;
      const a = noise(3, n);
      k.inA.set(a); k.inB.set(noise(4, n)); k.run();
      const spec = new Float64Array(2 * n);
      cachedFft(n).realTransform(spec, a);
      const want = Float64Array.from({ length: n / 2 + 1 }, (_, i) => spec[2 * i]! ** 2 + spec[2 * i + 1]! ** 2);
      expect(worstRel(k.powA, want)).toBeLessThan(1e-13);
    }
  });

  it('refuses lengths that are not powers of two from 8', () => {
    expect(powerSpectrumPair(1000)).toBeNull();
    expect(powerSpectrumPair(4)).toBeNull();
  });
});

describe('PairedPowerSpectra(n)', () => {
  it('calls every sink once, in submission order, pairs or alone after flush(), with the spectra of the fft.js path', () => {
    const n = 256, segs = Array.from({ length: 7 }, (_, i) => noise(20 + i, 200)); // zero-padded to 256
    const run = (simd: boolean) => {
      const q = new PairedPowerSpectra(n, { simd });
      const got: [number, Float64Array][] = [];
      segs.forEach((s, i) => {
        q.input().set(s);
        q.submit((p) => got.push([i, p.slice()]));
        if (i === 2) q.flush(); // a flush in the middle leaves the next segment alone again
      });
      q.flush();
      return got;
    };
    const simd = run(true), ref = run(false);
    expect(simd.map(([i]) => i)).toEqual([0, 1, 2, 3, 4, 5, 6]);
    simd.forEach(([, p], i) => expect(worstRel(p, ref[i]![1])).toBeLessThan(1e-13));
    // zero padding: the spectrum of the 200 samples padded with zeros (DFT definition)
    const padded = new Float64Array(n);
    padded.set(segs[6]!);
    expect(worstRel(simd[6]![1], dftPower(padded))).toBeLessThan(1e-12);
  });
});
