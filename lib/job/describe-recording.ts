// What the job loader needs to know about a recording, without reading its samples: signal labels
// and rates, duration and annotations. Injected into loadJob so tests can use fakes.
import type { Annotation } from '../io/recording.js';

/** Header facts of one recording. */
export interface RecordingDescription {
  /** Data signals in file order (index = position = SignalInfo.index). */
  signals: { label: string; rate_hz: number }[];
  /** Duration, s. */
  duration_s: number;
  /** Annotations (EDF+ TALs or CSV events), onsets in s from the recording start. */
  annotations: Annotation[];
}

/** Describe the recording at an absolute path; throws InputError when it cannot be read. */
export type DescribeRecording = (path: string) => Promise<RecordingDescription>;

interface OpenRecordingModule {
  openRecording(path: string): Promise<{
    info: { duration_s: number; signals: { label: string; rate_hz: number }[]; annotations: Annotation[] };
    close(): Promise<void>;
  }>;
}

/**
 * The default describer: opens the file with the io readers (lib/io/open-recording.ts), reads
 * only its header (and EDF+ annotations), and closes it.
 * @throws InputError from the reader for unreadable files
 */
export const describeRecordingFile: DescribeRecording = async (path) => {
  // Resolved at run time so the job module builds before the readers exist on this branch.
  const spec = '../io/open-recording.js';
  let mod: OpenRecordingModule;
  try {
    mod = (await import(spec)) as OpenRecordingModule;
  } catch {
    throw new Error('recording readers (lib/io/open-recording.ts) are not available in this build');
  }
  const rec = await mod.openRecording(path);
  try {
    return {
      signals: rec.info.signals.map((s) => ({ label: s.label, rate_hz: s.rate_hz })),
      duration_s: rec.info.duration_s,
      annotations: rec.info.annotations,
    };
  } finally {
    await rec.close();
  }
};
