import { describe, expect, it } from 'vitest';
import { JOB_FORMAT } from '../../lib/job/job-schema.js';
import { jobSchemaValidator } from '../../lib/job/validate-job-schema.js';
import { QUALITY_DEFAULTS, QUALITY_SETTINGS_TABLE, resolveQualitySettings } from '../../lib/quality/defaults.js';
import { qualitySchema } from '../../lib/quality/quality-schema.js';

const job = (quality: unknown) => ({
  format: JOB_FORMAT, title: 't', settings: { quality },
  workers: [{ id: 'W1', recordings: [{ file: 'a.edf', condition: 'c', channels: [{ signal: 's' }], segments: 'annotations' }] }],
});

describe('settings.quality in the job schema', () => {
  const validate = jobSchemaValidator();
  it('a partial quality block, an empty one and null are valid', () => {
    for (const q of [{ exclude: false }, { mains_ratio: 0.2, ecg_bpm: [50, 150] }, {}, null]) {
      expect(validate(job(q)), JSON.stringify(validate.errors)).toBe(true);
    }
  });
  it('an unknown key or a wrong type is rejected', () => {
    expect(validate(job({ exclud: true }))).toBe(false);
    expect(validate(job({ exclude: 'yes' }))).toBe(false);
    expect(validate(job({ clip_exclude_share: 2 }))).toBe(false);
  });
  it('every QUALITY_DEFAULTS key has one table row and one schema property with that default', () => {
    expect(QUALITY_SETTINGS_TABLE.map((r) => r.key).sort()).toEqual(Object.keys(QUALITY_DEFAULTS).sort());
    for (const [k, v] of Object.entries(QUALITY_DEFAULTS)) {
      expect((qualitySchema.properties as Record<string, { default: unknown }>)[k]!.default, k).toEqual(v);
    }
  });
  it('resolveQualitySettings(partial) fills the defaults and copies arrays (defaults stay frozen)', () => {
    const s = resolveQualitySettings({ exclude: false });
    expect(s).toEqual({ ...QUALITY_DEFAULTS, exclude: false });
    s.mains_hz.push(400);
    expect(QUALITY_DEFAULTS.mains_hz).toEqual([50, 60]);
    expect(resolveQualitySettings(null)).toEqual(QUALITY_DEFAULTS);
  });
});
