// End-to-end check of the simulator's claim: an RMS envelope of the generated samples, noise-
// corrected and normalized by the designed MVE, reproduces the designed per-segment values.
import { describe, expect, it } from 'vitest';
import { percentiles } from '../../lib/exposure/percentile.js';
import { restGaps } from '../../lib/exposure/rest-gaps.js';
import { designedTruth } from '../../lib/sim/designed-truth.js';
import { parseSimulationSpec } from '../../lib/sim/load-simulation-spec.js';
import { whiteShaper, type NoiseShaper } from '../../lib/sim/noise-shaper.js';
import { butterShaper } from '../../lib/sim/butter-shaper.js';
import { planStudy } from '../../lib/sim/plan-study.js';
import { RecordingSynthesizer } from '../../lib/sim/recording-synthesizer.js';
import { TINY_SPEC } from './tiny-spec.js';

/** 0.1 s moving RMS centred on k / 20 s, noise-corrected, in %MVE. */
function envelopePct(x: Float64Array, fs: number, mve: number, noise: number): Float64Array {
  const half = Math.round(0.05 * fs);
  const n = Math.floor(x.length / (fs / 20));
  const out = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const c = Math.round((k * fs) / 20);
    const a = Math.max(0, c - half), b = Math.min(x.length, c + half);
    let s = 0;
    for (let i = a; i < b; i++) s += x[i] * x[i];
    out[k] = (100 * Math.sqrt(Math.max(s / (b - a) - noise * noise, 0))) / mve;
  }
  return out;
}

export function checkKnownTruth(shaper: NoiseShaper, sigma: number): void {
  const spec = parseSimulationSpec(TINY_SPEC.replace('duration_s: 180, cycle_scale: 2', 'duration_s: 600, cycle_scale: 4'), 'tiny.yaml');
  const plan = planStudy(spec, { variant: 'long', seed: 21 });
  const truth = designedTruth(plan, {}, shaper.describe) as { workers: { recordings: { channels: { segments: { start_s: number; end_s: number; gaps: number; percentiles_pct: Record<string, number> }[] }[] }[] }[] };
  let designedGaps = 0, measuredGaps = 0, checked = 0, ratioSum = 0;
  plan.recordings.filter((r) => r.kind === 'field').forEach((rec) => {
    const wi = plan.spec.workers.findIndex((w) => w.id === rec.worker);
    const tr = truth.workers[wi].recordings.find((_, i) => plan.recordings.filter((r) => r.worker === rec.worker && r.kind === 'field')[i] === rec)!;
    const syn = new RecordingSynthesizer(rec, shaper);
    const data = syn.next(syn.totalSamples);
    rec.channels.forEach((c, ci) => {
      if (c.artifacts.dropout) return; // artifacts are outside the designed envelope
      const env = envelopePct(data[ci], rec.sampling_rate_hz, c.mve_uv, c.noise_uv);
      for (const seg of tr.channels[ci].segments) {
        const part = env.subarray(seg.start_s * 20, seg.end_s * 20);
        const [p10, p50, p90] = percentiles(part, [10, 50, 90]);
        // a 0.1 s RMS of 50 samples scatters by ≈ ±10 % around a(t); percentiles of many such
        // values stay within a few percent of the designed ones (known truth, tolerance stated here)
        // A 0.1 s RMS scatters around a(t) with relative SD σ ≈ 1/√(2·B·T) (≈ 0.1 for 50 white
        // samples; ≈ 0.12 for 20–200 Hz noise); the median is unbiased, the 10th/90th percentiles of
        // a flat segment move by ≈ 1.3 σ, and a short segment of few steps can move its median
        // when the scatter smears neighbouring step levels. Tolerances (known truth, stated here):
        // each percentile within 2.5 σ·p50 + 5 %; the p50 ratio averaged over segments within 3 %.
        const p = seg.percentiles_pct;
        expect(Math.abs(p50 - p.p50)).toBeLessThan(2.5 * sigma * p.p50 + 0.05 * p.p50);
        ratioSum += p50 / p.p50;
        expect(Math.abs(p90 - p.p90)).toBeLessThan(2.5 * sigma * p.p50 + 0.05 * p.p90);
        expect(Math.abs(p10 - p.p10)).toBeLessThan(2.5 * sigma * p.p50 + 0.05 * p.p10);
        measuredGaps += restGaps(part, { rate_hz: 20, threshold: 0.5, min_gap_s: 0.2 }).gaps;
        designedGaps += seg.gaps;
        checked++;
      }
    });
  });
  expect(checked).toBeGreaterThan(20);
  expect(Math.abs(ratioSum / checked - 1)).toBeLessThan(0.03);
  expect(designedGaps).toBeGreaterThan(40);
  // gaps found on the measured envelope: within 5 % of the designed count over the whole study
  expect(Math.abs(measuredGaps / designedGaps - 1)).toBeLessThan(0.05);
}

describe('simulated recordings reproduce their designed truth', () => {
  it('white noise: moving-RMS envelope percentiles and gap counts match truth.json values', () => {
    checkKnownTruth(whiteShaper, 0.1);
  });

  it('Butterworth 20–200 Hz noise at 500 Hz (the spec\'s model): the same claims hold', () => {
    // σ ≈ 1/√(2·B·T) with B = 180 Hz, T = 0.1 s → 0.12
    checkKnownTruth(butterShaper([20, 200], 4, 500), 0.12);
  });
});
