// `shiftload spectrum FILE`: Welch PSD of each signal (or one) over a span, with a short summary
// (power, peak, MNF, MDF, power per band, mains ratio, low-frequency share) and a suggested
// band-pass / notch with the reasons. Streams the recording once; memory is one segment per signal.
import type { CommandModule } from 'yargs';
import type { WithIO } from './cli-io.js';
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { openRecording } from '../io/open-recording.js';
import type { RecordingInfo } from '../io/recording.js';
import { meanFrequency } from '../dsp/mean-frequency.js';
import { medianFrequency } from '../dsp/median-frequency.js';
import { suggestBand, type BandSuggestion } from '../dsp/suggest-band.js';
import { WelchAccumulator } from '../dsp/welch.js';

export interface SpectrumOptions {
  /** Signal label (exact, else case-insensitive). @default every signal */
  signal?: string;
  /** Span start, s from the recording start. @default 0 */
  start_s?: number;
  /** Span end (exclusive), s. @default end of the recording */
  end_s?: number;
  /** Welch segment length, samples (power of two). @default the power of two nearest to 1 s of samples */
  nperseg?: number;
  /** Segment overlap as a fraction of nperseg, 0 ≤ overlap < 1. @default 0.5 */
  overlap?: number;
  /** CSV/TSV without a time column: sampling rate, Hz. */
  rate_hz?: number;
}

export const SPECTRUM_DEFAULTS = {
  /** fraction of nperseg */
  overlap: 0.5,
  /** s of signal per segment (rounded to the nearest power of two in samples) */
  segment_s: 1,
  /** Hz; band over which MNF and MDF are reported (upper edge clipped to fs/2) */
  analysis_band_hz: [20, 450] as const,
  /** Hz; edges of the power-per-band table (the last band ends at fs/2) */
  band_edges_hz: [0, 20, 50, 100, 200, 450],
};

export interface SpectrumSignal {
  index: number;
  label: string;
  unit: string;
  rate_hz: number;
  span_s: [number, number];
  welch: { window: string; nperseg: number; noverlap: number; nfft: number; detrend: string; scaling: string;
    average: string; onesided: boolean; segments: number; skipped_segments: number };
  /** Σ PSD·Δf, unit² (DC bin included) */
  total_power: number;
  /** √total_power, unit */
  rms: number;
  peak_hz: number;
  band_power: { from_hz: number; to_hz: number; share: number }[];
  analysis_band_hz: [number, number];
  /** over analysis_band_hz */
  mnf_hz: number;
  /** over analysis_band_hz, interpolated convention */
  mdf_hz: number;
  mnf_full_hz: number;
  mdf_full_hz: number;
  mains_ratio: number;
  low_frequency_ratio: number;
  suggestion: BandSuggestion;
  frequencies_hz: number[];
  psd: number[];
  psd_unit: string;
}

export interface SpectrumResult {
  file: string;
  signals: SpectrumSignal[];
}

/** Power of two nearest (in log scale) to fs · segment_s samples, at least 8. */
export function defaultNperseg(fs: number): number {
  return Math.max(8, 2 ** Math.round(Math.log2(fs * SPECTRUM_DEFAULTS.segment_s)));
}

function selectSignals(info: RecordingInfo, name: string | undefined): number[] {
  if (name === undefined) return info.signals.map((s) => s.index);
  const want = name.trim();
  const hit = info.signals.find((s) => s.label.trim() === want) ?? info.signals.find((s) => s.label.trim().toLowerCase() === want.toLowerCase());
  if (!hit) throw new UsageError(dspMsg.spectrumUnknownSignal(want, info.signals.map((s) => s.label.trim()).join(', ')));
  return [hit.index];
}

/**
 * Welch spectrum and band suggestion for the signals of a recording over a span.
 * @throws InputError from the reader; UsageError for an unknown signal, a bad span or overlap,
 *   or a span shorter than one segment
 * @example const r = await spectrumOf('rest.edf', { signal: 'EMG R trapezius', start_s: 60, end_s: 120 })
 */
