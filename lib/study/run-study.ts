// The analysis of a loaded study: an orchestrator that only composes. For each worker: noise level
// from the rest span(s), reference value from the reference span(s), then every field recording
// streamed once through the same filter and RMS envelope, noise-corrected, normalized and cut into
// task segments, each summarized by the exposure measures. Produces plain results data.
import { APDF_CURVE_LEVELS, apdfCurveSorted } from '../exposure/apdf.js';
import { rankedValid } from '../exposure/percentile.js';
import { evaMatrix } from '../exposure/eva-matrix.js';
import { noiseCorrect, noiseCorrectArray } from '../exposure/noise-correct.js';
import { normalizeEnvelope } from '../exposure/normalize-envelope.js';
import { segmentMeasures } from '../exposure/segment-measures.js';
import { rveOverMve, thresholdToRve } from '../exposure/threshold-to-rve.js';
import { openRecording } from '../io/open-recording.js';
import type { OpenOptions } from '../io/open-options.js';
import { scanEntryFor } from '../io/edf-scan-cache.js';
import { sha256File } from '../io/sha256-file.js';
import type { Study, StudyRecording, StudySpan } from '../job/study-types.js';
import { findingText } from '../messages.js';
import { toolVersion } from '../cli/tool-version.js';
import { decimateTrace } from './decimate-trace.js';
import type { RecordingJob, RecordingJobResult } from './process-recording.js';
import { readEnvelopes, type FilterSpec } from './read-envelopes.js';
import { RecordingPool } from './worker-pool.js';
import { fatigueBlocks } from '../exposure/fatigue-blocks.js';
import { fatigueMethod } from '../exposure/fatigue-method.js';
import { resolveFatigueSettings } from '../exposure/fatigue-settings.js';
import { fatigueTapSpec } from '../exposure/fatigue-taps.js';
import type { SpectralEpochSeries } from '../exposure/spectral-epochs.js';
import { recordingSpectrum } from './recording-spectrum.js';
import { excludeSpans } from '../quality/exclude-spans.js';
import { judgeScreening } from '../quality/judge-screening.js';
import { qualityRow } from '../quality/quality-row.js';
import { snrFinding } from '../quality/snr-finding.js';
import { resolveQualitySettings } from '../quality/defaults.js';
import type { EvaMatrix, EnvelopeTrace, FatigueBlock, FatigueSeries, Finding, LoadUnit, QualityRow, ReferenceValue, ResultRow, SpectrumResult, StudyResults } from './results.js';

export interface RunStudyOptions {
  /** Progress in seconds of signal processed out of the total. */
  onProgress?: (done_s: number, total_s: number, note: string) => void;
  /** Reader options (chunk size; tests prove results do not depend on it). */
  open?: OpenOptions;
  /**
   * Field recordings processed at once: 1 = one after another on this thread; N ≥ 2 = N worker
   * threads. Results are identical for every value.
   * @default 1
   */
  jobs?: number;
}

/** Per worker × channel position: the levels used to correct and normalize its envelopes. */
interface ChannelLevels {
  noise_uv: number | null;
  reference_uv: number | null;
  /** For RVE with a %MVE threshold: this worker's MVE (µV, noise-corrected). */
  mve_uv: number | null;
}

/** A recording channel's envelope (µV, noise-corrected) waiting for normalization. */
interface PendingChannel {
  rec: StudyRecording;
  c: number;
  env: Float64Array;
  /** Second envelope (reference window) for task-peak normalization. */
  peakEnv: Float64Array | null;
  clipped: number;
  samples: number;
  /** Spectral epochs of the fatigue analysis (null when it is off). */
  epochs: SpectralEpochSeries | null;
  /** True when the quality screening ran on this channel. */
  screened: boolean;
}

/** Seconds of margin read around reference and rest spans, so filter start-up stays outside. */
const SPAN_MARGIN_S = 1;

