import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { PDFDocument } from 'pdf-lib';
import { beforeAll, describe, expect, it } from 'vitest';
import { layoutResults, renderReport } from '../../lib/report/render-report.js';
import type { Comparison, StudyResults } from '../../lib/study/results.js';
import { inventedStudy } from './fixtures/invented-study.js';
import { pdfTextRuns } from './support/pdf-text.js';

// Fixture: INVENTED TEST DATA (test/report/fixtures/invented-study.ts). Expected texts come from the
// template files and the input object; numbers are formatted here by the documented rule
// (2 decimals below 1, 1 decimal below 100, none above).
const fmt = (x: number) => x.toFixed(Math.abs(x) < 1 ? 2 : Math.abs(x) < 100 ? 1 : 0);
const median = (v: number[]) => { const s = [...v].sort((a, b) => a - b); const m = s.length >> 1; return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2; };
const cautions = readFileSync(new URL('../../templates/report/cautions.md', import.meta.url), 'utf8')
  .split('\n').filter((l) => l.startsWith('- ')).map((l) => l.slice(2).trim());
const texts = JSON.parse(readFileSync(new URL('../../templates/report/texts.json', import.meta.url), 'utf8'));

let results: StudyResults;
let bytes: Uint8Array;
let runs: string[][];

beforeAll(async () => {
  results = inventedStudy();
  bytes = await renderReport(results);
  runs = await pdfTextRuns(bytes);
});

const pageWith = (heading: string) => runs.findIndex((r) => r.includes(heading));

