import { beforeAll, describe, expect, it } from 'vitest';
import { CONTENT_WIDTH, layoutReport, PAGE, pageText, type LaidPage } from '../../lib/report/layout-report.js';
import { layoutResults } from '../../lib/report/render-report.js';
import { loadReportFonts, type ReportFonts } from '../../lib/report/report-fonts.js';
import type { ReportModel } from '../../lib/report/report-model.js';
import { wrapText } from '../../lib/report/wrap-text.js';
import { inventedStudy } from './fixtures/invented-study.js';

let fonts: ReportFonts;
let pages: LaidPage[];
beforeAll(async () => {
  fonts = await loadReportFonts();
  pages = (await layoutResults(inventedStudy())).pages;
});

const lorem = 'Surface electromyography of the upper trapezius during packing shows long stretches without rest gaps, ' +
  'and the normalized envelope (%MVE) stays between two and five per cent for much of the shift; bench-height-adjustment-and-reach-distance ' +
  'matter. ' + 'word '.repeat(60);

describe('wrapText(text, width, size, measure)', () => {
  it('wrapText never makes a line wider than the width and keeps every word in order', () => {
    for (const width of [60, 120, 300, CONTENT_WIDTH]) {
      const lines = wrapText(lorem, width, 9, fonts.measure);
      for (const l of lines) expect(fonts.measure(l, 9)).toBeLessThanOrEqual(width + 1e-9);
      expect(lines.join('').replace(/\s+/g, '')).toBe(lorem.replace(/\s+/g, ''));
      if (width >= 300) expect(lines.join(' ').replace(/\s+/g, ' ').trim()).toBe(lorem.replace(/\s+/g, ' ').trim());
    }
  });

  it('wrapText breaks a word longer than the line after a hyphen first', () => {
    const lines = wrapText('bench-height-adjustment', 60, 9, fonts.measure);
    expect(lines.length).toBeGreaterThan(1);
    expect(lines[0].endsWith('-')).toBe(true);
  });
});

describe('layoutReport(model, measure, safeText, text)', () => {
  it('layoutReport keeps every text line of the fixture report inside the page margins', () => {
    for (const p of pages) for (const it of p.items) {
      if (it.k === 'text') {
        expect(it.x).toBeGreaterThanOrEqual(PAGE.left - 0.01);
        expect(it.x + fonts.measure(it.text, it.size, it.bold)).toBeLessThanOrEqual(PAGE.width - PAGE.right + 0.01);
        expect(it.y).toBeGreaterThan(PAGE.bottom - 30);
        expect(it.y).toBeLessThan(PAGE.height - PAGE.top + 0.01);
      } else if (it.k === 'chart') {
        expect(it.x + it.chart.width).toBeLessThanOrEqual(PAGE.width - PAGE.right + 0.01);
        expect(it.y - it.chart.height).toBeGreaterThanOrEqual(PAGE.bottom - 0.01);
        for (const m of it.marks) {
          const xs = m.k === 'path' ? m.pts.filter((_, i) => i % 2 === 0) : [m.x];
          for (const x of xs) { expect(x).toBeGreaterThanOrEqual(-0.01); expect(x).toBeLessThanOrEqual(it.chart.width + 0.01); }
        }
      }
    }
  });

  it('layoutReport breaks a table longer than a page onto more pages and repeats its header row', () => {
    const rows = Array.from({ length: 150 }, (_, i) => [`row ${i + 1}`, 'packing', (i * 1.5).toFixed(1)]);
    const model: ReportModel = {
      meta: { title: 't', author: 'a', subject: 's', keywords: [], creator: 'c' },
      pages: [{ id: 'p', blocks: [{ type: 'heading', level: 1, text: 'Long table' }, { type: 'table', columns: [
        { label: 'label column', width: 2 }, { label: 'task', width: 1 }, { label: 'value (min)', width: 1, align: 'right' }], rows }] }],
    };
    const laid = layoutReport(model, fonts.measure, fonts.safeText, { footer: '{title} · page {page} of {pages}', title: 't', footerLeft: 'x' });
    expect(laid.length).toBeGreaterThanOrEqual(3);
    for (const p of laid) {
      const t = pageText(p);
      expect(t).toContain('label column');
      expect(t).toContain('value (min)');
    }
    const cells = laid.flatMap((p) => pageText(p).filter((s) => /^row \d+$/.test(s)));
    expect(cells).toEqual(rows.map((r) => r[0]));
    // right-aligned numbers end at the column's right edge less the padding
    const v = laid[0].items.find((i) => i.k === 'text' && i.text === '3.0');
    expect(v && v.k === 'text' ? v.x + fonts.measure('3.0', v.size) : 0).toBeCloseTo(PAGE.left + CONTENT_WIDTH - 3, 1);
  });
});

describe('layoutReport footers', () => {
  it('layoutReport shortens a very long title in the footer so "page N of M" stays inside the margin', async () => {
    const f = await loadReportFonts();
    const model: ReportModel = { meta: { title: 't', author: 'a', subject: 's', keywords: [], creator: 'c' }, pages: [{ id: 'p', blocks: [{ type: 'paragraph', text: 'x' }] }] };
    const laid = layoutReport(model, f.measure, f.safeText, { footer: '{title} · page {page} of {pages}', title: 'A very long study title '.repeat(8), footerLeft: 'shiftload 0.1.0' });
    const footer = laid[0].items.find((i) => i.k === 'text' && i.text.endsWith('page 1 of 1'));
    expect(footer && footer.k === 'text' ? footer.x : 0).toBeGreaterThan(PAGE.left + f.measure('shiftload 0.1.0', 7.5));
    expect(footer && footer.k === 'text' ? footer.text : '').toContain('…');
  });
});
