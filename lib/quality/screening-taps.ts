// The bridge between the analysis and the screening. A recording job carries a ScreeningSpec
// (plain data) to wherever the recording is read (inline or a worker thread); there it becomes one
// QualityTap per channel for readEnvelopes, so screening shares the analysis' single pass; the
// taps' windows (transferable typed arrays) come back and are judged once the noise level is known.
import { openRecording } from '../io/open-recording.js';
import type { OpenOptions } from '../io/open-options.js';
import type { SignalInfo } from '../io/recording.js';
import type { QualitySettings } from './defaults.js';
import { QualityTap } from './quality-tap.js';
import type { ScreeningWindows } from './screening-types.js';

/** Plain-data description of the screening taps of one recording job (structured-clone safe). */
export interface ScreeningSpec {
  /** The job's settings.quality (partial allowed; defaults fill the rest). */
  settings?: Partial<QualitySettings> | null;
}

/**
 * One QualityTap per requested channel, when the SignalInfo of each is at hand.
 * @param spec plain-data spec
 * @param signals the SignalInfo of each requested channel, in the order read
 * @example const taps = screeningTaps({ settings: s.quality }, idx.map((i) => info.signals[i]));
 */
export function screeningTaps(spec: ScreeningSpec, signals: readonly SignalInfo[]): QualityTap[] {
  return signals.map((sig) => new QualityTap({ fs: sig.rate_hz, limits: sig, settings: spec.settings ?? undefined }));
}

/**
 * One QualityTap per requested channel of a file: reads the header for each signal's rate and
 * digital limits (a header read only; the samples are read by the analysis pass).
 * @param file recording path
 * @param signals SignalInfo indices, in the order read
 * @param spec plain-data spec
 * @param open reader options (CSV rate)
 * @throws InputError from the readers
 * @example const taps = await createScreeningTaps(job.file, job.signals, job.quality, job.open);
 */
export async function createScreeningTaps(file: string, signals: readonly number[], spec: ScreeningSpec, open?: OpenOptions): Promise<QualityTap[]> {
  const rec = await openRecording(file, open);
  try {
    return screeningTaps(spec, signals.map((i) => rec.info.signals[i]!));
  } finally {
    await rec.close();
  }
}

/** The windows of every tap after the pass (plain data, transferable: see screeningBuffers). */
export function screeningWindows(taps: readonly QualityTap[]): ScreeningWindows[] {
  return taps.map((t) => t.windows());
}
