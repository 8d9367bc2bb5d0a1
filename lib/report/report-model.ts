// The report model: plain data (pages → blocks: headings, paragraphs, tables, charts, cautions)
// built from StudyResults. No drawing here; layoutReport() places it, renderPdf() draws it, and
// tests read it without pdf-lib. Wording comes from templates/report (loadReportTexts).
import type { EnvelopeTrace, Finding, ResultRow, StudyResults } from '../study/results.js';
import { canonicalJson, settingsHash } from './canonical-json.js';
import { apdfChart } from './charts/apdf-chart.js';
import type { ChartModel } from './charts/chart-model.js';
import { evaChart } from './charts/eva-chart.js';
import { groupBarsChart, type BarGroup } from './charts/group-bars-chart.js';
import { pairedChart } from './charts/paired-chart.js';
import { spectrumChart } from './charts/spectrum-chart.js';
import { fatigueSeriesChart } from './charts/fatigue-series-chart.js';
import { jasaChart } from './charts/jasa-chart.js';
import { timelineChart } from './charts/timeline-chart.js';
import { fillRequired, fillTemplate, type TemplateVars } from './fill-template.js';
import { formatHours, formatMinutes, formatNumber, formatSetting } from './format-number.js';
import { medianRange } from './median-range.js';
import { readComparisons, type ReportComparison } from './read-comparisons.js';
import { loadReportTexts, type ReportTexts } from './report-texts.js';
import { flattenSettings, settingAt } from './setting-at.js';
import { SETTINGS_TABLE } from '../job/defaults.js';

export interface TableColumn {
  label: string;
  /** Share of the content width (the columns' shares are scaled to sum to 1). */
  width: number;
  align?: 'left' | 'right';
}

export type Block =
  | { type: 'title'; text: string; lines: string[] }
  | { type: 'heading'; level: 1 | 2 | 3; text: string }
  | { type: 'paragraph'; text: string; small?: boolean }
  | { type: 'bullets'; items: string[]; small?: boolean }
  | { type: 'caution'; title: string; items: string[] }
  | { type: 'table'; columns: TableColumn[]; rows: string[][]; small?: boolean }
  | { type: 'charts'; charts: ChartModel[] };

/** A logical page: starts on a new sheet; its blocks flow onto further sheets as needed. */
export interface ReportPage { id: string; blocks: Block[] }

export interface ReportMeta {
  title: string;
  author: string;
  subject: string;
  keywords: string[];
  /** ISO date-time from the results (never the clock); undefined when the results carry none. */
  creationDate?: string;
  creator: string;
}

export interface ReportModel { meta: ReportMeta; pages: ReportPage[] }

const PCT = { static: 'p10', median: 'p50', peak: 'p90' } as const;

/** Distinct values in first-appearance order, with `preferred` (when given) first in its order. */
function ordered(values: Iterable<string>, preferred: string[] = []): string[] {
  const seen = new Set<string>();
  for (const v of values) seen.add(v);
  const out = preferred.filter((p) => seen.has(p));
  for (const v of seen) if (!out.includes(v)) out.push(v);
  return out;
}

const num = (row: ResultRow, key: string): number | null => {
  const v = (row as unknown as Record<string, unknown>)[key];
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
};

/** Stable id fragment for SVG file names. */
const slug = (s: string) => s.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'x';

/**
 * Build the report model from validated results.
 * @param results a shiftload-results/1 object (validate with assertResults first)
 * @example const model = buildReportModel(results); model.pages[0].blocks[0] // title block
 */
