import { describe, expect, it } from 'vitest';
import { compareConditions, formatNumbers } from '../../lib/study/compare-conditions.js';
import type { LoadUnit, ResultRow } from '../../lib/study/results.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';
import { wilcoxonSignedRank } from '../../lib/stats/wilcoxon-signed-rank.js';
import { rankSum } from '../../lib/stats/rank-sum.js';
import { bootstrapCi } from '../../lib/stats/bootstrap-ci.js';
import { median } from '../../lib/stats/median.js';
import { UsageError } from '../../lib/errors.js';

function row(worker: string, condition: string, values: Partial<ResultRow> & { p50?: number | null }, unit: LoadUnit = '%MVE'): ResultRow {
  return {
    worker, condition, muscle: 'trapezius R', signal: 'EMG R', recording: `${worker}-${condition}.edf`, segment: 'assembly',
    start_s: 0, end_s: 3600, valid_s: 3600, unit, reference_uv: 400, noise_uv: 3,
    p10: 1, p50: 5, p90: 12, gap_threshold: 0.5, gaps: 100, gaps_per_min: 1.7, rest_pct: 4,
    longest_without_gap_s: 300, sustained_pct: 10, ...values,
  } as ResultRow;
}

/** A simulated study: n workers, p50 in A ~ N(10, 3²), B = A + shift + N(0, 0.8²). */
function study(g: SplitMix64, n: number, shift: number): ResultRow[] {
  const rows: ResultRow[] = [];
  for (let i = 0; i < n; i++) {
    const a = 10 + 3 * g.normal();
    const b = a + shift + 0.8 * g.normal();
    rows.push(row(`W${String(i + 1).padStart(2, '0')}`, 'current', { p50: a }));
    rows.push(row(`W${String(i + 1).padStart(2, '0')}`, 'redesign', { p50: b }));
  }
  return rows;
}

