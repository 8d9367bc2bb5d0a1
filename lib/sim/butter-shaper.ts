// The default spectral shaping of the simulator: a Butterworth band-pass (designed by lib/dsp
// butter, run causally by sosfiltInPlace) applied to white Gaussian noise. 20–450 Hz, order 4 is
// the usual sEMG band (common practice, no single source; De Luca et al. 2010, J Biomech
// 43:1573–1579 recommend a 20 Hz high-pass and a 450 Hz low-pass).
import { butter } from '../dsp/butter.js';
import { sosfiltInPlace } from '../dsp/sosfilt-in-place.js';
import type { NoiseFilter, NoiseShaper } from './noise-shaper.js';

/**
 * A shaper that band-passes white noise with a Butterworth filter (second-order sections).
 * @param band_hz [low, high] cut-offs, Hz (high < fs/2)
 * @param order Butterworth order (per edge, as scipy.signal.butter)
 * @param fs sampling rate, Hz
 * @throws UsageError (from butter) for cut-offs outside (0, fs/2) or a bad order
 * @example new RecordingSynthesizer(design, butterShaper([20, 450], 4, 1000))
 */
export function butterShaper(band_hz: [number, number], order: number, fs: number): NoiseShaper {
  const sos = butter(order, band_hz, { btype: 'bandpass', fs });
  const sections = sos.length / 6;
  return {
    describe: `zero-mean Gaussian white noise, Butterworth band-pass ${band_hz[0]}–${band_hz[1]} Hz, order ${order}, one forward pass (causal) at ${fs} Hz, scaled to unit RMS by the impulse-response energy`,
    create(): NoiseFilter {
      const state = new Float64Array(2 * sections);
      return { process: (x: Float64Array, n: number) => sosfiltInPlace(sos, state, x, 0, n) };
    },
  };
}
