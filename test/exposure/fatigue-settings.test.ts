import { describe, expect, it } from 'vitest';
import { FATIGUE_DEFAULTS, resolveFatigueSettings } from '../../lib/exposure/fatigue-settings.js';
import { fatigueTapSpec, fatigueTaps, spectralEpochBuffers } from '../../lib/exposure/fatigue-taps.js';
import { fatigueMethod } from '../../lib/exposure/fatigue-method.js';
import { DEFAULTS } from '../../lib/job/defaults.js';
import { JOB_FORMAT } from '../../lib/job/job-schema.js';
import { jobSchemaValidator } from '../../lib/job/validate-job-schema.js';

describe('resolveFatigueSettings(partial)', () => {
  it('resolveFatigueSettings fills missing keys from FATIGUE_DEFAULTS (a partial or null block is fine)', () => {
    expect(resolveFatigueSettings(null)).toEqual(FATIGUE_DEFAULTS);
    expect(resolveFatigueSettings({ block_s: 300 })).toEqual({ ...FATIGUE_DEFAULTS, block_s: 300 });
    expect(DEFAULTS.fatigue).toEqual(FATIGUE_DEFAULTS);
  });
});

describe('fatigueTaps(fatigueTapSpec(channels, settings, filterBand))', () => {
  it('fatigueTaps gives one tap per channel with the filter band, cut to fs/2, and null when disabled', () => {
    const spec = fatigueTapSpec([{ rate_hz: 1000 }, { rate_hz: 2048 }, { rate_hz: 600 }], resolveFatigueSettings({}), [30, 400]);
    expect(structuredClone(spec)).toEqual(spec); // plain data for a worker thread
    const taps = fatigueTaps(spec)!;
    expect(taps.map((t) => [t.fs, t.n, t.nfft, t.band_hz])).toEqual([[1000, 1000, 1024, [30, 400]], [2048, 2048, 2048, [30, 400]], [600, 600, 1024, [30, 300]]]);
    expect(fatigueTaps(fatigueTapSpec([{ rate_hz: 1000 }], resolveFatigueSettings({ band_hz: [20, 250] }), [30, 400]))![0]!.band_hz).toEqual([20, 250]);
    expect(fatigueTapSpec([{ rate_hz: 1000 }], resolveFatigueSettings({ enabled: false }), [30, 400])).toBeNull();
    expect(fatigueTaps(null)).toBeNull();
  });
  it('spectralEpochBuffers lists the six distinct buffers of each series (four epoch arrays, two of the mean spectrum)', () => {
    const t = fatigueTaps({ rates_hz: [1000], epoch_s: 1, band_hz: [30, 400] })![0]!;
    t.filtered(new Float64Array(3000).fill(1));
    const bufs = spectralEpochBuffers([t.result()]);
    expect(bufs.length).toBe(6);
    expect(new Set(bufs).size).toBe(6);
  });
});

describe('fatigueMethod(settings, filterBand, rates)', () => {
  it('fatigueMethod names the FFT length per rate, the band and the care sentence', () => {
    const m = fatigueMethod(resolveFatigueSettings({}), [30, 400], [2000, 1000, 1000]);
    expect(m.band_hz).toEqual([30, 400]);
    expect(m.description).toContain('1024-point at 1000 Hz, 2048-point at 2000 Hz');
    expect(m.description).toContain('not an individual');
  });
});

describe('job schema settings.fatigue', () => {
  const job = (fatigue: unknown) => ({
    format: JOB_FORMAT, title: 't', settings: { fatigue },
    workers: [{ id: 'W1', recordings: [{ file: 'a.edf', condition: 'c', channels: [{ signal: 's' }], segments: 'annotations' }] }],
  });
  it('accepts a partial, null or band-less fatigue block and rejects unknown keys and bad values', () => {
    const validate = jobSchemaValidator();
    expect(validate(job({ block_s: 300, band_hz: null }))).toBe(true);
    expect(validate(job({ band_hz: [20, 250], min_epochs: 60 }))).toBe(true);
    expect(validate(job(null))).toBe(true);
    expect(validate(job({ blocks_s: 300 }))).toBe(false);
    expect(validate(job({ min_epochs: 2 }))).toBe(false);
    expect(validate(job({ epoch_s: 0 }))).toBe(false);
  });
});
