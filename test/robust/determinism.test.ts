// Determinism: the same inputs and settings give byte-identical outputs whatever the folder, the
// working directory, the time zone, the locale and the number of worker threads. Each run is a
// separate process (bin/shiftload.js), so nothing is shared between them.
import { spawnSync } from 'node:child_process';
import { readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { scratchDir } from '../../lib/robust/scratch-dir.js';
import { writeSeedFiles } from '../../lib/robust/seed-files.js';

const bin = fileURLToPath(new URL('../../bin/shiftload.js', import.meta.url));
const root = scratchDir('shiftload-determinism-');
afterAll(() => rmSync(root, { recursive: true, force: true }));

/** Two environments that differ in everything that must not matter. */
const ENVS = [
  { TZ: 'UTC', LANG: 'C', LC_ALL: 'C' },
  { TZ: 'Pacific/Chatham', LANG: 'de_DE.UTF-8', LC_ALL: 'de_DE.UTF-8' },
];

function shiftload(args: string[], cwd: string, env: Record<string, string>): string {
  const r = spawnSync(process.execPath, [bin, ...args], { cwd, env: { ...process.env, ...env }, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`shiftload ${args.join(' ')} → ${r.status}: ${r.stderr}`);
  return r.stdout;
}

describe('determinism across folders, time zones, locales and --jobs', () => {
  const trees: string[] = [];
  beforeAll(() => {
    for (const name of ['first', 'second/deeper']) trees.push(writeSeedFiles(join(root, name)));
  });

  it('analyze gives byte-identical results.json, segments.csv and report.pdf (--jobs 1 vs 2, inputs in different folders)', () => {
    shiftload(['analyze', 'tiny-job.yaml', '-o', 'out-a', '--jobs', '1'], trees[0], ENVS[0]);
    shiftload(['analyze', join(trees[1], 'tiny-job.yaml'), '-o', join(root, 'elsewhere'), '--jobs', '2'], root, ENVS[1]);
    for (const f of ['results.json', 'segments.csv', 'report.pdf']) {
      const a = readFileSync(join(trees[0], 'out-a', f));
      const b = readFileSync(join(root, 'elsewhere', f));
      expect(a.length, f).toBeGreaterThan(100);
      expect(a.equals(b), f).toBe(true);
    }
    // nothing in the results names the folder it was run in
    expect(readFileSync(join(trees[0], 'out-a', 'results.json'), 'utf8')).not.toContain(root);
  }, 120_000);

  it('convert gives byte-identical EDF+ and CSV files', () => {
    for (const fmt of ['edf', 'csv']) {
      const outs = ENVS.map((env, i) => {
        const o = join(root, `conv${i}.${fmt}`);
        shiftload(['convert', join(trees[i], 'emg_3sig.bdf'), '--format', fmt, '-o', o, ...(fmt === 'csv' ? ['--signals', 'EMG R trapezius,EMG L trapezius'] : [])], trees[i], env);
        return readFileSync(o);
      });
      expect(outs[0].equals(outs[1]), fmt).toBe(true);
    }
  }, 60_000);

  it('inspect --json prints the same text', () => {
    const outs = ENVS.map((env, i) => shiftload(['inspect', 'emg_3sig.edf', '--json'], trees[i], env));
    expect(outs[0]).toBe(outs[1]);
  }, 30_000);
});
