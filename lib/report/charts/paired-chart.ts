// Paired dot plot: each worker's value in condition A and B, joined by a line.
import { emptyChart, type ChartModel } from './chart-model.js';
import { CONDITION_STYLES, MUTED } from './chart-styles.js';
import { niceAxis } from './nice-ticks.js';

export interface PairedPoint { worker: string; a: number | null; b: number | null }

/** Chart model: x = the two conditions, y = the measure; one grey line per worker with both values. */
export function pairedChart(id: string, points: PairedPoint[], conditionA: string, conditionB: string, yLabel: string, caption: string, width = 160, height = 170): ChartModel {
  const vals = points.flatMap((p) => [p.a, p.b]).filter((v): v is number => v !== null && Number.isFinite(v));
  const lo = Math.min(0, ...vals), hi = Math.max(...vals, 0.1);
  const y = niceAxis(yLabel, lo, hi * 1.05, 5);
  y.grid = true;
  const x = { label: '', min: -0.45, max: 1.45, ticks: [{ value: 0, label: conditionA }, { value: 1, label: conditionB }] };
  const chart = emptyChart(id, width, height, caption, x, y);
  const segs: [number, number, number, number][] = [];
  for (const p of points) if (p.a !== null && p.b !== null) segs.push([0, p.a, 1, p.b]);
  chart.series.push({ kind: 'segments', label: 'worker', style: { color: MUTED, width: 0.6 }, segs });
  chart.series.push({ kind: 'points', label: conditionA, style: CONDITION_STYLES[0], pts: points.filter((p) => p.a !== null).map((p) => ({ x: 0, y: p.a as number })) });
  chart.series.push({ kind: 'points', label: conditionB, style: CONDITION_STYLES[1], pts: points.filter((p) => p.b !== null).map((p) => ({ x: 1, y: p.b as number })) });
  return chart;
}