export async function runStudy(study: Study, options: RunStudyOptions = {}): Promise<StudyResults> {
  const s = study.settings;
  const unit: LoadUnit = study.unit;
  const filter: FilterSpec = {
    band_hz: s.band_hz, order: s.filter_order, mains_hz: s.mains_hz === 'none' ? null : s.mains_hz,
    mains_harmonics: s.mains_harmonics, mains_q: s.mains_q,
  };
  const rate = s.envelope_rate_hz;
  const findings: Finding[] = [];
  const rows: ResultRow[] = [];
  const eva: EvaMatrix[] = [];
  const traces: EnvelopeTrace[] = [];
  const apdf: StudyResults['apdf'] = [];
  const references: ReferenceValue[] = [];
  const filterByRate = new Map<number, unknown>();

  // Every input file with its fingerprint. The SHA-256 of each file runs alongside the analysis
  // (queued on the pool's threads behind the recordings, below): on a 460-MB recording it is a
  // few tenths of a second of reading and hashing that would otherwise come after it; a
  // rejection is seen where it is awaited.
  const files = new Map<string, { shown: string; rate_hz: number | null }>();
  for (const w of study.workers) for (const r of w.recordings) {
    files.set(r.file, { shown: r.fileAsWritten, rate_hz: r.rate_hz });
    for (const sp of [...r.reference, ...r.rest, ...r.mveReference]) files.set(sp.file, { shown: sp.fileAsWritten, rate_hz: sp.rate_hz });
  }

  // Work estimate for progress: every field recording once, plus reference and rest spans.
  let total = 0;
  for (const w of study.workers) for (const r of w.recordings) {
    total += r.duration_s;
    for (const sp of [...r.reference, ...r.rest, ...r.mveReference]) total += sp.end_s - sp.start_s;
  }
  let done = 0;
  // CSV recordings without a time column carry their rate in the job.
  const openOptions = (rate_hz: number | null): OpenOptions | undefined =>
    rate_hz === null ? options.open : { ...options.open, rate_hz };
  const progress = (d: number, note: string) => options.onProgress?.(Math.min(total, d), total, note);

  // Reference and rest values are cached per span and signal: a worker-level reference serves
  // every recording of that worker and is read once.
  const spanCache = new Map<string, { values: Float64Array; rate: number }>();
  async function spanEnvelope(span: StudySpan, signal: number, window_s: number, rateHz: number): Promise<Float64Array> {
    const key = `${span.file}\u0000${span.start_s}\u0000${span.end_s}\u0000${signal}\u0000${window_s}\u0000${rateHz}`;
    const hit = spanCache.get(key);
    if (hit) return hit.values;
    const from = Math.max(0, span.start_s - SPAN_MARGIN_S);
    const res = await readEnvelopes({
      file: span.file, signals: [signal], start_s: from, end_s: span.end_s + SPAN_MARGIN_S, filter,
      envelope: { window_s, rate_hz: rateHz }, open: openOptions(span.rate_hz),
    });
    // Keep only windows lying wholly inside the span (centre within half a window of its ends).
    const env = res.channels[0]!.envelope;
    const half = window_s / 2;
    let lo = Math.ceil((span.start_s + half - res.start_s) * rateHz - 1e-9);
    let hi = Math.floor((span.end_s - half - res.start_s) * rateHz + 1e-9) + 1;
    if (hi <= lo) { // span shorter than the window: use every window centred in the span
      lo = Math.ceil((span.start_s - res.start_s) * rateHz - 1e-9);
      hi = Math.ceil((span.end_s - res.start_s) * rateHz - 1e-9);
    }
    const values = env.slice(Math.max(0, lo), Math.min(env.length, Math.max(lo + 1, hi)));
    spanCache.set(key, { values, rate: rateHz });
    done += span.end_s - span.start_s;
    progress(done, span.fileAsWritten);
    return values;
  }

  // Field recordings: with worker threads every recording is queued at once (the pool runs
  // `jobs` of them at a time) and its channels are split into up to `jobs` groups, so that even a
  // single long recording keeps every core busy (each group reads the file itself; reading is
  // cheap next to filtering). Inline, each recording is read when its turn comes.
  const jobs = Math.max(1, Math.floor(options.jobs ?? 1));
  const pool = new RecordingPool(jobs);
  const fatigueSettings = resolveFatigueSettings(s.fatigue);
  const qualitySettings = resolveQualitySettings(s.quality);
  const quality: QualityRow[] = [];
  const fatigue: FatigueBlock[] = [];
  const fatigueSeries: FatigueSeries[] = [];
  const fatigueRates = new Set<number>();
  const spectra: SpectrumResult[] = []; // mean raw spectrum per worker × recording × channel
  const recordingJob = (rec: StudyRecording, channels: number[]): RecordingJob => ({
    file: rec.file, signals: channels.map((c) => rec.channels[c]!.signalIndex), filter,
    envelope: { window_s: s.rms_window_s, rate_hz: rate },
    second: s.normalize === 'task-peak' ? { window_s: s.reference_window_s, rate_hz: rate } : undefined,
    open: openOptions(rec.rate_hz),
    fatigue: fatigueTapSpec(channels.map((c) => rec.channels[c]!), fatigueSettings, s.band_hz),
    quality: qualitySettings.enabled ? { settings: qualitySettings } : null,
    scans: jobs > 1 ? [scanEntryFor(rec.file)].filter((e) => e !== null) : undefined,
  });
  const queued = new Map<string, Promise<RecordingJobResult>>();
  if (jobs > 1) {
    for (const w of study.workers) for (const rec of w.recordings) {
      const groups = channelGroups(rec.channels.length, jobs);
      const parts = groups.map((g) => pool.run(recordingJob(rec, g)));
      const p = Promise.all(parts).then((rs) => mergeGroups(rs, groups));
      p.catch(() => { /* awaited (and reported) in order below */ });
      queued.set(rec.id, p);
    }
  }
  // input hashes: on the pool, behind the recording jobs (inline: alongside the analysis)
  const hashes = new Map<string, Promise<string>>();
  for (const abs of files.keys()) {
    const h = jobs > 1 ? pool.hash(abs) : sha256File(abs);
    h.catch(() => undefined);
    hashes.set(abs, h);
  }
  try {
    for (const worker of study.workers) {
      const pending: PendingChannel[] = [];
      const levels = new Map<string, ChannelLevels>(); // key: recording id + channel index

      for (const rec of worker.recordings) {
        // Noise and reference levels for each channel of this recording.
        for (let c = 0; c < rec.channels.length; c++) {
          const ch = rec.channels[c]!;
          const where = { worker: worker.id, recording: rec.fileAsWritten, signal: ch.signal };
          let noise: number | null = null;
          if (s.noise_correction && rec.rest.length > 0) {
            let min = Infinity;
            for (const sp of rec.rest) {
              const v = await spanEnvelope(sp, sp.signalIndices[c]!, s.noise_window_s, rate);
              for (let i = 0; i < v.length; i++) if (v[i]! < min) min = v[i]!;
            }
            noise = Number.isFinite(min) ? min : null;
            if (noise === null) findings.push({ severity: 'warning', code: 'noise-unavailable', where, message: findingText.noiseUnavailable(ch.signal) });
          }
          const correct = (v: number) => (noise === null ? v : noiseCorrect(v, noise));
          let reference: number | null = null;
          if (s.normalize === 'mve' || s.normalize === 'rve') {
            reference = await referenceLevel(rec.reference, c, s.normalize, correct);
            if (reference !== null && !(reference > 0)) {
              findings.push({ severity: 'error', code: 'reference-zero', where, message: findingText.referenceZero(ch.signal, noise) });
              reference = null;
            }
          }
          let mve: number | null = null;
          if (study.gapThreshold.convertPerWorker && rec.mveReference.length > 0) {
            mve = await referenceLevel(rec.mveReference, c, 'mve', correct);
          }
          levels.set(`${rec.id}\u0000${c}`, { noise_uv: noise, reference_uv: reference, mve_uv: mve });
        }

        // The field recording: one streaming pass for all its channels.
        const base = done;
        const res = await (queued.get(rec.id) ?? pool.run(recordingJob(rec, rec.channels.map((_, c) => c)), (d) => progress(base + d, rec.fileAsWritten)));
        done = base + rec.duration_s;
        progress(done, rec.fileAsWritten);
        if (res.discontinuities > 0) {
          findings.push({ severity: 'info', code: 'discontinuous', where: { worker: worker.id, recording: rec.fileAsWritten }, message: findingText.discontinuous(res.discontinuities) });
        }
        res.channels.forEach((chRes, c) => {
          filterByRate.set(chRes.fs, chRes.filter);
          if (!chRes.unit_known) {
            findings.push({ severity: 'warning', code: 'unit-unknown', where: { worker: worker.id, recording: rec.fileAsWritten, signal: rec.channels[c]!.signal }, message: findingText.unitUnknown(rec.channels[c]!.signal, chRes.unit) });
          }
          const lv = levels.get(`${rec.id}\u0000${c}`)!;
          let env = lv.noise_uv === null ? chRes.envelope : noiseCorrectArray(chRes.envelope, lv.noise_uv);
          let peakEnv = chRes.second === null ? null : lv.noise_uv === null ? chRes.second : noiseCorrectArray(chRes.second, lv.noise_uv);
          const qw = res.quality?.[c] ?? null;
          if (qw) {
            // Quality screening: findings, and unusable spans set to NaN (excluded time) before
            // normalization, widened by half an RMS window so no envelope value overlaps them.
            const ch = rec.channels[c]!;
            const where = { worker: worker.id, recording: rec.fileAsWritten, signal: ch.signal };
            const q = judgeScreening(qw, { noise_uv: lv.noise_uv, mains_notched: filter.mains_hz !== null, highpass_hz: s.band_hz[0], where, settings: qualitySettings });
            findings.push(...q.findings);
            env = excludeSpans(env, rate, q.excluded, s.rms_window_s / 2);
            if (peakEnv) peakEnv = excludeSpans(peakEnv, rate, q.excluded, s.reference_window_s / 2);
            const snr = lv.noise_uv !== null && lv.noise_uv > 0 ? snrFinding(excludeSpans(chRes.envelope, rate, q.excluded, s.rms_window_s / 2), lv.noise_uv, where, qualitySettings.snr_min_db) : null;
            if (snr?.finding) findings.push(snr.finding);
            quality.push(qualityRow({ worker: worker.id, condition: rec.condition, muscle: ch.muscle, signal: ch.signal, recording: rec.fileAsWritten }, q, snr ? snr.snr_db : null));
          }
          pending.push({ rec, c, env, peakEnv, clipped: chRes.clipped_low + chRes.clipped_high, samples: chRes.samples, epochs: res.epochs?.[c] ?? null, screened: qw !== null });
          if (res.epochs) fatigueRates.add(chRes.fs);
        });
      }

      // Task-peak: the highest reference-window RMS of that muscle over all the worker's recordings.
      if (s.normalize === 'task-peak') {
        const peaks = new Map<string, number>();
        for (const p of pending) {
          const muscle = p.rec.channels[p.c]!.muscle;
          let m = peaks.get(muscle) ?? -Infinity;
          const e = p.peakEnv!;
          for (let i = 0; i < e.length; i++) if (e[i]! > m) m = e[i]!;
          peaks.set(muscle, m);
        }
        for (const p of pending) {
          const lv = levels.get(`${p.rec.id}\u0000${p.c}`)!;
          const m = peaks.get(p.rec.channels[p.c]!.muscle)!;
          lv.reference_uv = m > 0 && Number.isFinite(m) ? m : null;
        }
      }

      for (const p of pending) {
        const { rec, c } = p;
        const ch = rec.channels[c]!;
        const lv = levels.get(`${rec.id}\u0000${c}`)!;
        const where = { worker: worker.id, recording: rec.fileAsWritten, signal: ch.signal };
        references.push({
          worker: worker.id, condition: rec.condition, muscle: ch.muscle, signal: ch.signal, recording: rec.fileAsWritten,
          method: s.normalize, reference_uv: lv.reference_uv, noise_uv: lv.noise_uv, mve_uv: lv.mve_uv,
          spans: rec.reference.map((sp) => ({ file: sp.fileAsWritten, start_s: sp.start_s, end_s: sp.end_s, annotation: sp.annotation })),
        });
        if (p.clipped > 0 && !p.screened) { // the screening reports clipping per span itself
          findings.push({ severity: 'warning', code: 'clipping', where, message: findingText.clipping(p.clipped, p.samples) });
        }
        const normalizing = s.normalize !== 'none';
        if (normalizing && lv.reference_uv === null) {
          findings.push({ severity: 'error', code: 'no-reference', where, message: findingText.noReference(ch.signal, s.normalize) });
        }
        const env = !normalizing ? p.env : lv.reference_uv === null ? p.env.map(() => NaN) : normalizeEnvelope(p.env, lv.reference_uv);

        if (p.epochs) {
          const f = fatigueBlocks(p.epochs, {
            worker: worker.id, condition: rec.condition, muscle: ch.muscle, signal: ch.signal, recording: rec.fileAsWritten,
            duration_s: rec.duration_s, unit, reference_uv: normalizing ? lv.reference_uv : null, noise_uv: lv.noise_uv, segments: rec.segments,
          }, fatigueSettings);
          fatigue.push(...f.blocks);
          fatigueSeries.push(f.series);
          // the channel's mean raw spectrum with its band suggestion and MNF/MDF
          const sp = recordingSpectrum(p.epochs.spectrum, { worker: worker.id, condition: rec.condition, muscle: ch.muscle, signal: ch.signal, recording: rec.fileAsWritten },
            p.epochs.band_hz, s.mains_hz === 'none' ? null : s.mains_hz, p.epochs.epoch_s);
          if (sp) spectra.push(sp);
        }

        // The gap threshold in the envelope's unit.
        let threshold = study.gapThreshold.value;
        if (study.gapThreshold.convertPerWorker) {
          if (lv.mve_uv !== null && lv.reference_uv !== null && lv.mve_uv > 0) {
            threshold = thresholdToRve(study.gapThreshold.value, rveOverMve(lv.reference_uv, lv.mve_uv));
          } else {
            threshold = NaN;
            findings.push({ severity: 'error', code: 'threshold-not-converted', where, message: findingText.thresholdNotConverted(ch.signal) });
          }
        }

        // One row per task label: every occurrence of the label is joined, with a NaN between
        // occurrences so that no gap, run or EVA period spans two of them.
        const tasks = groupSegments(rec.segments, rec.duration_s);
        let maxP90 = -Infinity;
        for (const sg of tasks) {
          const slice = joinSlices(env, rate, sg.spans);
          if (sg.shortest_s < s.rms_window_s) {
            findings.push({ severity: 'warning', code: 'segment-too-short', where: { ...where, segment: sg.label, start_s: sg.start_s, end_s: sg.end_s }, message: findingText.segmentTooShort(sg.label, sg.shortest_s, s.rms_window_s) });
          }
          // exact at the ranks of the row's levels and of the APDF curve (0…100 %), without a full sort
          const sorted = rankedValid(slice, [...s.percentiles, ...APDF_CURVE_LEVELS]);
          const m = Number.isFinite(threshold)
            ? segmentMeasures(slice, {
              sorted,
              rate_hz: rate, percentiles: s.percentiles, gap_threshold: threshold, min_gap_s: s.gap_min_s,
              max_gap_s: s.gap_max_s, rest_counts: s.rest_counts, sustained_threshold: threshold, sustained_min_s: s.sustained_min_s,
            })
            : null;
          const levelsOf = m ? m.levels : Object.fromEntries(s.percentiles.map((q) => [`p${q}`, null]));
          const valid_s = m ? m.valid_s : 0;
          const row = {
            worker: worker.id, condition: rec.condition, muscle: ch.muscle, signal: ch.signal, recording: rec.fileAsWritten,
            segment: sg.label, start_s: sg.start_s, end_s: sg.end_s, segments: sg.spans.length, segment_s: sg.total_s, valid_s, unit,
            reference_uv: lv.reference_uv, noise_uv: lv.noise_uv,
            ...levelsOf,
            gap_threshold: threshold,
            gaps: m ? m.gaps : 0,
            gaps_per_min: m ? m.gaps_per_min : null,
            rest_pct: m ? m.rest_pct : null,
            longest_without_gap_s: m ? m.longest_without_gap_s : null,
            sustained_pct: m ? m.sustained_pct : null,
          } as ResultRow;
          rows.push(row);
          const excluded = sg.total_s - valid_s;
          if (m && excluded > Math.max(sg.spans.length / rate, 0.01 * sg.total_s)) {
            findings.push({ severity: 'info', code: 'excluded-time', where: { ...where, segment: sg.label, start_s: sg.start_s, end_s: sg.end_s }, message: findingText.excludedTime(sg.label, excluded, sg.total_s) });
          }
          const p90 = (row as unknown as Record<string, number | null>)[`p${Math.max(...s.percentiles)}`];
          if (typeof p90 === 'number' && p90 > maxP90) maxP90 = p90;
          if (slice.length > 0) {
            const e = evaMatrix(slice, { rate_hz: rate, amplitude_edges: s.eva.amplitude_edges, duration_edges_s: s.eva.duration_edges_s });
            eva.push({ worker: worker.id, condition: rec.condition, muscle: ch.muscle, segment: sg.label, unit, amplitude_edges: e.amplitude_edges, duration_edges_s: e.duration_edges_s, percent_time: e.percent_time });
            apdf.push({ worker: worker.id, condition: rec.condition, muscle: ch.muscle, segment: sg.label, unit, levels: apdfCurveSorted(sorted) });
          }
        }
        if ((unit === '%MVE') && maxP90 > 100) {
          findings.push({ severity: 'warning', code: 'reference-weak', where, message: findingText.referenceWeak(ch.signal, maxP90) });
        }
        const tr = decimateTrace(env, rate, s.trace_step_s);
        traces.push({
          worker: worker.id, condition: rec.condition, muscle: ch.muscle, recording: rec.fileAsWritten, unit,
          step_s: tr.step_s, mean: tr.mean, max: tr.max,
          segments: rec.segments.map((sg) => ({ label: sg.label, start_s: sg.start_s, end_s: sg.end_s })),
        });
      }
    }
    await Promise.all(hashes.values()); // the pool stays open until the input hashes are done
  } finally {
    await pool.close();
  }

  async function referenceLevel(spans: StudySpan[], c: number, method: 'mve' | 'rve', correct: (v: number) => number): Promise<number | null> {
    if (spans.length === 0) return null;
    if (method === 'mve') {
      // MVE: the highest moving RMS over reference_window_s in any reference span.
      let best = -Infinity;
      for (const sp of spans) {
        const v = await spanEnvelope(sp, sp.signalIndices[c]!, s.reference_window_s, rate);
        for (let i = 0; i < v.length; i++) if (v[i]! > best) best = v[i]!;
      }
      return Number.isFinite(best) ? correct(best) : null;
    }
    // RVE: the mean of the (noise-corrected) envelope over the reference span(s).
    let sum = 0;
    let n = 0;
    for (const sp of spans) {
      const v = await spanEnvelope(sp, sp.signalIndices[c]!, s.rms_window_s, rate);
      for (let i = 0; i < v.length; i++) { const x = v[i]!; if (x === x) { sum += correct(x); n++; } }
    }
    return n > 0 ? sum / n : null;
  }

  const inputs: StudyResults['inputs'] = [];
  for (const [abs, { shown, rate_hz }] of files) {
    const rec = await openRecording(abs, openOptions(rate_hz));
    const duration_s = rec.info.duration_s;
    await rec.close();
    inputs.push({ file: shown, sha256: await hashes.get(abs)!, duration_s });
  }

  return {
    format: 'shiftload-results/1',
    tool: { name: 'shiftload', version: toolVersion() },
    title: study.title,
    study: studyInfo(study),
    settings: {
      ...s,
      unit,
      gap_threshold: { value: study.gapThreshold.value, unit: study.gapThreshold.unit, converted_per_worker: study.gapThreshold.convertPerWorker, note: study.gapThreshold.note },
      percentile_method: 'linear interpolation between order statistics (numpy default, Hyndman & Fan type 7)',
      zero_phase: true,
      filter_by_rate: [...filterByRate.entries()].sort((a, b) => a[0] - b[0]).map(([, f]) => f),
    },
    inputs,
    rows,
    eva,
    traces,
    apdf,
    references,
    findings,
    quality,
    ...(fatigueSettings.enabled ? { fatigue, fatigue_series: fatigueSeries, fatigue_method: fatigueMethod(fatigueSettings, s.band_hz, [...fatigueRates].sort((a, b) => a - b)) } : {}),
    ...(spectra.length ? { spectra } : {}),
  };
}