export async function spectrumOf(file: string, o: SpectrumOptions = {}): Promise<SpectrumResult> {
  const overlap = o.overlap ?? SPECTRUM_DEFAULTS.overlap;
  if (!(overlap >= 0 && overlap < 1)) throw new UsageError(dspMsg.spectrumOverlap(overlap));
  const rec = await openRecording(file, o.rate_hz !== undefined ? { rate_hz: o.rate_hz } : {});
  try {
    const info = rec.info;
    const sel = selectSignals(info, o.signal);
    const start = o.start_s ?? 0;
    const end = o.end_s ?? info.duration_s;
    if (!(start >= 0 && end > start && end <= info.duration_s + 1e-9)) throw new UsageError(dspMsg.spectrumSpan(start, end, info.duration_s));
    const sigs = sel.map((i) => info.signals.find((s) => s.index === i)!);
    const accs = sigs.map((s) => {
      const nperseg = o.nperseg ?? defaultNperseg(s.rate_hz);
      return new WelchAccumulator({ fs: s.rate_hz, nperseg, noverlap: Math.round(overlap * nperseg), nan: 'skip' });
    });
    const counts = new Float64Array(sigs.length);
    for await (const c of rec.read({ signals: sel, start_s: start, end_s: end })) {
      for (let j = 0; j < sigs.length; j++) { accs[j].push(c.data[j]); counts[j] += c.data[j].length; }
    }
    return {
      file,
      signals: sigs.map((s, j) => {
        const w = accs[j].result();
        if (w.segments === 0) throw new UsageError(dspMsg.spectrumTooShort(file, s.label.trim(), counts[j], w.nperseg));
        return summarize(s, [start, end], w);
      }),
    };
  } finally {
    await rec.close();
  }
}

function summarize(s: RecordingInfo['signals'][number], span: [number, number], w: ReturnType<WelchAccumulator['result']>): SpectrumSignal {
  const f = w.f_hz, p = w.psd, n = f.length;
  const df = f[1] - f[0];
  const nyq = s.rate_hz / 2;
  let total = 0, peak = 1;
  for (let k = 0; k < n; k++) total += p[k] * df;
  for (let k = 1; k < n; k++) if (p[k] > p[peak]) peak = k;
  const edges = SPECTRUM_DEFAULTS.band_edges_hz.filter((e) => e < nyq).concat([nyq]);
  const bandPower = edges.slice(0, -1).map((from, i) => {
    const to = edges[i + 1];
    let sum = 0;
    for (let k = 0; k < n; k++) if (f[k] >= from && (f[k] < to || (to === nyq && f[k] <= to))) sum += p[k] * df;
    return { from_hz: from, to_hz: to, share: total > 0 ? sum / total : NaN };
  });
  const ab: [number, number] = [SPECTRUM_DEFAULTS.analysis_band_hz[0], Math.min(SPECTRUM_DEFAULTS.analysis_band_hz[1], nyq)];
  const sug = suggestBand(f, p);
  return {
    index: s.index, label: s.label.trim(), unit: s.unit, rate_hz: s.rate_hz, span_s: span,
    welch: { window: 'hann (periodic)', nperseg: w.nperseg, noverlap: w.noverlap, nfft: w.nperseg, detrend: 'constant',
      scaling: 'density', average: 'mean', onesided: true, segments: w.segments, skipped_segments: w.skipped_segments },
    total_power: total, rms: Math.sqrt(total), peak_hz: f[peak], band_power: bandPower,
    analysis_band_hz: ab,
    mnf_hz: meanFrequency(f, p, { fminHz: ab[0], fmaxHz: ab[1] }),
    mdf_hz: medianFrequency(f, p, { fminHz: ab[0], fmaxHz: ab[1], convention: 'interp' }),
    mnf_full_hz: meanFrequency(f, p),
    mdf_full_hz: medianFrequency(f, p, { convention: 'interp' }),
    mains_ratio: sug.mains_ratio, low_frequency_ratio: sug.low_frequency_ratio, suggestion: sug,
    frequencies_hz: Array.from(f), psd: Array.from(p), psd_unit: `${s.unit}^2/Hz`,
  };
}

const num = (v: number, d = 1) => (Number.isFinite(v) ? v.toFixed(d) : 'n/a');
const sig = (v: number) => (Number.isFinite(v) ? String(Number(v.toPrecision(4))) : 'n/a');

