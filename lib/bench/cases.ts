// The benchmark cases. Each runs in its own child process on the bench file and reports how much it
// read; the runner measures wall time and peak RSS. Add a case by appending to `benchCases`.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { convertRecording } from '../cli/convert.js';
import { inspectRecording } from '../cli/inspect.js';
import { openRecording } from '../io/open-recording.js';
import { loadJob } from '../job/load-job.js';
import { runStudy } from '../study/run-study.js';
import { csvBenchCases } from './csv-cases.js';

export interface BenchWork {
  /** Input bytes processed. */
  bytes: number;
  /** Samples processed (all channels). */
  samples: number;
  /** A value derived from the data, printed so the work cannot be skipped. */
  check: string;
}

export interface BenchCase {
  name: string;
  describe: string;
  /** Bench file the case runs on. @default 'edf' */
  input?: 'edf' | 'csv';
  /** Recording lengths (h) the case runs at when no --case is given (its input is costly to make). @default every --hours value */
  defaultHours?: number[];
  run(file: string): Promise<BenchWork>;
}

async function fileInfo(file: string): Promise<{ bytes: number; samples: number }> {
  const { statSync } = await import('node:fs');
  const rec = await openRecording(file);
  const samples = rec.info.signals.reduce((a, s) => a + s.samples, 0);
  await rec.close();
  return { bytes: statSync(file).size, samples };
}

function sumOf(d: Float64Array): number {
  let s = 0;
  for (let i = 0; i < d.length; i++) s += d[i];
  return s;
}

export const benchCases: BenchCase[] = [
  {
    name: 'inspect',
    describe: 'openRecording + one streaming pass over all signals with clipping counts (shiftload inspect)',
    async run(file) {
      const r = await inspectRecording(file);
      const { bytes, samples } = await fileInfo(file);
      return { bytes, samples, check: `clipped=${r.signals.reduce((a, s) => a + s.clipped_low + s.clipped_high, 0)} annotations=${r.annotations.length}` };
    },
  },
  {
    name: 'read-all',
    describe: 'read every signal as physical values and sum them',
    async run(file) {
      const rec = await openRecording(file);
      let sum = 0;
      for await (const c of rec.read({ signals: rec.info.signals.map((s) => s.index) })) {
        for (let j = 0; j < c.data.length; j++) sum += sumOf(c.data[j]);
      }
      await rec.close();
      const { bytes, samples } = await fileInfo(file);
      return { bytes, samples, check: `sum=${sum.toExponential(6)}` };
    },
  },
  {
    name: 'convert-edf',
    describe: 'shiftload convert --format edf (read, scale, write EDF+ atomically)',
    async run(file) {
      const out = join(tmpdir(), `shiftload-bench-convert-${process.pid}.edf`);
      try {
        const r = await convertRecording(file, { format: 'edf', out });
        const { bytes, samples } = await fileInfo(file);
        return { bytes, samples, check: `annotations=${r.annotations}` };
      } finally {
        rmSync(out, { force: true });
      }
    },
  },
];

/**
 * A job over the bench file: one worker, all four channels, MVE from the first 60 s, three task segments splitting the rest of the recording.
 */
function benchJob(file: string, duration_s: number, core: boolean): string {
  const dir = mkdtempSync(join(tmpdir(), 'shiftload-bench-job-'));
  const third = Math.floor((duration_s - 120) / 3);
  const seg = (label: string, a: number, b: number) => `          - { label: ${label}, start_s: ${a}, end_s: ${b} }`;
  const text = [
    'format: shiftload-job/1',
    'title: bench',
    // the bench signal is stationary, so its rest span is as loud as its reference: no noise correction
    core ? 'settings: { noise_correction: false, fatigue: { enabled: false }, quality: { enabled: false } }' : 'settings: { noise_correction: false }',
    'workers:',
    '  - id: B1',
    `    reference: { file: ${JSON.stringify(file)}, start_s: 0, end_s: 60 }`,
    '    recordings:',
    `      - file: ${JSON.stringify(file)}`,
    '        condition: bench',
    '        channels:',
    ...[1, 2, 3, 4].map((c) => `          - { signal: "EMG ch${c}", muscle: "muscle ${c}" }`),
    '        segments:',
    seg('task-a', 120, 120 + third), seg('task-b', 120 + third, 120 + 2 * third), seg('task-c', 120 + 2 * third, duration_s),
  ].join('\n') + '\n';
  writeFileSync(join(dir, 'job.yaml'), text);
  return join(dir, 'job.yaml');
}

// `analyze`: the default analysis (quality screening and fatigue epochs on); `analyze-core`: the
// issue's pipeline alone (band-pass, envelope, MVE, APDF, gaps), with screening and fatigue off.
for (const core of [false, true]) for (const jobs of [1, 2]) benchCases.push({
  name: `analyze${core ? '-core' : ''}${jobs === 1 ? '' : `-j${jobs}`}`,
  describe: `shiftload analyze --jobs ${jobs}: zero-phase 30–400 Hz band-pass, 0.1-s RMS at 20 Hz, MVE from 60 s, 3 task segments${core ? ', quality screening and fatigue off' : ', with quality screening and fatigue epochs'} (results only)`,
  async run(file) {
    const { bytes, samples } = await fileInfo(file);
    const rec = await openRecording(file);
    const duration = rec.info.duration_s;
    await rec.close();
    const jobPath = benchJob(file, duration, core);
    try {
      const study = await loadJob(jobPath);
      const res = await runStudy(study, { jobs });
      const p50 = res.rows.filter((r) => r.segment === 'task-a').map((r) => (r.p50 ?? NaN).toFixed(3)).join('/');
      return { bytes, samples, check: `rows=${res.rows.length} task-a p50=${p50}` };
    } finally {
      rmSync(join(jobPath, '..'), { recursive: true, force: true });
    }
  },
});

benchCases.push(...csvBenchCases);
