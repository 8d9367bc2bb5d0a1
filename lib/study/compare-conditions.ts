// Comparison of conditions across workers, per segment × muscle × measure: paired when the same
// workers were measured in both conditions (Wilcoxon signed-rank, bootstrap CI of the median
// difference), unpaired otherwise (rank-sum, bootstrap CI of the difference of medians).
// Statements report counts, medians and intervals in words that never overclaim.

import { UsageError } from '../errors.js';
import { exposureMsg } from '../messages.js';
import { bootstrapCi, bootstrapDifferenceCi } from '../stats/bootstrap-ci.js';
import { DEFAULTS as STATS } from '../stats/defaults.js';
import { mean } from '../stats/mean.js';
import { median } from '../stats/median.js';
import { rankSum } from '../stats/rank-sum.js';
import { wilcoxonSignedRank } from '../stats/wilcoxon-signed-rank.js';
import type { Comparison, ComparisonWorker, LoadUnit, ResultRow } from './results.js';

/** Measures that are not percentiles, with their units. */
const OTHER_MEASURES: Record<string, string> = {
  gaps_per_min: 'gaps/min',
  rest_pct: '% time',
  sustained_pct: '% time',
  longest_without_gap_s: 's',
};

const MEASURE_LABEL: Record<string, string> = {
  gaps_per_min: 'gap frequency',
  rest_pct: 'muscular rest',
  sustained_pct: 'sustained activity',
  longest_without_gap_s: 'longest time without a gap',
};

export const COMPARE_DEFAULTS = {
  /** Measures compared. @default ['p10', 'p50', 'p90', 'gaps_per_min', 'rest_pct'] */
  measures: ['p10', 'p50', 'p90', 'gaps_per_min', 'rest_pct'] as readonly string[],
  /** Fewer workers than this in a condition (or pairs) → descriptive only. @default 5 */
  min_workers: 5,
} as const;

export interface CompareConditionsOptions {
  /** ResultRow measure keys. @default ['p10', 'p50', 'p90', 'gaps_per_min', 'rest_pct'] */
  measures?: readonly string[];
  /** Bootstrap seed (the same for every comparison). @default 1 */
  seed?: number;
  /** Bootstrap resamples. @default 10000 */
  resamples?: number;
  /** Confidence level. @default 0.95 */
  level?: number;
  /** Which condition pairs [a, b] to compare; default: every pair, a before b in order of first appearance. */
  condition_pairs?: readonly (readonly [string, string])[];
}

function measureUnit(measure: string, unit: LoadUnit): string {
  if (/^p\d+(\.\d+)?$/.test(measure)) return unit;
  const u = OTHER_MEASURES[measure];
  if (u === undefined) throw new UsageError(exposureMsg.unknownMeasure(measure, Object.keys(OTHER_MEASURES)));
  return u;
}

function measureLabel(measure: string): string {
  const m = /^p(\d+(?:\.\d+)?)$/.exec(measure);
  if (m) {
    const q = Number(m[1]);
    const name = q === 10 ? 'static load ' : q === 50 ? 'median load ' : q === 90 ? 'peak load ' : '';
    return `${name}(P${m[1]})`;
  }
  return MEASURE_LABEL[measure] ?? measure;
}

/**
 * Numbers in words with shared decimals: the largest magnitude decides (≥ 100 → 0 decimals,
 * ≥ 1 → 1, below 1 → 2), so an estimate and its interval read alike; true minus sign.
 *
 * @example formatNumbers([-1.75, -2.8, -0.25]) // ['−1.8', '−2.8', '−0.3'] (toFixed rounding)
 */
export function formatNumbers(xs: readonly number[]): string[] {
  const a = Math.max(...xs.map((x) => Math.abs(x)));
  const d = a >= 100 ? 0 : a >= 1 ? 1 : 2;
  return xs.map((x) => {
    const s = x.toFixed(d);
    return (Number(s) === 0 ? (0).toFixed(d) : s).replace('-', '−');
  });
}

/** One number in words (see formatNumbers). @example formatNumber(-2.14) // '−2.1' */
export function formatNumber(x: number): string {
  return formatNumbers([x])[0]!;
}

function formatP(p: number): string {
  if (p < 0.001) return 'p < 0.001';
  return `p = ${p < 0.1 ? p.toFixed(3) : p.toFixed(2)}`;
}

/** Unit after a difference ('% time' differences are percentage points). */
function unitSuffix(unit: string): string {
  return unit === '% time' ? ' percentage points' : ` ${unit}`;
}

/** Unit after a level. */
function levelSuffix(unit: string): string {
  return unit === '% time' ? ' % of time' : ` ${unit}`;
}

/** Value of one worker in one condition: valid-time-weighted mean of that worker's rows. */
function workerValue(rows: ResultRow[], measure: string): number | null {
  let sw = 0; let s = 0; let n = 0; let plain = 0;
  for (const r of rows) {
    const v = (r as unknown as Record<string, unknown>)[measure];
    if (typeof v !== 'number' || !Number.isFinite(v)) continue;
    const w = Number.isFinite(r.valid_s) && r.valid_s > 0 ? r.valid_s : 0;
    sw += w; s += w * v; n++; plain += v;
  }
  if (n === 0) return null;
  return sw > 0 ? s / sw : plain / n;
}