/** Human-readable summary (no PSD values; use --json for them). */
export function formatSpectrum(r: SpectrumResult): string {
  const out: string[] = [`file      ${r.file}`];
  for (const s of r.signals) {
    const w = s.welch;
    out.push('');
    out.push(`signal    ${s.label} (#${s.index}, ${sig(s.rate_hz)} Hz, ${s.unit}), ${sig(s.span_s[0])}–${sig(s.span_s[1])} s`);
    out.push(`welch     ${w.segments} segments of ${w.nperseg} samples (${sig(s.rate_hz / w.nperseg)} Hz bins), ${w.noverlap} overlap, Hann, mean removed per segment` +
      (w.skipped_segments ? `; ${w.skipped_segments} segments with empty samples left out` : ''));
    const kv = (k: string, v: string) => out.push(`  ${k.padEnd(26)}${v}`);
    kv('total power', `${sig(s.total_power)} ${s.unit}² (RMS ${sig(s.rms)} ${s.unit})`);
    kv('spectral peak', `${num(s.peak_hz)} Hz`);
    kv(`mean frequency (MNF)`, `${num(s.mnf_hz)} Hz over ${s.analysis_band_hz[0]}–${sig(s.analysis_band_hz[1])} Hz (whole spectrum ${num(s.mnf_full_hz)} Hz)`);
    kv(`median frequency (MDF)`, `${num(s.mdf_hz)} Hz over ${s.analysis_band_hz[0]}–${sig(s.analysis_band_hz[1])} Hz (whole spectrum ${num(s.mdf_full_hz)} Hz)`);
    kv('power per band', s.band_power.map((b) => `${sig(b.from_hz)}–${sig(b.to_hz)} Hz ${num(100 * b.share)} %`).join(', '));
    kv('mains ratio', `${num(s.mains_ratio)} (peak at 50/60 Hz vs. neighbouring median)`);
    kv('below 20 Hz', `${num(100 * s.low_frequency_ratio)} % of the power`);
    kv('suggested band', `${s.suggestion.band_hz[0]}–${s.suggestion.band_hz[1]} Hz, ${s.suggestion.notch_hz === null ? 'no notch' : `notch at ${s.suggestion.notch_hz} Hz`}`);
    out.push('  why:');
    for (const reason of s.suggestion.reasons) out.push(`    - ${reason}`);
  }
  return out.join('\n') + '\n';
}

interface SpectrumArgs extends WithIO { file: string; signal?: string; start?: number; end?: number; nperseg?: number; overlap: number; rate?: number; json: boolean }

export const spectrumCommand: CommandModule<object, SpectrumArgs> = {
  command: 'spectrum <file>',
  describe: 'Power spectrum (Welch) of each signal with MNF, MDF, mains and low-frequency checks and a suggested band',
  builder: (y) => y
    .positional('file', { type: 'string', describe: 'recording (EDF, EDF+, BDF, BDF+, CSV/TSV)', demandOption: true })
    .option('signal', { type: 'string', describe: 'only the signal with this label (default: every signal)' })
    .option('start', { type: 'number', describe: 'span start, s from the recording start (default 0)' })
    .option('end', { type: 'number', describe: 'span end, s (default: end of the recording)' })
    .option('nperseg', { type: 'number', describe: 'Welch segment length in samples, a power of two (default: nearest to 1 s)' })
    .option('overlap', { type: 'number', default: SPECTRUM_DEFAULTS.overlap, describe: 'segment overlap as a fraction of the segment' })
    .option('rate', { type: 'number', describe: 'CSV/TSV without a time column: sampling rate in Hz' })
    .option('json', { type: 'boolean', default: false, describe: 'print one JSON object, with frequencies_hz[] and psd[]' })
    .example('$0 spectrum worker07_rest.edf', 'spectrum summary and suggested band for every signal')
    .example('$0 spectrum worker07_shift.edf --signal "EMG R trapezius" --start 600 --end 900', 'one signal, 10–15 min into the shift')
    .example('$0 spectrum worker07_shift.edf --nperseg 2048 --overlap 0.75 --json > psd.json', 'finer bins, PSD values as JSON') as never,
  handler: async (argv) => {
    if (argv.nperseg !== undefined && !Number.isInteger(argv.nperseg)) throw new UsageError(dspMsg.nperseg(argv.nperseg));
    const r = await spectrumOf(argv.file, {
      ...(argv.signal !== undefined ? { signal: argv.signal } : {}),
      ...(argv.start !== undefined ? { start_s: argv.start } : {}),
      ...(argv.end !== undefined ? { end_s: argv.end } : {}),
      ...(argv.nperseg !== undefined ? { nperseg: argv.nperseg } : {}),
      ...(argv.rate !== undefined ? { rate_hz: argv.rate } : {}),
      overlap: argv.overlap,
    });
    if (argv.json) argv.io.out(JSON.stringify(r, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2) + '\n');
    else argv.io.out(formatSpectrum(r));
  },
};
