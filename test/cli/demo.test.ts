// `shiftload demo` as a validation: the sample study is simulated with known truth (designed
// envelopes, sim/truth.json), and its analysis must recover it.
//
// What "recover" means, per measure (tolerances stated here):
// - Load levels are compared in µV: the designed level × the designed MVE × the analysis filter's
//   amplitude gain on the simulated noise spectrum, g = sqrt(Σ|H_sim|²|H_ana|⁴ / Σ|H_sim|²) (output
//   power of filtered noise, a linear-systems textbook fact; |H_ana|⁴ because the filter runs
//   forward and backward). The %MVE values cannot be compared directly: the MVE is the highest
//   1-s moving RMS of a noisy signal, which lies a few percent above the designed level by
//   construction (checked separately below).
//   p50 and p90: the median over all rows of measured/designed within 2 %.
//   p10: the same for rows whose designed p10 is at least 1 %MVE (below that the noise floor and
//   the noise correction dominate).
// - MVE estimate: between 0 and 12 % above designed MVE × g for every worker and muscle (the
//   maximum of ~25 noisy 1-s windows).
// - Gaps: total over the study within 5 % of the designed total; every row within one gap.
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { butter } from '../../lib/dsp/butter.js';
import { mainsNotch } from '../../lib/dsp/mains-notch.js';
import { sosfreqz } from '../../lib/dsp/sosfreqz.js';
import { SAMPLE_STUDY_SPEC } from '../../lib/sim/generate-sample-study.js';
import { loadSimulationSpec } from '../../lib/sim/load-simulation-spec.js';
import type { ResultRow, StudyResults } from '../../lib/study/results.js';

interface TruthTask { label: string; percentiles_pct: Record<string, number>; gaps: number; gaps_per_min: number }
interface Truth {
  workers: { id: string; recordings: { condition: string; channels: { muscle: string; mve_uv: number; tasks: TruthTask[] }[] }[] }[];
}

function median(v: number[]): number {
  const s = [...v].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/** Amplitude gain of the analysis chain on the simulated noise (see the header). */
function filterGain(results: StudyResults): number {
  const spec = loadSimulationSpec(SAMPLE_STUDY_SPEC);
  const fs = spec.sampling_rate_hz;
  const set = results.settings as { band_hz: [number, number]; filter_order: number; mains_hz: 50 | 60 | 'none'; mains_harmonics: number; mains_q: number };
  const f = Float64Array.from({ length: 20000 }, (_, i) => ((i + 0.5) / 20000) * (fs / 2));
  const hs = sosfreqz(butter(spec.noise_order, spec.noise_band_hz, { btype: 'bandpass', fs }), f, fs);
  const ha = sosfreqz(butter(set.filter_order, set.band_hz, { btype: 'bandpass', fs }), f, fs);
  const hn = set.mains_hz === 'none' ? null : sosfreqz(mainsNotch(set.mains_hz, fs, { harmonics: set.mains_harmonics, Q: set.mains_q }), f, fs);
  let num = 0, den = 0;
  for (let i = 0; i < f.length; i++) {
    const a = ha[i]! * (hn ? hn[i]! : 1);
    num += hs[i]! ** 2 * a ** 4;
    den += hs[i]! ** 2;
  }
  return Math.sqrt(num / den);
}

describe('shiftload demo', () => {
  it('generates, analyzes and recovers the designed truth of the sample study', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'shiftload-demo-'));
    const io = bufferIO();
    const code = await main(['demo', '--out', dir, '--no-report'], io);
    expect(io.stderr).not.toContain('error');
    expect(code).toBe(0);
    expect(io.stdout).toContain('segments.csv');
    const results = JSON.parse(readFileSync(join(dir, 'results', 'results.json'), 'utf8')) as StudyResults;
    const truth = JSON.parse(readFileSync(join(dir, 'study', 'truth.json'), 'utf8')) as Truth;
    const g = filterGain(results);
    expect(g).toBeGreaterThan(0.8);
    expect(g).toBeLessThan(1);

    const row = (w: string, c: string, m: string, t: string) => results.rows.find((r) => r.worker === w && r.condition === c && r.muscle === m && r.segment === t) as ResultRow & Record<string, number>;
    const ratios: Record<string, number[]> = { p10: [], p50: [], p90: [] };
    let gapsMeasured = 0, gapsDesigned = 0, rows = 0;
    for (const w of truth.workers) for (const rec of w.recordings) for (const ch of rec.channels) {
      const r0 = row(w.id, rec.condition, ch.muscle, 'all');
      const mveRatio = r0.reference_uv! / (ch.mve_uv * g);
      expect(mveRatio, `MVE estimate of ${w.id} ${ch.muscle}`).toBeGreaterThan(1.0);
      expect(mveRatio, `MVE estimate of ${w.id} ${ch.muscle}`).toBeLessThan(1.12);
      for (const task of ch.tasks) {
        const r = row(w.id, rec.condition, ch.muscle, task.label);
        expect(r, `row ${w.id} ${rec.condition} ${ch.muscle} ${task.label}`).toBeDefined();
        rows++;
        for (const q of ['p10', 'p50', 'p90']) {
          const designed = task.percentiles_pct[q]!;
          if (q === 'p10' && designed < 1) continue;
          ratios[q]!.push((r[q]! * r.reference_uv!) / (designed * ch.mve_uv * g));
        }
        gapsMeasured += r.gaps;
        gapsDesigned += task.gaps;
        expect(Math.abs(r.gaps - task.gaps), `gaps in ${w.id} ${rec.condition} ${ch.muscle} ${task.label}`).toBeLessThanOrEqual(1);
      }
    }
    expect(rows).toBeGreaterThan(50);
    for (const q of ['p10', 'p50', 'p90']) {
      expect(ratios[q]!.length).toBeGreaterThan(20);
      expect(Math.abs(median(ratios[q]!) - 1), `median measured/designed ${q}`).toBeLessThan(0.02);
    }
    expect(Math.abs(gapsMeasured / gapsDesigned - 1)).toBeLessThan(0.05);
  }, 180_000);

  it('refuses a folder with other files unless --force, and refreshes its own folder', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'shiftload-demo-'));
    const { writeFileSync } = await import('node:fs');
    writeFileSync(join(dir, 'mine.txt'), 'keep');
    const io = bufferIO();
    expect(await main(['demo', '--out', dir, '--no-report'], io)).toBe(2);
    expect(io.stderr.trim().split('\n')).toHaveLength(1);
    expect(existsSync(join(dir, 'study'))).toBe(false);
  });
});
