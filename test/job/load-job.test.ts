import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../lib/errors.js';
import { DEFAULTS } from '../../lib/job/defaults.js';
import { JobValidationError } from '../../lib/job/job-validation-error.js';
import { loadJob } from '../../lib/job/load-job.js';
import { fakeDescribe, jobFolder } from './fake-recordings.js';

// Line numbers matter: tests below point at them.
const BASE = [
  /*  1 */ 'format: shiftload-job/1',
  /*  2 */ 'title: Packing bench trial',
  /*  3 */ 'site: Line 2',
  /*  4 */ 'settings:',
  /*  5 */ '  band_hz: [30, 400]',
  /*  6 */ '  rms_window_s: 0.125',
  /*  7 */ 'workers:',
  /*  8 */ '  - id: W1',
  /*  9 */ '    reference: { file: w1-ref.edf, start_s: 0, end_s: 30 }',
  /* 10 */ '    rest: { file: w1-ref.edf, start_s: 40, end_s: 70 }',
  /* 11 */ '    recordings:',
  /* 12 */ '      - file: w1-bench-a.edf',
  /* 13 */ '        condition: bench-a',
  /* 14 */ '        channels:',
  /* 15 */ '          - { signal: "EMG R trapezius", muscle: "upper trapezius, right" }',
  /* 16 */ '        segments:',
  /* 17 */ '          - { label: sorting, start_s: 0, end_s: 1800 }',
  /* 18 */ '          - { label: packing, start_s: 1800, end_s: 3600 }',
  /* 19 */ '      - file: w1-bench-b.edf',
  /* 20 */ '        condition: bench-b',
  /* 21 */ '        channels:',
  /* 22 */ '          - { signal: "EMG R trapezius" }',
  /* 23 */ '        segments: annotations',
];

/** BASE with lines replaced: { 6: 'new text' } (1-based), null to delete. */
function variant(changes: Record<number, string | null> = {}, append: string[] = []): string {
  const out: string[] = [];
  BASE.forEach((l, i) => {
    const c = changes[i + 1];
    if (c === undefined) out.push(l);
    else if (c !== null) out.push(c);
  });
  return [...out, ...append].join('\n') + '\n';
}

async function loadText(text: string, extra: Record<string, string> = {}) {
  const { job, dir } = jobFolder(text, extra);
  return { job, dir, study: await loadJob(job, { describeRecording: fakeDescribe }) };
}

/** The first problem's message, with the (temp) job path replaced by "job.yaml". */
async function firstError(text: string, extra: Record<string, string> = {}): Promise<string> {
  const { job, dir } = jobFolder(text, extra);
  try {
    await loadJob(job, { describeRecording: fakeDescribe });
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as Error).message.split(job).join('job.yaml').split(dir + '/').join('');
  }
  throw new Error('expected the job to be refused');
}

