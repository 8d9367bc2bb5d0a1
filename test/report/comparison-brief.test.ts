// Page 1's "condition comparison in brief": one line per muscle × task from results.comparisons
// (median load and gap frequency), read back from the PDF. INVENTED TEST DATA
// (test/report/fixtures/invented-study.ts plus invented comparisons built from its rows).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { renderReport } from '../../lib/report/render-report.js';
import type { Comparison, StudyResults } from '../../lib/study/results.js';
import { inventedStudy } from './fixtures/invented-study.js';
import { pdfTextRuns } from './support/pdf-text.js';

const texts = JSON.parse(readFileSync(new URL('../../templates/report/texts.json', import.meta.url), 'utf8'));
const WORKERS = ['W01', 'W02', 'W03', 'W04', 'W05', 'W06'];

function comparison(r: StudyResults, segment: string, measure: 'p50' | 'gaps_per_min', unit: string, median_difference: number): Comparison {
  const rs = r.rows.filter((x) => x.muscle === 'right upper trapezius' && x.segment === segment);
  const val = (w: string, c: string) => (rs.find((x) => x.worker === w && x.condition === c) as unknown as Record<string, number | null>)[measure] ?? null;
  const per_worker = WORKERS.map((w) => { const a = val(w, 'bench-fixed'), b = val(w, 'bench-adjustable'); return { worker: w, a, b, difference: a !== null && b !== null ? b - a : null }; });
  return { segment, muscle: 'right upper trapezius', measure, unit, condition_a: 'bench-fixed', condition_b: 'bench-adjustable', paired: true, n: 6,
    median_difference, ci_low: null, ci_high: null, p_value: null, statement: 'Invented.', descriptive_only: false, per_worker } as unknown as Comparison;
}

describe('renderReport(results with comparisons): page-1 comparison brief', () => {
  it('renderReport() prints on page 1 one line per muscle × task with the workers lower/higher in b (counted from per_worker) and the median difference', async () => {
    const r = inventedStudy();
    r.comparisons = [comparison(r, 'packing', 'p50', '%MVE', -2.1), comparison(r, 'packing', 'gaps_per_min', 'gaps/min', 1.4), comparison(r, 'all', 'p50', '%MVE', -1)];
    const runs = await pdfTextRuns(await renderReport(r));
    const summary = runs.slice(0, runs.findIndex((p) => p.includes(texts.headings.overview))).flat().join(' ');
    expect(summary).toContain(texts.headings.comparisonBrief);
    const pw = (r.comparisons[0] as unknown as { per_worker: { a: number; b: number }[] }).per_worker;
    const lower = pw.filter((p) => p.b < p.a).length, higher = pw.filter((p) => p.b > p.a).length;
    expect(lower + higher).toBeGreaterThan(0);
    expect(summary).toContain(`Right upper trapezius, packing: median load lower in ${lower}, higher in ${higher} of 6 workers (−2.1 %MVE);`);
    expect(summary).toContain('(+1.4 gaps/min).');
    expect(summary).not.toContain('Right upper trapezius, all:'); // the whole recording stays on the comparison page
  });

  it('renderReport() prints no comparison brief without comparisons', async () => {
    const runs = await pdfTextRuns(await renderReport(inventedStudy()));
    expect(runs.flat()).not.toContain(texts.headings.comparisonBrief);
  });
});
