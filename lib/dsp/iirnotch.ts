// Second-order IIR notch (band-stop at one frequency), as scipy.signal.iirnotch.
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { checkSamplingRate } from './butter.js';
import type { Sos } from './sos.js';

/**
 * A notch at f0 with quality factor Q (−3 dB bandwidth f0/Q), as one second-order section.
 * b = g·[1, −2cos ω0, 1], a = [1, −2g·cos ω0, 2g − 1], g = 1/(1 + tan(Δω/2)) (the −3 dB
 * bandwidth form with gb = 1/√2).
 * @param f0 notch frequency, Hz, in (0, fs/2)
 * @param Q quality factor (> 0), e.g. 30
 * @param fs sampling rate, Hz
 * @returns Sos with one row
 * @throws UsageError for f0 outside (0, fs/2) or Q ≤ 0
 * @example iirnotch(50, 30, 1000)
 * Source: SciPy 1.17 iirnotch; Orfanidis SJ, Introduction to Signal Processing (1996), §11.3.
 */
export function iirnotch(f0: number, Q: number, fs: number): Sos {
  checkSamplingRate(fs);
  if (!(f0 > 0 && f0 < fs / 2)) throw new UsageError(dspMsg.notchFrequency(fs, f0));
  if (!(Q > 0 && Number.isFinite(Q))) throw new UsageError(dspMsg.notchQ(Q));
  const w0n = (2 * f0) / fs;
  const bw = (w0n / Q) * Math.PI;
  const w0 = w0n * Math.PI;
  const gb = 1 / Math.sqrt(2);
  const beta = (Math.sqrt(1 - gb ** 2) / gb) * Math.tan(bw / 2);
  const gain = 1 / (1 + beta);
  const c = Math.cos(w0);
  return Float64Array.of(gain, gain * -2 * c, gain, 1, -2 * gain * c, 2 * gain - 1);
}
