// Test helpers: a simulated trapezius channel (lib/sim synthesizer: band-limited Gaussian noise
// with a realistic, seeded amplitude profile) with defects injected at known times, and a runner
// that feeds it through a QualityTap the way the analysis does (raw chunks, then band-passed).
import { BandFilter } from '../../lib/dsp/band-filter.js';
import { QualityTap, type ChannelQuality, type QualityTapOptions } from '../../lib/quality/quality-tap.js';
import { butterShaper } from '../../lib/sim/butter-shaper.js';
import { RecordingSynthesizer } from '../../lib/sim/recording-synthesizer.js';
import type { ArtifactSpec } from '../../lib/sim/simulation-spec.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';
import { makeDesign } from '../sim/make-design.js';

/**
 * A realistic amplitude profile (%MVE on a 10 Hz grid): steps of 2–8 s whose levels are
 * log-uniform between 0.3 and 40 %MVE, about one step in five a rest near 0.2 %MVE.
 */
export function profile(seed: number, duration_s: number, rate_hz = 10): Float64Array {
  const rng = new SplitMix64(seed);
  const v = new Float64Array(Math.round(duration_s * rate_hz) + 1);
  let k = 0;
  while (k < v.length) {
    const len = Math.round((2 + 6 * rng.random()) * rate_hz);
    const level = rng.random() < 0.2 ? 0.2 : 0.3 * Math.exp(Math.log(40 / 0.3) * rng.random());
    v.fill(level, k, Math.min(v.length, k + len));
    k += len;
  }
  return v;
}

export interface SimOptions {
  fs: number;
  duration_s: number;
  seed: number;
  artifacts?: ArtifactSpec;
  /** Designed MVE, µV RMS. @default 400 */
  mve_uv?: number;
  /** Designed noise floor, µV RMS. @default 3 */
  noise_uv?: number;
  /** Constant envelope (%MVE) instead of the seeded profile. */
  level_pct?: number;
}

/** One simulated channel, µV (whole array; test signals are minutes long). */
export function simulate(o: SimOptions): Float64Array {
  const rate = 10;
  const env = o.level_pct === undefined ? profile(o.seed, o.duration_s, rate) : new Float64Array(Math.round(o.duration_s * rate) + 1).fill(o.level_pct);
  const design = makeDesign({
    fs: o.fs, duration_s: o.duration_s, envelope: env, rate_hz: rate, mve_uv: o.mve_uv ?? 400, noise_uv: o.noise_uv ?? 3,
    artifacts: o.artifacts ?? {}, seed: BigInt(o.seed) * 7919n + 13n,
  });
  const syn = new RecordingSynthesizer(design, butterShaper([20, Math.min(450, 0.45 * o.fs)], 4, o.fs));
  const x = new Float64Array(syn.totalSamples);
  while (syn.remaining > 0) {
    const at = syn.position;
    const part = syn.next(Math.min(65536, syn.remaining));
    x.set(part[0], at);
  }
  return x;
}

/** Add a mains hum of peak amplitude A µV at f Hz over [t0, t1) s (in place). */
export function addHum(x: Float64Array, fs: number, f: number, A: number, t0: number, t1: number): void {
  for (let i = Math.round(t0 * fs); i < Math.min(x.length, Math.round(t1 * fs)); i++) x[i] += A * Math.sin((2 * Math.PI * f * i) / fs + 0.3);
}

/**
 * Run a QualityTap over x in chunks the way readEnvelopes does: raw chunk, then the band-passed
 * output of the analysis filter (zero-phase Butterworth band-pass, default 30–400 Hz).
 */
export function runTap(x: Float64Array, options: QualityTapOptions, chunk = 4096, band: [number, number] = [30, 400]): ChannelQuality {
  const tap = new QualityTap(options);
  const bf = new BandFilter({ fs: options.fs, band_hz: [band[0], Math.min(band[1], 0.45 * options.fs)], order: 4, mains_hz: null });
  for (let i = 0; i < x.length; i += chunk) {
    const c = x.subarray(i, Math.min(x.length, i + chunk));
    tap.raw(c, i);
    const y = bf.push(c);
    if (y.length > 0) tap.filtered(y);
  }
  const y = bf.flush();
  if (y.length > 0) tap.filtered(y);
  return tap.finish();
}
