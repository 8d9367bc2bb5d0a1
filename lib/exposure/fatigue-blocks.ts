// After a recording has streamed: its spectral epochs (µV) are noise-corrected, normalized, marked
// active or not, and cut into time blocks and task segments, each with its amplitude and MNF trends
// and JASA category; plus the per-minute MNF series for the report chart.
import { median } from '../stats/median.js';
import type { FatigueBlock, FatigueSeries, LoadUnit } from '../study/results.js';
import { fatigueText } from '../messages.js';
import type { FatigueSettings } from './fatigue-settings.js';
import { fatigueTrend, type EpochValues, type FatigueTrend } from './fatigue-trend.js';
import { noiseCorrect } from './noise-correct.js';
import type { SpectralEpochSeries } from './spectral-epochs.js';

/** Who and what the epochs belong to, and the levels used to normalize them. */
export interface FatigueChannelContext {
  worker: string;
  condition: string;
  muscle: string;
  signal: string;
  recording: string;
  /** Duration of the recording, s (time blocks tile [0, duration_s)). */
  duration_s: number;
  /** The study's load unit. */
  unit: LoadUnit;
  /** Reference amplitude, µV (after noise correction); null = not normalizing, or missing. */
  reference_uv: number | null;
  /** Noise RMS, µV; null = not known / not corrected. */
  noise_uv: number | null;
  segments: readonly { label: string; start_s: number; end_s: number }[];
}

export interface FatigueChannelResult {
  blocks: FatigueBlock[];
  series: FatigueSeries;
  /** The epoch values used (normalized amplitude and active flags), for tests and further use. */
  values: EpochValues;
}

/** Fewest active epochs for a point of the chart series. */
const SERIES_MIN_EPOCHS = 5;

const orNull = (v: number) => (Number.isFinite(v) ? v : null);

/**
 * Fatigue trends of one channel of one recording.
 * Amplitude per epoch: noiseCorrect(rms, noise) (when noise is known), divided by reference_uv and
 * times 100 when normalizing (unit = the study's unit); µV when unit is 'uV'; NaN when normalizing
 * without a reference. Active epoch: amplitude ≥ active_threshold_pct (only with a reference) and
 * rms ≥ active_noise_factor × noise (only with a noise level); the rule is written into each block.
 * Time blocks tile [0, duration_s) by block_s (the last may be shorter); one more block per task
 * segment instance. Each block: fatigueTrend (least squares per minute, 95 % t intervals, JASA).
 * @example fatigueBlocks(tap.result(), { worker: 'W1', …, reference_uv: 412, noise_uv: 2.1 }, settings)
 * Source: METHODS.md §6 (JASA, Luttmann et al. 2000) and §7 (MNF, epochs).
 */
