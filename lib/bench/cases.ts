// The benchmark cases. Each runs in its own child process on the bench file and reports how much it
// read; the runner measures wall time and peak RSS. Add a case by appending to `benchCases`.
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { convertRecording } from '../cli/convert.js';
import { inspectRecording } from '../cli/inspect.js';
import { openRecording } from '../io/open-recording.js';

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
