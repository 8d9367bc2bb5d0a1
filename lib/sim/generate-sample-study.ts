// The bundled example study (sample-jobs/parcel-packing): generated on demand by `shiftload demo`
// so nothing large is committed. Short variant: 6 workers × 2 conditions × 25 min at 1000 Hz,
// 2 muscles; full variant: 8-hour field recordings.
import { fileURLToPath } from 'node:url';
import { loadSimulationSpec } from './load-simulation-spec.js';
import { simulate, type SimulateOptions } from './simulate.js';

/** Path of the bundled simulation spec. */
export const SAMPLE_STUDY_SPEC = fileURLToPath(new URL('../../sample-jobs/parcel-packing/simulation.yaml', import.meta.url));

export interface SampleStudyOptions {
  /** Folder to write into (created; must be empty unless force). */
  outDir: string;
  /** 8-hour field recordings instead of 25 minutes. @default false */
  full?: boolean;
  /** Overrides the spec's seed (2026). */
  seed?: number;
  /** Reuse a non-empty folder. @default false */
  force?: boolean;
  /** Progress callback after each recording. */
  onRecording?: SimulateOptions['onRecording'];
}

/**
 * Generate the parcel-packing sample study (EDF+ recordings, job.yaml, truth.json).
 * @returns paths of the job file and the truth file, and every recording written
 * @example const { jobPath, truthPath } = await generateSampleStudy({ outDir: tmp })
 */
export async function generateSampleStudy(options: SampleStudyOptions): Promise<{ jobPath: string; truthPath: string; files: string[] }> {
  const spec = loadSimulationSpec(SAMPLE_STUDY_SPEC);
  const r = await simulate(spec, options.outDir, {
    variant: options.full ? 'full' : 'short', seed: options.seed, force: options.force, file: SAMPLE_STUDY_SPEC,
    onRecording: options.onRecording,
  });
  return { jobPath: r.jobPath, truthPath: r.truthPath, files: r.files };
}
