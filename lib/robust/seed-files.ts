// Seed inputs for the robustness checks (fuzzer, catalogue tests): the EDFlib-made files in
// shared/fixtures/edf, a tiny EDF+/BDF+ written here with EdfWriter (known layout, annotations for a
// job), and the small CSV/TSV/YAML texts in test/fixtures/robust.
import { copyFileSync, existsSync, mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { EdfWriter } from '../io/edf-writer.js';
import { SplitMix64 } from '../stats/splitmix64.js';

/** shared/fixtures/edf beside the repository (lib/robust and dist/robust are at the same depth). */
export const SHARED_EDF_DIR = fileURLToPath(new URL('../../../shared/fixtures/edf/', import.meta.url));
/** test/fixtures/robust in the repository. */
export const ROBUST_FIXTURES_DIR = fileURLToPath(new URL('../../test/fixtures/robust/', import.meta.url));

/** Binary seeds taken from shared/fixtures/edf (made by EDFlib 1.23). */
export const SHARED_EDF_SEEDS = ['base_for_broken.edf', 'emg_3sig.edf', 'emg_3sig.bdf', 'emg_halfsec_records.edf'] as const;
/** Text seeds from test/fixtures/robust. */
export const TEXT_SEEDS = ['time-column.csv', 'decimal-comma.csv', 'no-time.tsv', 'tiny-job.yaml', 'tiny-segments.csv'] as const;

/** Rate of the tiny recording, Hz; duration 12 s; 2 signals "EMG R", "EMG L". */
export const TINY_RATE_HZ = 500;
export const TINY_DURATION_S = 12;

/**
 * Write tiny.edf or tiny.bdf (EDF+C/BDF+C, 2 signals, 500 Hz, 12 s, 1 s records) into `dir`:
 * seeded noise whose amplitude is 3× during "reference contraction" (1–3 s), 0.05× during
 * "break" (4–6 s) and 1× elsewhere, with those annotations and "lifting" (7–11 s). A longer
 * `duration_s` (whole seconds ≥ 12) makes a bigger file of the same design (kill and timing tests).
 * @returns the path written
 */
export function writeTinyRecording(dir: string, name = 'tiny.edf', duration_s = TINY_DURATION_S): string {
  const path = join(dir, name);
  const w = new EdfWriter(path, ['EMG R', 'EMG L'].map((label) => ({
    label, unit: 'uV', rate_hz: TINY_RATE_HZ, physical_min: -2000, physical_max: 2000, prefilter: 'HP:10Hz', transducer: 'AgAgCl',
  })), {
    start: '2026-01-05T08:00:00',
    annotations: [
      { onset_s: 1, duration_s: 2, text: 'reference contraction' },
      { onset_s: 4, duration_s: 2, text: 'break' },
      { onset_s: 7, duration_s: 4, text: 'lifting' },
    ],
  });
  const rng = new SplitMix64(20260105);
  const n = TINY_RATE_HZ * duration_s;
  const a = new Float64Array(n);
  const b = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = i / TINY_RATE_HZ;
    const g = t >= 1 && t < 3 ? 3 : t >= 4 && t < 6 ? 0.05 : 1;
    a[i] = 100 * g * rng.normal();
    b[i] = 60 * g * rng.normal();
  }
  w.write([a, b]);
  w.close();
  return path;
}

/**
 * Put every seed into `dir` (created when missing): the shared EDF/BDF files, tiny.edf, tiny.bdf
 * and the text seeds. Returns the folder.
 */
export function writeSeedFiles(dir: string): string {
  mkdirSync(dir, { recursive: true });
  for (const f of SHARED_EDF_SEEDS) copyFileSync(join(SHARED_EDF_DIR, f), join(dir, f));
  for (const f of TEXT_SEEDS) copyFileSync(join(ROBUST_FIXTURES_DIR, f), join(dir, f));
  if (!existsSync(join(dir, 'tiny.edf'))) writeTinyRecording(dir, 'tiny.edf');
  if (!existsSync(join(dir, 'tiny.bdf'))) writeTinyRecording(dir, 'tiny.bdf');
  return dir;
}

/** Read a seed file's bytes from a seed folder. */
export function seedBytes(dir: string, name: string): Buffer {
  return readFileSync(join(dir, name));
}