/**
 * Compare conditions across workers for every segment × muscle × measure.
 *
 * Rules (all documented in the output):
 * - Rows are grouped by segment, muscle and normalization unit (comparisons never mix %MVE and
 *   %RVE). Several rows of one worker in one condition (e.g. two recordings) are combined as the
 *   valid-time-weighted mean.
 * - Paired when at least one worker id appears in both conditions: only workers with both are
 *   used (others are listed in excluded_workers); differences are b − a. Wilcoxon signed-rank
 *   test (zeros dropped), bootstrap percentile CI of the median difference, matched-pairs
 *   rank-biserial r. Unpaired otherwise: rank-sum test, bootstrap CI of median(b) − median(a)
 *   (groups resampled separately), Cliff's delta.
 * - descriptive_only when fewer than 5 workers per condition (pairs < 5, or n_a or n_b < 5): no
 *   p-value and no interval are given, and the statement says so.
 * - Every bootstrap uses the same seed, so results are deterministic.
 *
 * @param rows ResultRows of one study
 * @param options measures, seed, resamples, level, condition_pairs
 * @returns one Comparison per segment × muscle × unit × measure × condition pair with data in both
 * @throws UsageError for an unknown measure
 * @example compareConditions(results.rows, { seed: 1 })[0].statement
 *   // "lower in 5 of 6 workers; median difference −2.1 %MVE (95 % CI −3.4 to −0.6); …"
 */
export function compareConditions(rows: readonly ResultRow[], options: CompareConditionsOptions = {}): Comparison[] {
  const measures = options.measures ?? COMPARE_DEFAULTS.measures;
  for (const m of measures) measureUnit(m, '%MVE');
  const boot = { seed: options.seed ?? STATS.seed, resamples: options.resamples ?? STATS.resamples, level: options.level ?? STATS.level };

  // groups in order of first appearance
  const groups = new Map<string, { segment: string; muscle: string; unit: LoadUnit; conditions: Map<string, Map<string, ResultRow[]>> }>();
  const conditionOrder: string[] = [];
  for (const r of rows) {
    if (!conditionOrder.includes(r.condition)) conditionOrder.push(r.condition);
    const key = JSON.stringify([r.segment, r.muscle, r.unit]);
    let g = groups.get(key);
    if (!g) { g = { segment: r.segment, muscle: r.muscle, unit: r.unit, conditions: new Map() }; groups.set(key, g); }
    let c = g.conditions.get(r.condition);
    if (!c) { c = new Map(); g.conditions.set(r.condition, c); }
    let w = c.get(r.worker);
    if (!w) { w = []; c.set(r.worker, w); }
    w.push(r);
  }
  const pairs: (readonly [string, string])[] = options.condition_pairs
    ? [...options.condition_pairs]
    : conditionOrder.flatMap((a, i) => conditionOrder.slice(i + 1).map((b) => [a, b] as const));

  const out: Comparison[] = [];
  for (const g of groups.values()) {
    for (const measure of measures) {
      for (const [ca, cb] of pairs) {
        const wa = g.conditions.get(ca);
        const wb = g.conditions.get(cb);
        if (!wa || !wb) continue;
        const va = new Map<string, number>();
        const vb = new Map<string, number>();
        for (const [w, rs] of wa) { const v = workerValue(rs, measure); if (v !== null) va.set(w, v); }
        for (const [w, rs] of wb) { const v = workerValue(rs, measure); if (v !== null) vb.set(w, v); }
        if (va.size === 0 || vb.size === 0) continue;
        out.push(compareOne(g.segment, g.muscle, g.unit, measure, ca, cb, va, vb, boot));
      }
    }
  }
  return out;
}

