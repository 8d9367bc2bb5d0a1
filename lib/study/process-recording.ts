// The unit of parallel work of an analysis: one field recording streamed once through the filter
// and envelope chain (and, later, the per-channel screening taps). Input and output are plain,
// transferable data, so the same function runs inline (--jobs 1) or on a worker thread.
import { primeScans, type EdfScan } from '../io/edf-scan-cache.js';
import type { OpenOptions } from '../io/open-options.js';
import { readEnvelopes, type ChannelEnvelopes, type EnvelopeSpec, type FilterSpec } from './read-envelopes.js';
import { fatigueTaps, spectralEpochBuffers, type FatigueTapSpec } from '../exposure/fatigue-taps.js';
import type { SpectralEpochSeries } from '../exposure/spectral-epochs.js';
import { fanOutTaps } from '../quality/fan-out-taps.js';
import { createScreeningTaps, screeningWindows, type ScreeningSpec } from '../quality/screening-taps.js';
import { screeningBuffers, type ScreeningWindows } from '../quality/screening-types.js';

export interface RecordingJob {
  file: string;
  open?: OpenOptions;
  signals: number[];
  filter: FilterSpec;
  envelope: EnvelopeSpec;
  second?: EnvelopeSpec;
  /** Spectral epochs for the fatigue analysis; absent/null = off. */
  fatigue?: FatigueTapSpec | null;
  /** Signal-quality screening; absent/null = off. */
  quality?: ScreeningSpec | null;
  /** The main thread's annotation scan of the file (so a worker need not scan it again). */
  scans?: [string, EdfScan][];
}

export interface RecordingJobResult {
  channels: ChannelEnvelopes[];
  start_s: number;
  end_s: number;
  discontinuities: number;
  /** Spectral epochs per channel (same order), or null when the fatigue analysis is off. */
  epochs: SpectralEpochSeries[] | null;
  /** Screening windows per channel (same order), or null when screening is off. */
  quality: ScreeningWindows[] | null;
}

/**
 * Process one field recording: every requested channel's envelope(s) in µV, clipping counts.
 * @param onProgress seconds of the recording read so far
 */
export async function processRecording(job: RecordingJob, onProgress?: (done_s: number) => void): Promise<RecordingJobResult> {
  if (job.scans) primeScans(job.scans);
  const taps = fatigueTaps(job.fatigue);
  const qtaps = job.quality ? await createScreeningTaps(job.file, job.signals, job.quality, job.open) : null;
  const res = await readEnvelopes({
    file: job.file, signals: job.signals, start_s: 0, end_s: null, filter: job.filter,
    envelope: job.envelope, second: job.second, open: job.open, onProgress, taps: fanOutTaps(taps, qtaps),
  });
  return {
    channels: res.channels, start_s: res.start_s, end_s: res.end_s, discontinuities: res.discontinuities,
    epochs: taps ? taps.map((t) => t.result()) : null,
    quality: qtaps ? screeningWindows(qtaps) : null,
  };
}

/** The ArrayBuffers of a result, to transfer (not copy) them between threads. */
export function transferablesOf(r: RecordingJobResult): ArrayBuffer[] {
  const out: ArrayBuffer[] = [];
  for (const c of r.channels) {
    out.push(c.envelope.buffer as ArrayBuffer);
    if (c.second) out.push(c.second.buffer as ArrayBuffer);
  }
  out.push(...spectralEpochBuffers(r.epochs));
  out.push(...screeningBuffers(r.quality));
  return out;
}
