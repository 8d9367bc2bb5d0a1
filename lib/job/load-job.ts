// Load a job file into a Study: read (size-limited, UTF-8), parse YAML safely with line numbers,
// validate against the shipped schema, then check against the recordings themselves (files exist,
// signals exist, segments fit and do not overlap, annotations exist) and resolve every default,
// path and time span. Every problem names file:line and the key path.
import { readFileSync, realpathSync, statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { InputError } from '../errors.js';
import { msg, jobMsg } from '../messages.js';
import type { LoadUnit } from '../study/results.js';
import { DEFAULTS, type Settings } from './defaults.js';
import { describeRecordingFile, type DescribeRecording, type RecordingDescription } from './describe-recording.js';
import type { JobFile, RecordingInput, SegmentsInput, SpanInput, SpansInput, WorkerInput } from './job-file.js';
import { jobIssue, JobValidationError, lineIssue, type JobIssue } from './job-validation-error.js';
import { formatKeyPath, type KeyPathStep } from './key-path.js';
import { parseYamlWithLines, YAML_LIMITS } from './parse-yaml-lines.js';
import { readSegmentsCsv } from './read-segments-csv.js';
import type { GapThreshold, Study, StudyChannel, StudyRecording, StudySegment, StudySpan, StudyWorker } from './study-types.js';
import { validateJobSchema } from './validate-job-schema.js';

export interface LoadJobOptions {
  /** Reads a recording's header facts. @default describeRecordingFile (the io readers) */
  describeRecording?: DescribeRecording;
}

/** Slack for comparing times read from files (EDF+ stores 100 ns ticks), s. */
const TIME_EPS = 1e-9;

/**
 * Load, validate and resolve a job file.
 * @param jobPath path of the job file (relative to the working folder or absolute)
 * @returns the Study: absolute paths, resolved spans and segments, every setting filled in
 * @throws InputError (JobValidationError for problems inside the file, with all issues found)
 * @example const study = await loadJob('job.yaml'); study.workers[0].recordings[0].segments
 */
export async function loadJob(jobPath: string, options: LoadJobOptions = {}): Promise<Study> {
  const describe = options.describeRecording ?? describeRecordingFile;
  const shown = jobPath;
  const jobFile = resolve(jobPath);
  const text = readTextFile(jobFile, shown, YAML_LIMITS.maxBytes);
  const parsed = parseYamlWithLines(text, shown);
  const schemaIssues = validateJobSchema(parsed.value, shown, parsed.lineOf);
  if (schemaIssues.length > 0) throw new JobValidationError(schemaIssues);

  const job = parsed.value as JobFile;
  const ctx = new JobContext(shown, jobFile, parsed.lineOf, describe);
  const settings = effectiveSettings(job, ctx);
  const workers: StudyWorker[] = [];
  const firstWorker = new Map<string, KeyPathStep[]>();
  for (let wi = 0; wi < job.workers.length; wi++) {
    const w = job.workers[wi];
    const wPath: KeyPathStep[] = ['workers', wi];
    const id = String(w.id);
    const seen = firstWorker.get(id);
    if (seen) ctx.issue([...wPath, 'id'], jobMsg.duplicateWorker(id, ctx.where(seen)));
    else firstWorker.set(id, [...wPath, 'id']);
    workers.push(await resolveWorker(w, id, wPath, settings, ctx));
  }
  const gapThreshold = resolveGapThreshold(settings, workers);
  ctx.throwIfAny();
  return {
    format: 'shiftload-job/1',
    title: job.title,
    site: job.site ?? null,
    date: job.date ?? null,
    analyst: job.analyst ?? null,
    notes: job.notes ?? null,
    jobFile,
    baseDir: dirname(jobFile),
    settings,
    unit: unitOf(settings.normalize),
    gapThreshold,
    workers,
  };
}

/** Shared state of one load: where issues go, how files are checked and described (cached). */
class JobContext {
  readonly issues: JobIssue[] = [];
  readonly baseDir: string;
  private readonly described = new Map<string, Promise<RecordingDescription | Error>>();
  private readonly jobReal: string;
  constructor(
    readonly shown: string,
    readonly jobFile: string,
    readonly lineOf: (p: readonly KeyPathStep[]) => number,
    private readonly describeFn: DescribeRecording,
  ) {
    this.baseDir = dirname(jobFile);
    this.jobReal = realpathSync(jobFile);
  }

  issue(path: KeyPathStep[], what: string): void {
    this.issues.push(jobIssue(this.shown, this.lineOf(path), path, what));
  }

  /** "line 12 (workers[0].id)": points at an earlier place in the job file. */
  where(path: KeyPathStep[]): string {
    return `line ${this.lineOf(path)} (${formatKeyPath(path)})`;
  }

  throwIfAny(): void {
    if (this.issues.length > 0) {
      const sorted = this.issues.map((x, i) => ({ x, i }))
        .sort((a, b) => (a.x.file === b.x.file ? 0 : a.x.file === this.shown ? -1 : 1) || a.x.line - b.x.line || a.i - b.i)
        .map((o) => o.x);
      throw new JobValidationError(sorted);
    }
  }

  /**
   * Check that a path written at `path` is an existing file other than the job file; return its
   * absolute path, or null (with an issue) when it is not usable.
   */
  inputFile(written: string, path: KeyPathStep[]): string | null {
    const abs = resolve(this.baseDir, written);
    let st;
    try { st = statSync(abs); } catch {
      this.issue(path, jobMsg.fileMissing(written));
      return null;
    }
    if (st.isDirectory()) { this.issue(path, jobMsg.fileIsFolder(written)); return null; }
    if (!st.isFile()) { this.issue(path, jobMsg.fileMissing(written)); return null; }
    if (realpathSync(abs) === this.jobReal) { this.issue(path, jobMsg.fileIsJob(written)); return null; }
    return abs;
  }

  /** Header facts of a file (each file described once); null with an issue when unreadable. */
  async describe(abs: string, written: string, path: KeyPathStep[]): Promise<RecordingDescription | null> {
    let p = this.described.get(abs);
    if (!p) {
      p = this.describeFn(abs).catch((e: unknown) => (e instanceof Error ? e : new Error(String(e))));
      this.described.set(abs, p);
    }
    const d = await p;
    if (d instanceof Error) {
      if (!(d instanceof InputError)) throw d;
      this.issue(path, jobMsg.cannotDescribe(written, d.message));
      return null;
    }
    return d;
  }
}

function readTextFile(abs: string, shown: string, maxBytes: number): string {
  let st;
  try { st = statSync(abs); } catch { throw new InputError(msg.fileNotFound(shown), { file: shown }); }
  if (st.isDirectory()) throw new InputError(msg.notAFile(shown), { file: shown });
  if (st.size > maxBytes) throw new InputError(jobMsg.tooLarge(shown, maxBytes), { file: shown });
  if (st.size === 0) throw new InputError(msg.emptyFile(shown), { file: shown });
  const bytes = readFileSync(abs);
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new InputError(jobMsg.notUtf8(shown), { file: shown });
  }
}