export function buildReportModel(results: StudyResults, texts: ReportTexts = loadReportTexts()): ReportModel {
  const { t } = texts;
  const L = t.labels as Record<string, string>;
  const rows = results.rows;
  const study = results.study ?? {};
  const segments = ordered(rows.map((r) => r.segment), study.segment_order).filter((s) => s !== 'all');
  const conditions = ordered(rows.map((r) => r.condition));
  const muscles = ordered(rows.map((r) => r.muscle));
  const workers = ordered(rows.map((r) => r.worker)).sort((a, b) => a.localeCompare(b, 'en', { numeric: true }));
  const units = ordered(rows.map((r) => r.unit));
  const unit = units.join(', ');
  const usedRefs = new Set<string>();
  const cite = (...keys: string[]) => keys.forEach((k) => usedRefs.add(k));
  const rowsOf = (muscle: string, segment: string, condition: string) =>
    rows.filter((r) => r.muscle === muscle && r.segment === segment && r.condition === condition);
  const gapMin = settingAt(results.settings, ['gap_min_s', 'gaps.min_duration_s', 'gap.min_duration_s']);
  const gapThreshold = rows.length ? rows[0].gap_threshold : undefined;
  const sameThreshold = rows.every((r) => r.gap_threshold === gapThreshold && r.unit === rows[0].unit);

  // ---------------------------------------------------------------- page 1: committee summary
  const p1: Block[] = [];
  const dates = study.start_date ? (study.end_date && study.end_date !== study.start_date ? `${study.start_date} to ${study.end_date}` : study.start_date) : undefined;
  const join = (...parts: (string | null)[]) => parts.filter((x): x is string => x !== null).join(' · ') || null;
  const titleLines = [
    join(fillTemplate(t.titleBlock.site, { site: study.site }), fillTemplate(t.titleBlock.dates, { dates })),
    join(fillTemplate(t.titleBlock.organisation, { organisation: study.organisation }),
      fillTemplate(t.titleBlock.generated, { created: results.created?.replace('T', ' ').replace(/:\d\d(\.\d+)?Z$/, ' UTC'), version: results.tool.version })),
    study.description ?? null,
  ].filter((x): x is string => x !== null);
  p1.push({ type: 'title', text: results.title, lines: titleLines });
  p1.push({ type: 'heading', level: 2, text: t.headings.who });
  const recordedS = recordedSeconds(rows);
  p1.push({ type: 'paragraph', small: true, text: fillRequired(t.who, {
    nWorkers: workers.length, nConditions: conditions.length, conditions: conditions.join(', '), muscles: muscles.join(', '),
    hours: formatHours(recordedS), segments: segments.join(', ') || '–',
  }) });
  p1.push({ type: 'heading', level: 2, text: t.headings.figures });
  const intro = fillTemplate(t.figuresIntro, { nWorkers: workers.length, gapMin: typeof gapMin === 'number' ? formatSetting(gapMin) : undefined, gapThreshold: sameThreshold && gapThreshold !== undefined ? formatSetting(gapThreshold) : undefined, unit: units[0] });
  if (intro) p1.push({ type: 'paragraph', text: intro, small: true });
  for (const m of muscles) {
    const items: string[] = [];
    for (const s of segments) for (const c of conditions) {
      const rs = rowsOf(m, s, c);
      if (!rs.length) continue;
      const p50 = medianRange(rs.map((r) => num(r, PCT.median)));
      const gpm = medianRange(rs.map((r) => r.gaps_per_min));
      const line = fillTemplate(t.figureSentence, {
        muscle: m, segment: s, condition: c, unit: rs[0].unit,
        p50: p50 && formatNumber(p50.median), p50min: p50 && formatNumber(p50.min), p50max: p50 && formatNumber(p50.max),
        gaps: gpm && formatNumber(gpm.median), gapsmin: gpm && formatNumber(gpm.min), gapsmax: gpm && formatNumber(gpm.max),
        nNote: rs.length === workers.length ? '' : fillRequired(t.figureN, { n: rs.length }),
      });
      if (line) items.push(line);
    }
    if (items.length) p1.push({ type: 'heading', level: 3, text: cap(m) }, { type: 'bullets', items, small: true });
  }
  p1.push({ type: 'heading', level: 2, text: t.headings.context });
  p1.push({ type: 'paragraph', text: (t.context as string[])[0], small: true });
  cite('jonsson1982', 'hansson2010');
  const nonMve = units.filter((u) => u !== '%MVE');
  if (nonMve.length) p1.push({ type: 'paragraph', text: fillRequired(t.contextUnitNote, { unit: nonMve.join(', ') }), small: true });
  p1.push({ type: 'heading', level: 2, text: t.headings.quality });
  p1.push({ type: 'paragraph', small: true, text: qualitySentence(results, texts, recordedS) });
  p1.push({ type: 'caution', title: t.headings.cautions, items: texts.cautions });
  // The comparison in brief follows the cautions, so they stay on the first sheet.
  p1.push(...comparisonBrief(readComparisons(results), texts, { muscles, segments }));

  // ---------------------------------------------------------------- overview charts + table
  const pOverview: Block[] = [{ type: 'heading', level: 1, text: t.headings.overview }, { type: 'paragraph', text: t.overviewIntro, small: true }];
  const ctxBlocks: Block[] = [{ type: 'heading', level: 2, text: t.headings.context }, ...(t.context as string[]).map((text): Block => ({ type: 'paragraph', text, small: true }))];
  for (const m of muscles) {
    const mUnit = rows.find((r) => r.muscle === m)?.unit ?? unit;
    const levelGroups: BarGroup[] = segments.map((s) => ({ label: s, clusters: (['static', 'median', 'peak'] as const).map((lv) => ({ label: L[lv], values: conditions.map((c) => medianRange(rowsOf(m, s, c).map((r) => num(r, PCT[lv])))) })) }));
    pOverview.push({ type: 'charts', charts: [groupBarsChart(`levels-${slug(m)}`, levelGroups, conditions, `${L.load} (${mUnit})`, fillRequired(t.captions.levels, { muscle: cap(m), unit: mUnit }), 483, 165)] });
    const gapGroups: BarGroup[] = segments.map((s) => ({ label: s, clusters: [{ label: '', values: conditions.map((c) => medianRange(rowsOf(m, s, c).map((r) => r.gaps_per_min))) }] }));
    pOverview.push({ type: 'charts', charts: [groupBarsChart(`gaps-${slug(m)}`, gapGroups, conditions, L.gapsPerMin, fillRequired(t.captions.gapsBars, { muscle: cap(m) }), 483, 130)] });
  }
  // table: medians across workers beside the historical values
  const ctxRows: string[][] = [];
  if (units.every((u) => u === '%MVE')) ctxRows.push([t.contextTableRow, '', '', '2–5', '10–14', '50–70', '', '']);
  let prevM = '', prevS = '';
  for (const m of muscles) for (const s of [...segments, 'all']) for (const c of conditions) {
    const rs = rowsOf(m, s, c);
    if (!rs.length) continue;
    const showM = m !== prevM, showS = showM || s !== prevS;
    prevM = m; prevS = s;
    const f = (k: string) => { const v = medianRange(rs.map((r) => num(r, k))); return v ? `${formatNumber(v.median)} (${formatNumber(v.min)}–${formatNumber(v.max)})` : '–'; };
    ctxRows.push([showM ? m : '', showS ? s : '', c, f('p10'), f('p50'), f('p90'), (() => { const v = medianRange(rs.map((r) => r.gaps_per_min)); return v ? formatNumber(v.median) : '–'; })(), (() => { const v = medianRange(rs.map((r) => r.rest_pct)); return v ? formatNumber(v.median) : '–'; })()]);
  }
  pOverview.push(...ctxBlocks, { type: 'table', small: true, columns: [
    { label: L.muscle, width: 1.3 }, { label: L.segment, width: 0.85 }, { label: L.condition, width: 1.25 },
    { label: `${L.static} (${unit})`, width: 1.1, align: 'right' }, { label: `${L.median} (${unit})`, width: 1.15, align: 'right' },
    { label: `${L.peak} (${unit})`, width: 1.25, align: 'right' }, { label: L.gapsPerMin, width: 0.55, align: 'right' }, { label: L.rest, width: 0.5, align: 'right' },
  ], rows: ctxRows });

  // ---------------------------------------------------------------- EVA
  const pEva: Block[] = [];
  if (results.eva.length) {
    pEva.push({ type: 'heading', level: 1, text: t.headings.eva }, { type: 'paragraph', text: t.evaIntro, small: true });
    cite('mathiassen1991');
    const charts: ChartModel[] = [];
    for (const m of muscles) for (const c of conditions) {
      const ms = results.eva.filter((e) => e.muscle === m && e.condition === c && e.segment === 'all');
      if (!ms.length) continue;
      const e0 = ms[0];
      const pooled = e0.percent_time.map((row, a) => row.map((_, d) => medianRange(ms.map((e) => e.percent_time[a]?.[d]))?.median ?? 0));
      charts.push(evaChart(`eva-${slug(m)}-${slug(c)}`, pooled, e0.amplitude_edges, e0.duration_edges_s, e0.unit,
        fillRequired(t.captions.eva, { muscle: m, segment: 'whole recording', condition: c }), { amplitude: L.amplitudeClass, duration: L.durationClass }));
    }
    for (let i = 0; i < charts.length; i += 2) pEva.push({ type: 'charts', charts: charts.slice(i, i + 2) });
  }

  // ---------------------------------------------------------------- comparisons (optional)
  const comparisons = readComparisons(results);
  const pCmp: Block[] = comparisons.length ? comparisonBlocks(comparisons, texts) : [];

  // ---------------------------------------------------------------- fatigue indicators (optional)
  const pFatigue = fatigueBlocks(results, texts, { conditions, muscles, workers, segments }, cite);

  // ---------------------------------------------------------------- spectra (optional)
  const pSpec: Block[] = [];
  if (results.spectra?.length) {
    pSpec.push({ type: 'heading', level: 1, text: t.headings.spectra });
    const s0 = results.spectra[0]!;
    const bandUsed = settingAt(results.settings, ['band_hz']);
    if (s0.epoch_s !== undefined && s0.bin_hz !== undefined) pSpec.push({ type: 'paragraph', small: true, text: fillRequired(t.spectraIntro, {
      epoch: formatSetting(s0.epoch_s), bin: formatSetting(s0.bin_hz), used: Array.isArray(bandUsed) ? bandUsed.map((v) => formatSetting(v as number)).join('–') : L.notRecorded }) });
    if (results.spectra.some((sp) => sp.suggested_band_hz)) {
      const band = (sp: { suggested_band_hz?: [number, number] }) => sp.suggested_band_hz ? `${formatNumber(sp.suggested_band_hz[0], 0)}–${formatNumber(sp.suggested_band_hz[1], 0)}` : '–';
      pSpec.push({ type: 'table', small: true, columns: [
        { label: L.worker, width: 0.6 }, { label: L.condition, width: 1.2 }, { label: L.muscle, width: 1.6 }, { label: L.suggestedBand, width: 1, align: 'right' },
        { label: L.suggestedNotch, width: 0.6, align: 'right' }, { label: L.mnf, width: 0.6, align: 'right' }, { label: L.mdf, width: 0.6, align: 'right' },
      ], rows: results.spectra.map((sp) => [sp.worker, sp.condition, sp.muscle, band(sp), sp.suggested_notch_hz ? formatNumber(sp.suggested_notch_hz, 0) : '–',
        typeof sp.mnf_hz === 'number' ? formatNumber(sp.mnf_hz, 0) : '–', typeof sp.mdf_hz === 'number' ? formatNumber(sp.mdf_hz, 0) : '–']) });
      const reasons = ordered(results.spectra.flatMap((sp) => sp.suggestion_reasons ?? []));
      if (reasons.length && reasons.length <= 6) pSpec.push({ type: 'bullets', small: true, items: reasons });
    }
    const charts = results.spectra.map((s, i) => spectrumChart(`spectrum-${i + 1}-${slug(s.worker)}-${slug(s.condition)}-${slug(s.muscle)}`, s,
      fillRequired(t.captions.spectrum, { muscle: s.muscle, worker: s.worker, condition: s.condition, band: s.suggested_band_hz ? `${formatNumber(s.suggested_band_hz[0], 0)}–${formatNumber(s.suggested_band_hz[1], 0)} Hz` : L.none }),
      { frequency: L.frequency, psd: L.psd }));
    for (let i = 0; i < charts.length; i += 2) pSpec.push({ type: 'charts', charts: charts.slice(i, i + 2) });
  }

  // ---------------------------------------------------------------- per-worker pages
  const workerPages: ReportPage[] = workers.map((w) => workerPage(w, results, texts, { segments, conditions, muscles }));

  // ---------------------------------------------------------------- methods, accounting, references, reproducibility
  const pMethods = methodsBlocks(results, texts, cite);
  const pAccount = accountingBlocks(results, texts, workers, conditions, muscles);
  const pRefs: Block[] = [{ type: 'heading', level: 1, text: t.headings.references }, { type: 'bullets', small: true,
    items: [...texts.references.entries()].filter(([k]) => usedRefs.has(k)).map(([, v]) => v) }];
  const pRepro = reproBlocks(results, texts);

  const pages: ReportPage[] = [
    { id: 'summary', blocks: p1 },
    { id: 'overview', blocks: pOverview },
    ...(pEva.length ? [{ id: 'eva', blocks: pEva }] : []),
    ...(pCmp.length ? [{ id: 'comparisons', blocks: pCmp }] : []),
    ...workerPages,
    ...(pFatigue.length ? [{ id: 'fatigue', blocks: pFatigue }] : []),
    ...(pSpec.length ? [{ id: 'spectra', blocks: pSpec }] : []),
    { id: 'methods', blocks: pMethods },
    { id: 'accounting', blocks: pAccount },
    { id: 'references', blocks: [...pRefs, ...pRepro] },
  ];
  return {
    meta: {
      title: results.title,
      author: study.organisation ?? 'shiftload',
      subject: `Surface-EMG exposure report: ${workers.length} workers, ${conditions.join(' / ')}, ${muscles.join(', ')}`,
      keywords: ['surface EMG', 'exposure', 'APDF', 'EMG gaps', ...conditions, ...muscles],
      creationDate: results.created,
      creator: `shiftload ${results.tool.version}`,
    },
    pages,
  };
}

