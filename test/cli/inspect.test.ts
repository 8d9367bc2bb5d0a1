// `shiftload inspect` through main(): JSON against the EDFlib truth files (every *.truth.json in
// shared/fixtures/edf; expected values: EDFlib 1.23 edf_hdr_struct/edf_param_struct fields,
// count_at_dig_min/max, edf_get_annotation), and every broken fixture → exit 2 with one line.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
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