/** Defaults overlaid with the job's settings, plus checks the schema cannot express. */
function effectiveSettings(job: JobFile, ctx: JobContext): Settings {
  const s = job.settings ?? {};
  const settings: Settings = {
    ...structuredClone(DEFAULTS as Settings),
    ...structuredClone(s),
    eva: { ...structuredClone(DEFAULTS.eva), ...structuredClone(s.eva ?? {}) },
  } as Settings;
  const at = (...k: KeyPathStep[]): KeyPathStep[] => ['settings', ...k];
  if (settings.band_hz[0] >= settings.band_hz[1]) ctx.issue(at('band_hz'), jobMsg.bandOrder(settings.band_hz[0], settings.band_hz[1]));
  for (const [key, edges] of [['amplitude_edges', settings.eva.amplitude_edges], ['duration_edges_s', settings.eva.duration_edges_s]] as const) {
    for (let i = 1; i < edges.length; i++) {
      if (!(edges[i] > edges[i - 1])) { ctx.issue(at('eva', key, i), jobMsg.notIncreasing()); break; }
    }
  }
  if (settings.gap_max_s !== null && settings.gap_max_s <= settings.gap_min_s) {
    ctx.issue(at('gap_max_s'), jobMsg.gapMaxBelowMin(settings.gap_max_s, settings.gap_min_s));
  }
  if (settings.gap_threshold_unit === 'mve' && (settings.normalize === 'task-peak' || settings.normalize === 'none')) {
    ctx.issue(at('gap_threshold_unit'), jobMsg.mveUnitImpossible(settings.normalize));
  }
  return settings;
}

