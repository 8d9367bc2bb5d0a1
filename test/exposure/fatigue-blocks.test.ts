import { describe, expect, it } from 'vitest';
import { fatigueBlocks, type FatigueChannelContext } from '../../lib/exposure/fatigue-blocks.js';
import { resolveFatigueSettings } from '../../lib/exposure/fatigue-settings.js';
import { spectralEpochs } from '../../lib/exposure/spectral-epochs.js';
import { designedMnfSlope, spectralShiftSignal, stationaryNoise, triangleLines, type ShiftDesign } from './spectral-shift-signal.js';

const ctx = (over: Partial<FatigueChannelContext> = {}): FatigueChannelContext => ({
  worker: 'W1', condition: 'current', muscle: 'trapezius', signal: 'EMG1', recording: 'w1.edf',
  duration_s: 600, unit: '%MVE', reference_uv: 500, noise_uv: null, segments: [], ...over,
});

describe('fatigueBlocks(epochs, context, settings)', () => {
  it('fatigueBlocks(signal with amplitude 5 + 0.5·t %MVE and MNF 80 − 0.8·t Hz) → +0.5 %MVE/min, −0.8 Hz/min, fatigue (METHODS.md §6 check at signal level)', () => {
    // 25 + 2.5·t µV RMS against a 500-µV reference = 5 + 0.5·t %MVE; lines 40…120 Hz (F0 = 80 Hz)
    // compressed by 1 %/min → MNF 80 − 0.8·t Hz (spectral-shift-signal.ts).
    const { lines_hz, powers } = triangleLines(40, 120, 5);
    const d: ShiftDesign = { fs: 1000, duration_s: 600, lines_hz, powers, compression_per_min: 0.01, a0_uv: 25, a1_uv_per_min: 2.5, seed: 5 };
    expect(designedMnfSlope(d)).toBeCloseTo(-0.8, 12);
    const ep = spectralEpochs(spectralShiftSignal(d), { fs: d.fs, band_hz: [30, 400] });
    const { blocks } = fatigueBlocks(ep, ctx(), resolveFatigueSettings({}));
    expect(blocks.length).toBe(1);
    const b = blocks[0]!;
    expect(b.category).toBe('fatigue');
    expect(b.epochs).toBe(600);
    expect(b.amplitude_slope_unit).toBe('%MVE/min');
    expect(Math.abs(b.amplitude_slope_per_min! - 0.5)).toBeLessThan(0.01);
    expect(Math.abs(b.mnf_slope_hz_per_min! + 0.8)).toBeLessThan(0.02);
    expect(Math.abs(b.mnf_mean_hz! - 76)).toBeLessThan(0.5);
  });

  it('fatigueBlocks(stationary band-limited noise, 8 seeds × 10 min) gives no-clear-change in at least 7 of 8 (false positives counted, not hidden)', () => {
    let clear = 0;
    const seen: string[] = [];
    for (const seed of [21, 22, 23, 24, 25, 26, 27, 28]) {
      const x = stationaryNoise(1000, 600, [40, 250], 30, seed);
      const ep = spectralEpochs(x, { fs: 1000, band_hz: [30, 400] });
      const b = fatigueBlocks(ep, ctx({ noise_uv: 2 }), resolveFatigueSettings({})).blocks[0]!;
      seen.push(b.category);
      if (b.category === 'no-clear-change') clear++;
    }
    expect(clear, seen.join(', ')).toBeGreaterThanOrEqual(7);
  });

  it('fatigueBlocks tiles [0, duration) by block_s (last block shorter), adds one block per task segment, and writes the active rule', () => {
    const x = stationaryNoise(1000, 1500, [40, 250], 30, 3);
    const ep = spectralEpochs(x, { fs: 1000, band_hz: [30, 400] });
    const segments = [{ label: 'packing', start_s: 100, end_s: 400 }, { label: 'packing', start_s: 900, end_s: 1000 }];
    const { blocks } = fatigueBlocks(ep, ctx({ duration_s: 1500, noise_uv: 2, segments }), resolveFatigueSettings({ block_s: 600 }));
    expect(blocks.map((b) => [b.segment, b.start_s, b.end_s, b.epochs_total])).toEqual([
      [null, 0, 600, 600], [null, 600, 1200, 600], [null, 1200, 1500, 300], ['packing', 100, 400, 300], ['packing', 900, 1000, 100],
    ]);
    expect(blocks[0]!.active_rule).toBe('epochs with noise-corrected RMS ≥ 2 %MVE and RMS ≥ 3 × the noise RMS (6.00 µV)');
  });

  it('fatigueBlocks leaves rest epochs (below 2 %MVE) out of the trends', () => {
    const fs = 1000;
    const x = stationaryNoise(fs, 600, [40, 250], 30, 4); // 6 %MVE
    for (let k = 0; k < x.length; k++) if (Math.floor(k / fs) % 3 === 0) x[k] = x[k]! * 0.1; // every third second at 0.6 %MVE
    const ep = spectralEpochs(x, { fs, band_hz: [30, 400] });
    const b = fatigueBlocks(ep, ctx(), resolveFatigueSettings({})).blocks[0]!;
    expect(b.epochs_total).toBe(600);
    expect(b.epochs).toBe(400);
    expect(fatigueBlocks(ep, ctx(), resolveFatigueSettings({ min_epochs: 401 })).blocks[0]!.category).toBe('insufficient-data');
  });

  it('fatigueBlocks without a reference while normalizing: amplitude null, MNF trend kept, insufficient-data', () => {
    const x = stationaryNoise(1000, 600, [40, 250], 30, 5);
    const ep = spectralEpochs(x, { fs: 1000, band_hz: [30, 400] });
    const b = fatigueBlocks(ep, ctx({ reference_uv: null, noise_uv: 2 }), resolveFatigueSettings({})).blocks[0]!;
    expect(b.amplitude_slope_per_min).toBeNull();
    expect(b.mnf_slope_hz_per_min).not.toBeNull();
    expect(b.category).toBe('insufficient-data');
    expect(b.active_rule).toBe('epochs with RMS ≥ 3 × the noise RMS (6.00 µV)');
  });

  it('fatigueBlocks(…).series holds 1-min medians of MNF that follow the designed line within 1 Hz', () => {
    const { lines_hz, powers } = triangleLines(60, 180, 5);
    const d: ShiftDesign = { fs: 1000, duration_s: 600, lines_hz, powers, compression_per_min: 0.01, a0_uv: 25, a1_uv_per_min: 0, seed: 9 };
    const ep = spectralEpochs(spectralShiftSignal(d), { fs: d.fs, band_hz: [30, 400] });
    const { series } = fatigueBlocks(ep, ctx(), resolveFatigueSettings({}));
    expect(series.step_s).toBe(60);
    expect(series.mnf_hz.length).toBe(10);
    series.mnf_hz.forEach((v, k) => expect(Math.abs(v! - 120 * (1 - 0.01 * (k + 0.5)))).toBeLessThan(1));
    expect(series.active_epochs).toEqual(new Array(10).fill(60));
    expect(series.amplitude[0]).toBeCloseTo(5, 1);
  });
});
