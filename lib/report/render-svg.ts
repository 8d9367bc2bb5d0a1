// Write a chart model as a standalone SVG file (same marks as the PDF, so the same picture), with
// the caption as <title>/<desc> and printed below the chart.
import { chartMarks, type Measure } from './charts/chart-marks.js';
import type { ChartModel, RGB } from './charts/chart-model.js';
import { wrapText } from './wrap-text.js';

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const col = (c: RGB) => `rgb(${Math.round(c[0] * 255)},${Math.round(c[1] * 255)},${Math.round(c[2] * 255)})`;
const n = (v: number) => String(Math.round(v * 100) / 100);

/**
 * SVG text for one chart. Deterministic.
 * @example writeAtomic('fig/apdf.svg', chartToSvg(chart, fonts.measure))
 */
export function chartToSvg(chart: ChartModel, measure: Measure): string {
  const { marks } = chartMarks(chart, measure);
  const capSize = 7.2;
  const cap = wrapText(chart.caption, chart.width, capSize, measure);
  const h = chart.height + 6 + cap.length * capSize * 1.3;
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${n(chart.width)}pt" height="${n(h)}pt" viewBox="0 0 ${n(chart.width)} ${n(h)}" font-family="DejaVu Sans, Verdana, sans-serif">`,
    `<title>${esc(chart.caption)}</title>`,
    `<rect width="100%" height="100%" fill="white"/>`,
  ];
  for (const m of marks) {
    if (m.k === 'text') {
      const anchor = m.anchor === 'middle' ? 'middle' : m.anchor === 'end' ? 'end' : 'start';
      const rot = m.up ? ` transform="rotate(-90 ${n(m.x)} ${n(m.y)})"` : '';
      out.push(`<text x="${n(m.x)}" y="${n(m.y)}" font-size="${n(m.size)}" text-anchor="${anchor}" fill="${col(m.color)}"${m.bold ? ' font-weight="bold"' : ''}${rot}>${esc(m.text)}</text>`);
    } else {
      const p = m.pts;
      let d = `M${n(p[0])} ${n(p[1])}`;
      for (let i = 2; i < p.length; i += 2) d += `L${n(p[i])} ${n(p[i + 1])}`;
      if (m.close) d += 'Z';
      const stroke = m.stroke ? ` stroke="${col(m.stroke)}" stroke-width="${n(m.width ?? 1)}"${m.dash && m.dash.length ? ` stroke-dasharray="${m.dash.map(n).join(' ')}"` : ''}` : '';
      out.push(`<path d="${d}" fill="${m.fill ? col(m.fill) : 'none'}"${stroke}/>`);
    }
  }
  cap.forEach((l, i) => out.push(`<text x="0" y="${n(chart.height + 4 + (i + 1) * capSize * 1.3)}" font-size="${capSize}" fill="rgb(107,112,120)">${esc(l)}</text>`));
  out.push('</svg>');
  return out.join('\n') + '\n';
}
