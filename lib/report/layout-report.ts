// Page layout: place the report model's blocks on A4 sheets. Text is wrapped with the font's
// metrics, tables break across sheets with their header row repeated, charts and caution boxes
// are never split, and every sheet gets a "page N of M" footer. The output is a list of draw
// items per sheet (PDF coordinates: pt, origin bottom left) that renderPdf() only has to paint.
import { chartMarks, fitText, type Mark, type Measure } from './charts/chart-marks.js';
import type { ChartModel, RGB } from './charts/chart-model.js';
import { INK, MUTED } from './charts/chart-styles.js';
import { fillRequired } from './fill-template.js';
import type { Block, ReportModel, TableColumn } from './report-model.js';
import { wrapText } from './wrap-text.js';

export type DrawItem =
  | { k: 'text'; x: number; y: number; text: string; size: number; bold?: boolean; color: RGB }
  | { k: 'rect'; x: number; y: number; w: number; h: number; fill?: RGB; stroke?: RGB; width?: number }
  | { k: 'line'; x1: number; y1: number; x2: number; y2: number; color: RGB; width: number }
  /** A chart whose box has its top-left corner at (x, y); marks are in chart coordinates (y down). */
  | { k: 'chart'; x: number; y: number; chart: ChartModel; marks: Mark[] };

export interface LaidPage { id: string; items: DrawItem[] }

/** Page geometry, pt. A4 portrait. */
export const PAGE = { width: 595.28, height: 841.89, left: 56, right: 56, top: 54, bottom: 62 } as const;
export const CONTENT_WIDTH = PAGE.width - PAGE.left - PAGE.right;

const BODY = 9.5, SMALL = 8.5, TABLE = 7.2, CAPTION = 7.2;
const LEAD = 1.38;
const HEADING: Record<1 | 2 | 3, number> = { 1: 15, 2: 11.5, 3: 10 };
const CAUTION_FILL: RGB = [0.975, 0.965, 0.935];
const CAUTION_BAR: RGB = [0.55, 0.38, 0.12];
const RULE: RGB = [0.75, 0.76, 0.78];
const ZEBRA: RGB = [0.955, 0.96, 0.965];

export interface LayoutText {
  /** Footer template with {title}, {page}, {pages}. */
  footer: string;
  /** Short title for the footer. */
  title: string;
  /** Left footer text (tool and version). */
  footerLeft: string;
}

/**
 * Lay out the whole report. Pure function of its inputs (deterministic).
 * @param safeText replaces characters the font cannot draw (applied to every text item)
 */
