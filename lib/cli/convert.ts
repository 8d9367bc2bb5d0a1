// `shiftload convert FILE --format csv|edf`: re-write a recording as CSV of physical values or as
// EDF+ (16-bit, annotations kept), optionally a subset of signals and a time span. Reading and
// writing are joined by a pipeline with one optional processing stage (`ConvertStage`), so a later
// filter or envelope can sit between them without touching the readers or writers.
import { resolve, dirname, basename, extname, join } from 'node:path';
import type { CommandModule } from 'yargs';
import type { WithIO } from './cli-io.js';
import { UsageError } from '../errors.js';
import { ioMsg, msg } from '../messages.js';
import { secondsToSamples } from '../dsp/seconds-to-samples.js';
import { chooseDuration, EdfWriter } from '../io/edf-writer.js';
import { openRecording } from '../io/open-recording.js';
import type { Annotation, RecordingInfo, SignalInfo } from '../io/recording.js';
import { AtomicFile } from '../io/write-atomic.js';
import { processingStage } from './convert-processing.js';

/**
 * A processing stage between reader and writer. `transform` receives the selected signals' physical
 * values of one time-aligned chunk (arrays owned by the reader: copy what you keep) and returns the
 * output for the same time span at `rates_hz`; `flush` returns what is held back at the end.
 */
export interface ConvertStage {
  /** Output sampling rate per selected signal, Hz. */
  rates_hz: number[];
  transform: (chunk: Float64Array[]) => Float64Array[];
  flush?: () => Float64Array[];
  /** Output physical range per signal for the EDF header. @default the input signal's range */
  physical_range?: [min: number, max: number][];
  /** Output unit per signal. @default the input unit */
  units?: string[];
}

export interface ConvertOptions {
  format: 'csv' | 'edf';
  /** Output path. @default the input path with the new extension */
  out?: string;
  /** Signal labels to keep, in output order. @default all */
  signals?: string[];
  /** Span start, s from the recording start. @default 0 */
  start_s?: number;
  /** Span end (exclusive), s. @default the end of the recording */
  end_s?: number;
  /** CSV input without a time column: its sampling rate, Hz. */
  rate_hz?: number;
  /** CSV input: unit of columns whose header gives none. @default 'uV' */
  unit?: string;
  /** Optional processing stage (none in the command itself). */
  stage?: (selected: SignalInfo[]) => ConvertStage;
}

export interface ConvertResult {
  out: string;
  format: 'csv' | 'edf';
  signals: string[];
  duration_s: number;
  annotations: number;
}

/** Where a time-aligned, per-signal stream of physical values goes. */
interface Sink {
  /** `t0` is the time of the first sample of each array, s from the output start. */
  write(data: Float64Array[], t0: number): void;
  close(): void;
  abort(): void;
}

/**
 * Convert a recording; the output is written atomically and never replaces the input.
 * @throws InputError from the reader; UsageError for an unknown signal, a span outside the
 *   recording, CSV output of mixed rates, or an output path equal to the input
 * @example await convertRecording('shift.csv', { format: 'edf' }) // writes shift.edf beside it
 */
