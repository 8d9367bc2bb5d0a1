// `shiftload inspect FILE`: what a recording holds — format, start, duration, every signal with its
// ranges, annotations — and, after one streaming pass over the data, the share of samples at the
// digital limits (clipping) per signal.
import type { CommandModule } from 'yargs';
import type { WithIO } from './cli-io.js';
import { openRecording, type OpenOptions } from '../io/open-recording.js';
import type { Annotation, RecordingInfo, SignalInfo } from '../io/recording.js';
import { formatQuality } from '../quality/format-quality.js';
import { screenRecording } from '../quality/screen-recording.js';

/** One signal as inspect reports it: the header fields plus clipping counts. */
export interface InspectSignal extends Omit<SignalInfo, 'digital_min' | 'digital_max'> {
  /** null for CSV (no digital values) */
  digital_min: number | null;
  digital_max: number | null;
  clipped_low: number;
  clipped_high: number;
  /** (clipped_low + clipped_high) / samples */
  clipped_share: number;
}

export interface InspectResult {
  file: string;
  format: string;
  start: string | null;
  /** EDF+: data start this many seconds after `start` (0 when absent) */
  start_subsecond_s: number;
  duration_s: number;
  record_duration_s: number | null;
  signals: InspectSignal[];
  annotations: Annotation[];
}

/**
 * Open a recording, stream every signal once and count samples at the digital limits.
 * @throws InputError from the readers (file, field/byte/line named)
 * @example const r = await inspectRecording('shift.edf'); r.signals[0].clipped_high
 */
export async function inspectRecording(file: string, options: OpenOptions = {}): Promise<InspectResult> {
  const rec = await openRecording(file, options);
  try {
    const info: RecordingInfo = rec.info;
    const n = info.signals.length;
    const low = new Float64Array(n);
    const high = new Float64Array(n);
    if (n > 0) {
      for await (const c of rec.read({ signals: info.signals.map((s) => s.index) })) {
        for (let j = 0; j < n; j++) {
          low[j] += c.clipped_low[j];
          high[j] += c.clipped_high[j];
        }
      }
    }
    return {
      file,
      format: info.format,
      start: info.start,
      start_subsecond_s: info.start_subsecond_s ?? 0,
      duration_s: info.duration_s,
      record_duration_s: info.record_duration_s,
      signals: info.signals.map((s, j) => ({
        index: s.index,
        label: s.label,
        unit: s.unit,
        rate_hz: s.rate_hz,
        physical_min: s.physical_min,
        physical_max: s.physical_max,
        digital_min: Number.isNaN(s.digital_min) ? null : s.digital_min,
        digital_max: Number.isNaN(s.digital_max) ? null : s.digital_max,
        prefilter: s.prefilter,
        transducer: s.transducer,
        samples: s.samples,
        clipped_low: low[j],
        clipped_high: high[j],
        clipped_share: s.samples > 0 ? (low[j] + high[j]) / s.samples : 0,
        ...(s.nan_count !== undefined ? { nan_count: s.nan_count } : {}),
      })),
      annotations: info.annotations,
    };
  } finally {
    await rec.close();
  }
}

/** The human-readable report: a few header lines, a signal table and an annotation table. */
export function formatInspect(r: InspectResult): string {
  const lines: string[] = [];
  const kv = (k: string, v: string) => lines.push(`${k.padEnd(10)}${v}`);
  kv('file', r.file);
  kv('format', r.format);
  kv('start', (r.start ?? 'unknown') + (r.start_subsecond_s ? ` + ${fmt(r.start_subsecond_s)} s` : ''));
  kv('duration', `${fmt(r.duration_s)} s (${clock(r.duration_s)})${r.record_duration_s !== null ? `, data records of ${fmt(r.record_duration_s)} s` : ''}`);
  lines.push('');
  const hasNan = r.signals.some((s) => s.nan_count !== undefined);
  const head = ['#', 'label', 'unit', 'rate Hz', 'physical min', 'physical max', 'digital min', 'digital max', 'samples', 'clipped', 'prefilter'];
  if (hasNan) head.splice(10, 0, 'empty');
  const rows = r.signals.map((s) => {
    const row = [
      String(s.index), s.label, s.unit, fmt(s.rate_hz), fmt(s.physical_min), fmt(s.physical_max),
      s.digital_min === null ? '-' : String(s.digital_min), s.digital_max === null ? '-' : String(s.digital_max),
      String(s.samples),
      s.clipped_low + s.clipped_high === 0 ? '0' : `${pct(s.clipped_share)} (${s.clipped_low} low, ${s.clipped_high} high)`,
      s.prefilter,
    ];
    if (hasNan) row.splice(10, 0, String(s.nan_count ?? 0));
    return row;
  });
  const right = new Set(['#', 'rate Hz', 'physical min', 'physical max', 'digital min', 'digital max', 'samples', 'empty']);
  lines.push(...table(head, rows, right));
  lines.push('');
  if (r.annotations.length === 0) {
    lines.push('annotations: none');
  } else {
    lines.push(`annotations (${r.annotations.length})`);
    lines.push(...table(['onset s', 'duration s', 'text'], r.annotations.map((a) => [
      a.onset_s.toFixed(4), a.duration_s === null ? '-' : a.duration_s.toFixed(4), a.text.replace(/[\r\n\t]+/g, ' '),
    ]), new Set(['onset s', 'duration s'])).map((l) => '  ' + l));
  }
  return lines.join('\n') + '\n';
}