/** The job's descriptive fields in the results' title block (absent fields left out). */
function studyInfo(study: Study): NonNullable<StudyResults['study']> {
  const info: NonNullable<StudyResults['study']> = {};
  if (study.site) info.site = study.site;
  if (study.date) { info.start_date = study.date; info.end_date = study.date; }
  if (study.analyst) info.organisation = study.analyst;
  if (study.notes) info.description = study.notes;
  const order: string[] = [];
  for (const w of study.workers) for (const r of w.recordings) for (const sg of r.segments) if (!order.includes(sg.label)) order.push(sg.label);
  info.segment_order = order;
  return info;
}

/** A task: every segment with one label, in time order. */
interface TaskSpans {
  label: string;
  spans: { start_s: number; end_s: number }[];
  start_s: number;
  end_s: number;
  total_s: number;
  shortest_s: number;
}

/** Group segments by label (first appearance order), then add the whole recording as 'all'. */
export function groupSegments(segments: readonly { label: string; start_s: number; end_s: number }[], duration_s: number): TaskSpans[] {
  const byLabel = new Map<string, TaskSpans>();
  for (const sg of segments) {
    let t = byLabel.get(sg.label);
    if (!t) { t = { label: sg.label, spans: [], start_s: sg.start_s, end_s: sg.end_s, total_s: 0, shortest_s: Infinity }; byLabel.set(sg.label, t); }
    t.spans.push({ start_s: sg.start_s, end_s: sg.end_s });
    t.start_s = Math.min(t.start_s, sg.start_s);
    t.end_s = Math.max(t.end_s, sg.end_s);
    t.total_s += sg.end_s - sg.start_s;
    t.shortest_s = Math.min(t.shortest_s, sg.end_s - sg.start_s);
  }
  const tasks = [...byLabel.values()];
  tasks.push({ label: 'all', spans: [{ start_s: 0, end_s: duration_s }], start_s: 0, end_s: duration_s, total_s: duration_s, shortest_s: duration_s });
  return tasks;
}

