// The report's fonts (DejaVu Sans regular and bold, from the npm package dejavu-fonts-ttf; Bitstream
// Vera licence) with their metrics: text width for layout and a guard that replaces characters the
// font lacks, so no missing-glyph box (.notdef) can reach a report. fontkit is imported lazily.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Measure } from './charts/chart-marks.js';

/** A fontkit glyph: id and advance width in font units. */
export interface FkGlyph { id: number; advanceWidth: number }

/** The part of a fontkit font the report uses. */
export interface FkFont {
  unitsPerEm: number;
  layout(text: string, features?: Record<string, boolean>): { glyphs: FkGlyph[] };
  glyphForCodePoint(cp: number): FkGlyph;
  hasGlyphForCodePoint(cp: number): boolean;
}

export interface ReportFonts {
  regularBytes: Uint8Array;
  boldBytes: Uint8Array;
  regular: FkFont;
  bold: FkFont;
  /** Width of text in pt (sum of glyph advances, as drawn with Tj: no kerning, no ligatures). */
  measure: Measure;
  /** `text` with every character the font cannot draw replaced by '?'. */
  safeText(text: string): string;
}

/** OpenType features passed to pdf-lib (ligatures off, so text extracts as typed). */
export const FONT_FEATURES = { liga: false, clig: false, calt: false, kern: false } as const;

/**
 * Replace a fontkit font's shaping `layout` with a plain cmap lookup (one glyph per code point).
 * Used on the font inside pdf-lib's embedder: shaping was most of the render time, and for the
 * Latin text of a report with ligatures off it selects the same glyphs.
 */
export function glyphPerCodePoint(font: FkFont): void {
  font.layout = (text: string) => {
    const glyphs: FkGlyph[] = [];
    for (const ch of text) glyphs.push(font.glyphForCodePoint(ch.codePointAt(0) as number));
    return { glyphs };
  };
}

let cached: Promise<ReportFonts> | null = null;

/** Load (once per process) the report fonts. */
export function loadReportFonts(): Promise<ReportFonts> {
  cached ??= (async () => {
    const mod = (await import('@pdf-lib/fontkit')) as unknown as { default: { create(b: Uint8Array): FkFont } };
    const fk = mod.default;
    const req = createRequire(import.meta.url);
    const regularBytes = new Uint8Array(readFileSync(req.resolve('dejavu-fonts-ttf/ttf/DejaVuSans.ttf')));
    const boldBytes = new Uint8Array(readFileSync(req.resolve('dejavu-fonts-ttf/ttf/DejaVuSans-Bold.ttf')));
    const regular = fk.create(regularBytes);
    const bold = fk.create(boldBytes);
    // One glyph per code point (cmap lookup, no shaping): fast, and exactly what renderPdf draws
    // (see glyphPerCodePoint). Widths cached per code point.
    const widths = [new Map<number, number>(), new Map<number, number>()];
    const measure: Measure = (text, size, isBold = false) => {
      const f = isBold ? bold : regular;
      const cache = widths[isBold ? 1 : 0];
      let w = 0;
      for (let i = 0; i < text.length; i++) {
        const cp = text.codePointAt(i) as number;
        if (cp > 0xffff) i++;
        let a = cache.get(cp);
        if (a === undefined) { a = f.glyphForCodePoint(cp).advanceWidth / f.unitsPerEm; cache.set(cp, a); }
        w += a;
      }
      return w * size;
    };
    const safeText = (text: string): string => {
      let out = '';
      for (const ch of text) {
        const cp = ch.codePointAt(0) as number;
        out += regular.hasGlyphForCodePoint(cp) && bold.hasGlyphForCodePoint(cp) ? ch : '?';
      }
      return out;
    };
    return { regularBytes, boldBytes, regular, bold, measure, safeText };
  })();
  return cached;
}
