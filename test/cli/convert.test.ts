// `shiftload convert` through main() and convertRecording(): CSV ↔ EDF+ round trips, spans and
// annotations, refusals. Reference data: shared/fixtures/edf (EDFlib 1.23 files, values as EDFlib
// reads them) and CSV files written here with known values.
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync, copyFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { convertRecording } from '../../lib/cli/convert.js';
import { main } from '../../lib/cli/main.js';
import { openRecording } from '../../lib/io/open-recording.js';
import { secondsToSamples } from '../../lib/dsp/seconds-to-samples.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';
import { truthFiles } from '../io/edf-truth.js';

const tmp = mkdtempSync(join(tmpdir(), 'shiftload-convert-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

async function readAll(path: string, digital = false, span: { start_s?: number; end_s?: number } = {}) {
  const rec = await openRecording(path);
  const data: number[][] = rec.info.signals.map(() => []);
  for await (const c of rec.read({ signals: rec.info.signals.map((s) => s.index), digital, ...span })) c.data.forEach((d, j) => data[j].push(...d));
  await rec.close();
  return { info: rec.info, data };
}

function parseCsv(path: string): { head: string[]; cols: number[][] } {
  const lines = readFileSync(path, 'utf8').trimEnd().split('\n');
  const head = lines[0].split(',');
  const cols: number[][] = head.map(() => []);
  for (const l of lines.slice(1)) l.split(',').forEach((c, j) => cols[j].push(c === '' ? NaN : Number(c)));
  return { head, cols };
}

describe('shiftload convert FILE --format csv|edf', () => {
  it('CSV → EDF+ → CSV keeps every value within one digital step (16-bit) and the times', async () => {
    const rng = new SplitMix64(3);
    const n = 2500;
    let text = 'time;EMG R [uV];EMG L [uV]\n';
    const x: number[][] = [[], []];
    for (let i = 0; i < n; i++) {
      const a = Math.round((rng.normal() * 150 + 20) * 1000) / 1000;
      const b = Math.round((rng.normal() * 40 - 5) * 1000) / 1000;
      x[0].push(a); x[1].push(b);
      text += `${(i / 2000).toFixed(4).replace('.', ',')};${String(a).replace('.', ',')};${String(b).replace('.', ',')}\n`;
    }
    const src = join(tmp, 'export.csv');
    writeFileSync(src, text);
    const io = bufferIO();
    expect(await main(['convert', src, '--format', 'edf'], io)).toBe(0);
    const edf = join(tmp, 'export.edf');
    expect(existsSync(edf)).toBe(true);
    expect(io.stdout).toContain('export.edf');
    const back = join(tmp, 'back.csv');
    expect(await main(['convert', edf, '--format', 'csv', '-o', back], bufferIO())).toBe(0);
    const { head, cols } = parseCsv(back);
    expect(head).toEqual(['time_s', 'EMG R', 'EMG L']);
    const { info } = await readAll(edf);
    expect(info.signals.map((s) => s.rate_hz)).toEqual([2000, 2000]);
    expect(cols[0].length).toBe(n);
    cols[0].forEach((t, i) => expect(t).toBeCloseTo(i / 2000, 9));
    for (let j = 0; j < 2; j++) {
      const s = info.signals[j];
      const step = (s.physical_max - s.physical_min) / (s.digital_max - s.digital_min);
      expect(s.physical_min).toBeLessThanOrEqual(Math.min(...x[j]));
      expect(s.physical_max).toBeGreaterThanOrEqual(Math.max(...x[j]));
      for (let i = 0; i < n; i++) expect(Math.abs(cols[j + 1][i] - x[j][i])).toBeLessThanOrEqual(step);
    }
  });

  for (const { name, path, truth } of truthFiles()) {
    it(`convert ${name} --format csv of one rate prints the reader's physical values exactly (shortest repr)`, async () => {
      const rate = truth.signals[0].sample_rate_hz;
      const same = truth.signals.filter((t) => t.sample_rate_hz === rate).map((t) => t.label);
      const out = join(tmp, `${name}.csv`);
      expect(await main(['convert', path, '--format', 'csv', '--signals', same.join(','), '-o', out], bufferIO())).toBe(0);
      const { head, cols } = parseCsv(out);
      expect(head).toEqual(['time_s', ...same]);
      const { data } = await readAll(path);
      same.forEach((label, k) => {
        const j = truth.signals.findIndex((t) => t.label === label);
        expect(cols[k + 1]).toEqual(data[j]);
        // expected: truth file first20_physical (EDFlib edfread_physical_samples), 1e-9 of range
        truth.signals[j].first20_physical.forEach((v, i) => expect(Math.abs(cols[k + 1][i] - v)).toBeLessThanOrEqual(1e-9 * (truth.signals[j].phys_max - truth.signals[j].phys_min)));
      });
    });

    it(`convert ${name} --format edf --start/--end keeps the span, shifts and limits annotations`, async () => {
      const rec0 = await openRecording(path);
      const dur = rec0.info.duration_s;
      await rec0.close();
      const start = Math.round(dur * 0.25 * 4) / 4 + 0.25;
      const end = Math.round(dur * 0.8 * 4) / 4;
      const out = join(tmp, `${name}.cut.edf`);
      expect(await main(['convert', path, '--format', 'edf', '--start', String(start), '--end', String(end), '-o', out], bufferIO())).toBe(0);
      const src = await readAll(path, false, { start_s: start, end_s: end });
      const cut = await readAll(out);
      expect(cut.info.duration_s).toBeCloseTo(end - start, 9);
      cut.info.signals.forEach((s, j) => {
        const t = truth.signals[j];
        expect(s.label).toBe(t.label);
        expect(cut.data[j].length).toBe(secondsToSamples(end, s.rate_hz) - secondsToSamples(start, s.rate_hz));
        // 16-bit sources keep their digital range, so values come back to rounding; 24-bit ones within a 16-bit step
        const step = (s.physical_max - s.physical_min) / (s.digital_max - s.digital_min);
        const tol = t.dig_max <= 32767 ? 1e-9 * (t.phys_max - t.phys_min) : step / 2 + 1e-9 * step;
        cut.data[j].forEach((v, i) => expect(Math.abs(v - src.data[j][i])).toBeLessThanOrEqual(tol));
      });
      const want = truth.annotations.filter((a) => a.onset_s >= start && a.onset_s < end);
      expect(cut.info.annotations.map((a) => a.text)).toEqual(want.map((a) => a.text));
      cut.info.annotations.forEach((a, i) => {
        expect(Math.abs(a.onset_s - (want[i].onset_s - start))).toBeLessThanOrEqual(1e-7);
        expect(a.duration_s).toBe(want[i].duration_s);
      });
    });
  }

  it('convert --format csv of signals with different rates exits 2 naming the rates', async () => {
    const t = truthFiles().find((f) => new Set(f.truth.signals.map((s) => s.sample_rate_hz)).size > 1);
    if (!t) return;
    const io = bufferIO();
    expect(await main(['convert', t.path, '--format', 'csv', '-o', join(tmp, 'mixed.csv')], io)).toBe(2);
    const rates = [...new Set(t.truth.signals.map((s) => s.sample_rate_hz))];
    expect(io.stderr).toMatch(new RegExp(`different sampling rates \\(${rates.join(', ')} Hz\\)`));
    expect(existsSync(join(tmp, 'mixed.csv'))).toBe(false);
  });

  it('convert refuses an output equal to the input, an unknown signal and a span outside the file', async () => {
    const f = truthFiles()[0];
    const copy = join(tmp, 'same.edf');
    copyFileSync(f.path, copy);
    let io = bufferIO();
    expect(await main(['convert', copy, '--format', 'edf'], io)).toBe(2);
    expect(io.stderr).toMatch(/same\.edf: output path is also an input/);
    io = bufferIO();
    expect(await main(['convert', copy, '--format', 'edf', '-o', join(tmp, 'x.edf'), '--signals', 'nope'], io)).toBe(2);
    expect(io.stderr).toMatch(/--signals: no signal named 'nope'/);
    io = bufferIO();
    expect(await main(['convert', copy, '--format', 'edf', '-o', join(tmp, 'x.edf'), '--start', '5', '--end', '1e6'], io)).toBe(2);
    expect(io.stderr.trim().split('\n')).toHaveLength(1);
    expect(existsSync(join(tmp, 'x.edf'))).toBe(false);
  });

  it('convertRecording(file, {stage}) runs the processing stage between reader and writer', async () => {
    const f = truthFiles()[0];
    const out = join(tmp, 'stage.csv');
    const label = f.truth.signals[0].label;
    await convertRecording(f.path, {
      format: 'csv', out, signals: [label],
      // a stand-in stage: keep every second sample at half the rate, doubled
      stage: (sel) => ({
        rates_hz: sel.map((s) => s.rate_hz / 2),
        transform: (chunk) => chunk.map((d) => Float64Array.from({ length: Math.floor(d.length / 2) }, (_, i) => 2 * d[2 * i])),
      }),
    });
    const { cols } = parseCsv(out);
    const { data } = await readAll(f.path);
    expect(cols[1].length).toBe(Math.floor(data[0].length / 2));
    cols[1].forEach((v, i) => expect(v).toBe(2 * data[0][2 * i]));
    expect(cols[0][1]).toBeCloseTo(2 / f.truth.signals[0].sample_rate_hz, 12);
  });
});

describe('shiftload convert --band / --envelope (processing stage)', () => {
  const src = new URL('../../../shared/fixtures/edf/emg_3sig.edf', import.meta.url).pathname;

  async function readSignal(label: string): Promise<{ x: Float64Array; fs: number }> {
    const { openRecording } = await import('../../lib/io/open-recording.js');
    const rec = await openRecording(src);
    const s = rec.info.signals.find((q) => q.label === label)!;
    const parts: number[] = [];
    for await (const c of rec.read({ signals: [s.index] })) parts.push(...c.data[0]!);
    await rec.close();
    return { x: Float64Array.from(parts), fs: s.rate_hz };
  }

  function csvColumn(text: string): Float64Array {
    return Float64Array.from(text.trim().split('\n').slice(1).map((l) => Number(l.split(',')[1])));
  }

  it('--band writes the zero-phase band-passed signal (= whole-signal sosfiltfilt within 1e-9 of full scale)', async () => {
    const { sosfiltfilt } = await import('../../lib/dsp/sosfiltfilt.js');
    const { butter } = await import('../../lib/dsp/butter.js');
    const dir = mkdtempSync(join(tmpdir(), 'shiftload-convert-band-'));
    const out = join(dir, 'f.csv');
    const io = bufferIO();
    expect(await main(['convert', src, '--format', 'csv', '--signals', 'EMG R trapezius', '--band', '20,200', '-o', out], io)).toBe(0);
    const { x, fs } = await readSignal('EMG R trapezius');
    const want = sosfiltfilt(butter(4, [20, 200], { btype: 'bandpass', fs }), x);
    const got = csvColumn(readFileSync(out, 'utf8'));
    expect(got.length).toBe(x.length);
    const scale = Math.max(...x.map(Math.abs));
    for (let i = 0; i < got.length; i++) expect(Math.abs(got[i]! - want[i]!)).toBeLessThan(1e-9 * scale);
  });

  it('--envelope writes the RMS envelope of the filtered signal at --envelope-rate', async () => {
    const { sosfiltfilt } = await import('../../lib/dsp/sosfiltfilt.js');
    const { butter } = await import('../../lib/dsp/butter.js');
    const { rmsEnvelope } = await import('../../lib/dsp/rms-envelope.js');
    const dir = mkdtempSync(join(tmpdir(), 'shiftload-convert-env-'));
    const out = join(dir, 'e.csv');
    const io = bufferIO();
    expect(await main(['convert', src, '--format', 'csv', '--signals', 'EMG R forearm', '--band', '20,200', '--envelope', '0.1', '--envelope-rate', '20', '-o', out], io)).toBe(0);
    const { x, fs } = await readSignal('EMG R forearm');
    const want = rmsEnvelope(sosfiltfilt(butter(4, [20, 200], { btype: 'bandpass', fs }), x), { fs, window_s: 0.1, rate_hz: 20 });
    const text = readFileSync(out, 'utf8');
    const got = csvColumn(text);
    expect(got.length).toBe(want.length);
    for (let i = 0; i < got.length; i++) expect(Math.abs(got[i]! - want[i]!)).toBeLessThan(1e-9 * Math.max(...want));
    expect(text.split('\n')[2]!.startsWith('0.05')).toBe(true); // second envelope sample at 1/20 s
  });

  it('--notch without --band is a usage error (exit 2)', async () => {
    const io = bufferIO();
    expect(await main(['convert', src, '--format', 'csv', '--notch', '50', '--envelope', '0.1'], io)).toBe(2);
    expect(io.stderr.trim().split('\n')).toHaveLength(1);
  });
});