export async function convertRecording(input: string, o: ConvertOptions): Promise<ConvertResult> {
  const out = o.out ?? join(dirname(input), basename(input, extname(input)) + (o.format === 'csv' ? '.csv' : '.edf'));
  if (resolve(out) === resolve(input)) throw new UsageError(msg.outputIsInput(out));
  const rec = await openRecording(input, {
    ...(o.rate_hz !== undefined ? { rate_hz: o.rate_hz } : {}),
    ...(o.unit !== undefined ? { unit: o.unit } : {}),
  });
  let sink: Sink | null = null;
  try {
    const info = rec.info;
    const sel = selectSignals(info, o.signals);
    const start = o.start_s ?? 0;
    const last = info.end_s ?? info.duration_s; // EDF+D: clock end of the last record
    const end = o.end_s ?? last;
    if (!(start >= 0 && end > start && end <= last + 1e-9)) throw new UsageError(ioMsg.convertSpan(start, end, last));
    const selInfo = sel.map((i) => info.signals[i]);
    const stage = o.stage ? o.stage(selInfo) : null;
    const rates = stage ? stage.rates_hz : selInfo.map((s) => s.rate_hz);
    const annotations = info.annotations
      .filter((a) => a.onset_s >= start - 1e-9 && a.onset_s < end)
      .map((a): Annotation => ({ onset_s: Math.max(0, a.onset_s - start), duration_s: a.duration_s, text: a.text }));
    if (o.format === 'csv') {
      const distinct = [...new Set(rates)];
      if (distinct.length > 1) throw new UsageError(ioMsg.convertMixedRates(distinct.join(', ')));
      sink = new CsvSink(out, selInfo.map((s) => s.label), rates[0]);
    } else {
      sink = new EdfSink(out, info, selInfo, rates, stage, start, end - start, annotations);
    }
    let first = true;
    for await (const c of rec.read({ signals: sel, start_s: start, end_s: end })) {
      // A processing stage holds samples back, so its output continues the row count.
      if (stage && c.gap_before && !first) throw new UsageError(ioMsg.convertProcessingGap(input));
      const data = stage ? stage.transform(c.data) : c.data;
      sink.write(data, stage ? (first ? 0 : NaN) : c.start_s - start);
      first = false;
    }
    if (stage?.flush) sink.write(stage.flush(), NaN);
    sink.close();
    return { out, format: o.format, signals: selInfo.map((s) => s.label), duration_s: end - start, annotations: o.format === 'edf' ? annotations.length : 0 };
  } catch (e) {
    sink?.abort();
    throw e;
  } finally {
    await rec.close();
  }
}

/** Indices of the signals named in `names` (exact label, then case-insensitive), or all. */
function selectSignals(info: RecordingInfo, names: string[] | undefined): number[] {
  if (names === undefined || names.length === 0) return info.signals.map((s) => s.index);
  return names.map((n) => {
    const want = n.trim();
    const hit = info.signals.find((s) => s.label.trim() === want) ?? info.signals.find((s) => s.label.trim().toLowerCase() === want.toLowerCase());
    if (!hit) throw new UsageError(ioMsg.convertUnknownSignal(want, info.signals.map((s) => s.label.trim()).join(', ')));
    return hit.index;
  });
}

/** CSV of physical values: `time_s,<label>,…`, shortest round-trip numbers, empty cell for NaN. */
class CsvSink implements Sink {
  private readonly file: AtomicFile;
  private row = 0;
  private t0 = NaN;
  constructor(path: string, labels: string[], private readonly rate: number) {
    this.file = new AtomicFile(path);
    this.file.write(Buffer.from(['time_s', ...labels].map(csvCell).join(',') + '\n', 'utf8'));
  }

  write(data: Float64Array[], t0: number): void {
    if (data.length === 0) return;
    // Time from the chunk start when known (keeps EDF+D gaps), else continuing the row count.
    if (!Number.isNaN(t0)) { this.t0 = t0; this.row = 0; }
    const n = data[0].length;
    const parts: string[] = [];
    for (let i = 0; i < n; i++) {
      let line = formatTime(this.t0 + (this.row + i) / this.rate);
      for (let j = 0; j < data.length; j++) {
        const v = data[j][i];
        line += v === v ? ',' + String(v) : ',';
      }
      parts.push(line);
    }
    this.row += n;
    if (n > 0) this.file.write(Buffer.from(parts.join('\n') + '\n', 'utf8'));
  }

  close(): void { this.file.commit(); }
  abort(): void { this.file.abort(); }
}

