import { PDFDocument } from 'pdf-lib';
import fontkit from '@pdf-lib/fontkit';
import { describe, expect, it } from 'vitest';
import { glyphPerCodePoint, loadReportFonts, type FkFont } from '../../lib/report/report-fonts.js';
import { allTemplateStrings } from '../../lib/report/report-texts.js';

describe('report fonts', () => {
  it('every character of every template string has a glyph in DejaVu Sans and DejaVu Sans Bold (no .notdef)', async () => {
    const { regular, bold } = await loadReportFonts();
    const strings = allTemplateStrings();
    expect(strings.length).toBeGreaterThan(80);
    const missing: string[] = [];
    for (const s of strings) for (const ch of s) {
      const cp = ch.codePointAt(0)!;
      for (const f of [regular, bold]) if (!f.hasGlyphForCodePoint(cp) || f.glyphForCodePoint(cp).id === 0) missing.push(`${ch} U+${cp.toString(16)} in "${s.slice(0, 30)}"`);
    }
    expect(missing).toEqual([]);
  });

  it('every template string encodes with the embedded font to glyph ids other than 0', async () => {
    const { regularBytes } = await loadReportFonts();
    const pdf = await PDFDocument.create();
    pdf.registerFontkit(fontkit);
    const font = await pdf.embedFont(regularBytes, { subset: true });
    glyphPerCodePoint((font as unknown as { embedder: { font: FkFont } }).embedder.font);
    const glyphs = (font as unknown as { embedder: { font: FkFont } }).embedder.font;
    for (const s of allTemplateStrings()) {
      expect(font.encodeText(s).toString()).toMatch(/^<[0-9A-F]*>$/);
      for (const g of glyphs.layout(s).glyphs) expect(g.id).not.toBe(0);
    }
  });

  it('safeText(text) replaces characters the fonts lack and keeps the rest', async () => {
    const { safeText } = await loadReportFonts();
    expect(safeText('µV ≤ 5 %MVE – ok')).toBe('µV ≤ 5 %MVE – ok');
    expect(safeText('漢字 W01')).toBe('?? W01');
  });

  it('measure(text, size) is the sum of glyph advances, proportional to size', async () => {
    const { measure, regular } = await loadReportFonts();
    const a = regular.glyphForCodePoint(65).advanceWidth / regular.unitsPerEm;
    expect(measure('AAA', 10)).toBeCloseTo(30 * a, 9);
    expect(measure('AAA', 20)).toBeCloseTo(2 * measure('AAA', 10), 9);
  });
});
