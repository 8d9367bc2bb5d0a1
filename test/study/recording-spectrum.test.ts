// The mean raw spectrum per channel: accumulated by the SpectralEpochs tap in the single pass,
// written by analyze as results.spectra with a band suggestion and MNF/MDF.
// Known truth: white Gaussian noise through a 4th-order Butterworth band-pass 20–450 Hz (fs 1000 Hz).
// Checks against the outside world: Parseval (the integral of a one-sided PSD equals the signal's
// variance; textbook fact) and lib/dsp welch (checked against scipy.signal.welch in
// test/dsp/welch.test.ts) on the same samples; a Butterworth band-pass is −3 dB at its cut-offs
// (textbook fact), which is where suggestBand puts the band edges.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { butter } from '../../lib/dsp/butter.js';
import { meanFrequency } from '../../lib/dsp/mean-frequency.js';
import { sosfilt } from '../../lib/dsp/sosfilt.js';
import { welch } from '../../lib/dsp/welch.js';
import { SpectralEpochs, spectralEpochs } from '../../lib/exposure/spectral-epochs.js';
import { EdfWriter } from '../../lib/io/edf-writer.js';
import { recordingSpectrum } from '../../lib/study/recording-spectrum.js';
import type { StudyResults } from '../../lib/study/results.js';

const FS = 1000;
const where = { worker: 'W1', condition: 'a', muscle: 'm', signal: 'EMG', recording: 'r.edf' };

/** Seeded Gaussian noise (LCG + Box–Muller), band-passed 20–450 Hz; 50 µV RMS before filtering. */
function bandNoise(n: number, seed: number, mainsUv = 0): Float64Array {
  let s = seed >>> 0;
  const u = () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return (s + 0.5) / 4294967296; };
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = 50 * Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
  const y = sosfilt(butter(4, [20, 450], { btype: 'bandpass', fs: FS }), x);
  if (mainsUv) for (let i = 0; i < n; i++) y[i] += mainsUv * Math.SQRT2 * Math.sin((2 * Math.PI * 50 * i) / FS);
  return y;
}

const x = bandNoise(300 * FS, 7);
const band: [number, number] = [20, 450];

describe('SpectralEpochs mean raw spectrum', () => {
  const tap = new SpectralEpochs({ fs: FS, band_hz: band });
  // uneven chunks: the spectrum must not depend on the split
  for (let i = 0, k = 0; i < x.length; k++) { const m = [997, 5003, 1, 20000][k % 4]!; tap.raw(x.subarray(i, Math.min(x.length, i + m))); i += m; }
  const sp = tap.meanSpectrum();

  it('meanSpectrum() after raw() in uneven chunks equals the batch spectralEpochs(…, raw) spectrum (chunk independence)', () => {
    const batch = spectralEpochs(new Float64Array(0), { fs: FS, band_hz: band }, x).spectrum;
    expect(batch.epochs).toBe(300);
    expect(sp.epochs).toBe(300);
    for (let j = 0; j < sp.psd.length; j++) expect(Math.abs(sp.psd[j]! - batch.psd[j]!)).toBeLessThanOrEqual(1e-9 * Math.max(1, batch.psd[j]!));
  });

  it('meanSpectrum() is on a 2-Hz grid from 0 to fs/2 and integrates to the signal variance within 3 % (Parseval)', () => {
    expect(sp.bin_hz).toBe(2);
    expect(sp.f_hz.length).toBe(251);
    expect(sp.f_hz[250]).toBe(500);
    let area = 0;
    for (let j = 0; j < sp.psd.length; j++) area += sp.psd[j]! * sp.bin_hz * (j === 0 || j === sp.psd.length - 1 ? 0.5 : 1);
    let v = 0, m = 0;
    for (let i = 0; i < x.length; i++) m += x[i]!;
    m /= x.length;
    for (let i = 0; i < x.length; i++) v += (x[i]! - m) ** 2;
    v /= x.length;
    expect(Math.abs(area / v - 1)).toBeLessThan(0.03);
  });

  it('recordingSpectrum(): MNF within 10 % of MNF from welch (nperseg 1024) on the same samples, band 20–450 ± 8 Hz, no notch', () => {
    const w = welch(x, { fs: FS, nperseg: 1024 });
    const ref = meanFrequency(w.f_hz, w.psd, { fminHz: band[0], fmaxHz: band[1] });
    const r = recordingSpectrum(sp, where, band, 50, 1)!;
    expect(Math.abs(r.mnf_hz! / ref - 1)).toBeLessThan(0.10);
    // power in the simulated band: the band-limited noise keeps > 97 % of its power within 20–450 Hz
    let inside = 0, all = 0;
    for (let j = 1; j < sp.psd.length; j++) { all += sp.psd[j]!; if (sp.f_hz[j]! >= 20 && sp.f_hz[j]! <= 450) inside += sp.psd[j]!; }
    expect(inside / all).toBeGreaterThan(0.97);
    expect(Math.abs(r.suggested_band_hz![0] - 20)).toBeLessThanOrEqual(8);
    expect(Math.abs(r.suggested_band_hz![1] - 450)).toBeLessThanOrEqual(8);
    expect(r.suggested_notch_hz).toBeNull();
    expect(r.suggestion_reasons!.length).toBeGreaterThanOrEqual(2);
    expect(r.freq_hz.length).toBe(r.psd.length);
  });

  it('recordingSpectrum() suggests a 50-Hz notch when a 10-µV mains line is added', () => {
    const t = new SpectralEpochs({ fs: FS, band_hz: band });
    t.raw(bandNoise(120 * FS, 3, 10));
    const r = recordingSpectrum(t.meanSpectrum(), where, band, null, 1)!;
    expect(r.suggested_notch_hz).toBe(50);
  });

  it('recordingSpectrum() returns null for a tap that saw no raw samples', () => {
    expect(recordingSpectrum(new SpectralEpochs({ fs: FS, band_hz: band }).meanSpectrum(), where, band, 50, 1)).toBeNull();
  });
});

