// Butterworth filter design in second-order sections, matching scipy.signal.butter(output='sos').
// Chain: analog prototype (buttap) → prewarp → band transform (lp2*_zpk) → bilinear_zpk → zpk2sos.
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { bilinearZpk } from './bilinear-zpk.js';
import { buttap } from './buttap.js';
import { lp2bpZpk, lp2bsZpk, lp2hpZpk, lp2lpZpk } from './lp2-zpk.js';
import type { Sos } from './sos.js';
import { zpk2sos } from './zpk2sos.js';

/** Filter type, as scipy's `btype`. */
export type BType = 'lowpass' | 'highpass' | 'bandpass' | 'bandstop';

export interface ButterOptions {
  /** Filter type. @default 'lowpass' */
  btype?: BType;
  /** Sampling rate in Hz (required; there is no default sampling rate anywhere in shiftload). */
  fs: number;
}

/** Throw UsageError unless fs is a positive finite number (Hz). */
export function checkSamplingRate(fs: number): void {
  if (!(Number.isFinite(fs) && fs > 0)) throw new UsageError(dspMsg.samplingRate(fs));
}

/**
 * Design a digital Butterworth filter as second-order sections.
 *
 * Same result as `scipy.signal.butter(order, cutoffs, btype, fs=fs, output='sos')`: prototype
 * poles, tangent prewarp of the cut-offs, bilinear transform, `zpk2sos` pairing 'nearest'
 * (sections ordered by increasing pole radius, gain in section 0). Odd orders give one
 * first-order section (b2 = a2 = 0). The gain at each cut-off is 1/√2 (−3.01 dB).
 *
 * @param order 1…10 (band-pass/band-stop have 2·order poles)
 * @param cutoffsHz one cut-off (lowpass/highpass) or [low, high] (bandpass/bandstop), Hz, in (0, fs/2)
 * @param options btype and fs (Hz)
 * @returns Sos (see sos.ts)
 * @throws UsageError naming the parameter, its valid range and the value received
 * @example butter(4, [20, 450], { btype: 'bandpass', fs: 2000 })
 * Source: Butterworth S (1930) Wireless Engineer 7:536–541; algorithm as SciPy 1.17 iirfilter.
 */
export function butter(order: number, cutoffsHz: number | readonly number[], options: ButterOptions): Sos {
  const btype = options.btype ?? 'lowpass';
  const fs = options.fs;
  checkSamplingRate(fs);
  if (!(Number.isInteger(order) && order >= 1 && order <= 10)) throw new UsageError(dspMsg.filterOrder(order));
  if (!['lowpass', 'highpass', 'bandpass', 'bandstop'].includes(btype)) throw new UsageError(dspMsg.btype(String(btype)));
  const w = typeof cutoffsHz === 'number' ? [cutoffsHz] : Array.from(cutoffsHz);
  const band = btype === 'bandpass' || btype === 'bandstop';
  if (w.length !== (band ? 2 : 1)) throw new UsageError(dspMsg.cutoffCount(btype, w.length));
  const names = band ? ['low cut-off', 'high cut-off'] : ['cut-off'];
  for (let i = 0; i < w.length; i++) {
    if (!(w[i] > 0)) throw new UsageError(dspMsg.cutoffPositive(names[i], w[i]));
    if (!(w[i] < fs / 2)) throw new UsageError(dspMsg.cutoffBelowNyquist(names[i], fs, w[i]));
  }
  if (band && !(w[0] < w[1])) throw new UsageError(dspMsg.cutoffOrder(w[0], w[1]));

  // scipy: normalise to Nyquist, then prewarp for a bilinear transform at fs = 2
  const warped = w.map((v) => 4 * Math.tan((Math.PI * (v / (fs / 2))) / 2));
  const proto = buttap(order);
  let analog;
  if (btype === 'lowpass') analog = lp2lpZpk(proto, warped[0]);
  else if (btype === 'highpass') analog = lp2hpZpk(proto, warped[0]);
  else {
    const bw = warped[1] - warped[0];
    const wo = Math.sqrt(warped[0] * warped[1]);
    analog = btype === 'bandpass' ? lp2bpZpk(proto, wo, bw) : lp2bsZpk(proto, wo, bw);
  }
  return zpk2sos(bilinearZpk(analog, 2));
}
