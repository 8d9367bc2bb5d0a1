// Turn a ChartModel into drawing marks (paths and text) in the chart's own coordinates: origin at
// the top left, y downwards, units pt. The PDF renderer and the SVG writer both draw these marks,
// so one chart model gives the same picture in both.
import type { Axis, ChartModel, Pattern, RGB, Style } from './chart-model.js';
import { GRID, INK, MUTED } from './chart-styles.js';

export type Mark =
  | { k: 'path'; pts: number[]; close?: boolean; stroke?: RGB; width?: number; dash?: readonly number[]; fill?: RGB }
  | { k: 'text'; x: number; y: number; text: string; size: number; anchor: 'start' | 'middle' | 'end'; up?: boolean; color: RGB; bold?: boolean };

/** Width of `text` at `size` pt in the report font (bold when asked). */
export type Measure = (text: string, size: number, bold?: boolean) => number;

const TICK = 7;
const LABEL = 7.5;
const SMALL = 6.5;

/** Plot-area rectangle inside the chart box, pt. */
export interface PlotArea { x: number; y: number; w: number; h: number }

/**
 * Lay the chart out and return its marks plus the plot area. Pure function of (chart, measure).
 * @example const { marks } = chartMarks(chart, (t, s) => t.length * s * 0.5)
 */