describe('loadJob(path) on a valid job', () => {
  it('loadJob(example) fills every default and keeps the given settings', async () => {
    const { study, dir, job } = await loadText(variant());
    expect(study.title).toBe('Packing bench trial');
    expect(study.site).toBe('Line 2');
    expect(study.analyst).toBeNull();
    expect(study.jobFile).toBe(job);
    expect(study.baseDir).toBe(dir);
    expect(study.settings).toEqual({ ...DEFAULTS, rms_window_s: 0.125 });
    expect(study.unit).toBe('%MVE');
    expect(study.gapThreshold).toMatchObject({ value: 0.5, unit: '%MVE', convertPerWorker: false });
  });

  it('loadJob(example) resolves paths, channels, segments, reference and rest spans', async () => {
    const { study, dir } = await loadText(variant());
    const [a, b] = study.workers[0].recordings;
    expect(a).toMatchObject({ id: 'W1/w1-bench-a.edf', file: join(dir, 'w1-bench-a.edf'), condition: 'bench-a', duration_s: 3600 });
    expect(a.channels).toEqual([{ signal: 'EMG R trapezius', signalIndex: 0, muscle: 'upper trapezius, right', rate_hz: 1000 }]);
    expect(a.segments).toEqual([
      { label: 'sorting', start_s: 0, end_s: 1800, source: 'job' },
      { label: 'packing', start_s: 1800, end_s: 3600, source: 'job' },
    ]);
    expect(a.reference).toEqual([{ file: join(dir, 'w1-ref.edf'), fileAsWritten: 'w1-ref.edf', rate_hz: null, start_s: 0, end_s: 30, annotation: null, signalIndices: [0] }]);
    expect(a.rest[0]).toMatchObject({ start_s: 40, end_s: 70 });
    // muscle defaults to the signal label; annotations with a duration become segments
    expect(b.channels[0].muscle).toBe('EMG R trapezius');
    expect(b.segments.map((s) => [s.label, s.start_s, s.end_s, s.source])).toEqual([
      ['task: sorting', 0, 1000, 'annotation'], ['task: packing', 1000, 2000, 'annotation'],
    ]);
  });

  it('loadJob() resolves a reference given by annotation text to every matching annotation (several trials)', async () => {
    const { study } = await loadText(variant({ 9: '    reference: { file: w1-ref.edf, annotation: MVC }' }));
    expect(study.workers[0].recordings[0].reference.map((s) => [s.start_s, s.end_s, s.annotation])).toEqual([[5, 8, 'MVC'], [15, 18, 'MVC']]);
  });

  it('loadJob() accepts a list of spans and a recording-level override without file', async () => {
    const { study } = await loadText(variant({ 9: '    reference: [{ file: w1-ref.edf, start_s: 0, end_s: 10 }, { file: w1-ref.edf, start_s: 20, end_s: 30 }]' },
      []).replace('        condition: bench-b\n', '        condition: bench-b\n        reference: { start_s: 2100, end_s: 2200 }\n'));
    const [a, b] = study.workers[0].recordings;
    expect(a.reference.map((s) => s.start_s)).toEqual([0, 20]);
    expect(b.reference).toMatchObject([{ fileAsWritten: 'w1-bench-b.edf', start_s: 2100, end_s: 2200 }]);
  });

  it('loadJob() picks annotation segments by prefix and strips it from the label', async () => {
    const { study } = await loadText(variant({ 23: '        segments: { annotations: { prefix: "task: " } }' }));
    expect(study.workers[0].recordings[1].segments.map((s) => s.label)).toEqual(['sorting', 'packing']);
  });

  it('loadJob() picks annotation segments by an include list', async () => {
    const { study } = await loadText(variant({ 23: '        segments: { annotations: { include: ["task: packing"] } }' }));
    expect(study.workers[0].recordings[1].segments).toEqual([{ label: 'task: packing', start_s: 1000, end_s: 2000, source: 'annotation' }]);
  });

  it('loadJob() reads segments from a CSV file, sorted by start', async () => {
    const { study } = await loadText(variant({ 23: '        segments: { csv: seg.csv }' }),
      { 'seg.csv': 'label,start_s,end_s\n"packing, line 2",600,1200\nsorting,0,600\n' });
    expect(study.workers[0].recordings[1].segments).toEqual([
      { label: 'sorting', start_s: 0, end_s: 600, source: 'csv' },
      { label: 'packing, line 2', start_s: 600, end_s: 1200, source: 'csv' },
    ]);
  });

  it('loadJob() with normalize none and no noise correction needs no reference or rest', async () => {
    const { study } = await loadText(variant({ 6: '  normalize: none\n  noise_correction: false', 9: null, 10: null }));
    expect(study.unit).toBe('uV');
    expect(study.workers[0].recordings[0].reference).toEqual([]);
    expect(study.gapThreshold.unit).toBe('uV');
  });

  it('loadJob() with normalize rve and mve_reference converts a %MVE gap threshold per worker', async () => {
    const { study } = await loadText(variant({ 6: '  normalize: rve', 10: '    rest: { file: w1-ref.edf, start_s: 40, end_s: 70 }\n    mve_reference: { file: w1-ref.edf, annotation: MVC }' }));
    expect(study.gapThreshold).toMatchObject({ unit: '%MVE', convertPerWorker: true });
    expect(study.workers[0].recordings[0].mveReference).toHaveLength(2);
  });

  it('loadJob() with normalize rve and no mve_reference takes the threshold as %RVE and says so', async () => {
    const { study } = await loadText(variant({ 6: '  normalize: rve' }));
    expect(study.gapThreshold).toMatchObject({ unit: '%RVE', convertPerWorker: false });
    expect(study.gapThreshold.note).toMatch(/%RVE/);
  });

  it('loadJob() treats an empty settings block (all commented out) as all defaults', async () => {
    const { study } = await loadText(variant({ 5: '  # band_hz: [30, 400]', 6: '  # eva:' }));
    expect(study.settings).toEqual(DEFAULTS);
  });

  it('loadJob() accepts a numeric worker id as text', async () => {
    const { study } = await loadText(variant({ 8: '  - id: 7' }));
    expect(study.workers[0].id).toBe('7');
  });
});

