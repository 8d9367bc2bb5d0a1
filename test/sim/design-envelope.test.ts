import { describe, expect, it } from 'vitest';
import { designEnvelope, type PlannedSegment } from '../../lib/sim/design-envelope.js';
import { SIM_DEFAULTS, type TaskDesign } from '../../lib/sim/simulation-spec.js';
import { Xoshiro128 } from '../../lib/stats/xoshiro128.js';

const task = (o: Partial<TaskDesign>): TaskDesign => ({ ...SIM_DEFAULTS.task, level_pct: 10, ...o });
const rate = 20;

describe('designEnvelope(segments, duration_s, rate_hz, rng)', () => {
  const segs: PlannedSegment[] = [
    { label: 'picking', start_s: 0, end_s: 120, design: task({ level_pct: 12, spread_pct: 4, gaps_per_min: 3 }) },
    { label: 'micro-break', start_s: 120, end_s: 180, design: task({ level_pct: 2, spread_pct: 0.3, floor_pct: 1.5, gaps_per_min: 8, gap_s: [0.5, 1] }) },
  ];

  it('places round(gaps_per_min · minutes) gaps per segment, each at the gap level, apart by the separation', () => {
    const env = designEnvelope(segs, 180, rate, new Xoshiro128(3));
    expect(env.gaps[0].length).toBe(6);
    expect(env.gaps[1].length).toBe(8);
    env.gaps.forEach((gs, i) => {
      const d = segs[i].design;
      let prevEnd = segs[i].start_s;
      for (const g of gs) {
        expect(g.start_s - prevEnd).toBeGreaterThanOrEqual(d.gap_separation_s - 1e-9);
        expect(g.end_s - g.start_s).toBeGreaterThanOrEqual(d.gap_s[0] - 1 / rate);
        expect(g.end_s - g.start_s).toBeLessThanOrEqual(d.gap_s[1] + 1 / rate);
        for (let k = Math.round(g.start_s * rate); k < Math.round(g.end_s * rate); k++) expect(env.values[k]).toBe(d.gap_level_pct);
        prevEnd = g.end_s;
      }
      expect(segs[i].end_s - prevEnd).toBeGreaterThanOrEqual(d.gap_separation_s - 1e-9);
    });
  });

  it('keeps every value outside the gaps within [floor_pct, cap_pct]', () => {
    const env = designEnvelope(segs, 180, rate, new Xoshiro128(4));
    const inGap = new Uint8Array(env.values.length);
    for (const gs of env.gaps) for (const g of gs) inGap.fill(1, Math.round(g.start_s * rate), Math.round(g.end_s * rate));
    for (let k = 0; k < env.values.length; k++) {
      if (inGap[k]) continue;
      const d = k / rate < 120 ? segs[0].design : segs[1].design;
      // a ramp crossing the segment boundary blends both tasks' levels
      const lo = Math.min(segs[0].design.floor_pct, segs[1].design.floor_pct);
      expect(env.values[k]).toBeGreaterThanOrEqual(lo - 1e-12);
      expect(env.values[k]).toBeLessThanOrEqual(d.cap_pct);
    }
  });

  it('with spread 0 and no gaps gives the task level exactly', () => {
    const env = designEnvelope([{ label: 'a', start_s: 0, end_s: 30, design: task({ level_pct: 7 }) }], 30, rate, new Xoshiro128(1));
    expect(Array.from(env.values).every((v) => v === 7)).toBe(true);
  });

  it('step levels have the designed mean and spread (2 h, spread 4 around 12 %MVE, no clamping)', () => {
    const d = task({ level_pct: 12, spread_pct: 4, floor_pct: 0, step_s: [2, 8], ramp_s: 0.05 });
    const env = designEnvelope([{ label: 'a', start_s: 0, end_s: 7200, design: d }], 7200, rate, new Xoshiro128(5));
    let s = 0, s2 = 0;
    for (const v of env.values) { s += v; s2 += v * v; }
    const n = env.values.length, m = s / n, sd = Math.sqrt(s2 / n - m * m);
    // ≈1400 steps: standard error of the mean ≈ 4/√1400 ≈ 0.11
    expect(Math.abs(m - 12)).toBeLessThan(0.5);
    expect(Math.abs(sd - 4)).toBeLessThan(0.5);
  });

  it('the same seed gives the same envelope, another seed another', () => {
    const a = designEnvelope(segs, 180, rate, new Xoshiro128(9));
    const b = designEnvelope(segs, 180, rate, new Xoshiro128(9));
    const c = designEnvelope(segs, 180, rate, new Xoshiro128(10));
    expect(Array.from(a.values)).toEqual(Array.from(b.values));
    expect(Array.from(a.values)).not.toEqual(Array.from(c.values));
  });

  it('drops gaps that do not fit with their separations', () => {
    const env = designEnvelope([{ label: 'a', start_s: 0, end_s: 10, design: task({ gaps_per_min: 60, gap_s: [1, 1], gap_separation_s: 3 }) }], 10, rate, new Xoshiro128(1));
    // 10 s holds at most 2 gaps of 1 s with 3 s around each: 2·1 + 3·3 = 11 > 10 → 1 gap (1 + 2·3 = 7)
    expect(env.gaps[0].length).toBe(1);
  });
});

describe('designReferenceEnvelope(ref, rate_hz)', () => {
  it('ramps to the hold level, holds it, releases, and lasts whole seconds', async () => {
    const { designReferenceEnvelope } = await import('../../lib/sim/design-reference-envelope.js');
    const ref = { ...SIM_DEFAULTS.reference, ramp_s: 1.5 };
    const d = designReferenceEnvelope(ref, 20);
    // 5 + 3 · (1.5 + 5 + 1 + 15) = 72.5 s → 73 s
    expect(d.duration_s).toBe(73);
    expect(d.trials.map((t) => t.text)).toEqual(['MVC 1', 'MVC 2', 'MVC 3']);
    const t1 = d.trials[1];
    expect(t1.onset_s).toBe(5 + 22.5);
    const at = (t: number) => d.values[Math.round(t * 20)];
    expect(at(t1.onset_s)).toBe(0);
    expect(at(t1.onset_s + 0.75)).toBeCloseTo(50, 12);
    expect(at(t1.hold_start_s + 2)).toBe(100);
    expect(at(t1.hold_end_s + 0.5)).toBeCloseTo(50, 12);
    expect(at(t1.onset_s + t1.duration_s + 1)).toBe(0);
    expect(at(2)).toBe(0);
  });
});
