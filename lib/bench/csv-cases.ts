// Benchmark cases on the CSV bench file (lib/bench/make-bench-csv.ts); appended to `benchCases`.
import { statSync } from 'node:fs';
import { openRecording } from '../io/open-recording.js';
import type { BenchCase } from './cases.js';

export const csvBenchCases: BenchCase[] = [
  {
    name: 'read-csv',
    describe: 'CSV input: openRecording (header pass) + read every signal as values and sum them',
    input: 'csv',
    // the CSV target is a 1-hour export (255 MB); 8 hours would be a 2 GB file to generate
    defaultHours: [1],
    async run(file) {
      const rec = await openRecording(file);
      let sum = 0;
      for await (const c of rec.read({ signals: rec.info.signals.map((s) => s.index) })) {
        for (let j = 0; j < c.data.length; j++) {
          const d = c.data[j];
          for (let i = 0; i < d.length; i++) sum += d[i];
        }
      }
      const samples = rec.info.signals.reduce((a, s) => a + s.samples, 0);
      await rec.close();
      return { bytes: statSync(file).size, samples, check: `sum=${sum.toExponential(6)} rate=${rec.info.signals[0].rate_hz}` };
    },
  },
];
