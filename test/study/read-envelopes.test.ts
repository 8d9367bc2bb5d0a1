// readEnvelopes over several channels at once: the channels of one rate are filtered together
// (BandFilterBank: SIMD pairs plus a scalar odd one), and must give exactly what each channel read
// alone gives, also across an EDF+D gap (known truth: a file written by EdfWriter, then edited into
// EDF+D as the EDF+ spec, Kemp & Olivan 2003, allows: records 3–5 moved 4 s later).
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { EdfWriter } from '../../lib/io/edf-writer.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';
import { readEnvelopes, type ReadEnvelopesRequest } from '../../lib/study/read-envelopes.js';
import { makeDiscontinuous } from '../support/edf-plus-d.js';

const dir = mkdtempSync(join(tmpdir(), 'shiftload-read-env-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** 3 channels × 6 s at 1000 Hz of noise (µV), made EDF+D with a 4-s gap after record 2. */
function makeD(): string {
  const p = join(dir, 'd.edf');
  const r = new SplitMix64(5);
  const sig = (label: string) => ({ label, unit: 'uV', rate_hz: 1000, physical_min: -2000, physical_max: 2000 });
  const w = new EdfWriter(p, [sig('a'), sig('b'), sig('c')], { record_duration_s: 1 });
  w.write([0, 1, 2].map((c) => Float64Array.from({ length: 6000 }, () => (r.random() - 0.5) * 200 * (c + 1))));
  w.close();
  makeDiscontinuous(p, 3, 6, 3 * 1000 * 2, [[3, 7], [4, 8], [5, 9]]); // TAL after three signals of 1000 two-byte samples
  return p;
}

describe('readEnvelopes(several channels)', () => {
  const file = makeD();
  const req = (signals: number[]): ReadEnvelopesRequest => ({
    file, signals, start_s: 0, end_s: null,
    filter: { band_hz: [20, 400], order: 4, mains_hz: 50, mains_harmonics: 3, mains_q: 30 },
    envelope: { window_s: 0.1, rate_hz: 20 }, second: { window_s: 0.5, rate_hz: 20 },
  });

  it('three channels read together equal each channel read alone, bit for bit, across an EDF+D gap', async () => {
    const together = await readEnvelopes(req([0, 1, 2]));
    expect(together.discontinuities).toBe(1);
    expect(together.end_s).toBe(10);
    for (let c = 0; c < 3; c++) {
      const alone = await readEnvelopes(req([c]));
      const a = together.channels[c]!, b = alone.channels[0]!;
      expect(a.envelope.length).toBe(200); // 10 s of clock time at 20 Hz
      expect(Array.from(a.envelope)).toEqual(Array.from(b.envelope));
      expect(Array.from(a.second!)).toEqual(Array.from(b.second!));
      // the 4 s without records are NaN; the recorded seconds are not
      expect(a.envelope.slice(62, 138).every((v) => Number.isNaN(v))).toBe(true);
      expect(a.envelope.slice(2, 58).some((v) => Number.isNaN(v))).toBe(false);
      expect(a.envelope.slice(142, 198).some((v) => Number.isNaN(v))).toBe(false);
    }
  });
});
