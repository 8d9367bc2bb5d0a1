// Test helper: read back the text drawn in a PDF, independently of the report code. It decompresses
// each page's content streams, follows the font selected by Tf, and decodes the glyph ids in <hex> Tj
// through that font's /ToUnicode CMap (the map a PDF viewer uses for copy and search).
import { inflateSync } from 'node:zlib';
import { PDFArray, PDFDict, PDFDocument, PDFName, PDFRawStream, PDFRef, type PDFObject } from 'pdf-lib';

function streamBytes(doc: PDFDocument, obj: PDFObject | undefined): Uint8Array {
  const s = obj instanceof PDFRef ? doc.context.lookup(obj) : obj;
  if (!(s instanceof PDFRawStream)) throw new Error('not a raw stream');
  const filter = s.dict.get(PDFName.of('Filter'));
  return filter && filter.toString() === '/FlateDecode' ? inflateSync(s.contents) : s.contents;
}

function parseToUnicode(text: string): Map<string, string> {
  const map = new Map<string, string>();
  for (const block of text.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const m of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>/g)) {
      const units: number[] = [];
      for (let i = 0; i < m[2].length; i += 4) units.push(parseInt(m[2].slice(i, i + 4), 16));
      map.set(m[1].toLowerCase(), String.fromCharCode(...units));
    }
  }
  return map;
}

/** For each page, the strings drawn by Tj operators, in drawing order. */
export async function pdfTextRuns(bytes: Uint8Array): Promise<string[][]> {
  const doc = await PDFDocument.load(bytes, { updateMetadata: false });
  const out: string[][] = [];
  for (const page of doc.getPages()) {
    const fonts = new Map<string, Map<string, string>>();
    const fontDict = page.node.Resources()?.lookup(PDFName.of('Font'), PDFDict);
    for (const [name, ref] of fontDict?.entries() ?? []) {
      const f = doc.context.lookup(ref, PDFDict);
      fonts.set(name.toString(), parseToUnicode(Buffer.from(streamBytes(doc, f.get(PDFName.of('ToUnicode')))).toString('latin1')));
    }
    const contents = page.node.Contents();
    const parts = contents instanceof PDFArray ? contents.asArray() : contents ? [contents] : [];
    const ops = parts.map((p) => Buffer.from(streamBytes(doc, p)).toString('latin1')).join('\n');
    const runs: string[] = [];
    let cur: Map<string, string> | undefined;
    for (const m of ops.matchAll(/(\/[^\s/]+)\s+[\d.]+\s+Tf|<([0-9a-fA-F]*)>\s*Tj/g)) {
      if (m[1]) { cur = fonts.get(m[1]); continue; }
      const hex = m[2].toLowerCase();
      let s = '';
      for (let i = 0; i < hex.length; i += 4) {
        const u = cur?.get(hex.slice(i, i + 4));
        if (u === undefined) throw new Error(`glyph ${hex.slice(i, i + 4)} has no ToUnicode entry`);
        s += u;
      }
      runs.push(s);
    }
    out.push(runs);
  }
  return out;
}
