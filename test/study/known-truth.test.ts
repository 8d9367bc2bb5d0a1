// Known-truth test of the whole analysis: Gaussian noise whose RMS follows a designed envelope,
// with designed rest gaps, written as EDF+, analyzed from a job file through the CLI. The designed
// envelope is built from plateaus whose cumulative time shares put the 10th, 50th and 90th
// percentiles in the middle of a plateau, so the expected load levels are the plateau levels
// themselves (APDF definition, METHODS.md §1.1) and the expected gap count is the number of
// designed gaps (each far longer than gap_min_s and far below the threshold; METHODS.md §2.2).
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { butterShaper } from '../../lib/sim/butter-shaper.js';
import type { RecordingDesign } from '../../lib/sim/recording-design.js';
import { writeSimulatedEdf } from '../../lib/sim/write-simulated-edf.js';
import type { StudyResults } from '../../lib/study/results.js';

const FS = 1000;
const GRID = 20; // design grid, Hz
const MVE_UV = 400;
const NOISE_UV = 0.5;

/** One 120-s work cycle as [seconds, %MVE] plateaus. Time shares (of 120 s, gaps 3.8 %):
 * 1 % 2 s | 2 % 12 s (p10 sits mid-way) | 4 % 18 s | 6 % 48 s with a 0.6-s gap (p50) |
 * 10 % 18 s | 15 % 12 s (p90) | 25 % 6 s | gap 4 s. */
const CYCLE: [number, number][] = [
  [2, 1], [12, 2], [18, 4], [24, 6], [0.6, 0], [23.4, 6], [18, 10], [12, 15], [6.4, 25], [3.6, 0],
];
const CYCLES = 10;
const GAPS_PER_CYCLE = 2;
const EXPECTED = { p10: 2, p50: 6, p90: 15 };

function grid(steps: [number, number][], repeat: number): Float64Array {
  const per = steps.reduce((a, s) => a + s[0], 0);
  const v = new Float64Array(Math.round(per * repeat * GRID) + 1);
  let k = 0;
  for (let r = 0; r < repeat; r++) for (const [d, level] of steps) { const n = Math.round(d * GRID); v.fill(level, k, k + n); k += n; }
  v[v.length - 1] = v[v.length - 2]!;
  return v;
}

function design(file: string, kind: RecordingDesign['kind'], envelope: Float64Array, annotations: RecordingDesign['annotations'], seed: bigint): RecordingDesign {
  const duration_s = (envelope.length - 1) / GRID;
  return {
    file, kind, worker: 'W1', condition: kind === 'field' ? 'a' : null, sampling_rate_hz: FS, design_rate_hz: GRID,
    duration_s, start: '2026-01-05T08:00:00', segments: [], annotations,
    channels: [{
      muscle_id: 'trap', signal: 'EMG R trapezius', muscle: 'upper trapezius, right', mve_uv: MVE_UV, noise_uv: NOISE_UV,
      envelope, gaps: [], artifacts: {}, physical_range_uv: 3000, seed,
    }],
  };
}

describe('analyze on a designed recording (known truth)', () => {
  it('recovers p10/p50/p90 within 2 % and the designed number of gaps exactly', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'shiftload-truth-'));
    const shaper = butterShaper([20, 450], 4, FS);
    const field = grid(CYCLE, CYCLES);
    const fieldS = (field.length - 1) / GRID;
    writeSimulatedEdf(design('field.edf', 'field', field, [{ onset_s: 0, duration_s: fieldS, text: 'task: work' }], 7n), join(dir, 'field.edf'), shaper);
    // Reference: 5 s of rest, then a 20-s hold at 100 %MVE, then 5 s of rest.
    writeSimulatedEdf(design('ref.edf', 'reference', grid([[5, 0], [20, 100], [5, 0]], 1), [{ onset_s: 5, duration_s: 20, text: 'hold' }], 8n), join(dir, 'ref.edf'), shaper);
    writeSimulatedEdf(design('rest.edf', 'rest', grid([[60, 0]], 1), [{ onset_s: 0, duration_s: 60, text: 'rest' }], 9n), join(dir, 'rest.edf'), shaper);
    // RVE = mean envelope over the hold (an unbiased level, unlike the maximum of noisy windows),
    // so %RVE here equals the designed %MVE; the threshold is applied in that unit.
    writeFileSync(join(dir, 'job.yaml'), `format: shiftload-job/1
title: known truth
settings:
  band_hz: [20, 450]
  normalize: rve
  gap_threshold_unit: as-normalized
  gap_threshold_pct: 0.5
workers:
  - id: W1
    reference: { file: ref.edf, annotation: hold }
    rest: { file: rest.edf, annotation: rest }
    recordings:
      - file: field.edf
        condition: a
        channels:
          - { signal: "EMG R trapezius", muscle: "upper trapezius, right" }
        segments:
          - { label: work, start_s: 0, end_s: ${fieldS} }
`);
    const io = bufferIO();
    const code = await main(['analyze', join(dir, 'job.yaml'), '--out', join(dir, 'out'), '--no-report'], io);
    expect(io.stderr).toBe('');
    expect(code).toBe(0);
    const res = JSON.parse(readFileSync(join(dir, 'out', 'results.json'), 'utf8')) as StudyResults;
    const row = res.rows.find((r) => r.segment === 'work')!;
    expect(row.unit).toBe('%RVE');
    for (const [q, v] of Object.entries(EXPECTED)) {
      const got = (row as unknown as Record<string, number>)[q]!;
      expect(Math.abs(got / v - 1), `${q}: got ${got}, designed ${v}`).toBeLessThan(0.02);
    }
    expect(row.gaps).toBe(CYCLES * GAPS_PER_CYCLE);
    expect(row.gaps_per_min).toBeCloseTo((CYCLES * GAPS_PER_CYCLE) / (fieldS / 60), 9);
    // RVE of a 100 %MVE hold ≈ the designed MVE in µV, times the band-pass's power gain on this
    // noise (both 20–450 Hz, so close to 1): within 3 %.
    expect(Math.abs(row.reference_uv! / MVE_UV - 1)).toBeLessThan(0.03);
  });
});
