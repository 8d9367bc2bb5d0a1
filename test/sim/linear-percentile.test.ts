import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { linearPercentile } from '../../lib/sim/linear-percentile.js';

// expected: shared/fixtures/dsp/percentile.json, numpy 2.4.6 numpy.percentile (method 'linear')
const fx = JSON.parse(readFileSync(new URL('../../../shared/fixtures/dsp/percentile.json', import.meta.url), 'utf8')) as {
  cases: { name: string; values: number[]; q: number[]; percentile: number[]; extra_q: number[]; extra_percentile: number[] }[];
};

describe('linearPercentile(values, p)', () => {
  for (const c of fx.cases) {
    it(`matches numpy.percentile on the fixture case "${c.name}" (1e-9)`, () => {
      const v = Float64Array.from(c.values);
      const frozen = Float64Array.from(c.values);
      const qs = [...c.q, ...c.extra_q];
      const want = [...c.percentile, ...c.extra_percentile];
      qs.forEach((q, i) => expect(linearPercentile(v, q)).toBeCloseTo(want[i], 9));
      expect(v).toEqual(frozen); // input not mutated
    });
  }

  it('linearPercentile(values, p, start, end) uses only the range', () => {
    expect(linearPercentile(Float64Array.of(100, 1, 2, 3, 4, -100), 50, 1, 5)).toBe(2.5);
    expect(Number.isNaN(linearPercentile(new Float64Array(3), 50, 2, 2))).toBe(true);
  });
});