/**
 * The fatigue section: MNF over the recording (one chart per muscle × condition, one line per
 * worker), the JASA plane of the time blocks, a count of blocks per category, and the method text
 * from results.fatigue_method. Empty when the results carry no fatigue analysis.
 */
function fatigueBlocks(results: StudyResults, texts: ReportTexts, k: { conditions: string[]; muscles: string[]; workers: string[]; segments: string[] }, cite: (...keys: string[]) => void): Block[] {
  const { fatigue, fatigue_series: series, fatigue_method: method } = results;
  if (!fatigue || !series || !method || (!fatigue.length && !series.length)) return [];
  const { t } = texts;
  const L = t.labels as Record<string, string>;
  const C = t.captions as Record<string, string>;
  cite('luttmann2000');
  const blocks: Block[] = [{ type: 'heading', level: 1, text: t.headings.fatigue }, { type: 'paragraph', small: true, text: t.fatigueIntro },
    { type: 'paragraph', small: true, text: method.description }, { type: 'caution', title: t.headings.cautions, items: [t.fatigueCare] }];
  const byWorker = (a: { worker: string }, b: { worker: string }) => k.workers.indexOf(a.worker) - k.workers.indexOf(b.worker) || a.worker.localeCompare(b.worker, 'en', { numeric: true });
  const pairs: [string, string][] = [];
  const muscles = ordered([...series.map((s) => s.muscle), ...fatigue.map((b) => b.muscle)], k.muscles);
  const conditions = ordered([...series.map((s) => s.condition), ...fatigue.map((b) => b.condition)], k.conditions);
  for (const m of muscles) for (const c of conditions) if (series.some((s) => s.muscle === m && s.condition === c) || fatigue.some((b) => b.muscle === m && b.condition === c)) pairs.push([m, c]);

  // MNF over the recording
  const mnfCharts: ChartModel[] = [];
  for (const [m, c] of pairs) {
    const ss = series.filter((s) => s.muscle === m && s.condition === c).sort(byWorker);
    if (!ss.length || !ss.some((s) => s.mnf_hz.some((v) => v !== null))) continue;
    const labels = ss.map((s) => (ss.filter((o) => o.worker === s.worker).length > 1 ? `${s.worker} ${s.recording}` : s.worker));
    const chart = fatigueSeriesChart(`mnf-${slug(m)}-${slug(c)}`, ss, labels, '', { timeMin: L.timeFromStart, mnf: L.mnf }, k.segments);
    chart.caption = fillRequired(C.fatigueSeries, { muscle: m, condition: c, step: formatSetting(ss[0]!.step_s), bands: chart.bands.length ? C.fatigueBands : C.fatigueNoBands });
    mnfCharts.push(chart);
  }
  if (mnfCharts.length) {
    blocks.push({ type: 'heading', level: 2, text: t.headings.fatigueSeries });
    for (let i = 0; i < mnfCharts.length; i += 2) blocks.push({ type: 'charts', charts: mnfCharts.slice(i, i + 2) });
  }

  // JASA plane of the time blocks
  const timeBlocks = fatigue.filter((b) => b.segment === null);
  const jasaCharts: ChartModel[] = [];
  const jl = { amplitude: L.amplitudeTrend, mnf: L.mnfTrend, fatigue: L.qFatigue, recovery: L.qRecovery, forceIncrease: L.qForceIncrease, forceDecrease: L.qForceDecrease, clear: L.clearTrend, unclear: L.noClearChange, interval: L.interval };
  for (const [m, c] of pairs) {
    const bs = timeBlocks.filter((b) => b.muscle === m && b.condition === c);
    if (!bs.length) continue;
    const left = bs.filter((b) => b.category === 'insufficient-data' || b.amplitude_slope_per_min === null || b.mnf_slope_hz_per_min === null).length;
    if (left === bs.length) continue;
    jasaCharts.push(jasaChart(`jasa-${slug(m)}-${slug(c)}`, bs, fillRequired(C.jasa, {
      muscle: m, condition: c, block: formatSetting(method.block_s / 60), unit: bs[0]!.amplitude_slope_unit,
      left: left ? fillRequired(C.jasaLeft, { n: left }) : '',
    }), jl));
  }
  if (jasaCharts.length) {
    blocks.push({ type: 'heading', level: 2, text: t.headings.jasa });
    for (let i = 0; i < jasaCharts.length; i += 2) blocks.push({ type: 'charts', charts: jasaCharts.slice(i, i + 2) });
  }

  // blocks per category
  if (timeBlocks.length) {
    const cats = ['fatigue', 'recovery', 'force-increase', 'force-decrease', 'no-clear-change', 'insufficient-data'] as const;
    const catLabel: Record<string, string> = { 'fatigue': L.qFatigue, 'recovery': L.qRecovery, 'force-increase': L.qForceIncrease, 'force-decrease': L.qForceDecrease, 'no-clear-change': L.noClearChange, 'insufficient-data': L.insufficientData };
    const rows: string[][] = [];
    for (const [m, c] of pairs) {
      const bs = timeBlocks.filter((b) => b.muscle === m && b.condition === c);
      if (bs.length) rows.push([m, c, ...cats.map((cat) => String(bs.filter((b) => b.category === cat).length))]);
    }
    blocks.push({ type: 'heading', level: 2, text: t.headings.fatigueCounts }, { type: 'table', small: true, columns: [
      { label: L.muscle, width: 1.5 }, { label: L.condition, width: 1.2 }, ...cats.map((cat) => ({ label: catLabel[cat]!, width: 0.62, align: 'right' as const })),
    ], rows });
  }
  return blocks;
}

