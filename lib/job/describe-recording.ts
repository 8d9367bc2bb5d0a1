// What the job loader needs to know about a recording, without reading its samples: signal labels
// and rates, duration and annotations. Injected into loadJob so tests can use fakes.
import { openRecording } from '../io/open-recording.js';
import type { Annotation } from '../io/recording.js';

/** Header facts of one recording. */
export interface RecordingDescription {
  /** Data signals in file order (index = position = SignalInfo.index). */
  signals: { label: string; rate_hz: number; /** physical unit as written in the file */ unit?: string }[];
  /** Duration, s. */
  duration_s: number;
  /** Annotations (EDF+ TALs or CSV events), onsets in s from the recording start. */
  annotations: Annotation[];
}

/** Options a describer passes on to the reader. */
export interface DescribeOptions {
  /** CSV without a time column: sampling rate, Hz. */
  rate_hz?: number;
}

/** Describe the recording at an absolute path; throws InputError when it cannot be read. */
export type DescribeRecording = (path: string, options?: DescribeOptions) => Promise<RecordingDescription>;

/**
 * The default describer: opens the file with the io readers (openRecording), takes its header
 * facts (and EDF+ annotations) and closes it; no samples are read.
 * @throws InputError from the reader for missing, unreadable or malformed files
 */
export const describeRecordingFile: DescribeRecording = async (path, options = {}) => {
  const rec = await openRecording(path, options.rate_hz !== undefined ? { rate_hz: options.rate_hz } : {});
  try {
    return {
      signals: rec.info.signals.map((s) => ({ label: s.label, rate_hz: s.rate_hz, unit: s.unit })),
      duration_s: rec.info.duration_s,
      annotations: rec.info.annotations,
    };
  } finally {
    await rec.close();
  }
};
