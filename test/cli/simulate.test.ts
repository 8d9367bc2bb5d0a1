import { createHash } from 'node:crypto';
import { existsSync, readdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { TINY_SPEC } from '../sim/tiny-spec.js';

const tmp = mkdtempSync(join(tmpdir(), 'shiftload-simcli-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

describe('shiftload simulate', () => {
  it('--help shows the options and examples', async () => {
    const io = bufferIO();
    expect(await main(['simulate', '--help'], io)).toBe(0);
    expect(io.stdout).toContain('--out');
    expect(io.stdout).toContain('--seed');
    expect(io.stdout).toContain('sample-jobs/parcel-packing/simulation.yaml');
    expect(io.stdout).toContain('8-hour field recordings');
  });

  it('a missing spec file is exit code 2 with one line naming the file', async () => {
    const io = bufferIO();
    expect(await main(['simulate', join(tmp, 'none.yaml'), '--out', join(tmp, 'o')], io)).toBe(2);
    expect(io.stderr).toBe(`shiftload: ${join(tmp, 'none.yaml')}: file not found\n`);
  });

  it('a negative --seed is exit code 2', async () => {
    const io = bufferIO();
    expect(await main(['simulate', 'x.yaml', '--out', join(tmp, 'o'), '--seed', '-3'], io)).toBe(2);
    expect(io.stderr).toBe('shiftload: --seed: expected a whole number ≥ 0, got -3\n');
  });

  it('writes recordings, job.yaml and truth.json; --seed and --format override the spec; a second run into the folder is refused', async () => {
    const spec = join(tmp, 'tiny.yaml');
    writeFileSync(spec, TINY_SPEC);
    const out = join(tmp, 'run');
    const io = bufferIO();
    expect(await main(['simulate', spec, '--out', out, '--seed', '17', '--format', 'edf'], io)).toBe(0);
    expect(io.stdout).toContain('8 recordings (edf, variant short, seed 17)');
    for (const f of ['w1-ref.edf', 'w1-rest.edf', 'w1-c1.edf', 'w2-c2.edf', 'job.yaml', 'truth.json']) expect(existsSync(join(out, f))).toBe(true);
    expect(JSON.parse(readFileSync(join(out, 'truth.json'), 'utf8')).seed).toBe(17);
    const again = bufferIO();
    expect(await main(['simulate', spec, '--out', out], again)).toBe(2);
    expect(again.stderr).toBe(`shiftload: ${out}: output folder exists and is not empty; use --force to reuse it\n`);
  });

  it('the same --seed gives byte-identical folders with the default Butterworth model (SHA-256 of every file)', async () => {
    const spec = join(tmp, 'tiny2.yaml');
    writeFileSync(spec, TINY_SPEC);
    const sums = async (out: string) => {
      expect(await main(['simulate', spec, '--out', out, '--seed', '99'], bufferIO())).toBe(0);
      return readdirSync(out).sort().map((f) => [f, createHash('sha256').update(readFileSync(join(out, f))).digest('hex')]);
    };
    const a = await sums(join(tmp, 'same1'));
    const b = await sums(join(tmp, 'same2'));
    expect(a.length).toBe(10);
    expect(b).toEqual(a);
  });
});