export function chartMarks(chart: ChartModel, measure: Measure): { marks: Mark[]; plot: PlotArea } {
  const marks: Mark[] = [];
  const yTickW = Math.max(0, ...chart.y.ticks.map((t) => measure(t.label, TICK)));
  const endW = Math.max(0, ...chart.series.map((s) => (s.kind === 'line' && s.endLabel ? measure(s.endLabel, SMALL) + 4 : 0)));
  // legend items flow in rows across the chart width
  const legendPos: { x: number; row: number }[] = [];
  let lx0 = 4 + LABEL + 4 + yTickW + 4, row = 0;
  for (const item of chart.legend) {
    const w = 19 + measure(item.label, 7) + 10;
    if (legendPos.length && lx0 + w - 10 > chart.width) { row++; lx0 = 4 + LABEL + 4 + yTickW + 4; }
    legendPos.push({ x: lx0, row });
    lx0 += w;
  }
  const legendH = chart.legend.length ? 13 + row * 11 : 0;
  const bandH = chart.bands.length ? 10 : 0;
  const plot: PlotArea = { x: 4 + LABEL + 4 + yTickW + 4, y: legendH + bandH + 4, w: 0, h: 0 };
  plot.w = chart.width - plot.x - Math.max(8, endW);
  plot.h = chart.height - plot.y - (TICK + 4 + LABEL + 6);
  const sx = (v: number) => plot.x + ((v - chart.x.min) / (chart.x.max - chart.x.min || 1)) * plot.w;
  const syRaw = (v: number) => plot.y + plot.h - ((v - chart.y.min) / (chart.y.max - chart.y.min || 1)) * plot.h;
  const sy = (v: number) => Math.min(plot.y + plot.h, Math.max(plot.y, syRaw(v)));
  const r = (v: number) => Math.round(v * 100) / 100;

  // bands (task segments) with their labels above the plot area
  for (const b of chart.bands) {
    const x0 = sx(Math.max(b.x0, chart.x.min));
    const x1 = sx(Math.min(b.x1, chart.x.max));
    if (x1 <= x0) continue;
    marks.push(rect(x0, plot.y, x1 - x0, plot.h, b.shade));
    marks.push(...patternMarks(b.pattern, x0, plot.y, x1 - x0, plot.h, [0.72, 0.74, 0.78]));
    marks.push({ k: 'path', pts: [r(x0), r(plot.y - bandH), r(x0), r(plot.y + plot.h)], stroke: MUTED, width: 0.4 });
    const label = fitText(b.label, x1 - x0 - 3, SMALL, measure);
    if (label) marks.push({ k: 'text', x: r(x0 + 2), y: r(plot.y - 3), text: label, size: SMALL, anchor: 'start', color: INK });
  }

  // grid lines
  if (chart.y.grid) for (const t of chart.y.ticks) marks.push({ k: 'path', pts: [r(plot.x), r(sy(t.value)), r(plot.x + plot.w), r(sy(t.value))], stroke: GRID, width: 0.4 });
  if (chart.x.grid) for (const t of chart.x.ticks) marks.push({ k: 'path', pts: [r(sx(t.value)), r(plot.y), r(sx(t.value)), r(plot.y + plot.h)], stroke: GRID, width: 0.4 });

  // cells (EVA grid)
  for (const c of chart.cells) {
    const x0 = sx(c.x0), x1 = sx(c.x1), y0 = sy(c.y1), y1 = sy(c.y0);
    const g = 1 - 0.8 * Math.min(1, Math.max(0, c.shade));
    marks.push({ ...rect(x0, y0, x1 - x0, y1 - y0, [g * 0.96 + 0.02, g * 0.97 + 0.02, g]), stroke: [1, 1, 1], width: 0.8 });
    const color: RGB = g < 0.5 ? [1, 1, 1] : INK;
    marks.push({ k: 'text', x: r((x0 + x1) / 2), y: r((y0 + y1) / 2 + SMALL * 0.35), text: c.text, size: SMALL, anchor: 'middle', color });
  }

  for (const s of chart.series) {
    const st = s.style;
    if (s.kind === 'line') {
      let run: number[] = [];
      const flush = () => { if (run.length >= 4) marks.push({ k: 'path', pts: run, stroke: st.color, width: st.width ?? 1, dash: st.dash }); run = []; };
      for (let i = 0; i < s.xs.length; i++) {
        const y = s.ys[i];
        if (y === null || !Number.isFinite(y)) { flush(); continue; }
        run.push(r(sx(s.xs[i])), r(sy(y)));
      }
      flush();
      if (s.endLabel) {
        let last = s.ys.length - 1;
        while (last >= 0 && s.ys[last] === null) last--;
        if (last >= 0) marks.push({ k: 'text', x: r(sx(s.xs[last]) + 3), y: r(sy(s.ys[last] as number) + 2.2), text: s.endLabel, size: SMALL, anchor: 'start', color: st.color });
      }
    } else if (s.kind === 'bars') {
      for (const b of s.bars) {
        const x0 = sx(b.x0), x1 = sx(b.x1), yt = sy(b.y), yb = sy(Math.max(chart.y.min, 0));
        marks.push({ ...rect(x0, Math.min(yt, yb), x1 - x0, Math.abs(yb - yt), st.fill ?? st.color), stroke: st.color, width: 0.6 });
        marks.push(...patternMarks(st.pattern ?? 'none', x0, Math.min(yt, yb), x1 - x0, Math.abs(yb - yt), st.color));
        if (b.lo !== undefined && b.hi !== undefined) {
          const xm = (x0 + x1) / 2, cap = Math.min(2.5, (x1 - x0) / 3);
          marks.push({ k: 'path', pts: [r(xm), r(sy(b.lo)), r(xm), r(sy(b.hi))], stroke: INK, width: 0.7 });
          marks.push({ k: 'path', pts: [r(xm - cap), r(sy(b.hi)), r(xm + cap), r(sy(b.hi))], stroke: INK, width: 0.7 });
          marks.push({ k: 'path', pts: [r(xm - cap), r(sy(b.lo)), r(xm + cap), r(sy(b.lo))], stroke: INK, width: 0.7 });
        }
        if (b.text) {
          const top = Math.min(yt, b.hi !== undefined ? sy(b.hi) : yt);
          marks.push({ k: 'text', x: r((x0 + x1) / 2), y: r(Math.max(plot.y + SMALL, top - 2)), text: b.text, size: 5.5, anchor: 'middle', color: INK });
        }
      }
    } else if (s.kind === 'points') {
      for (const p of s.pts) marks.push(markerMark(st.marker ?? 'circle', r(sx(p.x)), r(sy(p.y)), 2.2, st));
    } else {
      for (const [x0, y0, x1, y1] of s.segs) marks.push({ k: 'path', pts: [r(sx(x0)), r(sy(y0)), r(sx(x1)), r(sy(y1))], stroke: st.color, width: st.width ?? 0.8, dash: st.dash });
    }
  }

  // notes (e.g. quadrant names), inside the plot area
  for (const nt of chart.notes ?? []) {
    const x = sx(Math.min(chart.x.max, Math.max(chart.x.min, nt.x))) + (nt.anchor === 'start' ? 3 : -3);
    const y = sy(nt.y) + (nt.valign === 'top' ? SMALL + 2 : -3);
    marks.push({ k: 'text', x: r(x), y: r(y), text: nt.text, size: SMALL, anchor: nt.anchor, color: MUTED });
  }

  for (const l of chart.refLines) {
    const y = r(sy(l.y));
    marks.push({ k: 'path', pts: [r(plot.x), y, r(plot.x + plot.w), y], stroke: MUTED, width: 0.5, dash: l.dash });
    const lw = measure(l.label, SMALL);
    marks.push({ ...rect(plot.x + plot.w - 3 - lw, y - 2 - SMALL * 0.85, lw + 2, SMALL * 1.05, [1, 1, 1]) }); // keeps the label readable over curves
    marks.push({ k: 'text', x: r(plot.x + plot.w - 2), y: r(y - 2), text: l.label, size: SMALL, anchor: 'end', color: MUTED });
  }

  // axes, ticks and labels
  marks.push({ k: 'path', pts: [r(plot.x), r(plot.y), r(plot.x), r(plot.y + plot.h), r(plot.x + plot.w), r(plot.y + plot.h)], stroke: INK, width: 0.7 });
  axisTicks(chart.y, (v) => sy(v), 'y', plot, marks, measure);
  axisTicks(chart.x, (v) => sx(v), 'x', plot, marks, measure);
  marks.push({ k: 'text', x: r(plot.x + plot.w / 2), y: r(chart.height - 3), text: chart.x.label, size: LABEL, anchor: 'middle', color: INK });
  marks.push({ k: 'text', x: r(4 + LABEL), y: r(plot.y + plot.h / 2), text: chart.y.label, size: LABEL, anchor: 'middle', up: true, color: INK });

  // legend along the top
  chart.legend.forEach((item, i) => {
    const lx = legendPos[i].x;
    const y = 8 + legendPos[i].row * 11;
    if (item.swatch === 'line') marks.push({ k: 'path', pts: [r(lx), y - 2.5, r(lx + 16), y - 2.5], stroke: item.style.color, width: (item.style.width ?? 1) + 0.3, dash: item.style.dash });
    else if (item.swatch === 'box') {
      marks.push({ ...rect(lx + 2, y - 7, 9, 8, item.style.fill ?? item.style.color), stroke: item.style.color, width: 0.6 });
      marks.push(...patternMarks(item.style.pattern ?? 'none', lx + 2, y - 7, 9, 8, item.style.color));
    } else marks.push(markerMark(item.style.marker ?? 'circle', r(lx + 8), y - 3, 2.4, item.style));
    marks.push({ k: 'text', x: r(lx + 19), y, text: item.label, size: 7, anchor: 'start', color: INK });
  });
  return { marks, plot };
}