function compareOne(
  segment: string, muscle: string, normalization: LoadUnit, measure: string, ca: string, cb: string,
  va: Map<string, number>, vb: Map<string, number>, boot: { seed: number; resamples: number; level: number },
): Comparison {
  const unit = measureUnit(measure, normalization);
  const workers = [...new Set([...va.keys(), ...vb.keys()])].sort();
  const common = workers.filter((w) => va.has(w) && vb.has(w));
  const paired = common.length > 0;
  const levelPct = `${Math.round(boot.level * 1000) / 10} %`;
  const u = unitSuffix(unit);
  const label = measureLabel(measure);
  const head = `${cb} vs ${ca}, ${label}`;

  if (paired) {
    const diffs = Float64Array.from(common, (w) => vb.get(w)! - va.get(w)!);
    const per_worker: ComparisonWorker[] = workers.map((w) => ({
      worker: w, a: va.get(w) ?? null, b: vb.get(w) ?? null,
      difference: va.has(w) && vb.has(w) ? vb.get(w)! - va.get(w)! : null,
    }));
    const excluded = workers.filter((w) => !(va.has(w) && vb.has(w)));
    const n = common.length;
    let lower = 0; let higher = 0; let same = 0;
    for (const d of diffs) { if (d < 0) lower++; else if (d > 0) higher++; else same++; }
    const md = median(diffs);
    const descriptive = n < COMPARE_DEFAULTS.min_workers;
    const wil = n > 0 && (lower + higher > 0) ? wilcoxonSignedRank(diffs) : null;
    const ci = descriptive ? null : bootstrapCi(diffs, median, boot);
    const counts = `lower in ${lower} of ${n} workers, higher in ${higher}${same > 0 ? `, unchanged in ${same}` : ''}`;
    const excl = excluded.length > 0 ? ` (${excluded.length} worker${excluded.length === 1 ? '' : 's'} without both conditions left out)` : '';
    const [fmd, flo, fhi] = formatNumbers(ci ? [md, ci.low, ci.high] : [md]);
    const statement = descriptive
      ? `${head}: descriptive only (${n} worker${n === 1 ? '' : 's'} measured in both conditions; at least ${COMPARE_DEFAULTS.min_workers} are needed for an interval or test): ${counts}; median difference ${fmd}${u}${excl}.`
      : `${head}: ${counts}; median difference ${fmd}${u} (${levelPct} CI ${flo} to ${fhi}); Wilcoxon signed-rank ${formatP(wil ? wil.p_value : 1)}${excl}.`;
    return {
      segment, muscle, measure, unit, normalization, condition_a: ca, condition_b: cb,
      paired: true, n, n_a: n, n_b: n, per_worker, excluded_workers: excluded,
      median_a: median(Float64Array.from(common, (w) => va.get(w)!)),
      median_b: median(Float64Array.from(common, (w) => vb.get(w)!)),
      median_difference: md, mean_difference: mean(diffs),
      ci_low: ci ? ci.low : null, ci_high: ci ? ci.high : null, ci_level: boot.level, ci_method: ci ? ci.method : null,
      p_value: descriptive ? null : wil ? wil.p_value : 1,
      test: descriptive ? 'none (descriptive only)' : `Wilcoxon signed-rank, two-sided, zero differences dropped (${wil ? (wil.method === 'exact' ? 'exact' : 'normal approximation with tie and continuity correction') : 'all differences zero'})`,
      effect_size: wil ? wil.rank_biserial : 0, effect_size_name: 'matched-pairs rank-biserial r',
      lower_in: lower, higher_in: higher, unchanged_in: same,
      descriptive_only: descriptive, statement,
    };
  }

  const a = Float64Array.from([...va.keys()].sort(), (w) => va.get(w)!);
  const b = Float64Array.from([...vb.keys()].sort(), (w) => vb.get(w)!);
  const per_worker: ComparisonWorker[] = workers.map((w) => ({ worker: w, a: va.get(w) ?? null, b: vb.get(w) ?? null, difference: null }));
  const descriptive = Math.min(a.length, b.length) < COMPARE_DEFAULTS.min_workers;
  const ma = median(a);
  const mb = median(b);
  const rs = rankSum(a, b);
  const ci = descriptive ? null : bootstrapDifferenceCi(a, b, median, boot);
  const groupsTxt = `different workers (${a.length} in ${ca}, ${b.length} in ${cb})`;
  const [fmb, fma] = formatNumbers([mb, ma]);
  const medians = `median ${fmb} vs ${fma}${levelSuffix(unit)}`;
  const [fd, flo, fhi] = formatNumbers(ci ? [mb - ma, ci.low, ci.high] : [mb - ma]);
  const statement = descriptive
    ? `${head}: descriptive only (${groupsTxt}; at least ${COMPARE_DEFAULTS.min_workers} per condition are needed for an interval or test): ${medians}; difference of medians ${fd}${u}.`
    : `${head}: ${groupsTxt}; ${medians}; difference of medians ${fd}${u} (${levelPct} CI ${flo} to ${fhi}); rank-sum ${formatP(rs.p_value)}.`;
  return {
    segment, muscle, measure, unit, normalization, condition_a: ca, condition_b: cb,
    paired: false, n: a.length + b.length, n_a: a.length, n_b: b.length, per_worker, excluded_workers: [],
    median_a: ma, median_b: mb, median_difference: mb - ma, mean_difference: mean(b) - mean(a),
    ci_low: ci ? ci.low : null, ci_high: ci ? ci.high : null, ci_level: boot.level, ci_method: ci ? ci.method : null,
    p_value: descriptive ? null : rs.p_value,
    test: descriptive ? 'none (descriptive only)' : `Wilcoxon rank-sum (Mann–Whitney U), two-sided (${rs.method === 'exact' ? 'exact' : 'normal approximation with tie and continuity correction'})`,
    effect_size: rs.rank_biserial, effect_size_name: "Cliff's delta (rank-biserial)",
    lower_in: null, higher_in: null, unchanged_in: null,
    descriptive_only: descriptive, statement,
  };
}
