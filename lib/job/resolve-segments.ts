// Task segments of a recording from an inline list, EDF+ annotations or a CSV file; checks order,
// bounds and overlap, and returns them sorted by start.
//   Annotation rule: every annotation with a duration becomes a segment labelled with its text,
//   except texts used as reference/rest/MVE spans in the same file; `include` keeps only the listed
//   texts, `prefix` keeps texts starting with it and labels them with the rest of the text.
import { InputError } from '../errors.js';
import { jobMsg } from '../messages.js';
import type { RecordingDescription } from './describe-recording.js';
import type { SegmentsInput } from './job-file.js';
import { TIME_EPS, type JobContext } from './job-context.js';
import { jobIssue, JobValidationError, lineIssue } from './job-validation-error.js';
import type { KeyPathStep } from './key-path.js';
import { YAML_LIMITS } from './parse-yaml-lines.js';
import { readSegmentsCsv } from './read-segments-csv.js';
import { readTextFile } from './read-text-file.js';
import type { StudySegment } from './study-types.js';

interface PlacedSegment extends StudySegment {
  /** Where to point a message about this segment. */
  at: { file: string; line: number; path: KeyPathStep[] | null };
}

/** Inline list, annotations or CSV → sorted segments; checks order, bounds and overlap. */
export function resolveSegments(
  spec: SegmentsInput, sPath: KeyPathStep[], recFile: string, desc: RecordingDescription,
  usedAnnotations: ReadonlySet<string>, ctx: JobContext,
): StudySegment[] {
  let placed: PlacedSegment[] = [];
  const here = (path: KeyPathStep[]) => ({ file: ctx.shown, line: ctx.lineOf(path), path });
  if (Array.isArray(spec)) {
    placed = spec.map((s, k) => ({ ...s, source: 'job' as const, at: here([...sPath, k]) }));
  } else if (spec === 'annotations' || spec.annotations !== undefined) {
    if (spec !== 'annotations' && spec.csv !== undefined) { ctx.issue(sPath, jobMsg.segmentsBothSources()); return []; }
    const filter = spec === 'annotations' ? {} : spec.annotations ?? {};
    for (const a of desc.annotations) {
      if (a.duration_s === null || !(a.duration_s > 0)) continue;
      let label = a.text;
      if (filter.include !== undefined && !filter.include.includes(a.text)) continue;
      if (filter.prefix !== undefined) {
        if (!a.text.startsWith(filter.prefix)) continue;
        label = a.text.slice(filter.prefix.length).trim() || a.text;
      }
      if (filter.include === undefined && filter.prefix === undefined && usedAnnotations.has(a.text)) continue;
      placed.push({ label, start_s: a.onset_s, end_s: a.onset_s + a.duration_s, source: 'annotation', at: here(sPath) });
    }
    if (placed.length === 0) {
      const how = filter.include ? `no annotation with a duration among ${filter.include.map((x) => `'${x}'`).join(', ')}`
        : filter.prefix ? `no annotation with a duration starting with '${filter.prefix}'`
          : 'no annotation with a duration (other than reference/rest spans)';
      ctx.issue(sPath, jobMsg.noSegments(how, recFile));
      return [];
    }
  } else if (spec.csv !== undefined) {
    const abs = ctx.inputFile(spec.csv, [...sPath, 'csv']);
    if (abs === null) return [];
    let rows;
    try {
      rows = readSegmentsCsv(readTextFile(abs, spec.csv, YAML_LIMITS.maxBytes), spec.csv);
    } catch (e) {
      if (e instanceof JobValidationError) { ctx.issues.push(...e.issues); return []; }
      if (e instanceof InputError) { ctx.issue([...sPath, 'csv'], e.message); return []; }
      throw e;
    }
    if (rows.length === 0) { ctx.issue([...sPath, 'csv'], jobMsg.noSegments('the file lists no segments', spec.csv)); return []; }
    placed = rows.map((s) => ({ label: s.label, start_s: s.start_s, end_s: s.end_s, source: 'csv' as const, at: { file: spec.csv as string, line: s.line, path: null } }));
  } else {
    ctx.issue(sPath, jobMsg.segmentsNoSource());
    return [];
  }

  const problem = (s: PlacedSegment, what: string) => {
    ctx.issues.push(s.at.path === null ? lineIssue(s.at.file, s.at.line, what) : jobIssue(s.at.file, s.at.line, s.at.path, what));
  };
  const ok: PlacedSegment[] = [];
  for (const s of placed) {
    if (!(s.start_s < s.end_s)) { problem(s, jobMsg.segmentOrder(s.start_s, s.end_s)); continue; }
    if (s.end_s > desc.duration_s + TIME_EPS) { problem(s, jobMsg.segmentOutside(s.start_s, s.end_s, desc.duration_s, recFile)); continue; }
    ok.push(s);
  }
  const sorted = ok.map((s, i) => ({ s, i })).sort((a, b) => a.s.start_s - b.s.start_s || a.i - b.i).map((o) => o.s);
  for (let k = 1; k < sorted.length; k++) {
    const a = sorted[k - 1];
    const b = sorted[k];
    if (b.start_s < a.end_s - TIME_EPS) {
      const [later] = [a, b].sort((x, y) => x.at.line - y.at.line).slice(1);
      const other = later === a ? b : a;
      problem(later, jobMsg.segmentsOverlap(later.label, later.start_s, later.end_s, other.label, other.start_s, other.end_s));
    }
  }
  return sorted.map(({ label, start_s, end_s, source }) => ({ label, start_s, end_s, source }));
}