function cap(s: string): string { return s ? s[0].toUpperCase() + s.slice(1) : s; }

/** Recorded time: each recording counted once (its "all" row, or the longest row), seconds. */
function recordedSeconds(rows: ResultRow[]): number {
  const per = new Map<string, number>();
  for (const r of rows) {
    const key = `${r.worker}\u0000${r.condition}\u0000${r.recording}`;
    const d = r.segment === 'all' ? rowSpan(r) : 0;
    per.set(key, Math.max(per.get(key) ?? 0, d));
  }
  let s = 0;
  for (const v of per.values()) s += v;
  return s;
}

function qualitySentence(results: StudyResults, texts: ReportTexts, recordedS: number): string {
  const f = results.findings;
  const off = (results.settings.quality as { enabled?: boolean } | undefined)?.enabled === false;
  if (off) return f.length ? `${texts.t.qualityOff} ${fillRequired(texts.t.qualityOffFindings, { n: f.length })}` : texts.t.qualityOff;
  if (!f.length) return texts.t.qualityNone;
  // excluded time: per recording×signal from the "all" rows, averaged over channels of a recording
  let total = 0, excluded = 0;
  for (const r of results.rows) if (r.segment === 'all') { total += rowSpan(r); excluded += Math.max(0, rowSpan(r) - r.valid_s); }
  void recordedS;
  return fillRequired(texts.t.qualitySummary, {
    nFindings: f.length, nWarnings: f.filter((x) => x.severity === 'warning').length, nErrors: f.filter((x) => x.severity === 'error').length,
    excluded: `${formatMinutes(excluded)} min`, total: `${formatHours(total)} h`,
  });
}