describe('compareConditions(rows, options)', () => {
  it('compareConditions: a designed reduction of 2 %MVE in 8 workers is detected (known truth)', () => {
    const rows = study(new SplitMix64(31), 8, -2);
    const [c] = compareConditions(rows, { measures: ['p50'], seed: 4 });
    expect(c!.paired).toBe(true);
    expect(c!.n).toBe(8);
    expect(c!.condition_a).toBe('current');
    expect(c!.condition_b).toBe('redesign');
    expect(c!.p_value!).toBeLessThan(0.05);
    expect(c!.ci_high!).toBeLessThan(0);
    expect(c!.ci_low!).toBeLessThan(c!.median_difference!);
    expect(c!.lower_in! + c!.higher_in! + c!.unchanged_in!).toBe(8);
    expect(c!.effect_size!).toBeLessThan(-0.5);
    expect(c!.descriptive_only).toBe(false);
    // independent recomputation with the primitives
    const diffs = c!.per_worker.map((w) => w.difference!);
    expect(c!.p_value).toBe(wilcoxonSignedRank(diffs).p_value);
    const ci = bootstrapCi(diffs, median, { seed: 4 });
    expect([c!.ci_low, c!.ci_high]).toEqual([ci.low, ci.high]);
  });

  it('compareConditions: a designed shift of −2 %MVE (SD of differences 0.8) is detected in ≥ 95 % of 100 simulated 8-worker studies', () => {
    // Known truth: the shift is 2.5 SDs of the per-worker differences, so power is near 1.
    const g = new SplitMix64(123);
    let detected = 0;
    for (let s = 0; s < 100; s++) {
      const [c] = compareConditions(study(g, 8, -2), { measures: ['p50'], seed: s + 1, resamples: 200 });
      if (c!.p_value! < 0.05 && c!.ci_high! < 0) detected++;
    }
    expect(detected).toBeGreaterThanOrEqual(95);
  });

  it('compareConditions: without a designed difference p < 0.05 in about 5 % of 400 simulated studies (nominal level)', () => {
    const g = new SplitMix64(99);
    let positives = 0;
    const studies = 400;
    for (let s = 0; s < studies; s++) {
      const [c] = compareConditions(study(g, 10, 0), { measures: ['p50'], seed: s + 1, resamples: 20 });
      if (c!.p_value! < 0.05) positives++;
    }
    const rate = positives / studies;
    // exact signed-rank test with n = 10 has size 0.049 at p < 0.05; binomial SD over 400 studies ≈ 0.011
    expect(rate).toBeGreaterThan(0.015);
    expect(rate).toBeLessThan(0.09);
  });

  it('compareConditions statement: "lower in 5 of 6 workers, higher in 1; median difference … (95 % CI … to …)" and never claims significance', () => {
    const a = [10, 8, 12, 9, 11, 7];
    const d = [-3, -2.5, -2, -1.5, -1, 0.5];
    const rows = a.flatMap((v, i) => [row(`W${i}`, 'before', { p50: v }), row(`W${i}`, 'after', { p50: v + d[i]! })]);
    const [c] = compareConditions(rows, { measures: ['p50'], seed: 1 });
    const ci = bootstrapCi(d, median, { seed: 1 });
    const [, lo, hi] = formatNumbers([-1.75, ci.low, ci.high]);
    expect(c!.statement).toBe(
      'after vs before, median load (P50): lower in 5 of 6 workers, higher in 1; median difference −1.8 %MVE'
      + ` (95 % CI ${lo} to ${hi}); Wilcoxon signed-rank p = 0.063.`,
    );
    expect(c!.p_value).toBeCloseTo(0.0625, 12); // exact, T = 1 with n = 6: 2·2/64 (scipy agrees, see rank_tests.json six_pairs)
    expect(c!.statement).not.toMatch(/significan|prove|caus|safe|risk/i);
  });

  it('compareConditions with fewer than 5 workers is descriptive only: no p-value, no interval, and says so', () => {
    const rows = [0, 1, 2].flatMap((i) => [row(`W${i}`, 'A', { rest_pct: 4 + i }), row(`W${i}`, 'B', { rest_pct: 6 + i })]);
    const [c] = compareConditions(rows, { measures: ['rest_pct'] });
    expect(c!.descriptive_only).toBe(true);
    expect(c!.p_value).toBeNull();
    expect(c!.ci_low).toBeNull();
    expect(c!.test).toBe('none (descriptive only)');
    expect(c!.unit).toBe('% time');
    expect(c!.statement).toMatch(/descriptive only/);
    expect(c!.statement).toMatch(/higher in 3/);
    expect(c!.statement).toMatch(/median difference 2\.0 percentage points/);
  });

  it('compareConditions: different workers in the two conditions → unpaired rank-sum with the difference of medians', () => {
    const ga = [5, 6, 7, 8, 9, 10];
    const gb = [3, 4, 4.5, 5.5, 6.5];
    const rows = [...ga.map((v, i) => row(`A${i}`, 'old', { p90: v })), ...gb.map((v, i) => row(`B${i}`, 'new', { p90: v }))];
    const [c] = compareConditions(rows, { measures: ['p90'], resamples: 2000 });
    expect(c!.paired).toBe(false);
    expect([c!.n_a, c!.n_b]).toEqual([6, 5]);
    expect(c!.median_difference).toBe(median(gb) - median(ga));
    expect(c!.p_value).toBe(rankSum(ga, gb).p_value);
    expect(c!.lower_in).toBeNull();
    expect(c!.effect_size).toBe(rankSum(ga, gb).rank_biserial);
    expect(c!.statement).toMatch(/different workers \(6 in old, 5 in new\)/);
  });

  it('compareConditions pairs by worker id, uses only workers with both, and lists the others', () => {
    const rows = [0, 1, 2, 3, 4, 5].flatMap((i) => [row(`W${i}`, 'A', { p10: 1 + i }), row(`W${i}`, 'B', { p10: 0.5 + i })]);
    rows.push(row('W9', 'A', { p10: 3 }));
    const [c] = compareConditions(rows, { measures: ['p10'], resamples: 200 });
    expect(c!.paired).toBe(true);
    expect(c!.n).toBe(6);
    expect(c!.excluded_workers).toEqual(['W9']);
    expect(c!.per_worker.find((w) => w.worker === 'W9')).toEqual({ worker: 'W9', a: 3, b: null, difference: null });
    expect(c!.statement).toMatch(/1 worker without both conditions left out/);
  });

  it('compareConditions never mixes normalization units and combines repeated rows by valid time', () => {
    const rows = [
      row('W1', 'A', { p50: 4 }), row('W1', 'B', { p50: 3 }),
      row('W1', 'A', { p50: 40 }, '%RVE'), row('W1', 'B', { p50: 30 }, '%RVE'),
      row('W1', 'B', { p50: 6, valid_s: 1200 }), // second recording: (3·3600 + 6·1200)/4800 = 3.75
    ];
    const cs = compareConditions(rows, { measures: ['p50'], resamples: 50 });
    expect(cs.map((c) => c.normalization)).toEqual(['%MVE', '%RVE']);
    expect(cs[0]!.per_worker[0]!.b).toBeCloseTo(3.75, 12);
    expect(cs[1]!.unit).toBe('%RVE');
  });

  it('formatNumbers shares decimals across an estimate and its interval and uses a true minus sign', () => {
    expect(formatNumbers([-1.75, -2.8, -0.25])).toEqual(['−1.8', '−2.8', '−0.3']);
    expect(formatNumbers([0.123, -0.0449])).toEqual(['0.12', '−0.04']);
    expect(formatNumbers([-0.001])).toEqual(['0.00']);
    expect(formatNumbers([123.4, 5])).toEqual(['123', '5']);
  });

  it('compareConditions is deterministic and rejects unknown measures (UsageError)', () => {
    const rows = study(new SplitMix64(3), 6, 1);
    expect(compareConditions(rows, { resamples: 300 })).toEqual(compareConditions(rows, { resamples: 300 }));
    expect(compareConditions(rows, { resamples: 300 }).map((c) => c.measure)).toEqual(['p10', 'p50', 'p90', 'gaps_per_min', 'rest_pct']);
    expect(() => compareConditions(rows, { measures: ['p50x'] })).toThrow(UsageError);
  });
});
