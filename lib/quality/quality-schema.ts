// The `settings.quality` block of the job-file schema (JSON Schema draft-07), built from
// QUALITY_DEFAULTS and QUALITY_SETTINGS_TABLE so the schema, defaults and docs cannot drift apart.
import { QUALITY_DEFAULTS, QUALITY_SETTINGS_TABLE, type QualitySettings } from './defaults.js';

/** JSON types and ranges of each quality setting. */
const TYPES: Record<keyof QualitySettings, Record<string, unknown>> = {
  enabled: { type: 'boolean' },
  exclude: { type: 'boolean' },
  window_s: { type: 'number', exclusiveMinimum: 0, maximum: 60 },
  spectral_window_s: { type: 'number', exclusiveMinimum: 0, maximum: 60 },
  ecg_window_s: { type: 'number', minimum: 3, maximum: 120 },
  clip_min_samples: { type: 'integer', minimum: 1 },
  clip_exclude_share: { type: 'number', minimum: 0, maximum: 1 },
  flat_std_uv: { type: 'number', minimum: 0 },
  lost_fraction: { type: 'number', minimum: 0, maximum: 1 },
  mains_hz: { type: 'array', minItems: 1, items: { type: 'number', exclusiveMinimum: 0 } },
  mains_harmonics: { type: 'integer', minimum: 1, maximum: 20 },
  mains_ratio: { type: 'number', exclusiveMinimum: 0 },
  band_hz: { type: 'array', minItems: 2, maxItems: 2, items: { type: 'number', exclusiveMinimum: 0 } },
  motion_hz: { type: 'number', exclusiveMinimum: 0 },
  motion_ratio: { type: 'number', exclusiveMinimum: 0 },
  motion_exclude_ratio: { type: 'number', exclusiveMinimum: 0 },
  motion_relative: { type: 'number', minimum: 0 },
  ecg_bpm: { type: 'array', minItems: 2, maxItems: 2, items: { type: 'number', exclusiveMinimum: 0 } },
  ecg_min_r: { type: 'number', minimum: 0, maximum: 1 },
  ecg_bin_s: { type: 'number', exclusiveMinimum: 0, maximum: 0.1 },
  ecg_baseline_s: { type: 'number', exclusiveMinimum: 0, maximum: 5 },
  snr_min_db: { type: 'number' },
  max_spans: { type: 'integer', minimum: 1 },
};

/** Schema of `settings.quality`: every key optional; empty or null means all defaults. */
export const qualitySchema = {
  title: 'Signal-quality screening',
  description: 'Thresholds of the quality checks (clipping, flat line, lost signal, mains, low-frequency artifact, ECG, SNR) and whether unusable spans are excluded from the statistics (exclude). Every key is optional.',
  type: ['object', 'null'],
  additionalProperties: false,
  default: QUALITY_DEFAULTS,
  properties: Object.fromEntries(QUALITY_SETTINGS_TABLE.map((r) => [r.key, {
    ...TYPES[r.key],
    title: r.key,
    description: `${r.meaning}${r.unit ? ` Unit: ${r.unit}.` : ''} Default ${JSON.stringify(QUALITY_DEFAULTS[r.key])} (${r.source}).`,
    default: QUALITY_DEFAULTS[r.key],
  }])),
};
