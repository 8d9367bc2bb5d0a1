// writeAtomic / AtomicFile / removeStaleTemps (lib/io/write-atomic.ts) under failure: a write that
// cannot be renamed into place leaves the target untouched and no temporary file behind.
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { AtomicFile, removeStaleTemps, tempPathFor, writeAtomic } from '../../lib/io/write-atomic.js';

const dir = mkdtempSync(join(tmpdir(), 'shiftload-atomic-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('writeAtomic(target, data) when the rename fails', () => {
  it('throws, leaves the target as it was and removes its temporary file', () => {
    const target = join(dir, 'busy');
    mkdirSync(target);
    writeFileSync(join(target, 'keep'), 'x'); // a non-empty folder cannot be replaced by a file
    expect(() => writeAtomic(target, 'new content')).toThrow();
    expect(readFileSync(join(target, 'keep'), 'utf8')).toBe('x');
    expect(existsSync(tempPathFor(target))).toBe(false);
  });
  it('AtomicFile.commit() does the same', () => {
    const target = join(dir, 'busy2');
    mkdirSync(target);
    writeFileSync(join(target, 'keep'), 'x');
    const f = new AtomicFile(target);
    f.write(Buffer.from('abc'));
    expect(() => f.commit()).toThrow();
    expect(existsSync(tempPathFor(target))).toBe(false);
  });
});

describe('removeStaleTemps(dir, names)', () => {
  it('removes temporary files of the named outputs whose process is gone, keeps the rest', () => {
    const d = join(dir, 'stale');
    mkdirSync(d);
    const dead = (1 << 22) + 7; // above Linux's default pid_max: no such process
    const files = [`.results.json.${dead}.tmp`, `.results.json.${process.pid}.tmp`, `.other.txt.${dead}.tmp`, 'results.json', '.results.json.tmp'];
    for (const f of files) writeFileSync(join(d, f), 'x');
    expect(removeStaleTemps(d, ['results.json', 'segments.csv'])).toEqual([`.results.json.${dead}.tmp`]);
    expect(readdirSync(d).sort()).toEqual(files.slice(1).sort());
  });
  it('returns [] for a folder that does not exist', () => {
    expect(removeStaleTemps(join(dir, 'nope'), ['results.json'])).toEqual([]);
  });
});
