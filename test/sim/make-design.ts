// Test helper: a one-channel recording design built directly (no spec), for synthesizer tests.
import type { ArtifactSpec } from '../../lib/sim/simulation-spec.js';
import type { RecordingDesign } from '../../lib/sim/recording-design.js';

export function makeDesign(o: { fs: number; duration_s: number; envelope: Float64Array; rate_hz: number; mve_uv?: number; noise_uv?: number; artifacts?: ArtifactSpec; range_uv?: number; seed?: bigint }): RecordingDesign {
  return {
    file: 'test.csv', kind: 'field', worker: 'W1', condition: 'c', sampling_rate_hz: o.fs, design_rate_hz: o.rate_hz,
    duration_s: o.duration_s, start: '2026-01-01T08:00:00', segments: [], annotations: [],
    channels: [{
      muscle_id: 'm', signal: 'EMG test', muscle: 'test muscle', mve_uv: o.mve_uv ?? 400, noise_uv: o.noise_uv ?? 0,
      envelope: o.envelope, gaps: [], artifacts: o.artifacts ?? {}, physical_range_uv: o.range_uv ?? 1e6, seed: o.seed ?? 11n,
    }],
  };
}

/** Envelope grid from [duration_s, level_pct] steps. */
export function stepEnvelope(rate_hz: number, steps: [number, number][]): Float64Array {
  const total = steps.reduce((a, s) => a + s[0], 0);
  const v = new Float64Array(Math.round(total * rate_hz) + 1);
  let k = 0;
  for (const [d, level] of steps) { const n = Math.round(d * rate_hz); v.fill(level, k, k + n); k += n; }
  v[v.length - 1] = v[v.length - 2];
  return v;
}

/** Power of x at frequency f (single-bin DFT, normalised to the sinusoid amplitude²/2 scale). */
export function tonePower(x: Float64Array, fs: number, f: number, start = 0, end = x.length): number {
  let re = 0, im = 0;
  for (let i = start; i < end; i++) { const ph = (2 * Math.PI * f * i) / fs; re += x[i] * Math.cos(ph); im += x[i] * Math.sin(ph); }
  const n = end - start;
  return (2 * (re * re + im * im)) / (n * n);
}
