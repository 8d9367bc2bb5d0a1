// Task signal against baseline noise: the SNR of a channel's field envelope relative to the noise
// level of its rest recording, reported when low (low-level figures then rest on noise).
import { qualityMsg } from '../messages.js';
import type { Finding, FindingWhere } from '../study/results.js';
import { QUALITY_DEFAULTS } from './defaults.js';

export interface SnrResult {
  /** 10·log10((mean(env²) − noise²) / noise²), dB; −Infinity when the task power is not above the noise. NaN without data. */
  snr_db: number;
  /** Task RMS with the noise power removed, µV. */
  task_uv: number;
  /** The low-SNR finding, or null. */
  finding: Finding | null;
}

/**
 * SNR of a task envelope (RMS envelope in µV, before noise correction; NaN samples skipped)
 * against the noise RMS of the rest recording: task power = mean(env²) − noise².
 * @param envelope_uv the field envelope, µV, not noise-corrected
 * @param noise_uv noise level, µV RMS (> 0)
 * @param where worker/recording/signal for the finding
 * @param snr_min_db limit, dB @default QUALITY_DEFAULTS.snr_min_db (6 dB)
 * @example snrFinding(env, 2.5, { signal: 'EMG R' }).snr_db
 */
export function snrFinding(envelope_uv: Float64Array, noise_uv: number, where: FindingWhere, snr_min_db: number = QUALITY_DEFAULTS.snr_min_db): SnrResult {
  let s = 0, n = 0;
  for (let i = 0; i < envelope_uv.length; i++) { const v = envelope_uv[i]; if (v === v) { s += v * v; n++; } }
  if (n === 0 || !(noise_uv > 0)) return { snr_db: NaN, task_uv: NaN, finding: null };
  const task2 = s / n - noise_uv * noise_uv;
  const snr = task2 > 0 ? 10 * Math.log10(task2 / (noise_uv * noise_uv)) : -Infinity;
  const task = Math.sqrt(Math.max(task2, 0));
  const finding: Finding | null = snr < snr_min_db
    ? { severity: 'warning', code: 'low-snr', where: { ...where }, message: qualityMsg.lowSnr(where.signal ?? 'signal', snr, snr_min_db, task, noise_uv) }
    : null;
  return { snr_db: snr, task_uv: task, finding };
}
