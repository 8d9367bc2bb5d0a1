// EDF/EDF+/BDF+ reader against the EDFlib truth files. Every `*.truth.json` found in
// shared/fixtures/edf is used and every expected value and parameter is read from it.
// Expected: shared/fixtures/edf/*.truth.json, EDFlib 1.23 (Debian libedf1 1.23-1),
// edfread_physical_samples / edfread_digital_samples / edf_get_annotation; tolerances from the
// fixtures README ("Suggested tolerances").
import { describe, expect, it } from 'vitest';
import { secondsToSamples } from '../../lib/dsp/seconds-to-samples.js';
import { openRecording } from '../../lib/io/open-recording.js';
import type { EdfRecording } from '../../lib/io/edf-reader.js';
import { streamStats, truthFiles } from './edf-truth.js';

const files = truthFiles();

describe('openRecording(edf) against EDFlib truth files', () => {
  it('finds truth files', () => {
    expect(files.length).toBeGreaterThan(0);
  });

  for (const { name, path, truth } of files) {
    describe(name, () => {
      it('openRecording(file).info header fields equal EDFlib header', async () => {
        const rec = await openRecording(path);
        try {
          const h = truth.header;
          expect(rec.info.format.replace(/[CD]$/, '')).toBe(h.filetype_name);
          expect(rec.info.signals.length).toBe(h.edfsignals);
          expect(rec.info.duration_s).toBeCloseTo(h.file_duration_s, 7);
          expect(rec.info.record_duration_s).toBeCloseTo(h.datarecord_duration_s, 9);
          expect(rec.info.start).toBe(`${h.startdate}T${h.starttime}`);
          expect((rec as EdfRecording).header.records).toBe(h.datarecords_in_file);
          truth.signals.forEach((t, j) => {
            const s = rec.info.signals[j];
            expect(s.label.trimEnd()).toBe(t.label);
            expect(s.unit).toBe(t.physical_dimension);
            expect(s.prefilter).toBe(t.prefilter);
            expect(s.transducer).toBe(t.transducer);
            expect(s.physical_min).toBe(t.phys_min);
            expect(s.physical_max).toBe(t.phys_max);
            expect(s.digital_min).toBe(t.dig_min);
            expect(s.digital_max).toBe(t.dig_max);
            expect(s.samples).toBe(t.smp_in_file);
            expect(s.rate_hz).toBeCloseTo(t.sample_rate_hz, 9);
          });
        } finally { await rec.close(); }
      });

      it('header.raw equals raw_header cut at the specification widths', async () => {
        const rec = (await openRecording(path)) as EdfRecording;
        try {
          const raw = rec.header.raw;
          for (const [k, v] of Object.entries(truth.raw_header)) {
            if (k === 'signals' || k === 'derived' || k.startsWith('_')) continue;
            expect(raw[k], k).toBe(v);
          }
          expect(raw.signals).toEqual(truth.raw_header.signals);
          expect(rec.header.record_size).toBe(truth.raw_header.derived.data_record_size_bytes);
          expect(rec.header.bytes_per_sample).toBe(truth.raw_header.derived.bytes_per_sample);
        } finally { await rec.close(); }
      });

      it('read() physical values: first/last 20, spot checks, sums, min/max, clipped counts', async () => {
        const rec = await openRecording(path);
        try {
          const idx = truth.signals.map((_, j) => j);
          const st = await streamStats(rec, idx, false, truth.signals.map((t) => t.spot_checks.map((s) => s.index)));
          truth.signals.forEach((t, j) => {
            const tol = 1e-9 * (t.phys_max - t.phys_min);
            const s = st[j];
            expect(s.n).toBe(t.smp_in_file);
            s.first20.forEach((v, i) => expect(Math.abs(v - t.first20_physical[i])).toBeLessThanOrEqual(tol));
            s.last20.forEach((v, i) => expect(Math.abs(v - t.last20_physical[i])).toBeLessThanOrEqual(tol));
            for (const sc of t.spot_checks) expect(Math.abs(s.spots.get(sc.index)! - sc.physical)).toBeLessThanOrEqual(tol);
            expect(Math.abs(s.sum - t.sum_physical)).toBeLessThanOrEqual(1e-6);
            expect(Math.abs(s.sum / s.n - t.mean_physical)).toBeLessThanOrEqual(1e-9);
            expect(Math.abs(s.min - t.min_physical)).toBeLessThanOrEqual(tol);
            expect(Math.abs(s.max - t.max_physical)).toBeLessThanOrEqual(tol);
            expect(s.clippedHigh).toBe(t.count_at_dig_max);
            expect(s.clippedLow).toBe(t.count_at_dig_min);
          });
        } finally { await rec.close(); }
      });

      it('read({digital: true}) digital values are exact', async () => {
        const rec = await openRecording(path);
        try {
          const idx = truth.signals.map((_, j) => j);
          const st = await streamStats(rec, idx, true, truth.signals.map((t) => t.spot_checks.map((s) => s.index)));
          truth.signals.forEach((t, j) => {
            const s = st[j];
            expect(s.first20).toEqual(t.first20_digital);
            expect(s.last20).toEqual(t.last20_digital);
            for (const sc of t.spot_checks) expect(s.spots.get(sc.index)).toBe(sc.digital);
            expect(s.sum).toBe(t.sum_digital);
          });
        } finally { await rec.close(); }
      });

      it('info.annotations equal edf_get_annotation output (onset 1e-7 s, text exact)', async () => {
        const rec = await openRecording(path);
        try {
          const a = rec.info.annotations;
          expect(a.length).toBe(truth.header.annotations_in_file);
          truth.annotations.forEach((t, i) => {
            expect(Math.abs(a[i].onset_s - t.onset_s)).toBeLessThanOrEqual(1e-7);
            if (t.duration_s === null) expect(a[i].duration_s).toBeNull();
            else expect(Math.abs(a[i].duration_s! - t.duration_s)).toBeLessThanOrEqual(1e-7);
            expect(a[i].text).toBe(t.text);
          });
        } finally { await rec.close(); }
      });

      it('read() gives identical data for any chunk size (chunk independence)', async () => {
        const sizes = [1, 3000, 1 << 20];
        const results: number[][][] = [];
        for (const chunk_bytes of sizes) {
          const rec = await openRecording(path, { chunk_bytes });
          try {
            const all: number[][] = rec.info.signals.map(() => []);
            for await (const c of rec.read({ signals: rec.info.signals.map((s) => s.index) })) c.data.forEach((d, j) => all[j].push(...d));
            results.push(all);
          } finally { await rec.close(); }
        }
        expect(results[1]).toEqual(results[0]);
        expect(results[2]).toEqual(results[0]);
      });

      it('read({start_s, end_s}) gives samples secondsToSamples(start)…secondsToSamples(end) of each signal, time-aligned', async () => {
        const rec = await openRecording(path, { chunk_bytes: 1 });
        try {
          const idx = rec.info.signals.map((s) => s.index);
          const full: number[][] = idx.map(() => []);
          for await (const c of rec.read({ signals: idx, digital: true })) c.data.forEach((d, j) => full[j].push(...d));
          const dur = rec.info.duration_s;
          for (const [start, end] of [[dur * 0.3, dur * 0.71], [0.001, dur / 3], [dur / 2, dur]]) {
            const part: number[][] = idx.map(() => []);
            let firstStart = NaN;
            for await (const c of rec.read({ signals: idx, digital: true, start_s: start, end_s: end })) {
              if (Number.isNaN(firstStart)) firstStart = c.start_s;
              c.data.forEach((d, j) => part[j].push(...d));
            }
            rec.info.signals.forEach((s, j) => {
              const a = secondsToSamples(start, s.rate_hz);
              const b = secondsToSamples(end, s.rate_hz);
              expect(part[j]).toEqual(full[j].slice(a, b));
            });
            const r0 = rec.info.signals[0].rate_hz;
            expect(firstStart).toBeCloseTo(secondsToSamples(start, r0) / r0, 9);
          }
        } finally { await rec.close(); }
      });
    });
  }
});