describe('loadJob(path) refuses bad jobs with file:line and key path', () => {
  it('bad type: a number as text', async () => {
    expect(await firstError(variant({ 6: '  rms_window_s: fast' })))
      .toBe("job.yaml:6 settings.rms_window_s: expected a number, got text 'fast'");
  });

  it('unknown key with did-you-mean', async () => {
    expect(await firstError(variant({ 6: '  rms_windw_s: 0.1' })))
      .toBe('job.yaml:6 settings.rms_windw_s: unknown key; did you mean rms_window_s?');
  });

  it('unknown key without a close match lists the allowed keys', async () => {
    expect(await firstError(variant({ 3: 'colour: blue' })))
      .toMatch(/^job\.yaml:3 colour: unknown key; expected one of format, title, site/);
  });

  it('missing required key', async () => {
    expect(await firstError(variant({ 13: null })))
      .toBe("job.yaml:12 workers[0].recordings[0]: missing required key 'condition'");
  });

  it('wrong format value', async () => {
    expect(await firstError(variant({ 1: 'format: shiftload-job/9' })))
      .toBe("job.yaml:1 format: expected 'shiftload-job/1' (this tool reads that job format), got text 'shiftload-job/9'");
  });

  it('enum value out of the list', async () => {
    expect(await firstError(variant({ 6: '  normalize: mvc' })))
      .toBe("job.yaml:6 settings.normalize: expected one of 'mve', 'rve', 'task-peak', 'none', got text 'mvc'");
  });

  it('missing recording file', async () => {
    expect(await firstError(variant({ 12: '      - file: w1-bench-z.edf' })))
      .toBe("job.yaml:12 workers[0].recordings[0].file: file 'w1-bench-z.edf' not found (paths are relative to the job file)");
  });

  it('a folder as a file', async () => {
    const { job, dir } = jobFolder(variant({ 12: '      - file: data' }));
    mkdirSync(join(dir, 'data'));
    await expect(loadJob(job, { describeRecording: fakeDescribe })).rejects.toThrow(`${job}:12 workers[0].recordings[0].file: 'data' is a folder, expected a file`);
  });

  it('the job file itself as a recording', async () => {
    expect(await firstError(variant({ 12: '      - file: ./job.yaml' })))
      .toBe("job.yaml:12 workers[0].recordings[0].file: './job.yaml' is the job file itself, expected a recording");
  });

  it('missing signal lists the available ones', async () => {
    expect(await firstError(variant({ 15: '          - { signal: "EMG R trap" }' })))
      .toBe("job.yaml:15 workers[0].recordings[0].channels[0].signal: no signal 'EMG R trap' in w1-bench-a.edf (signals: EMG R trapezius, EMG L trapezius, EMG R forearm)");
  });

  it('a channel signal missing from the reference file names the span and the channel', async () => {
    expect(await firstError(variant({ 9: '    reference: { file: slow.edf, start_s: 0, end_s: 30 }', 15: '          - { signal: "EMG L trapezius" }' })))
      .toBe("job.yaml:9 workers[0].reference.file: no signal 'EMG L trapezius' in slow.edf, needed by workers[0].recordings[0].channels[0] (signals: EMG R trapezius)");
  });

  it('empty segment list', async () => {
    expect(await firstError(variant({ 16: '        segments: []', 17: null, 18: null })))
      .toBe('job.yaml:16 workers[0].recordings[0].segments: must not be empty');
  });

  it('overlapping segments point at the later-written one', async () => {
    expect(await firstError(variant({ 18: '          - { label: packing, start_s: 1700, end_s: 3600 }' })))
      .toBe("job.yaml:18 workers[0].recordings[0].segments[1]: segment 'packing' (1700–3600 s) overlaps 'sorting' (0–1800 s)");
  });

  it('segment outside the recording', async () => {
    expect(await firstError(variant({ 18: '          - { label: packing, start_s: 1800, end_s: 3700 }' })))
      .toBe('job.yaml:18 workers[0].recordings[0].segments[1]: 1800–3700 s lies outside w1-bench-a.edf (0–3600 s)');
  });

  it('segment with start after end', async () => {
    expect(await firstError(variant({ 17: '          - { label: sorting, start_s: 900, end_s: 0 }' })))
      .toBe('job.yaml:17 workers[0].recordings[0].segments[0]: start_s (900) must be less than end_s (0)');
  });

  it('YAML syntax error names the line', async () => {
    expect(await firstError(variant({ 6: '  rms_window_s: [0.1' })))
      .toMatch(/^job\.yaml:\d+: YAML syntax error: /);
    expect(await firstError(variant({ 13: '       condition: bench-a' })))
      .toMatch(/^job\.yaml:13: YAML syntax error: bad indentation/);
  });

  it('duplicate worker ids', async () => {
    const text = variant() + [
      '  - id: W1', '    reference: { file: w1-ref.edf, start_s: 0, end_s: 30 }', '    rest: { file: w1-ref.edf, start_s: 40, end_s: 70 }',
      '    recordings:', '      - { file: w1-bench-a.edf, condition: x, channels: [{ signal: EMG R forearm }], segments: annotations }',
    ].join('\n') + '\n';
    // the second worker's annotation-less recording is also wrong, but the duplicate id comes first
    expect(await firstError(text)).toBe("job.yaml:24 workers[1].id: worker id 'W1' is already used at line 8 (workers[0].id)");
  });

  it('reference annotation text that the file does not have', async () => {
    expect(await firstError(variant({ 9: '    reference: { file: w1-ref.edf, annotation: MVE trial }' })))
      .toBe("job.yaml:9 workers[0].reference.annotation: no annotation 'MVE trial' in w1-ref.edf (annotations: 'MVC', 'rest', 'marker')");
  });

  it('reference annotation without a duration needs duration_s', async () => {
    expect(await firstError(variant({ 9: '    reference: { file: w1-ref.edf, annotation: marker }' })))
      .toBe("job.yaml:9 workers[0].reference.annotation: annotation 'marker' at 90 s has no duration; add duration_s");
    const { study } = await loadText(variant({ 9: '    reference: { file: w1-ref.edf, annotation: marker, duration_s: 5 }' }));
    expect(study.workers[0].recordings[0].reference[0]).toMatchObject({ start_s: 90, end_s: 95 });
  });

  it('a span with both times and annotation', async () => {
    expect(await firstError(variant({ 9: '    reference: { file: w1-ref.edf, annotation: MVC, start_s: 0, end_s: 3 }' })))
      .toBe('job.yaml:9 workers[0].reference: give either start_s and end_s, or annotation (not both, not neither)');
  });

  it('a worker-level span without file', async () => {
    expect(await firstError(variant({ 10: '    rest: { start_s: 40, end_s: 70 }' })))
      .toBe("job.yaml:10 workers[0].rest: missing required key 'file' (a worker-level span must name its file)");
  });

  it('normalize mve without any reference', async () => {
    expect(await firstError(variant({ 9: null })))
      .toBe('job.yaml:11 workers[0].recordings[0]: no reference: normalize is mve, so each worker (or each recording) needs reference');
  });

  it('noise correction without rest', async () => {
    expect(await firstError(variant({ 10: null })))
      .toMatch(/^job\.yaml:11 workers\[0\]\.recordings\[0\]: no rest: noise_correction is true/);
  });

  it('band edge above half the sampling rate', async () => {
    expect(await firstError(variant({ 12: '      - file: slow.edf' })))
      .toBe("job.yaml:5 settings.band_hz: high edge 400 Hz is not below half the sampling rate of 'EMG R trapezius' in slow.edf (500 Hz → 250 Hz)");
  });

  it('band edges in the wrong order', async () => {
    expect(await firstError(variant({ 5: '  band_hz: [400, 30]' })))
      .toBe('job.yaml:5 settings.band_hz: low edge 400 Hz must be below high edge 30 Hz');
  });

  it('EVA edges must increase', async () => {
    expect(await firstError(variant({ 6: '  eva: { amplitude_edges: [0, 5, 5, 10] }' })))
      .toBe('job.yaml:6 settings.eva.amplitude_edges[2]: edges must increase strictly');
  });

  it('the same signal twice in a recording', async () => {
    expect(await firstError(variant({ 15: '          - { signal: "EMG R trapezius" }\n          - { signal: "EMG R trapezius", muscle: other }' })))
      .toBe("job.yaml:16 workers[0].recordings[0].channels[1].signal: signal 'EMG R trapezius' is already analysed at line 15 (workers[0].recordings[0].channels[0].signal)");
  });

  it('annotations that give no segments', async () => {
    expect(await firstError(variant({ 23: '        segments: { annotations: { prefix: "job: " } }' })))
      .toBe("job.yaml:23 workers[0].recordings[1].segments: no segments: no annotation with a duration starting with 'job: ' in w1-bench-b.edf");
  });

  it('CSV segments: a bad time names the CSV file, line and column', async () => {
    expect(await firstError(variant({ 23: '        segments: { csv: seg.csv }' }), { 'seg.csv': 'label,start_s,end_s\nsorting,0,600\npacking,six hundred,1200\n' }))
      .toBe("seg.csv:3 start_s: expected a number of seconds, got 'six hundred'");
  });

  it('CSV segments: a wrong header', async () => {
    expect(await firstError(variant({ 23: '        segments: { csv: seg.csv }' }), { 'seg.csv': 'task,from,to\nsorting,0,600\n' }))
      .toBe("seg.csv:1: expected the header line label,start_s,end_s, got 'task,from,to'");
  });

  it('CSV segments: overlap points at the CSV line', async () => {
    expect(await firstError(variant({ 23: '        segments: { csv: seg.csv }' }), { 'seg.csv': 'label,start_s,end_s\nsorting,0,600\npacking,500,1200\n' }))
      .toBe("seg.csv:3: segment 'packing' (500–1200 s) overlaps 'sorting' (0–600 s)");
  });

  it('an unreadable recording is reported at its key', async () => {
    const { job } = jobFolder(variant({ 12: '      - file: broken.edf' }), { 'broken.edf': 'x' });
    await expect(loadJob(job, { describeRecording: fakeDescribe })).rejects.toThrow(`${job}:12 workers[0].recordings[0].file: cannot read 'broken.edf': broken.edf: not a recording this test knows`);
  });

  it('keeps every problem found in one pass, first one in the message', async () => {
    const { job } = jobFolder(variant({ 6: '  rms_windw_s: 0.1', 13: null }));
    const err = await loadJob(job, { describeRecording: fakeDescribe }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(JobValidationError);
    const issues = (err as JobValidationError).issues;
    expect(issues.map((i) => i.line)).toEqual([6, 12]);
    expect((err as Error).message).toBe(issues[0].message);
  });

  it('a missing job file, a folder and an empty file', async () => {
    const { dir } = jobFolder(variant());
    await expect(loadJob(join(dir, 'nope.yaml'))).rejects.toThrow(`${join(dir, 'nope.yaml')}: file not found`);
    await expect(loadJob(dir)).rejects.toThrow(`${dir}: is a folder, expected a file`);
    writeFileSync(join(dir, 'empty.yaml'), '');
    await expect(loadJob(join(dir, 'empty.yaml'))).rejects.toThrow('file is empty');
  });

  it('a job file over 1 MiB is refused before parsing', async () => {
    const { dir } = jobFolder(variant());
    writeFileSync(join(dir, 'big.yaml'), variant() + '#'.repeat(1 << 20));
    await expect(loadJob(join(dir, 'big.yaml'))).rejects.toThrow(/larger than 1048576 bytes/);
  });
});
