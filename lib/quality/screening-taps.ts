// The bridge between the analysis and the screening: plain-data options (they cross worker
// threads with a RecordingJob) turned into one QualityTap per channel, and the taps' results back
// into plain data. The analysis passes the taps to readEnvelopes so screening shares its one pass.
import type { SignalInfo } from '../io/recording.js';
import type { FindingWhere } from '../study/results.js';
import type { QualitySettings } from './defaults.js';
import { QualityTap, type ChannelQuality } from './quality-tap.js';

/** Plain-data request to screen the channels of one recording (structured-clone safe). */
export interface ScreeningRequest {
  /** The job's settings.quality (partial allowed; defaults fill the rest). */
  settings?: Partial<QualitySettings> | null;
  /** True when the analysis notches the mains frequency. */
  mains_notched: boolean;
  /** High-pass edge of the analysis band-pass, Hz. */
  highpass_hz: number;
  /** One entry per channel read, in the order of the signals requested. */
  channels: { noise_uv: number | null; where: FindingWhere }[];
}

/**
 * One QualityTap per requested channel.
 * @param req plain-data request
 * @param signals the SignalInfo of each requested channel, same order as req.channels
 * @example
 *   const taps = screeningTaps(req, job.signals.map((i) => info.signals[i]));
 *   await readEnvelopes({ ..., taps });
 *   const quality = taps.map((t) => t.finish());
 */
export function screeningTaps(req: ScreeningRequest, signals: readonly SignalInfo[]): QualityTap[] {
  return req.channels.map((c, j) => {
    const sig = signals[j]!;
    return new QualityTap({
      fs: sig.rate_hz, limits: sig, noise_uv: c.noise_uv, mains_notched: req.mains_notched, highpass_hz: req.highpass_hz,
      where: c.where, settings: req.settings ?? undefined,
    });
  });
}

/** The finished results of the taps (plain data; transferable between threads by structured clone). */
export function finishScreening(taps: readonly QualityTap[]): ChannelQuality[] {
  return taps.map((t) => t.finish());
}
