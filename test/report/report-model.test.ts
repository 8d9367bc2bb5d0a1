import { describe, expect, it } from 'vitest';
import { buildReportModel, type Block } from '../../lib/report/report-model.js';
import { loadReportTexts } from '../../lib/report/report-texts.js';
import { renderReport } from '../../lib/report/render-report.js';
import type { StudyResults } from '../../lib/study/results.js';
import { inventedStudy } from './fixtures/invented-study.js';
import { pdfTextRuns } from './support/pdf-text.js';

const texts = loadReportTexts();
const textOf = (blocks: Block[]) => blocks.map((b) => ('text' in b ? b.text : 'items' in b ? b.items.join(' ') : 'rows' in b ? b.rows.flat().join(' ') : '')).join(' ');

describe('buildReportModel(results)', () => {
  it('buildReportModel orders pages: summary, overview, EVA, workers, methods, accounting, references', () => {
    const m = buildReportModel(inventedStudy());
    expect(m.pages.map((p) => p.id)).toEqual(['summary', 'overview', 'eva', 'worker-w01', 'worker-w02', 'worker-w03', 'worker-w04', 'worker-w05', 'worker-w06', 'methods', 'accounting', 'references']);
  });

  it('buildReportModel with %RVE rows does not set the %MVC guideline values beside them', () => {
    const r = inventedStudy();
    for (const row of r.rows) row.unit = '%RVE';
    const m = buildReportModel(r);
    const all = textOf(m.pages.flatMap((p) => p.blocks));
    expect(all).toContain('Loads in %RVE are not compared with them.');
    expect(all).not.toContain('Historical guideline (Jonsson 1982');
  });

  it('buildReportModel cites only references whose methods are used (no noise correction → no noise reference)', () => {
    const r = inventedStudy();
    r.settings.noise_correction = false;
    const refs = m2refs(buildReportModel(r));
    expect(refs.some((x) => x.includes('IEEE Trans Neural Syst Rehabil Eng'))).toBe(false);
    expect(refs.some((x) => x.startsWith('Jonsson B. 1982'))).toBe(true);
    expect(refs.length).toBeLessThan(texts.references.size);
  });

  it('renderReport(minimal results) works without study info, EVA, traces, APDF, findings or creation date', async () => {
    const full = inventedStudy();
    const r: StudyResults = { format: 'shiftload-results/1', tool: full.tool, title: 'Minimal', settings: {}, inputs: [],
      rows: full.rows.filter((x) => x.worker === 'W01'), eva: [], traces: [], apdf: [], findings: [] };
    const runs = await pdfTextRuns(await renderReport(r));
    const all = runs.flat().join(' ');
    expect(all).toContain(texts.t.qualityNone);
    expect(all).toContain('not recorded');
    expect(all).not.toMatch(/undefined|NaN/);
  });
});

function m2refs(m: ReturnType<typeof buildReportModel>): string[] {
  const page = m.pages.find((p) => p.id === 'references')!;
  const b = page.blocks.find((x) => x.type === 'bullets');
  return b && b.type === 'bullets' ? b.items : [];
}

describe('buildReportModel(results with spectra)', () => {
  it('buildReportModel adds a spectra page with one chart per spectrum and the suggested band as a band', () => {
    const r = inventedStudy();
    const freq_hz = Array.from({ length: 101 }, (_, i) => i * 5);
    r.spectra = [{ worker: 'W01', condition: 'bench-fixed', muscle: 'right upper trapezius', freq_hz, psd: freq_hz.map((f) => Math.exp(-f / 100)), suggested_band_hz: [20, 400] }];
    const page = buildReportModel(r).pages.find((p) => p.id === 'spectra')!;
    const charts = page.blocks.flatMap((b) => (b.type === 'charts' ? b.charts : []));
    expect(charts).toHaveLength(1);
    expect(charts[0].bands).toEqual([expect.objectContaining({ x0: 20, x1: 400 })]);
    expect(charts[0].caption).toContain('20–400 Hz');
    expect(buildReportModel(inventedStudy()).pages.some((p) => p.id === 'spectra')).toBe(false);
  });
});
