// lineBatches: whole lines for any block size, a final line without \n given one, the BOM skipped,
// and a line over the limit reported while the caller still knows its number.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { open } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { lineBatches } from '../../lib/io/line-batches.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';

const dir = mkdtempSync(join(tmpdir(), 'shiftload-lines-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The lines of `path` as the CSV reader splits batches: at each \n, a \r before it dropped. */
async function linesOf(path: string, blockBytes: number, maxLineBytes?: number): Promise<string[]> {
  const fh = await open(path, 'r');
  const lines: string[] = [];
  try {
    for await (const b of lineBatches(fh, blockBytes, (limit) => { throw new Error(`line ${lines.length + 1} over ${limit}`); }, maxLineBytes)) {
      expect(b.buf[b.end - 1]).toBe(0x0a);
      for (let p = b.start; p < b.end;) {
        const nl = b.buf.indexOf(0x0a, p);
        lines.push(b.buf.toString('latin1', p, nl > p && b.buf[nl - 1] === 0x0d ? nl - 1 : nl));
        p = nl + 1;
      }
    }
  } finally {
    await fh.close();
  }
  return lines;
}

describe('lineBatches(fh, blockBytes, tooLong, maxLineBytes)', () => {
  it('gives the same lines for every block size: \\n and \\r\\n endings, blank lines, no final newline, BOM', async () => {
    const rng = new SplitMix64(5);
    for (let f = 0; f < 20; f++) {
      const lines = Array.from({ length: 1 + Math.floor(rng.random() * 40) }, () => 'x'.repeat(Math.floor(rng.random() * 50)) + (rng.random() < 0.2 ? '\r' : ''));
      const bom = f % 4 === 0 ? '\ufeff' : '';
      const last = f % 3 === 0 ? '' : '\n';
      const path = join(dir, `l${f}.txt`);
      writeFileSync(path, bom + lines.join('\n') + last);
      const expected = lines.map((l) => l.replace(/\r$/, ''));
      if (last === '' && lines[lines.length - 1] === '') expected.pop(); // an empty last "line" after the final \n is no line
      for (const block of [16, 17, 23, 64, 100, 1 << 20]) expect(await linesOf(path, block), `file ${f} block ${block}`).toEqual(expected);
    }
  });

  it('an empty file gives no batch; a lone \\r gives one blank line', async () => {
    writeFileSync(join(dir, 'empty.txt'), '');
    expect(await linesOf(join(dir, 'empty.txt'), 16)).toEqual([]);
    writeFileSync(join(dir, 'cr.txt'), '\r');
    expect(await linesOf(join(dir, 'cr.txt'), 16)).toEqual(['']);
  });

  it('a line longer than maxLineBytes calls tooLong after the lines before it were handed out', async () => {
    const path = join(dir, 'long.txt');
    writeFileSync(path, 'a\nb\nc\n' + 'z'.repeat(200) + '\nd\n');
    await expect(linesOf(path, 16, 64)).rejects.toThrow('line 4 over 64');
    expect(await linesOf(path, 16, 256)).toEqual(['a', 'b', 'c', 'z'.repeat(200), 'd']);
  });
});
