// `shiftload inspect` through main(): JSON against the EDFlib truth files (every *.truth.json in
// shared/fixtures/edf; expected values: EDFlib 1.23 edf_hdr_struct/edf_param_struct fields,
// count_at_dig_min/max, edf_get_annotation), and every broken fixture → exit 2 with one line.
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { fixturesDir, truthFiles } from '../io/edf-truth.js';

describe('shiftload inspect FILE --json', () => {
  for (const { name, path, truth } of truthFiles()) {
    it(`inspect ${name} --json reports header, signals, clipping and annotations as EDFlib reads them`, async () => {
      const io = bufferIO();
      expect(await main(['inspect', path, '--json'], io)).toBe(0);
      const r = JSON.parse(io.stdout);
      expect(r.format.replace(/[CD]$/, '')).toBe(truth.header.filetype_name);
      expect(r.start).toBe(`${truth.header.startdate}T${truth.header.starttime}`);
      expect(r.duration_s).toBeCloseTo(truth.header.file_duration_s, 7);
      expect(r.signals.length).toBe(truth.header.edfsignals);
      truth.signals.forEach((t, j) => {
        const s = r.signals[j];
        expect([s.label, s.unit, s.prefilter]).toEqual([t.label, t.physical_dimension, t.prefilter]);
        expect([s.physical_min, s.physical_max, s.digital_min, s.digital_max]).toEqual([t.phys_min, t.phys_max, t.dig_min, t.dig_max]);
        expect(s.rate_hz).toBeCloseTo(t.sample_rate_hz, 9);
        expect(s.samples).toBe(t.smp_in_file);
        expect(s.clipped_high).toBe(t.count_at_dig_max);
        expect(s.clipped_low).toBe(t.count_at_dig_min);
        expect(s.clipped_share).toBeCloseTo((t.count_at_dig_max + t.count_at_dig_min) / t.smp_in_file, 12);
      });
      expect(r.annotations.length).toBe(truth.annotations.length);
      truth.annotations.forEach((a, i) => {
        expect(Math.abs(r.annotations[i].onset_s - a.onset_s)).toBeLessThanOrEqual(1e-7);
        if (a.duration_s !== null) expect(Math.abs(r.annotations[i].duration_s - a.duration_s)).toBeLessThanOrEqual(1e-7);
        else expect(r.annotations[i].duration_s).toBeNull();
        expect(r.annotations[i].text).toBe(a.text);
      });
    });

    it(`inspect ${name} prints an aligned table with every label and annotation text`, async () => {
      const io = bufferIO();
      expect(await main(['inspect', path], io)).toBe(0);
      for (const t of truth.signals) expect(io.stdout).toContain(t.label);
      for (const a of truth.annotations) expect(io.stdout).toContain(a.text);
      const lines = io.stdout.split('\n');
      const head = lines.findIndex((l) => l.startsWith('#'));
      // right-aligned 'samples' column: every row ends that column at the same position
      const end = lines[head].indexOf('samples') + 'samples'.length;
      truth.signals.forEach((t, j) => expect(lines[head + 1 + j].slice(0, end).trimEnd().endsWith(String(t.smp_in_file))).toBe(true));
    });
  }
});

describe('shiftload inspect BROKEN', () => {
  const dir = join(fixturesDir, 'broken');
  const files = readdirSync(dir).filter((f) => !f.endsWith('.json'));
  it('finds broken fixtures', () => expect(files.length).toBeGreaterThan(0));
  for (const f of files) {
    it(`inspect broken/${f} exits 2 with one line naming the file, no stack trace`, async () => {
      const io = bufferIO();
      expect(await main(['inspect', join(dir, f)], io)).toBe(2);
      const lines = io.stderr.trim().split('\n');
      expect(lines).toHaveLength(1);
      expect(lines[0]).toContain(f);
      expect(io.stderr).not.toMatch(/\bat .*\.[jt]s:\d+/);
      expect(io.stdout).toBe('');
    });
  }
  it('inspect of a missing file exits 2', async () => {
    const io = bufferIO();
    expect(await main(['inspect', join(dir, 'no-such.edf')], io)).toBe(2);
    expect(io.stderr).toMatch(/no-such\.edf: file not found/);
  });
});

describe('shiftload inspect CSV', () => {
  const tmp = mkdtempSync(join(tmpdir(), 'shiftload-inspect-'));
  afterAll(() => rmSync(tmp, { recursive: true, force: true }));
  const put = (name: string, text: string) => { const p = join(tmp, name); writeFileSync(p, text); return p; };

  it('inspect x.csv --json reports rate, unit and empty cells (nan_count)', async () => {
    const p = put('ok.csv', 'time;EMG [uV]\n0;1,5\n0,001;\n0,002;2\n');
    const io = bufferIO();
    expect(await main(['inspect', p, '--json'], io)).toBe(0);
    const r = JSON.parse(io.stdout);
    expect(r.format).toBe('CSV');
    expect(r.signals[0]).toMatchObject({ label: 'EMG', unit: 'uV', rate_hz: 1000, samples: 3, nan_count: 1, digital_min: null, clipped_low: 0, clipped_high: 0 });
  });
  it('inspect ragged.csv exits 2 with the line number, one line', async () => {
    const p = put('ragged.csv', 'time,A,B\n0,1,2\n0.001,1,2,3\n');
    const io = bufferIO();
    expect(await main(['inspect', p], io)).toBe(2);
    expect(io.stderr).toBe(`shiftload: ${p}:3: row has 4 cells, the header has 3\n`);
  });
  it('inspect text.csv exits 2 naming line and column', async () => {
    const p = put('text.csv', 'time,A\n0,1\n0.001,x1\n');
    const io = bufferIO();
    expect(await main(['inspect', p], io)).toBe(2);
    expect(io.stderr).toBe(`shiftload: ${p}:3 column A: expected a number, got 'x1'\n`);
  });
  it('inspect norate.csv --rate 500 reads a file without a time column', async () => {
    const p = put('norate.csv', 'A,B\n1,2\n3,4\n');
    const io = bufferIO();
    expect(await main(['inspect', p, '--rate', '500', '--json'], io)).toBe(0);
    expect(JSON.parse(io.stdout).duration_s).toBe(2 / 500);
  });
});
