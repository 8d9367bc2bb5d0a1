// The CSV benchmark recording: an N-hour, 4-channel, 2 kHz comma-separated export (≈ 255 MB per
// hour) written once into os.tmpdir()/shiftload-bench/ and reused. Layout as users export it and as
// `shiftload simulate` writes it: header `time_s,EMG ch1 [uV],...`, then one row per sample with the
// time in s (4 decimals) and each value in µV with 2 decimals. Content is cheap and deterministic:
// per channel a slowly modulated sum of three sines plus uniform noise from a 32-bit LCG (Numerical
// Recipes constants 1664525, 1013904223). Rows are formatted from integers straight into bytes.
import { existsSync, mkdirSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { AtomicFile } from '../io/write-atomic.js';
import { BENCH_DEFAULTS } from './make-bench-edf.js';

export const BENCH_CSV_DEFAULTS = {
  /** sine amplitudes, µV (the noise is uniform in ±noise_uV / 2) */
  sine_uV: [60, 30, 20],
  /** peak-to-peak of the uniform noise, µV */
  noise_uV: 60,
  /** seconds formatted per write() */
  block_s: 10,
} as const;

/** Write the decimal digits of the non-negative integer `v` at `p`; returns the new position. */
function putInt(out: Buffer, p: number, v: number): number {
  let n = 1;
  for (let x = v; x >= 10; x = Math.floor(x / 10)) n++;
  for (let k = n - 1; k >= 0; k--) {
    out[p + k] = 0x30 + (v % 10);
    v = Math.floor(v / 10);
  }
  return p + n;
}

/** Write `units / 10^decimals` with exactly `decimals` digits after the point (like toFixed). */
function putFixed(out: Buffer, p: number, units: number, decimals: number): number {
  if (units < 0) { out[p++] = 0x2d; units = -units; }
  const scale = 10 ** decimals;
  p = putInt(out, p, Math.floor(units / scale));
  out[p++] = 0x2e;
  let frac = units % scale;
  for (let k = decimals - 1; k >= 0; k--) {
    out[p + k] = 0x30 + (frac % 10);
    frac = Math.floor(frac / 10);
  }
  return p + decimals;
}

/** Path of the CSV bench file for `hours`; generated (atomically) when missing. */
export function makeBenchCsv(hours: number, folder = join(tmpdir(), 'shiftload-bench')): string {
  const { channels, rate_hz: fs } = BENCH_DEFAULTS;
  const { sine_uV, noise_uV, block_s } = BENCH_CSV_DEFAULTS;
  const path = join(folder, `bench-${hours}h-${channels}ch-${fs}hz.csv`);
  const seconds = Math.round(hours * 3600);
  // a complete file has at least 20 bytes per row; a cut one (never: atomic) would be shorter
  if (existsSync(path) && statSync(path).size > seconds * fs * 20) return path;
  mkdirSync(folder, { recursive: true });
  const freqs = [[31, 87, 143], [41, 97, 171], [53, 113, 197], [67, 131, 223]];
  const n = block_s * fs;
  // longest row: time "NNNNNNN.NNNN" + per channel ",-NNNNNNN.NN" + "\n"
  const out = Buffer.alloc(n * (16 + channels * 16));
  const x = new Float64Array(n);
  const units = Array.from({ length: channels }, () => new Int32Array(n));
  const file = new AtomicFile(path);
  let lcg = 12345;
  try {
    file.write(Buffer.from(['time_s', ...Array.from({ length: channels }, (_, c) => `EMG ch${c + 1} [uV]`)].join(',') + '\n', 'utf8'));
    for (let t0 = 0; t0 < seconds; t0 += block_s) {
      const len = Math.min(n, (seconds - t0) * fs);
      for (let c = 0; c < channels; c++) {
        x.fill(0, 0, len);
        const f = freqs[c % freqs.length];
        for (let k = 0; k < 3; k++) {
          const w0 = (2 * Math.PI * f[k]) / fs;
          const ph = w0 * t0 * fs;
          for (let i = 0; i < len; i++) x[i] += sine_uV[k] * Math.sin(w0 * i + ph);
        }
        const gain = 1 + 0.8 * Math.sin((2 * Math.PI * t0) / 600 + c);
        const u = units[c];
        for (let i = 0; i < len; i++) {
          lcg = (Math.imul(lcg, 1664525) + 1013904223) >>> 0;
          u[i] = Math.round(100 * gain * (x[i] + noise_uV * (lcg / 4294967296 - 0.5)));
        }
      }
      let p = 0;
      const step = 10000 / fs; // time in 1e-4 s per sample (exact for 2 kHz)
      for (let i = 0; i < len; i++) {
        p = putFixed(out, p, Math.round((t0 * fs + i) * step), 4);
        for (let c = 0; c < channels; c++) {
          out[p++] = 0x2c;
          p = putFixed(out, p, units[c][i], 2);
        }
        out[p++] = 0x0a;
      }
      file.write(out.subarray(0, p));
    }
    file.commit();
  } catch (e) {
    file.abort();
    throw e;
  }
  return path;
}