function unitOf(n: Settings['normalize']): LoadUnit {
  return n === 'mve' ? '%MVE' : n === 'rve' ? '%RVE' : n === 'task-peak' ? '%task-peak' : 'uV';
}

async function resolveWorker(w: WorkerInput, id: string, wPath: KeyPathStep[], settings: Settings, ctx: JobContext): Promise<StudyWorker> {
  // Worker-level spans must name their file.
  for (const key of ['reference', 'rest', 'mve_reference'] as const) {
    const spans = w[key];
    if (spans === undefined) continue;
    const list = Array.isArray(spans) ? spans : [spans];
    list.forEach((sp, k) => {
      if (sp.file === undefined) ctx.issue(spanPath([...wPath, key], spans, k), jobMsg.spanNoFile());
    });
  }
  const recordings: StudyRecording[] = [];
  const firstFile = new Map<string, KeyPathStep[]>();
  for (let ri = 0; ri < w.recordings.length; ri++) {
    const rPath: KeyPathStep[] = [...wPath, 'recordings', ri];
    const r = w.recordings[ri];
    const key = resolve(ctx.baseDir, r.file);
    const seen = firstFile.get(key);
    if (seen) { ctx.issue([...rPath, 'file'], jobMsg.duplicateRecording(r.file, ctx.where(seen))); continue; }
    firstFile.set(key, [...rPath, 'file']);
    const rec = await resolveRecording(w, id, wPath, r, rPath, settings, ctx);
    if (rec) recordings.push(rec);
  }
  return { id, notes: w.notes ?? null, recordings };
}

function spanPath(base: KeyPathStep[], spans: SpansInput, k: number): KeyPathStep[] {
  return Array.isArray(spans) ? [...base, k] : base;
}

