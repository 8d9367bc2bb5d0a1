import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { load } from 'js-yaml';
import { afterAll, describe, expect, it } from 'vitest';
import { InputError } from '../../lib/errors.js';
import { parseSimulationSpec } from '../../lib/sim/load-simulation-spec.js';
import { whiteShaper } from '../../lib/sim/noise-shaper.js';
import { planStudy } from '../../lib/sim/plan-study.js';
import { simulate } from '../../lib/sim/simulate.js';
import { TINY_SPEC } from './tiny-spec.js';

const tmp = mkdtempSync(join(tmpdir(), 'shiftload-sim-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));
const spec = parseSimulationSpec(TINY_SPEC, 'tiny.yaml');

function hashes(dir: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const f of readdirSync(dir).sort()) out[f] = createHash('sha256').update(readFileSync(join(dir, f))).digest('hex');
  return out;
}

/** Independent percentile for the test: R-7 with 1-based positions (Hyndman & Fan 1996). */
function r7(values: number[], p: number): number {
  const v = [...values].sort((a, b) => a - b);
  const pos = 1 + (v.length - 1) * (p / 100);
  const j = Math.floor(pos);
  return j >= v.length ? v[v.length - 1] : v[j - 1] + (pos - j) * (v[j] - v[j - 1]);
}

describe('simulate(spec, outDir, { format: "csv" })', () => {
  it('writes reference, rest and field recordings per worker, job.yaml and truth.json', async () => {
    const out = join(tmp, 'a');
    const r = await simulate(spec, out, { shaper: whiteShaper });
    expect(readdirSync(out).sort()).toEqual([
      'job.yaml', 'truth.json', 'w1-c1.csv', 'w1-c2.csv', 'w1-ref.csv', 'w1-rest.csv', 'w2-c1.csv', 'w2-c2.csv', 'w2-ref.csv', 'w2-rest.csv',
    ]);
    expect(r.samples).toBe(2 * 2 * 500 * (2 * 90 + 10 + 2 + 2 * (1 + 3 + 1 + 4)));
    const csv = readFileSync(join(out, 'w1-c1.csv'), 'utf8').split('\n');
    expect(csv[0]).toBe('time_s,EMG A [uV],EMG B [uV]');
    expect(csv.length).toBe(90 * 500 + 2); // header + rows + final newline
    expect(csv[1].split(',')[0]).toBe('0.0000');
  });

  it('the same seed gives byte-identical files (SHA-256), another seed different recordings', async () => {
    await simulate(spec, join(tmp, 'b1'), { shaper: whiteShaper, seed: 42 });
    await simulate(spec, join(tmp, 'b2'), { shaper: whiteShaper, seed: 42 });
    await simulate(spec, join(tmp, 'b3'), { shaper: whiteShaper, seed: 43 });
    const h1 = hashes(join(tmp, 'b1')), h2 = hashes(join(tmp, 'b2')), h3 = hashes(join(tmp, 'b3'));
    expect(h2).toEqual(h1);
    expect(h3['w1-c1.csv']).not.toBe(h1['w1-c1.csv']);
  });

  it('job.yaml lists every worker with reference, rest and one recording per condition, files that exist', async () => {
    const out = join(tmp, 'c');
    await simulate(spec, out, { shaper: whiteShaper });
    const job = load(readFileSync(join(out, 'job.yaml'), 'utf8')) as {
      format: string; settings: Record<string, unknown>;
      workers: { id: string; reference: { file: string; start_s: number; end_s: number }; rest: { file: string }; recordings: { file: string; condition: string; channels: { signal: string }[]; segments: { label: string; start_s: number; end_s: number }[] }[] }[];
    };
    expect(job.format).toBe('shiftload-job/1');
    expect(job.settings.band_hz).toEqual([30, 200]);
    expect(job.workers.map((w) => w.id)).toEqual(['W1', 'W2']);
    const files = new Set(readdirSync(out));
    for (const w of job.workers) {
      expect(files.has(w.reference.file)).toBe(true);
      expect(files.has(w.rest.file)).toBe(true);
      // reference span covers both trials: lead 2 s; trial 5 s + 4 s rest each
      expect(w.reference).toMatchObject({ start_s: 2, end_s: 2 + 9 + 5 });
      expect(w.recordings.map((r) => r.condition)).toEqual(['c1', 'c2']);
      for (const r of w.recordings) {
        expect(files.has(r.file)).toBe(true);
        expect(r.channels.map((c) => c.signal)).toEqual(['EMG A', 'EMG B']);
      }
      expect(w.recordings[0].segments.map((s) => s.label)).toEqual(['work', 'pause', 'work', 'pause']);
      expect(w.recordings[0].segments[3]).toEqual({ label: 'pause', start_s: 75, end_s: 90 });
    }
  });

  it('truth.json percentiles, gaps and rest equal an independent computation on the designed envelope', async () => {
    const out = join(tmp, 'd');
    await simulate(spec, out, { shaper: whiteShaper, seed: 9 });
    const truth = JSON.parse(readFileSync(join(out, 'truth.json'), 'utf8'));
    const plan = planStudy(spec, { seed: 9 });
    let checked = 0;
    for (const rec of plan.recordings.filter((r) => r.kind === 'field')) {
      const tw = truth.workers.find((w: { id: string }) => w.id === rec.worker);
      const tr = tw.recordings.find((r: { file: string }) => r.file === rec.file);
      rec.channels.forEach((c, ci) => {
        rec.segments.forEach((seg, si) => {
          const vals = Array.from(c.envelope.subarray(seg.start_s * 20, seg.end_s * 20));
          const ts = tr.channels[ci].segments[si];
          for (const p of [10, 50, 90]) expect(ts.percentiles_pct[`p${p}`]).toBeCloseTo(r7(vals, p), 8);
          // every designed gap is a run of gap-level values; no other value is below 0.5 %MVE
          const below = vals.filter((v) => v < 0.5).length;
          const gapSamples = c.gaps[si].reduce((a, g) => a + Math.round((g.end_s - g.start_s) * 20), 0);
          expect(below).toBe(gapSamples);
          expect(ts.gaps).toBe(c.gaps[si].length);
          expect(ts.gaps_per_min).toBeCloseTo(c.gaps[si].length / ((seg.end_s - seg.start_s) / 60), 9);
          expect(ts.rest_pct).toBeCloseTo((100 * below) / vals.length, 8);
          checked++;
        });
      });
    }
    expect(checked).toBe(2 * 2 * (4 + 2));
    expect(truth.workers[1].muscles[0]).toEqual({ signal: 'EMG A', muscle: 'muscle a', mve_uv: 350, noise_uv: 0.8 });
  });

  it('refuses a non-empty output folder without force', async () => {
    const out = join(tmp, 'e');
    await simulate(spec, out, { shaper: whiteShaper });
    writeFileSync(join(out, 'x.txt'), 'x');
    await expect(simulate(spec, out, { shaper: whiteShaper })).rejects.toThrow(InputError);
    await expect(simulate(spec, out, { shaper: whiteShaper })).rejects.toThrow(`${out}: output folder exists and is not empty; use --force to reuse it`);
    await simulate(spec, out, { shaper: whiteShaper, force: true });
  });

  it('an unknown variant is an InputError naming the valid ones', async () => {
    await expect(simulate(spec, join(tmp, 'f'), { shaper: whiteShaper, variant: 'huge', file: 'tiny.yaml' })).rejects.toThrow('tiny.yaml: variants: no variant "huge" (valid: short, long)');
  });
});
