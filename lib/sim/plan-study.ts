// From a simulation spec to fully designed recordings (reference, rest, one field recording per
// condition for each worker) and the job file that analyses them. Pure: no files, no samples.
import { Xoshiro128 } from '../stats/xoshiro128.js';
import { InputError } from '../errors.js';
import { secondsToSamples } from '../dsp/seconds-to-samples.js';
import { simMsg } from '../messages.js';
import { deriveSeed } from './derive-seed.js';
import { designEnvelope, type PlannedSegment } from './design-envelope.js';
import { designReferenceEnvelope } from './design-reference-envelope.js';
import type { ChannelDesign, RecordingDesign } from './recording-design.js';
import { SIM_DEFAULTS, type ArtifactSpec, type SimulationSpec, type WorkerSpec } from './simulation-spec.js';

export interface PlanOptions {
  /** Variant name (a key of spec.variants). @default the first variant */
  variant?: string;
  /** Overrides spec.seed. */
  seed?: number;
  /** Overrides spec.output_format. */
  format?: 'edf' | 'csv';
  /** The spec file name (messages only). */
  file?: string;
}

export interface StudyPlan {
  spec: SimulationSpec;
  variant: string;
  seed: number;
  format: 'edf' | 'csv';
  recordings: RecordingDesign[];
}

/**
 * Design every recording of a simulated study.
 * @throws InputError for an unknown variant
 * @example const plan = planStudy(loadSimulationSpec(file), { variant: 'short' })
 */
export function planStudy(spec: SimulationSpec, options: PlanOptions = {}): StudyPlan {
  const file = options.file ?? 'simulation spec';
  const variantNames = Object.keys(spec.variants);
  const variant = options.variant ?? variantNames[0];
  const v = spec.variants[variant];
  if (!v) throw new InputError(simMsg.specUnknownVariant(file, variant, variantNames), { file, where: 'variants' });
  const seed = options.seed ?? spec.seed;
  const format = options.format ?? spec.output_format;
  const fs = spec.sampling_rate_hz;
  const rate = spec.design_rate_hz;
  const recordings: RecordingDesign[] = [];

  for (const w of spec.workers) {
    const base = w.id.toLowerCase();
    // reference contractions
    const ref = designReferenceEnvelope(spec.reference, rate);
    recordings.push({
      file: `${base}-ref.${format}`, kind: 'reference', worker: w.id, condition: null,
      sampling_rate_hz: fs, design_rate_hz: rate, duration_s: ref.duration_s, start: spec.start,
      channels: spec.muscles.map((m) => channel(spec, w, m.id, 'reference', ref.values, [], seed)),
      segments: [],
      annotations: ref.trials.map((t) => ({ onset_s: t.onset_s, duration_s: t.duration_s, text: t.text })),
    });
    // rest (noise floor only)
    const restValues = new Float64Array(secondsToSamples(spec.rest_duration_s, rate) + 1);
    recordings.push({
      file: `${base}-rest.${format}`, kind: 'rest', worker: w.id, condition: null,
      sampling_rate_hz: fs, design_rate_hz: rate, duration_s: spec.rest_duration_s, start: spec.start,
      channels: spec.muscles.map((m) => channel(spec, w, m.id, 'rest', restValues, [], seed)),
      segments: [],
      annotations: [{ onset_s: 0, duration_s: spec.rest_duration_s, text: 'rest' }],
    });
    // field recordings
    for (const c of spec.conditions) {
      const times = cycleTimes(c.cycle.map((s) => ({ label: s.task, duration_s: s.duration_s * v.cycle_scale })), v.duration_s);
      const channels: ChannelDesign[] = spec.muscles.map((m) => {
        const wm = w.muscles[m.id];
        const extra = w.conditions[c.id]?.[m.id] ?? { load: 1, rest: 1 };
        const load = wm.load * extra.load;
        const rest = wm.rest * extra.rest;
        const segs: PlannedSegment[] = times.map((t) => {
          const d = c.tasks[t.label][m.id];
          return { ...t, design: { ...d, level_pct: d.level_pct * load, spread_pct: d.spread_pct * load, gaps_per_min: d.gaps_per_min * rest } };
        });
        const rng = new Xoshiro128(deriveSeed(seed, w.id, c.id, m.id, 'design'));
        const env = designEnvelope(segs, v.duration_s, rate, rng);
        return channel(spec, w, m.id, c.id, env.values, env.gaps, seed);
      });
      recordings.push({
        file: `${base}-${c.id}.${format}`, kind: 'field', worker: w.id, condition: c.id,
        sampling_rate_hz: fs, design_rate_hz: rate, duration_s: v.duration_s, start: spec.start,
        channels,
        segments: times.map((t) => ({ ...t, design: c.tasks[t.label][spec.muscles[0].id] })),
        annotations: times.map((t) => ({ onset_s: t.start_s, duration_s: t.end_s - t.start_s, text: t.label })),
      });
    }
  }
  return { spec, variant, seed, format, recordings };
}

/**
 * Task segments from a repeated cycle: boundaries on whole seconds; the last piece is cut at
 * the duration, and a piece shorter than 10 s is merged into the segment before it.
 */
export function cycleTimes(cycle: { label: string; duration_s: number }[], duration_s: number): { label: string; start_s: number; end_s: number }[] {
  const out: { label: string; start_s: number; end_s: number }[] = [];
  let t = 0;
  for (let j = 0; t < duration_s; j = (j + 1) % cycle.length) {
    const end = Math.min(duration_s, Math.max(t + 1, Math.round(t + cycle[j].duration_s)));
    if (end - t < 10 && out.length > 0) out[out.length - 1].end_s = end;
    else out.push({ label: cycle[j].label, start_s: t, end_s: end });
    t = end;
  }
  return out;
}

function channel(spec: SimulationSpec, w: WorkerSpec, muscleId: string, recKey: string, envelope: Float64Array, gaps: ChannelDesign['gaps'], seed: number): ChannelDesign {
  const m = spec.muscles.find((x) => x.id === muscleId)!;
  const wm = w.muscles[muscleId];
  const artifacts: ArtifactSpec = w.artifacts[recKey]?.[muscleId] ?? {};
  let peak = 0;
  for (let k = 0; k < envelope.length; k++) if (envelope[k] > peak) peak = envelope[k];
  const rms = Math.hypot((peak * wm.mve_uv) / 100, wm.noise_uv, artifacts.amplifier_uv ?? 0);
  const extra = (artifacts.hum?.amplitude_uv ?? 0) + (artifacts.ecg?.amplitude_uv ?? 0) + Math.max(0, ...(artifacts.motion ?? []).map((x) => x.amplitude_uv));
  const range = artifacts.clip_uv ?? Math.ceil((SIM_DEFAULTS.range_factor * rms + extra) / 100) * 100;
  return {
    muscle_id: muscleId, signal: m.signal, muscle: m.muscle, mve_uv: wm.mve_uv, noise_uv: wm.noise_uv,
    envelope, gaps, artifacts, physical_range_uv: Math.max(100, range),
    seed: deriveSeed(seed, w.id, recKey, muscleId, 'noise'),
  };
}