async function resolveRecording(
  w: WorkerInput, workerId: string, wPath: KeyPathStep[], r: RecordingInput, rPath: KeyPathStep[],
  settings: Settings, ctx: JobContext,
): Promise<StudyRecording | null> {
  const abs = ctx.inputFile(r.file, [...rPath, 'file']);
  const desc = abs === null ? null : await ctx.describe(abs, r.file, [...rPath, 'file']);

  // Channels: signals exist, no signal or muscle twice, band below Nyquist.
  const channels: StudyChannel[] = [];
  const firstSignal = new Map<string, KeyPathStep[]>();
  const firstMuscle = new Map<string, KeyPathStep[]>();
  r.channels.forEach((c, ci) => {
    const cPath: KeyPathStep[] = [...rPath, 'channels', ci];
    const muscle = c.muscle ?? c.signal;
    const s1 = firstSignal.get(c.signal);
    if (s1) ctx.issue([...cPath, 'signal'], jobMsg.duplicateChannel(c.signal, ctx.where(s1)));
    else firstSignal.set(c.signal, [...cPath, 'signal']);
    const m1 = firstMuscle.get(muscle);
    if (m1 && !s1) ctx.issue([...cPath, c.muscle === undefined ? 'signal' : 'muscle'], jobMsg.duplicateMuscle(muscle, ctx.where(m1)));
    else if (!m1) firstMuscle.set(muscle, [...cPath, c.muscle === undefined ? 'signal' : 'muscle']);
    if (!desc) return;
    const idx = desc.signals.findIndex((s) => s.label === c.signal);
    if (idx < 0) {
      ctx.issue([...cPath, 'signal'], jobMsg.noSignal(c.signal, r.file, desc.signals.map((s) => s.label)));
      return;
    }
    const rate = desc.signals[idx].rate_hz;
    if (!(settings.band_hz[1] < rate / 2)) {
      ctx.issue(['settings', 'band_hz'], jobMsg.bandAboveNyquist(settings.band_hz[1], c.signal, r.file, rate));
    }
    channels.push({ signal: c.signal, signalIndex: idx, muscle, rate_hz: rate });
  });

  // Signals missing from the field recording are reported there once, not again per span file.
  const missingHere = new Set(desc ? r.channels.map((c) => c.signal).filter((sig) => !desc.signals.some((s) => s.label === sig)) : []);

  // Reference, rest and MVE spans: the recording's own, else the worker's.
  const pick = (key: 'reference' | 'rest' | 'mve_reference') =>
    r[key] !== undefined ? { spans: r[key] as SpansInput, path: [...rPath, key], own: true }
      : w[key] !== undefined ? { spans: w[key] as SpansInput, path: [...wPath, key], own: false } : null;
  const usedAnnotations = new Set<string>();
  const spansFor = async (key: 'reference' | 'rest' | 'mve_reference'): Promise<StudySpan[]> => {
    const p = pick(key);
    if (!p) return [];
    const list = Array.isArray(p.spans) ? p.spans : [p.spans];
    const out: StudySpan[] = [];
    for (let k = 0; k < list.length; k++) {
      const sp = list[k];
      const sPath = spanPath(p.path, p.spans, k);
      const spanFile = sp.file ?? (p.own ? r.file : undefined);
      if (spanFile === undefined) continue; // reported at worker level
      const resolved = await resolveSpan(sp, spanFile, sPath, r, rPath, missingHere, ctx);
      for (const s of resolved) {
        if (abs !== null && s.file === abs && s.annotation !== null) usedAnnotations.add(s.annotation);
        out.push(s);
      }
    }
    return out;
  };
  const reference = await spansFor('reference');
  const rest = await spansFor('rest');
  const mveReference = await spansFor('mve_reference');
  if ((settings.normalize === 'mve' || settings.normalize === 'rve') && !pick('reference')) {
    ctx.issue(rPath, jobMsg.referenceNeeded(settings.normalize));
  }
  if (settings.noise_correction && !pick('rest')) ctx.issue(rPath, jobMsg.restNeeded());
  if (settings.normalize === 'rve' && settings.gap_threshold_unit === 'mve' && !pick('mve_reference')) {
    ctx.issue(rPath, jobMsg.mveReferenceNeeded());
  }

  const segments = desc ? resolveSegments(r.segments, [...rPath, 'segments'], r.file, desc, usedAnnotations, ctx) : [];
  if (abs === null || desc === null) return null;
  return {
    id: `${workerId}/${r.file}`,
    file: abs,
    fileAsWritten: r.file,
    condition: r.condition,
    notes: r.notes ?? null,
    duration_s: desc.duration_s,
    channels,
    segments,
    reference: settings.normalize === 'mve' || settings.normalize === 'rve' ? reference : [],
    rest,
    mveReference: settings.normalize === 'rve' ? mveReference : [],
  };
}

