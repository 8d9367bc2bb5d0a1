// EdfWriter: files written by shiftload must read back through the same reader checks as the EDFlib
// fixtures. Known-truth tests: physical data are invented here, so the expected values are the
// inputs themselves, within half a digital step (round-to-nearest in the writer).
import { mkdtempSync, readFileSync, rmSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { EdfWriter, chooseDuration, formatEdfNumber } from '../../lib/io/edf-writer.js';
import { openRecording } from '../../lib/io/open-recording.js';
import type { EdfRecording } from '../../lib/io/edf-reader.js';
import type { Annotation } from '../../lib/io/recording.js';

const dir = mkdtempSync(join(tmpdir(), 'shiftload-writer-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function signal(n: number, rate: number, amp: number, seed: number): Float64Array {
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = amp * Math.sin(2 * Math.PI * 7.3 * i / rate + seed) + 0.25 * amp * Math.sin(2 * Math.PI * 61 * i / rate);
  return x;
}

async function readAll(path: string, chunk_bytes?: number): Promise<{ rec: EdfRecording; data: number[][] }> {
  const rec = (await openRecording(path, { chunk_bytes })) as EdfRecording;
  const data: number[][] = rec.info.signals.map(() => []);
  for await (const c of rec.read({ signals: rec.info.signals.map((s) => s.index) })) c.data.forEach((d, j) => data[j].push(...d));
  await rec.close();
  return { rec, data };
}

const annotations: Annotation[] = [
  { onset_s: 0, duration_s: 1.5, text: 'rest' },
  { onset_s: 2.25, duration_s: null, text: 'électrode ✓ check' },
  { onset_s: 2.5, duration_s: 0.125, text: 'MVC 1' },
  { onset_s: 4.0001, duration_s: 2, text: 'task: lifting' },
];

describe('new EdfWriter(path, signals, options)', () => {
  for (const ext of ['edf', 'bdf']) {
    it(`write()/close() round trip (${ext}): values within half a digital step, annotations equal, header as given`, async () => {
      const path = join(dir, `rt.${ext}`);
      const rates = [1000, 1000, 500];
      const dur = 5.3; // not a whole number of records: the last record is padded
      const x = rates.map((r, j) => signal(Math.round(dur * r), r, [4000, 1500, 800][j], j));
      const sigs = rates.map((r, j) => ({ label: `EMG ${j}`, unit: 'µV', rate_hz: r, physical_min: [-5000, -2500, -1000.123456][j], physical_max: [5000, 3500, 1000.98765][j], prefilter: 'HP:10Hz', transducer: 'AgAgCl' }));
      const w = new EdfWriter(path, sigs, { record_duration_s: 0.5, start: '2025-03-04T05:06:07', patient: 'Worker 7', recording: 'line 3', annotations });
      // uneven pieces, proportional overall
      let at = 0;
      for (const step of [137, 1, 999, 2000, 2163]) {
        w.write(x.map((s, j) => s.subarray(at * rates[j] / 1000, (at + step) * rates[j] / 1000)));
        at += step;
      }
      w.close();
      expect(x[0][5]).toBe(4000 * Math.sin(2 * Math.PI * 7.3 * 5 / 1000) + 1000 * Math.sin(2 * Math.PI * 61 * 5 / 1000)); // input not modified
      const { rec, data } = await readAll(path, 1);
      expect(rec.info.format).toBe(ext === 'edf' ? 'EDF+C' : 'BDF+C');
      expect(rec.info.start).toBe('2025-03-04T05:06:07');
      expect(rec.info.record_duration_s).toBe(0.5);
      expect(rec.info.duration_s).toBe(5.5);
      expect(rec.header.patient).toBe('X X X Worker_7');
      expect(rec.header.recording).toBe('Startdate 04-MAR-2025 X X X line_3');
      rec.info.signals.forEach((s, j) => {
        expect(s.label).toBe(`EMG ${j}`);
        expect(s.unit).toBe('uV');
        expect(s.rate_hz).toBe(rates[j]);
        expect(s.prefilter).toBe('HP:10Hz');
        expect(s.physical_min).toBeLessThanOrEqual(sigs[j].physical_min);
        expect(s.physical_max).toBeGreaterThanOrEqual(sigs[j].physical_max);
        const step = (s.physical_max - s.physical_min) / (s.digital_max - s.digital_min);
        expect(data[j].length).toBe(5.5 * rates[j]);
        for (let i = 0; i < x[j].length; i++) expect(Math.abs(data[j][i] - x[j][i])).toBeLessThanOrEqual(step / 2 + 1e-9 * step);
        // padding repeats the last value
        for (let i = x[j].length; i < data[j].length; i++) expect(data[j][i]).toBe(data[j][x[j].length - 1]);
      });
      expect(rec.info.annotations.length).toBe(annotations.length);
      rec.info.annotations.forEach((a, i) => {
        expect(a.onset_s).toBeCloseTo(annotations[i].onset_s, 7);
        expect(a.duration_s).toBe(annotations[i].duration_s);
        expect(a.text).toBe(annotations[i].text);
      });
    });
  }

  it('values beyond the physical range are clipped to the digital limits and counted', async () => {
    const path = join(dir, 'clip.edf');
    const w = new EdfWriter(path, [{ label: 'A', unit: 'uV', rate_hz: 100, physical_min: -10, physical_max: 10 }]);
    const x = new Float64Array(100);
    x[3] = 50; x[4] = -50; x[5] = 10; x[6] = NaN;
    w.write([x]);
    w.close();
    const rec = await openRecording(path);
    let low = 0, high = 0;
    const got: number[] = [];
    for await (const c of rec.read({ signals: [0], digital: true })) { low += c.clipped_low[0]; high += c.clipped_high[0]; got.push(...c.data[0]); }
    await rec.close();
    expect([got[3], got[4], got[5]]).toEqual([32767, -32768, 32767]);
    // NaN → the digital value nearest physical 0 (documented): within half a step of 0
    expect(Math.abs((20 / 65535) * (got[6] + (10 / (20 / 65535) - 32767)))).toBeLessThanOrEqual(10 / 65535);
    expect([low, high]).toEqual([1, 2]);
  });

  it('abort() leaves no file; close() makes the target appear only at the end', () => {
    const path = join(dir, 'aborted.edf');
    const w = new EdfWriter(path, [{ label: 'A', unit: 'uV', rate_hz: 10, physical_min: -1, physical_max: 1 }]);
    w.write([new Float64Array(25)]);
    expect(existsSync(path)).toBe(false);
    w.abort();
    expect(existsSync(path)).toBe(false);
  });

  it('annotations crowded into one record widen the annotation signal; all survive', async () => {
    const path = join(dir, 'crowded.edf');
    const many: Annotation[] = Array.from({ length: 40 }, (_, i) => ({ onset_s: 0.5 + i * 0.001, duration_s: null, text: `event ${i}` }));
    const w = new EdfWriter(path, [{ label: 'A', unit: 'uV', rate_hz: 200, physical_min: -1, physical_max: 1 }], { annotations: many });
    w.write([new Float64Array(200 * 3)]);
    w.close();
    const { rec } = await readAll(path);
    expect(rec.info.annotations.map((a) => a.text)).toEqual(many.map((a) => a.text));
    // header bytes equal 256·(ns+1) and the file size matches the record count
    const bytes = readFileSync(path);
    expect(bytes.length).toBe(rec.header.header_bytes + rec.header.records * rec.header.record_size);
  });
});

describe('chooseDuration(rates)', () => {
  it('chooseDuration(rates) is the longest duration ≤ 1 s with whole samples per record for every rate', () => {
    expect(chooseDuration([2000, 1000, 500])).toBe(1);
    expect(chooseDuration([512.5])).toBe(0.96); // 512.5 · 0.96 = 492, the longest multiple of 2/1025 s with ≤ 6 decimals
    expect(chooseDuration([1000, 0.5])).toBe(2); // 0.5 Hz needs 2 s
    expect(chooseDuration([333.25, 1000])).toBe(4); // 1333/4 Hz and 1000 Hz: whole samples only every 4 s
  });
});

describe('formatEdfNumber(x, direction)', () => {
  it('keeps short numbers and rounds long ones outward within 8 characters', () => {
    expect(formatEdfNumber(-5000, 'down')).toBe('-5000');
    expect(formatEdfNumber(3276.7, 'up')).toBe('3276.7');
    expect(formatEdfNumber(-1000.123456, 'down')).toBe('-1000.13');
    expect(formatEdfNumber(1000.98765, 'up')).toBe('1000.988');
    expect(formatEdfNumber(0.1234567891, 'up')).toBe('0.123457');
    expect(() => formatEdfNumber(123456789012, 'up')).toThrow(/8-character/);
  });
});
