import { describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { checkCommand, formatDuration } from '../../lib/cli/check.js';
import { main } from '../../lib/cli/main.js';
import { jobTemplateText } from '../../lib/cli/init.js';
import { JobValidationError } from '../../lib/job/job-validation-error.js';
import { fakeDescribe, jobFolder } from '../job/fake-recordings.js';

// The handler is called directly so a fake describer can stand in for the readers.
async function runCheck(job: string, json = false) {
  const io = bufferIO();
  const handler = checkCommand.handler as (a: object) => Promise<void>;
  await handler({ io, job, json, describeRecording: fakeDescribe, _: [], $0: 'shiftload' });
  return io;
}

describe('formatDuration(seconds)', () => {
  it('formatDuration() picks s, min or h', () => {
    expect(formatDuration(10)).toBe('10 s');
    expect(formatDuration(750)).toBe('12.5 min');
    expect(formatDuration(27000)).toBe('7.50 h');
  });
});

describe('shiftload check JOB', () => {
  it('check prints counts and hours of a valid job', async () => {
    const { job } = jobFolder(jobTemplateText());
    const io = await runCheck(job);
    expect(io.stdout).toContain(`${job}: valid — Packing bench trial`);
    expect(io.stdout).toContain('1 worker(s), 2 recording(s), 4 channel(s), 4 segment(s)');
    // 2 × 3600 s recorded = 2.00 h; segments 3600 s + 2000 s = 1.56 h (invented fake recordings)
    expect(io.stdout).toContain('recorded 2.00 h, in segments 1.56 h');
    expect(io.stdout).toContain('W1  w1-bench-b.edf  bench-b  2 ch  2 seg  1.00 h recorded, 33.3 min in segments');
    expect(io.stdout).toContain('Gap threshold 0.5 %MVE.');
  });

  it('check --json prints a summary object', async () => {
    const { job } = jobFolder(jobTemplateText());
    const out = JSON.parse((await runCheck(job, true)).stdout) as { ok: boolean; summary: { segments: number; conditions: string[] } };
    expect(out.ok).toBe(true);
    expect(out.summary.segments).toBe(4);
    expect(out.summary.conditions).toEqual(['bench-a', 'bench-b']);
  });

  it('check --json on a bad job prints every issue, then throws the first', async () => {
    const { job } = jobFolder(jobTemplateText().replace('rms_window_s:', 'rms_windw_s:').replace('condition: bench-b', 'conditon: bench-b'));
    const io = bufferIO();
    const handler = checkCommand.handler as (a: object) => Promise<void>;
    await expect(handler({ io, job, json: true, describeRecording: fakeDescribe, _: [], $0: 'shiftload' })).rejects.toBeInstanceOf(JobValidationError);
    const out = JSON.parse(io.stdout) as { ok: boolean; issues: { line: number; what: string }[] };
    expect(out.ok).toBe(false);
    expect(out.issues.map((i) => i.what)).toEqual([
      'unknown key; did you mean rms_window_s?',
      "missing required key 'condition'", // at the recording's first line, above the misspelt key
      'unknown key; did you mean condition?',
    ]);
  });

  it('main(["check", job]) on a bad job exits 2 with one line naming file:line and key', async () => {
    const { job } = jobFolder(jobTemplateText().replace('filter_order: 4', 'filter_order: four'));
    const line = jobTemplateText().split('\n').findIndex((l) => l.includes('filter_order:')) + 1;
    const io = bufferIO();
    expect(await main(['check', job], io)).toBe(2);
    expect(io.stderr).toBe(`shiftload: ${job}:${line} settings.filter_order: expected a whole number, got text 'four'\n`);
  });
});