/**
 * The envelope samples of several spans joined into one array, one NaN between spans (NaN is
 * excluded time: it breaks gaps, runs and EVA periods, and adds no valid time). Envelope sample k
 * lies at k / rate s; a span [a, b) takes the samples with a ≤ k / rate < b.
 */
export function joinSlices(env: Float64Array, rate: number, spans: readonly { start_s: number; end_s: number }[]): Float64Array {
  const bounds = spans.map((sp) => {
    const i0 = Math.min(env.length, Math.max(0, Math.ceil(sp.start_s * rate - 1e-9)));
    const i1 = Math.min(env.length, Math.max(i0, Math.ceil(sp.end_s * rate - 1e-9)));
    return [i0, i1] as const;
  });
  if (bounds.length === 1) return env.subarray(bounds[0]![0], bounds[0]![1]);
  let n = bounds.length - 1;
  for (const [a, b] of bounds) n += b - a;
  const out = new Float64Array(n);
  let o = 0;
  bounds.forEach(([a, b], i) => {
    if (i > 0) out[o++] = NaN;
    out.set(env.subarray(a, b), o);
    o += b - a;
  });
  return out;
}

/** Split channel indices 0…n−1 into at most `k` contiguous groups of near-equal size. */
export function channelGroups(n: number, k: number): number[][] {
  const g = Math.max(1, Math.min(n, k));
  const out: number[][] = [];
  for (let i = 0; i < g; i++) {
    const a = Math.floor((i * n) / g), b = Math.floor(((i + 1) * n) / g);
    out.push(Array.from({ length: b - a }, (_, j) => a + j));
  }
  return out;
}

/** Put the results of channel groups back into one result in channel order. */
function mergeGroups(parts: RecordingJobResult[], groups: number[][]): RecordingJobResult {
  const channels: RecordingJobResult['channels'] = [];
  parts.forEach((r, i) => groups[i]!.forEach((c, j) => { channels[c] = r.channels[j]!; }));
  let epochs: RecordingJobResult['epochs'] = null;
  if (parts.every((r) => r.epochs !== null)) {
    epochs = [];
    parts.forEach((r, i) => groups[i]!.forEach((c, j) => { epochs![c] = r.epochs![j]!; }));
  }
  let quality: RecordingJobResult['quality'] = null;
  if (parts.every((r) => r.quality !== null)) {
    quality = [];
    parts.forEach((r, i) => groups[i]!.forEach((c, j) => { quality![c] = r.quality![j]!; }));
  }
  return { channels, start_s: parts[0]!.start_s, end_s: parts[0]!.end_s, discontinuities: parts[0]!.discontinuities, epochs, quality };
}
