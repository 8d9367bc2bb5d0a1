// APDF (cumulative amplitude distribution) curves, one per task segment, with the static, median and
// peak loads marked on each curve. Cumulative form as in Jonsson (1982): share of time at or below a load.
import type { LoadUnit } from '../../study/results.js';
import { emptyChart, type ChartModel } from './chart-model.js';
import { pick, SEGMENT_STYLES } from './chart-styles.js';
import { niceAxis } from './nice-ticks.js';

export interface ApdfCurve { segment: string; levels: number[] }
export interface ApdfLabels { load: string; probability: string; static: string; median: string; peak: string }

/**
 * Chart model for APDF curves. `levels[q]` is the load at q % (q = 0…100). The load axis ends at the
 * largest 98th-percentile level so that the 10/50/90 % region stays readable; curves stop there.
 */
export function apdfChart(id: string, curves: ApdfCurve[], unit: LoadUnit, caption: string, labels: ApdfLabels, segmentOrder: string[], width = 236, height = 155): ChartModel {
  const hi = Math.max(1, ...curves.map((c) => c.levels[Math.min(98, c.levels.length - 1)] ?? 0));
  const x = niceAxis(`${labels.load} (${unit})`, 0, hi, 5);
  const y = niceAxis(labels.probability, 0, 100, 5);
  x.grid = true;
  const chart = emptyChart(id, width, height, caption, x, y);
  chart.refLines.push({ y: 10, label: labels.static, dash: [1, 2] }, { y: 50, label: labels.median, dash: [1, 2] }, { y: 90, label: labels.peak, dash: [1, 2] });
  for (const c of curves) {
    const k = segmentOrder.indexOf(c.segment);
    const style = pick(SEGMENT_STYLES, k < 0 ? segmentOrder.length : k);
    const xs: number[] = [];
    const ys: number[] = [];
    const n = c.levels.length - 1;
    for (let q = 0; q <= n; q++) {
      if (c.levels[q] > x.max) break;
      xs.push(c.levels[q]);
      ys.push((100 * q) / n);
    }
    chart.series.push({ kind: 'line', label: c.segment, style, xs, ys });
    const pts = [10, 50, 90].map((p) => ({ x: c.levels[Math.round((p * n) / 100)], y: p })).filter((p) => p.x <= x.max);
    chart.series.push({ kind: 'points', label: c.segment, style, pts });
    chart.legend.push({ label: c.segment, style, swatch: 'line' });
  }
  return chart;
}
