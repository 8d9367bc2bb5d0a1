// The chart model: plain data (axes, ticks, series, bands, cells, labels, caption) that both the
// PDF renderer and the SVG writer draw, through chartMarks(). No drawing code here.

/** Colour as r, g, b in 0…1. Never the only carrier of meaning: every style also has a dash, marker or pattern. */
export type RGB = readonly [number, number, number];

/** Fill pattern drawn over a fill so that shapes stay apart in greyscale print. */
export type Pattern = 'none' | 'diagonal' | 'crosshatch' | 'horizontal' | 'dots';

export type Marker = 'circle' | 'square' | 'triangle' | 'diamond';

export interface Style {
  color: RGB;
  /** Line width, pt. @default 1 */
  width?: number;
  /** Dash pattern, pt; empty = solid. */
  dash?: readonly number[];
  /** Fill colour for bars/areas (defaults to `color`). */
  fill?: RGB;
  pattern?: Pattern;
  marker?: Marker;
  /** Markers drawn as outlines (true) or filled (false); unset: circles and triangles filled, squares and diamonds outlined. */
  hollow?: boolean;
}

export interface Tick { value: number; label: string }

export interface Axis {
  /** Axis title including the unit, e.g. "load (%MVE)". */
  label: string;
  min: number;
  max: number;
  ticks: Tick[];
  /** Draw light grid lines at the ticks. @default false */
  grid?: boolean;
}

/** A vertical band over x0…x1 (e.g. a task segment on a timeline), labelled at the top. */
export interface Band { x0: number; x1: number; label: string; shade: RGB; pattern: Pattern }

/** A horizontal reference line with its label (e.g. 50 % on an APDF). */
export interface RefLine { y: number; label: string; dash: readonly number[] }

export type Series =
  | { kind: 'line'; label: string; style: Style; xs: readonly number[]; ys: readonly (number | null)[]; endLabel?: string }
  | { kind: 'bars'; label: string; style: Style; bars: { x0: number; x1: number; y: number; lo?: number; hi?: number; text?: string }[] }
  | { kind: 'points'; label: string; style: Style; pts: { x: number; y: number }[] }
  | { kind: 'segments'; label: string; style: Style; segs: [number, number, number, number][] };

/**
 * A text placed in axis units (e.g. a quadrant name), kept inside the plot area: `align` says
 * which side of the point the text lies on (horizontally: start = text to the right of x).
 */
export interface Note { x: number; y: number; text: string; anchor: 'start' | 'end'; valign: 'top' | 'bottom' }

/** A shaded cell with a number in it (EVA grid); coordinates in axis units. */
export interface Cell { x0: number; x1: number; y0: number; y1: number; shade: number; text: string }

export interface ChartModel {
  /** Stable identifier, used as the SVG file name (letters, digits, dashes). */
  id: string;
  /** Size on the page, pt. */
  width: number;
  height: number;
  /** What is plotted, in words, with units. */
  caption: string;
  x: Axis;
  y: Axis;
  bands: Band[];
  refLines: RefLine[];
  series: Series[];
  cells: Cell[];
  /** Legend entries (label + the style drawn as a swatch). */
  legend: { label: string; style: Style; swatch: 'line' | 'box' | 'marker' }[];
  /** Free texts inside the plot area (optional). */
  notes?: Note[];
}

/** An empty chart with the given axes, for builders to fill. */
export function emptyChart(id: string, width: number, height: number, caption: string, x: Axis, y: Axis): ChartModel {
  return { id, width, height, caption, x, y, bands: [], refLines: [], series: [], cells: [], legend: [] };
}
