// Grouped bars with whiskers: medians across workers with the worker range, per task (and level)
// and condition. Used for static/median/peak loads and for gaps per minute.
import { formatNumber } from '../format-number.js';
import type { MedianRange } from '../median-range.js';
import { emptyChart, type ChartModel } from './chart-model.js';
import { BAND_SHADES, CONDITION_STYLES, pick } from './chart-styles.js';
import { niceAxis } from './nice-ticks.js';

export interface BarGroup {
  /** Group label (a task). */
  label: string;
  /** Sub-clusters inside the group (e.g. static/median/peak); one unnamed cluster for a plain group. */
  clusters: { label: string; values: (MedianRange | null)[] }[];
}

/**
 * Chart model: one band per group (labelled with the group), inside it one cluster per level with
 * one bar per condition; bar = median, whisker = min…max across workers, median printed above.
 */
export function groupBarsChart(id: string, groups: BarGroup[], conditions: string[], yLabel: string, caption: string, width = 483, height = 170): ChartModel {
  const clusterW = 1;
  let pos = 0;
  const placed: { g: BarGroup; start: number; end: number }[] = [];
  for (const g of groups) { placed.push({ g, start: pos, end: pos + g.clusters.length * clusterW }); pos += g.clusters.length * clusterW + 0.35; }
  const all = groups.flatMap((g) => g.clusters.flatMap((c) => c.values.map((v) => v?.max ?? 0)));
  const y = niceAxis(yLabel, 0, Math.max(...all, 0.1) * 1.08, 5);
  y.grid = true;
  const x = { label: '', min: -0.2, max: pos - 0.35 + 0.2, ticks: [] as { value: number; label: string }[] };
  const chart = emptyChart(id, width, height, caption, x, y);
  const bw = 0.8 / Math.max(1, conditions.length);
  placed.forEach(({ g, start, end }, gi) => {
    const b = pick(BAND_SHADES, gi);
    chart.bands.push({ x0: start - 0.1, x1: end - 0.1, label: g.label, shade: b.shade, pattern: 'none' });
    g.clusters.forEach((c, ci) => { if (c.label) x.ticks.push({ value: start + ci + 0.4, label: c.label }); });
  });
  conditions.forEach((cond, k) => {
    const style = pick(CONDITION_STYLES, k);
    const bars: { x0: number; x1: number; y: number; lo?: number; hi?: number; text?: string }[] = [];
    placed.forEach(({ g, start }) => g.clusters.forEach((c, ci) => {
      const v = c.values[k];
      if (!v) return;
      const x0 = start + ci + k * bw;
      bars.push({ x0, x1: x0 + bw * 0.92, y: v.median, lo: v.min, hi: v.max, text: formatNumber(v.median) });
    }));
    chart.series.push({ kind: 'bars', label: cond, style, bars });
    chart.legend.push({ label: cond, style, swatch: 'box' });
  });
  return chart;
}
