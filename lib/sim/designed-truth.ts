// truth.json: the values designed into a simulated study, computed from the designed envelopes
// (never by running the analysis), so the analysis can be checked against them.
import { secondsToSamples } from '../dsp/seconds-to-samples.js';
import { percentiles } from '../exposure/percentile.js';
import type { StudyPlan } from './plan-study.js';
import type { ChannelDesign, RecordingDesign } from './recording-design.js';
import { SIM_DEFAULTS } from './simulation-spec.js';

/** What "designed" means, written into truth.json. */
export const DESIGNED_MEANING =
  'Designed values are computed from the designed EMG envelope a(t) in %MVE (EMG only, without the ' +
  'noise floor and artifacts) sampled on the design grid, never by analysing the generated samples. ' +
  'An analysis with a short RMS window, the same envelope rate, noise correction and MVE normalization ' +
  'should reproduce them within random error: the generated signal is Gaussian noise whose RMS follows ' +
  'sqrt(a^2 + noise^2), so a 0.1 s RMS window scatters by roughly ±7 % around a(t), and an MVE taken ' +
  'as the highest 1 s moving RMS lands a few percent above the designed MVE. Designed gaps are found ' +
  'as designed only while the noise floor is well below the gap threshold in µV (threshold × MVE / 100); ' +
  'with noise near the threshold, noise-corrected gaps break up or vanish.';

export interface TruthSettings {
  /** Percentiles to report (0–100). @default [10, 50, 90] */
  percentiles: number[];
  /** Rest/gap threshold, %MVE. @default 0.5 */
  gap_threshold_pct: number;
  /** Shortest run below the threshold that is a gap, s. @default 0.2 */
  gap_min_s: number;
}

export interface SegmentTruth {
  label: string;
  start_s: number;
  end_s: number;
  /** Percentile name ("p10") → %MVE. */
  percentiles_pct: Record<string, number>;
  gaps: number;
  gaps_per_min: number;
  rest_pct: number;
  /** Longest run of the segment without a gap (above-threshold time between gaps or edges), s. */
  longest_without_gap_s: number;
  /** The gaps placed in the design, s. */
  designed_gaps: { start_s: number; end_s: number }[];
}

/**
 * Summary of a run of designed-envelope values: percentiles, gaps (runs below the threshold of at
 * least gap_min_s, counted on the grid), gaps/min, % rest (all below-threshold time) and the
 * longest time without a gap.
 * @param values %MVE on the design grid
 * @param start first grid index (inclusive) @param end last grid index (exclusive)
 * @param rate_hz grid rate, Hz
 */
export function summarizeDesigned(values: Float64Array, start: number, end: number, rate_hz: number, s: TruthSettings):
  Omit<SegmentTruth, 'label' | 'start_s' | 'end_s' | 'designed_gaps'> {
  const percentiles_pct: Record<string, number> = {};
  const ps = percentiles(values.subarray(start, end), s.percentiles);
  s.percentiles.forEach((p, i) => { percentiles_pct[`p${p}`] = ps[i]; });
  const minRun = s.gap_min_s * rate_hz - 1e-9;
  let gaps = 0, below = 0, run = 0, sinceGap = 0, longest = 0;
  for (let k = start; k <= end; k++) {
    const low = k < end && values[k] < s.gap_threshold_pct;
    if (low) { run++; below++; continue; }
    if (run > 0) {
      if (run >= minRun) { gaps++; longest = Math.max(longest, sinceGap); sinceGap = 0; }
      else sinceGap += run;
      run = 0;
    }
    if (k < end) sinceGap++;
  }
  longest = Math.max(longest, sinceGap);
  const n = end - start;
  const minutes = n / rate_hz / 60;
  return { percentiles_pct, gaps, gaps_per_min: minutes > 0 ? gaps / minutes : 0, rest_pct: n > 0 ? (100 * below) / n : 0, longest_without_gap_s: longest / rate_hz };
}

/**
 * The truth document of a planned study.
 * @example writeAtomic('out/truth.json', stableJson(designedTruth(plan, settings, shaper.describe)))
 */
