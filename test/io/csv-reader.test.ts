// CSV/TSV reader: delimiter and decimal-comma detection, units, missing cells, row and time checks,
// chunk independence. Inputs are written here (known truth: the values printed into the file).
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { parseDecimal } from '../../lib/io/parse-decimal.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';
import { readAll, refusal } from '../support/read-recording.js';

const dir = mkdtempSync(join(tmpdir(), 'shiftload-csv-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function put(name: string, text: string | Buffer): string {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
}


describe('openRecording(csv)', () => {
  it('comma-delimited with a time column: rate from the time steps, unit from the header, default uV', async () => {
    const p = put('a.csv', 'time_s,EMG R [mV],EMG L\n0,1.5,-2\n0.001,2.5,3e-1\n0.002,-0.25,4\n0.003,1,5\n');
    const { info, data } = await readAll(p);
    expect(info.format).toBe('CSV');
    expect(info.signals.map((s) => [s.label, s.unit, s.rate_hz, s.samples])).toEqual([['EMG R', 'mV', 1000, 4], ['EMG L', 'uV', 1000, 4]]);
    expect(info.duration_s).toBeCloseTo(0.004, 12);
    expect(data).toEqual([[1.5, 2.5, -0.25, 1], [-2, 0.3, 4, 5]]);
    expect(info.signals[0].physical_min).toBe(-0.25);
    expect(info.signals[1].physical_max).toBe(5);
    expect(info.signals.map((s) => s.nan_count)).toEqual([0, 0]);
  });

  it('semicolon with decimal comma (European export), "time [s]" column, CRLF and a BOM', async () => {
    const p = put('b.csv', Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from('time [s];Trap R [µV];Trap L [µV]\r\n0,000;12,5;-1\r\n0,0005;13,25;-2,5\r\n0,001;14;0,125\r\n')]));
    const { info, data } = await readAll(p);
    expect(info.signals.map((s) => [s.label, s.unit, s.rate_hz])).toEqual([['Trap R', 'µV', 2000], ['Trap L', 'µV', 2000]]);
    expect(data).toEqual([[12.5, 13.25, 14], [-1, -2.5, 0.125]]);
  });

  it('tab-delimited without a time column needs rate_hz; empty cells become NaN and are counted', async () => {
    const p = put('c.tsv', 'A\tB\n1\t2\n\t3\n4\tNaN\n5\t\n');
    expect(await refusal(p)).toMatch(/c\.tsv: no time column .* no sampling rate/);
    const { info, data } = await readAll(p, { rate_hz: 800, unit: 'mV' });
    expect(info.signals.map((s) => [s.rate_hz, s.unit, s.nan_count])).toEqual([[800, 'mV', 1], [800, 'mV', 2]]);
    expect(data[0]).toEqual([1, NaN, 4, 5]);
    expect(data[1]).toEqual([2, 3, NaN, NaN]);
  });

  it('a text cell is refused naming file:line and column', async () => {
    const p = put('text.csv', 't,EMG\n0,1\n0.001,abc\n');
    expect(await refusal(p)).toBe(`${p}:3 column EMG: expected a number, got 'abc'`);
  });

  it('a ragged row is refused naming the line', async () => {
    const p = put('ragged.csv', 't,A,B\n0,1,2\n\n0.001,1\n');
    expect(await refusal(p)).toBe(`${p}:4: row has 2 cells, the header has 3`);
  });

  it('duplicate or decreasing time stamps are refused naming the line', async () => {
    expect(await refusal(put('dup.csv', 'time,A\n0,1\n0.001,1\n0.001,2\n'))).toMatch(/dup\.csv:4: time 0\.001 s does not increase/);
    expect(await refusal(put('dec.csv', 'time,A\n0,1\n0.002,1\n0.001,2\n'))).toMatch(/dec\.csv:4: time/);
  });

  it('uneven time steps (a missing row) are refused naming the line', async () => {
    expect(await refusal(put('gap.csv', 'time,A\n0,1\n0.001,1\n0.002,2\n0.004,2\n0.005,2\n'))).toMatch(/gap\.csv:5: time step 0\.002/);
  });

  it('a file with only a header is refused', async () => {
    expect(await refusal(put('hdr.csv', 'time,A\n'))).toMatch(/no data rows/);
  });

  it('read() gives identical data for any block size; lines straddle blocks; start_s/end_s select rows', async () => {
    const rng = new SplitMix64(7);
    let text = 'time;X [uV];Y [uV]\n';
    const n = 3000;
    for (let i = 0; i < n; i++) text += `${(i / 1000).toFixed(3).replace('.', ',')};${(rng.random() * 200 - 100).toFixed(4).replace('.', ',')};${i}\n`;
    const p = put('big.csv', text);
    const a = await readAll(p, { chunk_bytes: 7 });
    const b = await readAll(p, { chunk_bytes: 1 << 20 });
    expect(a.data).toEqual(b.data);
    expect(a.data[1]).toEqual(Array.from({ length: n }, (_, i) => i));
    const part = await readAll(p, { chunk_bytes: 64 }, { span: { start_s: 0.5, end_s: 1.25 } });
    expect(part.data[1]).toEqual(Array.from({ length: 750 }, (_, i) => 500 + i));
    expect(part.starts[0]).toBe(0.5);
  });
});

describe('parseDecimal(bytes, a, b, decimalComma)', () => {
  it('equals Number(text) for plain decimals, exponents and long mantissas', () => {
    const rng = new SplitMix64(11);
    const cases = ['0', '-0', '1.', '.5', '+3.25', '1e3', '2.5E-7', '-123456789.123456789', '0.1', '0.30000000000000004', '1234567890123456789', '9007199254740993', '1e-400', '4.9e-324'];
    for (let i = 0; i < 2000; i++) cases.push(((rng.random() - 0.5) * 10 ** Math.floor(rng.random() * 16 - 8)).toPrecision(1 + Math.floor(rng.random() * 17)));
    for (const c of cases) {
      const b = Buffer.from(c);
      expect(Object.is(parseDecimal(b, 0, b.length, false), Number(c)), c).toBe(true);
      const bc = Buffer.from(c.replace('.', ','));
      expect(Object.is(parseDecimal(bc, 0, bc.length, true), Number(c)), c).toBe(true);
    }
  });
  it('returns NaN for text that is not a plain number', () => {
    for (const c of ['abc', '1,5', '1.2.3', '--1', '1e', 'e5', '0x10', '.', '']) {
      const b = Buffer.from(c);
      expect(parseDecimal(b, 0, b.length, false), c).toBeNaN();
    }
  });
});