function workerPage(w: string, results: StudyResults, texts: ReportTexts, o: { segments: string[]; conditions: string[]; muscles: string[] }): ReportPage {
  const { t } = texts;
  const L = t.labels as Record<string, string>;
  const segs = [...o.segments, 'all'];
  const wr = results.rows.filter((r) => r.worker === w).sort((a, b) =>
    o.conditions.indexOf(a.condition) - o.conditions.indexOf(b.condition) || o.muscles.indexOf(a.muscle) - o.muscles.indexOf(b.muscle) || segs.indexOf(a.segment) - segs.indexOf(b.segment));
  const wUnits = ordered(wr.map((r) => r.unit));
  const uniform = wr.every((r) => r.gap_threshold === wr[0]?.gap_threshold && r.unit === wr[0]?.unit);
  const threshold = uniform && wr.length ? fillRequired(t.workerThreshold, { value: formatSetting(wr[0].gap_threshold), unit: wr[0].unit }) : t.workerThresholdVaries;
  const blocks: Block[] = [{ type: 'heading', level: 1, text: fillRequired(t.headings.worker, { worker: w }) },
    { type: 'paragraph', text: fillRequired(t.workerIntro, { unit: wUnits.join(', '), threshold }), small: true }];
  const columns: TableColumn[] = [
    { label: L.condition, width: 1.2 }, { label: L.muscle, width: 1.55 }, { label: L.segment, width: 1.0 }, { label: L.valid, width: 0.6, align: 'right' },
    { label: L.static, width: 0.55, align: 'right' }, { label: L.median, width: 0.6, align: 'right' }, { label: L.peak, width: 0.5, align: 'right' },
    { label: L.gapsPerMin, width: 0.62, align: 'right' }, { label: L.rest, width: 0.5, align: 'right' }, { label: L.longest, width: 0.8, align: 'right' },
    { label: L.sustained, width: 0.8, align: 'right' },
  ];
  if (!uniform) columns.push({ label: L.threshold, width: 0.75, align: 'right' });
  let prev = '';
  blocks.push({ type: 'table', small: true, columns, rows: wr.map((r) => {
    const group = `${r.condition}\u0000${r.muscle}`;
    const first = group !== prev;
    prev = group;
    const cells = [first ? r.condition : '', first ? r.muscle : '', r.segment, formatMinutes(r.valid_s), formatNumber(num(r, 'p10')), formatNumber(num(r, 'p50')), formatNumber(num(r, 'p90')),
      formatNumber(r.gaps_per_min), formatNumber(r.rest_pct), formatNumber(r.longest_without_gap_s, 0), formatNumber(r.sustained_pct)];
    if (!uniform) cells.push(`${formatSetting(r.gap_threshold)} ${r.unit}`);
    return cells;
  }) });
  const traces = results.traces.filter((x) => x.worker === w).sort((a, b) => o.conditions.indexOf(a.condition) - o.conditions.indexOf(b.condition) || o.muscles.indexOf(a.muscle) - o.muscles.indexOf(b.muscle));
  for (const tr of traces) blocks.push({ type: 'charts', charts: [traceChart(tr, texts, o.segments)] });
  const apdfCharts: ChartModel[] = [];
  for (const c of o.conditions) for (const m of o.muscles) {
    const curves = o.segments.map((s) => results.apdf.find((a) => a.worker === w && a.condition === c && a.muscle === m && a.segment === s)).filter((a) => a !== undefined);
    if (!curves.length) continue;
    apdfCharts.push(apdfChart(`apdf-${slug(w)}-${slug(c)}-${slug(m)}`, curves.map((a) => ({ segment: a.segment, levels: a.levels })), curves[0].unit,
      fillRequired(t.captions.apdf, { muscle: m, worker: w, condition: c }),
      { load: L.load, probability: L.probability, static: `${L.static} 10 %`, median: `${L.median} 50 %`, peak: `${L.peak} 90 %` }, o.segments));
  }
  for (let i = 0; i < apdfCharts.length; i += 2) blocks.push({ type: 'charts', charts: apdfCharts.slice(i, i + 2) });
  return { id: `worker-${slug(w)}`, blocks };
}

function traceChart(tr: EnvelopeTrace, texts: ReportTexts, segments: string[]): ChartModel {
  const { t } = texts;
  const L = t.labels as Record<string, string>;
  const step = formatSetting(tr.step_s);
  return timelineChart(`timeline-${slug(tr.worker)}-${slug(tr.condition)}-${slug(tr.muscle)}`, tr,
    fillRequired(t.captions.timeline, { muscle: tr.muscle, worker: tr.worker, condition: tr.condition, step, unit: tr.unit }),
    { time: L.time, timeMin: L.timeMin, load: L.load, mean: `${step} s mean`, max: `${step} s maximum` }, segments);
}

/** Measures whose comparisons get statements and paired charts (the page-1 figures); the table lists all. */
const PRIMARY_MEASURES = ['p50', 'gaps_per_min'];

/**
 * Page 1: one line per muscle × task summarising the comparisons of the primary measures (median
 * load, gap frequency): in how many workers the value was lower and higher in the second condition,
 * and the median difference. Counts are read from per_worker (b < a, b > a). Empty without comparisons.
 */
