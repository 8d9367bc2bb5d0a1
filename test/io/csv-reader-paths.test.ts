// The CSV reader's two row paths (plain-number rows parsed in one pass, every other row by the
// general path) give the values written into the file, whatever the block size, and the same
// refusals at the same lines. Inputs are written here (known truth: the values printed into the file).
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { MAX_LINE_BYTES } from '../../lib/io/line-batches.js';
import { inputMsg } from '../../lib/messages.js';
import { readAll, refusal } from '../support/read-recording.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';

const dir = mkdtempSync(join(tmpdir(), 'shiftload-csv-paths-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));


/**
 * A semicolon file with decimal commas mixing plain rows and rows only the general path reads:
 * blank lines, empty and NaN cells, spaces, quotes, a 20-digit mantissa, CRLF, no final newline.
 * Returns the text and the values per column (NaN for missing cells).
 */
function mixedFile(rows: number, seed: number): { text: string; a: number[]; b: number[] } {
  const rng = new SplitMix64(seed);
  const a: number[] = [];
  const b: number[] = [];
  let text = '\ufefftime [s];A [uV];B\r\n';
  for (let i = 0; i < rows; i++) {
    const va = Math.round((rng.random() - 0.5) * 2e5) / 100;
    const vb = Math.round(rng.random() * 1e6) / 1e3;
    let ca = va.toFixed(2).replace('.', ',');
    let cb = vb.toFixed(3);
    const t = (i / 1000).toFixed(3).replace('.', ',');
    const r = rng.random();
    let eb = vb;
    if (r < 0.05) { ca = ` ${ca} `; }
    else if (r < 0.1) { cb = `"${cb}"`; }
    else if (r < 0.13) { cb = ''; eb = NaN; }
    else if (r < 0.15) { cb = 'NaN'; eb = NaN; }
    else if (r < 0.17) { cb = '1.00000000000000000001'; eb = 1; }
    else if (r < 0.19) text += '\r\n';
    else if (r < 0.2) text += '  \n';
    a.push(Number(ca.trim().replace(',', '.')));
    b.push(eb);
    text += `${t};${ca};${cb}${i === rows - 1 ? '' : r < 0.5 ? '\r\n' : '\n'}`;
  }
  return { text, a, b };
}

describe('openRecording(csv): plain-number rows and general rows', () => {
  it('read() gives the written values for any block size, with selection and start_s/end_s', async () => {
    const { text, a, b } = mixedFile(2500, 3);
    const p = join(dir, 'mixed.csv');
    writeFileSync(p, text);
    for (const chunk_bytes of [16, 17, 29, 64, 333, 4096, 1 << 20]) {
      const { info, data } = await readAll(p, { chunk_bytes }, { reversed: true });
      expect(info.signals.map((s) => [s.label, s.unit, s.rate_hz, s.samples, s.nan_count])).toEqual([['A', 'uV', 1000, 2500, 0], ['B', 'uV', 1000, 2500, b.filter(Number.isNaN).length]]);
      expect(info.signals[0].physical_min).toBe(Math.min(...a));
      expect(info.signals[1].physical_max).toBe(Math.max(...b.filter((v) => !Number.isNaN(v))));
      expect(data, `chunk_bytes ${chunk_bytes}`).toEqual([b, a]); // signals requested in reverse order
      const part = await readAll(p, { chunk_bytes }, { span: { start_s: 1.2, end_s: 1.9 }, reversed: true });
      expect(part.data).toEqual([b.slice(1200, 1900), a.slice(1200, 1900)]);
    }
  });

  it('a bad cell, a ragged row or an uneven time step after many plain rows is refused at its line for any block size', async () => {
    const { text } = mixedFile(1500, 4);
    const lines = text.split('\n');
    const row = (k: number) => { while (lines[k].split(';').length !== 3) k++; return k; }; // a data row at or after k
    const at = (k: number, edit: (l: string) => string) => lines.map((l, i) => (i === k ? edit(l) : l)).join('\n');
    const [k1, k2, k3, k4] = [row(lines.length - 400), row(lines.length - 300), row(lines.length - 200), row(lines.length - 100)];
    const cases: [string, string][] = [
      [at(k1, (l) => l.replace(/;([^;]*)$/, ';abc')), `:${k1 + 1} column B: expected a number, got 'abc'`],
      [at(k2, (l) => l.replace(/;[^;]*$/, '')), `:${k2 + 1}: row has 2 cells, the header has 3`],
      [at(k3, (l) => l.replace(/^[^;]*;/, '')), `:${k3 + 1}: row has 2 cells, the header has 3`],
      [at(k4, (l) => l.replace(/^([^;]*);/, (_, t: string) => `${(Number(t.replace(',', '.')) + 0.0005).toFixed(4).replace('.', ',')};`)), `:${k4 + 1}: time step 0.0015`],
    ];
    for (const [t, want] of cases) {
      const p = join(dir, 'bad.csv');
      writeFileSync(p, t);
      for (const chunk_bytes of [16, 61, 1 << 20]) expect((await refusal(p, { chunk_bytes })).startsWith(`${p}${want}`), `${want} chunk_bytes ${chunk_bytes}`).toBe(true);
    }
  });

  it('a line over MAX_LINE_BYTES after plain rows is refused naming its line', async () => {
    const p = join(dir, 'zeros.csv');
    writeFileSync(p, Buffer.concat([Buffer.from('time,A\n0,1\n0.001,2\n'), Buffer.alloc(MAX_LINE_BYTES + 1000), Buffer.from('\n0.002,3\n')]));
    expect(await refusal(p, {})).toBe(inputMsg.csvLineTooLong(p, 4, MAX_LINE_BYTES));
  });
});