function axisTicks(axis: Axis, s: (v: number) => number, which: 'x' | 'y', plot: PlotArea, marks: Mark[], measure: Measure): void {
  const r = (v: number) => Math.round(v * 100) / 100;
  let lastEnd = -Infinity;
  for (const t of axis.ticks) {
    if (t.value < axis.min - 1e-9 || t.value > axis.max + 1e-9) continue;
    const p = r(s(t.value));
    if (which === 'y') {
      marks.push({ k: 'path', pts: [r(plot.x - 3), p, r(plot.x), p], stroke: INK, width: 0.6 });
      marks.push({ k: 'text', x: r(plot.x - 4.5), y: r(p + TICK * 0.35), text: t.label, size: TICK, anchor: 'end', color: INK });
    } else {
      const yb = r(plot.y + plot.h);
      marks.push({ k: 'path', pts: [p, yb, p, r(yb + 3)], stroke: INK, width: 0.6 });
      const w = measure(t.label, TICK);
      if (p - w / 2 < lastEnd + 3) continue; // skip labels that would overlap their neighbour
      lastEnd = p + w / 2;
      marks.push({ k: 'text', x: p, y: r(yb + 4 + TICK), text: t.label, size: TICK, anchor: 'middle', color: INK });
    }
  }
}

type PathMark = Extract<Mark, { k: 'path' }>;

