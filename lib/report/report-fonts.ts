// The report's fonts (DejaVu Sans regular and bold, from the npm package dejavu-fonts-ttf; Bitstream
// Vera licence) with their metrics: text width for layout and a guard that replaces characters the
// font lacks, so no missing-glyph box (.notdef) can reach a report. fontkit is imported lazily.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Measure } from './charts/chart-marks.js';

/** The part of a fontkit font the report uses. */
export interface FkFont {
  unitsPerEm: number;
  layout(text: string, features?: Record<string, boolean>): { glyphs: { id: number; advanceWidth: number }[] };
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

/** OpenType features used for both measuring and drawing: ligatures off, so text extracts as typed. */
export const FONT_FEATURES = { liga: false, clig: false, calt: false, kern: false } as const;

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
    const cache = new Map<string, number>();
    const unitWidth = (text: string, isBold: boolean): number => {
      const key = (isBold ? 'b' : 'r') + text;
      let w = cache.get(key);
      if (w === undefined) {
        const f = isBold ? bold : regular;
        w = 0;
        for (const g of f.layout(text, { ...FONT_FEATURES }).glyphs) w += g.advanceWidth;
        w /= f.unitsPerEm;
        cache.set(key, w);
      }
      return w;
    };
    const measure: Measure = (text, size, isBold = false) => unitWidth(text, isBold) * size;
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
