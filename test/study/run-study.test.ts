// runStudy on the EDFlib fixture recording: results do not depend on how the file is chunked,
// the same inputs give the same bytes, and references pass through the same chain as field data.
import { copyFileSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadJob } from '../../lib/job/load-job.js';
import { runStudy } from '../../lib/study/run-study.js';
import { stableJson } from '../../lib/study/stable-json.js';
import { FIXTURE_EDF, fixtureJobYaml } from '../support/fixture-job.js';

const fixture = FIXTURE_EDF;

function makeJob(settings = ''): string {
  const dir = mkdtempSync(join(tmpdir(), 'shiftload-run-'));
  copyFileSync(fixture, join(dir, 'rec.edf'));
  writeFileSync(join(dir, 'job.yaml'), fixtureJobYaml({ settings, channels: [['EMG R trapezius', 'upper trapezius, right'], ['EMG R forearm', 'forearm extensors, right']] }));
  return join(dir, 'job.yaml');
}

describe('runStudy(study)', () => {
  it('gives byte-identical results for any reader chunk size', async () => {
    const study = await loadJob(makeJob());
    const a = stableJson(await runStudy(study, { open: { chunk_bytes: 1 } }));      // one record per chunk
    const b = stableJson(await runStudy(study, { open: { chunk_bytes: 1 << 20 } }));
    const c = stableJson(await runStudy(study, { open: { chunk_bytes: 7000 } }));
    expect(a).toBe(b);
    expect(a).toBe(c);
  });

  it('writes one row per channel × (segment + all) with the configured percentiles', async () => {
    const res = await runStudy(await loadJob(makeJob('  quality: { exclude: false }')));
    const segs = res.rows.filter((r) => r.signal === 'EMG R trapezius').map((r) => r.segment);
    expect(segs[segs.length - 1]).toBe('all');
    expect(res.rows.every((r) => r.unit === '%MVE')).toBe(true);
    for (const r of res.rows) expect(r.p10! <= r.p50! && r.p50! <= r.p90!).toBe(true);
    const all = res.rows.find((r) => r.segment === 'all' && r.signal === 'EMG R trapezius')!;
    expect(all.valid_s).toBeCloseTo(10, 6); // 10 records of 1 s (truth file header)
  });

  it('excludes the clipped second found by the screening and reports the exact clipped count', async () => {
    // expected count: shared/fixtures/edf/emg_3sig.edf.truth.json, EDFlib 1.23 count_at_dig_max
    const truth = JSON.parse(readFileSync(fixture + '.truth.json', 'utf8')) as { signals: { label: string; count_at_dig_max: number; count_at_dig_min: number }[] };
    const t = truth.signals.find((q) => q.label === 'EMG R trapezius')!;
    const res = await runStudy(await loadJob(makeJob()));
    const clipped = res.findings.filter((f) => f.code === 'clipped' && f.where.signal === 'EMG R trapezius');
    expect(clipped.length).toBeGreaterThan(0);
    const all = res.rows.find((r) => r.segment === 'all' && r.signal === 'EMG R trapezius')!;
    expect(all.valid_s).toBeLessThan(10);
    expect(all.valid_s).toBeGreaterThan(8);
    const q = (res as { quality?: { signal: string; clipped_samples?: number }[] }).quality;
    expect(q).toBeDefined();
    expect(t.count_at_dig_max + t.count_at_dig_min).toBeGreaterThan(0);
    expect(clipped.map((f) => f.message).join(' ')).toContain(String(t.count_at_dig_max + t.count_at_dig_min));
  });

  it('normalizes so that the reference span itself reaches about 100 %MVE', async () => {
    // The MVE is the highest 1-s moving RMS inside the reference span; the 0.1-s envelope inside
    // that span must therefore hover around 100 % (common practice: MVE normalization definition).
    const dir = makeJob('  trace_step_s: 1');
    const study = await loadJob(dir);
    const res = await runStudy(study);
    const ref = study.workers[0]!.recordings[0]!.reference[0]!;
    const trace = res.traces.find((t) => t.muscle === 'upper trapezius, right')!;
    expect(trace.unit).toBe('%MVE');
    const i0 = Math.ceil(ref.start_s / trace.step_s), i1 = Math.floor(ref.end_s / trace.step_s);
    const inside = trace.mean.slice(i0, i1).filter((v): v is number => v !== null);
    const mean = inside.reduce((s, v) => s + v, 0) / inside.length;
    expect(mean).toBeGreaterThan(70);
    expect(mean).toBeLessThan(105);
  });
});

describe('runStudy(study) with signals in mV', () => {
  it('converts every amplitude to µV: a mV copy of a recording gives the same µV results', async () => {
    const { convertRecording } = await import('../../lib/cli/convert.js');
    const dir = mkdtempSync(join(tmpdir(), 'shiftload-units-'));
    await convertRecording(fixture, { format: 'csv', out: join(dir, 'uv.csv'), signals: ['EMG R forearm'] });
    const lines = readFileSync(join(dir, 'uv.csv'), 'utf8').trim().split('\n');
    // same values in mV (÷1000), header unit [mV] (CSV reader: `name [unit]`)
    const mv = ['time_s,EMG R forearm [mV]', ...lines.slice(1).map((l) => { const [t, v] = l.split(','); return `${t},${Number(v) / 1000}`; })];
    writeFileSync(join(dir, 'mv.csv'), mv.join('\n') + '\n');
    const job = (file: string) => {
      const p = join(dir, `${file}.yaml`);
      writeFileSync(p, `format: shiftload-job/1
title: units
settings: { band_hz: [20, 200], normalize: none, noise_correction: false }
workers:
  - id: W1
    recordings:
      - file: ${file}
        condition: a
        channels: [{ signal: "EMG R forearm", muscle: forearm }]
        segments: [{ label: all-of-it, start_s: 0, end_s: 9 }]
`);
      return p;
    };
    const a = await runStudy(await loadJob(job('uv.csv')));
    const b = await runStudy(await loadJob(job('mv.csv')));
    const ra = a.rows.find((r) => r.segment === 'all-of-it')!;
    const rb = b.rows.find((r) => r.segment === 'all-of-it')!;
    expect(rb.unit).toBe('uV');
    for (const q of ['p10', 'p50', 'p90'] as const) expect(Math.abs(rb[q]! / ra[q]! - 1)).toBeLessThan(1e-9);
    expect(b.findings.some((f) => f.code === 'unit-unknown')).toBe(false);
  });
});
