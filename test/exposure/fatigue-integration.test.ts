// The fatigue analysis inside the one streaming pass: SpectralEpochs as a readEnvelopes tap on an
// EDF+ file, then fatigueBlocks — the wiring run-study uses.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { EdfWriter } from '../../lib/io/edf-writer.js';
import { readEnvelopes, type FilterSpec } from '../../lib/study/read-envelopes.js';
import { SpectralEpochs } from '../../lib/exposure/spectral-epochs.js';
import { fatigueBlocks } from '../../lib/exposure/fatigue-blocks.js';
import { resolveFatigueSettings } from '../../lib/exposure/fatigue-settings.js';
import { spectralShiftSignal, triangleLines, type ShiftDesign } from './spectral-shift-signal.js';

const dir = mkdtempSync(join(tmpdir(), 'shiftload-fatigue-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const filter: FilterSpec = { band_hz: [30, 400], order: 4, mains_hz: null, mains_harmonics: 1, mains_q: 30 };

describe('SpectralEpochs as a readEnvelopes tap', () => {
  // Known truth (spectral-shift-signal.ts): lines 60…180 Hz (F0 = 120 Hz) compressed by 1 %/min
  // → MNF 120 − 1.2·t Hz; RMS 25 + 2.5·t µV (5 + 0.5·t %MVE against 500 µV). 15 min at 1000 Hz.
  const { lines_hz, powers } = triangleLines(60, 180, 5);
  const d: ShiftDesign = { fs: 1000, duration_s: 900, lines_hz, powers, compression_per_min: 0.01, a0_uv: 25, a1_uv_per_min: 2.5, seed: 12 };
  const file = join(dir, 'shift.edf');
  const w = new EdfWriter(file, [{ label: 'EMG trap R', unit: 'uV', rate_hz: d.fs, physical_min: -2000, physical_max: 2000 }]);
  w.write([spectralShiftSignal(d)]);
  w.close();

  async function run(chunk_bytes: number) {
    const tap = new SpectralEpochs({ fs: d.fs, epoch_s: 1, band_hz: filter.band_hz });
    await readEnvelopes({ file, signals: [0], start_s: 0, end_s: null, filter, envelope: { window_s: 0.1, rate_hz: 20 }, taps: [tap], open: { chunk_bytes } });
    return tap.result();
  }

  it('readEnvelopes({ taps: [SpectralEpochs] }) gives the same epochs for 1-MiB and 2-record chunks (single pass, chunk independence)', async () => {
    const a = await run(1 << 20);
    const b = await run(4000);
    expect(a.t_s.length).toBe(900);
    expect(b.t_s).toEqual(a.t_s);
    for (let i = 0; i < a.t_s.length; i++) {
      expect(Math.abs(b.mnf_hz[i]! - a.mnf_hz[i]!)).toBeLessThan(1e-6);
      expect(Math.abs(b.rms_uv[i]! - a.rms_uv[i]!)).toBeLessThan(1e-6);
    }
  });

  it('fatigueBlocks after the pass: every 5-min block is fatigue with MNF slope −1.2 ± 0.05 Hz/min and amplitude slope +0.5 ± 0.02 %MVE/min', async () => {
    const ep = await run(1 << 20);
    const { blocks } = fatigueBlocks(ep, {
      worker: 'W1', condition: 'current', muscle: 'trapezius', signal: 'EMG trap R', recording: 'shift.edf',
      duration_s: 900, unit: '%MVE', reference_uv: 500, noise_uv: null, segments: [],
    }, resolveFatigueSettings({ block_s: 300 }));
    expect(blocks.length).toBe(3);
    for (const b of blocks) {
      expect(b.category).toBe('fatigue');
      expect(Math.abs(b.mnf_slope_hz_per_min! + 1.2)).toBeLessThan(0.05);
      expect(Math.abs(b.amplitude_slope_per_min! - 0.5)).toBeLessThan(0.02);
    }
  });
});
