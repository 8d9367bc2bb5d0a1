// Writes a designed recording as CSV, streamed and atomic: header `time_s,<signal> [uV],...`, one row
// per sample, time in s and values in µV (3 decimals = 0.001 µV).
import { AtomicFile } from '../io/write-atomic.js';
import type { NoiseShaper } from './noise-shaper.js';
import type { RecordingDesign } from './recording-design.js';
import { RecordingSynthesizer } from './recording-synthesizer.js';

/**
 * Generate and write one recording as CSV at `path` (atomic: temp file, then rename).
 * @param chunk_s samples are generated this many seconds at a time
 * @example writeSimulatedCsv(design, 'out/w1-ref.csv', shaper)
 */
export function writeSimulatedCsv(design: RecordingDesign, path: string, shaper: NoiseShaper, chunk_s = 5): void {
  const syn = new RecordingSynthesizer(design, shaper);
  const out = new AtomicFile(path);
  try {
    out.write(Buffer.from(['time_s', ...design.channels.map((c) => csvField(`${c.signal} [uV]`))].join(',') + '\n', 'utf8'));
    const fs = design.sampling_rate_hz;
    const tDigits = Math.max(3, Math.ceil(Math.log10(fs)) + 1);
    const step = Math.max(1, Math.round(chunk_s * fs));
    while (syn.remaining > 0) {
      const i0 = syn.position;
      const n = Math.min(step, syn.remaining);
      const data = syn.next(n);
      const lines: string[] = new Array(n);
      for (let j = 0; j < n; j++) {
        let line = ((i0 + j) / fs).toFixed(tDigits);
        for (let c = 0; c < data.length; c++) line += ',' + fixed3(data[c][j]);
        lines[j] = line;
      }
      out.write(Buffer.from(lines.join('\n') + '\n', 'utf8'));
    }
    out.commit();
  } catch (e) {
    out.abort();
    throw e;
  }
}

function fixed3(v: number): string {
  const s = v.toFixed(3);
  return s === '-0.000' ? '0.000' : s;
}

function csvField(s: string): string {
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}
