// The report's fatigue section and spectra, read back from the PDF (test/report/support/pdf-text.ts)
// and the SVG files. INVENTED TEST DATA: test/report/fixtures/invented-study.ts plus fatigue blocks,
// MNF series and spectra made up here; expected texts come from templates/report.
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { chartMarks } from '../../lib/report/charts/chart-marks.js';
import { fatigueSeriesChart } from '../../lib/report/charts/fatigue-series-chart.js';
import { renderReport } from '../../lib/report/render-report.js';
import type { FatigueBlock, FatigueCategory, FatigueSeries, SpectrumResult, StudyResults } from '../../lib/study/results.js';
import { inventedStudy } from './fixtures/invented-study.js';
import { pdfTextRuns } from './support/pdf-text.js';

const texts = JSON.parse(readFileSync(new URL('../../templates/report/texts.json', import.meta.url), 'utf8'));
const refs = readFileSync(new URL('../../templates/report/references.md', import.meta.url), 'utf8');

function withFatigue(base: StudyResults): StudyResults {
  const keys = new Map<string, { worker: string; condition: string; muscle: string; signal: string; recording: string }>();
  for (const r of base.rows) keys.set(`${r.worker}|${r.condition}|${r.muscle}`, { worker: r.worker, condition: r.condition, muscle: r.muscle, signal: r.signal, recording: r.recording });
  const cats: FatigueCategory[] = ['fatigue', 'recovery', 'force-increase', 'force-decrease', 'no-clear-change', 'insufficient-data'];
  const sign: Record<string, [number, number]> = { 'fatigue': [1, -1], 'recovery': [-1, 1], 'force-increase': [1, 1], 'force-decrease': [-1, -1], 'no-clear-change': [0.1, -0.1], 'insufficient-data': [0, 0] };
  const fatigue: FatigueBlock[] = [];
  const series: FatigueSeries[] = [];
  let i = 0;
  for (const k of keys.values()) {
    for (let b = 0; b < 3; b++, i++) {
      const cat = cats[i % cats.length]!;
      const [sx, sy] = sign[cat]!;
      const none = cat === 'insufficient-data';
      const x = none ? null : sx * (0.2 + 0.05 * b), y = none ? null : sy * (0.5 + 0.1 * b);
      fatigue.push({ ...k, segment: null, start_s: b * 600, end_s: (b + 1) * 600, epochs: none ? 3 : 400, epochs_total: 600, amplitude_unit: '%MVE', amplitude_slope_unit: '%MVE/min',
        amplitude_mean: 8, amplitude_slope_per_min: x, amplitude_ci_low: x === null ? null : x - 0.1, amplitude_ci_high: x === null ? null : x + 0.1,
        mnf_mean_hz: 110, mnf_slope_hz_per_min: y, mnf_ci_low: y === null ? null : y - 0.3, mnf_ci_high: y === null ? null : y + 0.3,
        mdf_mean_hz: 100, mdf_slope_hz_per_min: y, category: cat, ci_level: 0.95, active_rule: 'invented' });
    }
    const mnf = Array.from({ length: 30 }, (_, j) => (j === 7 ? null : 110 - 0.3 * j));
    series.push({ ...k, step_s: 60, amplitude_unit: '%MVE', mnf_hz: mnf, mdf_hz: mnf, amplitude: mnf.map(() => 8), active_epochs: mnf.map(() => 50), segments: [{ label: 'packing', start_s: 0, end_s: 1200 }, { label: 'labelling', start_s: 1200, end_s: 1800 }] });
  }
  const k0 = [...keys.values()][0]!;
  const spectra: SpectrumResult[] = [{ ...k0, freq_hz: Array.from({ length: 251 }, (_, j) => 2 * j), psd: Array.from({ length: 251 }, (_, j) => (j >= 10 && j <= 225 ? 4 : 0.01)),
    suggested_band_hz: [20, 450], suggested_notch_hz: null, suggestion_reasons: ['No mains hum (invented).'], mnf_hz: 235, mdf_hz: 235, mnf_band_hz: [30, 400], bin_hz: 2, epochs: 1800, epoch_s: 1 }];
  return { ...base, fatigue, fatigue_series: series, spectra,
    fatigue_method: { epoch_s: 1, block_s: 600, band_hz: [30, 400], active_threshold_pct: 2, active_noise_factor: 3, min_epochs: 30, ci_level: 0.95,
      description: 'Invented method text. The categories describe the EMG of the muscle, not an individual\'s fatigue state.' } };
}