function rect(x: number, y: number, w: number, h: number, fill: RGB): PathMark {
  const r = (v: number) => Math.round(v * 100) / 100;
  return { k: 'path', pts: [r(x), r(y), r(x + w), r(y), r(x + w), r(y + h), r(x), r(y + h)], close: true, fill };
}

/** Marker shapes, distinct in outline so that series differ without colour. */
function markerMark(marker: string, x: number, y: number, s: number, st: Style): PathMark {
  const r = (v: number) => Math.round(v * 100) / 100;
  let pts: number[];
  if (marker === 'square') pts = [x - s, y - s, x + s, y - s, x + s, y + s, x - s, y + s];
  else if (marker === 'triangle') pts = [x, y - s * 1.25, x + s * 1.15, y + s * 0.9, x - s * 1.15, y + s * 0.9];
  else if (marker === 'diamond') pts = [x, y - s * 1.3, x + s * 1.1, y, x, y + s * 1.3, x - s * 1.1, y];
  else { pts = []; for (let i = 0; i < 12; i++) pts.push(x + s * Math.cos((i * Math.PI) / 6), y + s * Math.sin((i * Math.PI) / 6)); }
  const filled = st.hollow === undefined ? marker === 'circle' || marker === 'triangle' : !st.hollow;
  return { k: 'path', pts: pts.map(r), close: true, stroke: st.color, width: 0.8, fill: filled ? st.color : [1, 1, 1] };
}

/** Pattern lines clipped to a rectangle (computed, so no clipping paths are needed). */
export function patternMarks(pattern: Pattern, x: number, y: number, w: number, h: number, color: RGB): Mark[] {
  const r = (v: number) => Math.round(v * 100) / 100;
  const out: Mark[] = [];
  if (w <= 0.5 || h <= 0.5 || pattern === 'none') return out;
  const sp = 3.2;
  const line = (pts: number[]) => out.push({ k: 'path', pts: pts.map(r), stroke: color, width: 0.35 });
  if (pattern === 'horizontal') {
    for (let yy = y + sp / 2; yy < y + h; yy += sp) line([x, yy, x + w, yy]);
    return out;
  }
  if (pattern === 'dots') {
    // rows of round-capped dashes of length ~0: one path per row keeps the file small
    for (let yy = y + sp / 2; yy < y + h; yy += sp * 1.3) out.push({ k: 'path', pts: [r(x), r(yy), r(x + w), r(yy)], stroke: color, width: 0.7, dash: [0.7, sp * 1.3 - 0.7] });
    return out;
  }
  // x + y = c (rising to the right on the page)
  for (let c = x + y + sp / 2; c < x + w + y + h; c += sp) {
    const a = Math.max(x, c - y - h), b = Math.min(x + w, c - y);
    if (b > a) line([a, c - a, b, c - b]);
  }
  if (pattern === 'crosshatch') {
    // x − y = c
    for (let c = x - y - h + sp / 2; c < x + w - y; c += sp) {
      const a = Math.max(x, c + y), b = Math.min(x + w, c + y + h);
      if (b > a) line([a, a - c, b, b - c]);
    }
  }
  return out;
}

/** Shorten `text` with an ellipsis until it fits `width`; '' when not even one letter fits. */
export function fitText(text: string, width: number, size: number, measure: Measure): string {
  if (measure(text, size) <= width) return text;
  for (let n = text.length - 1; n > 0; n--) {
    const t = text.slice(0, n).trimEnd() + '…';
    if (measure(t, size) <= width) return t;
  }
  return '';
}
