// The JASA plane chart model: where points land, which are hollow or left out, and the quadrant
// names. Quadrants as METHODS.md §6 (Luttmann et al. 2000; the mapping is FROM MEMORY there):
// amplitude up & MNF down = fatigue, amplitude down & MNF up = recovery, both up = force increase,
// both down = force decrease. INVENTED TEST DATA.
import { describe, expect, it } from 'vitest';
import { chartMarks } from '../../../lib/report/charts/chart-marks.js';
import { jasaChart, type JasaLabels } from '../../../lib/report/charts/jasa-chart.js';
import type { FatigueBlock, FatigueCategory } from '../../../lib/study/results.js';

const labels: JasaLabels = { amplitude: 'amplitude trend', mnf: 'MNF trend', fatigue: 'fatigue', recovery: 'recovery', forceIncrease: 'force increase', forceDecrease: 'force decrease', clear: 'clear', unclear: 'unclear', interval: '95 % interval' };

function block(x: number | null, y: number | null, category: FatigueCategory, segment: string | null = null): FatigueBlock {
  return {
    worker: 'W1', condition: 'a', muscle: 'm', signal: 's', recording: 'r.edf', segment, start_s: 0, end_s: 600, epochs: 500, epochs_total: 600,
    amplitude_unit: '%MVE', amplitude_slope_unit: '%MVE/min', amplitude_mean: 10, amplitude_slope_per_min: x,
    amplitude_ci_low: x === null ? null : x - 0.1, amplitude_ci_high: x === null ? null : x + 0.1,
    mnf_mean_hz: 100, mnf_slope_hz_per_min: y, mnf_ci_low: y === null ? null : y - 0.2, mnf_ci_high: y === null ? null : y + 0.2,
    mdf_mean_hz: 90, mdf_slope_hz_per_min: y, category, ci_level: 0.95, active_rule: 'rule',
  };
}

const blocks = [
  block(0.5, -0.8, 'fatigue'), // METHODS.md §6 check values: +0.5 %MVE/min, −0.8 Hz/min → fatigue
  block(-0.4, 0.6, 'recovery'),
  block(0.3, 0.2, 'force-increase'),
  block(-0.2, -0.3, 'force-decrease'),
  block(0.05, -0.02, 'no-clear-change'),
  block(null, null, 'insufficient-data'),
  block(9, 9, 'fatigue', 'packing'), // a segment block: not on the plane of time blocks
];

describe('jasaChart(id, blocks, caption, labels)', () => {
  const chart = jasaChart('jasa-m-a', blocks, 'caption', labels);
  const pts = chart.series.filter((s) => s.kind === 'points');

  it('jasaChart() puts one point per time block at (amplitude_slope_per_min, mnf_slope_hz_per_min); insufficient-data and segment blocks are left out', () => {
    const all = pts.flatMap((s) => (s.kind === 'points' ? s.pts : []));
    expect(all).toHaveLength(5);
    expect(all).toContainEqual({ x: 0.5, y: -0.8 });
    expect(all).toContainEqual({ x: -0.4, y: 0.6 });
    expect(all).not.toContainEqual({ x: 9, y: 9 });
  });

  it('jasaChart() draws no-clear-change blocks hollow and categorized blocks filled', () => {
    const hollow = pts.find((s) => s.style.hollow === true)!;
    const filled = pts.find((s) => s.style.hollow === false)!;
    expect(hollow.kind === 'points' && hollow.pts).toEqual([{ x: 0.05, y: -0.02 }]);
    expect(filled.kind === 'points' && filled.pts.length).toBe(4);
    // in the drawn marks (circles: 12-point paths): white inside for the hollow point and its legend swatch only
    const { marks } = chartMarks(chart, (t, s) => t.length * s * 0.5);
    const markers = marks.filter((m) => m.k === 'path' && m.close && m.pts.length === 24);
    expect(markers).toHaveLength(5 + 2); // 5 points + 2 legend swatches
    expect(markers.filter((m) => m.k === 'path' && m.fill && m.fill.every((v) => v === 1))).toHaveLength(1 + 1);
  });

  it('jasaChart() names each quadrant in its corner: fatigue x>0 y<0, recovery x<0 y>0, force increase x>0 y>0, force decrease x<0 y<0', () => {
    const at = (text: string) => chart.notes!.find((n) => n.text === text)!;
    expect(Math.sign(at('fatigue').x)).toBe(1); expect(Math.sign(at('fatigue').y)).toBe(-1);
    expect(Math.sign(at('recovery').x)).toBe(-1); expect(Math.sign(at('recovery').y)).toBe(1);
    expect(Math.sign(at('force increase').x)).toBe(1); expect(Math.sign(at('force increase').y)).toBe(1);
    expect(Math.sign(at('force decrease').x)).toBe(-1); expect(Math.sign(at('force decrease').y)).toBe(-1);
    // each categorized point lies in the quadrant named after its category
    const named: Record<string, string> = { 'fatigue': 'fatigue', 'recovery': 'recovery', 'force-increase': 'force increase', 'force-decrease': 'force decrease' };
    for (const b of blocks.slice(0, 4)) {
      const n = at(named[b.category]!);
      expect(Math.sign(b.amplitude_slope_per_min!)).toBe(Math.sign(n.x));
      expect(Math.sign(b.mnf_slope_hz_per_min!)).toBe(Math.sign(n.y));
    }
  });

  it('jasaChart() has symmetric axes around 0 holding every point, titled with units (%MVE/min, Hz/min)', () => {
    expect(chart.x.min).toBe(-chart.x.max);
    expect(chart.y.min).toBe(-chart.y.max);
    expect(chart.x.max).toBeGreaterThanOrEqual(0.5);
    expect(chart.y.max).toBeGreaterThanOrEqual(0.8);
    expect(chart.x.label).toBe('amplitude trend (%MVE/min)');
    expect(chart.y.label).toBe('MNF trend (Hz/min)');
  });

  it('jasaChart() draws the intervals as crosshairs through each point, clipped to the axes', () => {
    const ci = chart.series.find((s) => s.kind === 'segments' && s.label === '95 % interval');
    expect(ci && ci.kind === 'segments' && ci.segs).toContainEqual([0.4, -0.8, 0.6, -0.8]);
    const wide = jasaChart('w', [block(0.5, -0.8, 'fatigue'), { ...block(0.1, 0.1, 'no-clear-change'), amplitude_ci_low: -50, amplitude_ci_high: 50 }], 'c', labels);
    const segs = wide.series.flatMap((s) => (s.kind === 'segments' ? s.segs : []));
    for (const [x0, , x1] of segs) { expect(x0).toBeGreaterThanOrEqual(wide.x.min); expect(x1).toBeLessThanOrEqual(wide.x.max); }
    expect(jasaChart('n', blocks, 'c', labels, { intervals: false }).series.some((s) => s.label === '95 % interval')).toBe(false);
  });
});
