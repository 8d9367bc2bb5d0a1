// screenRecording on the EDFlib fixtures: clipped-sample counts must equal the truth files.
// Expected values: shared/fixtures/edf/*.truth.json, EDFlib 1.23 (Debian libedf1 1.23-1)
// edfread_digital_samples, count_at_dig_max / count_at_dig_min per signal.
import { describe, expect, it } from 'vitest';
import { screenRecording } from '../../lib/quality/screen-recording.js';
import { truthFiles } from '../io/edf-truth.js';

describe('screenRecording(file) on the EDFlib fixtures', () => {
  const files = truthFiles();
  it('finds at least one fixture with clipped samples (the check below is not vacuous)', () => {
    expect(files.some((f) => f.truth.signals.some((s) => s.count_at_dig_max + s.count_at_dig_min > 0))).toBe(true);
  });
  for (const { name, path, truth } of files) {
    for (const chunk_bytes of [undefined, 1]) {
      it(`${name}${chunk_bytes ? ' (one record per chunk)' : ''}: clipped counts per signal equal count_at_dig_max/min`, async () => {
        const q = await screenRecording(path, chunk_bytes ? { open: { chunk_bytes } } : {});
        expect(q.signals.map((s) => s.label)).toEqual(truth.signals.map((s) => s.label));
        q.signals.forEach((s, j) => {
          const t = truth.signals[j]!;
          expect(s.clipped_high, t.label).toBe(t.count_at_dig_max);
          expect(s.clipped_low, t.label).toBe(t.count_at_dig_min);
          expect(s.screened_s).toBeCloseTo(t.smp_in_file / t.sample_rate_hz, 9);
          // the clipped findings of this signal name exactly these samples
          const clipped = q.findings.filter((f) => f.code === 'clipped' && f.where.signal === t.label);
          const named = clipped.reduce((a, f) => a + Number(/: (\d+) of \d+ samples/.exec(f.message)![1]), 0);
          expect(named).toBe(t.count_at_dig_max + t.count_at_dig_min);
          for (const f of clipped) expect(f.where.recording).toBe(path);
        });
      });
    }
  }
});
