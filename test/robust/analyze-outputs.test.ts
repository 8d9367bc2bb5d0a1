// analyze never leaves a mismatched set of outputs: a renderer that fails leaves every previous
// output untouched (the report is rendered before anything is written), and --no-report into a
// reused folder removes the earlier run's report.pdf instead of leaving it beside new results.
import { existsSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { scratchDir } from '../../lib/robust/scratch-dir.js';
import { writeSeedFiles } from '../../lib/robust/seed-files.js';

const broken = { on: false };
vi.mock('../../lib/report/render-report.js', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../lib/report/render-report.js')>();
  return {
    ...real,
    renderReport: async (...a: Parameters<typeof real.renderReport>) => {
      if (broken.on) throw new Error('renderer failed (injected)');
      return real.renderReport(...a);
    },
  };
});

const root = scratchDir('shiftload-outputs-');
let seeds = '';
beforeAll(() => { seeds = writeSeedFiles(join(root, 'seeds')); });
afterAll(() => rmSync(root, { recursive: true, force: true }));

async function run(...args: string[]) {
  const io = bufferIO();
  const code = await main(args, io);
  return { code, out: io.stdout, err: io.stderr };
}

describe('analyze output set', () => {
  it('a renderer that throws (exit 1) leaves the previous results.json, segments.csv and report.pdf byte-identical', async () => {
    const out = join(root, 'out1');
    expect((await run('analyze', join(seeds, 'tiny-job.yaml'), '--no-report', '-o', out)).code).toBe(0);
    writeFileSync(join(out, 'report.pdf'), 'previous report');
    const job = join(seeds, 'job-changed.yaml');
    writeFileSync(job, readFileSync(join(seeds, 'tiny-job.yaml'), 'utf8').replace('title: robustness seed', 'title: changed'));
    const before = new Map(readdirSync(out).map((f) => [f, readFileSync(join(out, f))]));
    broken.on = true;
    try {
      const r = await run('analyze', job, '-o', out, '--force');
      expect(r.code).toBe(1);
      expect(r.err).toContain('renderer failed (injected)');
    } finally {
      broken.on = false;
    }
    expect(readdirSync(out).sort()).toEqual([...before.keys()].sort());
    for (const [f, b] of before) expect(readFileSync(join(out, f)).equals(b), f).toBe(true);
  }, 60_000);

  it('--no-report into a reused folder removes the earlier report.pdf and says so', async () => {
    const out = join(root, 'out2');
    expect((await run('analyze', join(seeds, 'tiny-job.yaml'), '--no-report', '-o', out)).code).toBe(0);
    writeFileSync(join(out, 'report.pdf'), 'report of an earlier run');
    const r = await run('analyze', join(seeds, 'tiny-job.yaml'), '--no-report', '-o', out, '--force');
    expect(r.code, r.err).toBe(0);
    expect(existsSync(join(out, 'report.pdf'))).toBe(false);
    expect(r.out).toMatch(/removed .*report\.pdf/);
  }, 60_000);
});
