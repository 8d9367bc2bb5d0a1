// writeAtomic / AtomicFile / removeStaleTemps (lib/io/write-atomic.ts) under failure: output paths
// that a rename would mishandle are refused (exit 2), a failed rename leaves the target untouched
// and no temporary file behind, and stale temporary files of killed runs can be cleared.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { UsageError } from '../../lib/errors.js';
import { AtomicFile, removeStaleTemps, tempPathFor, writeAtomic } from '../../lib/io/write-atomic.js';

const dir = mkdtempSync(join(tmpdir(), 'shiftload-atomic-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const edf = new URL('../../../shared/fixtures/edf/base_for_broken.edf', import.meta.url).pathname;

describe('writeAtomic(target, data) output path checks', () => {
  it('an existing folder, a missing folder and a named pipe are refused with a UsageError naming the path', () => {
    const folder = join(dir, 'afolder');
    mkdirSync(folder);
    expect(() => writeAtomic(folder, 'x')).toThrow(UsageError);
    expect(() => writeAtomic(join(dir, 'nope', 'x.csv'), 'x')).toThrow(/folder for this output does not exist/);
    const fifo = join(dir, 'pipe');
    execFileSync('mkfifo', [fifo]);
    expect(() => writeAtomic(fifo, 'x')).toThrow(/not a regular file/);
    expect(statSync(fifo).isFIFO()).toBe(true); // left as it was
    expect(() => new AtomicFile(fifo)).toThrow(/not a regular file/);
  });

  it('convert -o FOLDER, -o missing/folder/x.csv and -o PIPE exit 2 with one line (were internal errors)', async () => {
    const fifo = join(dir, 'pipe2');
    execFileSync('mkfifo', [fifo]);
    for (const o of [dir, join(dir, 'missing', 'x.csv'), fifo]) {
      const io = bufferIO();
      const code = await main(['convert', edf, '--format', 'csv', '-o', o], io);
      expect(code, io.stderr).toBe(2);
      expect(io.stderr.trim().split('\n')).toHaveLength(1);
      expect(io.stderr).toContain(o);
    }
    expect(statSync(fifo).isFIFO()).toBe(true);
  });
});

describe('AtomicFile when the rename fails', () => {
  it('commit() throws, leaves what is at the target and removes the temporary file', () => {
    const target = join(dir, 'busy');
    const f = new AtomicFile(target);
    f.write(Buffer.from('abc'));
    mkdirSync(target); // a non-empty folder appears at the target: the rename cannot replace it
    writeFileSync(join(target, 'keep'), 'x');
    expect(() => f.commit()).toThrow();
    expect(readFileSync(join(target, 'keep'), 'utf8')).toBe('x');
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
