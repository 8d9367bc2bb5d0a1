// Paint laid-out pages into a PDF with pdf-lib. Each sheet gets ONE content stream that we write
// ourselves (text with the embedded DejaVu fonts as glyph ids, vector paths for charts) and
// deflate with node:zlib: fast for long polylines, and painted in exactly the layout's order.
// Metadata comes from the results (never the clock), so the same input gives the same bytes.
import { deflateSync } from 'node:zlib';
import type { Mark } from './charts/chart-marks.js';
import type { RGB } from './charts/chart-model.js';
import type { DrawItem, LaidPage } from './layout-report.js';
import { PAGE } from './layout-report.js';
import { FONT_FEATURES, glyphPerCodePoint, type FkFont, type ReportFonts } from './report-fonts.js';
import type { ReportMeta } from './report-model.js';

/** Plain decimal (never exponent form), at most 2 decimals. */
function n(v: number): string {
  const s = (Math.round(v * 100) / 100).toFixed(2);
  return s.replace(/\.?0+$/, '') || '0';
}
const rgb = (c: RGB) => `${n(c[0])} ${n(c[1])} ${n(c[2])}`;

/**
 * Render pages to PDF bytes. pdf-lib and fontkit are imported here, lazily, so that the CLI starts fast.
 * @example const bytes = await renderPdf(pages, model.meta, fonts)
 */
export async function renderPdf(pages: LaidPage[], meta: ReportMeta, fonts: ReportFonts): Promise<Uint8Array> {
  const { PDFDocument, PDFName, PDFString } = await import('pdf-lib');
  const fontkit = (await import('@pdf-lib/fontkit')).default;
  const pdf = await PDFDocument.create({ updateMetadata: false });
  pdf.registerFontkit(fontkit);
  const regular = await pdf.embedFont(fonts.regularBytes, { subset: true, features: { ...FONT_FEATURES } });
  const bold = await pdf.embedFont(fonts.boldBytes, { subset: true, features: { ...FONT_FEATURES } });
  // pdf-lib 1.17.1 keeps the fontkit font at (PDFFont).embedder.font; encodeText calls its layout().
  for (const f of [regular, bold]) glyphPerCodePoint((f as unknown as { embedder: { font: FkFont } }).embedder.font);

  for (const lp of pages) {
    const page = pdf.addPage([PAGE.width, PAGE.height]);
    const fR = page.node.newFontDictionary('R', regular.ref).toString();
    const fB = page.node.newFontDictionary('B', bold.ref).toString();
    const ops: string[] = [];
    const text = (t: string, x: number, y: number, size: number, isBold: boolean | undefined, color: RGB, up = false) => {
      if (!t) return;
      const hex = (isBold ? bold : regular).encodeText(t).toString();
      const tm = up ? `0 1 -1 0 ${n(x)} ${n(y)}` : `1 0 0 1 ${n(x)} ${n(y)}`;
      ops.push(`BT ${isBold ? fB : fR} ${n(size)} Tf ${rgb(color)} rg ${tm} Tm ${hex} Tj ET`);
    };
    for (const it of lp.items) drawItem(it);

    function drawItem(it: DrawItem): void {
      if (it.k === 'text') text(it.text, it.x, it.y, it.size, it.bold, it.color);
      else if (it.k === 'line') ops.push(`${rgb(it.color)} RG ${n(it.width)} w [] 0 d ${n(it.x1)} ${n(it.y1)} m ${n(it.x2)} ${n(it.y2)} l S`);
      else if (it.k === 'rect') {
        const paint = it.fill && it.stroke ? 'B' : it.fill ? 'f' : 'S';
        ops.push(`${it.fill ? rgb(it.fill) + ' rg ' : ''}${it.stroke ? rgb(it.stroke) + ' RG ' + n(it.width ?? 0.5) + ' w [] 0 d ' : ''}${n(it.x)} ${n(it.y)} ${n(it.w)} ${n(it.h)} re ${paint}`);
      } else {
        ops.push('q');
        for (const m of it.marks) drawMark(m, it.x, it.y);
        ops.push('Q');
      }
    }

    function drawMark(m: Mark, ox: number, oy: number): void {
      if (m.k === 'text') {
        const w = fonts.measure(m.text, m.size, m.bold);
        const shift = m.anchor === 'middle' ? w / 2 : m.anchor === 'end' ? w : 0;
        if (m.up) text(m.text, ox + m.x, oy - m.y - shift, m.size, m.bold, m.color, true);
        else text(m.text, ox + m.x - shift, oy - m.y, m.size, m.bold, m.color);
        return;
      }
      const p = m.pts;
      if (p.length < 4) return;
      const parts: string[] = [];
      if (m.fill) parts.push(`${rgb(m.fill)} rg`);
      if (m.stroke) parts.push(`${rgb(m.stroke)} RG ${n(m.width ?? 1)} w [${(m.dash ?? []).map(n).join(' ')}] 0 d`);
      parts.push(`${n(ox + p[0])} ${n(oy - p[1])} m`);
      for (let i = 2; i < p.length; i += 2) parts.push(`${n(ox + p[i])} ${n(oy - p[i + 1])} l`);
      parts.push(m.close ? (m.fill && m.stroke ? 'b' : m.fill ? 'h f' : 's') : m.fill ? 'f' : 'S');
      ops.push(parts.join('\n'));
    }

    const stream = pdf.context.stream(deflateSync(Buffer.from(ops.join('\n'), 'latin1')), { Filter: 'FlateDecode' });
    page.node.addContentStream(pdf.context.register(stream));
  }

  pdf.setTitle(meta.title, { showInWindowTitleBar: true });
  pdf.setAuthor(meta.author);
  pdf.setSubject(meta.subject);
  pdf.setKeywords(meta.keywords);
  pdf.setCreator(meta.creator);
  pdf.setProducer(`${meta.creator} (pdf-lib)`);
  if (meta.creationDate && !Number.isNaN(Date.parse(meta.creationDate))) {
    pdf.setCreationDate(new Date(meta.creationDate));
    pdf.setModificationDate(new Date(meta.creationDate));
  }
  pdf.catalog.set(PDFName.of('Lang'), PDFString.of('en'));
  return pdf.save();
}
