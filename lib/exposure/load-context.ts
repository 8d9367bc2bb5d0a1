// Context sentences that place a row's load levels and rest figures beside literature values.
// Wording never says pass/fail: literature values are context, not limits, and figures describe
// muscle load, not an individual's injury risk.

import { JONSSON_GUIDELINES, REFERENCE_RANGES } from './guideline-values.js';

export interface LoadContextInput {
  /** Unit of the values; comparisons are made only for '%MVE'. */
  unit: string;
  p10?: number | null;
  p50?: number | null;
  p90?: number | null;
  gaps_per_min?: number | null;
  rest_pct?: number | null;
  /** Which published ranges to use; without it, only Jonsson's values and gap context are given. */
  muscle_group?: 'trapezius' | 'forearm extensors';
}

function fmt(x: number): string {
  const a = Math.abs(x);
  const s = a >= 100 ? x.toFixed(0) : a >= 10 ? x.toFixed(1) : x.toFixed(a >= 1 ? 1 : 2);
  return s.replace('-', '−');
}

const LEVEL_NAME: Record<string, string> = { static: 'Static load (P10)', median: 'Median load (P50)', peak: 'Peak load (P90)' };

/**
 * Sentences relating p10/p50/p90 (%MVE), gaps/min and rest % to literature values.
 *
 * Only for %MVE: for any other unit a single sentence says no comparison is made. Jonsson's values
 * are historical guideline values quoted from memory (METHODS.md §1.3); ranges are from §9.
 *
 * @param row the row's values and unit
 * @returns sentences in plain words (never pass/fail), ending with the caution sentence
 * @example loadContext({ unit: '%MVE', p50: 8 })
 *   // ["Median load (P50) 8.0 %MVE is at or below the historical 'should not exceed' value of 10 %MVC suggested by Jonsson (1982, quoted from memory).", …]
 */
export function loadContext(row: LoadContextInput): string[] {
  if (row.unit !== '%MVE') {
    return [`Literature values are expressed relative to maximal contractions (%MVC/%MVE); values in ${row.unit} are not compared with them.`];
  }
  const out: string[] = [];
  const src = JONSSON_GUIDELINES.short;
  for (const g of JONSSON_GUIDELINES.levels) {
    const v = row[`p${g.q}` as 'p10' | 'p50' | 'p90'];
    if (v === undefined || v === null || !Number.isFinite(v)) continue;
    const head = `${LEVEL_NAME[g.level]} ${fmt(v)} %MVE`;
    if (v <= g.should_not_exceed) {
      out.push(`${head} is at or below the historical 'should not exceed' value of ${g.should_not_exceed} %MVC suggested by ${src}.`);
    } else if (v <= g.must_not_exceed) {
      out.push(`${head} is above the historical 'should not exceed' value of ${g.should_not_exceed} %MVC and at or below the 'must not exceed' value of ${g.must_not_exceed} %MVC suggested by ${src}.`);
    } else {
      out.push(`${head} is above both historical values (${g.should_not_exceed} and ${g.must_not_exceed} %MVC) suggested by ${src}.`);
    }
  }
  const placed = (v: number, lo: number, hi: number) => (v < lo ? 'below' : v > hi ? 'above' : 'within');
  for (const r of REFERENCE_RANGES) {
    if (r.measure === 'gaps_per_min' || r.id === 'veiersted1990-static') continue;
    if (row.muscle_group === undefined || r.muscle_group !== row.muscle_group) continue;
    const v = row[r.measure];
    if (v === undefined || v === null || !Number.isFinite(v)) continue;
    const what = r.measure === 'rest_pct' ? `Muscular rest ${fmt(v)} % of time` : `Peak load (P90) ${fmt(v)} %MVE`;
    out.push(`${what} lies ${placed(v, r.low, r.high)} the range ${fmt(r.low)}–${fmt(r.high)} ${r.unit}${r.central !== null ? ` (${r.central_kind} ${fmt(r.central)})` : ''} reported for ${r.muscle_group} in ${r.population} by ${r.short}.`);
  }
  const g = row.gaps_per_min;
  if (g !== undefined && g !== null && Number.isFinite(g)) {
    const r = REFERENCE_RANGES.find((x) => x.id === 'veiersted1990-gaps')!;
    out.push(`Gap frequency ${fmt(g)} gaps/min; ${r.short} reported a median of ${fmt(r.central!)} (range ${fmt(r.low)}–${fmt(r.high)}) gaps/min for the trapezius of ${r.population}; thresholds and methods differ between studies.`);
  }
  if (out.length > 0) {
    out.push('These literature values are context, not limits; the figures describe muscle load, not an individual\'s injury risk.');
  }
  return out;
}