describe('renderReport(results)', () => {
  it('renderReport(results) writes one PDF page per laid-out page, each footed "page N of M"', async () => {
    const doc = await PDFDocument.load(bytes);
    const { pages } = await layoutResults(results);
    expect(doc.getPageCount()).toBe(pages.length);
    expect(doc.getPageCount()).toBeGreaterThan(10);
    runs.forEach((r, i) => expect(r.some((s) => s.endsWith(`page ${i + 1} of ${runs.length}`))).toBe(true));
  });

  it('renderReport(results) puts the title, the committee headings and every caution on page 1', () => {
    const p1 = runs[0];
    expect(p1).toContain(results.title);
    for (const h of ['who', 'figures', 'context', 'quality', 'cautions']) expect(p1).toContain(texts.headings[h]);
    const joined = p1.join(' ');
    for (const c of cautions) expect(joined).toContain(c);
    expect(joined).toContain('not legal limits');
    expect(joined).toContain('not a diagnosis');
  });

  it('renderReport(results) states page-1 medians across workers equal to the rows of the input', () => {
    const rs = results.rows.filter((r) => r.muscle === 'right upper trapezius' && r.segment === 'packing' && r.condition === 'bench-fixed');
    const p50 = rs.map((r) => r.p50 as number);
    const gpm = rs.map((r) => r.gaps_per_min as number);
    const expected = `During packing (bench-fixed): median load ${fmt(median(p50))} %MVE (${fmt(Math.min(...p50))}–${fmt(Math.max(...p50))}), ${fmt(median(gpm))} rest gaps per minute`;
    expect(runs[0].join(' ')).toContain(expected);
  });

  it('renderReport(results) prints one row of a worker table with exactly the input figures', () => {
    const row = results.rows.find((r) => r.worker === 'W03' && r.condition === 'bench-fixed' && r.muscle === 'right upper trapezius' && r.segment === 'packing')!;
    const page = runs[pageWith('Worker W03')];
    const expected = ['packing', (row.valid_s / 60).toFixed(1), fmt(row.p10 as number), fmt(row.p50 as number), fmt(row.p90 as number),
      fmt(row.gaps_per_min as number), fmt(row.rest_pct as number), (row.longest_without_gap_s as number).toFixed(0), fmt(row.sustained_pct as number)];
    const at = page.findIndex((s, i) => expected.every((e, k) => page[i + k] === e));
    expect(at).toBeGreaterThan(-1);
    expect(row.valid_s).toBeLessThan(row.end_s - row.start_s); // the fixture excluded time here
  });

  it('renderReport(results) has a page for every worker, methods, data-quality accounting, references and reproducibility', () => {
    for (const w of ['W01', 'W02', 'W03', 'W04', 'W05', 'W06']) expect(pageWith(`Worker ${w}`)).toBeGreaterThan(0);
    for (const h of ['methods', 'accounting', 'references', 'reproducibility', 'overview', 'eva']) expect(pageWith(texts.headings[h])).toBeGreaterThan(0);
    expect(pageWith(texts.headings.comparisons)).toBe(-1); // the fixture has no comparisons
  });

  it('renderReport(results) generates the methods text from results.settings', () => {
    const all = runs.flat().join(' ');
    expect(all).toContain('mains notch at 50 Hz (applied forward and backward with the band-pass, so its response is squared); band-pass filter (Butterworth, order 4, 20–450 Hz, applied forward and backward');
    expect(all).toContain('Spans judged unusable (flat line, lost signal');
    expect(all).toContain('RMS envelope over a 0.1 s moving window, evaluated at 20 Hz');
    expect(all).toContain('the highest 0.5 s moving RMS across the maximal reference contractions');
    expect(all).toContain(texts.headings.referenceValues);
    expect(all).toContain('Hyndman and Fan type 7');
    expect(all).toContain('below 0.5 %MVE lasting at least 0.2 s');
    expect(all).toContain('Maximal contractions can be painful or unsafe');
  });

  it('renderReport(results) prints the settings hash as SHA-256 of the key-sorted settings JSON and every input SHA-256', () => {
    const sorted = (v: unknown): unknown => (Array.isArray(v) ? v.map(sorted) : v && typeof v === 'object'
      ? Object.fromEntries(Object.keys(v).sort().map((k) => [k, sorted((v as Record<string, unknown>)[k])])) : v);
    const hash = createHash('sha256').update(JSON.stringify(sorted(results.settings))).digest('hex');
    const all = runs.flat();
    expect(all).toContain(hash);
    for (const i of results.inputs) expect(all).toContain(i.sha256);
  });

  it('renderReport(results) never prints undefined, NaN or a replacement "?"', () => {
    for (const s of runs.flat()) {
      expect(s).not.toMatch(/undefined|NaN|\[object/);
      expect(s).not.toContain('?');
    }
  });

  it('renderReport(results) takes the document metadata from the results, not the clock', async () => {
    const doc = await PDFDocument.load(bytes, { updateMetadata: false });
    expect(doc.getTitle()).toBe(results.title);
    expect(doc.getAuthor()).toBe(results.study?.organisation);
    expect(doc.getCreationDate()?.toISOString()).toBe(new Date(results.created!).toISOString());
  });

  it('renderReport(results) gives identical bytes for the same input', async () => {
    const again = await renderReport(inventedStudy());
    expect(Buffer.compare(Buffer.from(again), Buffer.from(bytes))).toBe(0);
  });

  it('renderReport(results) does not modify its input', async () => {
    const r = inventedStudy();
    const before = JSON.stringify(r);
    await renderReport(r);
    expect(JSON.stringify(r)).toBe(before);
  });

  it('renderReport(results with comparisons) adds the comparison page with the statements', async () => {
    const r = inventedStudy();
    const rs = r.rows.filter((x) => x.muscle === 'right upper trapezius' && x.segment === 'packing');
    const per_worker = ['W01', 'W02', 'W03', 'W04', 'W05', 'W06'].map((w) => {
      const a = rs.find((x) => x.worker === w && x.condition === 'bench-fixed')!.p50, b = rs.find((x) => x.worker === w && x.condition === 'bench-adjustable')!.p50;
      return { worker: w, a, b, difference: a !== null && b !== null ? b - a : null };
    });
    // an invented comparison with the fields of lib/study/results.ts Comparison that the report reads
    r.comparisons = [{ segment: 'packing', muscle: 'right upper trapezius', measure: 'p50', unit: '%MVE', condition_a: 'bench-fixed', condition_b: 'bench-adjustable',
      paired: true, n: 6, median_difference: -2.1, ci_low: -3.4, ci_high: -0.8, p_value: 0.031, statement: 'Invented statement: lower with the adjustable bench.',
      descriptive_only: false, per_worker }] as unknown as Comparison[];
    const rr = await pdfTextRuns(await renderReport(r));
    const i = rr.findIndex((p) => p.includes(texts.headings.comparisons));
    expect(i).toBeGreaterThan(0);
    expect(rr[i].join(' ')).toContain('Invented statement: lower with the adjustable bench.');
    expect(rr[i]).toContain('−3.4 to −0.80'); // 2 decimals below 1 (the report's number rule)
    expect(rr[i]).toContain('median load'); // measure key p50 printed by name
  });
});
