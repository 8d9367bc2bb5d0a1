// Envelope timeline of one recording and muscle: bin mean and bin maximum against time, with the
// task segments as labelled bands.
import type { EnvelopeTrace } from '../../study/results.js';
import { emptyChart, type ChartModel } from './chart-model.js';
import { BAND_SHADES, pick } from './chart-styles.js';
import { niceAxis } from './nice-ticks.js';

export interface TimelineLabels {
  /** Time axis title in hours and in minutes (minutes are used for recordings shorter than 2 h). */
  time: string;
  timeMin?: string;
  load: string;
  mean: string;
  max: string;
}

/**
 * Chart model for one envelope trace. The y axis runs to the 95th percentile of the bin maxima
 * (higher values are drawn at the top edge) so that a few short peaks do not flatten the picture.
 * @param segmentOrder task labels in report order (fixes each task's band shade across charts)
 */
export function timelineChart(id: string, trace: EnvelopeTrace, caption: string, labels: TimelineLabels, segmentOrder: string[], width = 483, height = 100): ChartModel {
  const n = trace.mean.length;
  const lastEnd = Math.max(n * trace.step_s, ...trace.segments.map((sg) => sg.end_s));
  const inMinutes = labels.timeMin !== undefined && lastEnd < 2 * 3600;
  const perUnit = inMinutes ? 60 : 3600;
  const stepUnits = trace.step_s / perUnit;
  const xs = new Array<number>(n);
  for (let i = 0; i < n; i++) xs[i] = (i + 0.5) * stepUnits;
  const maxes = trace.max.filter((v): v is number => v !== null && Number.isFinite(v)).sort((a, b) => a - b);
  const means = trace.mean.filter((v): v is number => v !== null && Number.isFinite(v));
  const top = Math.max(maxes.length ? maxes[Math.floor(0.95 * (maxes.length - 1))] : 1, means.length ? Math.max(...means) : 1, 1);
  const end = lastEnd / perUnit;
  const x = niceAxis(inMinutes ? (labels.timeMin as string) : labels.time, 0, end, 8);
  x.max = end; // the axis ends with the recording
  const y = niceAxis(`${labels.load} (${trace.unit})`, 0, top, 4);
  y.grid = true;
  const chart = emptyChart(id, width, height, caption, x, y);
  for (const s of trace.segments) {
    const k = segmentOrder.indexOf(s.label);
    const b = pick(BAND_SHADES, k < 0 ? segmentOrder.length : k);
    chart.bands.push({ x0: s.start_s / perUnit, x1: s.end_s / perUnit, label: s.label, shade: b.shade, pattern: b.pattern });
  }
  const maxStyle = { color: [0.62, 0.66, 0.72] as const, width: 0.45, dash: [] };
  const meanStyle = { color: [0.10, 0.16, 0.26] as const, width: 0.8, dash: [] };
  chart.series.push({ kind: 'line', label: labels.max, style: maxStyle, xs, ys: trace.max });
  chart.series.push({ kind: 'line', label: labels.mean, style: meanStyle, xs, ys: trace.mean });
  chart.legend.push({ label: labels.mean, style: meanStyle, swatch: 'line' }, { label: labels.max, style: maxStyle, swatch: 'line' });
  return chart;
}
