// Designed load envelope of a field recording (one muscle): per task segment, piecewise-constant
// steps of random durations around the task mean with a designed spread, joined by raised-cosine
// transitions, and designed rest gaps (runs at a near-zero level) placed by the seed. The envelope
// is defined on a regular grid (design rate, e.g. 20 Hz) in %MVE; the synthesizer interpolates it
// linearly to the sampling rate. Known-truth design of our own (common practice for simulation
// tests, no single source).
import type { Xoshiro128 } from '../stats/xoshiro128.js';
import { secondsToSamples } from '../dsp/seconds-to-samples.js';
import type { TaskDesign } from './simulation-spec.js';

/** A task segment to design: [start_s, end_s) with its task design. */
export interface PlannedSegment {
  label: string;
  start_s: number;
  end_s: number;
  design: TaskDesign;
}

/** A designed rest gap, [start_s, end_s), on the design grid. */
export interface DesignedGap { start_s: number; end_s: number }

export interface DesignedEnvelope {
  /** Grid rate, Hz: values[k] is the envelope at k / rate_hz s. */
  rate_hz: number;
  /** %MVE at each grid point; length = duration · rate + 1 (the last point closes the span). */
  values: Float64Array;
  /** The gaps placed in each segment (same order as the segments). */
  gaps: DesignedGap[][];
}

/**
 * Design the %MVE envelope of one muscle over a field recording.
 *
 * Segments must lie in [0, duration_s] and not overlap; grid points outside every segment are 0.
 * Gaps that do not fit (with their separations) are dropped, so read the placed gaps from the
 * result. Consumes `rng` (seed it per worker × recording × muscle).
 *
 * @param segments task segments, s
 * @param duration_s recording duration, s
 * @param rate_hz design grid rate, Hz
 * @param rng seeded generator
 * @example designEnvelope([{ label: 'picking', start_s: 0, end_s: 60, design }], 60, 20, new Xoshiro128(1))
 */
export function designEnvelope(segments: PlannedSegment[], duration_s: number, rate_hz: number, rng: Xoshiro128): DesignedEnvelope {
  const n = secondsToSamples(duration_s, rate_hz) + 1;
  const values = new Float64Array(n);
  const gaps: DesignedGap[][] = [];
  let prev = NaN;
  for (const seg of segments) {
    const d = seg.design;
    const ks = secondsToSamples(seg.start_s, rate_hz);
    const ke = Math.min(secondsToSamples(seg.end_s, rate_hz), n - 1);
    // steps
    let k0 = ks;
    while (k0 < ke) {
      const len = Math.max(1, secondsToSamples(rng.uniform(d.step_s[0], d.step_s[1]), rate_hz));
      const level = Math.min(d.cap_pct, Math.max(d.floor_pct, d.level_pct + d.spread_pct * rng.normal()));
      const from = Number.isNaN(prev) ? level : prev;
      const k1 = Math.min(k0 + len, ke);
      for (let k = k0; k < k1; k++) {
        const tau = (k - k0) / rate_hz;
        values[k] = tau < d.ramp_s ? from + (level - from) * 0.5 * (1 - Math.cos((Math.PI * tau) / d.ramp_s)) : level;
      }
      prev = level;
      k0 = k1;
    }
    gaps.push(placeGaps(values, ks, ke, d, rate_hz, rng));
  }
  values[n - 1] = n > 1 ? values[n - 2] : 0;
  return { rate_hz, values, gaps };
}

function placeGaps(values: Float64Array, ks: number, ke: number, d: TaskDesign, rate_hz: number, rng: Xoshiro128): DesignedGap[] {
  let count = Math.round((d.gaps_per_min * (ke - ks)) / rate_hz / 60);
  if (count <= 0) return [];
  const lens: number[] = [];
  for (let j = 0; j < count; j++) lens.push(Math.max(1, secondsToSamples(rng.uniform(d.gap_s[0], d.gap_s[1]), rate_hz)));
  const sep = Math.ceil(d.gap_separation_s * rate_hz);
  const free = () => ke - ks - lens.reduce((a, b) => a + b, 0) - (count + 1) * sep;
  while (count > 0 && free() < 0) { count--; lens.pop(); }
  if (count === 0) return [];
  const spare = free();
  const w: number[] = [];
  for (let j = 0; j <= count; j++) w.push(rng.random() + 1e-3);
  const wsum = w.reduce((a, b) => a + b, 0);
  const out: DesignedGap[] = [];
  let k = ks + sep + Math.floor((spare * w[0]) / wsum);
  for (let j = 0; j < count; j++) {
    const k1 = k + lens[j];
    values.fill(d.gap_level_pct, k, k1);
    out.push({ start_s: k / rate_hz, end_s: k1 / rate_hz });
    k = k1 + sep + Math.floor((spare * w[j + 1]) / wsum);
  }
  return out;
}
