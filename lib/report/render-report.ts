// The report entry points for `report` and `analyze`: results → PDF bytes (and SVG charts).
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { writeAtomic } from '../io/write-atomic.js';
import type { StudyResults } from '../study/results.js';
import { assertResults } from './assert-results.js';
import { layoutReport, type LaidPage } from './layout-report.js';
import { renderPdf } from './render-pdf.js';
import { chartToSvg } from './render-svg.js';
import { loadReportFonts } from './report-fonts.js';
import { buildReportModel } from './report-model.js';
import { loadReportTexts } from './report-texts.js';

export interface ReportOptions {
  /** Also write every chart as `<id>.svg` into this folder (created if missing). */
  svgDir?: string;
}

/** Model → laid-out pages (exported for tests and for a plain-text rendition). */
export async function layoutResults(results: StudyResults): Promise<{ pages: LaidPage[]; model: ReturnType<typeof buildReportModel> }> {
  const texts = loadReportTexts();
  const model = buildReportModel(results, texts);
  const fonts = await loadReportFonts();
  const pages = layoutReport(model, fonts.measure, fonts.safeText, {
    footer: texts.t.footer, title: results.title, footerLeft: `shiftload ${results.tool.version}`,
  });
  return { pages, model };
}

export interface RenderedReport {
  bytes: Uint8Array;
  /** Number of PDF pages. */
  pageCount: number;
  /** SVG files written (empty without svgDir). */
  svgFiles: string[];
}

/** renderReport with the page count and the SVG files written (for the CLI's summary line). */
export async function renderReportInfo(results: StudyResults, opts: ReportOptions = {}): Promise<RenderedReport> {
  assertResults(results, '(results)');
  const { pages, model } = await layoutResults(results);
  const fonts = await loadReportFonts();
  const svgFiles: string[] = [];
  if (opts.svgDir) {
    mkdirSync(opts.svgDir, { recursive: true });
    for (const p of pages) for (const it of p.items) if (it.k === 'chart') {
      const file = join(opts.svgDir, `${it.chart.id}.svg`);
      writeAtomic(file, chartToSvg(it.chart, fonts.measure));
      svgFiles.push(file);
    }
  }
  return { bytes: await renderPdf(pages, model.meta, fonts), pageCount: pages.length, svgFiles };
}

/**
 * Render the exposure report of `results` to PDF bytes. Deterministic: the same results give the
 * same bytes. Throws InputError if `results` is not a shiftload-results/1 object.
 * @example const pdf = await renderReport(results, { svgDir: 'out/charts' })
 */
export async function renderReport(results: StudyResults, opts: ReportOptions = {}): Promise<Uint8Array> {
  return (await renderReportInfo(results, opts)).bytes;
}

/** Render and write the report atomically to `outPath`; returns the number of bytes written. */
export async function writeReport(results: StudyResults, outPath: string, opts: ReportOptions = {}): Promise<number> {
  const bytes = await renderReport(results, opts);
  writeAtomic(outPath, bytes);
  return bytes.length;
}
