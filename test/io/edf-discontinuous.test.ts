// EDF+D: record start times from the time-keeping TALs, gap_before, and spans by clock time.
// Known truth: a file written by EdfWriter, then edited into EDF+D (test/support/edf-plus-d.ts):
// the reserved field and three time-keeping TALs (+3,+4,+5 → +7,+8,+9: a 4-s gap after record 2),
// as the EDF+ spec (Kemp & Olivan 2003) allows for discontinuous recordings.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { EdfWriter } from '../../lib/io/edf-writer.js';
import type { EdfRecording } from '../../lib/io/edf-reader.js';
import { openRecording } from '../../lib/io/open-recording.js';
import { makeDiscontinuous } from '../support/edf-plus-d.js';

const dir = mkdtempSync(join(tmpdir(), 'shiftload-edfd-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function makeD(): string {
  const p = join(dir, 'd.edf');
  const w = new EdfWriter(p, [{ label: 'idx', unit: 'uV', rate_hz: 100, physical_min: -32768, physical_max: 32767 }], { record_duration_s: 1 });
  w.write([Float64Array.from({ length: 600 }, (_, i) => i)]);
  w.close();
  makeDiscontinuous(p, 1, 6, 200, [[3, 7], [4, 8], [5, 9]]);
  return p;
}

describe('openRecording(EDF+D)', () => {
  const path = makeD();

  it('read() starts chunks at the record times and marks the gap', async () => {
    const rec = (await openRecording(path, { chunk_bytes: 1 })) as EdfRecording;
    expect(rec.info.format).toBe('EDF+D');
    const starts: number[] = [];
    const gaps: boolean[] = [];
    const values: number[] = [];
    for await (const c of rec.read({ signals: [0] })) { starts.push(c.start_s); gaps.push(c.gap_before); values.push(...c.data[0]); }
    await rec.close();
    expect(starts).toEqual([0, 1, 2, 7, 8, 9]);
    expect(gaps).toEqual([false, false, false, true, false, false]);
    expect(values).toEqual(Array.from({ length: 600 }, (_, i) => i));
  });

  it('large chunks never span a gap', async () => {
    const rec = await openRecording(path);
    const chunks: [number, boolean, number][] = [];
    for await (const c of rec.read({ signals: [0] })) chunks.push([c.start_s, c.gap_before, c.data[0].length]);
    await rec.close();
    expect(chunks).toEqual([[0, false, 300], [7, true, 300]]);
  });

  it('read({start_s, end_s}) selects samples by clock time across the gap', async () => {
    const rec = await openRecording(path, { chunk_bytes: 1 });
    const got: number[] = [];
    const starts: number[] = [];
    for await (const c of rec.read({ signals: [0], start_s: 1.5, end_s: 7.5 })) { starts.push(c.start_s); got.push(...c.data[0]); }
    await rec.close();
    expect(starts).toEqual([1.5, 2, 7]);
    expect(got).toEqual([...Array.from({ length: 150 }, (_, i) => 150 + i), ...Array.from({ length: 50 }, (_, i) => 300 + i)]);
  });
});

describe('shiftload convert of EDF+D', () => {
  it('convert --format csv keeps the clock times across the gap; --format edf fills the gap', async () => {
    const { main } = await import('../../lib/cli/main.js');
    const { bufferIO } = await import('../../lib/cli/cli-io.js');
    const path = makeD();
    const csv = join(dir, 'd.csv');
    expect(await main(['convert', path, '--format', 'csv', '-o', csv], bufferIO())).toBe(0);
    const rows = readFileSync(csv, 'utf8').trimEnd().split('\n').slice(1).map((l) => l.split(',').map(Number));
    expect(rows.length).toBe(600);
    expect(rows[299]).toEqual([2.99, 299]);
    expect(rows[300]).toEqual([7, 300]);
    const edf = join(dir, 'c.edf');
    expect(await main(['convert', path, '--format', 'edf', '-o', edf], bufferIO())).toBe(0);
    const rec = await openRecording(edf);
    expect(rec.info.format).toBe('EDF+C');
    expect(rec.info.duration_s).toBe(10);
    const v: number[] = [];
    for await (const c of rec.read({ signals: [0] })) v.push(...c.data[0]);
    await rec.close();
    expect(v.slice(295, 305).map(Math.round)).toEqual([295, 296, 297, 298, 299, 0, 0, 0, 0, 0]);
    expect(Math.round(v[700])).toBe(300);
    expect(Math.round(v[999])).toBe(599);
  });
});
