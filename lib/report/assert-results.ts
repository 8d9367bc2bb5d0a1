// Check that a parsed JSON value is a shiftload-results/1 object with the fields the report reads;
// the first problem becomes an InputError naming the file and the field.
import { InputError } from '../errors.js';
import { reportMsg } from '../messages.js';
import type { StudyResults } from '../study/results.js';

function show(v: unknown): string {
  if (v === undefined) return 'nothing';
  const s = JSON.stringify(v);
  return s === undefined ? String(v) : s.length > 40 ? s.slice(0, 37) + '...' : s;
}

/**
 * Throws InputError unless `value` has the results shape the report needs.
 * @param file the path as the user named it (for the message)
 */
export function assertResults(value: unknown, file: string): asserts value is StudyResults {
  const bad = (field: string, expected: string, got: unknown): never => { throw new InputError(reportMsg.badField(file, field, expected, show(got)), { file, where: field }); };
  if (value === null || typeof value !== 'object' || Array.isArray(value)) bad('(top level)', 'an object', value);
  const r = value as Record<string, unknown>;
  if (r.format !== 'shiftload-results/1') throw new InputError(reportMsg.badFormat(file, show(r.format)), { file, where: 'format' });
  const obj = (v: unknown, f: string) => { if (v === null || typeof v !== 'object' || Array.isArray(v)) bad(f, 'an object', v); return v as Record<string, unknown>; };
  const arr = (v: unknown, f: string) => { if (!Array.isArray(v)) bad(f, 'an array', v); return v as unknown[]; };
  const str = (v: unknown, f: string) => { if (typeof v !== 'string') bad(f, 'a string', v); };
  const numb = (v: unknown, f: string, nullable = false) => { if (!(typeof v === 'number' && Number.isFinite(v)) && !(nullable && v === null)) bad(f, nullable ? 'a number or null' : 'a number', v); };
  str(obj(r.tool, 'tool').version, 'tool.version');
  str(r.title, 'title');
  obj(r.settings, 'settings');
  arr(r.inputs, 'inputs').forEach((x, i) => { const o = obj(x, `inputs[${i}]`); str(o.file, `inputs[${i}].file`); str(o.sha256, `inputs[${i}].sha256`); numb(o.duration_s, `inputs[${i}].duration_s`); });
  const rows = arr(r.rows, 'rows');
  if (rows.length === 0) throw new InputError(reportMsg.noRows(file), { file, where: 'rows' });
  rows.forEach((x, i) => {
    const o = obj(x, `rows[${i}]`);
    for (const k of ['worker', 'condition', 'muscle', 'signal', 'recording', 'segment', 'unit']) str(o[k], `rows[${i}].${k}`);
    for (const k of ['start_s', 'end_s', 'valid_s', 'gap_threshold', 'gaps']) numb(o[k], `rows[${i}].${k}`);
    for (const k of ['gaps_per_min', 'rest_pct', 'longest_without_gap_s', 'sustained_pct']) numb(o[k], `rows[${i}].${k}`, true);
    for (const k of Object.keys(o)) if (/^p\d+(\.\d+)?$/.test(k)) numb(o[k], `rows[${i}].${k}`, true);
  });
  arr(r.eva, 'eva').forEach((x, i) => {
    const o = obj(x, `eva[${i}]`);
    const a = arr(o.amplitude_edges, `eva[${i}].amplitude_edges`), d = arr(o.duration_edges_s, `eva[${i}].duration_edges_s`);
    const pt = arr(o.percent_time, `eva[${i}].percent_time`);
    if (pt.length !== a.length) bad(`eva[${i}].percent_time`, `${a.length} rows (one per amplitude class)`, `${pt.length} rows`);
    pt.forEach((row, j) => { if (arr(row, `eva[${i}].percent_time[${j}]`).length !== d.length) bad(`eva[${i}].percent_time[${j}]`, `${d.length} values`, row); });
  });
  arr(r.traces, 'traces').forEach((x, i) => {
    const o = obj(x, `traces[${i}]`);
    numb(o.step_s, `traces[${i}].step_s`);
    if (arr(o.mean, `traces[${i}].mean`).length !== arr(o.max, `traces[${i}].max`).length) bad(`traces[${i}].max`, 'as many points as mean', (o.max as unknown[]).length);
    arr(o.segments, `traces[${i}].segments`);
  });
  arr(r.apdf, 'apdf').forEach((x, i) => { const lv = arr(obj(x, `apdf[${i}]`).levels, `apdf[${i}].levels`); if (lv.length < 2) bad(`apdf[${i}].levels`, 'levels at every percent 0…100', lv.length); });
  arr(r.findings, 'findings').forEach((x, i) => { const o = obj(x, `findings[${i}]`); str(o.code, `findings[${i}].code`); str(o.message, `findings[${i}].message`); obj(o.where, `findings[${i}].where`); });
}
