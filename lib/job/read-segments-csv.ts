// Task segments from a small CSV file: a header line `label,start_s,end_s`, then one segment per
// line. Fields may be double-quoted ("a, b"; "" for a quote). Blank lines and lines starting with #
// are skipped. Times in s from the recording start.
import { jobMsg } from '../messages.js';
import { jobIssue, JobValidationError, lineIssue } from './job-validation-error.js';

/** A segment read from a CSV file, with the line it came from (1-based). */
export interface CsvSegment { label: string; start_s: number; end_s: number; line: number }

/**
 * Parse segment CSV text.
 * @param text file contents
 * @param file the file name as the user wrote it (for messages)
 * @throws JobValidationError naming `file:line column` for a bad header, field count, label or time
 * @example readSegmentsCsv('label,start_s,end_s\nsorting,0,60\n', 'seg.csv')
 *   // [{ label: 'sorting', start_s: 0, end_s: 60, line: 2 }]
 */
export function readSegmentsCsv(text: string, file: string): CsvSegment[] {
  const fail = (line: number, column: string, what: string): never => {
    throw new JobValidationError([column === '' ? lineIssue(file, line, what) : jobIssue(file, line, [column], what)]);
  };
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  let headerSeen = false;
  const out: CsvSegment[] = [];
  for (let i = 0; i < lines.length; i++) {
    const lineNo = i + 1;
    const raw = lines[i];
    if (raw.trim() === '' || raw.trimStart().startsWith('#')) continue;
    const fields = splitCsvLine(raw);
    if (fields === null) fail(lineNo, '', jobMsg.csvQuote());
    const f = (fields as string[]).map((x) => x.trim());
    if (!headerSeen) {
      if (f.length !== 3 || f[0] !== 'label' || f[1] !== 'start_s' || f[2] !== 'end_s') {
        fail(lineNo, '', jobMsg.csvHeader(raw.trim()));
      }
      headerSeen = true;
      continue;
    }
    if (f.length !== 3) {
      fail(lineNo, '', jobMsg.csvColumns(f.length));
    }
    if (f[0] === '') fail(lineNo, 'label', jobMsg.emptyText());
    const num = (s: string, column: string): number => {
      const v = s === '' ? NaN : Number(s);
      if (!Number.isFinite(v)) fail(lineNo, column, jobMsg.csvNumber(s));
      if (v < 0) fail(lineNo, column, jobMsg.outOfRange('>= 0', v));
      return v;
    };
    out.push({ label: f[0], start_s: num(f[1], 'start_s'), end_s: num(f[2], 'end_s'), line: lineNo });
  }
  if (!headerSeen) {
    fail(1, '', jobMsg.csvHeader(''));
  }
  return out;
}

/** Split one CSV line into fields; null when a quoted field is not closed. */
function splitCsvLine(line: string): string[] | null {
  const out: string[] = [];
  let i = 0;
  for (;;) {
    let field = '';
    while (line[i] === ' ') i++;
    if (line[i] === '"') {
      i++;
      for (;;) {
        if (i >= line.length) return null;
        if (line[i] === '"') {
          if (line[i + 1] === '"') { field += '"'; i += 2; continue; }
          i++;
          break;
        }
        field += line[i++];
      }
      while (i < line.length && line[i] !== ',') field += line[i++];
    } else {
      while (i < line.length && line[i] !== ',') field += line[i++];
    }
    out.push(field);
    if (i >= line.length) return out;
    i++; // comma
  }
}
