// `simulate`: a simulation spec → recordings (EDF+ or CSV), job.yaml and truth.json in a folder.
// The orchestrator only composes: plan (pure design) → write each recording (streamed samples)
// → job file and designed truth.
import { existsSync, mkdirSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { InputError } from '../errors.js';
import { msg, simMsg } from '../messages.js';
import { writeAtomic } from '../io/write-atomic.js';
import { stableJson } from '../study/stable-json.js';
import { designedTruth, type TruthSettings } from './designed-truth.js';
import { jobYaml } from './job-document.js';
import type { NoiseShaper } from './noise-shaper.js';
import { planStudy, type StudyPlan } from './plan-study.js';
import type { RecordingDesign } from './recording-design.js';
import type { SimulationSpec } from './simulation-spec.js';
import { writeSimulatedCsv } from './write-simulated-csv.js';
import { writeSimulatedEdf } from './write-simulated-edf.js';
import { butterShaper } from './butter-shaper.js';

export interface SimulateOptions {
  /** Variant of the spec. @default the first one */
  variant?: string;
  /** Overrides the spec's seed. */
  seed?: number;
  /** Overrides the spec's output format. */
  format?: 'edf' | 'csv';
  /** Spectral shaping. @default butterShaper(spec.noise_band_hz, spec.noise_order, fs) */
  shaper?: NoiseShaper;
  /** Allow writing into a non-empty folder. @default false */
  force?: boolean;
  /** Spec file name for messages. */
  file?: string;
  /** Called after each recording is written. */
  onRecording?: (done: number, total: number, file: string) => void;
}

export interface SimulateResult {
  outDir: string;
  jobPath: string;
  truthPath: string;
  /** Recording files written (full paths). */
  files: string[];
  /** Samples generated (all channels). */
  samples: number;
  plan: StudyPlan;
}

/**
 * Generate a simulated study into `outDir`.
 * @throws InputError when outDir exists, is not empty and force is not set, or the spec is bad
 * @example await simulate(loadSimulationSpec('sim.yaml'), 'out', { seed: 7 })
 */
export async function simulate(spec: SimulationSpec, outDir: string, options: SimulateOptions = {}): Promise<SimulateResult> {
  const plan = planStudy(spec, { variant: options.variant, seed: options.seed, format: options.format, file: options.file });
  prepareFolder(outDir, options.force ?? false);
  const shaper = options.shaper ?? butterShaper(spec.noise_band_hz, spec.noise_order, spec.sampling_rate_hz);
  const files: string[] = [];
  let samples = 0;
  for (const rec of plan.recordings) {
    const path = join(outDir, rec.file);
    writeRecording(rec, path, shaper, plan.format);
    files.push(path);
    samples += Math.round(rec.duration_s * rec.sampling_rate_hz) * rec.channels.length;
    options.onRecording?.(files.length, plan.recordings.length, rec.file);
  }
  const jobPath = join(outDir, 'job.yaml');
  writeAtomic(jobPath, jobYaml(plan));
  const truthPath = join(outDir, 'truth.json');
  const st = spec.job.settings as Partial<TruthSettings>;
  writeAtomic(truthPath, stableJson(designedTruth(plan, {
    percentiles: Array.isArray(st.percentiles) ? st.percentiles : undefined,
    gap_threshold_pct: typeof st.gap_threshold_pct === 'number' ? st.gap_threshold_pct : undefined,
    gap_min_s: typeof st.gap_min_s === 'number' ? st.gap_min_s : undefined,
  }, shaper.describe)));
  return { outDir, jobPath, truthPath, files, samples, plan };
}

function writeRecording(rec: RecordingDesign, path: string, shaper: NoiseShaper, format: 'edf' | 'csv'): void {
  if (format === 'csv') writeSimulatedCsv(rec, path, shaper);
  else writeSimulatedEdf(rec, path, shaper);
}

function prepareFolder(dir: string, force: boolean): void {
  if (existsSync(dir)) {
    if (!statSync(dir).isDirectory()) throw new InputError(simMsg.outNotFolder(dir), { file: dir });
    if (!force && readdirSync(dir).length > 0) throw new InputError(msg.outputExists(dir), { file: dir });
  } else {
    mkdirSync(dir, { recursive: true });
  }
}