const dir = mkdtempSync(join(tmpdir(), 'shiftload-fatigue-report-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
let results: StudyResults;
let runs: string[][];

beforeAll(async () => {
  results = withFatigue(inventedStudy());
  runs = await pdfTextRuns(await renderReport(results, { svgDir: dir }));
});

describe('renderReport(results with fatigue, fatigue_series, fatigue_method, spectra)', () => {
  const L = texts.labels;

  it('renderReport() prints the fatigue heading, the four quadrant names on the JASA charts, and cites Luttmann et al. 2000', () => {
    const p = runs.findIndex((r) => r.includes(texts.headings.fatigue));
    expect(p).toBeGreaterThan(0);
    const section = runs.slice(p, runs.findIndex((r, i) => i > p && r.includes(texts.headings.methods))).flat();
    for (const q of [L.qFatigue, L.qRecovery, L.qForceIncrease, L.qForceDecrease]) expect(section).toContain(q);
    expect(section).toContain(texts.headings.jasa);
    expect(section).toContain(texts.headings.fatigueCounts);
    expect(section.join(' ')).toContain('Invented method text.');
    const refPage = runs.findIndex((r) => r.includes(texts.headings.references));
    expect(runs[refPage]!.join(' ')).toContain('Luttmann A, Jäger M, Laurig W. 2000');
    expect(refs).toMatch(/\[luttmann2000\].*from memory/);
  });

  it('renderReport() counts time blocks per category per muscle × condition in the table (counts equal the input)', () => {
    const p = runs.findIndex((r) => r.includes(texts.headings.fatigueCounts));
    const page = runs[p]!;
    const first = results.fatigue!.find((b) => b.segment === null)!;
    const bs = results.fatigue!.filter((b) => b.segment === null && b.muscle === first.muscle && b.condition === first.condition);
    const counts = ['fatigue', 'recovery', 'force-increase', 'force-decrease', 'no-clear-change', 'insufficient-data'].map((c) => String(bs.filter((b) => b.category === c).length));
    const at = page.indexOf(first.condition, page.indexOf(first.muscle, page.indexOf(texts.headings.fatigueCounts)));
    expect(page.slice(at + 1, at + 7)).toEqual(counts);
  });

  it('renderReport({ svgDir }) writes one MNF and one JASA SVG per muscle × condition, and the spectrum SVG with the suggested band', () => {
    const files = readdirSync(dir);
    const pairs = new Set(results.rows.map((r) => `${r.muscle}|${r.condition}`));
    expect(files.filter((f) => f.startsWith('mnf-'))).toHaveLength(pairs.size);
    expect(files.filter((f) => f.startsWith('jasa-'))).toHaveLength(pairs.size);
    const jasa = readFileSync(join(dir, files.find((f) => f.startsWith('jasa-'))!), 'utf8');
    for (const q of ['fatigue', 'recovery', 'force increase', 'force decrease', 'amplitude trend (%MVE/min)', 'MNF trend (Hz/min)']) expect(jasa).toContain(`>${q}</text>`);
    const spec = readFileSync(join(dir, files.find((f) => f.startsWith('spectrum-'))!), 'utf8');
    expect(spec).toContain('>20–450 Hz</text>');
  });

  it('renderReport() prints the spectra table with the suggested band and MNF', () => {
    const p = runs.findIndex((r) => r.includes(texts.headings.spectra));
    expect(runs[p]).toContain('20–450');
    expect(runs[p]).toContain('235');
  });

  it('renderReport() omits the fatigue section when the results carry no fatigue fields', async () => {
    const plain = await pdfTextRuns(await renderReport(inventedStudy()));
    expect(plain.findIndex((r) => r.includes(texts.headings.fatigue))).toBe(-1);
    expect(plain.flat()).not.toContain(L.qFatigue);
  });
});

describe('fatigueSeriesChart(id, series, lineLabels, caption, labels, segmentOrder)', () => {
  const s = (worker: string, segs: FatigueSeries['segments']): FatigueSeries => ({ worker, condition: 'a', muscle: 'm', signal: 's', recording: 'r', step_s: 60, amplitude_unit: '%MVE',
    mnf_hz: [100, 99, null, 97, 96], mdf_hz: [], amplitude: [], active_epochs: [], segments: segs });
  const segs = [{ label: 'packing', start_s: 0, end_s: 180 }, { label: 'labelling', start_s: 180, end_s: 300 }];

  it('fatigueSeriesChart() puts point k at (k + 0.5)·step_s in minutes, breaks the line at null, ends each line in its label, draws shared segments as bands', () => {
    const chart = fatigueSeriesChart('c', [s('W1', segs), s('W2', segs)], ['W1', 'W2'], 'cap', { timeMin: 'min', mnf: 'MNF (Hz)' }, ['packing', 'labelling']);
    const line = chart.series[0]!;
    expect(line.kind === 'line' && line.xs).toEqual([0.5, 1.5, 2.5, 3.5, 4.5]);
    expect(chart.bands.map((b) => [b.label, b.x0, b.x1])).toEqual([['packing', 0, 3], ['labelling', 3, 5]]);
    expect(chart.series.map((l) => l.kind === 'line' && l.endLabel)).toEqual(['W1', 'W2']);
    // dash patterns differ, so the lines differ without colour
    expect(JSON.stringify(chart.series[0]!.style.dash)).not.toBe(JSON.stringify(chart.series[1]!.style.dash));
    const { marks } = chartMarks(chart, (t, z) => t.length * z * 0.5);
    const dark = marks.filter((m) => m.k === 'path' && m.stroke === chart.series[0]!.style.color && m.pts.length >= 4 && !m.close);
    expect(dark.length).toBe(2 + 1); // two runs around the null step + the legend swatch
  });

  it('fatigueSeriesChart() leaves the bands out when the workers\' segments differ', () => {
    const chart = fatigueSeriesChart('c', [s('W1', segs), s('W2', [{ label: 'packing', start_s: 0, end_s: 300 }])], ['W1', 'W2'], 'cap', { timeMin: 'min', mnf: 'MNF (Hz)' }, []);
    expect(chart.bands).toEqual([]);
  });
});
