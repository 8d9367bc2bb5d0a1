import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { openRecording } from '../../lib/io/open-recording.js';
import { processRecording, type RecordingJob } from '../../lib/study/process-recording.js';
import { RecordingPool } from '../../lib/study/worker-pool.js';
import { FIXTURE_EDF } from '../support/fixture-job.js';

// Input: shared/fixtures/edf/emg_3sig.edf (EDFlib 1.23). The pool must give exactly what running
// each job inline gives, whichever thread (a worker or this one) ran it.
async function jobsFor(): Promise<RecordingJob[]> {
  const rec = await openRecording(FIXTURE_EDF);
  const idx = rec.info.signals.filter((s) => s.rate_hz === 1000).map((s) => s.index);
  await rec.close();
  const base = {
    file: FIXTURE_EDF, filter: { band_hz: [20, 200] as [number, number], order: 4, mains_hz: null, mains_harmonics: 3, mains_q: 30 },
    envelope: { window_s: 0.1, rate_hz: 20 },
  };
  return [[idx[0]!], [idx[1]!], idx, [idx[1]!, idx[0]!]].map((signals) => ({ ...base, signals }));
}

describe('RecordingPool(size)', () => {
  it('RecordingPool(3) (two workers and this thread) gives every job the inline result, bit for bit', async () => {
    const jobs = await jobsFor();
    const want = await Promise.all(jobs.map((j) => processRecording(j)));
    const pool = new RecordingPool(3);
    try {
      const got = await Promise.all(jobs.map((j) => pool.run(j)));
      got.forEach((g, k) => {
        expect(g.channels.length).toBe(want[k]!.channels.length);
        g.channels.forEach((c, i) => expect(Array.from(c.envelope)).toEqual(Array.from(want[k]!.channels[i]!.envelope)));
      });
    } finally {
      await pool.close();
    }
  });

  it('close() settles every job: those queued or running are refused, later ones too', async () => {
    const jobs = await jobsFor();
    const pool = new RecordingPool(2);
    const early = Promise.allSettled(jobs.map((j) => pool.run(j)));
    await pool.close();
    const late = await Promise.allSettled([pool.run(jobs[0]!)]);
    const outcome = [...(await early), ...late];
    expect(outcome[outcome.length - 1]!.status).toBe('rejected');
    expect(outcome.filter((o) => o.status === 'rejected').length).toBeGreaterThanOrEqual(jobs.length - 1);
  });

  it('hash(file) on a pool thread gives the SHA-256 listed in shared/fixtures/MANIFEST.json', async () => {
    // expected: shared/fixtures/MANIFEST.json (sha256 of every fixture file, written by the fixture generator)
    const manifest = JSON.parse(readFileSync(new URL('../../../shared/fixtures/MANIFEST.json', import.meta.url), 'utf8')) as { files: { path: string; sha256: string }[] };
    const want = manifest.files.find((f) => f.path === 'edf/emg_3sig.edf')!.sha256;
    const pool = new RecordingPool(2);
    try {
      const [a, b] = await Promise.all([pool.hash(FIXTURE_EDF), pool.hash(FIXTURE_EDF)]); // one on the worker, one here
      expect(a).toBe(want);
      expect(b).toBe(want);
    } finally {
      await pool.close();
    }
    expect(await new RecordingPool(1).hash(FIXTURE_EDF)).toBe(want);
  });
});
