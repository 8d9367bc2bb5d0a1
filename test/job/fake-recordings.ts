// Test support: a temp folder with placeholder recording files and a fake describer that returns
// invented header facts for them by file name (no real reader needed).
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { InputError } from '../../lib/errors.js';
import type { DescribeRecording, RecordingDescription } from '../../lib/job/describe-recording.js';

const trap = [{ label: 'EMG R trapezius', rate_hz: 1000 }, { label: 'EMG L trapezius', rate_hz: 1000 }, { label: 'EMG R forearm', rate_hz: 1000 }];

/** Invented recordings (names used by the tests and by the job template). */
export const FAKE_RECORDINGS: Record<string, RecordingDescription> = {
  'w1-ref.edf': {
    signals: trap, duration_s: 100,
    annotations: [
      { onset_s: 5, duration_s: 3, text: 'MVC' },
      { onset_s: 15, duration_s: 3, text: 'MVC' },
      { onset_s: 40, duration_s: 30, text: 'rest' },
      { onset_s: 90, duration_s: null, text: 'marker' },
    ],
  },
  'w1-bench-a.edf': { signals: trap, duration_s: 3600, annotations: [] },
  'w1-bench-b.edf': {
    signals: trap, duration_s: 3600,
    annotations: [
      { onset_s: 0, duration_s: 1000, text: 'task: sorting' },
      { onset_s: 1000, duration_s: 1000, text: 'task: packing' },
      { onset_s: 2500, duration_s: null, text: 'note' },
    ],
  },
  'slow.edf': { signals: [{ label: 'EMG R trapezius', rate_hz: 500 }], duration_s: 600, annotations: [] },
};

/** The fake describer: unknown names are unreadable files (InputError, like a real reader). */
export const fakeDescribe: DescribeRecording = async (path) => {
  const d = FAKE_RECORDINGS[basename(path)];
  if (!d) throw new InputError(`${basename(path)}: not a recording this test knows`);
  return d;
};

/** A fresh folder holding `job.yaml` with `text` and empty placeholder files for the fakes. */
export function jobFolder(text: string, extra: Record<string, string> = {}): { dir: string; job: string } {
  const dir = mkdtempSync(join(tmpdir(), 'shiftload-job-'));
  for (const name of Object.keys(FAKE_RECORDINGS)) writeFileSync(join(dir, name), '');
  for (const [name, content] of Object.entries(extra)) writeFileSync(join(dir, name), content);
  const job = join(dir, 'job.yaml');
  writeFileSync(job, text);
  return { dir, job };
}