function comparisonBrief(cmp: ReportComparison[], texts: ReportTexts, k: { muscles: string[]; segments: string[] }): Block[] {
  const B = texts.t.comparisonBrief as Record<string, string>;
  const primary = cmp.filter((c) => PRIMARY_MEASURES.includes(c.measure));
  if (!primary.length) return [];
  const pairKey = (c: ReportComparison) => `${c.condition_a}\u0000${c.condition_b}`;
  const onePair = new Set(primary.map(pairKey)).size === 1;
  const items: string[] = [];
  for (const m of ordered(primary.map((c) => c.muscle), k.muscles)) {
    // tasks only: the whole recording ('all') mixes them and is listed on the comparison page
    for (const sg of ordered(primary.filter((c) => c.muscle === m && c.segment !== 'all').map((c) => c.segment), k.segments)) {
      const mine = primary.filter((c) => c.muscle === m && c.segment === sg);
      for (const pk of ordered(mine.map(pairKey))) {
        const cs = PRIMARY_MEASURES.flatMap((ms) => mine.filter((c) => pairKey(c) === pk && c.measure === ms));
        const parts = cs.map((c) => {
          const diff = c.median_difference === null ? '–' : (c.median_difference > 0 ? '+' : '') + formatNumber(c.median_difference);
          const vars = { measure: measureName(c.measure, texts), n: c.n, diff, unit: c.unit };
          const both = c.per_worker.filter((p) => p.a !== null && p.b !== null);
          const text = c.paired && both.length
            ? fillRequired(B.paired, { ...vars, n: both.length, lower: both.filter((p) => p.b! < p.a!).length, higher: both.filter((p) => p.b! > p.a!).length })
            : fillRequired(B.unpaired, vars);
          return text + (c.descriptive_only ? B.descriptive : '');
        });
        const c0 = cs[0]!;
        items.push(fillRequired(B.line, { muscle: cap(m), segment: sg, pair: onePair ? '' : fillRequired(B.pair, { a: c0.condition_a, b: c0.condition_b }), parts: parts.join('; ') }));
      }
    }
  }
  const c0 = primary[0]!;
  return [
    { type: 'heading', level: 2, text: texts.t.headings.comparisonBrief },
    { type: 'paragraph', small: true, text: onePair ? fillRequired(B.intro, { a: c0.condition_a, b: c0.condition_b }) : B.introMixed },
    { type: 'bullets', small: true, items },
  ];
}

function comparisonBlocks(cmp: ReportComparison[], texts: ReportTexts): Block[] {
  const { t } = texts;
  const L = t.labels as Record<string, string>;
  const blocks: Block[] = [{ type: 'heading', level: 1, text: t.headings.comparisons }, { type: 'paragraph', text: t.comparisonsIntro, small: true }];
  const primary = cmp.some((c) => PRIMARY_MEASURES.includes(c.measure)) ? cmp.filter((c) => PRIMARY_MEASURES.includes(c.measure)) : cmp;
  for (const m of ordered(primary.map((c) => c.muscle))) {
    const mine = primary.filter((c) => c.muscle === m);
    blocks.push({ type: 'heading', level: 2, text: cap(m) });
    blocks.push({ type: 'bullets', small: true, items: mine.map((c) => `${cap(c.segment)}, ${measureName(c.measure, texts)}: ${c.statement}${c.descriptive_only ? ' ' + t.comparisonDescriptive : ''}`) });
    const charts: ChartModel[] = [];
    mine.forEach((c) => {
      if (!c.per_worker.length) return;
      charts.push(pairedChart(`paired-${slug(c.muscle)}-${slug(c.segment)}-${slug(c.measure)}`, c.per_worker, c.condition_a, c.condition_b, `${measureName(c.measure, texts)} (${c.unit})`,
        fillRequired(t.captions.paired, { measure: cap(measureName(c.measure, texts)), muscle: c.muscle, segment: c.segment, unit: c.unit, a: c.condition_a, b: c.condition_b }), 160, 150));
    });
    for (let i = 0; i < charts.length; i += 3) blocks.push({ type: 'charts', charts: charts.slice(i, i + 3) });
  }
  blocks.push({ type: 'heading', level: 2, text: t.headings.comparisonTable });
  blocks.push({ type: 'table', small: true, columns: [
    { label: L.muscle, width: 1.3 }, { label: L.segment, width: 0.9 }, { label: L.measure, width: 1.0 }, { label: `${L.condition} A → B`, width: 1.4 },
    { label: L.n, width: 0.3, align: 'right' }, { label: L.difference, width: 0.9, align: 'right' }, { label: L.ci, width: 1.25, align: 'right' }, { label: L.pValue, width: 0.5, align: 'right' },
  ], rows: cmp.map((c) => [c.muscle, c.segment, measureName(c.measure, texts), `${c.condition_a} → ${c.condition_b}`, String(c.n), `${formatNumber(c.median_difference)} ${c.unit}`,
    c.descriptive_only || c.ci_low === null || c.ci_high === null ? '–' : `${formatNumber(c.ci_low)} to ${formatNumber(c.ci_high)}`, c.p_value === null ? '–' : formatP(c.p_value)]) });
  return blocks;
}

/** Plain name of a ResultRow measure key (p50 → "median load"); other percentiles as "P<q> load". */
function measureName(key: string, texts: ReportTexts): string {
  const named = (texts.t.measures as Record<string, string>)[key];
  if (named) return named;
  const m = /^p(\d+(?:\.\d+)?)$/.exec(key);
  return m ? `${m[1]}th-percentile load` : key;
}

function formatP(p: number): string { return p < 0.001 ? '< 0.001' : formatNumber(p, p < 0.01 ? 3 : 2); }

