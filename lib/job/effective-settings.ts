// The effective settings of a job: DEFAULTS overlaid with the job's `settings`, plus the checks
// the schema cannot express (edge order, increasing class edges, gap limits, threshold unit).
import type { LoadUnit } from '../study/results.js';
import { jobMsg } from '../messages.js';
import { DEFAULTS, type Settings } from './defaults.js';
import type { JobFile } from './job-file.js';
import type { JobContext } from './job-context.js';
import type { KeyPathStep } from './key-path.js';

/** Defaults overlaid with the job's settings, plus checks the schema cannot express. */
export function effectiveSettings(job: JobFile, ctx: JobContext): Settings {
  const s = job.settings ?? {};
  const settings: Settings = {
    ...structuredClone(DEFAULTS as Settings),
    ...structuredClone(s),
    eva: { ...structuredClone(DEFAULTS.eva), ...structuredClone(s.eva ?? {}) },
    fatigue: { ...structuredClone(DEFAULTS.fatigue), ...structuredClone(s.fatigue ?? {}) },
    quality: { ...structuredClone(DEFAULTS.quality), ...structuredClone(s.quality ?? {}) },
  } as Settings;
  const at = (...k: KeyPathStep[]): KeyPathStep[] => ['settings', ...k];
  if (settings.band_hz[0] >= settings.band_hz[1]) ctx.issue(at('band_hz'), jobMsg.bandOrder(settings.band_hz[0], settings.band_hz[1]));
  const fb = settings.fatigue.band_hz;
  if (fb && fb[0] >= fb[1]) ctx.issue(at('fatigue', 'band_hz'), jobMsg.bandOrder(fb[0], fb[1]));
  for (const [key, edges] of [['amplitude_edges', settings.eva.amplitude_edges], ['duration_edges_s', settings.eva.duration_edges_s]] as const) {
    for (let i = 1; i < edges.length; i++) {
      if (!(edges[i] > edges[i - 1])) { ctx.issue(at('eva', key, i), jobMsg.notIncreasing()); break; }
    }
  }
  if (settings.gap_max_s !== null && settings.gap_max_s <= settings.gap_min_s) {
    ctx.issue(at('gap_max_s'), jobMsg.gapMaxBelowMin(settings.gap_max_s, settings.gap_min_s));
  }
  if (settings.gap_threshold_unit === 'mve' && (settings.normalize === 'task-peak' || settings.normalize === 'none')) {
    ctx.issue(at('gap_threshold_unit'), jobMsg.mveUnitImpossible(settings.normalize));
  }
  return settings;
}

/** Unit of the normalized envelope for a normalization method. */
export function unitOf(n: Settings['normalize']): LoadUnit {
  return n === 'mve' ? '%MVE' : n === 'rve' ? '%RVE' : n === 'task-peak' ? '%task-peak' : 'uV';
}
