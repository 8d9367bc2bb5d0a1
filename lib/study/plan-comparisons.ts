// The planning aid of a condition comparison: from the observed spread of per-worker differences,
// the smallest difference this design could detect, and — for a difference the user names — the
// number of workers needed. Paired comparisons only (the formula is for paired differences).
import { UsageError } from '../errors.js';
import { msg } from '../messages.js';
import { detectableDifference, workersNeeded } from '../stats/detectable-difference.js';
import type { Comparison, ComparisonPlanning } from './results.js';

/** A difference to detect, per measure key (e.g. { p50: 2 } for 2 %MVE in median load). */
export type DetectTargets = Record<string, number>;

/**
 * Parse `--detect` values: `2` (median load, p50), `p90=5`, `gaps_per_min=1`.
 * @throws UsageError naming the value that does not parse
 */
export function parseDetect(values: readonly string[]): DetectTargets {
  const out: DetectTargets = {};
  for (const v of values) {
    const m = /^(?:([a-z_0-9]+)=)?\s*(-?[0-9]+(?:\.[0-9]+)?)\s*(?:%?[A-Za-z/]*)?$/.exec(v.trim());
    if (!m || Number(m[2]) === 0) throw new UsageError(msg.badOption('detect', 'a difference such as 2, p90=5 or gaps_per_min=1 (not 0)', `'${v}'`));
    out[m[1] ?? 'p50'] = Math.abs(Number(m[2]));
  }
  return out;
}

/**
 * Add `planning` to each paired comparison with at least two per-worker differences.
 * Returns new objects; the input is not changed.
 */
export function planComparisons(comparisons: readonly Comparison[], detect: DetectTargets = {}): Comparison[] {
  return comparisons.map((c) => {
    const diffs = c.per_worker.map((w) => w.difference).filter((d): d is number => d !== null && Number.isFinite(d));
    if (!c.paired || diffs.length < 2) return c;
    const dd = detectableDifference(diffs, { n: diffs.length });
    const planning: ComparisonPlanning = {
      sd_of_differences: dd.sd, n: dd.n, detectable_difference: dd.difference, alpha: dd.alpha, power: dd.power,
      detect: null, workers_needed: null, method: dd.method,
    };
    const target = detect[c.measure];
    if (target !== undefined && dd.sd > 0) {
      planning.detect = target;
      planning.workers_needed = workersNeeded(target, dd.sd).n;
    }
    return { ...c, planning };
  });
}
