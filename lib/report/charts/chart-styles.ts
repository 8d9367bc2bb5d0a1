// Our chart palette. Each entry pairs a colour with a dash, marker and fill pattern so that the
// charts read in greyscale print and for readers who do not tell the colours apart.
import type { RGB, Style } from './chart-model.js';

export const INK: RGB = [0.13, 0.14, 0.16];
export const MUTED: RGB = [0.42, 0.44, 0.47];
export const GRID: RGB = [0.86, 0.87, 0.88];

/** Styles for conditions (first, second, …): dark solid, mid dashed hatched, … */
export const CONDITION_STYLES: Style[] = [
  { color: [0.16, 0.27, 0.38], fill: [0.27, 0.40, 0.52], width: 1.2, dash: [], pattern: 'none', marker: 'circle' },
  { color: [0.62, 0.36, 0.08], fill: [0.93, 0.75, 0.50], width: 1.2, dash: [4, 2], pattern: 'diagonal', marker: 'square' },
  { color: [0.25, 0.45, 0.28], fill: [0.70, 0.84, 0.70], width: 1.2, dash: [1, 1.5], pattern: 'crosshatch', marker: 'triangle' },
  { color: [0.45, 0.25, 0.45], fill: [0.85, 0.75, 0.88], width: 1.2, dash: [6, 2, 1, 2], pattern: 'horizontal', marker: 'diamond' },
];

/** Styles for task segments on APDF charts: dash patterns carry the distinction, colour helps. */
export const SEGMENT_STYLES: Style[] = [
  { color: [0.12, 0.22, 0.40], width: 1.3, dash: [], marker: 'circle' },
  { color: [0.70, 0.33, 0.05], width: 1.3, dash: [5, 2], marker: 'square' },
  { color: [0.18, 0.45, 0.25], width: 1.3, dash: [1.2, 1.8], marker: 'triangle' },
  { color: [0.50, 0.20, 0.45], width: 1.3, dash: [7, 2, 1.5, 2], marker: 'diamond' },
  { color: [0.30, 0.30, 0.30], width: 1.0, dash: [3, 3], marker: 'circle' },
  { color: [0.05, 0.45, 0.55], width: 1.0, dash: [9, 3], marker: 'square' },
];

/** Band shades and patterns for task segments on timelines (alternate so neighbours differ). */
export const BAND_SHADES: { shade: RGB; pattern: 'none' | 'diagonal' | 'dots' | 'horizontal' }[] = [
  { shade: [0.90, 0.93, 0.96], pattern: 'none' },
  { shade: [0.97, 0.94, 0.88], pattern: 'diagonal' },
  { shade: [0.91, 0.95, 0.91], pattern: 'dots' },
  { shade: [0.95, 0.92, 0.96], pattern: 'horizontal' },
];

export function pick<T>(list: readonly T[], i: number): T {
  return list[((i % list.length) + list.length) % list.length];
}