function methodsBlocks(results: StudyResults, texts: ReportTexts, cite: (...k: string[]) => void): Block[] {
  const { t } = texts;
  const M = t.methods as Record<string, string>;
  const s = results.settings;
  const L = t.labels as Record<string, string>;
  // Paths: the flat keys of lib/job/defaults.ts first, then older nested spellings.
  const get = (...paths: string[]) => settingAt(s, paths);
  const fmt = (v: unknown) => (typeof v === 'number' ? formatSetting(v) : typeof v === 'string' ? v : typeof v === 'boolean' ? String(v) : undefined);
  const band = get('band_hz', 'filter.band_hz', 'bandpass.band_hz') as number[] | undefined;
  const zero = get('zero_phase', 'filter.zero_phase', 'bandpass.zero_phase');
  const notch = get('mains_hz', 'filter.notch_hz', 'notch.freq_hz', 'notch_hz');
  const harmonics = get('mains_harmonics');
  const noiseOn = get('noise_correction.enabled', 'noise.enabled', 'noise_correction');
  const normMethod = String(get('normalize', 'normalization.method', 'normalize.method') ?? results.rows[0]?.unit ?? '').toLowerCase();
  const normText = /mve|mvc/.test(normMethod) ? M.normMve : /rve/.test(normMethod) ? M.normRve : /peak/.test(normMethod) ? M.normTaskPeak : /none|uv/.test(normMethod) ? M.normNone : undefined;
  const refWindow = fmt(get('reference_window_s', 'normalization.reference_window_s', 'normalize.window_s')) ?? L.notRecorded;
  const filterType = ((v) => (v === undefined || v === 'butterworth' ? 'Butterworth' : v))(fmt(get('filter_type', 'filter.type', 'bandpass.type')));
  const vars: TemplateVars = {
    filterType,
    order: fmt(get('filter_order', 'filter.order', 'bandpass.order')) ?? L.notRecorded,
    highpass: fmt(band?.[0] ?? get('filter.highpass_hz', 'bandpass.low_hz')) ?? L.notRecorded,
    lowpass: fmt(band?.[1] ?? get('filter.lowpass_hz', 'bandpass.high_hz')) ?? L.notRecorded,
    zeroPhase: zero === true ? M.zeroPhaseYes : zero === false ? M.zeroPhaseNo : L.notRecorded,
    window: fmt(get('rms_window_s', 'envelope.window_s', 'rms.window_s')) ?? L.notRecorded,
    rate: fmt(get('envelope_rate_hz', 'envelope.rate_hz', 'rms.rate_hz')) ?? L.notRecorded,
    notch: typeof notch === 'number' ? fillTemplate(M.notch, { notch: fmt(notch),
      harmonics: typeof harmonics === 'number' && harmonics > 1 ? fillTemplate(M.harmonics, { n: harmonics - 1 }) : '' }) ?? '' : '',
    noise: noiseOn === false ? M.noiseOff : fillTemplate(M.noise, { noiseSource: describeNoiseSource(get('noise_correction.source', 'noise.source') ?? 'rest'),
      noiseWindow: fmt(get('noise_window_s', 'noise_correction.window_s', 'noise.window_s')) ?? L.notRecorded }) ?? M.noiseOff,
    normalization: normText ? (fillTemplate(normText, { refWindow }) ?? L.notRecorded) : L.notRecorded,
  };
  const blocks: Block[] = [{ type: 'heading', level: 1, text: t.headings.methods }];
  blocks.push({ type: 'paragraph', text: fillRequired(M.pipeline, vars) + ' ' + M.sameChain });
  if (noiseOn !== false) cite('rds2019');
  cite('mathiassen1995');
  const q = results.settings.quality as { exclude?: boolean; enabled?: boolean } | undefined;
  if (q?.enabled === false) blocks.push({ type: 'paragraph', text: t.qualityOff });
  else if (q) {
    const screening = fillTemplate(M.screening as string, { excluded: q.exclude === false ? 'none: exclusion was switched off' : 'flat line, lost signal, ≥ 1 % of a window clipped, severe movement' });
    if (screening) blocks.push({ type: 'paragraph', text: screening });
  }
  const pcts = (get('percentiles', 'apdf.percentiles') as number[] | undefined) ?? [10, 50, 90];
  blocks.push({ type: 'paragraph', text: fillRequired(M.percentiles, { percentiles: pcts.map((p) => `${formatSetting(p)}th`).join(', ') }) });
  cite('hyndman1996');
  const gapUnit = String(get('gap_threshold.unit', 'gaps.threshold_unit', 'gap.threshold_unit') ?? results.rows[0]?.unit ?? '');
  const gapMax = get('gap_max_s', 'gaps.max_duration_s');
  const restCounts = get('rest_counts');
  const gapText = fillTemplate(M.gaps, {
    gapThreshold: fmt(get('gap_threshold.value', 'gap_threshold_pct', 'gaps.threshold', 'gap.threshold') ?? results.rows[0]?.gap_threshold), gapUnit,
    gapMin: fmt(get('gap_min_s', 'gaps.min_duration_s', 'gap.min_duration_s')),
    gapMax: typeof gapMax === 'number' ? fillTemplate(M.gapMax, { gapMax: fmt(gapMax) }) : '',
    restCounts: restCounts === 'gaps-only' ? M.restGapsOnly : M.restAll,
  });
  if (gapText) { blocks.push({ type: 'paragraph', text: gapText }); cite('veiersted1990', 'hansson2000'); }
  const note = get('gap_threshold.note');
  if (typeof note === 'string' && note) blocks.push({ type: 'paragraph', text: note });
  const sus = fillTemplate(M.sustained, { sustainedMin: fmt(get('sustained_min_s', 'sustained.min_duration_s')) });
  if (sus) blocks.push({ type: 'paragraph', text: sus });
  const ampEdges = (get('eva.amplitude_edges') as number[] | undefined) ?? results.eva[0]?.amplitude_edges;
  const durEdges = (get('eva.duration_edges_s') as number[] | undefined) ?? results.eva[0]?.duration_edges_s;
  if (ampEdges && durEdges) blocks.push({ type: 'paragraph', text: fillRequired(M.eva, { ampEdges: ampEdges.map(formatSetting).join(', '), durEdges: durEdges.map(formatSetting).join(', '), unit: results.eva[0]?.unit ?? gapUnit }) });
  blocks.push({ type: 'paragraph', text: fillRequired(M.unit, { units: ordered(results.rows.map((r) => r.unit)).join(', ') || L.none }) });
  blocks.push({ type: 'caution', title: t.headings.cautions, items: [M.mvcSafety, ...texts.cautions.slice(0, 3)] });
  const refs = results.references ?? [];
  if (refs.length) {
    blocks.push({ type: 'heading', level: 2, text: t.headings.referenceValues }, { type: 'paragraph', text: M.referencesIntro, small: true });
    const anyMve = refs.some((r) => r.mve_uv !== null && r.mve_uv !== undefined);
    const cols: TableColumn[] = [{ label: L.worker, width: 0.6 }, { label: L.condition, width: 1.1 }, { label: L.muscle, width: 1.5 }, { label: L.method, width: 0.7 },
      { label: L.referenceUv, width: 0.8, align: 'right' }, { label: L.noiseUv, width: 0.7, align: 'right' }];
    if (anyMve) cols.push({ label: L.mveUv, width: 0.7, align: 'right' });
    blocks.push({ type: 'table', small: true, columns: cols, rows: refs.map((r) => {
      const row = [r.worker, r.condition, r.muscle, r.method, formatNumber(r.reference_uv), formatNumber(r.noise_uv)];
      if (anyMve) row.push(formatNumber(r.mve_uv));
      return row;
    }) });
  }
  blocks.push({ type: 'heading', level: 2, text: t.headings.settings });
  const described = new Map(SETTINGS_TABLE.map((d) => [d.key, d]));
  blocks.push({ type: 'table', small: true, columns: [{ label: L.setting, width: 1.1 }, { label: L.value, width: 1.2 }, { label: L.unit, width: 0.45 }, { label: L.meaning, width: 2.6 }],
    rows: flattenSettings(s).map(([k, v]) => [k, v, described.get(k)?.unit ?? '', described.get(k)?.meaning ?? '']) });
  return blocks;
}