/** EDF+C through EdfWriter; EDF+D gaps are filled with NaN (written as physical 0) to keep time. */
class EdfSink implements Sink {
  private readonly writer: EdfWriter;
  private readonly written: number[];
  constructor(path: string, info: RecordingInfo, sel: SignalInfo[], private readonly rates: number[], stage: ConvertStage | null, start: number, span: number, annotations: Annotation[]) {
    const sixteen = (s: SignalInfo) => !Number.isNaN(s.digital_min) && s.digital_min >= -32768 && s.digital_max <= 32767;
    this.writer = new EdfWriter(path, sel.map((s, j) => {
      let [lo, hi] = stage?.physical_range?.[j] ?? [s.physical_min, s.physical_max];
      if (lo > hi) [lo, hi] = [hi, lo]; // EDF allows an inverted range (reversed polarity)
      if (!(hi > lo)) { lo -= 1; hi += 1; }
      const keepDigital = !stage && sixteen(s);
      return {
        label: s.label.trim(),
        unit: stage?.units?.[j] ?? s.unit,
        rate_hz: rates[j],
        physical_min: lo,
        physical_max: hi,
        ...(keepDigital ? { digital_min: s.digital_min, digital_max: s.digital_max } : {}),
        prefilter: s.prefilter,
        transducer: s.transducer,
      };
    }), {
      ...(info.start !== null ? { start: addSeconds(info.start, Math.floor(start)), start_subsecond_s: start - Math.floor(start) } : {}),
      record_duration_s: recordDurationFor(rates, span),
      annotations,
    });
    this.written = rates.map(() => 0);
  }

  write(data: Float64Array[], t0: number): void {
    if (!Number.isNaN(t0)) {
      // pad a time gap (EDF+D) so every signal stays aligned with the clock
      const fill = this.rates.map((r, j) => Math.max(0, secondsToSamples(t0, r) - this.written[j]));
      if (fill.some((k) => k > 0)) {
        this.writer.write(fill.map((k) => new Float64Array(k).fill(NaN)));
        fill.forEach((k, j) => { this.written[j] += k; });
      }
    }
    this.writer.write(data);
    data.forEach((d, j) => { this.written[j] += d.length; });
  }

  close(): void { this.writer.close(); }
  abort(): void { this.writer.abort(); }
}

/**
 * Record duration for a span: the default duration (chooseDuration) or the longest d0/k that also
 * divides the span, so the last record needs no padding; the default when none does.
 */
export function recordDurationFor(rates: number[], span: number): number {
  const d0 = chooseDuration(rates);
  const whole = (x: number) => Math.abs(x - Math.round(x)) < 1e-9 * Math.max(1, Math.abs(x));
  for (let k = 1; k <= 1000; k++) {
    const d = d0 / k;
    if (whole(span / d) && rates.every((r) => whole(r * d) && Math.round(r * d) >= 1)) {
      const s = Math.round(d * 1e6) / 1e6;
      if (Math.abs(s - d) < 1e-12) return s;
    }
  }
  return d0;
}