export function designedTruth(plan: StudyPlan, settings: Partial<TruthSettings>, noiseModel: string): object {
  const s: TruthSettings = {
    percentiles: settings.percentiles ?? SIM_DEFAULTS.percentiles,
    gap_threshold_pct: settings.gap_threshold_pct ?? SIM_DEFAULTS.gap_threshold_pct,
    gap_min_s: settings.gap_min_s ?? SIM_DEFAULTS.gap_min_s,
  };
  const workers = plan.spec.workers.map((w) => {
    const recs = plan.recordings.filter((r) => r.worker === w.id);
    return {
      id: w.id,
      muscles: plan.spec.muscles.map((m) => ({ signal: m.signal, muscle: m.muscle, mve_uv: w.muscles[m.id].mve_uv, noise_uv: w.muscles[m.id].noise_uv })),
      reference: recs.filter((r) => r.kind === 'reference').map((r) => ({ file: r.file, annotations: r.annotations }))[0],
      rest: recs.filter((r) => r.kind === 'rest').map((r) => ({ file: r.file, annotations: r.annotations }))[0],
      recordings: recs.filter((r) => r.kind === 'field').map((r) => ({
        file: r.file,
        condition: r.condition,
        duration_s: r.duration_s,
        channels: r.channels.map((c) => channelTruth(r, c, s)),
      })),
    };
  });
  return {
    format: 'shiftload-simulation-truth/1',
    title: plan.spec.title,
    variant: plan.variant,
    seed: plan.seed,
    designed_means: DESIGNED_MEANING,
    envelope: { unit: '%MVE', grid_rate_hz: plan.spec.design_rate_hz, interpolation: 'linear between grid points' },
    percentile_convention: 'linear interpolation between order statistics (numpy default), on the design grid',
    gap_threshold_pct: s.gap_threshold_pct,
    gap_min_s: s.gap_min_s,
    rest_pct_counts: 'all grid time below the gap threshold',
    noise_model: noiseModel,
    artifacts_note: 'artifacts (hum, ECG, motion, drop-out, clipping, amplifier noise) are not in the designed envelope; where a recording has them the analysis is expected to differ or to report findings',
    workers,
  };
}

function channelTruth(r: RecordingDesign, c: ChannelDesign, s: TruthSettings) {
  const rate = r.design_rate_hz;
  const idx = (t: number) => secondsToSamples(t, rate);
  const segments: SegmentTruth[] = r.segments.map((seg, i) => ({
    label: seg.label, start_s: seg.start_s, end_s: seg.end_s,
    ...summarizeDesigned(c.envelope, idx(seg.start_s), idx(seg.end_s), rate, s),
    designed_gaps: c.gaps[i] ?? [],
  }));
  // per task: all segments of a label pooled
  const labels = [...new Set(r.segments.map((x) => x.label))];
  const tasks = labels.map((label) => {
    const parts = r.segments.filter((x) => x.label === label);
    const total = parts.reduce((a, x) => a + idx(x.end_s) - idx(x.start_s), 0);
    const pooled = new Float64Array(total);
    let o = 0;
    for (const x of parts) { pooled.set(c.envelope.subarray(idx(x.start_s), idx(x.end_s)), o); o += idx(x.end_s) - idx(x.start_s); }
    const segs = segments.filter((x) => x.label === label);
    const gaps = segs.reduce((a, x) => a + x.gaps, 0);
    const below = segs.reduce((a, x) => a + (x.rest_pct / 100) * (idx(x.end_s) - idx(x.start_s)), 0);
    const percentiles_pct: Record<string, number> = {};
    const ps = percentiles(pooled, s.percentiles);
    s.percentiles.forEach((p, i) => { percentiles_pct[`p${p}`] = ps[i]; });
    return {
      label, segments: parts.length, duration_s: total / rate, percentiles_pct, gaps,
      gaps_per_min: total > 0 ? gaps / (total / rate / 60) : 0, rest_pct: total > 0 ? (100 * below) / total : 0,
      longest_without_gap_s: Math.max(...segs.map((x) => x.longest_without_gap_s)),
    };
  });
  return { signal: c.signal, muscle: c.muscle, mve_uv: c.mve_uv, noise_uv: c.noise_uv, physical_range_uv: c.physical_range_uv, tasks, segments };
}