function describeNoiseSource(v: unknown): string | undefined {
  if (typeof v !== 'string') return undefined;
  if (/rest/.test(v)) return 'the rest recording (lowest moving RMS)';
  if (/min/.test(v)) return 'the lowest moving RMS of the field recording';
  return v;
}

function accountingBlocks(results: StudyResults, texts: ReportTexts, workers: string[], conditions: string[], muscles: string[]): Block[] {
  const { t } = texts;
  const L = t.labels as Record<string, string>;
  const blocks: Block[] = [{ type: 'heading', level: 1, text: t.headings.accounting }, { type: 'paragraph', text: t.accountingIntro, small: true }];
  const all = results.rows.filter((r) => r.segment === 'all').sort((a, b) =>
    workers.indexOf(a.worker) - workers.indexOf(b.worker) || conditions.indexOf(a.condition) - conditions.indexOf(b.condition) || muscles.indexOf(a.muscle) - muscles.indexOf(b.muscle));
  const why = (r: ResultRow) => {
    const codes = results.findings.filter((f) => matches(f, r)).map((f) => f.code);
    return codes.length ? [...new Set(codes)].join(', ') : '';
  };
  blocks.push({ type: 'table', small: true, columns: [
    { label: L.worker, width: 0.6 }, { label: L.condition, width: 1.1 }, { label: L.muscle, width: 1.5 }, { label: L.recorded, width: 0.8, align: 'right' },
    { label: L.valid, width: 0.7, align: 'right' }, { label: L.excluded, width: 0.8, align: 'right' }, { label: L.why, width: 1.3 },
  ], rows: all.map((r) => [r.worker, r.condition, r.muscle, formatMinutes(rowSpan(r)), formatMinutes(r.valid_s), formatMinutes(Math.max(0, rowSpan(r) - r.valid_s)), why(r)]) });
  blocks.push({ type: 'heading', level: 2, text: t.headings.findings });
  if ((results.settings.quality as { enabled?: boolean } | undefined)?.enabled === false) blocks.push({ type: 'paragraph', text: t.qualityOff });
  if (!results.findings.length) blocks.push({ type: 'paragraph', text: t.qualityNone });
  else blocks.push({ type: 'table', small: true, columns: [{ label: L.severity, width: 0.6 }, { label: L.where, width: 1.6 }, { label: L.message, width: 3 }],
    rows: results.findings.map((f) => [f.severity, whereText(f), `${f.code}: ${f.message}`]) });
  return blocks;
}

/** Time covered by a row's segments, s (segment_s when the analysis gives it, else end − start). */
function rowSpan(r: ResultRow): number {
  return typeof r.segment_s === 'number' && Number.isFinite(r.segment_s) ? r.segment_s : r.end_s - r.start_s;
}

function matches(f: Finding, r: ResultRow): boolean {
  const w = f.where;
  return (w.worker === undefined || w.worker === r.worker) && (w.recording === undefined || w.recording === r.recording) && (w.signal === undefined || w.signal === r.signal);
}

function whereText(f: Finding): string {
  const w = f.where;
  const parts = [w.worker, w.recording, w.signal, w.segment].filter(Boolean) as string[];
  if (w.start_s !== undefined && w.end_s !== undefined) parts.push(`${formatNumber(w.start_s, 0)}–${formatNumber(w.end_s, 0)} s`);
  return parts.join(' · ') || '–';
}

function reproBlocks(results: StudyResults, texts: ReportTexts): Block[] {
  const { t } = texts;
  const L = t.labels as Record<string, string>;
  return [
    { type: 'heading', level: 1, text: t.headings.reproducibility },
    { type: 'paragraph', text: t.reproIntro, small: true },
    { type: 'table', small: true, columns: [{ label: L.setting, width: 1 }, { label: L.value, width: 4 }], rows: [
      [L.tool, `${results.tool.name} ${results.tool.version}`],
      [L.settingsHash, settingsHash(results.settings)],
      ['settings bytes', String(canonicalJson(results.settings).length)],
    ] },
    { type: 'table', small: true, columns: [{ label: L.file, width: 1.2 }, { label: L.duration, width: 0.55, align: 'right' }, { label: L.sha256, width: 3.65 }],
      rows: results.inputs.map((i) => [i.file, formatHours(i.duration_s), i.sha256]) },
  ];
}