function csvCell(s: string): string {
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** Seconds with at most 9 decimals, shortest form. */
function formatTime(t: number): string {
  return String(Math.round(t * 1e9) / 1e9);
}

function addSeconds(start: string, s: number): string {
  const d = new Date(start + 'Z');
  d.setTime(d.getTime() + s * 1000);
  return d.toISOString().slice(0, 19);
}

interface ConvertArgs extends WithIO {
  file: string; format: 'csv' | 'edf'; out?: string; signals?: string; start?: number; end?: number; rate?: number; unit?: string;
  band?: string; order: number; notch?: number; envelope?: number; 'envelope-rate': number;
}

/** `--band LOW,HIGH` → [low, high]. */
function parseBand(v: string): [number, number] {
  const p = v.split(',').map((x) => Number(x.trim()));
  if (p.length !== 2 || !p.every(Number.isFinite) || !(p[0]! < p[1]!)) throw new UsageError(msg.badOption('band', 'LOW,HIGH in Hz with LOW < HIGH, e.g. 30,400', `'${v}'`));
  return [p[0]!, p[1]!];
}

export const convertCommand: CommandModule<object, ConvertArgs> = {
  command: 'convert <file>',
  describe: 'Write a recording as CSV (physical values) or EDF+ (16-bit, annotations kept)',
  builder: (y) => y
    .positional('file', { type: 'string', describe: 'recording (EDF, EDF+, BDF, BDF+, CSV/TSV)', demandOption: true })
    .option('format', { choices: ['csv', 'edf'] as const, demandOption: true, describe: 'output format' })
    .option('out', { alias: 'o', type: 'string', describe: 'output file (default: input name with the new extension, beside the input)' })
    .option('signals', { type: 'string', describe: 'comma-separated signal labels to keep, in this order (default: all)' })
    .option('start', { type: 'number', describe: 'span start, s from the recording start (default 0)' })
    .option('end', { type: 'number', describe: 'span end, s (default: end of the recording)' })
    .option('rate', { type: 'number', describe: 'CSV/TSV input without a time column: sampling rate in Hz' })
    .option('unit', { type: 'string', describe: 'CSV/TSV input: unit of columns whose header gives none as "name [unit]" (default uV)' })
    .option('band', { type: 'string', describe: 'band-pass LOW,HIGH in Hz (Butterworth, zero phase, as in analyze)' })
    .option('order', { type: 'number', default: 4, describe: 'Butterworth order of --band' })
    .option('notch', { type: 'number', choices: [50, 60], describe: 'mains notch in Hz (with its 2nd and 3rd multiple), needs --band' })
    .option('envelope', { type: 'number', describe: 'write the moving-RMS envelope with this window, s, instead of the signal' })
    .option('envelope-rate', { type: 'number', default: 20, describe: 'envelope values per second (with --envelope)' })
    .example('$0 convert shift.edf --format edf --band 30,400 --notch 50 -o shift-filtered.edf', 'the signals as the analysis filters them')
    .example('$0 convert shift.edf --format csv --band 30,400 --envelope 0.1 --envelope-rate 20', 'the RMS envelope (µV) as CSV')
    .example('$0 convert logger_export.csv --format edf', 'make logger_export.edf (EDF+) beside the CSV')
    .example('$0 convert shift.edf --format csv --signals "EMG R trapezius,EMG L trapezius" --start 600 --end 900', 'five minutes of two signals as CSV')
    .example('$0 convert shift.bdf --format edf -o shift16.edf', 'a 16-bit EDF+ copy of a BDF+ file') as never,
  handler: async (argv) => {
    for (const [k, v] of [['start', argv.start], ['end', argv.end], ['rate', argv.rate]] as const) {
      if (v !== undefined && !Number.isFinite(v)) throw new UsageError(msg.badOption(k, 'a number', String(v)));
    }
    const r = await convertRecording(argv.file, {
      format: argv.format,
      ...(argv.out !== undefined ? { out: argv.out } : {}),
      ...(argv.signals !== undefined ? { signals: argv.signals.split(',').filter((s) => s.trim() !== '') } : {}),
      ...(argv.start !== undefined ? { start_s: argv.start } : {}),
      ...(argv.end !== undefined ? { end_s: argv.end } : {}),
      ...(argv.rate !== undefined ? { rate_hz: argv.rate } : {}),
      ...(argv.unit !== undefined ? { unit: argv.unit } : {}),
      ...(argv.band !== undefined || argv.envelope !== undefined ? {
        stage: processingStage({
          band_hz: argv.band !== undefined ? parseBand(argv.band) : null, order: argv.order,
          notch_hz: (argv.notch as 50 | 60 | undefined) ?? null, envelope_s: argv.envelope ?? null, rate_hz: argv['envelope-rate'],
        }),
      } : {}),
    });
    argv.io.out(`wrote ${r.out} (${r.format.toUpperCase()}, ${r.signals.length} signal${r.signals.length === 1 ? '' : 's'}, ${r.duration_s} s${r.format === 'edf' ? `, ${r.annotations} annotations` : ''})\n`);
  },
};
