// Cascade of notches at the mains frequency and its harmonics below fs/2.
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { iirnotch } from './iirnotch.js';
import { sosConcat, type Sos } from './sos.js';

export interface MainsNotchOptions {
  /** Number of multiples k·mains (k = 1…harmonics) to notch; those at or above fs/2 are skipped. @default 1 */
  harmonics?: number;
  /** Quality factor of each notch (bandwidth = frequency/Q, Hz). @default 30 */
  Q?: number;
}

/**
 * Notch filters at mains and its harmonics, as one Sos cascade (one section per notch).
 * @param mainsHz 50 or 60
 * @param fs sampling rate, Hz
 * @returns Sos; frequencies notched = k·mainsHz for k = 1…harmonics with k·mainsHz < fs/2
 * @throws UsageError for other mains frequencies or harmonics outside 1…20
 * @example mainsNotch(50, 2000, { harmonics: 3 }) // notches at 50, 100, 150 Hz
 * Common practice (power-line interference), no single source.
 */
export function mainsNotch(mainsHz: 50 | 60, fs: number, options: MainsNotchOptions = {}): Sos {
  if (mainsHz !== 50 && mainsHz !== 60) throw new UsageError(dspMsg.mainsHz(mainsHz));
  const harmonics = options.harmonics ?? 1;
  const Q = options.Q ?? 30;
  if (!(Number.isInteger(harmonics) && harmonics >= 1 && harmonics <= 20)) throw new UsageError(dspMsg.harmonics(harmonics));
  const parts: Sos[] = [];
  for (let k = 1; k <= harmonics; k++) {
    if (k * mainsHz >= fs / 2) break;
    parts.push(iirnotch(k * mainsHz, Q, fs));
  }
  if (parts.length === 0) throw new UsageError(dspMsg.notchFrequency(fs, mainsHz));
  return sosConcat(...parts);
}
