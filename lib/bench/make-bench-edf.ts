// The benchmark recording: an N-hour, 4-channel, 2 kHz EDF+ (≈ 57.6 MB per hour) written once by
// EdfWriter into os.tmpdir()/shiftload-bench/ and reused. Content is cheap and deterministic: per
// channel a slowly modulated sum of three sines plus uniform noise from a 32-bit LCG
// (Numerical Recipes constants 1664525, 1013904223), generated block by block with rotating phasors.
import { existsSync, mkdirSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { EdfWriter } from '../io/edf-writer.js';
import type { Annotation } from '../io/recording.js';

export const BENCH_DEFAULTS = {
  /** channels */
  channels: 4,
  /** sampling rate, Hz */
  rate_hz: 2000,
  /** seconds generated per write() */
  block_s: 10,
  /** physical range, µV */
  physical_range_uV: 5000,
} as const;

/** Path of the bench file for `hours`; generated (atomically) when missing. */
export function makeBenchEdf(hours: number, folder = join(tmpdir(), 'shiftload-bench')): string {
  const { channels, rate_hz: fs, block_s, physical_range_uV: range } = BENCH_DEFAULTS;
  const path = join(folder, `bench-${hours}h-${channels}ch-${fs}hz.edf`);
  const seconds = Math.round(hours * 3600);
  if (existsSync(path) && statSync(path).size > seconds * fs * channels * 2) return path;
  mkdirSync(folder, { recursive: true });
  const annotations: Annotation[] = [];
  for (let t = 0; t < seconds; t += 1800) annotations.push({ onset_s: t, duration_s: 1500, text: t % 3600 === 0 ? 'task: assembly' : 'task: packing' });
  const w = new EdfWriter(path, Array.from({ length: channels }, (_, c) => ({
    label: `EMG ch${c + 1}`, unit: 'uV', rate_hz: fs, physical_min: -range, physical_max: range, prefilter: 'HP:10Hz LP:500Hz', transducer: 'synthetic',
  })), { start: '2026-01-05T07:00:00', recording: 'shiftload bench', annotations });
  const n = block_s * fs;
  const blocks = Array.from({ length: channels }, () => new Float64Array(n));
  const freqs = [[31, 87, 143], [41, 97, 171], [53, 113, 197], [67, 131, 223]];
  let lcg = 12345;
  try {
    for (let t0 = 0; t0 < seconds; t0 += block_s) {
      const len = Math.min(n, (seconds - t0) * fs);
      for (let c = 0; c < channels; c++) {
        const x = blocks[c];
        x.fill(0, 0, len);
        const f = freqs[c % freqs.length];
        for (let k = 0; k < 3; k++) {
          // phasor rotation: exact start phase per block keeps the drift negligible
          const w0 = (2 * Math.PI * f[k]) / fs;
          const cw = Math.cos(w0);
          const sw = Math.sin(w0);
          let re = Math.cos(w0 * t0 * fs);
          let im = Math.sin(w0 * t0 * fs);
          const a = 300 / (k + 1);
          for (let i = 0; i < len; i++) {
            x[i] += a * im;
            const r2 = re * cw - im * sw;
            im = im * cw + re * sw;
            re = r2;
          }
        }
        const gain = 1 + 0.8 * Math.sin((2 * Math.PI * t0) / 600 + c);
        for (let i = 0; i < len; i++) {
          lcg = (Math.imul(lcg, 1664525) + 1013904223) >>> 0;
          x[i] = gain * (x[i] + 200 * (lcg / 4294967296 - 0.5));
        }
      }
      w.write(len === n ? blocks : blocks.map((b) => b.subarray(0, len)));
    }
    w.close();
  } catch (e) {
    w.abort();
    throw e;
  }
  return path;
}