function table(head: string[], rows: string[][], right: Set<string>): string[] {
  const w = head.map((h, i) => Math.max(h.length, ...rows.map((r) => [...r[i]].length)));
  const line = (cells: string[]) => cells.map((c, i) => {
    const pad = w[i] - [...c].length;
    return right.has(head[i]) ? ' '.repeat(pad) + c : c + ' '.repeat(pad);
  }).join('  ').trimEnd();
  return [line(head), ...rows.map(line)];
}

/** Shortest decimal that round-trips, without exponent for ordinary values. */
function fmt(x: number): string {
  return Number.isInteger(x) ? String(x) : String(Number(x.toPrecision(12)));
}

function pct(share: number): string {
  const p = share * 100;
  return `${p >= 0.01 ? p.toFixed(2) : p.toPrecision(2)}%`;
}

function clock(s: number): string {
  const t = Math.round(s);
  const h = Math.floor(t / 3600);
  const m = Math.floor((t % 3600) / 60);
  const sec = t % 60;
  return `${h}:${String(m).padStart(2, '0')}:${String(sec).padStart(2, '0')}`;
}

interface InspectArgs extends WithIO { file: string; json: boolean; rate?: number; unit?: string; quality: boolean }

export const inspectCommand: CommandModule<object, InspectArgs> = {
  command: 'inspect <file>',
  describe: 'Show what a recording holds: format, start, duration, signals, annotations, clipping',
  builder: (y) => y
    .positional('file', { type: 'string', describe: 'recording (EDF, EDF+, BDF, BDF+, CSV/TSV)', demandOption: true })
    .option('json', { type: 'boolean', default: false, describe: 'print one JSON object instead of tables' })
    .option('rate', { type: 'number', describe: 'CSV/TSV without a time column: sampling rate in Hz' })
    .option('unit', { type: 'string', describe: 'CSV/TSV: unit of columns whose header gives none as "name [unit]" (default uV)' })
    .option('quality', { type: 'boolean', default: false, describe: 'also screen signal quality (clipping, flat line, lost signal, mains, movement, ECG) in a second pass' })
    .example('$0 inspect worker07_shift.edf', 'signals, ranges, annotations and clipped samples as tables')
    .example('$0 inspect worker07_shift.edf --json', 'the same as one JSON object (for scripts)')
    .example('$0 inspect export.csv --rate 2000', 'a CSV export without a time column, sampled at 2000 Hz')
    .example('$0 inspect worker07_shift.edf --quality', 'add a quality table per signal and the quality findings with their times') as never,
  handler: async (argv) => {
    const r = await inspectRecording(argv.file, {
      ...(argv.rate !== undefined ? { rate_hz: argv.rate } : {}),
      ...(argv.unit !== undefined ? { unit: argv.unit } : {}),
    });
    const open = { ...(argv.rate !== undefined ? { rate_hz: argv.rate } : {}), ...(argv.unit !== undefined ? { unit: argv.unit } : {}) };
    const q = argv.quality ? await screenRecording(argv.file, { open }) : null;
    if (argv.json) argv.io.out(JSON.stringify(q ? { ...r, quality: q } : r, null, 2) + '\n');
    else argv.io.out(formatInspect(r) + (q ? '\n' + formatQuality(q) : ''));
  },
};
