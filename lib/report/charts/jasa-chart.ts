// The JASA plane: each time block's amplitude trend against its MNF trend, with the four quadrants
// named. Blocks whose trends are not clear are drawn hollow; blocks with too few epochs are left out.
import type { FatigueBlock } from '../../study/results.js';
import { emptyChart, type ChartModel, type Style } from './chart-model.js';
import { MUTED } from './chart-styles.js';
import { niceAxis } from './nice-ticks.js';

export interface JasaLabels {
  /** Axis titles without units, e.g. "amplitude trend", "MNF trend". */
  amplitude: string;
  mnf: string;
  /** Quadrant names. */
  fatigue: string;
  recovery: string;
  forceIncrease: string;
  forceDecrease: string;
  /** Legend: blocks with a category (filled), blocks without a clear change (hollow), the intervals. */
  clear: string;
  unclear: string;
  interval: string;
}

const CLEAR: Style = { color: [0.12, 0.22, 0.40], marker: 'circle', hollow: false };
const UNCLEAR: Style = { color: [0.12, 0.22, 0.40], marker: 'circle', hollow: true };
const CI: Style = { color: [0.55, 0.6, 0.68], width: 0.5 };
const AXIS0: Style = { color: MUTED, width: 0.5, dash: [2, 2] };

/**
 * Chart model of the JASA plane for a set of time blocks (segment === null; others are ignored):
 * x = amplitude slope (`amplitude_slope_unit`, e.g. %MVE/min), y = MNF slope (Hz/min), one point
 * per block with both slopes. Quadrants (Luttmann et al. 2000; the mapping is FROM MEMORY, as
 * METHODS.md §6): x > 0, y < 0 fatigue; x < 0, y > 0 recovery; x > 0, y > 0 force increase;
 * x < 0, y < 0 force decrease, each named in its corner. Blocks of category 'no-clear-change' are
 * hollow, 'insufficient-data' blocks are left out. Optional 95 % interval crosshairs (clipped to
 * the axes). Both axes are symmetric about zero and sized by the points (not the intervals), so
 * one wide interval does not squeeze the rest.
 * @example jasaChart('jasa-trap', blocks, 'JASA plane …', labels).series[0].pts
 */
export function jasaChart(id: string, blocks: readonly FatigueBlock[], caption: string, labels: JasaLabels, options: { intervals?: boolean; width?: number; height?: number } = {}): ChartModel {
  const used = blocks.filter((b) => b.segment === null && b.category !== 'insufficient-data'
    && b.amplitude_slope_per_min !== null && b.mnf_slope_hz_per_min !== null
    && Number.isFinite(b.amplitude_slope_per_min) && Number.isFinite(b.mnf_slope_hz_per_min));
  const unit = blocks.find((b) => b.amplitude_slope_unit)?.amplitude_slope_unit ?? 'unit/min';
  let ax = 0, ay = 0;
  for (const b of used) { ax = Math.max(ax, Math.abs(b.amplitude_slope_per_min!)); ay = Math.max(ay, Math.abs(b.mnf_slope_hz_per_min!)); }
  const x = niceAxis(`${labels.amplitude} (${unit})`, -(ax * 1.25 || 1), ax * 1.25 || 1, 4);
  const y = niceAxis(`${labels.mnf} (Hz/min)`, -(ay * 1.25 || 1), ay * 1.25 || 1, 4);
  const xr = Math.max(-x.min, x.max), yr = Math.max(-y.min, y.max); // symmetric: zero in the middle
  const xs = niceAxis(x.label, -xr, xr, 4), ys = niceAxis(y.label, -yr, yr, 4);
  xs.grid = true; ys.grid = true;
  const chart = emptyChart(id, options.width ?? 236, options.height ?? 190, caption, xs, ys);
  chart.series.push({ kind: 'segments', label: 'zero', style: AXIS0, segs: [[xs.min, 0, xs.max, 0], [0, ys.min, 0, ys.max]] });
  const clip = (v: number, a: { min: number; max: number }) => Math.min(a.max, Math.max(a.min, v));
  if (options.intervals !== false) {
    const segs: [number, number, number, number][] = [];
    for (const b of used) {
      const px = b.amplitude_slope_per_min!, py = b.mnf_slope_hz_per_min!;
      if (b.amplitude_ci_low !== null && b.amplitude_ci_high !== null) segs.push([clip(b.amplitude_ci_low, xs), py, clip(b.amplitude_ci_high, xs), py]);
      if (b.mnf_ci_low !== null && b.mnf_ci_high !== null) segs.push([px, clip(b.mnf_ci_low, ys), px, clip(b.mnf_ci_high, ys)]);
    }
    if (segs.length) {
      chart.series.push({ kind: 'segments', label: labels.interval, style: CI, segs });
      chart.legend.push({ label: labels.interval, style: CI, swatch: 'line' });
    }
  }
  const pt = (b: FatigueBlock) => ({ x: b.amplitude_slope_per_min!, y: b.mnf_slope_hz_per_min! });
  const unclear = used.filter((b) => b.category === 'no-clear-change').map(pt);
  const clear = used.filter((b) => b.category !== 'no-clear-change').map(pt);
  if (unclear.length) chart.series.push({ kind: 'points', label: labels.unclear, style: UNCLEAR, pts: unclear });
  if (clear.length) chart.series.push({ kind: 'points', label: labels.clear, style: CLEAR, pts: clear });
  chart.legend.push({ label: labels.clear, style: CLEAR, swatch: 'marker' }, { label: labels.unclear, style: UNCLEAR, swatch: 'marker' });
  chart.notes = [
    { x: xs.max, y: ys.min, text: labels.fatigue, anchor: 'end', valign: 'bottom' },
    { x: xs.min, y: ys.max, text: labels.recovery, anchor: 'start', valign: 'top' },
    { x: xs.max, y: ys.max, text: labels.forceIncrease, anchor: 'end', valign: 'top' },
    { x: xs.min, y: ys.min, text: labels.forceDecrease, anchor: 'start', valign: 'bottom' },
  ];
  return chart;
}
