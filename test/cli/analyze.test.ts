// `shiftload analyze` through the CLI: bad jobs stop with exit 2 and one line naming the job file,
// line and key; outputs are refused over inputs and over non-empty folders; a rerun gives the same
// bytes.
import { spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { FIXTURE_EDF, fixtureJobYaml } from '../support/fixture-job.js';

const fixture = FIXTURE_EDF;

function job(body: string): { dir: string; job: string } {
  const dir = mkdtempSync(join(tmpdir(), 'shiftload-analyze-'));
  copyFileSync(fixture, join(dir, 'rec.edf'));
  writeFileSync(join(dir, 'job.yaml'), body);
  return { dir, job: join(dir, 'job.yaml') };
}

const GOOD = fixtureJobYaml({ title: 'fixture' });

async function run(args: string[]) {
  const io = bufferIO();
  const code = await main(args, io);
  return { code, ...io };
}

describe('shiftload analyze', () => {
  it('writes results.json and segments.csv and says so', async () => {
    const { dir, job: j } = job(GOOD);
    const r = await run(['analyze', j, '--no-report']);
    expect(r.code).toBe(0);
    expect(existsSync(join(dir, 'job-results', 'results.json'))).toBe(true);
    expect(existsSync(join(dir, 'job-results', 'segments.csv'))).toBe(true);
    expect(r.stdout).toContain('results.json');
  });

  it('gives byte-identical results.json and segments.csv on a rerun', async () => {
    const { dir, job: j } = job(GOOD);
    await run(['analyze', j, '--no-report', '-o', join(dir, 'a')]);
    await run(['analyze', j, '--no-report', '-o', join(dir, 'b')]);
    for (const f of ['results.json', 'segments.csv']) {
      expect(readFileSync(join(dir, 'a', f))).toEqual(readFileSync(join(dir, 'b', f)));
    }
  });

  it('gives byte-identical outputs with --jobs 1 and --jobs 2 (worker threads)', async () => {
    const { dir } = job(GOOD);
    // two recordings so that two workers really run at once
    copyFileSync(join(dir, 'rec.edf'), join(dir, 'rec2.edf'));
    const two = GOOD.replace(/(      - file: rec\.edf[\s\S]*)$/, (m) => m + m.replace('rec.edf', 'rec2.edf').replace('condition: a', 'condition: b'));
    writeFileSync(join(dir, 'job.yaml'), two);
    const j = join(dir, 'job.yaml');
    expect((await run(['analyze', j, '--no-report', '-o', join(dir, 'j1'), '--jobs', '1'])).code).toBe(0);
    const r2 = await run(['analyze', j, '--no-report', '-o', join(dir, 'j2'), '--jobs', '2']);
    expect(r2.stderr).toBe('');
    for (const f of ['results.json', 'segments.csv']) {
      expect(readFileSync(join(dir, 'j2', f))).toEqual(readFileSync(join(dir, 'j1', f)));
    }
    expect(JSON.parse(readFileSync(join(dir, 'j2', 'results.json'), 'utf8')).rows.some((r: { condition: string }) => r.condition === 'b')).toBe(true);
  });

  it('the launcher finishes an analysis with --jobs 2 (worker threads keep the process alive)', () => {
    const { dir, job: j } = job(GOOD);
    const bin = new URL('../../bin/shiftload.js', import.meta.url).pathname;
    const r = spawnSync(process.execPath, [bin, 'analyze', j, '--no-report', '--jobs', '2', '-o', join(dir, 'o')], { encoding: 'utf8' });
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(existsSync(join(dir, 'o', 'results.json'))).toBe(true);
  });

  it('writes report.pdf identical to `shiftload report` of the written results.json', async () => {
    const { dir, job: j } = job(GOOD);
    expect((await run(['analyze', j, '-o', join(dir, 'o')])).code).toBe(0);
    expect((await run(['report', join(dir, 'o', 'results.json'), '-o', join(dir, 'again.pdf')])).code).toBe(0);
    expect(readFileSync(join(dir, 'again.pdf'))).toEqual(readFileSync(join(dir, 'o', 'report.pdf')));
  });

  it('refuses a non-empty output folder without --force (exit 2), accepts it with --force', async () => {
    const { dir, job: j } = job(GOOD);
    mkdirSync(join(dir, 'out'));
    writeFileSync(join(dir, 'out', 'keep.txt'), 'x');
    const r = await run(['analyze', j, '--no-report', '-o', join(dir, 'out')]);
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect((await run(['analyze', j, '--no-report', '-o', join(dir, 'out'), '--force'])).code).toBe(0);
    expect(readFileSync(join(dir, 'out', 'keep.txt'), 'utf8')).toBe('x');
  });

  const bad: [string, string, RegExp][] = [
    ['an unknown key', GOOD.replace('band_hz', 'band_hzz'), /job\.yaml:4 settings\.band_hzz: .*did you mean band_hz/],
    ['a missing file', GOOD.replace('- file: rec.edf', '- file: nope.edf'), /job\.yaml:10 .*recordings\[0\]\.file.*nope\.edf/],
    ['a missing signal', GOOD.replace('"EMG R trapezius"', '"EMG R trap"'), /job\.yaml:13 .*channels\[0\]\.signal: no signal 'EMG R trap'/],
    ['an empty segment list', GOOD.replace('segments: annotations', 'segments: []'), /job\.yaml:14 .*segments/],
  ];
  for (const [what, body, pattern] of bad) {
    it(`stops on ${what} with exit 2 and one line naming the file, line and key`, async () => {
      const { job: j } = job(body);
      const r = await run(['analyze', j, '--no-report']);
      expect(r.code).toBe(2);
      const lines = r.stderr.trim().split('\n');
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(pattern);
    });
  }
});