/** Resolve one span (times or annotation) in its file; check the recording's signals exist there. */
async function resolveSpan(
  sp: SpanInput, written: string, sPath: KeyPathStep[], r: RecordingInput, rPath: KeyPathStep[],
  missingHere: ReadonlySet<string>, ctx: JobContext,
): Promise<StudySpan[]> {
  const byTimes = sp.start_s !== undefined || sp.end_s !== undefined;
  const byAnnotation = sp.annotation !== undefined;
  if (byTimes === byAnnotation || (byTimes && (sp.start_s === undefined || sp.end_s === undefined))) {
    ctx.issue(sPath, jobMsg.spanTimesOrAnnotation());
    return [];
  }
  if (sp.duration_s !== undefined && !byAnnotation) { ctx.issue([...sPath, 'duration_s'], jobMsg.durationWithoutAnnotation()); return []; }
  const filePath = sp.file !== undefined ? [...sPath, 'file'] : [...rPath, 'file'];
  const abs = ctx.inputFile(written, filePath);
  if (abs === null) return [];
  const desc = await ctx.describe(abs, written, filePath);
  if (desc === null) return [];

  // The recording's channels must exist in the span's file too (same signal labels).
  const signalIndices: number[] = [];
  r.channels.forEach((c, ci) => {
    const idx = desc.signals.findIndex((s) => s.label === c.signal);
    if (idx < 0 && !missingHere.has(c.signal)) {
      ctx.issue(filePath, jobMsg.noSignalForChannel(c.signal, written, formatKeyPath([...rPath, 'channels', ci]), desc.signals.map((s) => s.label)));
    }
    signalIndices.push(idx);
  });

  const times: { start_s: number; end_s: number; annotation: string | null }[] = [];
  if (byTimes) {
    times.push({ start_s: sp.start_s as number, end_s: sp.end_s as number, annotation: null });
  } else {
    const text = sp.annotation as string;
    const hits = desc.annotations.filter((a) => a.text === text);
    if (hits.length === 0) {
      ctx.issue([...sPath, 'annotation'], jobMsg.noAnnotation(text, written, [...new Set(desc.annotations.map((a) => a.text))]));
      return [];
    }
    for (const a of hits) {
      const d = sp.duration_s ?? a.duration_s;
      if (d === null || d === undefined || !(d > 0)) {
        ctx.issue([...sPath, 'annotation'], jobMsg.annotationNoDuration(text, a.onset_s));
        return [];
      }
      times.push({ start_s: a.onset_s, end_s: a.onset_s + d, annotation: text });
    }
  }
  const out: StudySpan[] = [];
  for (const t of times) {
    if (!(t.start_s < t.end_s)) { ctx.issue(sPath, jobMsg.segmentOrder(t.start_s, t.end_s)); continue; }
    if (t.end_s > desc.duration_s + TIME_EPS) { ctx.issue(sPath, jobMsg.segmentOutside(t.start_s, t.end_s, desc.duration_s, written)); continue; }
    if (signalIndices.every((i) => i >= 0)) {
      out.push({ file: abs, fileAsWritten: written, start_s: t.start_s, end_s: t.end_s, annotation: t.annotation, signalIndices });
    }
  }
  return out;
}

interface PlacedSegment extends StudySegment {
  /** Where to point a message about this segment. */
  at: { file: string; line: number; path: KeyPathStep[] | null };
}

/** Inline list, annotations or CSV → sorted segments; checks order, bounds and overlap. */
function resolveSegments(
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

/** How the gap threshold applies, given the normalization and the references present. */
function resolveGapThreshold(settings: Settings, workers: StudyWorker[]): GapThreshold {
  const value = settings.gap_threshold_pct;
  const unit = unitOf(settings.normalize);
  if (settings.normalize === 'mve') {
    return { value, unit, convertPerWorker: false, note: `Gap threshold ${value} %MVE.` };
  }
  if (settings.normalize === 'rve' && settings.gap_threshold_unit !== 'as-normalized') {
    const all = workers.every((w) => w.recordings.every((r) => r.mveReference.length > 0));
    if (all) {
      return { value, unit: '%MVE', convertPerWorker: true, note: `Gap threshold ${value} %MVE, converted to %RVE per worker with k = RVE / MVE from each worker's MVE reference.` };
    }
    return { value, unit, convertPerWorker: false, note: `Gap threshold taken as ${value} %RVE: not every worker has an MVE reference, so a %MVE threshold could not be converted.` };
  }
  const unitWords = unit === 'uV' ? 'µV' : unit;
  return { value, unit, convertPerWorker: false, note: `Gap threshold ${value} ${unitWords} (in the unit of the normalized envelope).` };
}
