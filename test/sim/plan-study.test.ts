import { describe, expect, it } from 'vitest';
import { parseSimulationSpec } from '../../lib/sim/load-simulation-spec.js';
import { cycleTimes, planStudy } from '../../lib/sim/plan-study.js';
import { TINY_SPEC } from './tiny-spec.js';

describe('cycleTimes(cycle, duration_s)', () => {
  it('repeats the cycle, cuts the last piece at the duration and merges a piece under 10 s', () => {
    const c = [{ label: 'a', duration_s: 30 }, { label: 'b', duration_s: 15 }];
    expect(cycleTimes(c, 100)).toEqual([
      { label: 'a', start_s: 0, end_s: 30 }, { label: 'b', start_s: 30, end_s: 45 },
      { label: 'a', start_s: 45, end_s: 75 }, { label: 'b', start_s: 75, end_s: 90 },
      { label: 'a', start_s: 90, end_s: 100 },
    ]);
    expect(cycleTimes(c, 95).at(-1)).toEqual({ label: 'b', start_s: 75, end_s: 95 });
  });
});

describe('planStudy(spec, options)', () => {
  const spec = parseSimulationSpec(TINY_SPEC, 'tiny.yaml');

  it('designs reference, rest and one field recording per condition for each worker', () => {
    const plan = planStudy(spec);
    expect(plan.variant).toBe('short');
    expect(plan.recordings.map((r) => r.file)).toEqual([
      'w1-ref.csv', 'w1-rest.csv', 'w1-c1.csv', 'w1-c2.csv', 'w2-ref.csv', 'w2-rest.csv', 'w2-c1.csv', 'w2-c2.csv',
    ]);
    const field = plan.recordings[2];
    expect(field.annotations.map((a) => a.text)).toEqual(['work', 'pause', 'work', 'pause']);
    expect(field.channels.map((c) => c.envelope.length)).toEqual([90 * 20 + 1, 90 * 20 + 1]);
  });

  it('multiplies the designed levels by the worker load factor', () => {
    const flat = parseSimulationSpec(TINY_SPEC.replace('load: 1.2', 'load: 2').replace('work: { a: { level_pct: 6, spread_pct: 2, gaps_per_min: 4 }', 'work: { a: { level_pct: 6 }'), 'tiny.yaml');
    const plan = planStudy(flat);
    const w1 = plan.recordings.find((r) => r.file === 'w1-c2.csv')!.channels[0];
    const w2 = plan.recordings.find((r) => r.file === 'w2-c2.csv')!.channels[0];
    expect(new Set(w1.envelope)).toEqual(new Set([6]));
    expect(new Set(w2.envelope)).toEqual(new Set([12]));
  });

  it('--variant long scales the cycle and lengthens the recordings', () => {
    const plan = planStudy(spec, { variant: 'long', format: 'edf' });
    const field = plan.recordings.find((r) => r.file === 'w1-c1.edf')!;
    expect(field.duration_s).toBe(180);
    expect(field.segments.slice(0, 2).map((s) => [s.start_s, s.end_s])).toEqual([[0, 60], [60, 90]]);
  });
});
