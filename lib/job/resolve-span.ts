// Resolve a reference/rest/MVE span (times, or every annotation with a given text) in its file,
// checking that the recording's channels exist there and that the span fits the file.
import { resolve } from 'node:path';
import { microvoltsPerUnit } from '../io/microvolts-per-unit.js';
import { inputMsg, jobMsg } from '../messages.js';
import type { RecordingInput, SpanInput } from './job-file.js';
import { TIME_EPS, type JobContext } from './job-context.js';
import { formatKeyPath, type KeyPathStep } from './key-path.js';
import type { StudySpan } from './study-types.js';

/** Resolve one span (times or annotation) in its file; check the recording's signals exist there. */
export async function resolveSpan(
  sp: SpanInput, written: string, sPath: KeyPathStep[], r: RecordingInput, rPath: KeyPathStep[],
  missingHere: ReadonlySet<string>, ctx: JobContext, unitsHere: ReadonlyMap<string, string> = new Map(),
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
  const sameFile = abs === resolve(ctx.baseDir, r.file);
  const rate = sp.rate_hz ?? (sameFile ? r.rate_hz ?? null : null);
  const desc = await ctx.describe(abs, written, filePath, rate);
  if (desc === null) return [];

  // The recording's channels must exist in the span's file too (same signal labels).
  const signalIndices: number[] = [];
  r.channels.forEach((c, ci) => {
    let idx = desc.signals.findIndex((s) => s.label === c.signal);
    if (idx < 0 && !missingHere.has(c.signal)) {
      ctx.issue(filePath, jobMsg.noSignalForChannel(c.signal, written, formatKeyPath([...rPath, 'channels', ci]), desc.signals.map((s) => s.label)));
    }
    // Every amplitude is converted to µV when read (microvoltsPerUnit), so a reference or rest
    // span in mV against a recording in µV is fine. Units shiftload does not know are used as
    // written: two different ones would silently scale every normalized value, so they are refused.
    const spanUnit = idx >= 0 ? desc.signals[idx].unit : undefined;
    const recUnit = unitsHere.get(c.signal);
    const convertible = spanUnit !== undefined && recUnit !== undefined && microvoltsPerUnit(spanUnit) !== null && microvoltsPerUnit(recUnit) !== null;
    if (spanUnit !== undefined && recUnit !== undefined && !convertible && sameUnit(spanUnit, recUnit) === false) {
      ctx.issue(filePath, inputMsg.spanUnit(c.signal, written, spanUnit, r.file, recUnit));
      idx = -1;
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
      out.push({ file: abs, fileAsWritten: written, rate_hz: rate, start_s: t.start_s, end_s: t.end_s, annotation: t.annotation, signalIndices });
    }
  }
  return out;
}

/** Units compare equal ignoring case, spaces and the µ/u spelling ("µV" = "uV" = "UV"). */
function sameUnit(a: string, b: string): boolean {
  const norm = (u: string) => u.trim().toLowerCase().replace(/\u00b5|\u03bc/g, 'u');
  return norm(a) === norm(b);
}
