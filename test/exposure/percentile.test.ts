import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { percentile, percentiles, percentileSorted, rankedValid, sortedValid } from '../../lib/exposure/percentile.js';
import { UsageError } from '../../lib/errors.js';

// Expected: shared/fixtures/dsp/percentile.json, numpy 2.4.6 numpy.percentile (method 'linear').
const fixture = JSON.parse(readFileSync(new URL('../../../shared/fixtures/dsp/percentile.json', import.meta.url), 'utf8')) as {
  cases: { name: string; values: number[]; q: number[]; percentile: number[]; extra_q: number[]; extra_percentile: number[] }[];
};

function close(a: number, b: number, rel = 1e-12): void {
  expect(Math.abs(a - b)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(b)));
}

describe('percentiles(values, qs)', () => {
  for (const c of fixture.cases) {
    it(`percentiles(${c.name}) matches numpy.percentile for every q in the fixture (rel 1e-12)`, () => {
      const values = Float64Array.from(c.values);
      const before = Float64Array.from(values);
      const qs = [...c.q, ...c.extra_q];
      const want = [...c.percentile, ...c.extra_percentile];
      const got = percentiles(values, qs);
      got.forEach((g, i) => close(g, want[i]!));
      expect(values).toEqual(before); // input not sorted in place
    });
  }

  it('percentiles(1…10, [10, 50, 90]) = 1.9 / 5.5 / 9.1 (METHODS.md §1.5, numpy default, COMPUTED)', () => {
    const got = percentiles([1, 2, 3, 4, 5, 6, 7, 8, 9, 10], [10, 50, 90]);
    close(got[0]!, 1.9); close(got[1]!, 5.5); close(got[2]!, 9.1);
  });

  it('percentiles(values with NaN) equals percentiles of the values without NaN', () => {
    const c = fixture.cases[0]!;
    const withNaN = new Float64Array(c.values.length * 2);
    withNaN.fill(NaN);
    c.values.forEach((v, i) => { withNaN[2 * i + 1] = v; });
    expect(percentiles(withNaN, c.q)).toEqual(percentiles(c.values, c.q));
  });

  it('percentile(all NaN, 50) is NaN and percentile(x, 101) throws UsageError', () => {
    expect(percentile([NaN, NaN], 50)).toBeNaN();
    expect(percentile([], 50)).toBeNaN();
    expect(() => percentile([1], 101)).toThrow(UsageError);
    expect(() => percentile([1], NaN)).toThrow(/from 0 to 100/);
  });

  it('percentileSorted(constant c, q) = c for every q (invariant)', () => {
    const c = new Float64Array(1000).fill(3.25);
    for (const q of [0, 10, 33.3, 50, 90, 100]) expect(percentileSorted(c, q)).toBe(3.25);
  });
});

describe('rankedValid(values, qs)', () => {
  // Reference: the full sort (sortedValid) read at the same ranks — the two must agree bit for bit.
  function rng(seed: number): () => number {
    let s = seed >>> 0;
    return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 4294967296);
  }
  const qsAll = [...Array.from({ length: 101 }, (_, p) => p), 2.5, 97.5, 33.3];
  const shapes: [string, (r: () => number, i: number) => number][] = [
    ['uniform', (r) => r() * 100],
    ['skewed (exponential, long tail)', (r) => -Math.log(1 - r()) * 5],
    ['heavy ties (integers 0–9)', (r) => Math.floor(r() * 10)],
    ['with NaN, zeros, −0 and one huge outlier', (r, i) => (i % 97 === 0 ? NaN : i % 89 === 0 ? 0 : i % 83 === 0 ? -0 : i === 5000 ? 1e12 : r() * 3)],
  ];
  for (const [name, gen] of shapes) {
    for (const n of [10, 5000, 60000]) {
      it(`rankedValid(${name}, n = ${n}) equals sortedValid at every rank the percentiles read`, () => {
        const r = rng(n * 7 + name.length);
        const values = Float64Array.from({ length: n }, (_, i) => gen(r, i));
        const before = values.slice();
        const full = sortedValid(values);
        const ranked = rankedValid(values, qsAll);
        expect(ranked.length).toBe(full.length);
        for (const q of qsAll) expect(Object.is(percentileSorted(ranked, q), percentileSorted(full, q))).toBe(true);
        expect(values).toEqual(before); // input not changed
      });
    }
  }

  it('rankedValid of all-equal or all-NaN values', () => {
    expect(percentileSorted(rankedValid(new Float64Array(10000).fill(3), [50]), 50)).toBe(3);
    expect(rankedValid(new Float64Array(10000).fill(NaN), [50]).length).toBe(0);
  });
});
