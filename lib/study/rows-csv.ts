// segments.csv: the tidy table, one line per worker × condition × muscle × segment, with the same
// fields as results.json rows[] (RFC 4180 quoting, '.' decimal point, empty cell for null).
import type { ResultRow } from './results.js';
import { roundSignificant } from './stable-json.js';

/** Column order: identifying fields first, then measures in the order of the first row. */
export function rowColumns(rows: readonly ResultRow[]): string[] {
  const first = ['worker', 'condition', 'muscle', 'signal', 'recording', 'segment', 'start_s', 'end_s', 'segments', 'segment_s', 'valid_s', 'unit', 'reference_uv', 'noise_uv'];
  const seen = new Set(first);
  const cols = [...first];
  for (const r of rows) for (const k of Object.keys(r)) if (!seen.has(k)) { seen.add(k); cols.push(k); }
  return cols;
}

function cell(v: unknown): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? String(roundSignificant(v)) : '';
  const s = String(v);
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The CSV text of `rows` (header line included, '\n' line ends). */
export function rowsToCsv(rows: readonly ResultRow[]): string {
  const cols = rowColumns(rows);
  const lines = [cols.join(',')];
  for (const r of rows) lines.push(cols.map((c) => cell((r as unknown as Record<string, unknown>)[c])).join(','));
  return lines.join('\n') + '\n';
}
