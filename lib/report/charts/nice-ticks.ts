// Axis ticks at "nice" steps (1, 2, 2.5, 5 × 10^k), common practice for chart axes, no single source.
import { formatNumber } from '../format-number.js';
import type { Axis } from './chart-model.js';

/**
 * An axis from `lo` to at least `hi` with about `count` ticks at a nice step; the maximum is
 * rounded up to a whole step.
 * @example niceAxis('load (%MVE)', 0, 23, 5).ticks.map(t => t.value) // [0, 5, 10, 15, 20, 25]
 */
export function niceAxis(label: string, lo: number, hi: number, count = 5, fmt?: (v: number) => string): Axis {
  if (!(hi > lo)) hi = lo + 1;
  const raw = (hi - lo) / Math.max(1, count);
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * mag).find((s) => s >= raw * 0.999) ?? 10 * mag;
  const min = Math.floor(lo / step + 1e-9) * step;
  const max = Math.ceil(hi / step - 1e-9) * step;
  const ticks = [];
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9) + (step / mag === 2.5 ? 1 : 0));
  for (let v = min, i = 0; v <= max + step * 1e-6 && i < 100; i++, v = min + i * step) {
    const value = Math.round(v / step) * step;
    ticks.push({ value, label: fmt ? fmt(value) : formatNumber(value, decimals) });
  }
  return { label, min, max, ticks };
}