export function fatigueBlocks(epochs: SpectralEpochSeries, ctx: FatigueChannelContext, settings: FatigueSettings): FatigueChannelResult {
  const n = epochs.t_s.length;
  const normalizing = ctx.unit !== 'uV';
  const ref = normalizing ? ctx.reference_uv : null;
  const amplitude = new Float64Array(n);
  const active = new Uint8Array(n);
  const noise = ctx.noise_uv;
  const noiseFloor = noise !== null && noise > 0 ? settings.active_noise_factor * noise : -Infinity;
  for (let i = 0; i < n; i++) {
    const rms = epochs.rms_uv[i]!;
    const corrected = noise === null ? rms : noiseCorrect(rms, noise);
    const amp = !normalizing ? corrected : ref === null ? NaN : (100 * corrected) / ref;
    amplitude[i] = amp;
    const byLevel = ref === null || amp >= settings.active_threshold_pct;
    active[i] = Number.isFinite(rms) && rms > 0 && rms >= noiseFloor && byLevel ? 1 : 0;
  }
  const values: EpochValues = { t_s: epochs.t_s, amplitude, mnf_hz: epochs.mnf_hz, mdf_hz: epochs.mdf_hz, active };
  const rule = fatigueText.activeRule(ref === null ? null : settings.active_threshold_pct, ctx.unit,
    noise !== null && noise > 0 ? settings.active_noise_factor : null, noise);
  const slopeUnit = `${ctx.unit}/min`;

  const blocks: FatigueBlock[] = [];
  const add = (segment: string | null, start_s: number, end_s: number) => {
    const tr: FatigueTrend = fatigueTrend(values, start_s, end_s, { min_epochs: settings.min_epochs, confidence: 0.95 });
    blocks.push({
      worker: ctx.worker, condition: ctx.condition, muscle: ctx.muscle, signal: ctx.signal, recording: ctx.recording,
      segment, start_s, end_s, epochs: tr.epochs, epochs_total: tr.epochs_total,
      amplitude_unit: ctx.unit, amplitude_slope_unit: slopeUnit,
      amplitude_mean: orNull(tr.amplitude_mean), amplitude_slope_per_min: orNull(tr.amplitude_slope_per_min),
      amplitude_ci_low: orNull(tr.amplitude_ci_low), amplitude_ci_high: orNull(tr.amplitude_ci_high),
      mnf_mean_hz: orNull(tr.mnf_mean_hz), mnf_slope_hz_per_min: orNull(tr.mnf_slope_hz_per_min),
      mnf_ci_low: orNull(tr.mnf_ci_low), mnf_ci_high: orNull(tr.mnf_ci_high),
      mdf_mean_hz: orNull(tr.mdf_mean_hz), mdf_slope_hz_per_min: orNull(tr.mdf_slope_hz_per_min),
      category: tr.category, ci_level: 0.95, active_rule: rule,
    });
  };
  const B = settings.block_s;
  for (let k = 0; k * B < ctx.duration_s; k++) add(null, k * B, Math.min((k + 1) * B, ctx.duration_s));
  for (const sg of ctx.segments) add(sg.label, sg.start_s, sg.end_s);

  return { blocks, series: fatigueSeries(values, ctx, settings.series_step_s), values };
}

/**
 * Medians of MNF, MDF and amplitude over the active epochs of each step of `step_s` (null where a
 * step has fewer than 5 active epochs with a finite MNF).
 * @example fatigueSeries(values, ctx, 60).mnf_hz // one value per minute
 */
export function fatigueSeries(v: EpochValues, ctx: FatigueChannelContext, step_s: number): FatigueSeries {
  const steps = Math.max(0, Math.ceil(ctx.duration_s / step_s - 1e-9));
  const mnf: (number | null)[] = new Array(steps).fill(null);
  const mdf: (number | null)[] = new Array(steps).fill(null);
  const amp: (number | null)[] = new Array(steps).fill(null);
  const count: number[] = new Array(steps).fill(0);
  const n = v.t_s.length;
  const bf = new Float64Array(n), bd = new Float64Array(n), ba = new Float64Array(n);
  let i = 0;
  for (let k = 0; k < steps; k++) {
    const end = (k + 1) * step_s;
    let m = 0;
    while (i < n && v.t_s[i]! < end) {
      if (v.active[i] === 1 && Number.isFinite(v.mnf_hz[i]!)) { bf[m] = v.mnf_hz[i]!; bd[m] = v.mdf_hz[i]!; ba[m] = v.amplitude[i]!; m++; }
      i++;
    }
    count[k] = m;
    if (m >= SERIES_MIN_EPOCHS) {
      mnf[k] = orNull(median(bf.subarray(0, m)));
      mdf[k] = orNull(median(bd.subarray(0, m)));
      amp[k] = orNull(median(ba.subarray(0, m)));
    }
  }
  return {
    worker: ctx.worker, condition: ctx.condition, muscle: ctx.muscle, signal: ctx.signal, recording: ctx.recording,
    step_s, amplitude_unit: ctx.unit, mnf_hz: mnf, mdf_hz: mdf, amplitude: amp, active_epochs: count,
    segments: ctx.segments.map((s) => ({ label: s.label, start_s: s.start_s, end_s: s.end_s })),
  };
}
