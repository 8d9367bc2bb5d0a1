import { beforeAll, describe, expect, it } from 'vitest';
import { apdfChart } from '../../../lib/report/charts/apdf-chart.js';
import { chartMarks, patternMarks } from '../../../lib/report/charts/chart-marks.js';
import { evaChart } from '../../../lib/report/charts/eva-chart.js';
import { groupBarsChart } from '../../../lib/report/charts/group-bars-chart.js';
import { niceAxis } from '../../../lib/report/charts/nice-ticks.js';
import { pairedChart } from '../../../lib/report/charts/paired-chart.js';
import { timelineChart } from '../../../lib/report/charts/timeline-chart.js';
import { medianRange } from '../../../lib/report/median-range.js';
import { chartToSvg } from '../../../lib/report/render-svg.js';
import { loadReportFonts, type ReportFonts } from '../../../lib/report/report-fonts.js';
import { inventedStudy } from '../fixtures/invented-study.js';

let fonts: ReportFonts;
beforeAll(async () => { fonts = await loadReportFonts(); });
const study = inventedStudy(); // INVENTED TEST DATA

describe('niceAxis(label, lo, hi, count)', () => {
  it('niceAxis("x", 0, 23, 5) ticks at 0, 5, …, 25 (steps of 1, 2, 2.5, 5 × 10^k; common practice)', () => {
    expect(niceAxis('x', 0, 23, 5).ticks.map((t) => t.value)).toEqual([0, 5, 10, 15, 20, 25]);
    expect(niceAxis('x', 0, 1, 4).ticks.map((t) => t.label)).toEqual(['0.00', '0.25', '0.50', '0.75', '1.00']);
  });
});

describe('chart models', () => {
  it('apdfChart(...) marks static, median and peak at the input levels of 10, 50 and 90 %', () => {
    const a = study.apdf.find((x) => x.worker === 'W02' && x.segment === 'packing')!;
    const row = study.rows.find((r) => r.worker === a.worker && r.condition === a.condition && r.muscle === a.muscle && r.segment === 'packing')!;
    const c = apdfChart('a', [{ segment: 'packing', levels: a.levels }], a.unit, 'cap', { load: 'load', probability: 'p', static: 's', median: 'm', peak: 'k' }, ['packing']);
    const pts = c.series.find((s) => s.kind === 'points');
    expect(pts && pts.kind === 'points' ? pts.pts : []).toEqual([{ x: row.p10, y: 10 }, { x: row.p50, y: 50 }, { x: row.p90, y: 90 }]);
    expect(c.refLines.map((l) => l.y)).toEqual([10, 50, 90]);
  });

  it('evaChart(...) has one cell per amplitude × duration class with the percentage printed', () => {
    const e = study.eva[0];
    const c = evaChart('e', e.percent_time, e.amplitude_edges, e.duration_edges_s, e.unit, 'cap', { amplitude: 'a', duration: 'd' });
    expect(c.cells).toHaveLength(e.amplitude_edges.length * e.duration_edges_s.length);
    const cell = c.cells.find((x) => x.y0 === 2 && x.x0 === 3)!;
    const v = e.percent_time[2][3];
    expect(cell.text).toBe(v === 0 ? '·' : v.toFixed(v < 10 ? 1 : 0));
    expect(c.y.ticks.at(-1)!.label).toBe('≥ 30');
  });

  it('groupBarsChart(...) bars are the medians, whiskers the min and max across workers', () => {
    const vals = [3, 1, 4, 1.5];
    const c = groupBarsChart('g', [{ label: 'packing', clusters: [{ label: '', values: [medianRange(vals), null] }] }], ['A', 'B'], 'y', 'cap');
    const bars = c.series[0].kind === 'bars' ? c.series[0].bars : [];
    expect(bars).toHaveLength(1);
    expect(bars[0]).toMatchObject({ y: 2.25, lo: 1, hi: 4 });
    expect(c.legend.map((l) => l.label)).toEqual(['A', 'B']);
  });

  it('pairedChart(...) draws one line per worker with both values', () => {
    const c = pairedChart('p', [{ worker: 'a', a: 1, b: 2 }, { worker: 'b', a: 3, b: null }], 'A', 'B', 'y', 'cap');
    const segs = c.series.find((s) => s.kind === 'segments');
    expect(segs && segs.kind === 'segments' ? segs.segs : []).toEqual([[0, 1, 1, 2]]);
  });
});

