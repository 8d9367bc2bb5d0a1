// How the gap threshold applies, from the normalization and the MVE references present
// (METHODS.md §2.5: a %MVE threshold is converted per worker with k = RVE / MVE).
import type { Settings } from './defaults.js';
import { unitOf } from './effective-settings.js';
import type { GapThreshold, StudyWorker } from './study-types.js';

/** How the gap threshold applies, given the normalization and the references present. */
export function resolveGapThreshold(settings: Settings, workers: StudyWorker[]): GapThreshold {
  const value = settings.gap_threshold_pct;
  const unit = unitOf(settings.normalize);
  if (settings.normalize === 'mve') {
    return { value, unit, convertPerWorker: false, note: `Gap threshold ${value} %MVE.` };
  }
  if (settings.normalize === 'rve' && settings.gap_threshold_unit !== 'as-normalized') {
    const all = workers.every((w) => w.recordings.every((r) => r.mveReference.length > 0));
    if (all) {
      return { value, unit: '%MVE', convertPerWorker: true, note: `Gap threshold ${value} %MVE, converted to %RVE per worker with k = RVE / MVE from each worker's MVE reference.` };
    }
    return { value, unit, convertPerWorker: false, note: `Gap threshold taken as ${value} %RVE: not every worker has an MVE reference, so a %MVE threshold could not be converted.` };
  }
  const unitWords = unit === 'uV' ? 'µV' : unit;
  return { value, unit, convertPerWorker: false, note: `Gap threshold ${value} ${unitWords} (in the unit of the normalized envelope).` };
}