describe('analyze writes results.spectra (single streaming pass)', () => {
  const dir = mkdtempSync(join(tmpdir(), 'shiftload-spectra-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('main(["analyze", job]) on a band-limited noise recording: one spectrum per channel, MNF within 10 % of welch, band 20–450 ± 10 Hz; same with --jobs 2', async () => {
    const y = bandNoise(240 * FS, 11);
    const y2 = bandNoise(240 * FS, 12);
    const w = new EdfWriter(join(dir, 'rec.edf'), [
      { label: 'EMG A', unit: 'uV', rate_hz: FS, physical_min: -3000, physical_max: 3000 },
      { label: 'EMG B', unit: 'uV', rate_hz: FS, physical_min: -3000, physical_max: 3000 },
    ]);
    w.write([y, y2]);
    w.close();
    writeFileSync(join(dir, 'job.yaml'), `format: shiftload-job/1
title: spectra
settings:
  band_hz: [20, 450]
  normalize: none
  noise_correction: false
workers:
  - id: W1
    recordings:
      - file: rec.edf
        condition: a
        channels:
          - { signal: "EMG A", muscle: "muscle a" }
          - { signal: "EMG B", muscle: "muscle b" }
        segments:
          - { label: work, start_s: 0, end_s: 240 }
`);
    const outs: StudyResults[] = [];
    for (const jobs of ['1', '2']) {
      const io = bufferIO();
      const code = await main(['analyze', join(dir, 'job.yaml'), '--no-report', '-o', join(dir, `out${jobs}`), '--jobs', jobs], io);
      expect(code, io.stderr).toBe(0);
      outs.push(JSON.parse(readFileSync(join(dir, `out${jobs}`, 'results.json'), 'utf8')) as StudyResults);
    }
    const sp = outs[0]!.spectra!;
    expect(sp.map((s) => s.muscle)).toEqual(['muscle a', 'muscle b']);
    expect(outs[1]!.spectra).toEqual(sp);
    for (const [i, sig] of [y, y2].entries()) {
      // the EDF stores 16-bit samples: welch runs on the samples as stored (≈ 0.05 µV steps; negligible)
      const wl = welch(sig, { fs: FS, nperseg: 1024 });
      const ref = meanFrequency(wl.f_hz, wl.psd, { fminHz: 20, fmaxHz: 450 });
      expect(Math.abs(sp[i]!.mnf_hz! / ref - 1)).toBeLessThan(0.10);
      expect(Math.abs(sp[i]!.suggested_band_hz![0] - 20)).toBeLessThanOrEqual(10);
      expect(Math.abs(sp[i]!.suggested_band_hz![1] - 450)).toBeLessThanOrEqual(10);
      expect(sp[i]!.epochs).toBe(240);
    }
  });
});