export function layoutReport(model: ReportModel, measure: Measure, safeText: (s: string) => string, text: LayoutText): LaidPage[] {
  const pages: LaidPage[] = [];
  let cur: LaidPage = { id: '', items: [] };
  let y = 0;
  const top = PAGE.height - PAGE.top;
  const newSheet = (id: string) => { cur = { id, items: [] }; pages.push(cur); y = top; };
  const fits = (h: number) => y - h >= PAGE.bottom;
  const ensure = (h: number, id: string) => { if (!fits(h) && y < top) newSheet(id); };
  const put = (t: string, x: number, yy: number, size: number, bold = false, color: RGB = INK) =>
    cur.items.push({ k: 'text', x: r2(x), y: r2(yy), text: t, size, bold, color });

  for (const page of model.pages) {
    newSheet(page.id);
    page.blocks.forEach((block, i) => layoutBlock(block, page.id, page.blocks[i + 1]));
  }

  function lines(t: string, width: number, size: number, bold = false) { return wrapText(safeText(t), width, size, measure, bold); }

  function paragraph(t: string, size: number, id: string, x = PAGE.left, width = CONTENT_WIDTH, bold = false, color: RGB = INK) {
    const lead = size * (size < BODY ? 1.3 : LEAD);
    for (const line of lines(t, width, size, bold)) {
      ensure(lead, id);
      y -= lead;
      put(line, x, y + size * 0.28, size, bold, color);
    }
  }

  function layoutBlock(b: Block, id: string, next?: Block): void {
    switch (b.type) {
      case 'title': {
        paragraph(b.text, 18, id, PAGE.left, CONTENT_WIDTH, true);
        y -= 3;
        for (const l of b.lines) paragraph(l, 8.5, id, PAGE.left, CONTENT_WIDTH, false, MUTED);
        y -= 6;
        cur.items.push({ k: 'line', x1: PAGE.left, y1: r2(y), x2: PAGE.left + CONTENT_WIDTH, y2: r2(y), color: INK, width: 1.2 });
        y -= 6;
        return;
      }
      case 'heading': {
        const size = HEADING[b.level];
        const h = size * LEAD * lines(b.text, CONTENT_WIDTH, size, true).length + (b.level === 1 ? 8 : 5);
        // keep a heading with the start of what follows (a whole row of charts when charts follow)
        const keep = next?.type === 'charts' ? Math.max(70, ...next.charts.map((c) => c.height + 12)) : 70;
        if (y < top) ensure(h + keep, id);
        y -= b.level === 1 ? 4 : b.level === 2 ? 5 : 2;
        paragraph(b.text, size, id, PAGE.left, CONTENT_WIDTH, true);
        if (b.level === 1) {
          y -= 3;
          cur.items.push({ k: 'line', x1: PAGE.left, y1: r2(y), x2: PAGE.left + CONTENT_WIDTH, y2: r2(y), color: RULE, width: 0.6 });
        }
        y -= b.level === 3 ? 1 : 4;
        return;
      }
      case 'paragraph':
        paragraph(b.text, b.small ? SMALL : BODY, id);
        y -= 4;
        return;
      case 'bullets': {
        const size = b.small ? SMALL : BODY;
        const lead = size * (b.small ? 1.3 : LEAD);
        for (const item of b.items) {
          const ls = lines(item, CONTENT_WIDTH - 12, size);
          ls.forEach((l, i) => {
            ensure(lead, id);
            y -= lead;
            if (i === 0) put('•', PAGE.left + 2, y + size * 0.28, size);
            put(l, PAGE.left + 12, y + size * 0.28, size);
          });
          y -= 0.8;
        }
        y -= 3;
        return;
      }
      case 'caution': {
        const size = 8, lead = size * 1.25, pad = 7, inner = CONTENT_WIDTH - 2 * pad - 14;
        const itemLines = b.items.map((it) => lines(it, inner, size));
        const h = pad + 11 * LEAD + itemLines.reduce((s, ls) => s + ls.length * lead + 2, 0) + pad;
        y -= 4;
        ensure(h, id);
        cur.items.push({ k: 'rect', x: PAGE.left, y: r2(y - h), w: CONTENT_WIDTH, h: r2(h), fill: CAUTION_FILL, stroke: RULE, width: 0.5 });
        cur.items.push({ k: 'rect', x: PAGE.left, y: r2(y - h), w: 3, h: r2(h), fill: CAUTION_BAR });
        let yy = y - pad - 10;
        put(safeText(b.title), PAGE.left + pad + 2, yy, 10, true);
        yy -= 6;
        for (const ls of itemLines) {
          ls.forEach((l, i) => {
            yy -= lead;
            if (i === 0) put('!', PAGE.left + pad + 3, yy, size, true, CAUTION_BAR);
            put(l, PAGE.left + pad + 14, yy, size);
          });
          yy -= 2;
        }
        y -= h + 8;
        return;
      }
      case 'table':
        table(b.columns, b.rows, id);
        return;
      case 'charts':
        charts(b.charts, id);
        return;
    }
  }

  function table(columns: TableColumn[], rows: string[][], id: string): void {
    const size = TABLE, lead = size * 1.3, padX = 3, padY = 2.6;
    // each column at least as wide as the longest word of its header; the rest shared by the given shares
    const minW = columns.map((c) => Math.max(...safeText(c.label).split(/[ ]+/).map((w) => measure(w, size, true))) + 2 * padX + 0.5);
    let widths = columns.map(() => 0);
    let free = columns.map((_, i) => i);
    let room = CONTENT_WIDTH;
    for (let guard = 0; guard < columns.length; guard++) {
      const share = free.reduce((s, i) => s + columns[i].width, 0);
      const tooNarrow = free.filter((i) => (columns[i].width / share) * room < minW[i]);
      if (!tooNarrow.length) { for (const i of free) widths[i] = (columns[i].width / share) * room; break; }
      for (const i of tooNarrow) { widths[i] = minW[i]; room -= minW[i]; }
      free = free.filter((i) => !tooNarrow.includes(i));
      if (!free.length) { widths = widths.map((w) => (w * CONTENT_WIDTH) / (CONTENT_WIDTH - room)); break; }
    }
    const xs: number[] = [];
    widths.reduce((x, w) => (xs.push(x), x + w), PAGE.left);
    const wrapRow = (cells: string[], bold: boolean) => cells.map((c, i) => lines(c ?? '', widths[i] - 2 * padX, size, bold));
    const header = wrapRow(columns.map((c) => c.label), true);
    const headerH = Math.max(...header.map((l) => l.length)) * lead + 2 * padY;
    const drawRow = (cells: string[][], bold: boolean, h: number, shade: boolean) => {
      if (shade) cur.items.push({ k: 'rect', x: PAGE.left, y: r2(y - h), w: r2(CONTENT_WIDTH), h: r2(h), fill: ZEBRA });
      cells.forEach((ls, i) => ls.forEach((l, j) => {
        const yy = y - padY - (j + 1) * lead + size * 0.3;
        const w = measure(l, size, bold);
        const x = columns[i].align === 'right' ? xs[i] + widths[i] - padX - w : xs[i] + padX;
        put(l, x, yy, size, bold);
      }));
      y -= h;
    };
    const drawHeader = () => {
      drawRow(header, true, headerH, false);
      cur.items.push({ k: 'line', x1: PAGE.left, y1: r2(y), x2: r2(PAGE.left + CONTENT_WIDTH), y2: r2(y), color: INK, width: 0.6 });
    };
    y -= 3;
    ensure(headerH + lead + 2 * padY, id);
    cur.items.push({ k: 'line', x1: PAGE.left, y1: r2(y), x2: r2(PAGE.left + CONTENT_WIDTH), y2: r2(y), color: INK, width: 0.6 });
    drawHeader();
    rows.forEach((row, ri) => {
      const cells = wrapRow(row, false);
      const h = Math.max(1, ...cells.map((l) => l.length)) * lead + 2 * padY;
      if (!fits(h)) {
        newSheet(id);
        cur.items.push({ k: 'line', x1: PAGE.left, y1: r2(y), x2: r2(PAGE.left + CONTENT_WIDTH), y2: r2(y), color: INK, width: 0.6 });
        drawHeader();
      }
      drawRow(cells, false, h, ri % 2 === 1);
    });
    cur.items.push({ k: 'line', x1: PAGE.left, y1: r2(y), x2: r2(PAGE.left + CONTENT_WIDTH), y2: r2(y), color: INK, width: 0.6 });
    y -= 8;
  }

  function charts(list: ChartModel[], id: string): void {
    const gap = 14;
    const slot = (CONTENT_WIDTH - gap * (list.length - 1)) / list.length;
    const sized = list.map((c) => ({ ...c, width: Math.min(c.width, slot) }));
    const caps = sized.map((c) => lines(c.caption, c.width, CAPTION));
    const h = Math.max(...sized.map((c) => c.height)) + 4 + Math.max(...caps.map((c) => c.length)) * CAPTION * 1.3 + 10;
    ensure(h, id);
    const yTop = y;
    let x = PAGE.left;
    sized.forEach((c, i) => {
      cur.items.push({ k: 'chart', x: r2(x), y: r2(yTop), chart: c, marks: chartMarks(c, (t, s, b) => measure(safeText(t), s, b)).marks.map((m) => (m.k === 'text' ? { ...m, text: safeText(m.text) } : m)) });
      let yy = yTop - c.height - 4;
      for (const l of caps[i]) { yy -= CAPTION * 1.3; put(l, x, yy + CAPTION * 0.3, CAPTION, false, MUTED); }
      x += c.width + gap;
    });
    y = yTop - h;
  }

  // footers: "page N of M"
  const n = pages.length;
  pages.forEach((p, i) => {
    const yb = PAGE.bottom - 26;
    p.items.push({ k: 'line', x1: PAGE.left, y1: yb + 10, x2: r2(PAGE.left + CONTENT_WIDTH), y2: yb + 10, color: RULE, width: 0.5 });
    const pageOnly = fillRequired(text.footer, { title: '', page: i + 1, pages: n });
    const room = CONTENT_WIDTH - measure(text.footerLeft, 7.5) - measure(pageOnly, 7.5) - 24;
    const title = fitText(safeText(text.title), room, 7.5, measure) || '…';
    const right = safeText(fillRequired(text.footer, { title, page: i + 1, pages: n }));
    p.items.push({ k: 'text', x: r2(PAGE.left + CONTENT_WIDTH - measure(right, 7.5)), y: yb, text: right, size: 7.5, color: MUTED });
    p.items.push({ k: 'text', x: PAGE.left, y: yb, text: safeText(text.footerLeft), size: 7.5, color: MUTED });
  });
  return pages;
}

function r2(v: number): number { return Math.round(v * 100) / 100; }

/** All text of a laid-out page in drawing order (for tests and a plain-text rendition). */
export function pageText(page: LaidPage): string[] {
  const out: string[] = [];
  for (const it of page.items) {
    if (it.k === 'text') out.push(it.text);
    else if (it.k === 'chart') for (const m of it.marks) if (m.k === 'text') out.push(m.text);
  }
  return out;
}
