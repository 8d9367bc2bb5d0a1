// Mean power spectrum with the suggested filter band hatched (drawn only when results carry spectra).
import type { SpectrumResult } from '../../study/results.js';
import { emptyChart, type ChartModel } from './chart-model.js';
import { niceAxis } from './nice-ticks.js';

export interface SpectrumLabels { frequency: string; psd: string }

/** Chart model: PSD (µV²/Hz, linear) against frequency (Hz); the suggested band as a hatched band. */
export function spectrumChart(id: string, s: SpectrumResult, caption: string, labels: SpectrumLabels, width = 236, height = 150): ChartModel {
  const fmax = Math.max(...s.freq_hz, 1);
  const pmax = Math.max(...s.psd.filter((v) => Number.isFinite(v)), 1e-12);
  const x = niceAxis(labels.frequency, 0, fmax, 5);
  x.max = fmax;
  const y = niceAxis(labels.psd, 0, pmax * 1.05, 4);
  y.grid = true;
  const chart = emptyChart(id, width, height, caption, x, y);
  if (s.suggested_band_hz) chart.bands.push({ x0: s.suggested_band_hz[0], x1: s.suggested_band_hz[1], label: `${s.suggested_band_hz[0]}–${s.suggested_band_hz[1]} Hz`, shade: [0.95, 0.93, 0.88], pattern: 'diagonal' });
  chart.series.push({ kind: 'line', label: 'PSD', style: { color: [0.12, 0.2, 0.35], width: 0.9 }, xs: s.freq_hz, ys: s.psd });
  return chart;
}
