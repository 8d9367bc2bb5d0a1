import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';

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
});
