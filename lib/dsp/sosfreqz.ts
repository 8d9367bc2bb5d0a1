// Frequency response magnitude of a section cascade at chosen frequencies (scipy.signal.sosfreqz).
import { checkSos } from './check-sos.js';
import type { Sos } from './sos.js';

/**
 * |H(e^{i2πf/fs})| of the cascade at each frequency.
 * @param freqsHz frequencies in Hz
 * @param fs sampling rate in Hz
 * @returns magnitudes (linear; 20·log10 for dB)
 * @example sosfreqz(butter(4, 10, { fs: 1000 }), [10], 1000) // [0.7071…]
 * Source: SciPy 1.17 sosfreqz (product of the sections' responses).
 */
export function sosfreqz(sos: Sos, freqsHz: ArrayLike<number>, fs: number): Float64Array {
  const n = checkSos(sos);
  const out = new Float64Array(freqsHz.length);
  for (let i = 0; i < freqsHz.length; i++) {
    const w = (2 * Math.PI * freqsHz[i]) / fs;
    // z^-1 = e^{-iw}, z^-2 = e^{-2iw}
    const c1 = Math.cos(w), s1 = -Math.sin(w), c2 = Math.cos(2 * w), s2 = -Math.sin(2 * w);
    let mag = 1;
    for (let s = 0; s < n; s++) {
      const o = s * 6;
      const nr = sos[o] + sos[o + 1] * c1 + sos[o + 2] * c2, ni = sos[o + 1] * s1 + sos[o + 2] * s2;
      const dr = sos[o + 3] + sos[o + 4] * c1 + sos[o + 5] * c2, di = sos[o + 4] * s1 + sos[o + 5] * s2;
      mag *= Math.hypot(nr, ni) / Math.hypot(dr, di);
    }
    out[i] = mag;
  }
  return out;
}
