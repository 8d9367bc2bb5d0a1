import { describe, expect, it } from 'vitest';
import { loadContext } from '../../lib/exposure/load-context.js';
import { JONSSON_GUIDELINES, REFERENCE_RANGES } from '../../lib/exposure/guideline-values.js';

describe('loadContext(row)', () => {
  it("loadContext({p50: 8 %MVE}) says 'at or below the historical should-not-exceed value of 10 %MVC' (Jonsson, FROM MEMORY)", () => {
    const s = loadContext({ unit: '%MVE', p50: 8 });
    expect(s[0]).toBe("Median load (P50) 8.0 %MVE is at or below the historical 'should not exceed' value of 10 %MVC suggested by Jonsson (1982, quoted from memory).");
    expect(s.at(-1)).toMatch(/context, not limits/);
  });

  it('loadContext places values between and above the two historical values and never says pass/fail', () => {
    const s = loadContext({ unit: '%MVE', p10: 3, p50: 20, p90: 45, gaps_per_min: 2, rest_pct: 4, muscle_group: 'trapezius' });
    const text = s.join(' ');
    expect(s[0]).toMatch(/above the historical 'should not exceed' value of 2 %MVC and at or below the 'must not exceed' value of 5 %MVC/);
    expect(s[1]).toMatch(/above both historical values \(10 and 14 %MVC\)/);
    expect(text).toMatch(/Peak load \(P90\) 45\.0 %MVE lies above the range 3\.1–24\.0/);
    expect(text).toMatch(/Veiersted et al\. \(1990\) reported a median of 4\.8/);
    expect(text).not.toMatch(/\b(pass|fail|safe|unsafe|exceeds the limit|violat)/i);
  });

  it('loadContext({unit: %RVE}) makes no comparison and says why', () => {
    const s = loadContext({ unit: '%RVE', p50: 80 });
    expect(s).toHaveLength(1);
    expect(s[0]).toMatch(/not compared/);
  });

  it('guideline data carry citations and evidence tags', () => {
    expect(JONSSON_GUIDELINES.evidence).toBe('FROM MEMORY');
    expect(JONSSON_GUIDELINES.levels.map((l) => [l.should_not_exceed, l.must_not_exceed])).toEqual([[2, 5], [10, 14], [50, 70]]);
    for (const r of REFERENCE_RANGES) { expect(r.citation.length).toBeGreaterThan(20); expect(r.low).toBeLessThanOrEqual(r.high); }
  });
});
