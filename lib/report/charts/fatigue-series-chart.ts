// MNF over the recording: one line per worker (medians of the active epochs per step), with the
// task segments as labelled bands when every line shares them.
import type { FatigueSeries } from '../../study/results.js';
import { emptyChart, type ChartModel } from './chart-model.js';
import { BAND_SHADES, SEGMENT_STYLES, pick } from './chart-styles.js';
import { niceAxis } from './nice-ticks.js';

export interface FatigueSeriesLabels {
  /** Time axis title in minutes, e.g. "time from recording start (min)". */
  timeMin: string;
  /** MNF axis title including the unit, e.g. "MNF (Hz)". */
  mnf: string;
}

/** True when every series has the same task segments (labels and times). */
function sameSegments(series: readonly FatigueSeries[]): boolean {
  const key = (s: FatigueSeries) => JSON.stringify(s.segments.map((g) => [g.label, g.start_s, g.end_s]));
  return series.every((s) => key(s) === key(series[0]!));
}

/**
 * Chart model of MNF against time for several series (e.g. every worker's recording of one muscle
 * in one condition): x = minutes from the recording start (point k at (k + 0.5)·step_s), y = MNF
 * in Hz; a null step breaks the line. Each line has its own dash pattern and ends in its label
 * (the worker id), so colour is never the only cue. Task segments are drawn as bands only when all
 * series share them (otherwise `bands` is empty).
 * @param lineLabels one label per series (same order), printed at the line's end and in the legend
 * @param segmentOrder task labels in report order (fixes each task's band shade across charts)
 * @example fatigueSeriesChart('mnf-trap-a', series, ['W1', 'W2'], 'MNF …', labels, ['picking'])
 */
export function fatigueSeriesChart(id: string, series: readonly FatigueSeries[], lineLabels: readonly string[], caption: string, labels: FatigueSeriesLabels, segmentOrder: string[], width = 236, height = 150): ChartModel {
  let end = 0, lo = Infinity, hi = -Infinity;
  for (const s of series) {
    end = Math.max(end, s.mnf_hz.length * s.step_s, ...s.segments.map((g) => g.end_s));
    for (const v of s.mnf_hz) if (v !== null && Number.isFinite(v)) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  }
  if (!(hi >= lo)) { lo = 0; hi = 1; }
  const pad = Math.max(2, 0.1 * (hi - lo));
  const x = niceAxis(labels.timeMin, 0, end / 60, 6);
  x.max = end / 60;
  const y = niceAxis(labels.mnf, Math.max(0, lo - pad), hi + pad, 4);
  y.grid = true;
  const chart = emptyChart(id, width, height, caption, x, y);
  const bandsShown = series.length > 0 && sameSegments(series);
  if (bandsShown) for (const g of series[0]!.segments) {
    const k = segmentOrder.indexOf(g.label);
    const b = pick(BAND_SHADES, k < 0 ? segmentOrder.length : k);
    chart.bands.push({ x0: g.start_s / 60, x1: g.end_s / 60, label: g.label, shade: b.shade, pattern: b.pattern });
  }
  series.forEach((s, i) => {
    const st = pick(SEGMENT_STYLES, i);
    const style = { color: st.color, width: 0.9, dash: st.dash };
    const xs = s.mnf_hz.map((_, k) => ((k + 0.5) * s.step_s) / 60);
    const label = lineLabels[i] ?? s.worker;
    chart.series.push({ kind: 'line', label, style, xs, ys: s.mnf_hz, endLabel: label });
    chart.legend.push({ label, style, swatch: 'line' });
  });
  return chart;
}
