// Known-truth test signals for the fatigue analysis (invented data, test use only).
//
// spectralShiftSignal: a sum of sinusoids ("lines") whose frequencies are all scaled by the same
// slowly falling factor s(t) = 1 − c·t (t in min), times an amplitude A(t) = a0 + a1·t:
//   x(t) = A(t) · Σ_i √(2·P_i) · cos(φ_i + 2π·f_i·τ(t)),  τ(t) = ∫₀ᵗ s(u) du = t − c·t²/2
// (τ and t in consistent units). Line i has instantaneous frequency f_i·s(t) and power P_i·A(t)²,
// so the power-weighted mean frequency of the signal at time t is exactly
//   MNF(t) = s(t) · F0,  F0 = Σ P_i f_i / Σ P_i,
// i.e. MNF falls linearly at dMNF/dt = −c·F0 Hz/min (the compression of the whole spectrum seen
// with fatigue), and the RMS is A(t)·√ΣP_i. Within a 1-s Hann epoch a line moves by f·c/60 Hz —
// far below a bin — and the chirp is symmetric about the epoch centre, so the epoch MNF equals the
// design at the centre up to leakage between lines (lines ≥ 4 Hz apart, beyond the ±2-bin Hann
// main lobe). Phases are drawn from a seeded generator (lib/stats/xoshiro128.ts).
import { Xoshiro128 } from '../../lib/stats/xoshiro128.js';
import { butter } from '../../lib/dsp/butter.js';
import { sosfilt } from '../../lib/dsp/sosfilt.js';

export interface ShiftDesign {
  fs: number;
  duration_s: number;
  /** Line frequencies at t = 0, Hz. */
  lines_hz: number[];
  /** Relative line powers (normalized so that Σ P_i = 1, i.e. RMS = A(t)). */
  powers: number[];
  /** Spectral compression rate c, fraction per minute (s(t) = 1 − c·t). */
  compression_per_min: number;
  /** A(t) = a0 + a1·t (t in min), µV RMS. */
  a0_uv: number;
  a1_uv_per_min: number;
  seed: number;
}

/** F0 = Σ P_i f_i / Σ P_i, the MNF at t = 0, Hz. */
export function designedMnf0(d: ShiftDesign): number {
  let num = 0, den = 0;
  d.lines_hz.forEach((f, i) => { num += d.powers[i]! * f; den += d.powers[i]!; });
  return num / den;
}

/** The designed MNF slope, Hz per minute: −c·F0. */
export function designedMnfSlope(d: ShiftDesign): number {
  return -d.compression_per_min * designedMnf0(d);
}

/** Lines every `step` Hz from lo to hi with powers shaped as a triangle peaking at the centre (symmetric, so F0 = (lo+hi)/2). */
export function triangleLines(lo: number, hi: number, step: number): { lines_hz: number[]; powers: number[] } {
  const lines_hz: number[] = [], powers: number[] = [];
  const c = (lo + hi) / 2, half = (hi - lo) / 2 + step;
  for (let f = lo; f <= hi + 1e-9; f += step) { lines_hz.push(f); powers.push(1 - Math.abs(f - c) / half); }
  const s = powers.reduce((a, b) => a + b, 0);
  return { lines_hz, powers: powers.map((p) => p / s) };
}

/** The whole signal (µV) of a design. */
export function spectralShiftSignal(d: ShiftDesign): Float64Array {
  const n = Math.round(d.duration_s * d.fs);
  const x = new Float64Array(n);
  const rng = new Xoshiro128(d.seed);
  const c = d.compression_per_min / 60; // per second
  for (let i = 0; i < d.lines_hz.length; i++) {
    const a = Math.sqrt(2 * d.powers[i]!), w = 2 * Math.PI * d.lines_hz[i]!, phi = 2 * Math.PI * rng.random();
    for (let k = 0; k < n; k++) {
      const t = k / d.fs;
      x[k] += a * Math.cos(phi + w * (t - (c * t * t) / 2));
    }
  }
  for (let k = 0; k < n; k++) x[k] *= d.a0_uv + (d.a1_uv_per_min * k) / d.fs / 60;
  return x;
}

/** Stationary band-limited Gaussian noise (µV): N(0, 1) from Xoshiro128 through a 4th-order Butterworth band-pass (causal). */
export function stationaryNoise(fs: number, duration_s: number, band_hz: [number, number], rms_uv: number, seed: number): Float64Array {
  const rng = new Xoshiro128(seed);
  const n = Math.round(duration_s * fs);
  const w = new Float64Array(n);
  for (let k = 0; k < n; k++) w[k] = rng.normal();
  const y = sosfilt(butter(4, band_hz, { btype: 'bandpass', fs }), w);
  let s2 = 0;
  for (let k = 0; k < n; k++) s2 += y[k]! * y[k]!;
  const g = rms_uv / Math.sqrt(s2 / n);
  for (let k = 0; k < n; k++) y[k] = y[k]! * g;
  return y;
}