describe('chartMarks(chart, measure)', () => {
  it('chartMarks keeps every mark of a timeline inside the chart box, values above the axis clamped', () => {
    const tr = study.traces[0];
    const c = timelineChart('t', tr, 'cap', { time: 'time (h)', load: 'load', mean: 'mean', max: 'max' }, ['packing']);
    const { marks, plot } = chartMarks(c, fonts.measure);
    for (const m of marks) if (m.k === 'path') for (let i = 0; i < m.pts.length; i += 2) {
      expect(m.pts[i]).toBeGreaterThanOrEqual(0); expect(m.pts[i]).toBeLessThanOrEqual(c.width);
      expect(m.pts[i + 1]).toBeGreaterThanOrEqual(0); expect(m.pts[i + 1]).toBeLessThanOrEqual(c.height);
    }
    const lines = marks.filter((m) => m.k === 'path' && m.pts.length > 100);
    for (const l of lines) if (l.k === 'path') for (let i = 1; i < l.pts.length; i += 2) expect(l.pts[i]).toBeGreaterThanOrEqual(plot.y - 0.01);
    expect(marks.some((m) => m.k === 'text' && m.text === 'time (h)')).toBe(true);
  });

  it('timelineChart(...) uses minutes for recordings shorter than 2 h and hours otherwise', () => {
    const labels = { time: 'time (h)', timeMin: 'time (min)', load: 'l', mean: 'm', max: 'x' };
    const short = { ...study.traces[0], mean: [1, 2, 3], max: [2, 3, 4], step_s: 600, segments: [{ label: 'a', start_s: 0, end_s: 1500 }] };
    const c = timelineChart('t', short, 'cap', labels, ['a']);
    expect(c.x.label).toBe('time (min)');
    expect(c.bands[0]).toMatchObject({ x0: 0, x1: 25 });
    expect(timelineChart('t', study.traces[0], 'cap', labels, []).x.label).toBe('time (h)'); // the fixture's 3 h recordings
  });

  it('chartMarks breaks a line series at null (excluded time)', () => {
    const tr = { ...study.traces[0], mean: [1, 2, null, 3, 4], max: [2, 3, null, 4, 5], step_s: 60, segments: [] };
    const c = timelineChart('t', tr, 'cap', { time: 't', load: 'l', mean: 'mean', max: 'max' }, []);
    const runs = chartMarks(c, fonts.measure).marks.filter((m) => m.k === 'path' && m.stroke && m.pts.length === 4 && m.width === 0.8);
    expect(runs).toHaveLength(2);
  });

  it('patternMarks(pattern, box) keeps hatch lines inside the box', () => {
    for (const p of ['diagonal', 'crosshatch', 'horizontal', 'dots'] as const) {
      const ms = patternMarks(p, 10, 20, 50, 30, [0, 0, 0]);
      expect(ms.length).toBeGreaterThan(3);
      for (const m of ms) if (m.k === 'path') for (let i = 0; i < m.pts.length; i += 2) {
        expect(m.pts[i]).toBeGreaterThanOrEqual(10 - 0.01); expect(m.pts[i]).toBeLessThanOrEqual(60.01);
        expect(m.pts[i + 1]).toBeGreaterThanOrEqual(20 - 0.01); expect(m.pts[i + 1]).toBeLessThanOrEqual(50.01);
      }
    }
  });
});

describe('chartToSvg(chart, measure)', () => {
  it('chartToSvg writes the same marks as paths and text, with the caption as title', () => {
    const e = study.eva[0];
    const c = evaChart('e', e.percent_time, e.amplitude_edges, e.duration_edges_s, e.unit, 'EVA of <test> & more', { amplitude: 'a', duration: 'd' });
    const svg = chartToSvg(c, fonts.measure);
    const { marks } = chartMarks(c, fonts.measure);
    expect(svg.match(/<path /g)?.length).toBe(marks.filter((m) => m.k === 'path').length);
    expect(svg).toContain('<title>EVA of &lt;test&gt; &amp; more</title>');
    expect(chartToSvg(c, fonts.measure)).toBe(svg);
  });
});
