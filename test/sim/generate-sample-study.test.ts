import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadJob } from '../../lib/job/load-job.js';
import { generateSampleStudy } from '../../lib/sim/generate-sample-study.js';

const tmp = mkdtempSync(join(tmpdir(), 'shiftload-sample-'));
let result: Awaited<ReturnType<typeof generateSampleStudy>>;
beforeAll(async () => { result = await generateSampleStudy({ outDir: join(tmp, 'study') }); });
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

interface Truth {
  workers: { id: string; recordings: { condition: string; channels: { muscle: string; tasks: { label: string; percentiles_pct: Record<string, number>; gaps_per_min: number }[] }[] }[] }[];
}

describe('generateSampleStudy({ outDir })', () => {
  it('writes 4 EDF+ recordings per worker, a job file the job loader accepts and truth.json', async () => {
    expect(result.files.length).toBe(24);
    expect(result.jobPath).toBe(join(tmp, 'study', 'job.yaml'));
    const study = await loadJob(result.jobPath);
    expect(study.workers.length).toBe(6);
    for (const w of study.workers) {
      expect(w.recordings.map((r) => r.condition)).toEqual(['bench-fixed', 'bench-adjustable']);
      for (const r of w.recordings) expect(r.segments.map((s) => s.label).slice(0, 4)).toEqual(['picking', 'packing', 'labelling', 'micro-break']);
    }
  });

  it('truth.json has the designed scenario: lower trapezius load and more gaps at the adjustable bench for most, not all, workers', () => {
    const t = JSON.parse(readFileSync(result.truthPath, 'utf8')) as Truth;
    let lower = 0, moreGaps = 0;
    let forearmChange = 0;
    for (const w of t.workers) {
      const [fixed, adj] = ['bench-fixed', 'bench-adjustable'].map((c) => w.recordings.find((r) => r.condition === c)!);
      const task = (rec: typeof fixed, m: number, label: string) => rec.channels[m].tasks.find((x) => x.label === label)!;
      if (task(adj, 0, 'packing').percentiles_pct.p50 < 0.9 * task(fixed, 0, 'packing').percentiles_pct.p50) lower++;
      if (task(adj, 0, 'packing').gaps_per_min > task(fixed, 0, 'packing').gaps_per_min) moreGaps++;
      forearmChange += Math.abs(task(adj, 1, 'packing').percentiles_pct.p50 / task(fixed, 1, 'packing').percentiles_pct.p50 - 1);
    }
    expect(lower).toBeGreaterThanOrEqual(4);
    expect(lower).toBeLessThan(6);
    expect(moreGaps).toBeGreaterThanOrEqual(4);
    expect(moreGaps).toBeLessThan(6);
    expect(forearmChange / 6).toBeLessThan(0.2);
  });
});
