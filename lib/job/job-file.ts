// The shape of a job file as written (after schema validation, before defaults and resolution).
// The schema (job-schema.ts) is the authority; these types mirror it for the loader.
import type { Settings } from './defaults.js';

/** A span as written: times, or annotation text (with an optional duration). */
export interface SpanInput {
  file?: string;
  start_s?: number;
  end_s?: number;
  annotation?: string;
  duration_s?: number;
  rate_hz?: number;
}

export type SpansInput = SpanInput | SpanInput[];

export interface SegmentInput { label: string; start_s: number; end_s: number }

export type SegmentsInput =
  | SegmentInput[]
  | 'annotations'
  | { annotations?: { include?: string[]; prefix?: string }; csv?: string };

export interface ChannelInput { signal: string; muscle?: string }

export interface RecordingInput {
  file: string;
  rate_hz?: number;
  condition: string;
  notes?: string;
  channels: ChannelInput[];
  segments: SegmentsInput;
  reference?: SpansInput;
  rest?: SpansInput;
  mve_reference?: SpansInput;
}

export interface WorkerInput {
  id: string | number;
  notes?: string;
  reference?: SpansInput;
  rest?: SpansInput;
  mve_reference?: SpansInput;
  recordings: RecordingInput[];
}

/** Settings as written: every key optional, `eva` partial too. */
export type SettingsInput = Partial<Omit<Settings, 'eva' | 'fatigue' | 'quality'>> & { eva?: Partial<Settings['eva']> | null; fatigue?: Partial<Settings['fatigue']> | null; quality?: Partial<Settings['quality']> | null };

export interface JobFile {
  format: string;
  title: string;
  site?: string;
  date?: string;
  analyst?: string;
  notes?: string;
  settings?: SettingsInput | null;
  workers: WorkerInput[];
}
