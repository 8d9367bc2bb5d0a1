// `shiftload compare`: two studies compared worker by worker. The statistics themselves are
// checked against scipy in test/stats; here: matching, labels, planning, and refusals.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import type { ResultRow } from '../../lib/study/results.js';

/** Invented per-worker median loads (test data, not measurements). */
const BEFORE = [8.1, 9.4, 7.7, 10.2, 8.8, 9.0];
const SHIFT = [-2.1, -1.6, -2.4, -0.8, -2.0, 0.3]; // lower in 5 of 6

function results(p50s: number[], condition: string): object {
  const rows = p50s.map((p50, i) => ({
    worker: `W${i + 1}`, condition, muscle: 'upper trapezius, right', signal: 'EMG', recording: `w${i + 1}.edf`,
    segment: 'packing', start_s: 0, end_s: 600, segments: 1, segment_s: 600, valid_s: 600, unit: '%MVE', reference_uv: 400, noise_uv: 2,
    p10: p50 / 3, p50, p90: p50 * 2, gap_threshold: 0.5, gaps: 10, gaps_per_min: 1, rest_pct: 2, longest_without_gap_s: 60, sustained_pct: 0,
  } as ResultRow));
  return { format: 'shiftload-results/1', tool: { name: 'shiftload', version: '0' }, title: `study ${condition}`, settings: {}, inputs: [], rows, eva: [], traces: [], apdf: [], findings: [] };
}

function files(): { a: string; b: string; dir: string } {
  const dir = mkdtempSync(join(tmpdir(), 'shiftload-compare-'));
  writeFileSync(join(dir, 'a.json'), JSON.stringify(results(BEFORE, 'line-2')));
  writeFileSync(join(dir, 'b.json'), JSON.stringify(results(BEFORE.map((v, i) => v + SHIFT[i]!), 'line-2')));
  return { a: join(dir, 'a.json'), b: join(dir, 'b.json'), dir };
}

describe('shiftload compare A B', () => {
  it('pairs workers by id and states the change in words, with the planning aid', async () => {
    const { a, b } = files();
    const io = bufferIO();
    expect(await main(['compare', a, b, '--measures', 'p50', '--json', '--detect', '1'], io)).toBe(0);
    const out = JSON.parse(io.stdout) as { comparisons: { paired: boolean; n: number; median_difference: number; lower_in: number; statement: string; planning: { workers_needed: number; detectable_difference: number; sd_of_differences: number } }[] }[];
    const c = out[0]!.comparisons[0]!;
    expect(c.paired).toBe(true);
    expect(c.n).toBe(6);
    expect(c.lower_in).toBe(5);
    // median of the differences above: sorted −2.4 −2.1 −2.0 −1.6 −0.8 0.3 → (−2.0 − 1.6)/2 = −1.8
    expect(c.median_difference).toBeCloseTo(-1.8, 9);
    expect(c.statement).toContain('lower in 5 of 6 workers');
    // planning: n = ⌈(2.8016·SD/δ)²⌉ with SD the sample SD of the differences (normal approximation)
    const sd = c.planning.sd_of_differences;
    expect(c.planning.workers_needed).toBe(Math.ceil((2.801585 * sd / 1) ** 2 - 1e-9));
    expect(c.planning.detectable_difference).toBeCloseTo(2.801585 * sd / Math.sqrt(6), 4);
  });

  it('prints statements as text by default', async () => {
    const { a, b } = files();
    const io = bufferIO();
    expect(await main(['compare', a, b, '--measures', 'p50'], io)).toBe(0);
    expect(io.stdout).toContain('upper trapezius, right, packing');
    expect(io.stdout).toContain('not anyone\'s injury risk');
  });

  it('refuses a file that is not a results file (exit 2, one line naming the file and field)', async () => {
    const { a, dir } = files();
    writeFileSync(join(dir, 'x.json'), JSON.stringify({ format: 'other' }));
    const io = bufferIO();
    expect(await main(['compare', a, join(dir, 'x.json')], io)).toBe(2);
    expect(io.stderr.trim().split('\n')).toHaveLength(1);
    expect(io.stderr).toContain('x.json');
    expect(io.stderr).toContain('format');
  });

  it('refuses a condition that the study does not have', async () => {
    const { a, b } = files();
    const io = bufferIO();
    expect(await main(['compare', a, b, '--condition-a', 'nope'], io)).toBe(2);
    expect(io.stderr).toContain('line-2');
  });
});
