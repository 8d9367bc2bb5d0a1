// Load a job file into a Study: read (size-limited, UTF-8), parse YAML safely with line numbers,
// validate against the shipped schema, then check against the recordings themselves (files exist,
// signals exist, segments fit and do not overlap, annotations exist) and resolve every default,
// path and time span. Every problem names file:line and the key path.
import { dirname, resolve } from 'node:path';
import { jobMsg } from '../messages.js';
import type { Settings } from './defaults.js';
import { describeRecordingFile, type DescribeRecording } from './describe-recording.js';
import { effectiveSettings, unitOf } from './effective-settings.js';
import type { JobFile, RecordingInput, SpansInput, WorkerInput } from './job-file.js';
import { JobContext } from './job-context.js';
import { JobValidationError } from './job-validation-error.js';
import type { KeyPathStep } from './key-path.js';
import { parseYamlWithLines, YAML_LIMITS } from './parse-yaml-lines.js';
import { readTextFile } from './read-text-file.js';
import { resolveGapThreshold } from './resolve-gap-threshold.js';
import { resolveSegments } from './resolve-segments.js';
import { resolveSpan } from './resolve-span.js';
import type { Study, StudyChannel, StudyRecording, StudySpan, StudyWorker } from './study-types.js';
import { validateJobSchema } from './validate-job-schema.js';

export interface LoadJobOptions {
  /** Reads a recording's header facts. @default describeRecordingFile (the io readers) */
  describeRecording?: DescribeRecording;
}

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
  const rate = r.rate_hz ?? null;
  const desc = abs === null ? null : await ctx.describe(abs, r.file, [...rPath, 'file'], rate);

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
    const fs = desc.signals[idx].rate_hz;
    if (!(settings.band_hz[1] < fs / 2)) {
      ctx.issue(['settings', 'band_hz'], jobMsg.bandAboveNyquist(settings.band_hz[1], c.signal, r.file, fs));
    }
    channels.push({ signal: c.signal, signalIndex: idx, muscle, rate_hz: fs });
  });

  // Signals missing from the field recording are reported there once, not again per span file.
  const missingHere = new Set(desc ? r.channels.map((c) => c.signal).filter((sig) => !desc.signals.some((s) => s.label === sig)) : []);
  // Units of the channels in the field recording: a span file must use the same ones (not converted).
  const unitsHere = new Map<string, string>();
  for (const sg of desc?.signals ?? []) if (sg.unit !== undefined) unitsHere.set(sg.label, sg.unit);

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
      const resolved = await resolveSpan(sp, spanFile, sPath, r, rPath, missingHere, ctx, unitsHere);
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
    rate_hz: rate,
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
