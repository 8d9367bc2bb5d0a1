// EVA matrix as a shaded grid with the percentage in every cell (Mathiassen & Winkel 1991).
import { formatNumber } from '../format-number.js';
import { emptyChart, type ChartModel } from './chart-model.js';

export interface EvaLabels { amplitude: string; duration: string }

function classLabels(edges: number[]): string[] {
  return edges.map((e, i) => (i + 1 < edges.length ? `${formatNumber(e, e % 1 ? 1 : 0)}–${formatNumber(edges[i + 1], edges[i + 1] % 1 ? 1 : 0)}` : `≥ ${formatNumber(e, e % 1 ? 1 : 0)}`));
}

/**
 * Chart model for an EVA matrix: percent[a][d] = % of time in amplitude class a and duration class d.
 * Shade grows with the percentage (full at the matrix maximum); every cell also prints its number.
 */
export function evaChart(id: string, percent: number[][], ampEdges: number[], durEdges: number[], unit: string, caption: string, labels: EvaLabels, width = 236, height = 160): ChartModel {
  const nA = ampEdges.length, nD = durEdges.length;
  const x = { label: labels.duration, min: 0, max: nD, ticks: classLabels(durEdges).map((label, i) => ({ value: i + 0.5, label })) };
  const y = { label: `${labels.amplitude} (${unit})`, min: 0, max: nA, ticks: classLabels(ampEdges).map((label, i) => ({ value: i + 0.5, label })) };
  const chart = emptyChart(id, width, height, caption, x, y);
  const top = Math.max(1e-9, ...percent.flat());
  for (let a = 0; a < nA; a++) for (let d = 0; d < nD; d++) {
    const v = percent[a]?.[d] ?? 0;
    chart.cells.push({ x0: d, x1: d + 1, y0: a, y1: a + 1, shade: v / top, text: v === 0 ? '·' : formatNumber(v, v < 10 ? 1 : 0) });
  }
  return chart;
}
